/**
 * Design-basis documents to PDF through headless Chromium (Debian's /usr/bin/chromium, driven by
 * playwright-core; cellbasis never downloads a browser), finished with pdf-lib.
 *
 * One browser per run, a small pool of pages, every network request from the page refused
 * (anything but file: and data: URLs is aborted, so a document can only show what it carries),
 * and Chromium's own requests kept off the network (OFFLINE_ARGS):
 *
 *   import { findChromium, withPdfPrinter } from '../publish/pdf.ts';
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
 *   - lays the page out for print (print media, the paper's text width as viewport, device scale
 *     factor 2 so chart canvases are drawn at twice their CSS size and stay sharp);
 *   - waits for the load event, for `document.fonts.ready`, and, when the page has a <canvas>
 *     or a `data-charts-ready` attribute on <html>, until `<html data-charts-ready="true">`
 *     (the site's chart script sets it once every chart is drawn);
 *   - prints `meta.paper` (A4 or Letter) with its own margins (a page's CSS @page size is not
 *     used, and @page margin boxes of the page's print CSS are switched off), a running header (document number, title, revision, status) and footer (number,
 *     revision, status, date, "page X of Y") on every page, an outline from the headings and a
 *     tagged (accessible) PDF;
 *   - sets the document properties and attachments of `meta` with pdf-lib
 *     (lib/core/pdf-properties.ts).
 * The output has no /ID and no XMP metadata, so the same HTML and meta give the same bytes on
 * the same Chromium (README "Issuing revisions" lists what another Chromium may change).
 *
 * Without Chromium, `withPdfPrinter` throws a ChromiumMissingError (a UserError saying how to
 * install it). `CELLBASIS_CHROMIUM` names another browser binary; set to a path that does not
 * exist it makes Chromium absent, which is how the tests check that message.
 */
import { accessSync, constants, existsSync } from 'node:fs';
import { resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import { PDFArray, PDFDict, PDFDocument, PDFHexString, PDFName, PDFRef, PDFString } from 'pdf-lib';
import { PDF_LIB_WHOLE, setPdfProperties, type PdfMeta } from '../core/pdf-properties.ts';
import { EXIT_VALIDATION, UserError } from '../core/errors.ts';
import { escapeHtml } from '../report/trusted-html.ts';
import type { SealPdfPrinter } from '../archive/seal.ts';

export const DEFAULT_CHROMIUM = '/usr/bin/chromium';

/**
 * Chromium off the network altogether, not only the pages: Chromium makes requests of its own
 * whatever the page does (Debian's build, with --disable-background-networking and
 * --disable-component-update, still asks update.googleapis.com and accounts.google.com, through
 * the proxy of the environment when one is set). The printer only ever opens files, so it uses
 * no proxy and resolves no host name: each such request fails inside Chromium, before any DNS
 * query or connection. (Extra --disable-features would replace playwright-core's own list.)
 */
export const OFFLINE_ARGS = ['--no-proxy-server', '--host-resolver-rules=MAP * ~NOTFOUND'];

export const CHROMIUM_ARGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
  '--no-first-run',
  ...OFFLINE_ARGS,
];

/** The Chromium binary to use, or null when there is none: CELLBASIS_CHROMIUM if set, else /usr/bin/chromium. */
export function findChromium(): string | null {
  const path = process.env.CELLBASIS_CHROMIUM || DEFAULT_CHROMIUM;
  try {
    accessSync(path, constants.X_OK);
    return path;
  } catch {
    return null;
  }
}

export function chromiumMissingMessage(): string {
  const named = process.env.CELLBASIS_CHROMIUM;
  const where = named ? `CELLBASIS_CHROMIUM names ${named}, which is not an executable file` : `Chromium was not found at ${DEFAULT_CHROMIUM}`;
  return `${where}: PDFs need Debian's Chromium (apt-get install -y chromium), or CELLBASIS_CHROMIUM set to a Chromium binary; cellbasis never downloads a browser`;
}

export class ChromiumMissingError extends UserError {
  constructor() {
    super(chromiumMissingMessage(), EXIT_VALIDATION);
    this.name = 'ChromiumMissingError';
  }
}

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
  /** Longest wait for one page to load and draw its charts, ms (default 60 000). */
  timeoutMs?: number;
  /** Told of each request the page tried to make and that was refused. */
  onBlockedRequest?: (url: string) => void;
}

/** Paper size and margins, mm. The header and footer stand in the top and bottom margins. */
const PAPER = {
  A4: { width: 210, height: 297 },
  Letter: { width: 215.9, height: 279.4 },
} as const;
const MARGIN_MM = { top: 20, bottom: 18, side: 16 };
const CSS_PX_PER_MM = 96 / 25.4;
const DEVICE_SCALE = 2;

function isoDay(date: Date): string {
  return date.toISOString().slice(0, 10);
}

/** Inline style of both bands: Chromium renders them apart from the page, without its CSS. */
const BAND_STYLE = [
  "font-family: 'DejaVu Sans', 'Liberation Sans', Arial, sans-serif",
  'font-size: 7.5pt',
  'line-height: 1.2',
  'color: #333',
  'width: 100%',
  `margin: 0 ${MARGIN_MM.side}mm`,
  'display: flex',
  'justify-content: space-between',
  'gap: 6mm',
  '-webkit-print-color-adjust: exact',
].join('; ');
const CELL_STYLE = 'white-space: nowrap; overflow: hidden; text-overflow: ellipsis';

/** The running header: document number and title left, revision and status right. */
export function headerTemplate(meta: PdfMeta): string {
  return (
    `<div style="${BAND_STYLE}; border-bottom: 0.5pt solid #888; padding-bottom: 1.2mm">` +
    `<span style="${CELL_STYLE}">${escapeHtml(meta.documentNumber)} · ${escapeHtml(meta.title)}</span>` +
    `<span style="white-space: nowrap">Rev ${escapeHtml(meta.revision)} · ${escapeHtml(meta.status)}</span>` +
    '</div>'
  );
}

/** The running footer: number, revision, status and date left, "page X of Y" right. */
export function footerTemplate(meta: PdfMeta): string {
  return (
    `<div style="${BAND_STYLE}; border-top: 0.5pt solid #888; padding-top: 1.2mm">` +
    `<span style="${CELL_STYLE}">${escapeHtml(meta.documentNumber)} rev ${escapeHtml(meta.revision)}, ${escapeHtml(meta.status)}, ${isoDay(meta.date)}</span>` +
    '<span style="white-space: nowrap">page <span class="pageNumber"></span> of <span class="totalPages"></span></span>' +
    '</div>'
  );
}

/**
 * Chromium names each element of a tagged PDF's structure tree after the DOM node it came from
 * (/ID (node00038561), ISO 32000-1 §14.7.2), lists them in the StructTreeRoot's /IDTree, and
 * refers to header cells by those names in table attributes (/Headers, §14.8.5.7). The node
 * numbers count up within a renderer process, so the same page printed on a fresh tab and on a
 * tab that printed another document first gave PDFs differing in nothing but these names (seen:
 * a reprinted draft unlike the first print). They are renamed node00000001, node00000002, ... in
 * the order the structure tree lists its elements, /Headers follow, and the /IDTree is rebuilt
 * as one sorted /Names array (§7.9.6) in place of the old one, so the bytes depend on the page
 * alone. Returns how many were renamed.
 */
export function renumberStructureIds(pdf: PDFDocument): number {
  const root = pdf.catalog.lookupMaybe(PDFName.of('StructTreeRoot'), PDFDict);
  if (!root) return 0;
  const [ID, K, A, HEADERS] = ['ID', 'K', 'A', 'Headers'].map((n) => PDFName.of(n)) as [PDFName, PDFName, PDFName, PDFName];
  const elements: { ref: PDFRef; dict: PDFDict }[] = [];
  const renamed = new Map<string, string>();
  const seen = new Set<PDFDict>();
  const lookup = (value: unknown) => (value instanceof PDFRef ? pdf.context.lookup(value) : value);
  const walk = (kid: unknown): void => {
    const value = lookup(kid);
    if (value instanceof PDFArray) {
      for (let i = 0; i < value.size(); i++) walk(value.get(i));
      return;
    }
    if (!(value instanceof PDFDict) || seen.has(value)) return;
    seen.add(value);
    const id = value.get(ID);
    if (kid instanceof PDFRef && (id instanceof PDFString || id instanceof PDFHexString)) {
      const name = `node${String(elements.length + 1).padStart(8, '0')}`;
      renamed.set(id.decodeText(), name);
      value.set(ID, PDFString.of(name));
      elements.push({ ref: kid, dict: value });
    }
    walk(value.get(K));
  };
  walk(root.get(K));
  if (elements.length === 0) return 0;

  const renameHeaders = (attributes: unknown): void => {
    const value = lookup(attributes);
    if (value instanceof PDFArray) {
      for (let i = 0; i < value.size(); i++) renameHeaders(value.get(i));
      return;
    }
    if (!(value instanceof PDFDict)) return;
    const headers = lookup(value.get(HEADERS));
    if (!(headers instanceof PDFArray)) return;
    for (let i = 0; i < headers.size(); i++) {
      const header = headers.get(i);
      const name = header instanceof PDFString || header instanceof PDFHexString ? renamed.get(header.decodeText()) : undefined;
      if (name) headers.set(i, PDFString.of(name));
    }
  };
  for (const dict of seen) renameHeaders(dict.get(A));

  const deleteTree = (node: unknown): void => {
    const value = lookup(node);
    if (node instanceof PDFRef) pdf.context.delete(node);
    if (!(value instanceof PDFDict)) return;
    const kids = lookup(value.get(PDFName.of('Kids')));
    if (kids instanceof PDFArray) for (let i = 0; i < kids.size(); i++) deleteTree(kids.get(i));
  };
  deleteTree(root.get(PDFName.of('IDTree')));
  const names = pdf.context.obj([]);
  for (const { ref, dict } of elements) {
    names.push(dict.get(ID)!);
    names.push(ref);
  }
  root.set(PDFName.of('IDTree'), pdf.context.register(pdf.context.obj({ Names: names })));
  return elements.length;
}

/** Sets the document properties, dates and attachments of a printed PDF, and names its structure elements by position. */
export async function finishPdf(printed: Uint8Array, meta: PdfMeta, chromiumVersion: string): Promise<Uint8Array> {
  const pdf = await PDFDocument.load(printed, { updateMetadata: false, ...PDF_LIB_WHOLE });
  renumberStructureIds(pdf);
  await setPdfProperties(pdf, meta, chromiumVersion);
  return pdf.save({ useObjectStreams: false, objectsPerTick: Infinity });
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
 * Every font the page declares, loaded before anything is measured for print: a font that
 * only print content needs (or that the browser would fetch lazily) must not arrive while the
 * pages are laid out, or the layout, and so the PDF, would depend on timing. Then the layout is
 * given two frames to settle.
 */
async function settleFonts(page: Page): Promise<void> {
  await page.evaluate(async () => {
    await Promise.allSettled([...document.fonts].map((font) => font.load()));
    await document.fonts.ready;
    await new Promise((resolve) => requestAnimationFrame(() => requestAnimationFrame(resolve)));
  });
}

/** Loads a page and waits until its fonts and charts are drawn. */
async function loadForPrint(page: Page, url: string, timeoutMs: number): Promise<void> {
  await page.goto(url, { waitUntil: 'load', timeout: timeoutMs });
  await page.addStyleTag({ content: NO_MARGIN_BOXES });
  await settleFonts(page);
  const hasCharts = await page.evaluate(() => document.documentElement.hasAttribute('data-charts-ready') || document.querySelector('canvas') !== null);
  if (!hasCharts) return;
  try {
    await page.waitForFunction(() => document.documentElement.dataset.chartsReady === 'true', undefined, { timeout: timeoutMs });
  } catch {
    throw new UserError(`pdf: ${url}: the charts did not report ready (<html data-charts-ready="true">) within ${Math.round(timeoutMs / 1000)} s`, EXIT_VALIDATION);
  }
}

/** At most `size` pages; a print waits for a free one. */
class PagePool {
  private readonly idle: Page[] = [];
  private readonly waiting: { resolve: (page: Page) => void; reject: (error: unknown) => void }[] = [];
  private created = 0;

  constructor(
    private readonly context: BrowserContext,
    private readonly size: number,
  ) {}

  private async create(): Promise<Page> {
    this.created += 1;
    try {
      return await this.context.newPage();
    } catch (error) {
      this.created -= 1;
      throw error;
    }
  }

  acquire(): Promise<Page> {
    const idle = this.idle.pop();
    if (idle) return Promise.resolve(idle);
    if (this.created < this.size) return this.create();
    return new Promise((resolve, reject) => this.waiting.push({ resolve, reject }));
  }

  release(page: Page): void {
    const next = this.waiting.shift();
    if (next) next.resolve(page);
    else this.idle.push(page);
  }

  /** A page that failed is closed; whoever waits gets a fresh one. */
  async discard(page: Page): Promise<void> {
    this.created -= 1;
    await page.close().catch(() => undefined);
    const next = this.waiting.shift();
    if (next) this.create().then(next.resolve, next.reject);
  }
}

async function openBrowser(options: PrinterOptions): Promise<Browser> {
  const executablePath = options.executablePath ?? findChromium();
  if (executablePath === null) throw new ChromiumMissingError();
  try {
    return await chromium.launch({ executablePath, args: CHROMIUM_ARGS, headless: true, timeout: options.timeoutMs ?? 60_000 });
  } catch (error) {
    throw new UserError(`pdf: Chromium (${executablePath}) did not start: ${(error as Error).message.split('\n')[0]}`, EXIT_VALIDATION);
  }
}

/**
 * Runs `work` with a printer on one Chromium, closed when `work` settles (also when it throws).
 * Throws ChromiumMissingError when there is no Chromium.
 */
export async function withPdfPrinter<T>(work: (printer: PdfPrinter) => Promise<T>, options: PrinterOptions = {}): Promise<T> {
  const browser = await openBrowser(options);
  const timeoutMs = options.timeoutMs ?? 60_000;
  try {
    const contexts = new Map<PdfMeta['paper'], { context: BrowserContext; pool: PagePool }>();
    const poolFor = async (paper: PdfMeta['paper']) => {
      let entry = contexts.get(paper);
      if (!entry) {
        const widthPx = Math.round((PAPER[paper].width - 2 * MARGIN_MM.side) * CSS_PX_PER_MM);
        const heightPx = Math.round((PAPER[paper].height - MARGIN_MM.top - MARGIN_MM.bottom) * CSS_PX_PER_MM);
        const context = await browser.newContext({
          viewport: { width: widthPx, height: heightPx },
          deviceScaleFactor: DEVICE_SCALE,
          serviceWorkers: 'block',
          reducedMotion: 'reduce',
          colorScheme: 'light',
          timezoneId: 'UTC',
          locale: 'en-GB',
        });
        await context.route('**/*', (route) => {
          const url = route.request().url();
          if (/^(file|data):/i.test(url)) return route.continue();
          options.onBlockedRequest?.(url);
          return route.abort('blockedbyclient');
        });
        entry = { context, pool: new PagePool(context, Math.max(1, options.pages ?? 2)) };
        contexts.set(paper, entry);
      }
      return entry.pool;
    };
    const printer: PdfPrinter = {
      chromiumVersion: browser.version(),
      async print(htmlPathOrUrl, meta) {
        const url = pageUrl(htmlPathOrUrl);
        const pool = await poolFor(meta.paper);
        const page = await pool.acquire();
        let printed: Buffer;
        try {
          await page.emulateMedia({ media: 'print' });
          await loadForPrint(page, url, timeoutMs);
          printed = await page.pdf({
            format: meta.paper,
            printBackground: true,
            displayHeaderFooter: true,
            headerTemplate: headerTemplate(meta),
            footerTemplate: footerTemplate(meta),
            margin: { top: `${MARGIN_MM.top}mm`, bottom: `${MARGIN_MM.bottom}mm`, left: `${MARGIN_MM.side}mm`, right: `${MARGIN_MM.side}mm` },
            preferCSSPageSize: false,
            outline: true,
            tagged: true,
          });
        } catch (error) {
          await pool.discard(page);
          throw error;
        }
        pool.release(page);
        return finishPdf(printed, meta, browser.version());
      },
    };
    return await work(printer);
  } finally {
    await browser.close().catch(() => undefined);
  }
}

/** The printer a seal is given (lib/archive/seal.ts): one Chromium, one page, for one document. */
export const sealPdfPrinter: SealPdfPrinter = {
  check() {
    if (findChromium() === null) throw new ChromiumMissingError();
  },
  print: (htmlPath, meta) => withPdfPrinter(async (printer) => ({ pdf: await printer.print(htmlPath, meta), chromium: printer.chromiumVersion }), { pages: 1 }),
};
