/**
 * The data under each chart: a table of its numbers (formatted, at most a few dozen rows, every
 * k-th point of a long series) and the complete data as CSV in a data: URI that a link downloads
 * without any server, so it works from a page opened from disk. CSV numbers are written in full
 * precision with a dot as decimal mark; the header names each column with its unit.
 */
import { formatNumber } from '../format.ts';
import { table, type Table } from '../table.ts';

/** A column of numbers (null: no value at that row) or of labels. */
export type DataColumn = { header: string; values: (number | null)[]; digits?: number } | { header: string; labels: string[] };

export interface ChartData {
  table: Table;
  /** "Every 8th of 214 points, and the last; the CSV file holds all of them." or "". */
  tableNote: string;
  csvHref: string;
  csvName: string;
}

const MAX_ROWS = 32;

function length(c: DataColumn): number {
  return 'labels' in c ? c.labels.length : c.values.length;
}

function csvCell(text: string): string {
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

function rawCell(c: DataColumn, i: number): string {
  if ('labels' in c) return csvCell(c.labels[i] ?? '');
  const v = c.values[i];
  return v === null || v === undefined ? '' : String(v);
}

function shownCell(c: DataColumn, i: number): string {
  if ('labels' in c) return c.labels[i] ?? '';
  const v = c.values[i];
  return v === null || v === undefined ? '' : formatNumber(v, c.digits ?? 4);
}

export function csvText(columns: readonly DataColumn[]): string {
  const n = Math.max(...columns.map(length));
  const lines = [columns.map((c) => csvCell(c.header)).join(',')];
  for (let i = 0; i < n; i++) lines.push(columns.map((c) => rawCell(c, i)).join(','));
  return `${lines.join('\r\n')}\r\n`;
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

export function chartData(columns: readonly DataColumn[], fileName: string): ChartData {
  const n = Math.max(...columns.map(length));
  const { indices, step } = sampled(n);
  return {
    table: table(
      columns.map((c) => c.header),
      columns.map((c) => ('labels' in c ? 'left' : 'right')),
      indices.map((i) => ({ cells: columns.map((c) => shownCell(c, i)) })),
    ),
    tableNote: step > 1 ? `Every ${ordinal(step)} of ${n} points, and the last; the CSV file holds all of them.` : '',
    csvHref: `data:text/csv;charset=utf-8,${encodeURIComponent(csvText(columns))}`,
    csvName: fileName,
  };
}
