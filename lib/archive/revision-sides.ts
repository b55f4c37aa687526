/**
 * The two sides of a revision comparison, read from disk: an issued revision as issued (basis
 * and results from its folder, never recomputed), or `draft`, the working basis calculated now,
 * named as the draft of the revision it becomes when next issued. A project whose revisions lie
 * in the former folder is refused (former-layout.ts); an issue run in progress or killed is
 * named, never read as a revision.
 */
import { projectBasisPath } from '../basis/projects.ts';
import type { Diagnostic } from '../basis/types.ts';
import { calculate } from '../plant/calculate.ts';
import { EXIT_USAGE, UserError } from '../core/errors.ts';
import { DRAFT_STATUS } from '../report/revision.ts';
import type { RevisionSide } from './compare.ts';
import { lastRevision, readIssuedFolder, temporaryNote } from './issued-folder.ts';
import { readIssuedRevision } from './issued-revision.ts';
import { nextRevision, revisionProblem } from '../basis/revisions.ts';
import { readWorkingBasis } from './working-basis.ts';
import { refuseFormerLayout } from './former-layout.ts';

const DRAFT = 'draft';

export interface LabelledSide extends RevisionSide {
  /** "revision B (issued for review on 2026-11-30)" or "draft of revision C (working basis)". */
  label: string;
}

/** Reads one side; `note` is told what the issued folder holds besides revisions (an issue run in progress or killed). */
export function readRevisionSide(cwd: string, project: string, which: string, warn?: (d: Diagnostic) => void, note?: (text: string) => void): LabelledSide {
  projectBasisPath(project, cwd);
  refuseFormerLayout(cwd, project);
  const folder = readIssuedFolder(cwd, project);
  for (const name of folder.temporary) note?.(temporaryNote(cwd, project, name));
  if (which === DRAFT) {
    const working = readWorkingBasis(cwd, project, warn);
    const revision = nextRevision(lastRevision(folder));
    return { revision, status: DRAFT_STATUS, basis: working.basis, results: calculate(working.basis), source: working.text, label: `draft of revision ${revision} (working basis)` };
  }
  const problem = revisionProblem(which);
  if (problem) throw new UserError(`${problem}; or "draft" for the working basis`, EXIT_USAGE);
  if (!folder.revisions.includes(which)) {
    const issued = folder.revisions.length ? `issued: ${folder.revisions.join(', ')}` : 'none is issued yet';
    throw new UserError(`revision ${which} of projects/${project} is not issued (${issued}; "draft" is the working basis)`, EXIT_USAGE);
  }
  const rev = readIssuedRevision(cwd, project, which);
  return { revision: which, status: rev.manifest.status, basis: rev.basis, ...(rev.basisProblem ? { basisProblem: rev.basisProblem } : {}), results: rev.results, source: rev.basisText, label: `revision ${which} (${rev.manifest.status} on ${rev.manifest.issuedOn})` };
}
