/**
 * Design-basis documents to PDF through headless Chromium (Debian's /usr/bin/chromium, driven by
 * playwright-core; cellbasis never downloads a browser), finished with pdf-lib.
 *
 * One browser per run, a small pool of pages, every network request from the page refused
 * (anything but file: and data: URLs is aborted, so a document can only show what it carries),
 * and Chromium's own requests kept off the network (OFFLINE_ARGS):
 *
 *   import { withPdfPrinter } from '../publish/pdf.ts';
 *   import { findChromium, chromiumMissingMessage } from '../publish/chromium.ts';
 *   import { documentPdfMeta } from '../report/pdf-meta.ts';
 *
 *   if (findChromium() === null) say(chromiumMissingMessage());   // HTML only, and say so
 *   else await withPdfPrinter(async (printer) => {
 *     const bytes = await printer.print('site/p/x/index.html', documentPdfMeta({ basis, results }, { date }));
 *     writeFileSync('site/p/x/document.pdf', bytes);
 *   });
 *
 * `print(htmlPathOrUrl, meta)` accepts a file path or a file: URL and may be called concurrently
 * (up to `pages` prints run at once; the rest wait). For each print the printer
 *   - lays the page out once, for print only (SCREEN_HELD: nothing is laid out for the screen,
 *     the paper's text width as viewport, device scale factor 2 so chart canvases are drawn at
 *     twice their CSS size and stay sharp);
 *   - waits for the load event, for `document.fonts.ready`, and, when the page has a <canvas>
 *     or a `data-charts-ready` attribute on <html>, until `<html data-charts-ready="true">`
 *     (the site's chart script sets it once every chart is drawn);
 *   - prints `meta.paper` (A4 or Letter) with its own margins (a page's CSS @page size is not
 *     used, and @page margin boxes of the page's print CSS are switched off), the running header
 *     and footer of pdf-page.ts on every page, an outline from the headings and a tagged
 *     (accessible) PDF;
 *   - finishes the bytes with pdf-lib (pdf-finish.ts: structure elements named by position, the
 *     properties and attachments of `meta`).
 * The output has no /ID and no XMP metadata, so the same HTML and meta give the same bytes on
 * the same Chromium (README "Issuing revisions" lists what another Chromium may change). The
 * Chromium comes from chromium.ts, the pages from page-pool.ts.
 *
 * Without Chromium, `withPdfPrinter` throws a ChromiumMissingError (a UserError saying how to
 * install it). `CELLBASIS_CHROMIUM` names another browser binary; set to a path that does not
 * exist it makes Chromium absent, which is how the tests check that message.
 */
import { existsSync } from 'node:fs';
import { resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import type { PdfMeta } from '../core/pdf-properties.ts';
import { EXIT_VALIDATION, UserError } from '../core/errors.ts';
import type { IssuePdfPrinter } from '../archive/issue.ts';
import { ChromiumMissingError, findChromium, openBrowser } from './chromium.ts';
import { DEVICE_SCALE, footerTemplate, headerTemplate, printMargins, printViewport } from './pdf-page.ts';
import { finishPdf } from './pdf-finish.ts';
import { PagePool } from './page-pool.ts';

export interface PdfPrinter {
  /** Prints a page (file path or file: URL) to PDF bytes. */
  print(htmlPathOrUrl: string, meta: PdfMeta): Promise<Uint8Array>;
  /** Version of the Chromium in use, e.g. "156.0.8078.114". */
  readonly chromiumVersion: string;
}

export interface PrinterOptions {
  /** Pages printing at once (default 2). */
  pages?: number;
  /** Chromium binary (default: findChromium()). */
  executablePath?: string;
  /** Longest wait for Chromium to start and for one page to load, ms (default 60 000). */
  timeoutMs?: number;
  /**
   * Longest wait for a loaded page's charts to report ready, ms (default: timeoutMs). Kept apart
   * from the start-up wait so that a short chart wait never races a slow Chromium launch.
   */
  chartsTimeoutMs?: number;
  /** Told of each request the page tried to make and that was refused. */
  onBlockedRequest?: (url: string) => void;
}

function pageUrl(htmlPathOrUrl: string): string {
  if (/^file:/i.test(htmlPathOrUrl)) return htmlPathOrUrl;
  if (/^[a-z][a-z0-9+.-]*:\/\//i.test(htmlPathOrUrl)) throw new UserError(`pdf: ${htmlPathOrUrl}: only local files are printed (network requests are blocked)`);
  const path = resolve(htmlPathOrUrl);
  if (!existsSync(path)) throw new UserError(`pdf: ${htmlPathOrUrl}: no such file`);
  return pathToFileURL(path).href;
}

/**
 * The printer draws the running header and footer itself; margin boxes a page's own print CSS
 * may declare (for printing from a browser) are switched off so that nothing is drawn twice.
 */
const NO_MARGIN_BOXES = `@page { ${['top-left', 'top-center', 'top-right', 'bottom-left', 'bottom-center', 'bottom-right'].map((box) => `@${box} { content: none; }`).join(' ')} }`;

/**
 * Nothing of a printed page is laid out or painted for the screen: a style sheet adopted before
 * the page's own content exists hides the whole document from screen media, so the print's
 * layout is the page's first and only one. Measured on synthetic 48-page drafts (processor time
 * of Chromium's processes, a trace of the renderer): loading took 1.7 to 3.2 s while Chromium
 * laid out and painted the part parsed so far, frame after frame, and the whole page was laid
 * out for the screen again after printing; held, loading takes 0.7 to 1.0 s, and the PDFs'
 * bytes are the same.
 * It also makes the layout independent of timing: laid out while parsing, the print reused line
 * boxes from whichever frames the parse happened to reach, and under load one glyph of an issued
 * document came out 1/64 px (one layout unit) lower in one of two prints of the same page
 * (seen: a 1-byte difference in a content stream, 11478 against 11478.0156).
 * Print media rules still apply to the print; scripts run and charts draw as before (Chart.js is
 * given fixed canvas sizes, and the charts are drawn again at beforeprint).
 * The same adopted sheet carries NO_MARGIN_BOXES: adopted sheets come after the page's own in
 * the cascade, as a <style> appended after loading did, without a call to the page and a change
 * of its DOM per print.
 */
const SCREEN_HELD = `(() => {
  const sheet = new CSSStyleSheet();
  sheet.replaceSync(${JSON.stringify(`@media screen { html { display: none !important; } } ${NO_MARGIN_BOXES}`)});
  document.adoptedStyleSheets = [...document.adoptedStyleSheets, sheet];
})();`;

/**
 * Every font the page declares, loaded before anything is measured for print: a font that
 * only print content needs (or that the browser would fetch lazily) must not arrive while the
 * pages are laid out, or the layout, and so the PDF, would depend on timing. Then two frames
 * pass, and a page that draws charts (a <canvas>, or `data-charts-ready` on <html>) is waited
 * for until `<html data-charts-ready="true">`, at most `chartsTimeoutMs`. All in one call to the
 * page: Playwright's waitForFunction, which sets up a script of its own in each page loaded,
 * took 50–60 ms of processor time a print (Node and Chromium, synthetic drafts, 5 December).
 * Resolves false when the charts did not report ready in time.
 */
function settleForPrint(page: Page, chartsTimeoutMs: number): Promise<boolean> {
  return page.evaluate(async (timeoutMs) => {
    await Promise.allSettled([...document.fonts].map((font) => font.load()));
    await document.fonts.ready;
    await new Promise((resolve) => requestAnimationFrame(() => requestAnimationFrame(resolve)));
    const root = document.documentElement;
    if (!root.hasAttribute('data-charts-ready') && document.querySelector('canvas') === null) return true;
    const deadline = performance.now() + timeoutMs;
    while (root.dataset.chartsReady !== 'true') {
      if (performance.now() >= deadline) return false;
      await new Promise((resolve) => setTimeout(resolve, 20));
    }
    return true;
  }, chartsTimeoutMs);
}

/** Loads a page and waits until its fonts and charts are drawn. */
async function loadForPrint(page: Page, url: string, timeoutMs: number, chartsTimeoutMs: number): Promise<void> {
  await page.goto(url, { waitUntil: 'load', timeout: timeoutMs });
  if (!(await settleForPrint(page, chartsTimeoutMs))) {
    throw new UserError(`pdf: ${url}: the charts did not report ready (<html data-charts-ready="true">) within ${Math.round(chartsTimeoutMs / 1000)} s`, EXIT_VALIDATION);
  }
}

/**
 * A browser context laid out for print on `paper` (its text column as viewport, device scale
 * factor 2, UTC, light scheme, no motion, nothing laid out for the screen) that refuses every request but file: and data: URLs,
 * with its pool of pages.
 */
async function printContext(browser: Browser, paper: PdfMeta['paper'], options: PrinterOptions): Promise<PagePool> {
  const context: BrowserContext = await browser.newContext({
    viewport: printViewport(paper),
    deviceScaleFactor: DEVICE_SCALE,
    serviceWorkers: 'block',
    reducedMotion: 'reduce',
    colorScheme: 'light',
    timezoneId: 'UTC',
    locale: 'en-GB',
  });
  await context.addInitScript(SCREEN_HELD);
  await context.route('**/*', (route) => {
    const url = route.request().url();
    if (/^(file|data):/i.test(url)) return route.continue();
    options.onBlockedRequest?.(url);
    return route.abort('blockedbyclient');
  });
  return new PagePool(context, Math.max(1, options.pages ?? 2));
}

/** Chromium's print of a loaded page: the paper of `meta`, its margins with the running header and footer, an outline, tagged. */
function printPage(page: Page, meta: PdfMeta): Promise<Buffer> {
  return page.pdf({
    format: meta.paper,
    printBackground: true,
    displayHeaderFooter: true,
    headerTemplate: headerTemplate(meta),
    footerTemplate: footerTemplate(meta),
    margin: printMargins(),
    preferCSSPageSize: false,
    outline: true,
    tagged: true,
  });
}

/**
 * Runs `work` with a printer on one Chromium, closed when `work` settles (also when it throws).
 * Throws ChromiumMissingError when there is no Chromium.
 */
export async function withPdfPrinter<T>(work: (printer: PdfPrinter) => Promise<T>, options: PrinterOptions = {}): Promise<T> {
  const browser = await openBrowser(options);
  const timeoutMs = options.timeoutMs ?? 60_000;
  const chartsTimeoutMs = options.chartsTimeoutMs ?? timeoutMs;
  try {
    const pools = new Map<PdfMeta['paper'], Promise<PagePool>>();
    const poolFor = (paper: PdfMeta['paper']) => {
      if (!pools.has(paper)) pools.set(paper, printContext(browser, paper, options));
      return pools.get(paper)!;
    };
    const printer: PdfPrinter = {
      chromiumVersion: browser.version(),
      async print(htmlPathOrUrl, meta) {
        const url = pageUrl(htmlPathOrUrl);
        const pool = await poolFor(meta.paper);
        const page = await pool.acquire();
        let printed: Buffer;
        try {
          await loadForPrint(page, url, timeoutMs, chartsTimeoutMs);
          printed = await printPage(page, meta);
        } catch (error) {
          await pool.discard(page);
          throw error;
        }
        pool.release(page);
        return finishPdf(printed, meta, browser.version(), url);
      },
    };
    return await work(printer);
  } finally {
    await browser.close().catch(() => undefined);
  }
}

/** The printer issuing is given (lib/archive/issue.ts): one Chromium, one page, for one document. */
export const issuePdfPrinter: IssuePdfPrinter = {
  check() {
    if (findChromium() === null) throw new ChromiumMissingError();
  },
  print: (htmlPath, meta) => withPdfPrinter(async (printer) => ({ pdf: await printer.print(htmlPath, meta), chromium: printer.chromiumVersion }), { pages: 1 }),
};
