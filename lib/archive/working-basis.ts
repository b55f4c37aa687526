/**
 * The working basis of a project (projects/<id>/basis.yaml) as issue and compare read it: its
 * bytes read once (only a regular file, refused above the size limit before reading), validated, and its text as the
 * loader reads it (UTF-8, LF line ends), so that what is issued is exactly what was checked.
 */
import { statSync } from 'node:fs';
import { readRegularFile } from '../core/read-file.ts';
import { loadBasisText } from '../basis/load.ts';
import { BasisError } from '../basis/diagnostics.ts';
import { projectBasisPath } from '../basis/projects.ts';
import { decodeBasisBytes, MAX_BASIS_BYTES, tooLargeError } from '../basis/source-text.ts';
import type { DesignBasis, Diagnostic } from '../basis/types.ts';
import { EXIT_USAGE, UserError } from '../core/errors.ts';

export interface WorkingBasis {
  /** projects/<id>/basis.yaml, as messages show it. */
  display: string;
  text: string;
  basis: DesignBasis;
}

/** Throws a UserError when the file is missing, a BasisError when it has errors; tells `warn` each warning. */
export function readWorkingBasis(cwd: string, project: string, warn?: (d: Diagnostic) => void): WorkingBasis {
  const path = projectBasisPath(project, cwd);
  const display = `projects/${project}/basis.yaml`;
  let size: number;
  try {
    size = statSync(path).size;
  } catch {
    throw new UserError(`${display}: no such file (create the project with cellbasis new ${project})`, EXIT_USAGE);
  }
  if (size > MAX_BASIS_BYTES) throw new BasisError([tooLargeError(display, size)]);
  const bytes = readRegularFile(path, { maxBytes: MAX_BASIS_BYTES, what: 'design basis' });
  const loaded = loadBasisText(bytes, display, project);
  for (const w of loaded.warnings) warn?.(w);
  if (!loaded.ok) throw new BasisError(loaded.errors, loaded.warnings);
  const decoded = decodeBasisBytes(bytes, display);
  if (!decoded.ok) throw new BasisError(decoded.errors);
  return { display, text: decoded.text, basis: loaded.basis };
}
