/**
 * Revisions issued by earlier versions of cellbasis lie in projects/<id>/sealed/ instead of
 * projects/<id>/issued/. They are neither lost nor silently ignored: every command that reads or
 * writes the issued revisions (issue, audit, compare, build, serve) refuses such a project with
 * one line naming the one command that moves the folder. Moving it changes no byte inside (a
 * manifest records no path), so the revisions, their hashes and their signatures stay valid, and
 * they are then read and audited as they were issued (manifest format 1, layout.ts).
 */
import { lstatSync } from 'node:fs';
import { join } from 'node:path';
import { EXIT_VALIDATION, UserError } from '../core/errors.ts';
import { FORMER_DIR, ISSUED_DIR } from './layout.ts';

/** The refusal for a project that still has the former folder, or null. */
export function formerLayoutProblem(cwd: string, projectId: string): string | null {
  const project = join(cwd, 'projects', projectId);
  if (!lstatSync(join(project, FORMER_DIR), { throwIfNoEntry: false })) return null;
  const from = `projects/${projectId}/${FORMER_DIR}`;
  const to = `projects/${projectId}/${ISSUED_DIR}`;
  if (lstatSync(join(project, ISSUED_DIR), { throwIfNoEntry: false })) {
    return `${from}/ holds revisions issued by an earlier cellbasis, beside ${to}/: move each revision folder of ${from}/ into ${to}/ unchanged (mv ${from}/REV ${to}/), then remove the empty ${from}/`;
  }
  return `${from}/ holds revisions issued by an earlier cellbasis, in the folder's former name; move it once, unchanged (every hash and signature stays valid): mv ${from} ${to}`;
}

/** Throws the refusal of formerLayoutProblem (exit 1), for commands that stop on it. */
export function refuseFormerLayout(cwd: string, projectId: string): void {
  const problem = formerLayoutProblem(cwd, projectId);
  if (problem) throw new UserError(problem, EXIT_VALIDATION);
}
