// The charge basis of fuel utilization: electrons per molecule on complete oxidation,
// z = 4 n_C + n_H − 2 n_O (carbon to CO2, hydrogen to H2O, nitrogen to N2), worked by hand from
// the overall reactions, e.g. C2H6 + 3.5 O2 → 2 CO2 + 3 H2O takes 3.5 × 4 = 14 electrons
// (4 e⁻ per O2; Larminie & Dicks, Fuel Cell Systems Explained, 2nd ed., ch. 2).
import { describe, expect, it } from 'vitest';
import { electronsOfStream, electronsPerMolecule } from '../../lib/electrochem/charge.ts';
import { fuelPath } from '../../lib/equilibrium/fuel-path.ts';
import { technology } from '../../lib/electrochem/technologies.ts';
import { getSpecies } from '../../lib/thermo/species-data.ts';
import { FARADAY_C_PER_MOL as F } from '../../lib/thermo/constants.ts';

describe('electrons per molecule on complete oxidation', () => {
  it('2 per H2 and CO, 8 per CH4, 14 per C2H6, 20 per C3H8, 6 per CH3OH, 3 per NH3 (to N2); 0 for H2O, CO2, N2; −4 for O2', () => {
    // O2 needed per molecule × 4: H2 ½, CO ½, CH4 2, C2H6 3.5, C3H8 5, CH3OH 1.5, NH3 ¾.
    const expected: Record<string, number> = { H2: 2, CO: 2, CH4: 8, C2H6: 14, C3H8: 20, CH3OH: 6, NH3: 3, H2O: 0, CO2: 0, N2: 0, O2: -4 };
    for (const [name, z] of Object.entries(expected)) expect(electronsPerMolecule(getSpecies(name)), name).toBe(z);
  });

  it('a stream carries Σ ṅ_i z_i', () => {
    expect(electronsOfStream({ CH4: 0.5, H2: 0.25, CO2: 0.25 })).toBeCloseTo(0.5 * 8 + 0.25 * 2, 12);
  });

  it('the fuel path takes utilization on that charge basis: Q = F Σ ṅ_i z_i of the feed, I = U Q', () => {
    const feed = { H2: 0.1, CO: 0.1, CH4: 0.3, C2H6: 0.05, C3H8: 0.02, CH3OH: 0.03, NH3: 0.02, H2O: 2 };
    // By hand: 0.1·2 + 0.1·2 + 0.3·8 + 0.05·14 + 0.02·20 + 0.03·6 + 0.02·3 = 4.14 mol e⁻ per s.
    const path = fuelPath({
      technology: technology('solid-oxide'), mode: 'power', temperatureK: 1073.15, fuelPressureBar: 1, airPressureBar: 1,
      fuelFeed: feed, airFeed: { O2: 5, N2: 18.8 }, utilization: 0.7,
    });
    expect(path.chargeBasisA / F).toBeCloseTo(4.14, 12);
    expect(path.currentA / F).toBeCloseTo(0.7 * 4.14, 12);
  });
});
