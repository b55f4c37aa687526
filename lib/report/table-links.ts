/**
 * The CSV link of every table of a document. Each table built with lib/report/table.ts carries
 * its data; here the finished view is searched for its tables (any plain object with a header,
 * rows and data, in document order), their names are checked to be unique in the document, and
 * each gets the link its page shows under it:
 *   files   `tables/<name>.csv` beside the page, which the site writes (lib/publish/table-files.ts);
 *   inline  the CSV itself as a data: URI, for a document that must stand alone (a sealed
 *           document.html has nothing beside it).
 * A table added to the view is linked and written without more work.
 */
import { tableCsv, tableHtml, type Table } from './table.ts';

export type TableLinks = 'files' | 'inline';

/** The folder beside a page that holds the CSV files of its tables. */
const TABLE_FOLDER = 'tables';

function isTable(value: unknown): value is Table {
  if (typeof value !== 'object' || value === null) return false;
  const t = value as Partial<Table>;
  return typeof t.name === 'string' && Array.isArray(t.head) && Array.isArray(t.rows) && typeof t.data === 'object' && t.data !== null && Array.isArray(t.data.columns);
}

function plain(value: unknown): value is Record<string, unknown> {
  if (typeof value !== 'object' || value === null) return false;
  const proto = Object.getPrototypeOf(value);
  return proto === Object.prototype || proto === null;
}

/** Every table of a view model, in the order of its properties (the document's order); throws on two tables of one name. */
export function tablesOf(view: unknown): Table[] {
  const found: Table[] = [];
  const seen = new Set<unknown>();
  const visit = (value: unknown): void => {
    // Numbers and strings (most of a view: charts' data) hold no table.
    if (typeof value !== 'object' || value === null || seen.has(value)) return;
    if (isTable(value)) {
      seen.add(value);
      found.push(value);
      return;
    }
    if (Array.isArray(value)) {
      seen.add(value);
      value.forEach(visit);
    } else if (plain(value)) {
      seen.add(value);
      Object.values(value).forEach(visit);
    }
  };
  visit(view);
  const names = found.map((t) => t.name);
  const twice = names.find((n, i) => names.indexOf(n) !== i);
  if (twice !== undefined) throw new Error(`two tables of the document are named "${twice}"`);
  return found;
}

/** The site path of a table's CSV file beside the page at `pagePath` ("projects/x/index.html"). */
export function tableFilePath(pagePath: string, t: Table): string {
  return `${tableFolder(pagePath)}${t.name}.csv`;
}

/** The folder, with its closing slash, of a page's CSV files: `<page's folder>/tables/`. */
export function tableFolder(pagePath: string): string {
  const folder = pagePath.includes('/') ? pagePath.slice(0, pagePath.lastIndexOf('/') + 1) : '';
  return `${folder}${TABLE_FOLDER}/`;
}

/** The tables linkTables found in each view, so that the site writing their files need not walk the view again. */
const linked = new WeakMap<object, Table[]>();

/** Every table of a view model whose tables were linked (linkTables), else found now (tablesOf). */
export function linkedTables(view: object): Table[] {
  return linked.get(view) ?? tablesOf(view);
}

/**
 * Gives every table of `view` its CSV link (`download` is the name a browser saves it under,
 * `<prefix>-<name>.csv`) and its rows as HTML for the page (tableHtml). Returns the tables.
 */
export function linkTables(view: object, mode: TableLinks, prefix: string): Table[] {
  const tables = tablesOf(view);
  linked.set(view, tables);
  for (const t of tables) {
    t.csv = {
      href: mode === 'files' ? `${TABLE_FOLDER}/${t.name}.csv` : `data:text/csv;charset=utf-8,${encodeURIComponent(tableCsv(t))}`,
      download: `${prefix}-${t.name}.csv`,
      text: `Download as CSV: ${t.title}`,
    };
    t.html = tableHtml(t);
  }
  return tables;
}
