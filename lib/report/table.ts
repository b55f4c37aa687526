/**
 * The table model of the document: what a page shows (a header, rows of formatted cells, the
 * alignment of each column, group rows heading blocks of rows) and, beside it, the same content
 * for a spreadsheet (`data`): named columns with the unit their numbers are in, and rows of raw
 * values (numbers unrounded, in the units of the results object). Every table has a name, which
 * is the file name of its CSV (`streams.csv`) and the section of `cellbasis calc` that prints it,
 * and a title.
 *
 * Build tables with the functions here and a table gets its CSV everywhere without more work:
 * the document links it (lib/report/table-links.ts), the site writes it beside the page
 * (lib/publish/table-files.ts) and `cellbasis calc --section NAME --csv` prints it.
 *   pairsTable   label and value rows (headline, results figures): its data is one row, one
 *                column per quantity, so that the same table of several projects stacks
 *   crossTable   one display column per item (streams): its data is one row per item
 *   recordsTable one row per item both on the page and in the data (inputs, substances)
 *   table        anything else, display and data given separately (charts' data)
 */
import { csvText } from '../core/csv.ts';
import { escapeHtml, trustedHtml, type TrustedHtml } from './trusted-html.ts';

export type Align = 'left' | 'right';

export interface TableRow {
  /** A row that heads a group of rows (one cell across the table), or a row of cells. */
  group?: string;
  cells: string[];
  /** Marks the row for attention (a failed check, an open assumption). */
  flag?: boolean;
}

/** A value of a table's data: a number in its column's unit, text, yes or no, or nothing (an empty field). */
export type DataValue = number | string | boolean | null;

/** A column of a table's data: its name and the unit of its numbers as the basis spells units ("K", "A/m2", "mol/mol"), "" for none. */
export interface DataColumn {
  name: string;
  unit: string;
}

export interface TableData {
  columns: DataColumn[];
  rows: DataValue[][];
}

/** Where a page downloads a table's CSV from (set by lib/report/table-links.ts). */
export interface CsvLink {
  href: string;
  /** The file name a browser saves it under. */
  download: string;
  text: string;
}

export interface Table {
  /** Lower-case words joined by hyphens, unique in its document: "streams". */
  name: string;
  title: string;
  head: string[];
  align: Align[];
  rows: TableRow[];
  data: TableData;
  csv?: CsvLink;
  /** The header and body rows as the page shows them (set by lib/report/table-links.ts with the link). */
  html?: TableHtml;
}

/** A table's header cells and body rows as HTML, for the templates' dataTable macro (templates/_includes/macros.njk). */
export interface TableHtml {
  head: TrustedHtml;
  body: TrustedHtml;
}

const NAME = /^[a-z0-9]+(?:-[a-z0-9]+)*$/;

export type TableSpec = Omit<Table, 'csv' | 'html'>;

/** A table from its display and its data, each checked for shape. */
export function table(spec: TableSpec): Table {
  const { name, head, align, rows, data } = spec;
  if (!NAME.test(name)) throw new Error(`table name "${name}" is not lower-case words joined by hyphens`);
  if (head.length !== align.length) throw new Error(`table ${name}: one alignment per column is needed`);
  for (const row of rows) {
    if (row.group === undefined && row.cells.length !== head.length) throw new Error(`table ${name}: a row of ${row.cells.length} cells in a table of ${head.length} columns`);
  }
  const headers = data.columns.map(columnHeader);
  const repeated = headers.find((h, i) => headers.indexOf(h) !== i);
  if (repeated !== undefined) throw new Error(`table ${name}: the data column "${repeated}" appears twice`);
  for (const row of data.rows) {
    if (row.length !== data.columns.length) throw new Error(`table ${name}: a data row of ${row.length} values for ${data.columns.length} columns`);
  }
  return { ...spec };
}

/** The header of a data column: its name, and its unit in square brackets where it has one ("temperature [K]"). */
export function columnHeader(c: DataColumn): string {
  return c.unit === '' ? c.name : `${c.name} [${c.unit}]`;
}

/**
 * A table's HTML and CSV, kept by the rows and data they were made from, so that tables sharing
 * them (the same checks in every document of a build, lib/report/sections/verification.ts) have
 * them made once. A table is never changed once made (only its link and HTML are set on it), and
 * the entries go with the rows and data.
 */
const htmlMade = new WeakMap<readonly TableRow[], { head: readonly string[]; align: readonly Align[]; html: TableHtml }>();
const csvMade = new WeakMap<TableData, string>();

/** The table's data as a CSV file (lib/core/csv.ts): the header row names each column with its unit. */
export function tableCsv(t: Table): string {
  let text = csvMade.get(t.data);
  if (text === undefined) {
    text = csvText(t.data.columns.map(columnHeader), t.data.rows);
    csvMade.set(t.data, text);
  }
  return text;
}

/** One number, text or flag of a row of a pairs or cross table, with the column it takes in the data. */
export interface Datum {
  name: string;
  unit: string;
  value: DataValue;
}

/** A label and value row: the label, the value as shown, and the raw values behind it (one, or several for "a / b"). */
export interface Pair {
  label: string;
  text: string;
  data: Datum[];
}

/** A pair of one quantity: shown as `text`, in the data as `value` in `unit` under the label. */
export function quantity(label: string, value: DataValue, unit: string, text: string): Pair {
  return { label, text, data: [{ name: label, unit, value }] };
}

/** A pair shown as text whose data is the text itself. */
export function textPair(label: string, text: string): Pair {
  return quantity(label, text, '', text);
}

/** Label and value rows (two columns): numbers right-aligned, or text left-aligned. The data is one row, a column per datum. */
export function pairsTable(name: string, title: string, pairs: readonly Pair[], head: [string, string] = ['Quantity', 'Value'], values: Align = 'right'): Table {
  const data = pairs.flatMap((p) => p.data);
  return table({
    name,
    title,
    head: [...head],
    align: ['left', values],
    rows: pairs.map((p) => ({ cells: [p.label, p.text] })),
    data: { columns: data.map(({ name: n, unit }) => ({ name: n, unit })), rows: [data.map((d) => d.value)] },
  });
}

/** A value of an item in the data: its column and how to read it. */
export interface ItemDatum<T> {
  name: string;
  unit: string;
  value(item: T): DataValue;
}

/** A row of a cross table: a quantity across the items, or a group row. */
export type CrossRow<T> = { label: string; text(item: T): string; data: ItemDatum<T>[] } | { group: string };

export interface CrossSpec<T> {
  name: string;
  title: string;
  items: readonly T[];
  /** The item's name: the head of its display column and the first field of its data row. */
  itemName(item: T): string;
  /** The name of the data column holding the item's name ("stream"). */
  itemColumn: string;
  rows: readonly CrossRow<T>[];
}

/** One display column per item, a row per quantity; the data has one row per item, a column per quantity. */
export function crossTable<T>(spec: CrossSpec<T>): Table {
  const { items, rows } = spec;
  const data = rows.flatMap((r) => ('group' in r ? [] : r.data));
  return table({
    name: spec.name,
    title: spec.title,
    head: ['', ...items.map(spec.itemName)],
    align: ['left', ...items.map(() => 'right' as const)],
    rows: rows.map((r) => ('group' in r ? { group: r.group, cells: [] } : { cells: [r.label, ...items.map(r.text)] })),
    data: {
      columns: [{ name: spec.itemColumn, unit: '' }, ...data.map(({ name: n, unit }) => ({ name: n, unit }))],
      rows: items.map((item) => [spec.itemName(item), ...data.map((d) => d.value(item))]),
    },
  });
}

/** A column of a records table: its head, alignment and cell on the page, and its columns in the data. */
export interface RecordColumn<T> {
  head: string;
  align: Align;
  text(item: T): string;
  data: ItemDatum<T>[];
}

export interface RecordsSpec<T> {
  name: string;
  title: string;
  columns: readonly RecordColumn<T>[];
  /** The items, in groups headed by a group row (a group without a title has no row of its own). */
  groups: readonly { title?: string; items: readonly T[] }[];
  flag?(item: T): boolean;
}

/** One row per item on the page and in the data. */
export function recordsTable<T>(spec: RecordsSpec<T>): Table {
  const { columns } = spec;
  const data = columns.flatMap((c) => c.data);
  const rows: TableRow[] = [];
  for (const g of spec.groups) {
    if (g.title !== undefined && g.items.length) rows.push({ group: g.title, cells: [] });
    for (const item of g.items) rows.push({ cells: columns.map((c) => c.text(item)), ...(spec.flag?.(item) ? { flag: true } : {}) });
  }
  return table({
    name: spec.name,
    title: spec.title,
    head: columns.map((c) => c.head),
    align: columns.map((c) => c.align),
    rows,
    data: {
      columns: data.map(({ name: n, unit }) => ({ name: n, unit })),
      rows: spec.groups.flatMap((g) => g.items.map((item) => data.map((d) => d.value(item)))),
    },
  });
}

/** A cell's text; as in the templates (undefined output throws), a missing cell is an error, not the word "undefined". */
function shown(text: string | null | undefined): string {
  if (text === undefined || text === null) throw new Error(`a table cell is ${text}`);
  return String(text);
}

/** The class of a column's cells, by its alignment. */
const cellClass = (align: Align | undefined): string => (align === 'right' ? 'num' : 'txt');

/**
 * The header cells and the body rows of a table as HTML, every text escaped as the templates'
 * autoescaping does (escapeHtml): what the dataTable macro showed with a Nunjucks loop per row
 * and per cell, made here in one pass because those loops were the largest part of a page's
 * render (each iteration a scope of its own in Nunjucks). test/report/view-html.test.ts checks it
 * byte for byte against that loop. A body row is indented by four spaces and ends in a newline.
 */
export function tableHtml(t: Table): TableHtml {
  const made = htmlMade.get(t.rows);
  if (made && made.head === t.head && made.align === t.align) return made.html;
  const html = rowsHtml(t);
  htmlMade.set(t.rows, { head: t.head, align: t.align, html });
  return html;
}

/** tableHtml's work: the header cells and the body rows, escaped. */
function rowsHtml(t: Table): TableHtml {
  let head = '';
  t.head.forEach((h, i) => (head += `<th scope="col" class="${cellClass(t.align[i])}">${escapeHtml(shown(h))}</th>`));
  const classes = t.align.map(cellClass);
  let body = '';
  for (const row of t.rows) {
    if (row.group) {
      body += `    <tr class="group"><th colspan="${t.head.length}" scope="colgroup">${escapeHtml(row.group)}</th></tr>\n`;
      continue;
    }
    body += row.flag ? '    <tr class="flag">' : '    <tr>';
    row.cells.forEach((c, i) => (body += `<td class="${classes[i] ?? 'txt'}">${escapeHtml(shown(c))}</td>`));
    body += '</tr>\n';
  }
  return { head: trustedHtml(head), body: trustedHtml(body) };
}
