/**
 * The worked lines of section 6: for each headline figure, the method's equation with this
 * design's numbers and the result from the results object (never recomputed: the line shows
 * how the result follows, and the tests check that the numbers shown give it). Numbers come from
 * the results, the design inputs of the basis and the constants F and R (CODATA 2018). One
 * module per group of lines in result-lines/; each line names a relation of the equation table
 * (equations.ts).
 */
import type { DesignBasis } from '../basis/types.ts';
import type { Results } from '../plant/results-schema.ts';
import { calcLine, withOrigins, type CalcLine, type LineSpec } from './calc-line.ts';
import type { EquationBook } from './equation-book.ts';
import { nernstLine, standardLines, voltageLines } from './result-lines/voltage-lines.ts';
import { sizeLines } from './result-lines/size-lines.ts';
import { flowLines } from './result-lines/flow-lines.ts';
import { efficiencyLines } from './result-lines/efficiency-lines.ts';
import { heatLines } from './result-lines/heat-lines.ts';
import { carbonLines } from './result-lines/carbon-lines.ts';
import { plantLines } from './result-lines/plant-lines.ts';

export interface LineGroup {
  id: string;
  title: string;
  lines: CalcLine[];
}

/**
 * The worked lines of section 6, in groups. `origins` replaces, by quantity name, where a number
 * is said to come from: an operating case reuses these lines, and its current density or
 * resistance is not the design input the sizing calculation's lines name (sections/cases.ts).
 */
export function resultLines(r: Results, basis: DesignBasis, book: EquationBook, origins: Readonly<Record<string, string>> = {}): LineGroup[] {
  const build = (specs: (LineSpec | null)[]) => specs.filter((s): s is LineSpec => s !== null).map((s) => calcLine(withOrigins(s, origins), book));
  const groups: LineGroup[] = [
    { id: 'results-voltage', title: 'Voltages', lines: build([...standardLines(r, book), nernstLine(r, book, 'inlet'), nernstLine(r, book, 'outlet'), ...voltageLines(r, book)]) },
    { id: 'results-size', title: 'Current, size and power', lines: build(sizeLines(r, basis)) },
    { id: 'results-flows', title: "Flows by Faraday's law", lines: build(flowLines(r, basis)) },
    { id: 'results-efficiency', title: 'Efficiency', lines: build(efficiencyLines(r, book)) },
    { id: 'results-heat', title: 'Heat', lines: build(heatLines(r)) },
  ];
  const carbon = build(carbonLines(r));
  if (carbon.length) groups.push({ id: 'results-carbon', title: 'Carbon margin', lines: carbon });
  groups.push({ id: 'results-plant', title: 'The plant around the stack', lines: build(plantLines(r)) });
  return groups;
}
