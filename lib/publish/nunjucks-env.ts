/**
 * The one Nunjucks environment of the design documents, used by the Eleventy site (handed over
 * with eleventyConfig.setLibrary('njk', ...)) and by renderDocumentHtml, so an issued document and
 * its site page are rendered by the same code. Autoescaping is on and undefined output throws;
 * the only way to insert unescaped HTML is the `trusted` filter, which accepts nothing but the
 * TrustedHtml values lib/report makes (KaTeX of our own LaTeX, chart JSON, CSS strings) and throws
 * on any other value, user text included. The `portfolioRow` filter inserts a row of the
 * portfolio index as this environment rendered it, escaped, from templates/_includes/portfolio-row.njk.
 *
 * Nunjucks is Eleventy's own copy (resolved from @11ty/eleventy), so the environment is of the
 * version Eleventy drives; the few members used here are typed below.
 */
import { createRequire } from 'node:module';
import { join } from 'node:path';
import { isTrustedHtml } from '../report/trusted-html.ts';
import { TEMPLATES_DIR } from './paths.ts';

export interface NunjucksEnvironment {
  render(name: string, context: object): string;
  renderString(source: string, context: object): string;
  addFilter(name: string, filter: (...args: never[]) => unknown): NunjucksEnvironment;
}

interface NunjucksModule {
  Environment: new (loader: unknown, options: { autoescape: boolean; throwOnUndefined: boolean; trimBlocks: boolean; lstripBlocks: boolean }) => NunjucksEnvironment;
  FileSystemLoader: new (paths: string[], options?: { noCache?: boolean }) => unknown;
  runtime: { SafeString: new (html: string) => unknown };
}

const fromEleventy = createRequire(createRequire(import.meta.url).resolve('@11ty/eleventy'));
const nunjucks = fromEleventy('nunjucks') as NunjucksModule;

let shared: NunjucksEnvironment | undefined;

/** While a page renders in parts (renderParts): the HTML the trusted filter was given, in order; else null. */
let inserted: string[] | null = null;

/** What stands for the `n`th inserted HTML in the text Nunjucks makes while a page renders in parts. */
const MARK = '\u0000';

function trusted(value: unknown): unknown {
  if (!isTrustedHtml(value)) throw new Error(`the trusted filter was given ${typeof value === 'string' ? 'a plain string' : typeof value}; only HTML made by lib/report may be inserted unescaped`);
  if (inserted === null) return new nunjucks.runtime.SafeString(value.html);
  inserted.push(value.html);
  return new nunjucks.runtime.SafeString(`${MARK}${inserted.length - 1}${MARK}`);
}

/**
 * A template rendered as the texts that, joined, are exactly what `env.render` returns: the
 * text Nunjucks makes around the HTML of the `trusted` filter, and that HTML, in order. A page
 * rendered as one string is one string of some 0.95 million characters (two bytes each, as the
 * page holds characters beyond Latin-1), built by Nunjucks as a chain of pieces and copied into
 * fresh memory when it is first read; its parts, each far smaller, are encoded one after the
 * other without that copy (lib/publish/render.ts). Where the page's own text holds the mark (a
 * NUL character in text from a basis), the marks cannot be told apart and the page is rendered
 * again as one string.
 */
export function renderParts(env: NunjucksEnvironment, name: string, context: object): string[] {
  const parts: string[] = [];
  inserted = parts;
  let text: string;
  try {
    text = env.render(name, context);
  } finally {
    inserted = null;
  }
  const pieces = text.split(MARK);
  if (pieces.length !== 2 * parts.length + 1 || pieces.some((piece, i) => i % 2 === 1 && piece !== String((i - 1) / 2))) return [env.render(name, context)];
  for (let i = 1; i < pieces.length; i += 2) pieces[i] = parts[(i - 1) / 2]!;
  return pieces;
}

/**
 * Each row of the portfolio index rendered once for each row object: the dev server keeps every
 * project's row and makes again only the row of the project saved, so the index of 2 000
 * projects re-renders one row a save, not all of them. The row's own template is rendered by
 * the same environment (autoescaped) as the page around it was, so the index is byte for byte
 * the one a full build writes.
 */
const renderedRows = new WeakMap<object, unknown>();

function portfolioRow(env: NunjucksEnvironment, row: object): unknown {
  let html = renderedRows.get(row);
  if (html === undefined) {
    // Kept for later renders, so made whole even inside a render in parts.
    const outer = inserted;
    inserted = null;
    try {
      // The template's last line ends in a newline, which the loop around it writes itself.
      html = new nunjucks.runtime.SafeString(env.render('portfolio-row.njk', { r: row }).replace(/\n$/, ''));
    } finally {
      inserted = outer;
    }
    renderedRows.set(row, html);
  }
  return html;
}

function createEnvironment(): NunjucksEnvironment {
  const loader = new nunjucks.FileSystemLoader([join(TEMPLATES_DIR, '_includes'), TEMPLATES_DIR]);
  const env = new nunjucks.Environment(loader, { autoescape: true, throwOnUndefined: true, trimBlocks: true, lstripBlocks: true });
  env.addFilter('trusted', trusted);
  env.addFilter('portfolioRow', (row: object) => portfolioRow(env, row));
  return env;
}

/** The shared environment of this process. */
export function nunjucksEnvironment(): NunjucksEnvironment {
  shared ??= createEnvironment();
  return shared;
}
