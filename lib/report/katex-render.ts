/**
 * LaTeX to HTML at build time with KaTeX, for the equations the view model writes itself. An
 * expression KaTeX cannot parse, or one it would only render with a warning (strict mode), is a
 * fault in cellbasis and fails the build: throwOnError is on, `trust` is off, and a command it
 * refuses (\href, \url, \includegraphics, \htmlClass ...) fails too instead of showing in red.
 * User text never enters LaTeX: lib/report/tex.ts builds every expression from numbers and our
 * own symbols.
 *
 * Identical expressions are rendered once: the HTML is cached by display mode and source, so a
 * site of many pages that share the method's equations renders each of them a single time. The
 * cache keeps the most recently used CACHE_LIMIT expressions: the worked lines of each project
 * carry its own numbers, and a cache that kept them all would hold every page of a large site.
 */
import katex from 'katex';
import { trustedHtml, type TrustedHtml } from './trusted-html.ts';

const cache = new Map<string, TrustedHtml>();
const CACHE_LIMIT = 4000;

/** KaTeX draws what it will not render (an untrusted command) in this colour; we look for it and fail. */
const REFUSED = '#b10dc9';
let renders = 0;

/** Renders our own LaTeX (inline, or display for a numbered equation); throws on any error. */
export function renderTex(tex: string, display = false): TrustedHtml {
  const key = `${display ? 'D' : 'I'}${tex}`;
  const cached = cache.get(key);
  if (cached) {
    // Most recently used last: a Map keeps insertion order.
    cache.delete(key);
    cache.set(key, cached);
    return cached;
  }
  let html: string;
  try {
    html = katex.renderToString(tex, { displayMode: display, throwOnError: true, trust: false, strict: 'error', output: 'htmlAndMathml', errorColor: REFUSED });
  } catch (error) {
    throw new Error(`KaTeX cannot render the equation "${tex}": ${(error as Error).message}`);
  }
  if (html.includes(REFUSED)) throw new Error(`KaTeX cannot render the equation "${tex}": it uses a command that is not trusted`);
  renders++;
  const value = trustedHtml(html);
  cache.set(key, value);
  if (cache.size > CACHE_LIMIT) cache.delete(cache.keys().next().value!);
  return value;
}

/** How many distinct expressions were rendered, and how many are cached (for the tests). */
export function texCacheStats(): { renders: number; cached: number } {
  return { renders, cached: cache.size };
}
