// One document on its own, for issuing: renderDocumentHtml with the site's templates, and
// inlineAssets making it a single file that needs nothing beside it.
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { renderDocumentHtml, renderStandaloneHtml, renderView, renderViewBytes } from '../../lib/publish/render.ts';
import { nunjucksEnvironment, renderParts } from '../../lib/publish/nunjucks-env.ts';
import { documentView, type DocumentView } from '../../lib/report/document.ts';
import { inlineAssets } from '../../lib/publish/inline-assets.ts';
import { writeSiteAssets } from '../../lib/publish/write-assets.ts';
import { CASES, scaffoldCase } from '../helpers/scaffold-cases.ts';
import { HAZARD_NOTICE } from '../../lib/hazards/notice.ts';
import { escapeHtml } from '../../lib/report/trusted-html.ts';

const c = scaffoldCase('molten-carbonate', 'power');
const input = { basis: c.basis, results: c.results, revision: { kind: 'issued' as const, revision: 'A', status: 'issued for review' as const, issuedOn: '2026-10-01', note: '', signatures: [], pdfHref: 'document.pdf' }, history: [] };
const dir = mkdtempSync(join(tmpdir(), 'cellbasis-render-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('renderDocumentHtml', () => {
  const html = renderDocumentHtml(input, { assetBase: '../../assets/' });
  it('links the assets relative to the page and carries every section', () => {
    expect(html).toContain('<link rel="stylesheet" href="../../assets/katex/katex.min.css">');
    expect(html).toContain('<script src="../../assets/charts.js"></script>');
    for (const id of ['title-block', 'purpose', 'summary', 'inputs', 'assumptions', 'method', 'results', 'cases', 'charts', 'hazards', 'verification', 'references', 'history']) expect(html).toContain(`id="${id}"`);
  });
  it('opens the hazards section with the standing notice, before the first caution', () => {
    const hazards = html.slice(html.indexOf('<section id="hazards"'));
    const notice = hazards.indexOf(`<p class="notice" role="note">${escapeHtml(HAZARD_NOTICE)}</p>`);
    expect(notice).toBeGreaterThan(0);
    expect(notice).toBeLessThan(hazards.indexOf('<div class="caution'));
    expect(HAZARD_NOTICE).toMatch(/authority having jurisdiction and licensed professional practice/);
  });
  it('is the same for the same input', () => {
    expect(renderDocumentHtml(input, { assetBase: '../../assets/' })).toBe(html);
  });
});

describe('inlineAssets', () => {
  const assets = join(dir, 'assets');
  writeSiteAssets(assets);
  const single = inlineAssets(renderDocumentHtml(input, { assetBase: '' }), assets);

  it('leaves no link to a stylesheet or script file', () => {
    expect(single).not.toMatch(/<link\b[^>]*stylesheet/);
    expect(single).not.toMatch(/<script\b[^>]*\bsrc=/);
    expect(single).toContain('new window.Chart(');
  });
  it('embeds the KaTeX fonts as WOFF2 data URIs and drops the other formats', () => {
    expect(single).toMatch(/url\(data:font\/woff2;base64,[A-Za-z0-9+/]{100}/);
    expect(single).not.toMatch(/url\([^)]*\.(woff|ttf)\)/);
    expect(single).not.toContain('url(fonts/');
  });
  it('keeps links to other documents such as the issued PDF', () => {
    expect(single).toContain('href="document.pdf"');
  });
  it('matches renderStandaloneHtml, whose tables carry their CSV inside the file', () => {
    // Nothing stands beside a standalone document, so its CSV are data: URIs (tables: 'inline').
    expect(renderStandaloneHtml(input)).toBe(inlineAssets(renderDocumentHtml(input, { assetBase: '', tables: 'inline' }), assets));
    expect(renderStandaloneHtml(input)).not.toContain('href="tables/');
  });
  it('refuses an asset URL that leads outside the asset folder or names nothing', () => {
    writeFileSync(join(dir, 'secret.css'), 'body{}');
    expect(() => inlineAssets('<link rel="stylesheet" href="../secret.css">', assets)).toThrow(/outside the asset folder/);
    expect(() => inlineAssets('<script src="missing.js"></script>', assets)).toThrow(/not in the asset folder/);
  });
});

describe('renderViewBytes', () => {
  const view = (c: { basis: typeof input.basis; results: typeof input.results }) => documentView({ ...input, basis: c.basis, results: c.results }, { assetBase: '../../assets/' });
  const bytesOf = (doc: DocumentView) => {
    let copy = Buffer.alloc(0);
    renderViewBytes(doc, (bytes) => (copy = Buffer.from(bytes)));
    return copy;
  };
  it.each(CASES)('gives the UTF-8 bytes of renderView, the page rendered in parts (%s %s)', (technology, mode) => {
    const doc = view(scaffoldCase(technology, mode));
    const parts = renderParts(nunjucksEnvironment(), 'document-page.njk', { doc });
    // Each piece of trusted HTML is a part of its own, between the text around it.
    expect(parts.length).toBeGreaterThan(100);
    expect(parts.join('')).toBe(renderView(doc));
    expect(bytesOf(doc).equals(Buffer.from(renderView(doc), 'utf8'))).toBe(true);
  });
  it('gives them as well where the page text holds the NUL that marks the parts, by rendering it whole', () => {
    const doc = view(c);
    const marked = { ...doc, pageTitle: `${doc.pageTitle} \u00000\u0000 \u0000` };
    expect(renderParts(nunjucksEnvironment(), 'document-page.njk', { doc: marked })).toEqual([renderView(marked)]);
    expect(bytesOf(marked).equals(Buffer.from(renderView(marked), 'utf8'))).toBe(true);
    expect(bytesOf(marked).includes('\u00000\u0000')).toBe(true);
  });
});
