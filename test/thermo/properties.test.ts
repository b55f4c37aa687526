// Identities the NASA polynomials must satisfy (McBride, Zehe & Gordon, NASA/TP-2002-211556,
// eqs. 1-3): g = h - Ts; h(298.15 K) equals the heat of formation in the record header;
// cp = dh/dT and cp/T = ds/dT; cp, h, s continuous at every interval boundary; range errors.
import { describe, expect, it } from 'vitest';
import { allSpecies, getSpecies } from '../../lib/thermo/species-data.ts';
import { cp, enthalpy, entropy, gibbs, speciesProperties } from '../../lib/thermo/properties.ts';
import { TemperatureRangeError } from '../../lib/core/errors.ts';

describe('species properties', () => {
  it('g = h − T s for every species at several temperatures', () => {
    for (const s of allSpecies()) {
      for (const t of [s.lowK, (s.lowK + s.highK) / 2, Math.min(s.highK, 1500)]) {
        expect(gibbs(s, t)).toBeCloseTo(enthalpy(s, t) - t * entropy(s, t), 6);
      }
    }
  });

  it('h(298.15 K) equals the heat of formation of the record header (NASA convention)', () => {
    for (const s of allSpecies().filter((x) => x.lowK <= 298.15)) {
      // The fits reproduce the tabulated 298.15 K value to a few J/mol (largest here: CO2, 2.2 J/mol,
      // 0.0006 % of its heat of formation).
      expect(Math.abs(enthalpy(s, 298.15) - s.record.heatOfFormationJPerMol), s.label).toBeLessThan(5);
    }
  });

  it('cp = dh/dT and cp/T = ds/dT (central differences, step 0.01 K)', () => {
    for (const name of ['H2', 'H2O', 'CO2', 'CH4', 'C(gr)', 'H2O(L)']) {
      const s = getSpecies(name);
      const t = name === 'H2O(L)' ? 330 : 850;
      const d = 0.01;
      expect((enthalpy(s, t + d) - enthalpy(s, t - d)) / (2 * d)).toBeCloseTo(cp(s, t), 3);
      expect((entropy(s, t + d) - entropy(s, t - d)) / (2 * d)).toBeCloseTo(cp(s, t) / t, 6);
    }
  });

  it('cp, h and s are continuous at each interval boundary', () => {
    for (const s of allSpecies()) {
      const intervals = s.record.intervals;
      for (let k = 0; k + 1 < intervals.length; k++) {
        const boundary = intervals[k]!.highK;
        const below = boundary - 1e-7;
        const above = boundary + 1e-7;
        // NASA fits are constrained to join at the boundaries; 1e-3 relative covers the
        // coefficients' printed precision (9-10 significant digits).
        expect(Math.abs(cp(s, above) - cp(s, below)), `${s.label} cp at ${boundary}`).toBeLessThan(1e-3 * Math.abs(cp(s, boundary)) + 1e-3);
        expect(Math.abs(enthalpy(s, above) - enthalpy(s, below)), `${s.label} h at ${boundary}`).toBeLessThan(2);
        expect(Math.abs(entropy(s, above) - entropy(s, below)), `${s.label} s at ${boundary}`).toBeLessThan(2e-3);
      }
    }
  });

  it('refuses temperatures outside a record range and names the species and the range', () => {
    expect(() => cp(getSpecies('H2O(L)'), 700)).toThrow(TemperatureRangeError);
    expect(() => cp(getSpecies('H2O(L)'), 700)).toThrow(/H2O\(L\).*273\.15 K to 600 K/);
    expect(() => enthalpy(getSpecies('H2'), 150)).toThrow(/H2: temperature 150\.00 K is outside the range of its species data, 200 K to 20000 K/);
    expect(() => entropy(getSpecies('CH4'), 7000)).toThrow(TemperatureRangeError);
  });

  it('speciesProperties carries the unit in every key', () => {
    expect(Object.keys(speciesProperties(getSpecies('CO'), 1000)).sort()).toEqual(
      ['cp_J_per_mol_K', 'g_J_per_mol', 'h_J_per_mol', 's_J_per_mol_K', 'species', 'temperature_K'].sort(),
    );
  });
});
