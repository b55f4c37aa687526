/**
 * The two sides of a revision comparison, read from disk: a sealed revision as sealed (basis
 * and results from its folder, never recomputed), or `draft`, the working basis calculated now.
 */
import { projectBasisPath } from '../basis/projects.ts';
import type { Diagnostic } from '../basis/types.ts';
import { calculate } from '../plant/calculate.ts';
import { EXIT_USAGE, UserError } from '../core/errors.ts';
import type { RevisionSide } from './compare.ts';
import { readSealedFolder } from './sealed-folder.ts';
import { readSealedRevision } from './sealed-revision.ts';
import { revisionProblem } from '../basis/revisions.ts';
import { readWorkingBasis } from './working-basis.ts';

export const DRAFT = 'draft';

export interface LabelledSide extends RevisionSide {
  /** "revision B (issued for review, sealed 2026-11-30)" or "draft (working basis)". */
  label: string;
}

export function readRevisionSide(cwd: string, project: string, which: string, warn?: (d: Diagnostic) => void): LabelledSide {
  projectBasisPath(project, cwd);
  if (which === DRAFT) {
    const working = readWorkingBasis(cwd, project, warn);
    return { basis: working.basis, results: calculate(working.basis), source: working.text, label: 'draft (working basis)' };
  }
  const problem = revisionProblem(which);
  if (problem) throw new UserError(`${problem}; or "draft" for the working basis`, EXIT_USAGE);
  const folder = readSealedFolder(cwd, project);
  if (!folder.revisions.includes(which)) {
    const sealed = folder.revisions.length ? `sealed: ${folder.revisions.join(', ')}` : 'none is sealed yet';
    throw new UserError(`revision ${which} of projects/${project} is not sealed (${sealed}; "draft" is the working basis)`, EXIT_USAGE);
  }
  const rev = readSealedRevision(cwd, project, which);
  return { basis: rev.basis, results: rev.results, source: rev.basisText, label: `revision ${which} (${rev.manifest.status}, sealed ${rev.manifest.sealedOn})` };
}
