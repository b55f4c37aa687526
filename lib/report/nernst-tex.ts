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
 * `\frac{numerator}{denominator}` (or the numerator alone) of the terms, each shown by `show`:
 * symbols side by side, numbers (`times`) with a multiplication sign between them, so that two
 * partial pressures never read as one number.
 */
export function quotientTex(
  terms: readonly QuotientTerm[],
  show: (term: QuotientTerm) => string = (t) => texPressure(t.species, t.electrode),
  { times = false }: { times?: boolean } = {},
): string {
  const top = terms.filter((t) => t.power > 0).map((t) => factor(t, show(t)));
  const bottom = terms.filter((t) => t.power < 0).map((t) => factor(t, show(t)));
  const join = (list: string[]) => list.join(times ? '\\times' : '\\,');
  return bottom.length ? `\\frac{${join(top)}}{${join(bottom)}}` : join(top);
}

/** ln of the quotient from partial pressures in bar (the same arithmetic as lib/electrochem/nernst.ts). */
export function lnQuotient(terms: readonly QuotientTerm[], pressure: (term: QuotientTerm) => number): number {
  return terms.reduce((sum, t) => sum + t.power * Math.log(pressure(t)), 0);
}
