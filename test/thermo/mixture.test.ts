// Mixture properties over the species data and their inverses in temperature.
import { describe, expect, it } from 'vitest';
import { mixtureEnthalpyJ, mixtureHeatCapacityJPerK, mixtureMolarMassKgPerMol, mixtureStandardEntropyJPerK } from '../../lib/thermo/mixture.ts';
import { temperatureAtEnthalpyK, temperatureAtStandardEntropyK } from '../../lib/thermo/mixture-temperature.ts';
import { cp, enthalpy, entropy } from '../../lib/thermo/properties.ts';
import { getSpecies } from '../../lib/thermo/species-data.ts';
import { UserError } from '../../lib/core/errors.ts';

const gas = { N2: 7.52, CO2: 1, H2O: 2 };

describe('mixture properties', () => {
  it('are the amount-weighted sums of the species properties', () => {
    const sum = (f: (s: ReturnType<typeof getSpecies>, t: number) => number, t: number) =>
      Object.entries(gas).reduce((acc, [k, n]) => acc + n * f(getSpecies(k), t), 0);
    expect(mixtureEnthalpyJ(gas, 900)).toBeCloseTo(sum(enthalpy, 900), 6);
    expect(mixtureStandardEntropyJPerK(gas, 900)).toBeCloseTo(sum(entropy, 900), 9);
    expect(mixtureHeatCapacityJPerK(gas, 900)).toBeCloseTo(sum(cp, 900), 9);
  });

  it('molar mass of dry air: 28.965 g/mol (ISO 2533 standard atmosphere 28.9644 g/mol, with CO2)', () => {
    // N2 78.084, O2 20.946, Ar 0.934, CO2 0.036 % by volume (ISO 2533:1975; both quoted from memory); the
    // standard's 28.9644 g/mol was set with 0.0314 % CO2 and a few trace gases, 1e-4 relative.
    const air = { N2: 0.78084, O2: 0.20946, Ar: 0.00934, CO2: 0.00036 };
    expect(Math.abs(mixtureMolarMassKgPerMol(air) * 1000 - 28.9644)).toBeLessThan(3e-3);
  });
});

describe('temperature from enthalpy or entropy', () => {
  it('inverts H(T) and S°(T) to 1e-9 K over the range', () => {
    for (const t of [250, 298.15, 640, 1500, 2900, 5800]) {
      expect(Math.abs(temperatureAtEnthalpyK(gas, mixtureEnthalpyJ(gas, t), 1000) - t), `h at ${t}`).toBeLessThan(1e-9 * t);
      expect(Math.abs(temperatureAtStandardEntropyK(gas, mixtureStandardEntropyJPerK(gas, t), 300) - t), `s at ${t}`).toBeLessThan(1e-9 * t);
    }
  });

  it('refuses a value no temperature in the range gives', () => {
    expect(() => temperatureAtEnthalpyK(gas, mixtureEnthalpyJ(gas, 6000) + 1e6, 1000)).toThrow(UserError);
    expect(() => temperatureAtEnthalpyK(gas, mixtureEnthalpyJ(gas, 200) - 1e3, 1000)).toThrow(/below the range/);
  });
});
