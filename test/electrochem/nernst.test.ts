// The Nernst voltage from the oxygen potential across an oxide-ion (or carbonate) electrolyte,
// E = RT/4F ln(p_O2,air/p_O2,fuel), against the hydrogen and carbon monoxide forms it must equal
// where the fuel gas is at equilibrium: E = E° + RT/2F ln(p_H2 p_O2^½/p_H2O) and
// E = E°_CO + RT/2F ln(p_CO p_O2^½/p_CO2), with p_O2,fuel = (p_H2O/(K p_H2))² (or the CO/CO2
// couple's) and K = exp(−ΔG°/RT) (the zirconia oxygen-sensor equation; e.g. Larminie & Dicks,
// Fuel Cell Systems Explained, 2nd ed., §2.5, for the hydrogen form).
import { describe, expect, it } from 'vitest';
import { hydrogenStandardVoltage, nernstVoltage, oxygenPotentialNernstV } from '../../lib/electrochem/nernst.ts';
import { potentialCouple } from '../../lib/electrochem/electrolytes.ts';
import { FARADAY_C_PER_MOL as F, GAS_CONSTANT_J_PER_MOL_K as R } from '../../lib/thermo/constants.ts';
import { gibbs } from '../../lib/thermo/properties.ts';
import { getSpecies } from '../../lib/thermo/species-data.ts';

const g = (name: string, t: number) => gibbs(getSpecies(name), t);
/** ΔG° of CO + ½O2 → CO2 and of H2 + ½O2 → H2O(g) at T from the species data (NASA Glenn), J/mol. */
const dGco = (t: number) => g('CO2', t) - g('CO', t) - 0.5 * g('O2', t);
const dGh2 = (t: number) => g('H2O', t) - g('H2', t) - 0.5 * g('O2', t);

describe('Nernst voltage from the oxygen potential', () => {
  const t = 1073.15;
  const air = { O2: 0.21 * 1.1 };

  it('equals the H2/H2O form: p_O2,fuel = (p_H2O/(K p_H2))² with K of H2 + ½O2 → H2O', () => {
    for (const [h2, h2o] of [[0.97, 0.03], [0.5, 0.5], [0.05, 0.95]] as const) {
      const k = Math.exp(-dGh2(t) / (R * t));
      const lnO2Bar = 2 * Math.log(h2o / (k * h2));
      const e = oxygenPotentialNernstV('oxide', t, { O2: lnO2Bar }, air);
      // Both forms are one identity in exact arithmetic: 1e-12 V is rounding.
      expect(Math.abs(e - nernstVoltage('oxide', 'gas', t, { H2: h2, H2O: h2o }, air))).toBeLessThan(1e-12);
    }
  });

  it('equals the CO/CO2 form E°_CO + RT/2F ln(p_CO p_O2^½/p_CO2), with E°_CO(1000 K) = 1.0136 V from NIST-JANAF', () => {
    const co = 0.7;
    const co2 = 0.3;
    const k = Math.exp(-dGco(t) / (R * t));
    const e = oxygenPotentialNernstV('oxide', t, { O2: 2 * Math.log(co2 / (k * co)), CO2: Math.log(co2) }, air);
    const byHand = -dGco(t) / (2 * F) + ((R * t) / (2 * F)) * Math.log((co * Math.sqrt(air.O2)) / co2);
    expect(Math.abs(e - byHand)).toBeLessThan(1e-12);
    // NIST-JANAF Thermochemical Tables (4th ed., 1998; from memory): ΔfG°(1000 K) of CO2 −395.886 and
    // of CO −200.275 kJ/mol, so ΔG° = −195.611 kJ/mol and E°_CO = 195 611/2F = 1.01368 V. The NASA
    // polynomials reproduce JANAF to about 0.05 kJ/mol (0.26 mV): 0.5 mV.
    expect(Math.abs(-dGco(1000) / (2 * F) - 195611 / (2 * F))).toBeLessThan(5e-4);
  });

  it('carbonate: adds RT/2F ln(p_CO2,air/p_CO2,fuel) and equals the carbonate row with H2, H2O and CO2', () => {
    const k = Math.exp(-dGh2(t) / (R * t));
    const fuel = { H2: 0.4, H2O: 0.3, CO2: 0.25 };
    const cathode = { O2: 0.1, CO2: 0.2 };
    const e = oxygenPotentialNernstV('carbonate', t, { O2: 2 * Math.log(fuel.H2O / (k * fuel.H2)), CO2: Math.log(fuel.CO2) }, cathode);
    expect(Math.abs(e - nernstVoltage('carbonate', 'gas', t, fuel, cathode, hydrogenStandardVoltage(t, 'gas')))).toBeLessThan(1e-12);
  });
});

describe('the couple of each ion, from the electrode reactions of the per-ion table', () => {
  // Larminie & Dicks, Fuel Cell Systems Explained, 2nd ed., Fig. 1.4 (from memory): the air electrode
  // forms O²⁻ from ½O2 and CO3²⁻ from ½O2 + CO2; it consumes H⁺ (and, in alkaline cells, water and
  // electrons give OH⁻ from the electrolyte's water), so those ions have no couple of gases alone.
  it('oxide: ½O2; carbonate: ½O2 + CO2; proton and hydroxide: none', () => {
    expect(potentialCouple('oxide')).toEqual([{ species: 'O2', coefficient: 0.5 }]);
    expect(potentialCouple('carbonate')).toEqual([
      { species: 'O2', coefficient: 0.5 },
      { species: 'CO2', coefficient: 1 },
    ]);
    expect(potentialCouple('proton')).toBeNull();
    expect(potentialCouple('hydroxide')).toBeNull();
    expect(() => oxygenPotentialNernstV('proton', 1000, { O2: -40 }, { O2: 0.2 })).toThrow(/no couple/);
  });
});
