/**
 * A fingerprint of the calculation library: SHA-256 over the tool version and every file under
 * lib/ (sorted by path; every kind, so that a script, a data table or a text of a kind added
 * later is covered too). Cached results are keyed by it, so a changed equation,
 * coefficient or hazard table never serves a stale result, whether or not the version was raised.
 */
import { createHash } from 'node:crypto';
import { readdirSync, readFileSync } from 'node:fs';
import { join, relative } from 'node:path';
import { fileURLToPath } from 'node:url';
import { toolVersion } from '../core/version.ts';

const LIB = fileURLToPath(new URL('..', import.meta.url));

let fingerprint: string | undefined;

function files(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const path = join(dir, entry.name);
    if (entry.isDirectory()) return files(path);
    return entry.isFile() ? [path] : [];
  });
}

export function libraryFingerprint(): string {
  if (fingerprint) return fingerprint;
  const hash = createHash('sha256').update(`cellbasis ${toolVersion()}\n`);
  for (const path of files(LIB).sort()) {
    hash.update(`${relative(LIB, path)}\n`);
    hash.update(readFileSync(path));
  }
  fingerprint = hash.digest('hex');
  return fingerprint;
}
