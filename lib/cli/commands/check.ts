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
import { csvText, type CsvValue } from '../../core/csv.ts';
import { columnHeader, type Table } from '../../report/table.ts';
import { CSV_OPTION } from '../table-output.ts';

/**
 * The CSV of `check --csv`: one record per valid basis, so a portfolio lands in one spreadsheet.
 * Columns: the project id and its file, the summary of the basis (text, as printed), then the
 * headline table's data (numbers unrounded, the unit in the header). Bases of different kinds
 * have different headline quantities: the columns are their union in the order first met, a
 * quantity a basis does not have is an empty field.
 */
function portfolioCsv(records: readonly { fields: [string, CsvValue][] }[]): string {
  const header: string[] = [];
  for (const r of records) for (const [name] of r.fields) if (!header.includes(name)) header.push(name);
  return csvText(header, records.map((r) => {
    const byName = new Map(r.fields);
    return header.map((name) => (byName.has(name) ? byName.get(name)! : null));
  }));
}

/** A headline table's data as (header, value) fields. */
function headlineFields(t: Table): [string, CsvValue][] {
  const row = t.data.rows[0] ?? [];
  return t.data.columns.map((c, i) => [columnHeader(c), row[i] ?? null]);
}

export const checkCommand: Command = {
  name: 'check',
  summary: 'validate design bases and print a summary of each valid one',
  usage: 'check [ID | FILE]...',
  details:
    'Without arguments, checks every projects/*/basis.yaml under the current folder, and names anything else\n' +
    'under projects/ (a folder that is no project is an error, a file a warning).\n' +
    'Problems go to stderr as file:line:col: path: message; warnings do not fail the check.\n' +
    'With --csv, stdout is one CSV record per valid basis: its summary and headline numbers (unrounded, units in the header).\n' +
    'Exit code 1 when any basis has errors, 2 when an argument names no basis.',
  positionals: [0, Number.POSITIVE_INFINITY],
  options: [CSV_OPTION],
  async run(args, io) {
    let code = EXIT_OK;
    const records: { fields: [string, CsvValue][] }[] = [];
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
      let headline: Table | undefined;
      try {
        const { calculate } = await import('../../plant/calculate.ts');
        const { formatFinding } = await import('../../plant/located-error.ts');
        const { everyFinding } = await import('../../plant/findings.ts');
        const results = calculate(result.basis);
        for (const finding of everyFinding(results)) io.err(`${formatFinding(result.basis, finding)}\n`);
        // The document's headline table, as the summary of the document shows it.
        const { headlineTable } = await import('../../report/sections/summary.ts');
        headline = headlineTable(results);
        calculated = headline.rows.map((row) => [row.cells[0]!, row.cells[1]!]);
      } catch (error) {
        if (!(error instanceof BasisError)) throw error;
        for (const d of error.errors) io.err(`${formatDiagnostic(d)}\n`);
        io.err(`${ref.displayPath}: ${error.errors.length} error${error.errors.length === 1 ? '' : 's'} found by the calculation\n`);
        if (code === EXIT_OK) code = EXIT_VALIDATION;
        continue;
      }
      if (args.values.csv) {
        records.push({ fields: [['project id', ref.id], ['file', ref.displayPath], ...basisSummaryRows(result.basis).map(([k, v]): [string, CsvValue] => [k, v]), ...headlineFields(headline!)] });
        continue;
      }
      const warnings = result.warnings.length ? ` (${result.warnings.length} warning${result.warnings.length === 1 ? '' : 's'})` : '';
      io.out(`${ref.displayPath}: valid${warnings}\n${table([...basisSummaryRows(result.basis), ...calculated])}\n`);
    }
    if (args.values.csv && records.length) io.out(portfolioCsv(records));
    return code;
  },
};
