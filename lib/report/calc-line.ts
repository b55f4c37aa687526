/**
 * One line of the results that a checker can redo by hand: a relation of an equation of the
 * method (cited by number, taken from the equation table, equations.ts) and, aligned under it,
 * the same relation with this design's numbers put in (as many digits as the numbers have, up to
 * six) and the result with its unit, followed by where each number comes from. The raw numbers
 * stay on the line (`inputs`, `value`) so that tests can recompute each line and compare it with
 * the results.
 */
import type { EquationBook } from './equation-book.ts';
import { NUMBERS, symbolicLhs, symbolicRhs, symbolTex } from './equations.ts';
import { formatNumber, formatPercent, formatTrimmed, texNumber } from './format.ts';
import { renderTex } from './katex-render.ts';
import { texValue } from './tex.ts';
import { unitTex, unitText } from './units.ts';
import { escapeHtml, trustedHtml, type TrustedHtml } from './trusted-html.ts';

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
  /** The quantities as the rows of the line's table of where each number comes from (symbol, value, origin), as HTML. */
  quantityRows: TrustedHtml;
  /** A remark on how the line is evaluated, or "". */
  note: string;
  inputs: Record<string, number>;
  value: number;
}

/** A number a worked line puts into its relation: its name there (the equation table gives its symbol), value, unit and origin. */
export interface QuantitySpec {
  /** Name of the quantity in the relation (and in `inputs`). */
  name: string;
  value: number;
  /** Unit of the number as substituted, a key of lib/report/units.ts ("J/mol"; "" for none). */
  unit: string;
  origin: string;
  digits?: number;
}

export interface LineSpec {
  id: string;
  title: string;
  /** The equation (a key of the equation table, defined by the method) and which of its relations the line evaluates. */
  equation: string;
  relation: string;
  /** A left-hand side of the line's own, where it evaluates the relation at a point (E_in for E). */
  lhs?: string;
  quantities: QuantitySpec[];
  /** A unit conversion written after the substituted right-hand side (× 1/3.6 × 10⁶ for kWh). */
  conversion?: string;
  /** The result in the unit shown. */
  value: number;
  unit: string;
  digits?: number;
  /** A fraction also shown as a percentage (efficiencies). */
  percent?: boolean;
  note?: string;
}

/** A line with the origins of some of its quantities replaced, by quantity name (an operating case's numbers reusing a line of section 6). */
export function withOrigins(line: LineSpec, origins: Readonly<Record<string, string>>): LineSpec {
  return { ...line, quantities: line.quantities.map((q) => (origins[q.name] === undefined ? q : { ...q, origin: origins[q.name]! })) };
}

const SUBSTITUTION_DIGITS = 6;

/**
 * The rows of a line's table of quantities as HTML, the text escaped as the templates'
 * autoescaping does: made here, not by a Nunjucks loop per quantity in the workedLine macro.
 */
function quantityRows(quantities: readonly CalcQuantity[]): TrustedHtml {
  let html = '';
  for (const q of quantities) html += `<tr><td class="sym">${q.symbol.html}</td><td class="num">${escapeHtml(q.value)}</td><td class="txt">${escapeHtml(q.origin)}</td></tr>`;
  return trustedHtml(html);
}

export function calcLine(spec: LineSpec, book: EquationBook): CalcLine {
  const equation = book.get(spec.equation);
  const relation = equation.entry.relations[spec.relation];
  if (!relation) throw new Error(`equation "${spec.equation}" has no relation "${spec.relation}" for the line ${spec.id}`);
  const numbers: Record<string, string> = {};
  const inputs: Record<string, number> = {};
  for (const q of spec.quantities) {
    if (!relation.symbols[q.name]) throw new Error(`the line ${spec.id} gives ${q.name}, which the relation ${spec.equation}/${spec.relation} does not name`);
    numbers[q.name] = texValue(q.value, q.digits ?? SUBSTITUTION_DIGITS, true);
    inputs[q.name] = q.value;
  }
  for (const name of Object.keys(relation.symbols)) if (numbers[name] === undefined) throw new Error(`the line ${spec.id} gives no number for ${name}`);
  const digits = spec.digits ?? 5;
  const percentTex = spec.percent ? ` = ${texNumber(spec.value * 100, 4)}\\,\\%` : '';
  const resultTex = `${texValue(spec.value, digits).replace(/^\((.*)\)$/, '$1')}${unitTex(spec.unit)}${percentTex}`;
  const lhs = spec.lhs ?? symbolicLhs(relation, 'line');
  const substituted = `${relation.rhs(numbers, NUMBERS)}${spec.conversion ?? ''}`;
  // A relation that equates two expressions shows both with the numbers put in: lhs(numbers) = rhs(numbers) = result.
  const substitutedLhs = relation.lhsOf ? relation.lhsOf(numbers, NUMBERS) : '';
  const quantities = spec.quantities.map((q): CalcQuantity => {
    const symbol = relation.symbols[q.name]!;
    return {
      symbol: renderTex(symbol.listed ?? symbolTex(symbol, 'line')),
      value: `${formatTrimmed(q.value, q.digits ?? SUBSTITUTION_DIGITS)}${q.unit ? ` ${unitText(q.unit)}` : ''}`,
      origin: q.origin,
    };
  });
  return {
    id: spec.id,
    title: spec.title,
    equation: { number: equation.number, anchor: equation.anchor },
    math: renderTex(`\\begin{aligned} ${lhs} &= ${symbolicRhs(relation, 'line')} \\\\ ${substitutedLhs} &= ${substituted} = ${resultTex} \\end{aligned}`, true),
    result: spec.percent ? formatPercent(spec.value) : `${formatNumber(spec.value, digits)}${spec.unit ? ` ${unitText(spec.unit)}` : ''}`,
    quantities,
    quantityRows: quantityRows(quantities),
    note: spec.note ?? '',
    inputs,
    value: spec.value,
  };
}
