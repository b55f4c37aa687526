/**
 * Watching what runs in the pages cellbasis itself opens in Chromium (the PDF printer of
 * lib/publish/pdf.ts, used by `issue` and `build`), without changing that code: `watchPrinting()`
 * wraps playwright-core's `chromium.launch` in this process, so that every browser context the
 * printer makes gets, before any page loads,
 *   - an exposed binding `__cellbasisProbe` and an init script that reports through it any
 *     assignment to `window.__pwned` (what the hostile payload's scripts do) and any call of
 *     alert, confirm, prompt, print or open;
 *   - listeners for dialogs, page errors and console messages, and for every request, with its URL;
 *   - a record of each page load (its URL), so a test can show the probe saw the prints it meant.
 * `stop()` restores `chromium.launch`.
 *
 * The probe only observes: it refuses no request and changes nothing the page draws.
 */
import { chromium, type Browser, type BrowserContext, type LaunchOptions, type Page } from 'playwright-core';

export interface PrintWatch {
  /** What the probe reported: `__pwned=<value>`, `alert:<message>`, ... */
  probe: string[];
  /** Dialogs opened (type: message); each is dismissed. */
  dialogs: string[];
  /** Uncaught errors of page scripts. */
  pageErrors: string[];
  /** Console messages (type: text). */
  console: string[];
  /** Every request a page made, by URL. */
  requests: string[];
  /** URL of every page load. */
  loads: string[];
  /** Browser contexts the probe was attached to. */
  contexts: number;
  stop(): void;
}

/** Reports assignments to window.__pwned and calls of the dialog and window functions. */
export const PROBE_SCRIPT = `(() => {
  const report = (what) => { try { window.__cellbasisProbe(String(what)); } catch (e) {} };
  Object.defineProperty(window, '__pwned', { configurable: false, get() { return undefined; }, set(value) { report('__pwned=' + value); } });
  for (const name of ['alert', 'confirm', 'prompt', 'print', 'open']) {
    const original = window[name];
    window[name] = function (...args) { report(name + ':' + args.join(',')); return original.apply(this, args); };
  }
})();`;

/** Attaches the probe to a context (also usable on a test's own contexts). */
export async function attachProbe(context: BrowserContext, watch: Omit<PrintWatch, 'stop'>): Promise<void> {
  watch.contexts += 1;
  await context.exposeBinding('__cellbasisProbe', (_source, what: string) => void watch.probe.push(what));
  await context.addInitScript({ content: PROBE_SCRIPT });
  const onPage = (page: Page) => {
    page.on('dialog', (dialog) => {
      watch.dialogs.push(`${dialog.type()}: ${dialog.message()}`);
      void dialog.dismiss().catch(() => undefined);
    });
    page.on('pageerror', (error) => watch.pageErrors.push(error.message));
    page.on('console', (message) => watch.console.push(`${message.type()}: ${message.text()}`));
    page.on('request', (request) => watch.requests.push(request.url()));
    page.on('load', () => watch.loads.push(page.url()));
  };
  context.pages().forEach(onPage);
  context.on('page', onPage);
}

export function watchPrinting(): PrintWatch {
  const launch = chromium.launch.bind(chromium);
  const watch: PrintWatch = {
    probe: [],
    dialogs: [],
    pageErrors: [],
    console: [],
    requests: [],
    loads: [],
    contexts: 0,
    stop: () => {
      (chromium as { launch: typeof chromium.launch }).launch = launch;
    },
  };
  (chromium as { launch: typeof chromium.launch }).launch = async (options?: LaunchOptions): Promise<Browser> => {
    const browser = await launch(options);
    const newContext = browser.newContext.bind(browser);
    browser.newContext = async (contextOptions) => {
      const context = await newContext(contextOptions);
      await attachProbe(context, watch);
      return context;
    };
    return browser;
  };
  return watch;
}
