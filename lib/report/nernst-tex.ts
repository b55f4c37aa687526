/**
 * The Nernst pressure quotient of a cell as LaTeX: symbolic, with partial-pressure symbols, or
 * substituted, with this design's partial pressures in bar (p° = 1 bar, so each p/p° is the
 * number itself). The terms come from the per-ion table, lib/electrochem/electrolytes.ts.
 */
import type { QuotientTerm } from '../electrochem/electrolytes.ts';
import { texPressure } from './tex.ts';

function factor(term: QuotientTerm, base: string): string {
  return Math.abs(term.power) === 0.5 ? `{${base}}^{1/2}` : base;
}

/**
 * `\frac{numerator}{denominator}` (or the numerator alone) of the terms, each shown by `show`
 * and joined by `times`: symbols side by side (a thin space), numbers with a multiplication sign
 * between them, so that two partial pressures never read as one number.
 */
export function quotientTex(terms: readonly QuotientTerm[], show: (term: QuotientTerm) => string = (t) => texPressure(t.species, t.electrode), times = '\\,'): string {
  const top = terms.filter((t) => t.power > 0).map((t) => factor(t, show(t)));
  const bottom = terms.filter((t) => t.power < 0).map((t) => factor(t, show(t)));
  return bottom.length ? `\\frac{${top.join(times)}}{${bottom.join(times)}}` : top.join(times);
}
