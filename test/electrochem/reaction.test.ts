// Reaction properties: consistency with thermodynamic identities (van 't Hoff, Gibbs-Helmholtz)
// and the Nernst equation (ΔG = ΔG° + RT ln Q, e.g. Larminie & Dicks, Fuel Cell Systems
// Explained, 2nd ed., eq. 2.8).
import { describe, expect, it } from 'vitest';
import { evaluateReaction, lnEquilibriumConstant, nernstPotential } from '../../lib/electrochem/reaction.ts';
import { parseEquation } from '../../lib/electrochem/equation.ts';
import { FARADAY_C_PER_MOL, GAS_CONSTANT_J_PER_MOL_K } from '../../lib/thermo/constants.ts';

describe('reaction properties', () => {
  it('reversible voltage of H2 + ½O2 → H2O at 1000 K is 0.998 V', () => {
    expect(evaluateReaction('H2 + 0.5 O2 -> H2O', 1000).reversibleVoltage_V).toBeCloseTo(0.998, 3);
  });

  it("van 't Hoff: d ln K / dT = ΔH° / RT² (numerical derivative, 0.01 % agreement)", () => {
    for (const [text, t] of [['CO + H2O -> CO2 + H2', 900], ['CH4 + H2O -> CO + 3 H2', 1000], ['H2 + 1/2 O2 -> H2O', 1200]] as const) {
      const eq = parseEquation(text);
      const d = 0.05;
      const slope = (lnEquilibriumConstant(eq.terms, t + d) - lnEquilibriumConstant(eq.terms, t - d)) / (2 * d);
      const dH = evaluateReaction(text, t, 2).deltaH_J_per_mol;
      expect(slope / (dH / (GAS_CONSTANT_J_PER_MOL_K * t * t))).toBeCloseTo(1, 4);
    }
  });

  it('dE/dT = ΔS°/(nF) matches the numerical derivative of the reversible voltage', () => {
    const r = evaluateReaction('H2 + 0.5 O2 -> H2O', 1000);
    const numeric = (evaluateReaction('H2 + 0.5 O2 -> H2O', 1000.5).reversibleVoltage_V - evaluateReaction('H2 + 0.5 O2 -> H2O', 999.5).reversibleVoltage_V) / 1;
    expect(r.dEdT_V_per_K).toBeCloseTo(numeric, 8);
    expect(r.dEdT_V_per_K).toBeCloseTo(r.deltaS_J_per_mol_K / (2 * FARADAY_C_PER_MOL), 12);
  });

  it('electrons default to 4 per O2 (8 for methane) and can be overridden', () => {
    expect(evaluateReaction('CH4 + 2 O2 -> CO2 + 2 H2O', 298.15).electrons).toBe(8);
    expect(evaluateReaction('CO + 1/2 O2 -> CO2', 298.15).electrons).toBe(2);
    expect(evaluateReaction('CO + H2O -> CO2 + H2', 298.15, 2).electrons).toBe(2);
    expect(() => evaluateReaction('CO + H2O -> CO2 + H2', 298.15)).toThrow(/--electrons/);
  });

  it('direction: galvanic when ΔG° < 0, electrolytic when ΔG° > 0, same magnitudes', () => {
    const fc = evaluateReaction('H2 + 0.5 O2 -> H2O', 1073.15);
    const el = evaluateReaction('H2O -> H2 + 0.5 O2', 1073.15);
    expect(fc.direction).toBe('galvanic');
    expect(el.direction).toBe('electrolytic');
    expect(el.reversibleVoltage_V).toBeCloseTo(fc.reversibleVoltage_V, 12);
    expect(el.thermoneutralVoltage_V).toBeCloseTo(fc.thermoneutralVoltage_V, 12);
  });

  it('Nernst: E = E° + RT/2F ln(pH2 pO2^½ / pH2O); condensed water has activity 1', () => {
    const eq = parseEquation('H2 + 1/2 O2 -> H2O');
    const t = 1073.15;
    const e0 = evaluateReaction('H2 + 1/2 O2 -> H2O', t).reversibleVoltage_V;
    const p = { H2: 0.6, O2: 0.21, H2O: 0.3 };
    const expected = e0 + ((GAS_CONSTANT_J_PER_MOL_K * t) / (2 * FARADAY_C_PER_MOL)) * Math.log((0.6 * Math.sqrt(0.21)) / 0.3);
    expect(nernstPotential(eq, t, p)).toBeCloseTo(expected, 12);
    expect(nernstPotential(eq, t, { H2: 1, O2: 1, H2O: 1 })).toBeCloseTo(e0, 12);
    const liquid = parseEquation('H2 + 1/2 O2 -> H2O(L)');
    expect(nernstPotential(liquid, 298.15, { H2: 1, O2: 1 })).toBeCloseTo(1.229, 3);
    expect(() => nernstPotential(eq, t, { H2: 1, O2: 1 })).toThrow(/H2O/);
  });
});
