// The electrochemistry table of section 6 (and of `calc --section electrochemistry`) must name the
// number it shows. effectiveNernst_V is the area-mean driving voltage t_ion Ē_A − ΔV_x (Eq. 16 of
// the method: V = Ē_A − ΔV_x − j ASR for the uniform-voltage cell), which differs from the
// charge mean Ē wherever E falls along the cell. Independent recomputation of the CHP demo
// (NASA Glenn data, own Gibbs minimiser, Simpson's rule; /tmp script, not the project's code):
// Ē = 0.951194 V, and the uniform-voltage root V + ΔV_x = 0.797521 V, so t Ē_A − ΔV_x = V + j ASR
// = 0.782521 + 0.35 × 0.42 = 0.929521 V, while t Ē − ΔV_x would be 0.936194 V.
// That was with the ambient humidity converted at the 1.10 bar air electrode (1.085 % water); at
// the ambient pressure where it is stated (1.178 %) the cathode O2 is diluted by
// (1 − 0.011784)/(1 − 0.010855), and E(u) falls by RT/4F times the log of the ratio of the O2
// fractions along the path (2.07e-5 V at the inlet; the shifted profile agrees with the project's
// to 1e-15 V): Ē = 0.951173 V, V = 0.782500 V, V + j ASR = 0.929500 V, t Ē − ΔV_x = 0.936173 V
// (/tmp script: trapezoid rule and the closed-form uniform-voltage law).
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { loadBasisText } from '../../lib/basis/load.ts';
import { calculate } from '../../lib/plant/calculate.ts';
import { figureTables } from '../../lib/report/sections/results-tables.ts';
import { scaffoldCase } from '../helpers/scaffold-cases.ts';
import type { Results } from '../../lib/plant/results-schema.ts';

function demo(id: string): Results {
  const loaded = loadBasisText(readFileSync(new URL(`../../projects/${id}/basis.yaml`, import.meta.url), 'utf8'), `projects/${id}/basis.yaml`, id);
  if (!loaded.ok) throw new Error(id);
  return calculate(loaded.basis);
}

/** The label of the electrochemistry table's row that shows effectiveNernst_V. */
function drivingRow(r: Results): string {
  const t = figureTables(r).find((f) => f.id === 'figures-electrochemistry')!.table;
  const k = t.data.columns.findIndex((c, i) => c.unit === 'V' && t.data.rows[0]![i] === r.electrochemistry.effectiveNernst_V);
  return t.rows[k]!.cells[0]!;
}

describe('the driving voltage of the electrochemistry table', () => {
  it('CHP demo: the value is V + j ASR = 0.929500 V, the area mean (not t Ē − ΔV_x = 0.936173 V), and the label says so', () => {
    const r = demo('thistlemere-sofc-chp');
    const e = r.electrochemistry;
    expect(e.effectiveNernst_V).toBeCloseTo(0.9295, 5);
    expect(e.effectiveNernst_V).toBeCloseTo(r.headline.cellVoltage_V + e.ionicCurrentDensity_A_per_m2 * e.areaSpecificResistance_ohm_m2, 12);
    expect(e.ionicTransferenceNumber * r.headline.meanNernst_V - e.crossoverAllowance_V - e.effectiveNernst_V).toBeGreaterThan(0.006);
    const label = drivingRow(r);
    expect(label).toMatch(/area-mean Nernst voltage Ē_A/);
    expect(label).not.toMatch(/× Ē −/);
  });

  it.each([
    ['solid-oxide', 'electrolysis'],
    ['proton-ceramic', 'electrolysis'],
  ] as const)('%s %s: t_ion Ē_A, not the charge mean Ē', (technology, mode) => {
    const r = scaffoldCase(technology, mode).results;
    const e = r.electrochemistry;
    expect(e.effectiveNernst_V).toBeCloseTo(e.ionicTransferenceNumber * e.areaMeanNernst_V, 12);
    const label = drivingRow(r);
    expect(label).toMatch(/area-mean Nernst voltage Ē_A/);
    expect(label).not.toMatch(/^Mean Nernst voltage Ē$/);
  });
});
