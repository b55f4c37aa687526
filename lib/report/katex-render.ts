/**
 * LaTeX to HTML at build time with KaTeX, for the equations the view model writes itself. An
 * expression KaTeX cannot parse, or one it would only render with a warning (strict mode), is a
 * fault in cellbasis and fails the build: throwOnError is on, `trust` is off, and a command it
 * refuses (\href, \url, \includegraphics, \htmlClass ...) fails too instead of showing in red.
 * User text never enters LaTeX: lib/report/tex.ts builds every expression from numbers and our
 * own symbols.
 *
 * Expressions that differ only in their numbers (the same worked line of two projects) share one
 * KaTeX render: the structure's output is learnt once and each expression's numbers are placed in
 * it (lib/report/katex-structure.ts), which gives KaTeX's own bytes (test/report/katex-structure.test.ts
 * checks every worked line and equation of every demo and scaffold against renderToString). The
 * structures are kept in an LRU of STRUCTURE_LIMIT; one whose output does not follow that rule is
 * remembered as such. Expressions KaTeX renders itself (those without numbers, such as the
 * method's equations and symbols, and those of such structures) are cached by display mode and
 * source in an LRU of CACHE_LIMIT, so a site of many pages renders each of them a single time.
 */
import katex from 'katex';
import { fillStructure, learnStructure, splitNumbers, type KatexNumbers, type KatexStructure } from './katex-structure.ts';
import { trustedHtml, type TrustedHtml } from './trusted-html.ts';

const cache = new Map<string, TrustedHtml>();
const CACHE_LIMIT = 4000;
const structures = new Map<string, KatexStructure | null>();
const STRUCTURE_LIMIT = 2000;

/** KaTeX draws what it will not render (an untrusted command) in this colour; we look for it and fail. */
const REFUSED = '#b10dc9';
let renders = 0;

/** The options every expression is rendered with (exported for the test that compares with KaTeX's own output). */
export function katexOptions(display: boolean) {
  return { displayMode: display, throwOnError: true, trust: false, strict: 'error', output: 'htmlAndMathml', errorColor: REFUSED } as const;
}

/** Renders our own LaTeX (inline, or display for a numbered equation); throws on any error. */
export function renderTex(tex: string, display = false): TrustedHtml {
  // An expression with numbers is filled into its structure's output, which costs less than a
  // look-up would save: only expressions rendered by KaTeX itself are kept.
  const split = splitNumbers(tex);
  const structure = split && structureOf(split, display);
  if (split && structure) return trustedHtml(fillStructure(structure, split.numbers));
  const key = `${display ? 'D' : 'I'}${tex}`;
  const cached = cache.get(key);
  if (cached) {
    // Most recently used last: a Map keeps insertion order.
    cache.delete(key);
    cache.set(key, cached);
    return cached;
  }
  const value = trustedHtml(katexHtml(tex, display));
  remember(cache, key, value, CACHE_LIMIT);
  return value;
}

/** Most recently used last (a Map keeps insertion order); the least recently used is dropped past `limit`. */
function remember<V>(map: Map<string, V>, key: string, value: V, limit: number): void {
  map.set(key, value);
  if (map.size > limit) map.delete(map.keys().next().value!);
}

/** KaTeX's output for `tex`; throws on any error or untrusted command. */
function katexHtml(tex: string, display: boolean): string {
  let html: string;
  try {
    html = katex.renderToString(tex, katexOptions(display));
  } catch (error) {
    throw new Error(`KaTeX cannot render the equation "${tex}": ${(error as Error).message}`);
  }
  if (html.includes(REFUSED)) throw new Error(`KaTeX cannot render the equation "${tex}": it uses a command that is not trusted`);
  renders++;
  return html;
}

/** The structure of this key, learnt on first use; null for one whose expressions KaTeX must render itself. */
function structureOf(split: KatexNumbers, display: boolean): KatexStructure | null {
  const mapKey = `${display ? 'D' : 'I'}${split.key}`;
  let structure = structures.get(mapKey);
  if (structure === undefined) {
    try {
      structure = learnStructure(split, (probe) => katexHtml(probe, display));
    } catch {
      // A key KaTeX cannot render (the expression itself then fails with its own message).
      structure = null;
    }
  } else structures.delete(mapKey);
  remember(structures, mapKey, structure, STRUCTURE_LIMIT);
  return structure;
}

/** How many times KaTeX rendered (expressions, and structures learnt), and how many expressions are cached (for the tests). */
export function texCacheStats(): { renders: number; cached: number } {
  return { renders, cached: cache.size };
}
