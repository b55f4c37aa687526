// Every table of a document is downloadable as CSV (issue 21, item 5): the page links each
// table's CSV under it; the site writes the files beside the page (tables/<name>.csv), the bytes
// of the table's data; a standalone document carries them inline as data: URIs. Each file is read
// back by an RFC 4180 parser of its own (csv-parse): a header row naming every column, units in
// square brackets, and numbers that are the results' own doubles (shortest round-trip decimals).
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { parse } from 'csv-parse/sync';
import { documentView } from '../../lib/report/document.ts';
import { tablesOf } from '../../lib/report/table-links.ts';
import { tableCsv } from '../../lib/report/table.ts';
import { writeTableFiles } from '../../lib/publish/table-files.ts';
import { renderView } from '../../lib/publish/render.ts';
import { scaffoldCase } from '../helpers/scaffold-cases.ts';

const read = (text: string) => parse(text, { record_delimiter: '\r\n' }) as string[][];

describe('the CSV files of a document', () => {
  const c = scaffoldCase('solid-oxide', 'power');
  const input = { basis: c.basis, results: c.results, revision: { kind: 'draft' as const, revision: 'A', lastIssued: null, date: null }, history: [] };
  const out = mkdtempSync(join(tmpdir(), 'cellbasis-tables-'));
  afterAll(() => rmSync(out, { recursive: true, force: true }));

  it('are written beside the page, one per table, each the bytes of its table and linked from the page', () => {
    const view = documentView(input, { assetBase: '../../assets/', pagePath: 'projects/p1/index.html' });
    const tables = tablesOf(view);
    const names = tables.map((t) => t.name);
    // The tables item 5 names: inputs, streams, results, hazards and the charts' data (the page shows
    // the cautions as blocks, not a table; `hazards --csv` prints them as one).
    expect(names).toEqual(expect.arrayContaining(['inputs', 'streams', 'headline', 'efficiency', 'heat', 'substances', 'hazard-streams', 'polarisation', 'sensitivity-efficiency']));
    const files = writeTableFiles(out, view);
    expect(files).toHaveLength(tables.length);
    const html = renderView(view);
    for (const t of tables) {
      const file = join(out, 'projects', 'p1', 'tables', `${t.name}.csv`);
      const text = readFileSync(file, 'utf8');
      expect(text, t.name).toBe(tableCsv(t));
      const [head, ...rows] = read(text);
      expect(head!.length, t.name).toBe(t.data.columns.length);
      expect(rows.length, t.name).toBe(t.data.rows.length);
      expect(t.csv!.download, t.name).toBe(`${c.results.project.id}-${t.name}.csv`);
      // includes, not toContain: a failure would print the whole page.
      expect(html.includes(`href="tables/${t.name}.csv" download="${t.csv!.download}"`), t.name).toBe(true);
    }
  });

  it('hold numbers, not formatted text: the streams file gives back the results\' doubles', () => {
    const view = documentView(input, { assetBase: '', pagePath: 'projects/p1/index.html' });
    const streams = tablesOf(view).find((t) => t.name === 'streams')!;
    const [head, ...rows] = read(tableCsv(streams));
    const col = (name: string) => head!.indexOf(name);
    expect(col('Enthalpy flow [W]')).toBeGreaterThan(0);
    for (const [i, s] of c.results.streams.entries()) {
      expect(Number(rows[i]![col('Temperature [K]')])).toBe(s.temperature_K);
      expect(Number(rows[i]![col('Mass flow [kg/h]')])).toBe(s.massFlow_kg_per_h);
      expect(Number(rows[i]![col('Enthalpy flow [W]')])).toBe(s.enthalpyFlow_W);
      // No digit grouping, unicode minus or unit inside a field.
      for (const field of rows[i]!.slice(1)) expect(field).toMatch(/^(|-?\d+(\.\d+)?(e[+-]\d+)?)$/);
    }
  });

  it('travel inline in a standalone document: each link a data: URI of the same CSV', () => {
    const view = documentView(input, { assetBase: '', tables: 'inline' });
    for (const t of tablesOf(view)) {
      expect(t.csv!.href.startsWith('data:text/csv;charset=utf-8,'), t.name).toBe(true);
      expect(decodeURIComponent(t.csv!.href.slice('data:text/csv;charset=utf-8,'.length)), t.name).toBe(tableCsv(t));
    }
  });
});
