/**
 * Loading a design basis for a command: resolve the argument (project id or file), validate it,
 * print warnings on stderr, and throw a BasisError (exit 1) listing every located error.
 */
import { resolveProjectArg } from '../basis/projects.ts';
import { loadBasisFile } from '../basis/load.ts';
import { BasisError, formatDiagnostic } from '../basis/diagnostics.ts';
import type { DesignBasis } from '../basis/types.ts';
import type { Io } from './command.ts';

export function loadProject(arg: string, io: Io): DesignBasis {
  const ref = resolveProjectArg(arg, io.cwd);
  const result = loadBasisFile(ref.path, { id: ref.id, displayPath: ref.displayPath });
  for (const d of result.warnings) io.err(`${formatDiagnostic(d)}\n`);
  if (!result.ok) throw new BasisError(result.errors, result.warnings);
  return result.basis;
}
