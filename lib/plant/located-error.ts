/**
 * Errors the calculation finds in a basis that passed validation (a cell voltage above the Nernst
 * voltage, inputs that conflict, a fuel that cannot reach its utilization), located like
 * validation errors: `file:line:col: path: message`, exit code 1.
 */
import { BasisError } from '../basis/diagnostics.ts';
import type { DesignBasis, Diagnostic } from '../basis/types.ts';
import { UserError } from '../core/errors.ts';

export function locatedDiagnostic(basis: DesignBasis, path: string, message: string, severity: Diagnostic['severity'] = 'error'): Diagnostic {
  // The value itself, else the nearest written parent (a default has no position of its own).
  let at = basis.positions[`${path}.value`] ?? basis.positions[path];
  let probe = path;
  while (!at && probe.includes('.')) {
    probe = probe.slice(0, probe.lastIndexOf('.'));
    at = basis.positions[probe];
  }
  return { severity, file: basis.file, line: at?.line ?? 1, column: at?.column ?? 1, path, message };
}

export function locatedError(basis: DesignBasis, path: string, message: string): BasisError {
  return new BasisError([locatedDiagnostic(basis, path, message)]);
}

/**
 * Runs a calculation step and turns a plain UserError from the library (e.g. "the fuel cannot
 * reach the requested utilization") into a located error at `path`.
 */
export function atPath<T>(basis: DesignBasis, path: string, step: () => T): T {
  try {
    return step();
  } catch (error) {
    if (error instanceof BasisError) throw error;
    if (error instanceof UserError) throw locatedError(basis, path, error.message);
    throw error;
  }
}
