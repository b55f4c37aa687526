/**
 * A disk cache of results: `.cellbasis-cache/results/<key>.json` under the working folder, keyed by
 * SHA-256 of the basis bytes, the project id, the file name and the library fingerprint
 * (lib/batch/fingerprint.ts). Entries are written to a temporary file and renamed, so a killed
 * build never leaves a torn entry; an unreadable entry is treated as a miss.
 */
import { createHash } from 'node:crypto';
import { lstatSync, mkdirSync, readFileSync, renameSync, unlinkSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { EXIT_VALIDATION, UserError } from '../core/errors.ts';
import { libraryFingerprint } from './fingerprint.ts';
import type { Results } from '../plant/results-schema.ts';

export const CACHE_DIR = '.cellbasis-cache';

/**
 * Writes a cache entry whole: into `<entry>.<pid>.tmp`, created new (never written through a
 * link or over a file), then renamed into place. A regular file of that name is a leftover of
 * an earlier process that had this process id, and is replaced; anything else there is refused.
 */
export function writeCacheEntry(target: string, bytes: string | Uint8Array): void {
  const temp = `${target}.${process.pid}.tmp`;
  try {
    writeFileSync(temp, bytes, { flag: 'wx' });
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code !== 'EEXIST') throw error;
    if (!lstatSync(temp).isFile()) throw new UserError(`${temp} is not a file cellbasis made; nothing was changed: remove it yourself`, EXIT_VALIDATION);
    unlinkSync(temp);
    writeFileSync(temp, bytes, { flag: 'wx' });
  }
  renameSync(temp, target);
}

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
    writeCacheEntry(join(this.dir, `${key}.json`), JSON.stringify(results));
  }
}
