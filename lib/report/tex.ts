/**
 * Pieces of LaTeX the view model assembles equations from. Every piece comes from numbers
 * (lib/report/format.ts) or from our own symbols; the one outside name that reaches LaTeX is a
 * species label, which the basis loader has already matched against the species data and which
 * is checked here once more against a plain formula pattern, so no user text can enter KaTeX.
 */
import type { Electrode } from '../electrochem/electrolytes.ts';
import { texNumber, texTrimmed } from './format.ts';

const FORMULA = /^[A-Z][A-Za-z0-9]*(\(L\)|\(gr\))?$/;

/** A species label as an upright formula with subscripts: CH4 → \mathrm{CH_4}, H2O(L) → \mathrm{H_2O(l)}. */
export function texSpecies(label: string): string {
  if (!FORMULA.test(label)) throw new Error(`"${label}" is not a species formula`);
  const phase = /\((L|gr)\)$/.exec(label);
  const formula = label.replace(/\((L|gr)\)$/, '').replace(/(\d+)/g, '_{$1}');
  return `\\mathrm{${formula}${phase ? `(${phase[1] === 'L' ? 'l' : 'gr'})` : ''}}`;
}


/** Partial pressure of a species at an electrode: p_{H2,f}. */
export function texPressure(label: string, electrode: Electrode): string {
  return `p_{${texSpecies(label)},\\mathrm{${electrode}}}`;
}

/** A number for a substituted equation, in parentheses when negative so that signs read clearly; `trim` drops trailing zeros. */
export function texValue(value: number, digits = 5, trim = false): string {
  const text = trim ? texTrimmed(value, digits) : texNumber(value, digits);
  return value < 0 ? `(${text})` : text;
}
