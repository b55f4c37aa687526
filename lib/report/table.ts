/**
 * The table shape the templates display: a header, rows of already formatted cells, and the
 * alignment of each column (numbers right-aligned). Group rows span the table and head a block
 * of rows.
 */
export type Align = 'left' | 'right';

export interface TableRow {
  /** A row that heads a group of rows (one cell across the table), or a row of cells. */
  group?: string;
  cells: string[];
  /** Marks the row for attention (a failed check, an open assumption). */
  flag?: boolean;
}

export interface Table {
  head: string[];
  align: Align[];
  rows: TableRow[];
}

export function table(head: string[], align: Align[], rows: TableRow[]): Table {
  if (head.length !== align.length) throw new Error('a table needs one alignment per column');
  for (const row of rows) {
    if (row.group === undefined && row.cells.length !== head.length) throw new Error(`a row of ${row.cells.length} cells in a table of ${head.length} columns`);
  }
  return { head, align, rows };
}

/** Label and value rows (two columns): numbers right-aligned, or text left-aligned. */
export function pairs(rows: [string, string][], head: [string, string] = ['Quantity', 'Value'], values: Align = 'right'): Table {
  return table(head, ['left', values], rows.map((cells) => ({ cells })));
}
