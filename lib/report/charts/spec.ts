/**
 * The chart description the page carries as JSON and templates/assets/charts.js draws with
 * Chart.js: axes with titles and units, line series of [x, y] points (a style index picks colour
 * and dash from the script's own palette), marker series for the design point, and tornado bars
 * of the sensitivity study, stacked horizontal bars of the energy flow. Only numbers and our own labels go into it.
 */
export interface Axis {
  title: string;
  log?: boolean;
  min?: number;
  max?: number;
  /** Distance between the ticks of a linear axis (a divisor of min and max); Chart.js chooses one when absent. */
  step?: number;
}

export interface LineSeries {
  label: string;
  points: [number, number][];
  /** Index into the script's palette of data colours. */
  style: number;
  /** A reference line (a limit, the design temperature): drawn thin in the reference colour. */
  reference?: boolean;
  /** Draw on the right-hand axis. */
  right?: boolean;
  dashed?: boolean;
  /** Points only, in the marker colour: the design point. */
  marker?: boolean;
}

export type ChartSpec =
  | { kind: 'line'; x: Axis; y: Axis; y2?: Axis; series: LineSeries[] }
  | { kind: 'tornado'; x: Axis; categories: string[]; low: number[]; high: number[]; lowLabel: string; highLabel: string }
  /** Horizontal bars of stacked parts, one bar per category; each part a value per category (the energy flow). */
  | { kind: 'stacked'; x: Axis; categories: string[]; parts: { label: string; values: number[] }[] };
