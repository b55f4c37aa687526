// Draft pages kept from the site a build replaces (lib/publish/kept-pages.ts): a draft whose
// inputs (basis bytes, revision context, history, page path) and rendering code are those of a
// page the old site holds unchanged has its files linked instead of rendered. What must hold:
// the site is byte for byte the one a build rendering every page writes; anything changed (the
// basis, a file of the old site edited or removed) is rendered again; and no file the old site
// holds is ever written through a link.
import { linkSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, relative } from 'node:path';
import { afterAll, expect, it } from 'vitest';
import { buildSite } from '../../lib/publish/build.ts';
import { draftPageKey, keptPages } from '../../lib/publish/kept-pages.ts';
import { renderScaffold } from '../../lib/basis/scaffolds.ts';
import { CACHE_DIR } from '../../lib/batch/results-cache.ts';
import { run } from '../helpers/run-cli.ts';

const made: string[] = [];
afterAll(() => {
  for (const dir of made) rmSync(dir, { recursive: true, force: true });
});

const KINDS = [
  ['pem', 'power'],
  ['solid-oxide', 'power'],
  ['pem', 'electrolysis'],
  ['molten-carbonate', 'power'],
] as const;

/** A working folder with one scaffold project of each kind above: p1..p4. */
function portfolio(): string {
  const root = mkdtempSync(join(tmpdir(), 'cellbasis-kept-pages-'));
  made.push(root);
  KINDS.forEach(([technology, mode], i) => {
    const id = `p${i + 1}`;
    mkdirSync(join(root, 'projects', id), { recursive: true });
    writeFileSync(join(root, 'projects', id, 'basis.yaml'), renderScaffold(technology, mode, id, '2026-11-30'));
  });
  return root;
}

/** Every file under `dir` by path relative to it, with its bytes. */
function files(dir: string, base = dir): Map<string, Buffer> {
  const out = new Map<string, Buffer>();
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const path = join(dir, entry.name);
    if (entry.isDirectory()) for (const [k, v] of files(path, base)) out.set(k, v);
    else out.set(relative(base, path), readFileSync(path));
  }
  return out;
}

const draftFiles = (site: string, id: string) => [...files(join(site, 'projects', id)).keys()].filter((p) => p === 'index.html' || p.endsWith('.csv'));

it('a second build keeps every unchanged draft page, and writes the very bytes of a build that renders them all', async () => {
  const root = portfolio();
  const site = join(root, 'site');
  const first = await buildSite({ root, pdf: false });
  expect(first.keptPages, 'nothing to keep the first time').toBe(0);
  const inode = () => statSync(join(site, 'projects', 'p1', 'index.html')).ino;
  const written = inode();
  const second = await buildSite({ root, pdf: false });
  expect(second.keptPages).toBe(KINDS.length);
  // Linked, not written: the page's file is the first build's.
  expect(inode()).toBe(written);
  const kept = files(site);
  const rendered = await buildSite({ root, pdf: false, renderAll: true });
  expect(rendered.keptPages).toBe(0);
  expect(inode()).not.toBe(written);
  const again = files(site);
  expect([...kept.keys()].sort()).toEqual([...again.keys()].sort());
  for (const [path, bytes] of again) expect(kept.get(path)!.equals(bytes), path).toBe(true);
  // Each draft has its page and CSV files recorded, so a build after --render-all keeps them again.
  expect((await buildSite({ root, pdf: false })).keptPages).toBe(KINDS.length);
  expect(readdirSync(join(root, CACHE_DIR, 'pages')).filter((n) => n.endsWith('.json'))).toHaveLength(KINDS.length);
});

it('renders again what changed (a basis, a file of the old site edited or removed) and never writes through a link into the old site', async () => {
  const root = portfolio();
  const site = join(root, 'site');
  await buildSite({ root, pdf: false });
  const truth = files(site);
  // p1: a new basis (a comment: new bytes, new key). p2: its page edited in place in the site.
  // p3: one of its CSV files removed. p4: untouched.
  const basis = join(root, 'projects', 'p1', 'basis.yaml');
  writeFileSync(basis, `${readFileSync(basis, 'utf8')}\n# changed\n`);
  const page2 = join(site, 'projects', 'p2', 'index.html');
  writeFileSync(page2, `${readFileSync(page2, 'utf8')}<!-- edited by hand -->`);
  const csv3 = draftFiles(site, 'p3').find((p) => p.endsWith('.csv'))!;
  rmSync(join(site, 'projects', 'p3', csv3));
  // Links held outside the site to the old files: a build writing through a link would change them.
  const watch = mkdtempSync(join(tmpdir(), 'cellbasis-kept-watch-'));
  made.push(watch);
  const held = ['p1', 'p2', 'p4'].map((id) => {
    const copy = join(watch, `${id}.html`);
    linkSync(join(site, 'projects', id, 'index.html'), copy);
    return { copy, bytes: readFileSync(copy) };
  });
  const report = await buildSite({ root, pdf: false });
  expect(report.keptPages, 'only p4 is kept').toBe(1);
  for (const { copy, bytes } of held) expect(readFileSync(copy).equals(bytes), copy).toBe(true);
  const now = files(site);
  expect(now.get(join('projects', 'p2', 'index.html'))!.equals(truth.get(join('projects', 'p2', 'index.html'))!), 'the edit is gone').toBe(true);
  expect(now.get(join('projects', 'p3', csv3))!.equals(truth.get(join('projects', 'p3', csv3))!), 'the CSV file is back').toBe(true);
  // p4's page is the one held outside (linked), p1's and p2's new files.
  expect(statSync(join(site, 'projects', 'p4', 'index.html')).ino).toBe(statSync(held[2]!.copy).ino);
  for (const [i, id] of ['p1', 'p2'].entries()) expect(statSync(join(site, 'projects', id, 'index.html')).ino, id).not.toBe(statSync(held[i]!.copy).ino);
});

it('the key changes with each input it stands for, and only with them', () => {
  const inputs = { resultsKey: 'a'.repeat(64), pagePath: 'projects/p1/index.html', revision: { kind: 'draft', revision: 'A', date: '2026-11-30' }, history: [{ revision: 'A', note: '' }] };
  const key = draftPageKey(inputs);
  expect(draftPageKey(structuredClone(inputs))).toBe(key);
  expect(key).toMatch(/^[0-9a-f]{64}$/);
  const variants = [
    { ...inputs, resultsKey: 'b'.repeat(64) },
    { ...inputs, pagePath: 'projects/p2/index.html' },
    { ...inputs, revision: { ...inputs.revision, date: '2026-12-01' } },
    { ...inputs, history: [{ revision: 'A', note: 'issued for review' }] },
  ];
  for (const v of variants) expect(draftPageKey(v)).not.toBe(key);
});

it('cellbasis build says how many pages it kept, and --render-all renders them all', async () => {
  const root = portfolio();
  expect((await run(['build', '--html-only', '--quiet'], root)).code).toBe(0);
  const kept = await run(['build', '--html-only', '--quiet'], root);
  expect(kept.code, kept.err).toBe(0);
  expect(kept.err).toContain(`kept ${KINDS.length} draft pages of the site replaced, unchanged`);
  const all = await run(['build', '--html-only', '--quiet', '--render-all'], root);
  expect(all.code, all.err).toBe(0);
  expect(all.err).not.toContain('kept');
});

it('uses no record that names a file beyond the page and its own tables folder (the build writes those itself)', () => {
  const root = mkdtempSync(join(tmpdir(), 'cellbasis-kept-records-'));
  made.push(root);
  const old = join(root, 'old');
  const paths = ['projects/p1/index.html', 'projects/p1/tables/streams.csv', 'projects/p2/index.html', 'index.html', 'projects/p1/tables/sub/x.csv'];
  for (const path of paths) {
    mkdirSync(join(old, path, '..'), { recursive: true });
    writeFileSync(join(old, path), path);
  }
  // Records made as a build makes them, over the files of `old` (written there, as into a fresh folder).
  const writer = keptPages(root, join(root, 'none'), old);
  const at = (...names: string[]) => names.map((n) => join(old, n));
  writer.record('a'.repeat(64), at('projects/p1/index.html', 'projects/p1/tables/streams.csv'));
  writer.record('b'.repeat(64), at('projects/p1/index.html', 'index.html'));
  writer.record('c'.repeat(64), at('projects/p1/index.html', 'projects/p2/index.html'));
  writer.record('d'.repeat(64), at('projects/p1/index.html', 'projects/p1/tables/sub/x.csv'));
  const fresh = join(root, 'fresh');
  mkdirSync(fresh);
  const reader = keptPages(root, old, fresh);
  for (const key of ['b', 'c', 'd']) expect(reader.link(key.repeat(64), 'projects/p1/index.html'), key).toBe(false);
  expect(readdirSync(fresh), 'nothing linked by a refused record').toEqual([]);
  expect(reader.link('a'.repeat(64), 'projects/p2/index.html'), 'a record for another page').toBe(false);
  expect(reader.link('a'.repeat(64), 'projects/p1/index.html')).toBe(true);
  expect(readFileSync(join(fresh, 'projects/p1/tables/streams.csv'), 'utf8')).toBe('projects/p1/tables/streams.csv');
  expect(reader.linked()).toBe(1);
});
