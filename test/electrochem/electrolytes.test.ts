// The per-ion table (lib/electrochem/data/electrolytes.yaml) against the textbook forms of each
// electrolyte's Nernst equation and of what its ion carries per electron, written out here by
// hand: J. Larminie and A. Dicks, Fuel Cell Systems Explained, 2nd ed. (Wiley, 2003), Fig. 1.4,
// §2.5 and ch. 7-8; R. O'Hayre et al., Fuel Cell Fundamentals, 3rd ed., ch. 2 (from memory).
import { describe, expect, it } from 'vitest';
import { activeQuotient, nernstQuotient } from '../../lib/electrochem/electrolytes.ts';
import { nernstLogQuotient } from '../../lib/electrochem/nernst.ts';
import { exchangeFor } from '../../lib/equilibrium/electrolyte-exchange.ts';
import { IONS } from '../../lib/electrochem/technologies.ts';

/** Each factor as "species,electrode^power". */
const factors = (ion: (typeof IONS)[number]) => nernstQuotient(ion).map((t) => `${t.species},${t.electrode}^${t.power}`);

describe('electrolytes', () => {
  it('give the textbook Nernst quotients', () => {
    // oxide: p_H2,f p_O2,a^½ / p_H2O,f; proton: p_H2,f p_O2,a^½ / p_H2O,a;
    // carbonate: p_H2,f p_O2,a^½ p_CO2,a / (p_H2O,f p_CO2,f); hydroxide: p_H2,f p_O2,a^½ (water activity 1).
    expect(factors('oxide')).toEqual(['H2,f^1', 'O2,a^0.5', 'H2O,f^-1']);
    expect(factors('proton')).toEqual(['H2,f^1', 'O2,a^0.5', 'H2O,a^-1']);
    expect(factors('carbonate')).toEqual(['H2,f^1', 'O2,a^0.5', 'CO2,a^1', 'H2O,f^-1', 'CO2,f^-1']);
    expect(factors('hydroxide')).toEqual(['H2,f^1', 'O2,a^0.5']);
    // Liquid water (activity 1) drops the water term.
    expect(activeQuotient('proton', 'liquid').map((t) => t.species)).toEqual(['H2', 'O2']);
  });

  it('evaluate ln Q as the product of the partial pressures', () => {
    const fuel = { H2: 0.6, H2O: 0.3, CO2: 0.1 };
    const air = { O2: 0.15, H2O: 0.05, CO2: 0.2 };
    // The quotients of the test above, multiplied out by hand.
    expect(nernstLogQuotient('oxide', 'gas', fuel, air)).toBeCloseTo(Math.log((0.6 * Math.sqrt(0.15)) / 0.3), 14);
    expect(nernstLogQuotient('proton', 'gas', fuel, air)).toBeCloseTo(Math.log((0.6 * Math.sqrt(0.15)) / 0.05), 14);
    expect(nernstLogQuotient('carbonate', 'gas', fuel, air)).toBeCloseTo(Math.log((0.6 * Math.sqrt(0.15) * 0.2) / (0.3 * 0.1)), 14);
    expect(nernstLogQuotient('hydroxide', 'liquid', fuel, air)).toBeCloseTo(Math.log(0.6 * Math.sqrt(0.15)), 14);
  });

  it('move per electron what the textbook half-reactions move', () => {
    // oxide: H2 + O²⁻ → H2O + 2e⁻ | ½O2 + 2e⁻ → O²⁻; proton: H2 → 2H⁺ + 2e⁻ | ½O2 + 2H⁺ + 2e⁻ → H2O;
    // carbonate: H2 + CO3²⁻ → H2O + CO2 + 2e⁻ | ½O2 + CO2 + 2e⁻ → CO3²⁻;
    // hydroxide: H2 + 2OH⁻ → 2H2O + 2e⁻ | ½O2 + H2O + 2e⁻ → 2OH⁻; all per mole of electrons.
    expect(exchangeFor('oxide')).toEqual({ fuelElements: { O: 0.5 }, fuelSpecies: { H2: -0.5, H2O: 0.5 }, airSpecies: { O2: -0.25 } });
    expect(exchangeFor('proton')).toEqual({ fuelElements: { H: -1 }, fuelSpecies: { H2: -0.5 }, airSpecies: { O2: -0.25, H2O: 0.5 } });
    expect(exchangeFor('carbonate')).toEqual({ fuelElements: { C: 0.5, O: 1.5 }, fuelSpecies: { H2: -0.5, H2O: 0.5, CO2: 0.5 }, airSpecies: { O2: -0.25, CO2: -0.5 } });
    expect(exchangeFor('hydroxide')).toEqual({ fuelElements: { O: 1, H: 1 }, fuelSpecies: { H2: -0.5, H2O: 1 }, airSpecies: { O2: -0.25, H2O: -0.5 } });
  });
});
