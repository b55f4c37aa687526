// The built site in a real browser, opened from disk with no network: Debian's Chromium driven by
// playwright-core (never a downloaded browser). Every page: no console error, no failed request
// and no request that is not file://, no KaTeX error, every chart drawn, every section present,
// the page marked ready for printing, and the data tables shown in print. Full-page screenshots go
// to test-artifacts/. Without /usr/bin/chromium the test skips loudly, except under CI, where it fails.
import { existsSync, mkdirSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { chromium, type Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildSite } from '../../lib/publish/build.ts';
import { PACKAGE_ROOT } from '../../lib/publish/paths.ts';
import { EPOCH, htmlPages, issuedDemoRoot } from '../helpers/site.ts';

const CHROMIUM = '/usr/bin/chromium';
const ARGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'];
const ARTIFACTS = join(PACKAGE_ROOT, 'test-artifacts');
const DOCUMENT_SECTIONS = ['title-block', 'contents', 'purpose', 'summary', 'inputs', 'assumptions', 'method', 'results', 'cases', 'charts', 'hazards', 'verification', 'references', 'history'];

const available = existsSync(CHROMIUM);
if (!available && !process.env.CI) {
  console.warn(`\n*** SKIPPED the browser test of the site: no Chromium at ${CHROMIUM} (apt-get install -y chromium); it runs, and must pass, whenever CI is set ***\n`);
}

interface PageReport {
  consoleErrors: string[];
  failed: string[];
  foreign: string[];
  katexErrors: number;
  ready: string | undefined;
  sections: string[];
  canvases: { id: string; painted: number; width: number }[];
  hiddenInPrint: number;
  /** Tables wider than the text column on screen, to be scrolled sideways. */
  overflowing: string[];
  /** The tick labels of every numeric axis, as Chart.js drew them. */
  ticks: string[];
  /** Printed: the document's width and the outermost elements wider than the A4 text column. */
  printWidth: { scrollWidth: number; column: number; wider: string[] };
}

/** The text column of A4 paper less the printer's 16 mm side margins (lib/publish/pdf-page.ts), CSS px; Letter's is wider. */
const A4_COLUMN_PX = Math.round(((210 - 2 * 16) * 96) / 25.4);

/**
 * What a page of the site is. An issued revision's page (projects/<id>/rev-X/index.html) is its
 * register page since issuing (issue 20): the revision's facts, sign-off and links to the
 * document as issued, which the site carries beside it as rev-X/document.html, a full document.
 */
function kindOf(path: string): 'index' | 'register' | 'document' {
  if (path === 'index.html') return 'index';
  return /\/rev-[^/]+\/index\.html$/.test(path) ? 'register' : 'document';
}

describe.skipIf(!available && !process.env.CI)('the built site in Chromium, from disk', () => {
  let root: string;
  let site: string;
  let browser: Browser;
  const reports = new Map<string, PageReport>();

  beforeAll(async () => {
    root = await issuedDemoRoot();
    site = join(root, 'site');
    await buildSite({ root, env: EPOCH, pdf: false });
    browser = await chromium.launch({ executablePath: CHROMIUM, args: ARGS });
    rmSync(ARTIFACTS, { recursive: true, force: true });
    mkdirSync(ARTIFACTS, { recursive: true });
    for (const path of htmlPages(site)) reports.set(path, await visit(browser, join(site, path), path));
  }, 300_000);

  afterAll(async () => {
    await browser?.close();
    if (root) rmSync(root, { recursive: true, force: true });
  });

  async function visit(b: Browser, file: string, path: string): Promise<PageReport> {
    const context = await b.newContext({ viewport: { width: 1000, height: 1400 }, deviceScaleFactor: 1 });
    const page = await context.newPage();
    const report: PageReport = { consoleErrors: [], failed: [], foreign: [], katexErrors: 0, ready: undefined, sections: [], canvases: [], hiddenInPrint: 0, overflowing: [], ticks: [], printWidth: { scrollWidth: 0, column: 0, wider: [] } };
    await page.route('**/*', (route) => {
      const url = route.request().url();
      if (url.startsWith('file://')) return route.continue();
      report.foreign.push(url);
      return route.abort();
    });
    page.on('console', (m) => {
      if (m.type() === 'error') report.consoleErrors.push(m.text());
    });
    page.on('pageerror', (e) => report.consoleErrors.push(e.message));
    page.on('requestfailed', (r) => report.failed.push(`${r.url()} (${r.failure()?.errorText ?? 'failed'})`));
    await page.goto(pathToFileURL(file).href, { waitUntil: 'load' });
    await page.waitForFunction(() => document.documentElement.dataset.chartsReady === 'true', null, { timeout: 30_000 }).catch(() => undefined);
    report.ready = await page.evaluate(() => document.documentElement.dataset.chartsReady);
    report.katexErrors = await page.locator('.katex-error').count();
    report.sections = await page.evaluate(() => [...document.querySelectorAll('[id]')].map((e) => e.id));
    report.canvases = await page.evaluate(() =>
      [...document.querySelectorAll('canvas')].map((c) => {
        const ctx = (c as HTMLCanvasElement).getContext('2d')!;
        const { data } = ctx.getImageData(0, 0, (c as HTMLCanvasElement).width, (c as HTMLCanvasElement).height);
        let painted = 0;
        for (let i = 3; i < data.length; i += 4) if (data[i]! > 0) painted++;
        return { id: c.id, painted, width: c.getBoundingClientRect().width };
      }),
    );
    report.ticks = await page.evaluate(() =>
      [...document.querySelectorAll('canvas')].flatMap((c) => {
        const chart = (window as unknown as { Chart: { getChart(c: Element): { scales: Record<string, { type: string; ticks: { label: unknown }[] }> } } }).Chart.getChart(c);
        return Object.values(chart?.scales ?? {})
          .filter((s) => s.type === 'linear')
          .flatMap((s) => s.ticks.map((t) => `${c.id}: ${String(t.label)}`));
      }),
    );
    report.overflowing = await page.evaluate(() =>
      [...document.querySelectorAll('.wide')].filter((w) => w.scrollWidth > w.clientWidth + 1).map((w) => `${w.closest('section[id]')?.id}: ${w.scrollWidth} px in ${w.clientWidth} px`),
    );
    await page.screenshot({ path: join(ARTIFACTS, `${path.replace(/\/index\.html$|\.html$/, '').replace(/\//g, '_') || 'index'}.png`), fullPage: true });
    await page.emulateMedia({ media: 'print' });
    report.hiddenInPrint = await page.evaluate(() => [...document.querySelectorAll('details table')].filter((t) => t.getBoundingClientRect().height === 0).length);
    // As the printer lays it out: print media, the column's width, the data tables open (beforeprint opens them).
    await page.setViewportSize({ width: A4_COLUMN_PX, height: 1400 });
    report.printWidth = await page.evaluate(`(async () => {
      document.querySelectorAll('details').forEach((d) => { d.open = true; });
      await document.fonts.ready;
      const column = document.documentElement.clientWidth;
      const wider = [...document.querySelectorAll('body *')]
        .filter((e) => !e.closest('.katex-mathml') && e.getBoundingClientRect().right > column + 1 && e.parentElement.getBoundingClientRect().right <= column + 1)
        .map((e) => e.tagName.toLowerCase() + '.' + [...e.classList].join('.') + ' in ' + (e.closest('section[id]')?.id ?? '?') + ': ' + Math.round(e.getBoundingClientRect().right) + ' px');
      return { scrollWidth: document.documentElement.scrollWidth, column, wider };
    })()`);
    await context.close();
    return report;
  }

  it('opened every page: the index, four drafts, and of each of the two issued revisions its register page and its document', () => {
    const pages = [...reports.keys()];
    expect(pages.filter((p) => kindOf(p) === 'register').map((p) => p.replace(/index\.html$/, 'document.html'))).toEqual(pages.filter((p) => /\/rev-/.test(p) && kindOf(p) === 'document'));
    expect(pages.map(kindOf).sort()).toEqual(['document', 'document', 'document', 'document', 'document', 'document', 'index', 'register', 'register']);
  });

  it('logs no console error and fails no request', () => {
    for (const [path, r] of reports) {
      expect(r.consoleErrors, path).toEqual([]);
      expect(r.failed, path).toEqual([]);
    }
  });

  it('asks for nothing but files from disk', () => {
    for (const [path, r] of reports) expect(r.foreign, path).toEqual([]);
  });

  it('renders every equation without a KaTeX error', () => {
    for (const [path, r] of reports) expect(r.katexErrors, path).toBe(0);
  });

  it('draws every chart: each canvas has paint on it, at its fixed size', () => {
    for (const [path, r] of reports) {
      if (kindOf(path) !== 'document') {
        expect(r.canvases, path).toEqual([]);
        continue;
      }
      expect(r.canvases.length, path).toBeGreaterThanOrEqual(6);
      for (const c of r.canvases) {
        expect(c.painted, `${path} ${c.id}`).toBeGreaterThan(2000);
        expect(c.width, `${path} ${c.id}`).toBe(640);
      }
    }
  });

  it('has every section of the document, the index its table, and a register page its title block and the revision', () => {
    for (const [path, r] of reports) {
      const kind = kindOf(path);
      if (kind === 'index') expect(r.sections).toContain('portfolio');
      else if (kind === 'register') expect(r.sections, path).toEqual(expect.arrayContaining(['title-block', 'revision']));
      else for (const id of DOCUMENT_SECTIONS) expect(r.sections, `${path} #${id}`).toContain(id);
    }
  });

  it('writes the tick labels of the charts as the document writes numbers: minus sign U+2212, no thousands comma', () => {
    for (const [path, r] of reports) {
      if (kindOf(path) !== 'document') continue;
      expect(r.ticks.length, path).toBeGreaterThan(50);
      expect(r.ticks.filter((t) => /:.*[-,]/.test(t)), path).toEqual([]);
    }
  });

  it('fits every table of a document into the text column on screen, so none is cut off at the right', () => {
    // Every page's offenders at once, not only the first page's.
    const offenders = [...reports].filter(([path, r]) => path !== 'index.html' && r.overflowing.length > 0).map(([path, r]) => [path, r.overflowing]);
    expect(Object.fromEntries(offenders)).toEqual({});
  });

  it('marks every page ready for the PDF printer', () => {
    for (const [path, r] of reports) expect(r.ready, path).toBe('true');
  });

  it('prints at full size: nothing is wider than the text column of A4, which would make Chromium shrink the whole document', () => {
    // One data table of eleven columns once made every page of a document print at 65 %.
    const offenders = [...reports].filter(([path, r]) => path !== 'index.html' && r.printWidth.wider.length > 0).map(([path, r]) => [path, r.printWidth.wider]);
    expect(Object.fromEntries(offenders)).toEqual({});
    for (const [path, r] of reports) {
      if (path === 'index.html') continue;
      expect(r.printWidth.scrollWidth, path).toBeLessThanOrEqual(r.printWidth.column);
      expect(r.printWidth.column, path).toBe(A4_COLUMN_PX);
    }
  });

  it('shows the data tables of the charts when printed', () => {
    for (const [path, r] of reports) expect(r.hiddenInPrint, path).toBe(0);
  });
});
