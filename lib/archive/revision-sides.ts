/**
 * The two sides of a revision comparison, read from disk: a sealed revision as sealed (basis
 * and results from its folder, never recomputed), or `draft`, the working basis calculated now.
 */
import { readFileSync } from 'node:fs';
import { loadBasisText } from '../basis/load.ts';
import { BasisError } from '../basis/diagnostics.ts';
import { projectBasisPath } from '../basis/projects.ts';
import { decodeBasisBytes } from '../basis/source-text.ts';
import type { Diagnostic } from '../basis/types.ts';
import { calculate } from '../plant/calculate.ts';
import { EXIT_USAGE, UserError } from '../errors.ts';
import type { RevisionSide } from './compare.ts';
import { readSealedFolder } from './sealed-folder.ts';
import { readSealedRevision } from './sealed-revision.ts';
import { revisionProblem } from './revisions.ts';

export const DRAFT = 'draft';

export interface LabelledSide extends RevisionSide {
  /** "revision B (issued for review, sealed 2026-11-30)" or "draft (working basis)". */
  label: string;
}

export function readRevisionSide(cwd: string, project: string, which: string, warn?: (d: Diagnostic) => void): LabelledSide {
  const path = projectBasisPath(project, cwd);
  if (which === DRAFT) {
    const display = `projects/${project}/basis.yaml`;
    let bytes: Buffer;
    try {
      bytes = readFileSync(path);
    } catch {
      throw new UserError(`${display}: no such file`, EXIT_USAGE);
    }
    const loaded = loadBasisText(bytes, display, project);
    for (const w of loaded.warnings) warn?.(w);
    if (!loaded.ok) throw new BasisError(loaded.errors, loaded.warnings);
    const decoded = decodeBasisBytes(bytes, display);
    return { basis: loaded.basis, results: calculate(loaded.basis), ...(decoded.ok ? { source: decoded.text } : {}), label: 'draft (working basis)' };
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
