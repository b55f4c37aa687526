// A document's tables reach the page as HTML made by lib/report/table.ts (tableHtml), no longer
// by a Nunjucks loop per row and per cell in the dataTable macro. The reference is that loop
// itself, kept here exactly as templates/_includes/macros.njk had it, rendered with the site's
// own Nunjucks environment (autoescaping on): every table of the document of every demo
// (projects/*) and of two scaffolds must come out byte for byte the same, and so must tables
// made to hold every character the escaping changes, group rows, flags and empty bodies.
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { loadBasisText } from '../../lib/basis/load.ts';
import type { DesignBasis } from '../../lib/basis/types.ts';
import { calculate } from '../../lib/plant/calculate.ts';
import { documentView } from '../../lib/report/document.ts';
import { tableHtml, type Table } from '../../lib/report/table.ts';
import { linkedTables } from '../../lib/report/table-links.ts';
import { nunjucksEnvironment } from '../../lib/publish/nunjucks-env.ts';
import { PACKAGE_ROOT } from '../../lib/publish/paths.ts';
import { basisFrom } from '../helpers/scaffold-basis.ts';

/** The head and body loops of the dataTable macro before tableHtml, verbatim (trimBlocks and lstripBlocks as the environment sets them). */
const LOOP = `<thead><tr>{% for h in t.head %}<th scope="col" class="{{ 'num' if t.align[loop.index0] == 'right' else 'txt' }}">{{ h }}</th>{% endfor %}</tr></thead>
  <tbody>
  {% for row in t.rows %}
    {% if row.group %}
    <tr class="group"><th colspan="{{ t.head | length }}" scope="colgroup">{{ row.group }}</th></tr>
    {% else %}
    <tr{% if row.flag %} class="flag"{% endif %}>{% for c in row.cells %}<td class="{{ 'num' if t.align[loop.index0] == 'right' else 'txt' }}">{{ c }}</td>{% endfor %}</tr>
    {% endif %}
  {% endfor %}
  </tbody>`;

const byLoop = (t: Table): string => nunjucksEnvironment().renderString(LOOP, { t });
const byTableHtml = (t: Table): string => {
  const html = tableHtml(t);
  return `<thead><tr>${html.head.html}</tr></thead>\n  <tbody>\n${html.body.html}  </tbody>`;
};

function tablesOfDocument(basis: DesignBasis): Table[] {
  const view = documentView({ basis, results: calculate(basis), revision: { kind: 'draft', revision: 'A', lastIssued: null, date: null }, history: [] }, { assetBase: '../../assets/' });
  return linkedTables(view);
}

describe('tables as HTML (tableHtml)', () => {
  it('are byte for byte what the Nunjucks loop made, for every table of every demo and of two scaffolds', () => {
    const tables: Table[] = [];
    for (const id of readdirSync(join(PACKAGE_ROOT, 'projects'))) {
      const loaded = loadBasisText(readFileSync(join(PACKAGE_ROOT, 'projects', id, 'basis.yaml'), 'utf8'), `projects/${id}/basis.yaml`, id);
      if (!loaded.ok) throw new Error(`${id}: ${loaded.errors.map((e) => e.message).join('; ')}`);
      tables.push(...tablesOfDocument(loaded.basis));
    }
    tables.push(...tablesOfDocument(basisFrom('solid-oxide', 'power')), ...tablesOfDocument(basisFrom('pem', 'electrolysis')));
    // Some thirty tables a document: a handful would mean the views were not searched.
    expect(tables.length).toBeGreaterThan(100);
    expect(tables.some((t) => t.rows.some((r) => r.group))).toBe(true);
    expect(tables.some((t) => t.rows.some((r) => r.flag))).toBe(true);
    const differing = tables.filter((t) => byTableHtml(t) !== byLoop(t)).map((t) => t.name);
    expect(differing).toEqual([]);
    // The view hands each table its HTML with its CSV link (linkTables).
    expect(tables.every((t) => t.html !== undefined)).toBe(true);
  });

  it('escape as the templates do, and show group rows, flags, empty groups and empty bodies as the loop did', () => {
    const hostile = `<script>alert("x")</script> & 'quoted' \\ back`;
    const cases: Table[] = [
      { name: 'a', title: 'A', head: [hostile, 'B'], align: ['left', 'right'], rows: [{ group: hostile, cells: [] }, { cells: [hostile, '1 & 2'], flag: true }, { group: '', cells: ['x', 'y'] }], data: { columns: [], rows: [] } },
      { name: 'b', title: 'B', head: ['only'], align: ['right'], rows: [], data: { columns: [], rows: [] } },
      { name: 'c', title: 'C', head: ['p', 'q', 'r'], align: ['right', 'left', 'right'], rows: [{ cells: ['1', '', '3'], flag: false }], data: { columns: [], rows: [] } },
    ];
    for (const t of cases) expect(byTableHtml(t)).toBe(byLoop(t));
    expect(byTableHtml(cases[0]!)).toContain('&lt;script&gt;alert(&quot;x&quot;)&lt;/script&gt; &amp; &#39;quoted&#39; &#92; back');
  });

  it('refuses a missing cell, as the templates refuse undefined output', () => {
    const t = { name: 'a', title: 'A', head: ['x'], align: ['left'], rows: [{ cells: [undefined] }], data: { columns: [], rows: [] } } as unknown as Table;
    expect(() => tableHtml(t)).toThrow(/a table cell is undefined/);
    expect(() => byLoop(t)).toThrow();
  });
});
