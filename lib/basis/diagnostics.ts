/**
 * Problems found in a design basis. While a file is checked they are `Finding`s that name the
 * YAML path they concern; `locate.ts` turns them into `Diagnostic`s (types.ts) with the file,
 * line and column. This module also formats diagnostics as `file:line:col: path: message` and
 * defines `BasisError`, the UserError that carries them for callers that prefer to throw.
 */
import { EXIT_VALIDATION, UserError } from '../core/errors.ts';
import { visibleText } from '../core/visible-text.ts';
import type { Diagnostic } from './types.ts';

/** A key or list index on the way from the document root to a value. */
export type Path = readonly (string | number)[];

/**
 * What the location of a finding points at: the value at the path (default), the key of the
 * path's last segment (unknown and duplicate keys), or, for a key that is missing, the key of
 * the mapping that should hold it.
 */
export type Target = 'value' | 'key' | 'missing';

export interface Finding {
  severity: 'error' | 'warning';
  at: Path;
  target: Target;
  message: string;
}

/** Collects the findings of one check. */
export class Findings {
  readonly list: Finding[] = [];

  error(at: Path, message: string, target: Target = 'value'): void {
    this.list.push({ severity: 'error', at, target, message });
  }

  warning(at: Path, message: string, target: Target = 'value'): void {
    this.list.push({ severity: 'warning', at, target, message });
  }
}

/** The dotted path of messages: `streams.fuel-electrode.composition.CH4`, `references[2].id`. */
export function pathText(path: Path): string {
  let out = '';
  for (const segment of path) {
    if (typeof segment === 'number') out += `[${segment}]`;
    else out += out === '' ? segment : `.${segment}`;
  }
  return out;
}

/**
 * `file:line:col: path: message`, with `warning: ` after the location for warnings; a character a
 * reader cannot see (in a key of the path, a value the message repeats) is shown escaped, here as
 * on the terminal (lib/core/visible-text.ts), since the site's index page shows these lines too.
 */
export function formatDiagnostic(d: Diagnostic): string {
  const where = `${d.file}:${d.line}:${d.column}: `;
  const severity = d.severity === 'warning' ? 'warning: ' : '';
  return visibleText(`${where}${severity}${d.path ? `${d.path}: ` : ''}${d.message}`);
}

/** By line, then column, then path; stable for equal positions. */
export function sortDiagnostics(list: Diagnostic[]): Diagnostic[] {
  return [...list].sort((a, b) => a.line - b.line || a.column - b.column || a.path.localeCompare(b.path));
}

/** A design basis with errors, for callers that throw: the message holds every diagnostic, one a line. */
export class BasisError extends UserError {
  constructor(
    readonly errors: Diagnostic[],
    readonly warnings: Diagnostic[] = [],
  ) {
    super(errors.map(formatDiagnostic).join('\n'), EXIT_VALIDATION);
    this.name = 'BasisError';
  }
}
