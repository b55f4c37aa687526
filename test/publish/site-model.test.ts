// The site model keeps of each project only what its pages cannot make again: the basis and its
// results are read again when a page is rendered (from the basis file and the results cache), so
// the model of a large portfolio stays small; a basis saved meanwhile is refused, not published
// under the index row and warnings made from the text before.
import { readFileSync, rmSync, writeFileSync } from 'node:fs';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { loadSiteModel, type SiteModel } from '../../lib/publish/site-model.ts';
import { renderView } from '../../lib/publish/render.ts';
import { UserError } from '../../lib/core/errors.ts';
import { basisFile, demoRoot } from '../helpers/site.ts';

const ID = 'hob-tor-pem-backup';
let root: string;
let model: SiteModel;

beforeAll(() => {
  root = demoRoot([ID, 'kestrelford-pem-electrolyser']);
  model = loadSiteModel(root, { env: { SOURCE_DATE_EPOCH: '1764547200' } });
}, 60_000);

afterAll(() => rmSync(root, { recursive: true, force: true }));

it('makes a page again, the same each time, from the basis file and the results cache', () => {
  const page = model.pages.find((p) => p.pagePath === `projects/${ID}/index.html`)!;
  const first = renderView(page.view());
  expect(first).toContain('8 kW PEM backup power unit');
  expect(renderView(page.view())).toBe(first);
  // The row is made when the model is loaded and kept, formatted.
  expect(model.portfolio.rows.map((r) => r.id)).toEqual(['hob-tor-pem-backup', 'kestrelford-pem-electrolyser']);
  expect(model.portfolio.rows[0]!.title).toMatch(/^8 kW PEM backup power unit/);
});

it('refuses to make a page or a PDF of a basis saved after the model was made from it', () => {
  const page = model.pages.find((p) => p.pagePath === `projects/${ID}/index.html`)!;
  const draft = model.drafts.find((d) => d.id === ID)!;
  const good = readFileSync(basisFile(root, ID), 'utf8');
  writeFileSync(basisFile(root, ID), good.replace('title: 8 kW PEM backup power unit', 'title: 9 kW PEM backup power unit'));
  try {
    expect(() => page.view()).toThrow(UserError);
    expect(() => page.view()).toThrow(`projects/${ID}/basis.yaml changed while the site was made from it`);
    expect(() => draft.document()).toThrow(`projects/${ID}/basis.yaml changed while the site was made from it`);
  } finally {
    writeFileSync(basisFile(root, ID), good);
  }
  // The same text again: the page is made as before.
  expect(renderView(page.view())).toContain('8 kW PEM backup power unit');
});
