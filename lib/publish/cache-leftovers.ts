/**
 * Temporary files a killed build left in the caches. Cache entries are written as
 * `<entry>.<pid>.tmp` and renamed into place (lib/batch/results-cache.ts,
 * lib/publish/draft-pdfs.ts); a build killed between the two leaves the temporary file. Each
 * build removes those whose process no longer runs: never one of a live build, which will
 * rename it, and never a finished entry. Only regular files named exactly as an entry's
 * temporary file (`<64 hex digits>.<json|pdf>.<pid>.tmp`) are removed, nothing else found there.
 */
import { lstatSync, readdirSync, unlinkSync } from 'node:fs';
import { join } from 'node:path';
import { processAlive } from '../archive/issued-folder.ts';
import { CACHE_DIR } from '../batch/results-cache.ts';

/** The cache folders whose entries are written through `<entry>.<pid>.tmp`, with their entries' extension. */
export const ENTRY_EXTENSIONS = { results: 'json', bases: 'json', pdf: 'pdf', pages: 'json' } as const;
export const CACHE_FOLDERS = Object.keys(ENTRY_EXTENSIONS) as (keyof typeof ENTRY_EXTENSIONS)[];

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
    const temp = new RegExp(`^[0-9a-f]{64}\\.${ENTRY_EXTENSIONS[folder]}\\.(\\d+)\\.tmp$`);
    for (const name of names) {
      const pid = Number(temp.exec(name)?.[1]);
      if (!pid || pid === process.pid || processAlive(pid) || !lstatSync(join(dir, name)).isFile()) continue;
      unlinkSync(join(dir, name));
      removed.push(join(CACHE_DIR, folder, name));
    }
  }
  return removed;
}
