/**
 * `cellbasis check [ID | FILE]...`: validates design bases (every project when none is named),
 * prints each problem as file:line:col: path: message on stderr and a summary of each valid
 * basis on stdout. Exit 1 when any basis has errors, 2 when an argument names no basis.
 */
import type { Command, Io } from '../command.ts';
import type { DesignBasis } from '../../basis/types.ts';
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
function portfolioCsv(records: readonly PortfolioRecord[]): string {
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

/** One CSV record of `check --csv`. */
interface PortfolioRecord {
  fields: [string, CsvValue][];
}

/**
 * The bases to check: those named, or every project under projects/ (each thing there that is no
 * project named on stderr; an error among them makes the exit code 1). Refuses a folder with none.
 */
function checkTargets(named: readonly string[], io: Io): { targets: readonly string[]; code: number } {
  if (named.length > 0) return { targets: named, code: EXIT_OK };
  const scanned = scanProjects(io.cwd);
  for (const problem of scanned.problems) io.err(`${projectsProblemText(problem)}\n`);
  const code = scanned.problems.some((p) => p.severity === 'error') ? EXIT_VALIDATION : EXIT_OK;
  if (scanned.ids.length === 0 && code === EXIT_OK) {
    throw new UserError('check: no design bases under projects/ here; create one with cellbasis new ID --technology TECH');
  }
  return { targets: scanned.ids, code };
}

/**
 * Checks one basis: loads it and calculates it, printing each problem and finding on stderr, and
 * its summary with the headline on stdout (or, with --csv, returns its record). 'usage' where the
 * argument names no basis, 'invalid' where the loader or the calculation finds errors.
 */
async function checkBasis(target: string, io: Io, csv: boolean): Promise<{ outcome: 'usage' | 'invalid' | 'valid'; record?: PortfolioRecord }> {
  let result;
  let ref;
  try {
    ref = resolveProjectArg(target, io.cwd);
    result = loadBasisFile(ref.path, { id: ref.id, displayPath: ref.displayPath });
  } catch (error) {
    if (!(error instanceof UserError)) throw error;
    io.err(`cellbasis: check: ${error.message}\n`);
    return { outcome: 'usage' };
  }
  for (const d of [...(result.ok ? [] : result.errors), ...result.warnings]) io.err(`${formatDiagnostic(d)}\n`);
  if (!result.ok) {
    io.err(`${ref.displayPath}: ${result.errors.length} error${result.errors.length === 1 ? '' : 's'}\n`);
    return { outcome: 'invalid' };
  }
  // The calculation may still find a problem (a voltage above the Nernst voltage, conflicting sizes).
  let headline: Table;
  try {
    headline = await calculatedHeadline(result.basis, io);
  } catch (error) {
    if (!(error instanceof BasisError)) throw error;
    for (const d of error.errors) io.err(`${formatDiagnostic(d)}\n`);
    io.err(`${ref.displayPath}: ${error.errors.length} error${error.errors.length === 1 ? '' : 's'} found by the calculation\n`);
    return { outcome: 'invalid' };
  }
  if (csv) {
    return { outcome: 'valid', record: { fields: [['project id', ref.id], ['file', ref.displayPath], ...basisSummaryRows(result.basis).map(([k, v]): [string, CsvValue] => [k, v]), ...headlineFields(headline)] } };
  }
  const calculated = headline.rows.map((row): [string, string] => [row.cells[0]!, row.cells[1]!]);
  const warnings = result.warnings.length ? ` (${result.warnings.length} warning${result.warnings.length === 1 ? '' : 's'})` : '';
  io.out(`${ref.displayPath}: valid${warnings}\n${table([...basisSummaryRows(result.basis), ...calculated])}\n`);
  return { outcome: 'valid' };
}

/** Calculates a valid basis, prints each finding on stderr at its basis field, and returns the document's headline table, as its summary shows it. */
async function calculatedHeadline(basis: DesignBasis, io: Io): Promise<Table> {
  const { calculate } = await import('../../plant/calculate.ts');
  const { formatFinding } = await import('../../plant/located-error.ts');
  const { everyFinding } = await import('../../plant/findings.ts');
  const results = calculate(basis);
  for (const finding of everyFinding(results)) io.err(`${formatFinding(basis, finding)}\n`);
  const { headlineTable } = await import('../../report/sections/summary.ts');
  return headlineTable(results);
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
    const { targets, code: scanCode } = checkTargets(args.positionals, io);
    let code = scanCode;
    const records: PortfolioRecord[] = [];
    for (const target of targets) {
      const checked = await checkBasis(target, io, Boolean(args.values.csv));
      if (checked.outcome === 'usage') code = EXIT_USAGE;
      else if (checked.outcome === 'invalid' && code === EXIT_OK) code = EXIT_VALIDATION;
      else if (checked.record) records.push(checked.record);
    }
    if (args.values.csv && records.length) io.out(portfolioCsv(records));
    return code;
  },
};
