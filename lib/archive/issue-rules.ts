/**
 * What a revision needs before it may be issued with a status, as one pure function of the
 * basis, its results, the request and the revision before it. Every unmet rule is one line
 * naming what is missing and where to put it; `issue` refuses (exit 1, nothing written) when
 * there is any, and prints the findings that do not stop it.
 *
 * Sign-off by status (common document-control practice, no source: a document issued for review
 * is prepared; for approval it is checked as well; approved, it is approved by a third role):
 *   issued for review     the preparer, with a date
 *   issued for approval   the preparer and the checker, with dates; the checker is not the preparer
 *   approved              the preparer, checker and approver, with dates; neither the checker nor
 *                         the approver is the preparer; every open assumption accepted with a
 *                         recorded reason (assumptions[].accepted); no error-level finding
 * Dates: every sign-off date on or before the issue date, the issue date not in the future and
 * not before the preparer's date, the required dates in the order prepared, checked, approved.
 *
 * A revision whose basis changed since the revision before it must be signed after that
 * revision was issued: a sign-off date before it predates the changes (revision B that kept
 * revision A's checked date). For a role the status requires this refuses the issue; for
 * another it is a finding.
 */
import type { DesignBasis } from '../basis/types.ts';
import type { IssueStatus } from '../basis/revisions.ts';
import type { Results } from '../plant/results-schema.ts';
import { EXIT_VALIDATION, UserError } from '../core/errors.ts';
import type { IssueManifest, SignOffRole } from './layout.ts';

/** The roles each status requires, in sign-off order. */
const REQUIRED_ROLES: Record<IssueStatus, readonly SignOffRole[]> = {
  'issued for review': ['prepared'],
  'issued for approval': ['prepared', 'checked'],
  approved: ['prepared', 'checked', 'approved'],
};

const ROLE_NOUN: Record<SignOffRole, string> = { prepared: 'the preparer', checked: 'the checker', approved: 'the approver' };

export interface IssueRequest {
  basis: DesignBasis;
  results: Results;
  /** projects/<id>/basis.yaml, as messages name it. */
  basisFile: string;
  status: IssueStatus;
  revision: string;
  /** The issue date, YYYY-MM-DD. */
  issueDate: string;
  /** Today by the clock, YYYY-MM-DD (UTC). */
  today: string;
  /** The revision issued last: its name, date and sign-off, and whether the basis changed since (sign-off aside). */
  previous: { revision: string; issuedOn: string; signOff: IssueManifest['signOff']; changed: boolean } | null;
  /** How many checks of the calculation library against published values fail. */
  failedChecks: number;
}

export interface IssueVerdict {
  /** One line per unmet rule; the issue is refused when there is any. */
  refusals: string[];
  /** Lines reported without refusing. */
  findings: string[];
}

/** A name as compared for "not the same person": letters and digits only, case folded. */
function person(name: string): string {
  return name.normalize('NFKC').toLowerCase().replace(/[^\p{L}\p{N}]/gu, '');
}

function signOffRules(req: IssueRequest, out: IssueVerdict): void {
  const signOff = req.basis.document.signOff;
  const required = REQUIRED_ROLES[req.status];
  const where = `${req.basisFile}: document.sign-off`;
  for (const role of required) {
    const s = signOff[role];
    if (!s) out.refusals.push(`${req.status} needs ${ROLE_NOUN[role]}: add ${role}: { name, date } under document.sign-off in ${req.basisFile}`);
    else if (!s.date) out.refusals.push(`${where}.${role}: ${req.status} needs the date ${ROLE_NOUN[role]} signed: write ${role}: { name: ${s.name}, date: YYYY-MM-DD }`);
  }
  const preparer = signOff.prepared;
  for (const role of ['checked', 'approved'] as const) {
    const s = signOff[role];
    if (required.includes(role) && s && preparer && person(s.name) === person(preparer.name)) {
      out.refusals.push(`${where}.${role}: ${s.name} prepared the document and cannot also have ${role} it: ${req.status} needs ${ROLE_NOUN[role]} to be another person`);
    }
  }
  const dated = required.map((role) => [role, signOff[role]?.date] as const).filter((x): x is readonly [SignOffRole, string] => typeof x[1] === 'string');
  for (let i = 1; i < dated.length; i++) {
    const [role, date] = dated[i]!;
    const [before, beforeDate] = dated[i - 1]!;
    if (date < beforeDate) out.refusals.push(`${where}.${role}.date: ${date} is before ${before} on ${beforeDate}; the dates run prepared, checked, approved`);
  }
  // The preparer's date after the issue date is dateRules' refusal.
  for (const role of ['checked', 'approved'] as const) {
    const date = signOff[role]?.date;
    if (date && date > req.issueDate) out.refusals.push(`${where}.${role}.date: ${date} is after the issue date ${req.issueDate}; a revision is issued after it is signed (give --date, or correct the date)`);
  }
}

function dateRules(req: IssueRequest, out: IssueVerdict): void {
  if (req.issueDate > req.today) out.refusals.push(`the issue date ${req.issueDate} is in the future (today is ${req.today}, UTC); a revision is dated the day it is issued or earlier`);
  const prepared = req.basis.document.signOff.prepared?.date;
  if (prepared && req.issueDate < prepared) out.refusals.push(`the issue date ${req.issueDate} is before the preparer's date ${prepared} (${req.basisFile}: document.sign-off.prepared.date); a revision is issued after it is prepared`);
}

/** Sign-off dates that predate the changes made since the revision before (findings, or refusals for the roles the status requires). */
function staleSignOff(req: IssueRequest, out: IssueVerdict): void {
  const previous = req.previous;
  if (!previous?.changed) return;
  for (const role of ['prepared', 'checked', 'approved'] as const) {
    const s = req.basis.document.signOff[role];
    if (!s?.date || s.date >= previous.issuedOn) continue;
    const before = previous.signOff.find((x) => x.role === role);
    const kept = before && before.date === s.date && person(before.name) === person(s.name) ? `, the date revision ${previous.revision} has,` : '';
    const line = `${req.basisFile}: document.sign-off.${role}.date: ${s.date}${kept} is before revision ${previous.revision} was issued (${previous.issuedOn}), but the basis changed since: ${role === 'prepared' ? 'the preparation' : `the ${role === 'checked' ? 'check' : 'approval'}`} does not cover the changes; sign it again with its new date`;
    (REQUIRED_ROLES[req.status].includes(role) ? out.refusals : out.findings).push(line);
  }
}

/** An approved revision: each open assumption accepted with a reason, no error-level finding. */
function approvalRules(req: IssueRequest, out: IssueVerdict): void {
  if (req.status !== 'approved') return;
  req.basis.assumptions.forEach((a, i) => {
    if (!a.open) return;
    if (!a.accepted) {
      out.refusals.push(`${req.basisFile}: assumptions[${i}] (${a.id}) is open: an approved revision needs it confirmed (open: false) or accepted as open with the reason, accepted: { reason, by, date }`);
    } else if (a.accepted.date > req.issueDate) {
      out.refusals.push(`${req.basisFile}: assumptions[${i}].accepted.date: ${a.accepted.date} is after the issue date ${req.issueDate}`);
    }
  });
  for (const line of errorFindings(req)) out.refusals.push(`an approved revision has no error-level finding: ${line}`);
}

/**
 * The findings of a basis that forbid approval: a check of the library against published values
 * that fails (the results are not to be relied on), carbon deposition at the design point (the
 * document itself says the design must change before it is issued), and any finding the results
 * mark as critical.
 */
function errorFindings(req: Pick<IssueRequest, 'results' | 'failedChecks'>): string[] {
  const out: string[] = [];
  if (req.failedChecks > 0) out.push(`${req.failedChecks} check${req.failedChecks === 1 ? '' : 's'} of the calculation library against published values fail (cellbasis check lists them)`);
  // Findings with a severity, where the results carry them: the critical ones forbid approval.
  // Results that carry findings state a negative carbon margin as a critical finding of its own
  // (steam-to-carbon-below-minimum), so the margin is read directly only from results made before
  // findings existed; reading it in both would refuse the same deposit twice.
  const findings = (req.results as { findings?: readonly { severity?: unknown; path?: unknown; message?: unknown }[] }).findings;
  if (findings === undefined) {
    const margin = req.results.headline.carbonMargin;
    if (margin !== null && margin < 0) out.push(`the steam-to-carbon ratio is below the carbon limit (margin ${margin.toPrecision(3)}): carbon can deposit`);
  }
  for (const f of findings ?? []) if (f.severity === 'critical') out.push(`${String(f.path)}: ${String(f.message)}`);
  return out;
}

export function issueVerdict(req: IssueRequest): IssueVerdict {
  const out: IssueVerdict = { refusals: [], findings: [] };
  dateRules(req, out);
  signOffRules(req, out);
  staleSignOff(req, out);
  approvalRules(req, out);
  return out;
}

/** The refusal of an issue for unmet rules: each on its own line (the command prints them), exit 1. */
export class IssueRefused extends UserError {
  constructor(readonly lines: string[], what: string) {
    super(`${what}: ${lines.length} rule${lines.length === 1 ? '' : 's'} not met; nothing was issued`, EXIT_VALIDATION);
  }
}
