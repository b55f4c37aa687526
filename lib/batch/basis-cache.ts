/**
 * A disk cache of checked design bases: `.cellbasis-cache/bases/<key>.json` under the working
 * folder, beside the results (lib/batch/results-cache.ts), keyed as they are (`resultsKey`: the
 * basis bytes, the project id, the file name and the library fingerprint, which covers the loader
 * and its data files), written and verified as their entries are (`writeCacheEntry`,
 * `readCacheEntry`: a damaged entry is a miss). Reading, parsing and checking a basis took some
 * 7 ms a project (yaml's parser, the schema, the physics checks); the checked basis read back as
 * JSON takes some 0.3 ms, and a build from cached results loads every basis each time.
 *
 * Only a basis that loaded without errors is stored, with its warnings, and only when its JSON
 * gives back exactly the same value (isDeepStrictEqual: no undefined member, -0, NaN, infinity or
 * object of a class that JSON would change): what is read back is what loading gives. A cache
 * that cannot be written (a read-only folder) only costs the time it would have saved.
 *
 *   loadThroughCache(cache, bytes, file, id): LoadResult   the cached load, else loadBasisText's (stored when it may be)
 */
import { isDeepStrictEqual } from 'node:util';
import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { loadBasisText, type LoadResult } from '../basis/load.ts';
import { isFileError } from '../core/file-errors.ts';
import { asciiJson, CACHE_DIR, readJsonEntry, resultsKey, writeCacheEntry } from './results-cache.ts';

type Loaded = Extract<LoadResult, { ok: true }>;

export class BasisCache {
  private readonly dir: string;

  constructor(cwd: string) {
    this.dir = join(cwd, CACHE_DIR, 'bases');
  }

  get(key: string): Loaded | undefined {
    const loaded = readJsonEntry(join(this.dir, `${key}.json`)) as Loaded | undefined;
    return loaded?.ok === true ? loaded : undefined;
  }

  /** Stores a load that JSON gives back exactly; anything else, and a cache that cannot be written, is let go. */
  put(key: string, loaded: Loaded): void {
    const json = asciiJson(loaded);
    if (!isDeepStrictEqual(JSON.parse(json), loaded)) return;
    try {
      mkdirSync(this.dir, { recursive: true });
      writeCacheEntry(join(this.dir, `${key}.json`), json);
    } catch (error) {
      if (!isFileError(error)) throw error;
    }
  }
}

/** A basis's bytes loaded as loadBasisText loads them: from the cache when it holds them (same bytes, id, file and library), else loaded now and stored. */
export function loadThroughCache(cache: BasisCache, bytes: Uint8Array, file: string, id: string): LoadResult {
  const key = resultsKey(bytes, id, file);
  const cached = cache.get(key);
  if (cached) return cached;
  const loaded = loadBasisText(bytes, file, id);
  if (loaded.ok) cache.put(key, loaded);
  return loaded;
}
