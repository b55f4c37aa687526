/**
 * Section 9, verification: the calculation library's checks against published values
 * (lib/verification, `runAllChecks()`: the same table the tests assert), each with the value
 * computed, the published value (as the reference table gives it, without padding zeros), the deviation against
 * its tolerance, pass or fail, the source and whether the published value is quoted from memory.
 * Species in the quantity and the source are written with subscripts (H₂O), units as printed (bar²).
 */
import type { CheckResult } from '../../verification/checks.ts';
import { formatNumber, formatTrimmed } from '../format.ts';
import { speciesText } from '../species-text.ts';
import { table, type Table } from '../table.ts';
import { prettyUnit } from '../units.ts';

export interface VerificationSection {
  table: Table;
  passed: number;
  failed: number;
  fromMemory: number;
  /** Which tool ran the checks, and when that is not the tool that calculated a sealed revision. */
  ranBy: string;
}

function unit(u: string): string {
  return u === '1' ? '' : ` ${prettyUnit(u)}`;
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
    passed: checks.filter((c) => c.pass).length,
    failed: checks.filter((c) => !c.pass).length,
    fromMemory: checks.filter((c) => c.check.memory).length,
    ranBy: same
      ? `Run by cellbasis ${toolVersion}, the version that calculated this document.`
      : `Run by cellbasis ${toolVersion} when this site was built; this revision was calculated by cellbasis ${resultsToolVersion}, and its sealed document holds the checks as they stood then.`,
  };
}
