/**
 * One line of the results that a checker can redo by hand: the equation (cited by number from
 * the method) and, aligned under it, the same equation with this design's numbers put in (as
 * many digits as the numbers have, up to six) and the result with its unit, followed by where each number comes from. The raw numbers stay on the line (`inputs`,
 * `value`) so that tests can recompute each line and compare it with the results.
 */
import type { EquationBook } from './equation-book.ts';
import { formatNumber, formatPercent, formatTrimmed, texNumber } from './format.ts';
import { renderTex } from './katex-render.ts';
import { texValue } from './tex.ts';
import { unitTex, unitText } from './units.ts';
import type { TrustedHtml } from './trusted-html.ts';

export interface CalcQuantity {
  symbol: TrustedHtml;
  /** The value with its unit, as the substitution shows it. */
  value: string;
  /** Where it comes from: "design input", "Eq. 9", "stream table". */
  origin: string;
}

export interface CalcLine {
  id: string;
  title: string;
  equation: { number: number; anchor: string };
  /** The equation and, aligned under it, the numbers put in and the result. */
  math: TrustedHtml;
  /** The result with its unit: "0.9893 V". */
  result: string;
  quantities: CalcQuantity[];
  /** A remark on how the line is evaluated, or "". */
  note: string;
  inputs: Record<string, number>;
  value: number;
}

export interface QuantitySpec {
  /** Name of the number in `inputs`. */
  name: string;
  /** Its LaTeX symbol (ours). */
  symbol: string;
  value: number;
  /** Unit of the number as substituted, a key of lib/report/units.ts ("J/mol"; "" for none). */
  unit: string;
  origin: string;
  digits?: number;
}

export interface LineSpec {
  id: string;
  title: string;
  equation: string;
  /** Left-hand side and right-hand side of the symbolic form. */
  lhs: string;
  rhs: string;
  quantities: QuantitySpec[];
  /**
   * The right-hand side with numbers: receives each quantity's number as LaTeX by name
   * (negative numbers in parentheses).
   */
  substitute: (n: Record<string, string>) => string;
  /** The result in the unit shown. */
  value: number;
  unit: string;
  digits?: number;
  /** A fraction also shown as a percentage (efficiencies). */
  percent?: boolean;
  note?: string;
}

const SUBSTITUTION_DIGITS = 6;

export function calcLine(spec: LineSpec, book: EquationBook): CalcLine {
  const equation = book.get(spec.equation);
  const numbers: Record<string, string> = {};
  const inputs: Record<string, number> = {};
  for (const q of spec.quantities) {
    numbers[q.name] = texValue(q.value, q.digits ?? SUBSTITUTION_DIGITS, true);
    inputs[q.name] = q.value;
  }
  const digits = spec.digits ?? 5;
  const percentTex = spec.percent ? ` = ${texNumber(spec.value * 100, 4)}\\,\\%` : '';
  const resultTex = `${texValue(spec.value, digits).replace(/^\((.*)\)$/, '$1')}${unitTex(spec.unit)}${percentTex}`;
  return {
    id: spec.id,
    title: spec.title,
    equation: { number: equation.number, anchor: equation.anchor },
    math: renderTex(`\\begin{aligned} ${spec.lhs} &= ${spec.rhs} \\\\ &= ${spec.substitute(numbers)} = ${resultTex} \\end{aligned}`, true),
    result: spec.percent ? formatPercent(spec.value) : `${formatNumber(spec.value, digits)}${spec.unit ? ` ${unitText(spec.unit)}` : ''}`,
    quantities: spec.quantities.map((q) => ({
      symbol: renderTex(q.symbol),
      value: `${formatTrimmed(q.value, q.digits ?? SUBSTITUTION_DIGITS)}${q.unit ? ` ${unitText(q.unit)}` : ''}`,
      origin: q.origin,
    })),
    note: spec.note ?? '',
    inputs,
    value: spec.value,
  };
}
