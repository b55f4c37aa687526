// Section 9 shows the reference table of lib/verification/reference-checks.yaml as published:
// the published value with the digits the table gives (Larminie and Dicks, Fuel Cell Systems
// Explained, Table 2.2: 1.17 V at 100 °C), species with subscripts and units as printed.
import { describe, expect, it } from 'vitest';
import { runAllChecks } from '../../lib/verification/checks.ts';
import { verificationSection } from '../../lib/report/sections/verification.ts';

const section = verificationSection(runAllChecks(), '0.1.0', '0.1.0');
const row = (id: string) => section.table.rows.find((r) => r.cells[0] === id)!.cells;

describe('the verification table', () => {
  it('shows a published value with the digits it is published with, not padded to the computed one', () => {
    expect(row('EC-02')[3]).toBe('1.17 V');
    expect(row('TH-01')[3]).toBe('−241.826 kJ/mol');
    expect(row('EC-02')[2]).toMatch(/^1\.\d{5} V$/);
  });

  it('writes the species of a quantity and its source with subscripts, and a unit such as bar^2 as bar²', () => {
    expect(row('TH-01')[1]).toBe('ΔfH° of H₂O(g) at 298.15 K');
    expect(row('EC-02')[1]).toBe('reversible voltage of H₂ + ½O₂ → H₂O(g) at 100 °C');
    expect(row('EQ-05')[3]).toBe('0.0303 bar²');
    expect(row('TH-01')[6]).toContain('H₂O ideal-gas table');
    for (const r of section.table.rows) for (const cell of r.cells.slice(1, 4)) expect(cell, r.cells[0]).not.toMatch(/\^|_/);
  });

  it('keeps the tolerance whole: "(±" and its number are joined by a no-break space, so a wrapped column never ends a line on ±', () => {
    for (const r of section.table.rows) expect(r.cells[4], r.cells[0]).toMatch(/ \(±\u00a0[^ ]/);
    expect(row('TH-01')[4]).toMatch(/^0\.\d+ \(±\u00a00\.050\)$/); // TH-01's tolerance is 0.05 kJ/mol (reference-checks.yaml)
  });
});
