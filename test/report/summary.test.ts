// The findings in the summary of conclusions (lib/report/sections/summary.ts): every finding of
// the results and every warning of the basis check, each with its severity in words, its basis
// field and the assumptions that bear on it; "No findings" only where there are none; and the
// conclusions saying so where a confirmed assumption is contradicted.
import { describe, expect, it } from 'vitest';
import { parse } from 'csv-parse/sync';
import { summarySection } from '../../lib/report/sections/summary.ts';
import { tableCsv } from '../../lib/report/table.ts';
import { runAllChecks } from '../../lib/verification/checks.ts';
import { scaffoldCase } from '../helpers/scaffold-cases.ts';

const checks = runAllChecks();

describe('the findings of a PEM electrolyser whose water loop cannot carry its heat, against a confirmed assumption that it does', () => {
  // The scaffold's loop circulates 250 times the water split; at a 4 % conversion it circulates 25
  // times, and carries about a tenth of the stack heat at the 5 K rise.
  const c = scaffoldCase('pem', 'electrolysis', (y) =>
    y
      .replace(/steam-conversion: 0\.004 /, 'steam-conversion: 0.04 ')
      .replace('isothermal at the operating temperature., open: false }', 'isothermal at the operating temperature., open: false, concerns: [conditions.allowed-air-temperature-rise] }'),
  );
  const s = summarySection(c.results, c.basis, c.results.hazards, checks);

  it('lists the contradicted assumption first, as critical, then the water loop, as a warning, each with its field and assumptions', () => {
    expect(s.findings.map((f) => [f.severity, f.origin, f.field])).toEqual([
      ['Critical', 'calculation: assumption-contradicted', 'assumptions.0.open'],
      ['Warning', 'calculation: water-loop-short', 'operating-point.steam-conversion'],
    ]);
    expect(s.findings[1]!.assumptions).toBe('A1 (confirmed)');
    expect(s.findings[1]!.related).toBe('conditions.allowed-air-temperature-rise');
    expect(s.findings[1]!.text).toMatch(/carries only \d+ % of the stack heat/);
    expect(s.findingsCount).toBe('2 findings: 1 critical, 1 warning.');
  });

  it('gives the findings\' data as the CSV of a table, a record per finding with its severity, code, fields and assumptions', () => {
    const t = s.findingsTable;
    expect(t.name).toBe('findings');
    const rows = parse(tableCsv(t), { record_delimiter: '\r\n' }) as string[][];
    expect(rows[0]).toEqual(['Severity', 'Source', 'Code', 'Field', 'Finding', 'Also concerns', 'Assumptions']);
    expect(rows.slice(1).map((r) => [r[0], r[1], r[2], r[3], r[5], r[6]])).toEqual([
      ['Critical', 'calculation', 'assumption-contradicted', 'assumptions.0.open', s.findings[0]!.related, s.findings[0]!.assumptions],
      ['Warning', 'calculation', 'water-loop-short', 'operating-point.steam-conversion', 'conditions.allowed-air-temperature-rise', 'A1 (confirmed)'],
    ]);
    expect(rows[2]![4]).toBe(s.findings[1]!.text);
  });

  it('concludes that the design must change and that the results contradict A1', () => {
    expect(s.conclusions[0]).toMatch(/^The calculation raises 1 critical finding \(below\)/);
    expect(s.conclusions.join(' ')).toMatch(/The results contradict the confirmed assumption A1 \(findings below\)\./);
  });
});

it('says "No findings" only where the calculation and the basis check raise none', () => {
  const c = scaffoldCase('solid-oxide', 'power');
  expect(c.results.findings).toEqual([]);
  expect(c.basis.warnings).toEqual([]);
  const s = summarySection(c.results, c.basis, c.results.hazards, checks);
  expect(s.findings).toEqual([]);
  expect(s.findingsCount).toMatch(/^No findings/);
  // The findings' CSV is still offered: its header, and no records.
  expect(s.findingsTable.data.rows).toEqual([]);
});

it('puts the highest local current density and the inlet value with its kind in the headline', () => {
  const c = scaffoldCase('pem', 'electrolysis');
  expect(c.results.fuelPath.inlet).toBe('limit');
  const rows = summarySection(c.results, c.basis, c.results.hazards, checks).headline.rows.map((r) => r.cells);
  const inlet = rows.find((r) => r[0]!.startsWith('Nernst voltage, inlet'))!;
  expect(inlet[1]).toMatch(/\(limit u → 0⁺: no feed on one electrode\)/);
  expect(rows.find((r) => r[0]!.startsWith('Local current density, mean / highest'))).toBeDefined();
});
