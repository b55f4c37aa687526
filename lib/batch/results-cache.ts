/**
 * A disk cache of results: `.cellbasis-cache/results/<key>.json` under the working folder, keyed by
 * SHA-256 of the basis bytes, the project id, the file name and the library fingerprint
 * (lib/batch/fingerprint.ts). Entries are written to a temporary file and renamed, so a killed
 * build never leaves a torn entry. A results entry is JSON in ASCII (every other character as its
 * \u escape), which is read back about twice as fast as UTF-8 text.
 *
 * An entry is trusted only once verified: it starts with a line holding the SHA-256 of what
 * follows (`cellbasis-cache sha256=<hex>`), and is read through the bounded reader (no link, no
 * FIFO or device, at most MAX_ENTRY_BYTES). An entry that is torn, edited, of an older format, too
 * large or no regular file is a miss: calculated (or printed) again and written anew. The hash
 * guards against damage, not against someone who may write the cache and rewrites the hash too.
 */
import { isAscii } from 'node:buffer';
import { createHash } from 'node:crypto';
import { existsSync, lstatSync, mkdirSync, renameSync, unlinkSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { EXIT_VALIDATION, UserError } from '../core/errors.ts';
import { readRegularFile } from '../core/read-file.ts';
import { libraryFingerprint } from './fingerprint.ts';
import type { Results } from '../plant/results-schema.ts';

export const CACHE_DIR = '.cellbasis-cache';

/**
 * Writes a cache entry whole: into `<entry>.<pid>.tmp`, created new (never written through a
 * link or over a file), then renamed into place. A regular file of that name is a leftover of
 * an earlier process that had this process id, and is replaced; anything else there is refused.
 */
export function writeCacheEntry(target: string, body: string | Uint8Array): void {
  const bytes = Buffer.concat([Buffer.from(`${ENTRY_HEADER}${createHash('sha256').update(body).digest('hex')}\n`), Buffer.from(body)]);
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

/** The largest cache entry read: a results file is about 0.1 MB, a draft's PDF about 1 MB. */
export const MAX_ENTRY_BYTES = 64 * 1024 * 1024;
const ENTRY_HEADER = 'cellbasis-cache sha256=';

/** The body of a cache entry whose hash holds, or undefined (missing, damaged, foreign: a miss). */
export function readCacheEntry(target: string): Buffer | undefined {
  let bytes: Buffer;
  try {
    bytes = readRegularFile(target, { maxBytes: MAX_ENTRY_BYTES, what: 'cache entry', followLinks: false });
  } catch {
    return undefined;
  }
  const end = bytes.indexOf(0x0a);
  const header = end < 0 ? '' : bytes.subarray(0, end).toString('latin1');
  if (!header.startsWith(ENTRY_HEADER)) return undefined;
  const body = bytes.subarray(end + 1);
  return createHash('sha256').update(body).digest('hex') === header.slice(ENTRY_HEADER.length) ? body : undefined;
}

export function resultsKey(basisBytes: string | Uint8Array, id: string, file: string): string {
  return createHash('sha256').update(libraryFingerprint()).update('\0').update(id).update('\0').update(file).update('\0').update(basisBytes).digest('hex');
}

/** JSON of a value in ASCII: every character beyond it written as its \\u escape (JSON.parse gives the same value back). */
export function asciiJson(value: unknown): string {
  const json = JSON.stringify(value);
  return NON_ASCII.test(json) ? json.replace(NON_ASCII_ALL, (c) => `\\u${c.charCodeAt(0).toString(16).padStart(4, '0')}`) : json;
}

/** The value of a JSON cache entry whose hash holds (readCacheEntry), or undefined. */
export function readJsonEntry(target: string): unknown {
  const body = readCacheEntry(target);
  if (!body) return undefined;
  try {
    // Entries are written in ASCII (asciiJson): read as one-byte text, which decodes and parses
    // at about twice the speed of UTF-8 text with a few non-ASCII characters (°, Δ, ·) in it. An
    // entry of an earlier writer may hold UTF-8, and is read as such.
    return JSON.parse(body.toString(isAscii(body) ? 'latin1' : 'utf8'));
  } catch {
    return undefined;
  }
}

const NON_ASCII = /[^\u0000-\u007f]/;
const NON_ASCII_ALL = /[^\u0000-\u007f]/g;

export class ResultsCache {
  private readonly dir: string;

  constructor(cwd: string) {
    this.dir = join(cwd, CACHE_DIR, 'results');
  }

  get(key: string): Results | undefined {
    return readJsonEntry(join(this.dir, `${key}.json`)) as Results | undefined;
  }

  /** Whether an entry of the key is stored (not read nor verified: get() does that when it is read). */
  has(key: string): boolean {
    return existsSync(join(this.dir, `${key}.json`));
  }

  put(key: string, results: Results): void {
    mkdirSync(this.dir, { recursive: true });
    writeCacheEntry(join(this.dir, `${key}.json`), asciiJson(results));
  }
}
