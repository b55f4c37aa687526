/**
 * The signature of a sealed revision: manifest.sig must verify over the exact bytes of
 * manifest.json with the public key the manifest records (a signature made with another key
 * fails), a recorded key needs a signature, and a required key must be the recorded one.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { SEALED_FILES, type SealManifest } from './layout.ts';
import { keyFingerprint, sameKey, verifyBytes } from './signature.ts';
import { finding, type AuditFinding } from './audit-finding.ts';

export function signatureProblems(dir: string, manifest: SealManifest, manifestBytes: Buffer, requireKey: string | undefined): AuditFinding[] {
  let signature: string | null;
  try {
    signature = readFileSync(join(dir, SEALED_FILES.signature), 'latin1');
  } catch {
    signature = null;
  }
  const out: AuditFinding[] = [];
  if (signature === null) {
    if (manifest.publicKey) out.push(finding('manifest.sig is missing, but manifest.json records the key it was signed with'));
    if (requireKey) out.push(finding(`not signed, but a signature by key ${keyFingerprint(requireKey)} is required`));
    return out;
  }
  if (!manifest.publicKey) return [finding('manifest.sig is there, but manifest.json records no public key to check it with')];
  let recorded: string;
  try {
    recorded = keyFingerprint(manifest.publicKey);
  } catch {
    return [finding('manifest.json: the public key it records is not a valid key, so manifest.sig cannot be checked')];
  }
  if (!verifyBytes(manifestBytes, signature, manifest.publicKey)) {
    out.push(
      finding(
        'manifest.sig does not verify over manifest.json with the public key manifest.json records',
        `made with another key than ${recorded} (the recorded one), or manifest.json or manifest.sig changed after signing`,
      ),
    );
  }
  if (requireKey && !sameKey(requireKey, manifest.publicKey)) out.push(finding(`signed with key ${recorded}, not with the required key ${keyFingerprint(requireKey)}`));
  return out;
}
