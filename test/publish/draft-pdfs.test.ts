// The PDF cache of the working drafts (lib/publish/draft-pdfs.ts): an unchanged draft is copied,
// not printed again; but a PDF depends on more than its page's bytes, and its key must say so.
// A stylesheet changed alone left every page's bytes as they were, so builds served the PDFs
// printed with the old stylesheet (found when a print-CSS fix did not show in the PDFs).
import { cpSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, statSync, utimesSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, expect, it } from 'vitest';
import { printInputs } from '../../lib/publish/draft-pdfs.ts';
import { buildSite } from '../../lib/publish/build.ts';
import { CACHE_DIR } from '../../lib/batch/results-cache.ts';
import { describeWithChromium } from '../helpers/chromium.ts';
import { basisFile, demoRoot, EPOCH } from '../helpers/site.ts';

const made: string[] = [];
afterAll(() => {
  for (const dir of made) rmSync(dir, { recursive: true, force: true });
});

function fakeSite(): string {
  const site = mkdtempSync(join(tmpdir(), 'cellbasis-print-inputs-'));
  made.push(site);
  mkdirSync(join(site, 'assets', 'katex', 'fonts'), { recursive: true });
  writeFileSync(join(site, 'assets', 'report.css'), 'body { font-size: 10pt; }\n');
  writeFileSync(join(site, 'assets', 'katex', 'fonts', 'a.woff2'), 'font');
  mkdirSync(join(site, 'projects', 'p'), { recursive: true });
  writeFileSync(join(site, 'projects', 'p', 'index.html'), '<p>page</p>');
  return site;
}

it('digests every asset the pages load: a changed byte, an added or a renamed asset changes it; the pages do not', () => {
  const site = fakeSite();
  const base = printInputs(site);
  const copy = mkdtempSync(join(tmpdir(), 'cellbasis-print-inputs-'));
  made.push(copy);
  cpSync(site, copy, { recursive: true });
  expect(printInputs(copy), 'the same assets elsewhere').toBe(base);
  writeFileSync(join(copy, 'projects', 'p', 'index.html'), '<p>another page</p>');
  expect(printInputs(copy), 'a page is keyed by its own bytes, not here').toBe(base);
  writeFileSync(join(copy, 'assets', 'report.css'), 'body { font-size: 11pt; }\n');
  expect(printInputs(copy), 'a changed stylesheet').not.toBe(base);
  writeFileSync(join(copy, 'assets', 'report.css'), 'body { font-size: 10pt; }\n');
  expect(printInputs(copy), 'changed back').toBe(base);
  writeFileSync(join(copy, 'assets', 'katex', 'fonts', 'b.woff2'), 'font');
  expect(printInputs(copy), 'an added font').not.toBe(base);
  rmSync(join(copy, 'assets', 'katex', 'fonts', 'b.woff2'));
  cpSync(join(copy, 'assets', 'katex', 'fonts', 'a.woff2'), join(copy, 'assets', 'katex', 'fonts', 'c.woff2'));
  rmSync(join(copy, 'assets', 'katex', 'fonts', 'a.woff2'));
  expect(printInputs(copy), 'a renamed font').not.toBe(base);
});

describeWithChromium('draft PDFs from the cache', () => {
  it('copies an unchanged draft and prints a changed one, one cache entry per PDF printed, the changed draft\'s old PDF removed', async () => {
    const root = demoRoot(['hob-tor-pem-backup', 'kestrelford-pem-electrolyser']);
    made.push(root);
    const cache = join(root, CACHE_DIR, 'pdf');
    await buildSite({ root, env: EPOCH });
    const first = readdirSync(cache).sort();
    expect(first).toHaveLength(2);
    const mtimes = first.map((n) => statSync(join(cache, n)).mtimeMs);
    const pdf = join(root, 'site', 'projects', 'hob-tor-pem-backup', 'document.pdf');
    const bytes = readFileSync(pdf);
    await buildSite({ root, env: EPOCH });
    expect(readdirSync(cache).sort(), 'nothing printed: both copied').toEqual(first);
    expect(first.map((n) => statSync(join(cache, n)).mtimeMs)).toEqual(mtimes);
    expect(readFileSync(pdf).equals(bytes)).toBe(true);
    const file = basisFile(root, 'hob-tor-pem-backup');
    writeFileSync(file, readFileSync(file, 'utf8').replace('title: 8 kW PEM backup power unit', 'title: 8.5 kW PEM backup power unit'));
    // Written an hour before this build, as entries of earlier days are (lib/publish/cache-unused.ts keeps what was written since the build started).
    const hourAgo = new Date(Date.now() - 3_600_000);
    for (const n of first) utimesSync(join(cache, n), hourAgo, hourAgo);
    await buildSite({ root, env: EPOCH });
    const third = readdirSync(cache).sort();
    expect(readFileSync(pdf).equals(bytes)).toBe(false);
    expect(third, 'the changed draft printed anew and the PDF of its old page removed; the unchanged one kept').toHaveLength(2);
    expect(third.filter((n) => first.includes(n)), 'the unchanged draft\'s entry').toHaveLength(1);
  }, 240_000);
});
