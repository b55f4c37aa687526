/**
 * The sealed basis calculated again and compared with the sealed results (audit-results.ts):
 * the basis must still load, calculate and give the same numbers; another tool version is a
 * note, other species data a failure.
 */
import type { DesignBasis } from '../basis/types.ts';
import { loadBasisText } from '../basis/load.ts';
import { BasisError, formatDiagnostic } from '../basis/diagnostics.ts';
import { calculate } from '../plant/calculate.ts';
import { speciesDataHash } from '../thermo/species-data.ts';
import { toolVersion } from '../core/version.ts';
import { SEALED_FILES } from './layout.ts';
import { compareResults } from './audit-results.ts';
import { finding, type AuditFinding } from './audit-finding.ts';

export interface CalculationCheck {
  problems: AuditFinding[];
  notes: string[];
  /** The sealed basis, when it loads. */
  basis?: DesignBasis;
}

/** `results` is the parsed results.json (undefined when it is missing or not JSON). */
export function calculationProblems(basisBytes: Buffer, results: unknown, display: string, project: string): CalculationCheck {
  const loaded = loadBasisText(basisBytes, `${display}/${SEALED_FILES.basis}`, project);
  if (!loaded.ok) return { problems: [finding(`the sealed ${SEALED_FILES.basis} has errors`, ...loaded.errors.map(formatDiagnostic))], notes: [] };
  const basis = loaded.basis;
  if (results === undefined) return { problems: [], notes: [], basis };
  let recomputed;
  try {
    recomputed = calculate(basis);
  } catch (error) {
    const details = error instanceof BasisError ? error.errors.map(formatDiagnostic) : [(error as Error).message];
    return { problems: [finding('the sealed basis no longer calculates', ...details)], notes: [], basis };
  }
  const problems: AuditFinding[] = [];
  const notes: string[] = [];
  const sealed = results as { tool?: { version?: unknown }; speciesData_sha256?: unknown };
  if (sealed.tool?.version !== toolVersion()) notes.push(`sealed with cellbasis ${String(sealed.tool?.version)}, recalculated with cellbasis ${toolVersion()}`);
  if (sealed.speciesData_sha256 !== speciesDataHash()) {
    problems.push(
      finding(
        'the species data differ from those it was sealed with',
        `lib/thermo/data/nasa-glenn-excerpt.inp: SHA-256 ${speciesDataHash()}`,
        `${SEALED_FILES.results} records ${String(sealed.speciesData_sha256)}`,
      ),
    );
  }
  const compared = compareResults(results, recomputed);
  if (compared.count) {
    problems.push(finding(`${SEALED_FILES.results} differs from a recalculation of the sealed basis in ${compared.count} field${compared.count === 1 ? '' : 's'}`, ...compared.lines));
  }
  return { problems, notes, basis };
}
