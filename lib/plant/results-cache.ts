/**
 * A disk cache of results: `.cellbasis-cache/results/<key>.json` under the working folder, keyed by
 * SHA-256 of the basis bytes, the project id, the file name and the library fingerprint
 * (lib/plant/fingerprint.ts). Entries are written to a temporary file and renamed, so a killed
 * build never leaves a torn entry; an unreadable entry is treated as a miss.
 */
import { createHash } from 'node:crypto';
import { mkdirSync, readFileSync, renameSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { libraryFingerprint } from './fingerprint.ts';
import type { Results } from './results-schema.ts';

export const CACHE_DIR = '.cellbasis-cache';

export function resultsKey(basisBytes: string | Uint8Array, id: string, file: string): string {
  return createHash('sha256').update(libraryFingerprint()).update('\0').update(id).update('\0').update(file).update('\0').update(basisBytes).digest('hex');
}

export class ResultsCache {
  private readonly dir: string;

  constructor(cwd: string) {
    this.dir = join(cwd, CACHE_DIR, 'results');
  }

  get(key: string): Results | undefined {
    try {
      return JSON.parse(readFileSync(join(this.dir, `${key}.json`), 'utf8')) as Results;
    } catch {
      return undefined;
    }
  }

  put(key: string, results: Results): void {
    mkdirSync(this.dir, { recursive: true });
    const target = join(this.dir, `${key}.json`);
    const temp = `${target}.${process.pid}.tmp`;
    writeFileSync(temp, JSON.stringify(results));
    renameSync(temp, target);
  }
}
