// Cache entries no project uses any more (lib/publish/cache-unused.ts): a complete build removes
// the results, checked bases and PDFs of keys it did not use, written before it started; never
// an entry it used, one written since it started (another process's), nor anything not named as
// an entry. Without it every changed basis and every new library left its entries for ever.
import { mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, statSync, symlinkSync, utimesSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, expect, it } from 'vitest';
import { removeUnusedCacheEntries } from '../../lib/publish/cache-unused.ts';
import { CACHE_DIR } from '../../lib/batch/results-cache.ts';
import { renderScaffold } from '../../lib/basis/scaffolds.ts';
import { run } from '../helpers/run-cli.ts';

const made: string[] = [];
afterAll(() => {
  for (const dir of made) rmSync(dir, { recursive: true, force: true });
});

function tempRoot(): string {
  const root = mkdtempSync(join(tmpdir(), 'cellbasis-cache-unused-'));
  made.push(root);
  return root;
}

const key = (c: string) => c.repeat(64);
const HOUR_AGO = new Date(Date.now() - 3_600_000);

/** Writes `name` of `size` bytes into a cache folder, last modified an hour ago unless `recent`. */
function entry(root: string, folder: string, name: string, size: number, recent = false): void {
  const dir = join(root, CACHE_DIR, folder);
  mkdirSync(dir, { recursive: true });
  writeFileSync(join(dir, name), 'x'.repeat(size));
  if (!recent) utimesSync(join(dir, name), HOUR_AGO, HOUR_AGO);
}

it('removes only old entries of keys not used, in the folders named, and counts them', () => {
  const root = tempRoot();
  entry(root, 'results', `${key('a')}.json`, 10); // used: kept
  entry(root, 'results', `${key('b')}.json`, 20); // unused, old: removed
  entry(root, 'results', `${key('c')}.json`, 30, true); // unused, written since the build started: kept
  entry(root, 'results', `${key('d')}.json.12345.tmp`, 40); // a temporary file (cache-leftovers.ts): kept
  entry(root, 'results', 'notes.json', 50); // not named as an entry: kept
  entry(root, 'results', `${key('e')}.pdf`, 60); // a PDF's name in results/: not an entry there, kept
  symlinkSync(join(root, CACHE_DIR, 'results', `${key('a')}.json`), join(root, CACHE_DIR, 'results', `${key('f')}.json`)); // a link: kept
  mkdirSync(join(root, CACHE_DIR, 'results', `${key('9')}.json`)); // a folder: kept
  entry(root, 'bases', `${key('a')}.json`, 5); // used
  entry(root, 'bases', `${key('b')}.json`, 7); // unused: removed
  entry(root, 'pdf', `${key('b')}.pdf`, 100); // pdf/ not named: not looked at
  const startedMs = Date.now();
  const removed = removeUnusedCacheEntries(root, { results: new Set([key('a')]), bases: new Set([key('a')]) }, startedMs);
  expect(removed).toEqual({ entries: 2, bytes: 27 });
  expect(readdirSync(join(root, CACHE_DIR, 'results')).sort()).toEqual([`${key('9')}.json`, `${key('a')}.json`, `${key('c')}.json`, `${key('d')}.json.12345.tmp`, `${key('e')}.pdf`, `${key('f')}.json`, 'notes.json'].sort());
  expect(readdirSync(join(root, CACHE_DIR, 'bases'))).toEqual([`${key('a')}.json`]);
  expect(readdirSync(join(root, CACHE_DIR, 'pdf'))).toEqual([`${key('b')}.pdf`]);
  expect(removeUnusedCacheEntries(root, { results: new Set([key('a')]), bases: new Set([key('a')]) }, startedMs), 'a second pass finds nothing').toEqual({ entries: 0, bytes: 0 });
});

it('is quiet where there is no cache', () => {
  expect(removeUnusedCacheEntries(tempRoot(), { results: new Set(), bases: new Set(), pdf: new Set() }, Date.now())).toEqual({ entries: 0, bytes: 0 });
});

it('cellbasis build: a changed basis leaves one results entry, one checked basis and one page record a project, and the build says what it removed', async () => {
  const root = tempRoot();
  for (const id of ['p1', 'p2']) {
    mkdirSync(join(root, 'projects', id), { recursive: true });
    writeFileSync(join(root, 'projects', id, 'basis.yaml'), renderScaffold('pem', 'power', id, '2026-11-30'));
  }
  const folders = ['results', 'bases', 'pages'].map((f) => join(root, CACHE_DIR, f));
  const first = await run(['build', '--html-only', '--quiet'], root);
  expect(first.code, first.err).toBe(0);
  expect(first.err).not.toMatch(/no project uses/);
  const before = folders.map((dir) => readdirSync(dir).sort());
  for (const names of before) expect(names).toHaveLength(2);
  // As entries of an earlier day: written before the next build starts.
  for (const [i, dir] of folders.entries()) for (const n of before[i]!) utimesSync(join(dir, n), HOUR_AGO, HOUR_AGO);
  const file = join(root, 'projects', 'p1', 'basis.yaml');
  writeFileSync(file, `${readFileSync(file, 'utf8')}\n# a comment: new bytes, a new key\n`);
  const second = await run(['build', '--html-only', '--quiet'], root);
  expect(second.code, second.err).toBe(0);
  const gone = folders.reduce((sum, dir, i) => sum + before[i]!.filter((n) => !readdirSync(dir).includes(n)).length, 0);
  expect(gone, 'the old entry of p1 in each folder').toBe(3);
  for (const [i, dir] of folders.entries()) {
    const after = readdirSync(dir).sort();
    expect(after, dir).toHaveLength(2);
    expect(after.filter((n) => before[i]!.includes(n)), `${dir}: p2's entry, unchanged`).toHaveLength(1);
    for (const n of after) expect(statSync(join(dir, n)).isFile()).toBe(true);
  }
  expect(second.err).toMatch(/removed 3 cache entries no project uses any more \(\d+\.\d MiB\) from \.cellbasis-cache\//);
}, 120_000);
