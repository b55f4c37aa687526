/**
 * The issued basis loaded for the audit and, when the auditor asks (`audit --recalculate`),
 * calculated again and compared with the issued results (audit-results.ts).
 *
 * The audit proper checks what was issued, not what today's library would make of it: the hashes,
 * signatures and chain guarantee every byte, whatever a later cellbasis calculates. So by default
 * the basis is only loaded, for the manifest's cross-checks (number, title, sign-off); a basis a
 * later cellbasis no longer reads is a note, not a failure (its bytes are still those issued).
 * With recalculation the basis must load, calculate and give the same numbers; another tool
 * version is a note, other species data a failure.
 */
import type { DesignBasis } from '../basis/types.ts';
import { BasisError, formatDiagnostic } from '../basis/diagnostics.ts';
import { calculate } from '../plant/calculate.ts';
import { speciesDataHash } from '../thermo/species-data.ts';
import { toolVersion } from '../core/version.ts';
import { FORMER_MANIFEST_FORMAT, ISSUED_FILES, type IssueManifest } from './layout.ts';
import { loadIssuedBasis } from './issued-revision.ts';
import { compareResults } from './audit-results.ts';
import { finding, type AuditFinding } from './audit-finding.ts';

export interface CalculationCheck {
  problems: AuditFinding[];
  notes: string[];
  /** The issued basis, when it loads. */
  basis?: DesignBasis;
}

/**
 * `results` is the parsed results.json (undefined when it is missing or not JSON); `manifest`
 * the parsed manifest, or null when it is damaged (the basis is then read as format 2).
 * Without `recalculate`, only the loading.
 */
export function calculationProblems(basisBytes: Buffer, results: unknown, display: string, project: string, manifest: IssueManifest | null, recalculate = false): CalculationCheck {
  const former = manifest?.format === FORMER_MANIFEST_FORMAT;
  const loaded = loadIssuedBasis(basisBytes, `${display}/${ISSUED_FILES.basis}`, project, manifest);
  if (!loaded.ok) {
    const details = loaded.errors.map(formatDiagnostic);
    if (recalculate) return { problems: [finding(`the issued ${ISSUED_FILES.basis} has errors`, ...details)], notes: [] };
    return { problems: [], notes: [`the issued ${ISSUED_FILES.basis} does not load with cellbasis ${toolVersion()} (${details[0]}); its bytes are checked by hash and signature, its content against the manifest is not`] };
  }
  const basis = loaded.basis;
  if (results === undefined || !recalculate) return { problems: [], notes: [], basis };
  let recomputed;
  try {
    recomputed = calculate(basis);
  } catch (error) {
    const details = error instanceof BasisError ? error.errors.map(formatDiagnostic) : [(error as Error).message];
    return { problems: [finding('the issued basis no longer calculates', ...details)], notes: [], basis };
  }
  const problems: AuditFinding[] = [];
  const notes: string[] = [];
  const issued = results as { tool?: { version?: unknown }; speciesData_sha256?: unknown };
  if (issued.tool?.version !== toolVersion()) notes.push(`issued with cellbasis ${String(issued.tool?.version)}, recalculated with cellbasis ${toolVersion()}`);
  if (issued.speciesData_sha256 !== speciesDataHash()) {
    problems.push(
      finding(
        'the species data differ from those it was issued with',
        `lib/thermo/data/nasa-glenn-excerpt.inp: SHA-256 ${speciesDataHash()}`,
        `${ISSUED_FILES.results} records ${String(issued.speciesData_sha256)}`,
      ),
    );
  }
  const compared = compareResults(results, recomputed, former);
  if (compared.count) {
    problems.push(finding(`${ISSUED_FILES.results} differs from a recalculation of the issued basis in ${compared.count} field${compared.count === 1 ? '' : 's'}`, ...compared.lines));
  }
  return { problems, notes, basis };
}
