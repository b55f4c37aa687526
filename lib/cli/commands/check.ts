/**
 * `cellbasis check [ID | FILE]...`: validates design bases (every project when none is named),
 * prints each problem as file:line:col: path: message on stderr and a summary of each valid
 * basis on stdout. Exit 1 when any basis has errors, 2 when an argument names no basis.
 */
import type { Command } from '../command.ts';
import { table } from '../../core/plain-text.ts';
import { projectsProblemText, resolveProjectArg, scanProjects } from '../../basis/projects.ts';
import { loadBasisFile } from '../../basis/load.ts';
import { formatDiagnostic } from '../../basis/diagnostics.ts';
import { basisSummaryRows } from '../../basis/summary.ts';
import { BasisError } from '../../basis/diagnostics.ts';
import { EXIT_OK, EXIT_USAGE, EXIT_VALIDATION, UserError } from '../../core/errors.ts';

export const checkCommand: Command = {
  name: 'check',
  summary: 'validate design bases and print a summary of each valid one',
  usage: 'check [ID | FILE]...',
  details:
    'Without arguments, checks every projects/*/basis.yaml under the current folder, and names anything else\n' +
    'under projects/ (a folder that is no project is an error, a file a warning).\n' +
    'Problems go to stderr as file:line:col: path: message; warnings do not fail the check.\n' +
    'Exit code 1 when any basis has errors, 2 when an argument names no basis.',
  positionals: [0, Number.POSITIVE_INFINITY],
  options: [],
  async run(args, io) {
    let code = EXIT_OK;
    let targets = args.positionals;
    if (targets.length === 0) {
      const scanned = scanProjects(io.cwd);
      for (const problem of scanned.problems) io.err(`${projectsProblemText(problem)}\n`);
      if (scanned.problems.some((p) => p.severity === 'error')) code = EXIT_VALIDATION;
      targets = scanned.ids;
      if (targets.length === 0 && code === EXIT_OK) {
        throw new UserError('check: no design bases under projects/ here; create one with cellbasis new ID --technology TECH');
      }
    }
    for (const target of targets) {
      let result;
      let ref;
      try {
        ref = resolveProjectArg(target, io.cwd);
        result = loadBasisFile(ref.path, { id: ref.id, displayPath: ref.displayPath });
      } catch (error) {
        if (!(error instanceof UserError)) throw error;
        io.err(`cellbasis: check: ${error.message}\n`);
        code = EXIT_USAGE;
        continue;
      }
      for (const d of [...(result.ok ? [] : result.errors), ...result.warnings]) io.err(`${formatDiagnostic(d)}\n`);
      if (!result.ok) {
        io.err(`${ref.displayPath}: ${result.errors.length} error${result.errors.length === 1 ? '' : 's'}\n`);
        if (code === EXIT_OK) code = EXIT_VALIDATION;
        continue;
      }
      // The calculation may still find a problem (a voltage above the Nernst voltage, conflicting sizes).
      let calculated: [string, string][] = [];
      try {
        const { calculate } = await import('../../plant/calculate.ts');
        const { formatFinding } = await import('../../plant/located-error.ts');
        const { everyFinding } = await import('../../plant/findings.ts');
        const results = calculate(result.basis);
        for (const finding of everyFinding(results)) io.err(`${formatFinding(result.basis, finding)}\n`);
        // The document's headline table, as the summary of the document shows it.
        const { headlineTable } = await import('../../report/sections/summary.ts');
        calculated = headlineTable(results).rows.map((row) => [row.cells[0]!, row.cells[1]!]);
      } catch (error) {
        if (!(error instanceof BasisError)) throw error;
        for (const d of error.errors) io.err(`${formatDiagnostic(d)}\n`);
        io.err(`${ref.displayPath}: ${error.errors.length} error${error.errors.length === 1 ? '' : 's'} found by the calculation\n`);
        if (code === EXIT_OK) code = EXIT_VALIDATION;
        continue;
      }
      const warnings = result.warnings.length ? ` (${result.warnings.length} warning${result.warnings.length === 1 ? '' : 's'})` : '';
      io.out(`${ref.displayPath}: valid${warnings}\n${table([...basisSummaryRows(result.basis), ...calculated])}\n`);
    }
    return code;
  },
};
