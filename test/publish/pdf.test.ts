// The PDF printer on a page of its own: paper, running header and footer on every page,
// document properties and dates, attachments, charts waited for, network refused.
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { PDFArray, PDFDict, PDFDocument, PDFName, PDFRef, PDFString } from 'pdf-lib';
import { withPdfPrinter } from '../../lib/publish/pdf.ts';
import { footerTemplate, headerTemplate } from '../../lib/publish/pdf-page.ts';
import type { PdfMeta } from '../../lib/core/pdf-properties.ts';
import { toolVersion } from '../../lib/core/version.ts';
import { announceChromiumSkip, describeWithChromium } from '../helpers/chromium.ts';
import { compact, pageTexts, pdfAttachments, pdfInfo } from '../helpers/pdf-inspect.ts';

announceChromiumSkip('the PDF printer tests');

const dir = mkdtempSync(join(tmpdir(), 'cellbasis-pdf-'));

function page(body: string, htmlAttributes = ''): string {
  const path = join(dir, `page-${Math.random().toString(36).slice(2)}.html`);
  writeFileSync(path, `<!doctype html><html lang="en" ${htmlAttributes}><head><meta charset="utf-8"><title>t</title></head><body>${body}</body></html>`);
  return path;
}

const long = Array.from({ length: 5 }, (_, i) => `<h1>Section ${i + 1}</h1><p style="height: 250mm">text ${i + 1}</p>`).join('');

const meta: PdfMeta = {
  title: 'Stack <design> basis & "more"',
  documentNumber: 'DB-X-001',
  revision: 'B',
  status: 'issued for review',
  author: 'A. Engineer',
  subject: 'Design-basis calculation: test',
  keywords: ['design basis', 'DB-X-001'],
  paper: 'Letter',
  date: new Date('2026-11-30T00:00:00Z'),
  attachments: [{ name: 'basis.yaml', bytes: Buffer.from('a: 1\n'), mimeType: 'application/yaml', description: 'the basis', relationship: 'Source' }],
};

it('escapes the user text in the header and footer templates and styles them inline', () => {
  const header = headerTemplate(meta);
  expect(header).toContain('Stack &lt;design&gt; basis &amp; &quot;more&quot;');
  expect(header).toMatch(/^<div style="[^"]*font-size: 7.5pt/);
  expect(footerTemplate(meta)).toContain('<span class="pageNumber"></span> of <span class="totalPages"></span>');
  expect(footerTemplate(meta)).toContain('DB-X-001 rev B, issued for review, 2026-11-30');
});

describeWithChromium('PDF printer', () => {
  let pdf: Uint8Array;
  const blocked: string[] = [];

  beforeAll(async () => {
    const html = page(`<link rel="stylesheet" href="https://example.invalid/a.css"><img src="http://example.invalid/i.png">${long}`);
    pdf = await withPdfPrinter((printer) => printer.print(html, meta), { onBlockedRequest: (url) => blocked.push(url) });
  });

  it('prints every page with the running header and footer, on the paper asked for', async () => {
    const doc = await PDFDocument.load(pdf);
    expect(doc.getPageCount()).toBeGreaterThan(1);
    const { width, height } = doc.getPage(0).getSize();
    expect([Math.round(width), Math.round(height)]).toEqual([612, 792]); // Letter, 8.5 × 11 in
    const texts = await pageTexts(pdf);
    expect(texts.length).toBe(doc.getPageCount());
    texts.forEach((t, i) => {
      const words = compact(t);
      for (const field of ['DB-X-001', 'Stack <design> basis & "more"', 'Rev B', 'issued for review', '2026-11-30', `page ${i + 1} of ${texts.length}`]) {
        expect(words, `page ${i + 1}: ${field}`).toContain(compact(field));
      }
    });
    expect(compact(texts[2]!)).toContain('Section3');
  });

  it('sets the document properties and the dates from the meta, never the clock', async () => {
    const info = await pdfInfo(pdf);
    expect(info).toMatchObject({
      title: meta.title,
      author: 'A. Engineer',
      subject: 'Design-basis calculation: test',
      keywords: 'design basis DB-X-001',
      creator: `cellbasis ${toolVersion()}`,
      producer: expect.stringMatching(new RegExp(`^cellbasis ${toolVersion().replaceAll('.', '\\.')} \\(Chromium \\d+\\.[\\d.]+\\)$`)),
      creationDate: 'D:20261130000000Z',
      modDate: 'D:20261130000000Z',
    });
    const files = await pdfAttachments(pdf);
    expect([...files.keys()]).toEqual(['basis.yaml']);
    expect(files.get('basis.yaml')!.bytes.toString()).toBe('a: 1\n');
    expect(files.get('basis.yaml')!.creationDate).toBe('D:20261130000000Z');
    expect((await PDFDocument.load(pdf)).catalog.has(PDFName.of('Outlines')), 'an outline').toBe(true);
  });

  it('refuses every request that is not to a local file', () => {
    expect(blocked.sort()).toEqual(['http://example.invalid/i.png', 'https://example.invalid/a.css']);
  });

  it('waits for the charts to report ready, and prints the same bytes for the same page', async () => {
    const charts = page(
      `<canvas id="c" width="200" height="100"></canvas>${long}<script>setTimeout(() => { document.body.insertAdjacentHTML('afterbegin', '<p>charts drawn</p>'); document.documentElement.dataset.chartsReady = 'true'; }, 400);</script>`,
      'data-charts-ready="false"',
    );
    const [a, b] = await withPdfPrinter((printer) => Promise.all([printer.print(charts, meta), printer.print(charts, meta)]), { pages: 2 });
    expect(compact((await pageTexts(a))[0]!)).toContain('chartsdrawn');
    expect(Buffer.from(a).equals(Buffer.from(b))).toBe(true);
  });

  it('prints the same bytes for a page whatever the tab printed before: structure element names are renumbered', async () => {
    // A table whose cells name their header cells: Chromium tags the header cells with /ID
    // (node<DOM node number>) and the data cells with /Headers naming them (ISO 32000-1
    // §14.7.2, §14.8.5.7). DOM node numbers count up in a renderer, so a tab that printed
    // another page first numbered them differently (seen in CI: a reprinted draft unlike the first print).
    const table = page(`<table><thead><tr><th>quantity</th><th>value</th></tr></thead><tbody>${Array.from({ length: 6 }, (_, i) => `<tr><th scope="row">row ${i}</th><td>${i}</td></tr>`).join('')}</tbody></table>${long}`);
    const other = page(`<h1>another page</h1>${long}`);
    const [first, again] = await withPdfPrinter(
      async (printer) => {
        const a = await printer.print(table, meta);
        await printer.print(other, meta);
        return [a, await printer.print(table, meta)] as const;
      },
      { pages: 1 },
    );
    expect(Buffer.from(first).equals(Buffer.from(again)), 'the same page printed on a fresh tab and on a used one').toBe(true);

    const doc = await PDFDocument.load(first);
    const root = doc.catalog.lookup(PDFName.of('StructTreeRoot'), PDFDict);
    const idTree = root.lookup(PDFName.of('IDTree'), PDFDict).lookup(PDFName.of('Names'), PDFArray);
    const listed = new Map<string, PDFRef>();
    for (let i = 0; i < idTree.size(); i += 2) listed.set((idTree.lookup(i) as PDFString).decodeText(), idTree.get(i + 1) as PDFRef);
    expect(listed.size, 'header cells carry names').toBeGreaterThanOrEqual(2);
    expect([...listed.keys()]).toEqual([...listed.keys()].map((_, i) => `node${String(i + 1).padStart(8, '0')}`));
    for (const [name, ref] of listed) expect((doc.context.lookup(ref, PDFDict).get(PDFName.of('ID')) as PDFString).decodeText()).toBe(name);
    // Every /Headers entry names a listed element.
    // The /Headers of table cells, wherever they sit (the objects are packed in object streams).
    const headers: string[] = [];
    const seen = new Set<unknown>();
    const collect = (value: unknown): void => {
      if (seen.has(value)) return;
      seen.add(value);
      if (value instanceof PDFArray) for (let i = 0; i < value.size(); i++) collect(value.get(i));
      if (!(value instanceof PDFDict)) return;
      const list = value.get(PDFName.of('Headers'));
      if (list instanceof PDFArray) for (let i = 0; i < list.size(); i++) headers.push((list.get(i) as PDFString).decodeText());
      for (const [, v] of value.entries()) collect(v);
    };
    for (const [, object] of doc.context.enumerateIndirectObjects()) collect(object);
    expect(headers.length, 'data cells name their header cells').toBeGreaterThan(0);
    expect(headers.filter((h) => !listed.has(h))).toEqual([]);
  });

  it("switches off the margin boxes of the page's own print CSS, so the running footer is not drawn twice", async () => {
    // CSS Paged Media margin boxes (@page { @bottom-right { ... } }), as report.css declares
    // for printing from a browser; the printer draws its own header and footer instead.
    const own = page(`<style>@page { @bottom-right { content: "own margin box " counter(page); } }</style>${long}`);
    const texts = await pageTexts(await withPdfPrinter((printer) => printer.print(own, meta), { pages: 1 }));
    expect(texts.length).toBeGreaterThan(1);
    texts.forEach((t, i) => {
      expect(compact(t), `page ${i + 1}`).not.toContain('ownmarginbox');
      expect(compact(t), `page ${i + 1}`).toContain(compact(`page ${i + 1} of ${texts.length}`));
    });
  });

  it('says so when the charts never report ready, and goes on printing the pages waiting for the pool', async () => {
    const stuck = page('<canvas></canvas>', 'data-charts-ready="false"');
    const fine = page('<h1>fine</h1>');
    const results = await withPdfPrinter((printer) => Promise.allSettled([fine, stuck, fine, fine].map((p) => printer.print(p, meta))), { pages: 1, chartsTimeoutMs: 1500 });
    expect(results.map((r) => r.status)).toEqual(['fulfilled', 'rejected', 'fulfilled', 'fulfilled']);
    expect((results[1] as PromiseRejectedResult).reason.message).toMatch(/charts did not report ready \(<html data-charts-ready="true">\) within 2 s/);
  });

  it('writes links to local files relative to the page, so they work wherever the PDF is copied (ISO 32000-1 §12.6.4.7 URI actions)', async () => {
    const folder = join(dir, 'a project');
    mkdirSync(join(folder, 'rev-A'), { recursive: true });
    const html = join(folder, 'index.html');
    writeFileSync(html, `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>t</title></head><body><p><a href="rev-A/index.html">revision A</a> <a href="../other%20one/index.html#heat">other</a> <a href="https://example.org/x?y=1">web</a></p></body></html>`);
    const printed = await withPdfPrinter((printer) => printer.print(html, meta));
    const doc = await PDFDocument.load(printed);
    const uris = doc.getPages().flatMap((p) => {
      const annots = p.node.lookupMaybe(PDFName.of('Annots'), PDFArray);
      return Array.from({ length: annots?.size() ?? 0 }, (_, i) => annots!.lookupMaybe(i, PDFDict)?.lookupMaybe(PDFName.of('A'), PDFDict)?.lookupMaybe(PDFName.of('URI'), PDFString)?.decodeText());
    });
    expect(uris.sort()).toEqual(['../other%20one/index.html#heat', 'https://example.org/x?y=1', 'rev-A/index.html']);
    expect(Buffer.from(printed).includes('file:')).toBe(false);
  });
});

afterAll(() => rmSync(dir, { recursive: true, force: true }));
