/**
 * A record of everything under a path that a write, a rename, a chmod or a touch changes, for
 * tests that a command left something exactly as it was: one line per entry (the path itself
 * included, symbolic links not followed) with its type, mode, size, inode, link count,
 * modification and change times (nanoseconds) and its content (the SHA-256 of a file's bytes,
 * a link's target, a folder's sorted names). Reading changes none of these; a rename changes
 * the change time, so even a folder renamed away and back is seen.
 */
import { createHash } from 'node:crypto';
import { lstatSync, readdirSync, readFileSync, readlinkSync } from 'node:fs';
import { join, relative } from 'node:path';

export function treeRecord(dir: string): Record<string, string> {
  const out: Record<string, string> = {};
  const walk = (path: string) => {
    const s = lstatSync(path, { bigint: true });
    const rel = relative(dir, path) || '.';
    const kind = s.isDirectory() ? 'dir' : s.isFile() ? 'file' : s.isSymbolicLink() ? 'link' : 'other';
    const content = kind === 'file' ? createHash('sha256').update(readFileSync(path)).digest('hex') : kind === 'link' ? readlinkSync(path) : kind === 'dir' ? readdirSync(path).sort().join(',') : '';
    out[rel] = `${kind} mode=${(Number(s.mode) & 0o7777).toString(8)} size=${s.size} ino=${s.ino} nlink=${s.nlink} mtime=${s.mtimeNs} ctime=${s.ctimeNs} ${content}`;
    if (kind === 'dir') for (const name of readdirSync(path)) walk(join(path, name));
  };
  walk(dir);
  return out;
}
