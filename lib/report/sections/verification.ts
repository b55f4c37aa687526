/**
 * The verification of the calculation library against published values (lib/verification,
 * `runAllChecks()`: the same table the tests assert). The body of the document carries its
 * summary, one row per group of checks (species data, electrochemistry, equilibrium, plant
 * quantities: the prefix of each check's id) with how many pass and the largest deviation as a
 * share of its tolerance; the appendix carries every check with the value computed, the
 * published value (as the reference table gives it, without padding zeros), the deviation
 * against its tolerance, pass or fail, the source and whether the published value is quoted from
 * memory. Species in the quantity and the source are written with subscripts (H₂O), units as
 * printed (bar²).
 */
import type { CheckResult } from '../../verification/checks.ts';
import { formatNumber, formatTrimmed } from '../format.ts';
import { speciesText } from '../species-text.ts';
import { recordsTable, type RecordColumn, type Table } from '../table.ts';
import { appendixLetter } from '../outline.ts';
import { prettyUnit } from '../units.ts';

export interface VerificationSection {
  /** Every check, for the appendix. */
  table: Table;
  /** One row per group of checks, for the body. */
  summary: Table;
  /** The letter of the appendix that holds the table. */
  appendix: string;
  passed: number;
  failed: number;
  fromMemory: number;
  /** Which tool ran the checks, and when that is not the tool that calculated an issued revision. */
  ranBy: string;
}

function unit(u: string): string {
  return u === '1' ? '' : ` ${prettyUnit(u)}`;
}

/** What each group of checks covers, by the prefix of the check ids of lib/verification/reference-checks.yaml. */
const GROUPS: Record<string, string> = {
  TH: 'Species data: formation properties, heat capacities, equilibrium constants of formation',
  EC: 'Electrochemistry: reversible, thermoneutral and Nernst voltages',
  EQ: 'Chemical equilibrium of gas mixtures',
  PL: 'Plant quantities: heating values, flows by Faraday\'s law, efficiencies',
};

/** A group of checks by the prefix of their ids, with its counts and its largest deviation over its tolerance. */
interface CheckGroup {
  prefix: string;
  checks: number;
  failed: number;
  worst: number;
}

const SUMMARY_COLUMNS: RecordColumn<CheckGroup>[] = [
  {
    head: 'Group',
    align: 'left',
    text: (g) => `${GROUPS[g.prefix] ?? g.prefix} (${g.prefix})`,
    data: [
      { name: 'Group', unit: '', value: (g) => g.prefix },
      { name: 'Covers', unit: '', value: (g) => GROUPS[g.prefix] ?? '' },
    ],
  },
  { head: 'Checks', align: 'right', text: (g) => String(g.checks), data: [{ name: 'Checks', unit: '', value: (g) => g.checks }] },
  { head: 'Pass', align: 'right', text: (g) => String(g.checks - g.failed), data: [{ name: 'Pass', unit: '', value: (g) => g.checks - g.failed }] },
  { head: 'Fail', align: 'right', text: (g) => String(g.failed), data: [{ name: 'Fail', unit: '', value: (g) => g.failed }] },
  { head: 'Largest deviation / tolerance', align: 'right', text: (g) => formatNumber(g.worst, 2), data: [{ name: 'Largest deviation / tolerance', unit: '', value: (g) => g.worst }] },
];

/** The checks counted by group, for the body of the document (the full table is an appendix). */
function verificationSummaryTable(checks: readonly CheckResult[]): Table {
  const prefixOf = (c: CheckResult) => c.check.id.replace(/-.*$/, '');
  const groups: CheckGroup[] = [...new Set(checks.map(prefixOf))].map((prefix) => {
    const group = checks.filter((c) => prefixOf(c) === prefix);
    return { prefix, checks: group.length, failed: group.filter((c) => !c.pass).length, worst: Math.max(...group.map((c) => Math.abs(c.deviation) / c.check.tolerance)) };
  });
  return recordsTable({ name: 'verification-summary', title: 'Checks against published values, by group', columns: SUMMARY_COLUMNS, groups: [{ items: groups }], flag: (g) => g.failed > 0 });
}

const checkUnit = (c: CheckResult) => (c.check.unit === '1' ? '' : c.check.unit);

const COLUMNS: RecordColumn<CheckResult>[] = [
  { head: 'Check', align: 'left', text: (c) => c.check.id, data: [{ name: 'Check', unit: '', value: (c) => c.check.id }] },
  { head: 'Quantity', align: 'left', text: (c) => speciesText(c.check.what), data: [{ name: 'Quantity', unit: '', value: (c) => c.check.what }] },
  {
    head: 'Computed',
    align: 'right',
    text: (c) => `${formatNumber(c.computed, 6)}${unit(c.check.unit)}`,
    data: [
      { name: 'Computed', unit: '', value: (c) => c.computed },
      { name: 'Unit', unit: '', value: checkUnit },
    ],
  },
  // As published: no trailing zeros the publication does not give (1.17 V, not 1.17000 V).
  { head: 'Published', align: 'right', text: (c) => `${formatTrimmed(c.check.expected, 6)}${unit(c.check.unit)}`, data: [{ name: 'Published', unit: '', value: (c) => c.check.expected }] },
  {
    head: 'Deviation (tolerance)',
    align: 'right',
    // A no-break space keeps ± with its number where the column wraps (print).
    text: (c) => `${formatNumber(c.deviation, 2)} (±\u00a0${formatNumber(c.check.tolerance, 2)})`,
    data: [
      { name: 'Deviation', unit: '', value: (c) => c.deviation },
      { name: 'Tolerance', unit: '', value: (c) => c.check.tolerance },
    ],
  },
  { head: 'Result', align: 'left', text: (c) => (c.pass ? 'pass' : 'FAIL'), data: [{ name: 'Passes', unit: '', value: (c) => c.pass }] },
  {
    head: 'Source of the published value',
    align: 'left',
    text: (c) => `${speciesText(c.check.source)}${c.check.memory ? ' (quoted from memory)' : ''}`,
    data: [
      { name: 'Source of the published value', unit: '', value: (c) => c.check.source },
      { name: 'Quoted from memory', unit: '', value: (c) => c.check.memory },
    ],
  },
];

/**
 * The tables and counts of each set of checks, made once: a site build hands the same checks to
 * every document, whose tables were made again for each of them. A document gets tables of its
 * own that share the rows (linking gives each document's tables their own CSV link) and, through
 * the shared rows and data, their HTML and CSV made once (lib/report/table.ts).
 */
const madeFor = new WeakMap<readonly CheckResult[], Omit<VerificationSection, 'ranBy'>>();

function checksMade(checks: readonly CheckResult[]): Omit<VerificationSection, 'ranBy'> {
  let made = madeFor.get(checks);
  if (!made) {
    made = {
      table: recordsTable({ name: 'verification', title: 'Checks against published values', columns: COLUMNS, groups: [{ items: checks }], flag: (c) => !c.pass }),
      summary: verificationSummaryTable(checks),
      appendix: appendixLetter('checks'),
      passed: checks.filter((c) => c.pass).length,
      failed: checks.filter((c) => !c.pass).length,
      fromMemory: checks.filter((c) => c.check.memory).length,
    };
    madeFor.set(checks, made);
  }
  return made;
}

export function verificationSection(checks: readonly CheckResult[], toolVersion: string, resultsToolVersion: string): VerificationSection {
  const same = toolVersion === resultsToolVersion;
  const made = checksMade(checks);
  return {
    ...made,
    table: { ...made.table },
    summary: { ...made.summary },
    ranBy: same
      ? `Run by cellbasis ${toolVersion}, the version that calculated this document.`
      : `Run by cellbasis ${toolVersion}; these results were calculated by cellbasis ${resultsToolVersion}.`,
  };
}
