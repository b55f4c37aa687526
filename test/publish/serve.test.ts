// cellbasis serve: Eleventy's dev server on the site, rebuilt incrementally when a basis changes
// (only that project's pages and the index), with the same bytes as the built site; a basis with errors shows its located diagnostics on the
// index page and the server keeps running.
import { readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { serveSite } from '../../lib/publish/serve.ts';
import { buildSite } from '../../lib/publish/build.ts';
import { join } from 'node:path';
import { basisFile, demoRoot, freePort } from '../helpers/site.ts';

const ID = 'hob-tor-pem-backup';
/** A second project, which a change to the first must leave alone. */
const OTHER = 'kestrelford-pem-electrolyser';
let port: number;
let root: string;
let server: { stop(): Promise<void> };

async function page(path: string): Promise<string> {
  const response = await fetch(`http://127.0.0.1:${port}/${path}`);
  return response.text();
}

/** Polls a page until `test` holds (the rebuild after a change takes a moment), at most 30 s. */
async function until(path: string, test: (html: string) => boolean): Promise<string> {
  let html = '';
  for (let i = 0; i < 60; i++) {
    html = await page(path).catch(() => '');
    if (test(html)) return html;
    await new Promise((r) => setTimeout(r, 500));
  }
  return html;
}

beforeAll(async () => {
  root = demoRoot([ID, OTHER]);
  port = await freePort();
  server = await serveSite({ root, port });
}, 120_000);

afterAll(async () => {
  await server?.stop();
  rmSync(root, { recursive: true, force: true });
});

it('serves the site, rebuilds it when a basis changes, and shows a broken basis on the index page', async () => {
  expect(await until(`projects/${ID}/`, (h) => h.includes('8 kW PEM backup power unit'))).toContain('8 kW PEM backup power unit');
  const otherPage = join(root, 'site', 'projects', OTHER, 'index.html');
  const otherWritten = statSync(otherPage).mtimeMs;
  const good = readFileSync(basisFile(root, ID), 'utf8');
  writeFileSync(basisFile(root, ID), good.replace('title: 8 kW PEM backup power unit', 'title: 9 kW PEM backup power unit'));
  expect(await until(`projects/${ID}/`, (h) => h.includes('9 kW PEM backup power unit'))).toContain('9 kW PEM backup power unit');
  expect(await until('', (h) => h.includes('9 kW PEM backup power unit'))).toContain('9 kW PEM backup power unit');
  expect(statSync(otherPage).mtimeMs, 'the page of the unchanged project is not written again').toBe(otherWritten);
  writeFileSync(basisFile(root, ID), good.replace('value: "62 C", source: R2', 'value: "warm", source: R2'));
  const index = await until('', (h) => h.includes('The last build failed'));
  expect(index).toMatch(/projects\/hob-tor-pem-backup\/basis\.yaml:\d+:\d+: conditions\.operating-temperature\.value: expected a temperature/);
  writeFileSync(basisFile(root, ID), good);
  expect(await until('', (h) => h.includes('8 kW PEM backup power unit') && !h.includes('The last build failed'))).toContain('8 kW PEM backup power unit');
}, 120_000);

it('serves each page byte for byte as cellbasis build writes it (one renderer for both)', async () => {
  await until(`projects/${ID}/`, (h) => h.includes('8 kW PEM backup power unit'));
  const built = join(root, 'built');
  await buildSite({ root, out: built, pdf: false });
  for (const path of [`projects/${ID}/index.html`, `projects/${OTHER}/index.html`, 'index.html']) {
    expect(await page(path), path).toBe(readFileSync(join(built, path), 'utf8'));
  }
}, 120_000);

it('after a save that changes a project’s numbers, serves the index byte for byte as a full build writes it (only that row made again)', async () => {
  const before = await until('', (h) => h.includes('8 kW PEM backup power unit') && !h.includes('The last build failed'));
  const good = readFileSync(basisFile(root, ID), 'utf8');
  const changed = good.replace('current-density: { value: "0.65 A/cm2", source: R2 }', 'current-density: { value: "0.55 A/cm2", source: R2 }');
  expect(changed, 'the demo basis still states its current density this way').not.toBe(good);
  try {
    writeFileSync(basisFile(root, ID), changed);
    // The row's numbers (cell voltage, output, heat) move with the current density: the index changes.
    const after = await until('', (h) => h !== before && h.includes('8 kW PEM backup power unit'));
    expect(after).not.toBe(before);
    const row = (html: string, id: string) => new RegExp(`<tr id="project-${id}">[\\s\\S]*?</tr>`).exec(html)?.[0];
    expect(row(before, ID)).toBeDefined();
    expect(row(after, ID), 'the changed project’s row').not.toBe(row(before, ID));
    expect(row(after, OTHER), 'the other project’s row').toBe(row(before, OTHER));
    const built = join(root, 'built-after-save');
    await buildSite({ root, out: built, pdf: false });
    expect(after).toBe(readFileSync(join(built, 'index.html'), 'utf8'));
  } finally {
    writeFileSync(basisFile(root, ID), good);
    await until('', (h) => h === before);
  }
}, 120_000);
