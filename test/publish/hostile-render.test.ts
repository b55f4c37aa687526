// Hostile text of a basis, rendered for real: a basis whose every free text (document fields,
// sign-off names, cell material notes, value justifications, the mixture's name and source,
// assumption texts, reference citations) carries scripts, markup, closing tags of raw-text
// elements, template syntax and LaTeX is issued twice (revisions A and B, so the issued history
// quotes changed hostile values), then built into the site with its draft printed to PDF.
// Every page of it, and each issued document.html, is opened in Chromium from disk: no script of
// the user runs (window.__pwned stays undefined, no dialog, no page error), no element is
// injected (the page has the same elements as the demo basis's page, and the same scripts),
// and the text shows literally, template syntax and LaTeX included, never inside KaTeX. The
// PDFs (the printed draft and both issued ones) carry the text literally, and while cellbasis
// printed them a probe in every page it opened saw no script of the user run.
import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { chromium, type Browser } from 'playwright-core';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { buildSite } from '../../lib/publish/build.ts';
import { withPdfPrinter } from '../../lib/publish/pdf.ts';
import type { PdfMeta } from '../../lib/core/pdf-properties.ts';
import { PACKAGE_ROOT } from '../../lib/publish/paths.ts';
import { announceChromiumSkip, describeWithChromium } from '../helpers/chromium.ts';
import { compact, pageTexts, pdfAttachments, pdfInfo } from '../helpers/pdf-inspect.ts';
import { run } from '../helpers/run-cli.ts';
import { EPOCH, htmlPages } from '../helpers/site.ts';
import { parseDocument } from 'yaml';
import { HOSTILE_MIXTURE, HOSTILE_SOURCE_PROJECT, LITERAL_PIECES, SCRIPT_PAYLOAD, hostileBasisText, hostileParagraphs, hostileText } from '../helpers/hostile-basis.ts';
import { watchPrinting, type PrintWatch } from '../helpers/chromium-probe.ts';

announceChromiumSkip('the hostile-content tests in Chromium');

const CHROMIUM = '/usr/bin/chromium';
const ARGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'];

/** What each revision's texts end with (the issued history then quotes changed hostile values). */
const VARIANT = { A: '', B: ' <i>rev B</i> {{ 6*6 }}', draft: ' <u>draft C</u> {% endraw %}' } as const;

/**
 * The basis text prepared and checked again on `date` (through the YAML document, as the hostile
 * text is written): a revision after A changes the basis, and a checked date left before the new
 * preparation would be a finding of the basis check on the draft's page, which the clean page has not.
 */
function preparedOn(text: string, date: string): string {
  const doc = parseDocument(text);
  doc.setIn(['document', 'sign-off', 'prepared', 'date'], date);
  doc.setIn(['document', 'sign-off', 'checked', 'date'], date);
  return doc.toString({ lineWidth: 0 });
}

interface PageReport {
  pwned: string;
  dialogs: string[];
  pageErrors: string[];
  consoleErrors: string[];
  foreign: string[];
  chartsReady: string | undefined;
  title: string;
  text: string;
  tags: string[];
  /** Tag names of every element outside the revision history (which differs with the revisions issued). */
  tagsOutsideHistory: string[];
  scripts: { src: string | null; type: string; className: string; text: string }[];
  onAttributes: string[];
  scriptUrls: number;
  imgX: number;
  pwnClass: number;
  katexTexts: string[];
}

describeWithChromium('a hostile basis rendered, issued and printed', () => {
  let root: string;
  let site: string;
  let browser: Browser;
  let printing: PrintWatch;
  let control: Omit<PrintWatch, 'stop'>;
  const pages = new Map<string, PageReport>();
  const issued = (rev: string, file: string) => join(root, 'projects', 'hostile', 'issued', rev, file);

  async function visit(file: string): Promise<PageReport> {
    const context = await browser.newContext({ viewport: { width: 1000, height: 1400 } });
    const foreign: string[] = [];
    await context.route('**/*', (route) => {
      const url = route.request().url();
      if (/^(file|data):/i.test(url)) return route.continue();
      foreign.push(url);
      return route.abort('blockedbyclient');
    });
    const page = await context.newPage();
    const dialogs: string[] = [];
    const pageErrors: string[] = [];
    const consoleErrors: string[] = [];
    page.on('dialog', (d) => {
      dialogs.push(`${d.type()}: ${d.message()}`);
      void d.dismiss().catch(() => undefined);
    });
    page.on('pageerror', (e) => pageErrors.push(e.message));
    page.on('console', (m) => {
      if (m.type() === 'error') consoleErrors.push(m.text());
    });
    await page.goto(pathToFileURL(file).href, { waitUntil: 'load' });
    await page.waitForFunction(() => !document.querySelector('canvas') || document.documentElement.dataset.chartsReady === 'true', null, { timeout: 30_000 }).catch(() => undefined);
    // Give a script that would run late (an image's onerror, a timer) its moment.
    await page.waitForTimeout(300);
    const report = await page.evaluate(() => {
      const all = [...document.querySelectorAll('*')];
      return {
        pwned: typeof (window as { __pwned?: unknown }).__pwned,
        chartsReady: document.documentElement.dataset.chartsReady,
        title: document.title,
        text: document.documentElement.textContent ?? '',
        tags: all.map((e) => e.tagName.toLowerCase()),
        tagsOutsideHistory: all.filter((e) => !e.closest('#history')).map((e) => e.tagName.toLowerCase()),
        scripts: [...document.scripts].map((s) => ({ src: s.getAttribute('src'), type: s.type, className: s.className, text: s.text })),
        onAttributes: all.flatMap((e) => [...e.attributes].filter((a) => /^on/i.test(a.name)).map((a) => `${e.tagName.toLowerCase()}[${a.name}]`)),
        scriptUrls: all.filter((e) => [...e.attributes].some((a) => /^(href|src|action|formaction|xlink:href)$/i.test(a.name) && /^\s*javascript:/i.test(a.value))).length,
        imgX: document.querySelectorAll('img[src="x"]').length,
        pwnClass: document.querySelectorAll('.pwn').length,
        katexTexts: [...document.querySelectorAll('.katex')].map((e) => e.textContent ?? ''),
      };
    });
    await context.close();
    return { ...report, dialogs, pageErrors, consoleErrors, foreign };
  }

  beforeAll(async () => {
    root = mkdtempSync(join(tmpdir(), 'cellbasis-hostile-'));
    mkdirSync(join(root, 'projects', 'hostile'), { recursive: true });
    mkdirSync(join(root, 'projects', 'clean'), { recursive: true });
    // The demo basis as it is: the page every hostile page is compared with.
    writeFileSync(join(root, 'projects', 'clean', 'basis.yaml'), readFileSync(join(PACKAGE_ROOT, 'projects', HOSTILE_SOURCE_PROJECT, 'basis.yaml')));
    const basis = join(root, 'projects', 'hostile', 'basis.yaml');
    printing = watchPrinting();
    try {
      writeFileSync(basis, hostileBasisText(VARIANT.A));
      const a = await run(['issue', 'hostile', '--rev', 'A', '--status', 'issued for review', '--date', '2026-10-01', '--note', hostileText('note')], root);
      expect(a.code, a.err).toBe(0);
      // Revision B changes the basis after A was issued, so it is prepared again after A's date.
      writeFileSync(basis, preparedOn(hostileBasisText(VARIANT.B), '2026-10-12'));
      const b = await run(['issue', 'hostile', '--rev', 'B', '--status', 'issued for review', '--date', '2026-10-15'], root);
      expect(b.code, b.err).toBe(0);
      writeFileSync(basis, preparedOn(hostileBasisText(VARIANT.draft), '2026-10-12'));
      await buildSite({ root, env: EPOCH, pdf: true });
    } finally {
      printing.stop();
    }
    site = join(root, 'site');

    // The control: the payload on a page of its own, printed by the same printer with the same
    // probe, must be seen to run; otherwise a silent probe would prove nothing.
    const controlPage = join(root, 'control.html');
    writeFileSync(controlPage, `<!DOCTYPE html><html><head><title>control</title></head><body><p>control</p>${SCRIPT_PAYLOAD}</body></html>`);
    const controlWatch = watchPrinting();
    try {
      const meta: PdfMeta = { title: 'control', documentNumber: 'C-1', revision: 'A', status: 'draft', author: '', subject: '', keywords: [], paper: 'A4', date: new Date('2026-01-01T00:00:00Z') };
      await withPdfPrinter((printer) => printer.print(controlPage, meta), { pages: 1 });
    } finally {
      controlWatch.stop();
    }
    control = controlWatch;

    browser = await chromium.launch({ executablePath: CHROMIUM, args: ARGS });
    for (const path of htmlPages(site)) pages.set(path, await visit(join(site, path)));
    for (const rev of ['A', 'B']) pages.set(`issued/${rev}/document.html`, await visit(issued(rev, 'document.html')));
    pages.set('control.html', await visit(controlPage));
  }, 400_000);

  afterAll(async () => {
    await browser?.close();
    if (root) rmSync(root, { recursive: true, force: true });
  });

  const CLEAN = 'projects/clean/index.html';
  const hostilePages = () => [...pages.keys()].filter((p) => p !== CLEAN && p !== 'control.html');
  /** The register pages of the issued revisions (lib/report/revision-page.ts): facts of the manifest, not the document. */
  const registerPages = () => hostilePages().filter((p) => /\/rev-[AB]\/index\.html$/.test(p));
  /** Every page that is a document: the draft, and each issued document.html, as issued and as the site copies it. */
  const documentPages = () => hostilePages().filter((p) => p !== 'index.html' && !registerPages().includes(p));
  const variantOf = (path: string): string => (path.includes('rev-A') || path.includes('issued/A') ? VARIANT.A : path.includes('rev-B') || path.includes('issued/B') ? VARIANT.B : VARIANT.draft);

  it('opened the index, the draft and both issued revisions of the site, and both issued document.html files', () => {
    expect(hostilePages().sort()).toEqual(
      [
        'index.html',
        'projects/hostile/index.html',
        'projects/hostile/rev-A/index.html',
        'projects/hostile/rev-A/document.html',
        'projects/hostile/rev-B/index.html',
        'projects/hostile/rev-B/document.html',
        'issued/A/document.html',
        'issued/B/document.html',
      ].sort(),
    );
  });

  it('the probe works: the payload on a page of its own runs, opens dialogs and sets window.__pwned (in the viewer and in the printer)', () => {
    const viewed = pages.get('control.html')!;
    expect(viewed.pwned).toBe('number');
    expect(viewed.dialogs.length).toBeGreaterThan(0);
    expect(control.probe).toEqual(expect.arrayContaining(['__pwned=1', 'alert:pwned']));
    expect(control.dialogs.length).toBeGreaterThan(0);
  });

  it('runs no script of the user on any page: window.__pwned undefined, no dialog, no page error, no console error', () => {
    for (const path of hostilePages()) {
      const r = pages.get(path)!;
      expect(r.pwned, path).toBe('undefined');
      expect(r.dialogs, path).toEqual([]);
      expect(r.pageErrors, path).toEqual([]);
      expect(r.consoleErrors, path).toEqual([]);
    }
  });

  it('draws every chart of every document page, the hostile mixture name in its data included', () => {
    for (const path of documentPages()) expect(pages.get(path)!.chartsReady, path).toBe('true');
  });

  it('asks for nothing outside the disk: no request other than file: and data:', () => {
    for (const path of hostilePages()) expect(pages.get(path)!.foreign, path).toEqual([]);
  });

  it('injects no element: each hostile page of the site has exactly the elements, in order, of the demo basis\'s page (the revision history aside)', () => {
    const clean = pages.get(CLEAN)!.tagsOutsideHistory;
    expect(clean.length).toBeGreaterThan(10_000);
    // The draft, rendered by the site as the clean page is; an issued document.html is the
    // standalone file (styles and scripts inlined), checked by the tests below.
    for (const path of documentPages().filter((p) => p.startsWith('projects/') && !p.includes('/rev-'))) {
      const hostile = pages.get(path)!.tagsOutsideHistory;
      expect(hostile.length, path).toBe(clean.length);
      expect(hostile, path).toEqual(clean);
    }
  });

  it('injects no element anywhere: no <img src=x>, no event-handler attribute, no javascript: URL, no element of the user\'s class', () => {
    for (const path of hostilePages()) {
      const r = pages.get(path)!;
      expect(r.imgX, path).toBe(0);
      expect(r.onAttributes, path).toEqual([]);
      expect(r.scriptUrls, path).toBe(0);
      expect(r.pwnClass, path).toBe(0);
      for (const tag of ['img', 'iframe', 'object', 'embed', 'textarea', 'b', 'i', 'u', 'form']) {
        expect(r.tags.filter((t) => t === tag).length, `${path} <${tag}>`).toBe(pages.get(CLEAN)!.tags.filter((t) => t === tag).length);
      }
    }
  });

  it('has only the template\'s own scripts: the two asset scripts (inlined in document.html) and the chart data', () => {
    const clean = pages.get(CLEAN)!.scripts;
    const assets = ['chart.umd.min.js', 'charts.js'].map((f) => readFileSync(join(site, 'assets', f), 'utf8').replace(/<\/script/gi, '<\\/script').trim());
    for (const path of documentPages()) {
      const scripts = pages.get(path)!.scripts;
      expect(scripts.length, path).toBe(clean.length);
      for (const s of scripts) {
        if (s.type === 'application/json') expect(s.className, path).toBe('chart-spec');
        else if (s.src !== null) expect(s.src, path).toMatch(/^(\.\.\/)+assets\/(chart\.umd\.min|charts)\.js$/);
        else expect(assets, `${path}: an inline script that is not one of the assets`).toContain(s.text.trim());
      }
    }
    for (const s of pages.get('index.html')!.scripts) expect(s.type === 'application/json' || /assets\//.test(s.src ?? ''), `index: ${s.src}`).toBe(true);
  });

  it('shows every hostile text literally, as text: markup, template syntax and LaTeX as written', () => {
    for (const path of documentPages()) {
      const r = pages.get(path)!;
      for (const [marker, text] of hostileParagraphs(variantOf(path))) expect(r.text.includes(text), `${path}: the ${marker} text, literally`).toBe(true);
      expect(r.text.includes(HOSTILE_MIXTURE), `${path}: the mixture name`).toBe(true);
      expect(r.title, path).toContain(hostileText('title') + variantOf(path));
      for (const piece of LITERAL_PIECES) expect(r.text, path).toContain(piece);
    }
    const index = pages.get('index.html')!;
    for (const marker of ['title', 'client', 'number']) expect(index.text, `index: ${marker}`).toContain(hostileText(marker) + VARIANT.draft);
    // A register page shows the title and number as issued, and the note, as text.
    for (const path of registerPages()) {
      const r = pages.get(path)!;
      for (const marker of ['title', 'number']) expect(r.text, `${path}: ${marker}`).toContain(hostileText(marker) + variantOf(path));
    }
    expect(pages.get('projects/hostile/rev-A/index.html')!.text).toContain(hostileText('note'));
  });

  it('evaluates no template syntax: no 49 or 36 stands where {{ 7*7 }} or {{ 6*6 }} was written', () => {
    for (const path of hostilePages()) {
      const text = pages.get(path)!.text;
      expect(text, path).not.toMatch(/<!-- 49 |<\/i> 36/);
      expect(text, path).toContain('<!-- {{ 7*7 }} {% raw %} {{ cellbasis }} {{ page.url }}');
    }
  });

  it('hands no user text to KaTeX: no .katex element holds a marker or a piece of the payload, and there are as many as on the demo page', () => {
    const cleanCount = pages.get(CLEAN)!.katexTexts.length;
    expect(cleanCount).toBeGreaterThan(20);
    for (const path of documentPages()) {
      const katex = pages.get(path)!.katexTexts;
      expect(katex.length, path).toBe(cleanCount);
      for (const t of katex) expect(t, path).not.toMatch(/\[(title|number|client|site|purpose|scope|prepared|checked|mixture|assumption|reference|source|fuel-electrode|air-electrode|electrolyte)|pwn|javascript|passwd|7\*7|cellbasis/);
    }
  });

  it('printed with the probe in every page cellbasis opened: both issued revisions and the draft, and no script of the user ran while printing', () => {
    expect(printing.contexts).toBeGreaterThanOrEqual(3);
    expect(printing.loads.some((u) => /\/issued\/\.tmp-A-\d+\/document\.html$/.test(u)), 'revision A printed').toBe(true);
    expect(printing.loads.some((u) => /\/issued\/\.tmp-B-\d+\/document\.html$/.test(u)), 'revision B printed').toBe(true);
    expect(printing.loads.some((u) => /\/projects\/hostile\/index\.html$/.test(u)), 'the draft printed').toBe(true);
    expect(printing.probe).toEqual([]);
    expect(printing.dialogs).toEqual([]);
    expect(printing.pageErrors).toEqual([]);
    expect(printing.requests.filter((u) => !/^(file|data):/i.test(u))).toEqual([]);
  });

  it('each PDF carries every hostile text literally, and its title and author as written', async () => {
    const pdfs: [string, string, string][] = [
      ['draft', join(site, 'projects', 'hostile', 'document.pdf'), VARIANT.draft],
      ['issued A', issued('A', 'document.pdf'), VARIANT.A],
      ['issued B', issued('B', 'document.pdf'), VARIANT.B],
    ];
    for (const [name, file, variant] of pdfs) {
      const bytes = readFileSync(file);
      const text = compact((await pageTexts(bytes)).join(''));
      for (const [marker, paragraph] of hostileParagraphs(variant)) expect(text.includes(compact(paragraph)), `${name}: the ${marker} text`).toBe(true);
      expect(text.includes(compact(HOSTILE_MIXTURE)), `${name}: the mixture name`).toBe(true);
      expect(text, name).not.toMatch(/\[title\][^[]*?\]49/);
      const info = await pdfInfo(bytes);
      expect(info.title, name).toBe(hostileText('title') + variant);
      expect(info.author, name).toBe(hostileText('prepared') + variant);
    }
  });

  it('each issued PDF carries the issued basis, hostile text and all, byte for byte', async () => {
    for (const rev of ['A', 'B']) {
      const attached = await pdfAttachments(readFileSync(issued(rev, 'document.pdf')));
      expect(attached.get('basis.yaml')!.bytes.equals(readFileSync(issued(rev, 'basis.yaml'))), rev).toBe(true);
    }
  });

  it('the issued revisions pass their audit', async () => {
    const r = await run(['audit', 'hostile'], root);
    expect(r.out).toBe('PASS projects/hostile rev A, not signed\nPASS projects/hostile rev B, not signed\n');
    expect(r.code).toBe(0);
  });
});
