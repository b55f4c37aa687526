/**
 * Everything wrong with the projects of a site, collected over all of them before the build
 * gives up, so that one run names every problem: basis diagnostics as file:line:col: path:
 * message, problems of issued revisions (manifest, results) as file: message. SiteError carries
 * them to the command, which prints them one a line and exits 1.
 */
import { formatDiagnostic } from '../basis/diagnostics.ts';
import type { Diagnostic } from '../basis/types.ts';
import { EXIT_VALIDATION, UserError } from '../core/errors.ts';

/**
 * A line as a string of its own. V8 keeps a string cut from another (a slice, a join of pieces)
 * together with that other: a warning quoting a few words of a basis or a results entry kept the
 * whole text alive, some 46 kB a warning in a build of 400 synthetic projects, and the site model
 * keeps its warnings until the build ends. Copied through a buffer, the line holds only itself.
 */
function own(line: string): string {
  return Buffer.from(line, 'utf8').toString('utf8');
}

export class SiteProblems {
  readonly errors: string[] = [];
  readonly warnings: string[] = [];

  diagnostics(list: readonly Diagnostic[]): void {
    for (const d of list) (d.severity === 'error' ? this.errors : this.warnings).push(own(formatDiagnostic(d)));
  }

  /** Findings of the calculation, already formatted (lib/plant/located-error.ts formatFinding): reported like warnings. */
  findings(lines: readonly string[]): void {
    this.warnings.push(...lines.map(own));
  }

  error(file: string, message: string): void {
    this.errors.push(own(`${file}: ${message}`));
  }

  /** A line that does not stop the build, already naming what it concerns. */
  warning(line: string): void {
    this.warnings.push(own(`warning: ${line}`));
  }
}

export class SiteError extends UserError {
  constructor(
    readonly errors: readonly string[],
    readonly warnings: readonly string[] = [],
  ) {
    super(`${[...errors, ...warnings].join('\n')}\nthe site was not built: ${errors.length} error${errors.length === 1 ? '' : 's'} in the projects (the previous site is left as it was)`, EXIT_VALIDATION);
    this.name = 'SiteError';
  }
}
