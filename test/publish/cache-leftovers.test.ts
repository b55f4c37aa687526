// The caches' temporary files: a build killed between writing `<entry>.<pid>.tmp` and renaming it
// leaves that file; the next build removes it, but never a live build's temporary file nor a
// finished entry (lib/publish/cache-leftovers.ts).
import { spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, expect, it } from 'vitest';
import { CACHE_FOLDERS, removeCacheLeftovers } from '../../lib/publish/cache-leftovers.ts';
import { CACHE_DIR } from '../../lib/batch/results-cache.ts';

const roots: string[] = [];
afterEach(() => {
  for (const r of roots.splice(0)) rmSync(r, { recursive: true, force: true });
});

/** The pid of a process that has ended (a child run to completion). */
function deadPid(): number {
  const child = spawnSync(process.execPath, ['-e', '']);
  expect(child.status).toBe(0);
  return child.pid!;
}

it('removes the temporary files of ended processes from every cache, and nothing else', () => {
  const root = mkdtempSync(join(tmpdir(), 'cellbasis-cache-left-'));
  roots.push(root);
  const dead = deadPid();
  const live = process.ppid; // the process that started this test runs as long as it does
  // Entries are named by a SHA-256 in hex; only a temporary file of exactly that naming is removed.
  const key = (c: string) => c.repeat(64);
  const names: Record<string, string[]> = {
    results: [`${key('a')}.json`, `${key('b')}.json.${dead}.tmp`, `${key('c')}.json.${live}.tmp`, `${key('d')}.json.${process.pid}.tmp`, `bb.json.${dead}.tmp`],
    bases: [`${key('a')}.json`, `${key('9')}.json.${dead}.tmp`, `${key('c')}.json.${live}.tmp`],
    pdf: [`${key('e')}.pdf`, `${key('f')}.pdf.${dead}.tmp`, 'notes.tmp', `${key('f')}.json.${dead}.tmp`],
    pages: [`${key('a')}.json`, `${key('7')}.json.${dead}.tmp`, `${key('c')}.json.${live}.tmp`],
  };
  for (const folder of CACHE_FOLDERS) {
    mkdirSync(join(root, CACHE_DIR, folder), { recursive: true });
    for (const n of names[folder]!) writeFileSync(join(root, CACHE_DIR, folder, n), 'x');
  }
  const removed = removeCacheLeftovers(root);
  expect(removed.sort()).toEqual([join(CACHE_DIR, 'bases', `${key('9')}.json.${dead}.tmp`), join(CACHE_DIR, 'pages', `${key('7')}.json.${dead}.tmp`), join(CACHE_DIR, 'pdf', `${key('f')}.pdf.${dead}.tmp`), join(CACHE_DIR, 'results', `${key('b')}.json.${dead}.tmp`)]);
  // This process's own file is kept too: it may be writing it now (a second build in the same process).
  expect(readdirSync(join(root, CACHE_DIR, 'results')).sort()).toEqual([`${key('a')}.json`, `${key('c')}.json.${live}.tmp`, `${key('d')}.json.${process.pid}.tmp`, `bb.json.${dead}.tmp`].sort());
  expect(readdirSync(join(root, CACHE_DIR, 'bases')).sort()).toEqual([`${key('a')}.json`, `${key('c')}.json.${live}.tmp`].sort());
  expect(readdirSync(join(root, CACHE_DIR, 'pdf')).sort()).toEqual([`${key('e')}.pdf`, 'notes.tmp', `${key('f')}.json.${dead}.tmp`].sort());
  expect(readdirSync(join(root, CACHE_DIR, 'pages')).sort()).toEqual([`${key('a')}.json`, `${key('c')}.json.${live}.tmp`].sort());
  expect(removeCacheLeftovers(root), 'a second pass finds nothing').toEqual([]);
});

it('is quiet where there is no cache yet', () => {
  const root = mkdtempSync(join(tmpdir(), 'cellbasis-cache-left-'));
  roots.push(root);
  expect(removeCacheLeftovers(root)).toEqual([]);
});
