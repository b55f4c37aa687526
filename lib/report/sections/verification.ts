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
import { table, type Table } from '../table.ts';
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

function summaryTable(checks: readonly CheckResult[]): Table {
  const prefixes = [...new Set(checks.map((c) => c.check.id.replace(/-.*$/, '')))];
  return table(
    ['Group', 'Checks', 'Pass', 'Fail', 'Largest deviation / tolerance'],
    ['left', 'right', 'right', 'right', 'right'],
    prefixes.map((prefix) => {
      const group = checks.filter((c) => c.check.id.replace(/-.*$/, '') === prefix);
      const failed = group.filter((c) => !c.pass).length;
      const worst = Math.max(...group.map((c) => Math.abs(c.deviation) / c.check.tolerance));
      return { cells: [`${GROUPS[prefix] ?? prefix} (${prefix})`, String(group.length), String(group.length - failed), String(failed), formatNumber(worst, 2)], flag: failed > 0 };
    }),
  );
}

export function verificationSection(checks: readonly CheckResult[], toolVersion: string, resultsToolVersion: string): VerificationSection {
  const rows = checks.map((c) => ({
    cells: [
      c.check.id,
      speciesText(c.check.what),
      `${formatNumber(c.computed, 6)}${unit(c.check.unit)}`,
      // As published: no trailing zeros the publication does not give (1.17 V, not 1.17000 V).
      `${formatTrimmed(c.check.expected, 6)}${unit(c.check.unit)}`,
      // A no-break space keeps ± with its number where the column wraps (print).
      `${formatNumber(c.deviation, 2)} (±\u00a0${formatNumber(c.check.tolerance, 2)})`,
      c.pass ? 'pass' : 'FAIL',
      `${speciesText(c.check.source)}${c.check.memory ? ' (quoted from memory)' : ''}`,
    ],
    flag: !c.pass,
  }));
  const same = toolVersion === resultsToolVersion;
  return {
    table: table(['Check', 'Quantity', 'Computed', 'Published', 'Deviation (tolerance)', 'Result', 'Source of the published value'], ['left', 'left', 'right', 'right', 'right', 'left', 'left'], rows),
    summary: summaryTable(checks),
    appendix: appendixLetter('checks'),
    passed: checks.filter((c) => c.pass).length,
    failed: checks.filter((c) => !c.pass).length,
    fromMemory: checks.filter((c) => c.check.memory).length,
    ranBy: same
      ? `Run by cellbasis ${toolVersion}, the version that calculated this document.`
      : `Run by cellbasis ${toolVersion}; these results were calculated by cellbasis ${resultsToolVersion}.`,
  };
}
