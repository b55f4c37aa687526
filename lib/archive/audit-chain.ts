/**
 * The chain of sealed revisions: each manifest's `previous` names the revision before it and the
 * SHA-256 of that revision's manifest.json as it is now; each revision follows the one before
 * it (lib/basis/revisions.ts) and is not sealed on an earlier date; the first names no previous revision.
 */
import type { SealManifest } from './layout.ts';
import { checkFollows } from '../basis/revisions.ts';
import { sha256Hex } from './hash.ts';
import { finding, type AuditFinding } from './audit-finding.ts';

/** What the chain check keeps of each revision. */
export interface ChainLink {
  revision: string;
  manifest: SealManifest | null;
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

export function chainProblems(link: ChainLink, before: ChainLink | null): AuditFinding[] {
  const m = link.manifest;
  if (!m) return [];
  const out = follows(before?.revision ?? null, link.revision);
  if (before === null) {
    if (m.previous) out.push(finding(`manifest.json names previous revision ${m.previous.revision}, which is not sealed`));
    return out;
  }
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
  if (before.manifest && before.manifest.sealedOn > m.sealedOn) out.push(finding(`manifest.json: sealed on ${m.sealedOn}, before revision ${before.revision} (${before.manifest.sealedOn})`));
  return out;
}
