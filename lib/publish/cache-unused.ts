/**
 * Cache entries no project uses any more. Every change of a basis, of the library (its
 * fingerprint is part of every key: lib/batch/fingerprint.ts) or of a draft's page gives new
 * keys, and without this the entries of the old keys would stay for ever: some 0.1 MB of results
 * and checked basis a changed project, and about 1 MB a printed draft.
 *
 * After a complete build (every project read, every page written, the new site in place) the
 * build removes, in results/ and bases/, each entry whose key is not the key of a project's
 * basis as the build read it and, when it printed, in pdf/, each PDF it neither copied nor
 * printed. Only entries last written before the build started go: an entry that another
 * cellbasis process (`serve`, a second build) wrote meanwhile stays, and a build that fails
 * removes nothing. Only regular files named as entries are (`<64 hex digits>.<json|pdf>`):
 * temporary files (lib/publish/cache-leftovers.ts), links, folders and anything else found there
 * are left as they are. An entry removed costs at most its calculation or print again.
 *
 *   removeUnusedCacheEntries(root, used, startedMs): { entries, bytes }
 *     used       the keys the build used, by cache folder; a folder not named is not looked at
 *     startedMs  when the build started (Date.now()): entries written since then stay
 */
import { lstatSync, readdirSync, unlinkSync } from 'node:fs';
import { join } from 'node:path';
import { CACHE_DIR } from '../batch/results-cache.ts';
import { isFileError } from '../core/file-errors.ts';
import { ENTRY_EXTENSIONS } from './cache-leftovers.ts';

export type UsedKeys = Partial<Record<keyof typeof ENTRY_EXTENSIONS, ReadonlySet<string>>>;

/**
 * A file system's modification times may be as coarse as 2 s (FAT); an entry written up to that
 * long before the build started is kept too, and goes in the next build that does not use it.
 */
const TIMESTAMP_MARGIN_MS = 2_000;

export function removeUnusedCacheEntries(root: string, used: UsedKeys, startedMs: number): { entries: number; bytes: number } {
  let entries = 0;
  let bytes = 0;
  for (const [folder, keys] of Object.entries(used) as [keyof typeof ENTRY_EXTENSIONS, ReadonlySet<string>][]) {
    const dir = join(root, CACHE_DIR, folder);
    const entry = new RegExp(`^([0-9a-f]{64})\\.${ENTRY_EXTENSIONS[folder]}$`);
    let names: string[];
    try {
      names = readdirSync(dir);
    } catch {
      continue;
    }
    for (const name of names) {
      const key = entry.exec(name)?.[1];
      if (!key || keys.has(key)) continue;
      try {
        const stat = lstatSync(join(dir, name));
        if (!stat.isFile() || stat.mtimeMs >= startedMs - TIMESTAMP_MARGIN_MS) continue;
        unlinkSync(join(dir, name));
        entries++;
        bytes += stat.size;
      } catch (error) {
        // Gone already (another build removed it), or a folder we may not write: left as it is.
        if (!isFileError(error)) throw error;
      }
    }
  }
  return { entries, bytes };
}
