/**
 * The numbered equations of one document. The method section defines each equation once, in
 * reading order, from its entry of the equation table (equations.ts); the results cite it by key
 * and get its number ("from Eq. 7"), its anchor and its relations, which their worked lines
 * evaluate. Defining a key twice or citing one never defined is a fault of the view model and
 * throws, so a document can never show a dangling equation reference.
 */
import type { EquationEntry } from './equations.ts';
import { renderTex } from './katex-render.ts';
import type { TrustedHtml } from './trusted-html.ts';

export interface Equation {
  key: string;
  number: number;
  /** Anchor id of the equation in the page: eq-7. */
  anchor: string;
  html: TrustedHtml;
  entry: EquationEntry;
}

export class EquationBook {
  readonly #byKey = new Map<string, Equation>();

  define(entry: EquationEntry): Equation {
    const { key } = entry;
    if (this.#byKey.has(key)) throw new Error(`equation "${key}" is defined twice`);
    const number = this.#byKey.size + 1;
    const equation = { key, number, anchor: `eq-${number}`, html: renderTex(entry.display(), true), entry };
    this.#byKey.set(key, equation);
    return equation;
  }

  get(key: string): Equation {
    const equation = this.#byKey.get(key);
    if (!equation) throw new Error(`equation "${key}" is cited but not defined in the method`);
    return equation;
  }

  has(key: string): boolean {
    return this.#byKey.has(key);
  }
}
