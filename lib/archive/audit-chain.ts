/**
 * The chain of issued revisions: each manifest's `previous` names the revision before it and the
 * SHA-256 of that revision's manifest.json as it is now; each revision follows the one before it
 * (lib/basis/revisions.ts) and is not issued on an earlier date; the first names no previous
 * revision. Signatures hold along the chain: once a revision is signed, a later one that is not
 * has lost its signature, and a role signed by one key in a revision and by another in a later
 * one has changed its key. Either fails, since it is what replacing a signed revision by another
 * would look like; a genuine change of key passes when the auditor names every key it trusts
 * (audit --key).
 */
import { FORMER_MANIFEST_FORMAT, type IssueManifest } from './layout.ts';
import { checkFollows } from '../basis/revisions.ts';
import { sha256Hex } from './hash.ts';
import { keyFingerprint, sameKey } from './signature.ts';
import { shortFingerprint } from '../report/revision.ts';
import { finding, type AuditFinding } from './audit-finding.ts';

/** What the chain check keeps of each revision. */
export interface ChainLink {
  revision: string;
  manifest: IssueManifest | null;
  manifestBytes: Buffer | null;
}

function follows(before: string | null, revision: string): AuditFinding[] {
  try {
    checkFollows(before, revision);
    return [];
  } catch (error) {
    return [finding((error as Error).message)];
  }
}

interface Signer {
  /** null for the one signature of format 1, which names no role. */
  role: string | null;
  publicKey: string;
}

function signers(m: IssueManifest): Signer[] {
  if (m.format === FORMER_MANIFEST_FORMAT) return m.formerPublicKey ? [{ role: null, publicKey: m.formerPublicKey }] : [];
  return m.signatures.map((s) => ({ role: s.role, publicKey: s.publicKey }));
}

function shown(publicKey: string): string {
  try {
    return shortFingerprint(keyFingerprint(publicKey));
  } catch {
    return '(not a valid key)';
  }
}

/** A signature lost or a key changed from the revision before; none where the auditor trusts the new key. */
function signatureContinuity(now: IssueManifest, before: IssueManifest, trusted: readonly string[]): AuditFinding[] {
  const was = signers(before);
  const is = signers(now);
  if (was.length === 0) return [];
  if (is.length === 0) {
    const list = was.map((s) => `${s.role ? `${s.role}: ` : ''}key ${shown(s.publicKey)}`).join(', ');
    return [finding(`not signed, but revision ${before.revision} before it is (${list}): once a revision is signed, every later one is`)];
  }
  const out: AuditFinding[] = [];
  for (const s of is) {
    const earlier = was.find((w) => w.role === null || s.role === null || w.role === s.role);
    if (!earlier || sameKey(earlier.publicKey, s.publicKey) || trusted.some((t) => sameKey(t, s.publicKey))) continue;
    const role = s.role ? ` for ${s.role}` : '';
    out.push(
      finding(
        `signed${role} with key ${shown(s.publicKey)}, where revision ${before.revision} was signed${earlier.role ? ` for ${earlier.role}` : ''} with key ${shown(earlier.publicKey)}: the key changed`,
        'if the change is genuine, audit with --key for each key you trust (the public key of each signer)',
      ),
    );
  }
  return out;
}

export function chainProblems(link: ChainLink, before: ChainLink | null, trusted: readonly string[] = []): AuditFinding[] {
  const m = link.manifest;
  if (!m) return [];
  const out = follows(before?.revision ?? null, link.revision);
  if (before === null) {
    if (m.previous) out.push(finding(`manifest.json names previous revision ${m.previous.revision}, which is not issued`));
    return out;
  }
  if (before.manifest) out.push(...signatureContinuity(m, before.manifest, trusted));
  if (!m.previous) return [...out, finding(`manifest.json names no previous revision, but revision ${before.revision} comes before it`)];
  if (m.previous.revision !== before.revision) return [...out, finding(`manifest.json names previous revision ${m.previous.revision}, but the revision before it is ${before.revision}`)];
  if (!before.manifestBytes) return [...out, finding(`the link to revision ${before.revision} cannot be checked: its manifest.json is missing`)];
  const now = sha256Hex(before.manifestBytes);
  if (now !== m.previous.manifest_sha256) {
    out.push(
      finding(
        `manifest.json's link to revision ${before.revision} does not match that revision's manifest.json`,
        `${before.revision}/manifest.json: SHA-256 ${now}`,
        `manifest.json records ${m.previous.manifest_sha256}`,
      ),
    );
  }
  if (before.manifest && before.manifest.issuedOn > m.issuedOn) out.push(finding(`manifest.json: issued on ${m.issuedOn}, before revision ${before.revision} (${before.manifest.issuedOn})`));
  return out;
}
