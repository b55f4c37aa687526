// Efficiencies stated on their basis (issue 17 item 4): a figure above 100 % says why beside the
// number. Facts: a steam-fed electrolyser near thermoneutral exceeds 100 % on HHV over electricity
// alone, since the HHV counts the water's latent heat (44.0 kJ/mol at 25 °C, NIST; from memory),
// which the steam brings (e.g. Larminie & Dicks, Fuel Cell Systems Explained, 2nd ed., §2.4 on
// heating-value bases); −ΔG(T)/LHV exceeds 1 where the oxidation gains entropy (C + ½O2 → CO).
import { describe, expect, it } from 'vitest';
import { figureTables } from '../../lib/report/sections/results-tables.ts';
import { efficiencyBasisNotes } from '../../lib/report/efficiency-basis.ts';
import { documentText, scaffoldCase } from '../helpers/scaffold-cases.ts';

function efficiencyRows(technology: 'solid-oxide' | 'pem', mode: 'power' | 'electrolysis'): string {
  const r = scaffoldCase(technology, mode).results;
  return JSON.stringify(figureTables(r).find((t) => t.id === 'figures-efficiency'));
}

describe('efficiency figures on their basis', () => {
  it('a solid oxide electrolyser: the HHV figure over electricity alone says why it exceeds 100 % and gives the heat-counted one', () => {
    const r = scaffoldCase('solid-oxide', 'electrolysis').results;
    expect(r.efficiency.electrolysisEfficiencyHhv!).toBeGreaterThan(1);
    const note = efficiencyBasisNotes(r).electrolysisEfficiencyHhv!;
    expect(note).toMatch(/^over electricity alone; above 100 % because .*latent heat the steam feed brings, which the HHV counts/);
    expect(note).toMatch(/with that heat counted the efficiency is \d+\.?\d* %/);
    const rows = efficiencyRows('solid-oxide', 'electrolysis');
    expect(rows).toContain('Electrolysis efficiency over electricity alone, HHV');
    expect(rows).toContain('Electrolysis efficiency with the heat supplied counted, HHV');
    expect(rows).not.toMatch(/"Electrolysis efficiency, HHV"/);
  });

  it('the summary names the electrolysis figures over electricity alone, says why HHV exceeds 100 %, and gives the heat-counted pair', () => {
    const t = documentText('solid-oxide', 'electrolysis');
    expect(t).toContain('Specific electric energy / efficiency over electricity alone, LHV / HHV');
    expect(t).toContain('(HHV over electricity alone; above 100 % because');
    expect(t).toContain('Efficiency with the heat supplied counted, LHV / HHV');
  });

  it('a figure at or below 100 % carries no note', () => {
    const r = scaffoldCase('pem', 'power').results;
    expect(r.efficiency.thermodynamicLimitLhv!).toBeLessThan(1);
    expect(efficiencyBasisNotes(r)).toEqual({});
  });
});
