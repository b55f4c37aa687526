// Electrolysis efficiencies on their basis (issue 17 item 4): the electricity-only figures, the
// heat-inclusive ones, and co-electrolysis charged with its whole syngas. Hand values from the
// NIST-JANAF / CODATA heats of formation (from memory): LHV of H2 241.826 kJ/mol, HHV 285.830,
// the latent heat of water at 25 °C 44.004 kJ/mol, LHV of CO 282.984 and of CH4 802.3 kJ/mol;
// F = 96485.33212 C/mol (CODATA 2018). The figures were recomputed outside the repository.
import { describe, expect, it } from 'vitest';
import { electrolysisEfficiency } from '../../lib/plant/efficiency.ts';
import { FARADAY_C_PER_MOL as F } from '../../lib/thermo/constants.ts';
import { scaffoldCase } from '../helpers/scaffold-cases.ts';

const P = 2 * F * 1.3; // 1 mol/s of H2 at 1.3 V: 250 861.9 W

describe('electrolysis efficiency on its basis', () => {
  it('steam electrolysis at the thermoneutral point: 114 % on HHV by electricity only, 96.9 % with the latent heat of the steam counted', () => {
    const e = electrolysisEfficiency({ producedMolPerS: { H2: 1, O2: 0.5, H2O: -1 }, powerInW: P, isothermalHeatW: 0, meanNernstV: 1.0, cellVoltageV: 1.3 });
    // 285.830 / 250.862 = 1.13939 and 241.826 / 250.862 = 0.96398 (species data within 0.01 % of the NIST values).
    expect(e.efficiencyHhv).toBeCloseTo(1.13939, 3);
    expect(e.efficiencyLhv).toBeCloseTo(0.96398, 3);
    // The steam brings 44.0 kW of latent heat the HHV counts: 285.830 / (250.862 + 44.004) = 0.96936.
    expect(e.steamLatentHeatW).toBeCloseTo(44004, -1);
    expect(e.heatInclusiveEfficiencyHhv).toBeCloseTo(0.96936, 3);
    expect(e.heatInclusiveEfficiencyHhv).toBeLessThan(1);
  });

  it('liquid water below thermoneutral: the heat absorbed is counted, and at V_tn = HHV/2F the heat-inclusive HHV figure is 1', () => {
    // V_tn of liquid water at 25 °C: 285.830 kJ/mol / 2F = 1.48118 V; at 1.3 V the stack absorbs 2F (1.48118 − 1.3) = 34.96 kW.
    const demand = 2 * F * (285830 / (2 * F) - 1.3);
    const e = electrolysisEfficiency({ producedMolPerS: { H2: 1, O2: 0.5, 'H2O(L)': -1 }, powerInW: P, isothermalHeatW: -demand, meanNernstV: 1.2, cellVoltageV: 1.3 });
    expect(e.efficiencyHhv).toBeGreaterThan(1.13);
    expect(e.heatDemandW).toBeCloseTo(demand, 6);
    expect(e.steamLatentHeatW).toBe(0);
    expect(e.heatInclusiveEfficiencyHhv).toBeCloseTo(1, 3);
  });

  it('co-electrolysis charges its energy to the syngas: H2, CO and the methane formed, each by its heating value', () => {
    const e = electrolysisEfficiency({ producedMolPerS: { H2: 0.7, CO: 0.25, CH4: 0.01, H2O: -0.72, CO2: -0.26, O2: 0.5 }, powerInW: P, isothermalHeatW: 0, meanNernstV: 1.0, cellVoltageV: 1.3 });
    // 0.7 × 241.826 + 0.25 × 282.984 + 0.01 × 802.3 = 248.047 kW.
    expect(e.productLhvW / 1000).toBeCloseTo(248.047, 0);
    expect(e.efficiencyLhv).toBeCloseTo(248047 / P, 3);
  });

  it('the solid oxide electrolyser scaffold: above 100 % on HHV by electricity only, below it with the heat counted, both in the results', () => {
    const r = scaffoldCase('solid-oxide', 'electrolysis').results;
    expect(r.efficiency.electrolysisEfficiencyHhv!).toBeGreaterThan(1);
    expect(r.efficiency.heatInclusiveEfficiencyHhv!).toBeLessThan(1);
    expect(r.efficiency.heatInclusiveEfficiencyLhv!).toBeLessThanOrEqual(r.efficiency.electrolysisEfficiencyLhv!);
  });
});

describe('heat demand of a liquid-water electrolyser below thermoneutral', () => {
  it('a PEM electrolyser at 1.45 V, below V_tn ≈ 1.48 V of liquid water (HHV/2F at 25 °C, a fact of the trade), gets the heat-demand finding the steam-fed ones get', () => {
    const c = scaffoldCase('pem', 'electrolysis', (y) => y.replace(/cell-voltage: "[^"]*"/, 'cell-voltage: "1.45 V"'));
    const r = c.results;
    expect(r.heat.isothermalHeat_W).toBeLessThan(0);
    const demand = r.findings.filter((f) => f.code === 'heat-demand');
    expect(demand).toHaveLength(1);
    expect(demand[0]!.message).toContain(`absorbs ${(-r.heat.isothermalHeat_W / 1000).toPrecision(4)} kW of heat`);
    expect(demand[0]!.message).toContain('heated water or lye loop');
  });
});
