/**
 * Temporary files a killed build left in the caches. Cache entries are written as
 * `<entry>.<pid>.tmp` and renamed into place (lib/plant/results-cache.ts,
 * lib/publish/draft-pdfs.ts); a build killed between the two leaves the temporary file. Each
 * build removes those whose process no longer runs: never one of a live build, which will
 * rename it, and never a finished entry.
 */
import { readdirSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { processAlive } from '../archive/sealed-folder.ts';
import { CACHE_DIR } from '../plant/results-cache.ts';

/** The cache folders whose entries are written through `<entry>.<pid>.tmp`. */
export const CACHE_FOLDERS = ['results', 'pdf'] as const;

const TEMP = /\.(\d+)\.tmp$/;

/** Removes the stale temporary files under `<root>/.cellbasis-cache/`; returns their paths relative to root. */
export function removeCacheLeftovers(root: string): string[] {
  const removed: string[] = [];
  for (const folder of CACHE_FOLDERS) {
    const dir = join(root, CACHE_DIR, folder);
    let names: string[];
    try {
      names = readdirSync(dir);
    } catch {
      continue;
    }
    for (const name of names) {
      const pid = Number(TEMP.exec(name)?.[1]);
      if (!pid || pid === process.pid || processAlive(pid)) continue;
      rmSync(join(dir, name), { force: true });
      removed.push(join(CACHE_DIR, folder, name));
    }
  }
  return removed;
}
