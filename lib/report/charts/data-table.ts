/**
 * The data under each chart: a table of its numbers as the chart shows them (formatted, in the
 * chart's units, at most a few dozen rows: every k-th point of a long series) and, as the table's
 * data, every point unrounded in the units of the results object, which the page offers as CSV
 * (lib/report/table.ts).
 */
import { formatNumber } from '../format.ts';
import { table, type DataValue, type Table, type TableRow } from '../table.ts';

/**
 * A column of a chart's data table. `head` and `shown` make the column of the page (numbers as
 * the chart plots them, or labels); `data` the column of the CSV (the results' numbers, in their
 * unit). A column may have either or both: where the chart plots a difference (the tornado bars),
 * the CSV gives the values the difference is made of.
 */
export interface ChartColumn {
  head?: string;
  shown?: (number | null)[] | string[];
  digits?: number;
  data?: { name: string; unit: string; values: DataValue[] };
}

export interface ChartData {
  table: Table;
  /** "Every 8th of 214 points, and the last; the CSV file holds all of them." or "". */
  tableNote: string;
}

const MAX_ROWS = 32;

function shownCell(c: ChartColumn, i: number): string {
  const v = c.shown?.[i];
  if (v === null || v === undefined) return '';
  return typeof v === 'string' ? v : formatNumber(v, c.digits ?? 4);
}

function ordinal(n: number): string {
  return n === 2 ? '2nd' : n === 3 ? '3rd' : `${n}th`;
}

/** Indices of at most MAX_ROWS rows: every k-th, the last always included. */
function sampled(n: number): { indices: number[]; step: number } {
  if (n <= MAX_ROWS) return { indices: Array.from({ length: n }, (_, i) => i), step: 1 };
  const step = Math.ceil((n - 1) / (MAX_ROWS - 1));
  const indices: number[] = [];
  for (let i = 0; i < n - 1; i += step) indices.push(i);
  indices.push(n - 1);
  return { indices, step };
}

/** The chart's table (name: the figure's, such as "nernst-path"; title given when the figure is numbered). */
export function chartData(name: string, columns: readonly ChartColumn[]): ChartData {
  const shown = columns.filter((c) => c.head !== undefined);
  const data = columns.flatMap((c) => (c.data ? [c.data] : []));
  const n = Math.max(...shown.map((c) => c.shown?.length ?? 0));
  const rows = Math.max(...data.map((d) => d.values.length));
  if (n !== rows) throw new Error(`chart data ${name}: ${n} rows shown, ${rows} in the data`);
  const { indices, step } = sampled(n);
  const tableRows: TableRow[] = indices.map((i) => ({ cells: shown.map((c) => shownCell(c, i)) }));
  return {
    table: table({
      name,
      title: name,
      head: shown.map((c) => c.head!),
      align: shown.map((c) => (c.shown?.some((v) => typeof v === 'string') ? 'left' : 'right')),
      rows: tableRows,
      data: {
        columns: data.map((d) => ({ name: d.name, unit: d.unit })),
        rows: Array.from({ length: rows }, (_, i) => data.map((d) => d.values[i] ?? null)),
      },
    }),
    tableNote: step > 1 ? `Every ${ordinal(step)} of ${n} points, and the last; the CSV file holds all of them.` : '',
  };
}
