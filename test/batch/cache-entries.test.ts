// The caches trust an entry only once verified (issue 15 item 9; the cache part of the hostile
// corpus, class "cache"): an entry whose bytes no longer match the SHA-256 it was written with
// (edited, torn, of an older format), one that is a link, a FIFO or larger than any entry, is a
// miss, never served and never waited on; an entry as written is served.
import { mkdirSync, readFileSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { CACHE_DIR, MAX_ENTRY_BYTES, ResultsCache, readCacheEntry, resultsKey, writeCacheEntry } from '../../lib/batch/results-cache.ts';
import { calculate } from '../../lib/plant/calculate.ts';
import { basisFrom, projectsRoot } from '../helpers/scaffold-basis.ts';

function cacheRoot(): { root: string; dir: string } {
  const root = projectsRoot('cache-entries', {});
  const dir = join(root, CACHE_DIR, 'results');
  mkdirSync(dir, { recursive: true });
  return { root, dir };
}

describe('cache entries are verified before they are trusted', () => {
  const results = calculate(basisFrom('pem', 'power'));
  const key = resultsKey('basis bytes', 'p', 'projects/p/basis.yaml');

  it('an entry as written is served; one number changed in it is a miss', () => {
    const { root, dir } = cacheRoot();
    const cache = new ResultsCache(root);
    cache.put(key, results);
    expect(cache.get(key)).toEqual(results);
    const file = join(dir, `${key}.json`);
    const text = readFileSync(file, 'utf8');
    const voltage = String(results.headline.cellVoltage_V);
    expect(text).toContain(voltage);
    // Still valid JSON, still a results file: only the hash tells.
    writeFileSync(file, text.replace(voltage, String(results.headline.cellVoltage_V + 0.1)));
    expect(cache.get(key)).toBeUndefined();
  });

  it('an entry is written in ASCII and reads back the same results, as does an entry written in UTF-8', () => {
    const { root, dir } = cacheRoot();
    const cache = new ResultsCache(root);
    // Results text carries non-ASCII characters (degree signs, Greek letters, middle dots); so does this one, beyond U+FFFF too.
    const text = 'ΔG at 80 °C · 𝜂';
    const withText = { ...results, project: { ...results.project, title: text } };
    expect(JSON.stringify(results)).toMatch(/[^\u0000-\u007f]/);
    cache.put(key, withText);
    const bytes = readFileSync(join(dir, `${key}.json`));
    expect(bytes.every((b) => b < 0x80)).toBe(true);
    expect(cache.get(key)).toEqual(withText);
    // An entry an earlier version wrote, in UTF-8, is read as UTF-8.
    writeCacheEntry(join(dir, `${key}.json`), JSON.stringify(withText));
    expect(readFileSync(join(dir, `${key}.json`)).some((b) => b >= 0x80)).toBe(true);
    expect(cache.get(key)).toEqual(withText);
  });

  it('an entry of the old format (bare JSON), torn, empty or with a bad header is a miss', () => {
    const { root, dir } = cacheRoot();
    const cache = new ResultsCache(root);
    const file = join(dir, `${key}.json`);
    const json = JSON.stringify(results);
    for (const bytes of [json, '', 'cellbasis-cache sha256=00\n' + json, json.slice(0, 100)]) {
      writeFileSync(file, bytes);
      expect(cache.get(key)).toBeUndefined();
    }
    cache.put(key, results);
    writeFileSync(file, readFileSync(file).subarray(0, 200));
    expect(cache.get(key), 'torn').toBeUndefined();
  });

  it('a link, a FIFO or an entry over the limit is a miss, and the FIFO is never opened', () => {
    const { root, dir } = cacheRoot();
    const file = join(dir, 'entry.pdf');
    const elsewhere = join(root, 'elsewhere.pdf');
    writeCacheEntry(elsewhere, 'bytes');
    expect(readCacheEntry(elsewhere)?.toString()).toBe('bytes');
    symlinkSync(elsewhere, file);
    expect(readCacheEntry(file), 'a link').toBeUndefined();
    rmSync(file);
    expect(spawnSync('mkfifo', [file]).status).toBe(0);
    expect(readCacheEntry(file), 'a FIFO').toBeUndefined();
    rmSync(file);
    writeFileSync(file, Buffer.alloc(MAX_ENTRY_BYTES + 1));
    expect(readCacheEntry(file), 'too large').toBeUndefined();
  });
});
