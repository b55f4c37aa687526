/**
 * The signatures of an issued revision: each signature manifest.json records must be in its file
 * (manifest.<role>.sig; manifest.sig for format 1), verify over the exact bytes of manifest.json
 * with the public key recorded beside it (a signature made with another key fails), and carry the
 * fingerprint of that key; with keys the auditor trusts (audit --key), every revision must be
 * signed, and only by them. `signedBy` words who signed, for the audit's line.
 */
import { FORMER_MANIFEST_FORMAT, signatureFiles, type IssueManifest } from './layout.ts';
import { readIssuedFile } from './issued-files.ts';
import { keyFingerprint, sameKey, verifyBytes } from './signature.ts';
import { shortFingerprint } from '../report/revision.ts';
import { finding, type AuditFinding } from './audit-finding.ts';

/** A fingerprint as the audit writes it (the first 16 hex digits, grouped), or a note when the key is not valid. */
function shown(publicKey: string): string {
  try {
    return shortFingerprint(keyFingerprint(publicKey));
  } catch {
    return '(not a valid key)';
  }
}

/** "signed for approved by key alice (1a2b 3c4d 5e6f 7a8b)", "signed by key 1a2b … (format 1)", or "not signed". */
export function signedBy(m: IssueManifest): string {
  if (m.format === FORMER_MANIFEST_FORMAT) return m.formerPublicKey ? `signed by key ${shown(m.formerPublicKey)}` : 'not signed';
  if (m.signatures.length === 0) return 'not signed';
  return `signed ${m.signatures.map((s) => `for ${s.role} by key ${s.key} (${shown(s.publicKey)})`).join(', ')}`;
}

function readSignature(dir: string, display: string, file: string): string | null {
  try {
    return readIssuedFile(dir, display, file).toString('latin1');
  } catch {
    return null;
  }
}

export function signatureProblems(dir: string, display: string, manifest: IssueManifest, manifestBytes: Buffer, trusted: readonly string[]): AuditFinding[] {
  const out: AuditFinding[] = [];
  for (const s of manifest.signatures) {
    let actual: string;
    try {
      actual = keyFingerprint(s.publicKey);
    } catch {
      out.push(finding(`manifest.json: the public key it records for ${s.role} is not a valid key, so its signature cannot be checked`));
      continue;
    }
    if (actual !== s.fingerprint) out.push(finding(`manifest.json: the fingerprint recorded for ${s.role} (${shortFingerprint(s.fingerprint)}) is not that of the key recorded beside it (${shortFingerprint(actual)})`));
  }
  const files = signatureFiles(manifest);
  for (const { file, role, publicKey } of files) {
    const text = readSignature(dir, display, file);
    if (text === null) {
      out.push(finding(`${file} is missing, but manifest.json records a signature${role ? ` for ${role}` : ''}`));
      continue;
    }
    if (!verifyBytes(manifestBytes, text, publicKey)) {
      out.push(
        finding(
          `${file} does not verify over manifest.json with the public key manifest.json records${role ? ` for ${role}` : ''}`,
          `made with another key than ${shown(publicKey)} (the recorded one), or manifest.json or ${file} changed after signing`,
        ),
      );
    }
  }
  if (manifest.format === FORMER_MANIFEST_FORMAT && !manifest.formerPublicKey && readSignature(dir, display, 'manifest.sig') !== null) {
    out.push(finding('manifest.sig is there, but manifest.json records no public key to check it with'));
  }
  if (trusted.length) {
    if (files.length === 0) out.push(finding(`not signed, but a signature by ${trusted.length === 1 ? `key ${shown(trusted[0]!)}` : `one of the keys ${trusted.map(shown).join(', ')}`} is required`));
    for (const { role, publicKey } of files) {
      if (!trusted.some((t) => sameKey(t, publicKey))) out.push(finding(`signed${role ? ` for ${role}` : ''} with key ${shown(publicKey)}, not with ${trusted.length === 1 ? `the required key ${shown(trusted[0]!)}` : 'any of the keys given with --key'}`));
    }
  }
  return out;
}
