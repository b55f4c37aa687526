/**
 * What the electrolyte carries between the electrodes per mole of electrons passed, in power
 * mode (electrolysis is the same exchange with the opposite sign):
 *
 *   ion          fuel electrode (as elements)    fuel electrode, if only H2 reacts   air electrode
 *   oxide O²⁻    +½ O                            −½ H2, +½ H2O                       −¼ O2
 *   proton H⁺    −1 H                            −½ H2                               −¼ O2, +½ H2O
 *   carbonate    +½ C, +3/2 O                    −½ H2, +½ H2O, +½ CO2               −¼ O2, −½ CO2
 *   hydroxide    +1 O, +1 H                      −½ H2, +1 H2O                       −¼ O2, −½ H2O
 *
 * From the electrode reactions (methods note of this project; e.g. Larminie & Dicks, Fuel Cell
 * Systems Explained, 2nd ed., Fig. 1.4): oxide H2 + O²⁻ → H2O + 2e⁻ | ½O2 + 2e⁻ → O²⁻;
 * proton H2 → 2H⁺ + 2e⁻ | ½O2 + 2H⁺ + 2e⁻ → H2O; carbonate H2 + CO3²⁻ → H2O + CO2 + 2e⁻ |
 * ½O2 + CO2 + 2e⁻ → CO3²⁻; hydroxide H2 + 2OH⁻ → 2H2O + 2e⁻ | ½O2 + H2O + 2e⁻ → 2OH⁻.
 */
import type { Ion } from '../electrochem/technologies.ts';

export interface Exchange {
  /** Element change of the fuel-electrode gas per mole of electrons (for a re-equilibrated gas). */
  fuelElements: Readonly<Record<string, number>>;
  /** Species change of the fuel-electrode gas per mole of electrons where only H2 reacts. */
  fuelSpecies: Readonly<Record<string, number>>;
  /** Species change of the air-electrode gas per mole of electrons. */
  airSpecies: Readonly<Record<string, number>>;
}

const TABLE: Record<Ion, Exchange> = {
  oxide: { fuelElements: { O: 0.5 }, fuelSpecies: { H2: -0.5, H2O: 0.5 }, airSpecies: { O2: -0.25 } },
  proton: { fuelElements: { H: -1 }, fuelSpecies: { H2: -0.5 }, airSpecies: { O2: -0.25, H2O: 0.5 } },
  carbonate: { fuelElements: { C: 0.5, O: 1.5 }, fuelSpecies: { H2: -0.5, H2O: 0.5, CO2: 0.5 }, airSpecies: { O2: -0.25, CO2: -0.5 } },
  hydroxide: { fuelElements: { O: 1, H: 1 }, fuelSpecies: { H2: -0.5, H2O: 1 }, airSpecies: { O2: -0.25, H2O: -0.5 } },
};

export function exchangeFor(ion: Ion): Exchange {
  return TABLE[ion];
}
