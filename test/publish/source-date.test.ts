// The date a working draft is shown with (lib/publish/source-date.ts): reproducible (never the
// clock), and never before the revision it follows; and the sign-off dates a draft kept from the
// revision before, which its title block and revision history mark as such. Revisions are dated in the order they are
// made, each after the one it supersedes (common practice of document control, no source); the
// Hob Tor demo's basis kept the sign-offs of revision 0 (latest 2026-05-26), issued 2026-05-27,
// so its draft of revision 1 was dated the day before the revision it follows.
import { cpSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { draftDate } from '../../lib/publish/source-date.ts';
import { loadSiteModel, type SiteModel } from '../../lib/publish/site-model.ts';
import { renderView } from '../../lib/publish/render.ts';
import { basisFrom } from '../helpers/scaffold-basis.ts';
import { demoRoot } from '../helpers/site.ts';

const SIGNED = { 'document.sign-off': { prepared: { name: 'A. B', date: '2026-05-11' }, checked: { name: 'C. D', date: '2026-05-18' } } };

it('is the latest sign-off date, or the last issue date where that is later, or SOURCE_DATE_EPOCH when set', () => {
  const basis = basisFrom('pem', 'power', SIGNED);
  expect(draftDate(basis, {})).toBe('2026-05-18');
  expect(draftDate(basis, {}, '2026-05-27')).toBe('2026-05-27');
  expect(draftDate(basis, {}, '2026-05-01')).toBe('2026-05-18');
  // 1767225600 s is 2026-01-01T00:00:00Z.
  expect(draftDate(basis, { SOURCE_DATE_EPOCH: '1767225600' }, '2026-05-27')).toBe('2026-01-01');
});

let root: string;
let model: SiteModel;
beforeAll(() => {
  root = demoRoot(['hob-tor-pem-backup']);
  // The issued revision beside the basis, as the repository holds it (a copy: nothing is changed).
  cpSync(new URL('../../projects/hob-tor-pem-backup/issued', import.meta.url), join(root, 'projects', 'hob-tor-pem-backup', 'issued'), { recursive: true });
  model = loadSiteModel(root, { env: {} });
}, 60_000);
afterAll(() => rmSync(root, { recursive: true, force: true }));

it('dates the Hob Tor draft of revision 1 no earlier than revision 0, issued 2026-05-27', () => {
  const draft = model.drafts.find((d) => d.id === 'hob-tor-pem-backup')!;
  expect(draft.revision.kind === 'draft' && draft.revision.lastIssued?.issuedOn).toBe('2026-05-27');
  expect(draft.date).toBe('2026-05-27');
});

it("marks the Hob Tor draft's sign-offs, kept from revision 0, as dated before revision 0 was issued", () => {
  // The draft of revision 1 showed "Approved L. Brennan-Oduya 2026-05-26" as if revision 1 had
  // been approved the day before revision 0 was: those are revision 0's sign-offs, kept in the
  // basis; they do not sign revision 1 (lib/archive/issue-rules.ts refuses them when it is issued
  // with changes).
  const page = model.pages.find((p) => p.pagePath === 'projects/hob-tor-pem-backup/index.html')!;
  const html = renderView(page.view());
  const marked = '2026-05-26 (before revision 0 was issued, 2026-05-27)';
  // Once in the title block, once in the draft's row of the revision history.
  expect(html.split(marked).length - 1).toBe(2);
  // Revision 0's own row keeps its dates as issued.
  expect(html).toContain('L. Brennan-Oduya, 2026-05-26</td>');
});
