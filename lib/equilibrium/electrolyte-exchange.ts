/**
 * What the electrolyte carries between the electrodes per mole of electrons passed, in power
 * mode (electrolysis is the same exchange with the opposite sign), from the electrode reactions
 * of the ion (lib/electrochem/electrolytes.ts): each gas the fuel-electrode reaction forms joins
 * the fuel gas and each it consumes leaves it, likewise at the air electrode, per electron
 * (the reactions are written for two). Which gives
 *
 *   ion          fuel electrode (as elements)    fuel electrode, if only H2 reacts   air electrode
 *   oxide O²⁻    +½ O                            −½ H2, +½ H2O                       −¼ O2
 *   proton H⁺    −1 H                            −½ H2                               −¼ O2, +½ H2O
 *   carbonate    +½ C, +3/2 O                    −½ H2, +½ H2O, +½ CO2               −¼ O2, −½ CO2
 *   hydroxide    +1 O, +1 H                      −½ H2, +1 H2O                       −¼ O2, −½ H2O
 *
 * (The water of an alkaline cell's reactions belongs to its electrolyte for the Nernst equation,
 * but it is still formed at the fuel electrode and taken at the air electrode, as here.)
 */
import { ELECTRONS, electrolyte, type ElectrodeReaction } from '../electrochem/electrolytes.ts';
import type { Ion } from '../electrochem/technologies.ts';
import { getSpecies } from '../thermo/species-data.ts';

export interface Exchange {
  /** Element change of the fuel-electrode gas per mole of electrons (for a re-equilibrated gas). */
  fuelElements: Readonly<Record<string, number>>;
  /** Species change of the fuel-electrode gas per mole of electrons where only H2 reacts. */
  fuelSpecies: Readonly<Record<string, number>>;
  /** Species change of the air-electrode gas per mole of electrons. */
  airSpecies: Readonly<Record<string, number>>;
}

/** The gases a reaction moves into (+) and out of (−) its electrode's gas, per mole of electrons. */
function gasChange(reaction: ElectrodeReaction): Record<string, number> {
  const change: Record<string, number> = {};
  for (const [side, sign] of [['consumes', -1], ['forms', 1]] as const) {
    for (const { species, coefficient } of reaction[side]) {
      if (species !== 'ion') change[species] = (change[species] ?? 0) + (sign * coefficient) / ELECTRONS;
    }
  }
  return change;
}

/** The same change counted in elements, those that cancel left out. */
function elementChange(species: Readonly<Record<string, number>>): Record<string, number> {
  const elements: Record<string, number> = {};
  for (const [label, amount] of Object.entries(species)) {
    for (const [element, count] of Object.entries(getSpecies(label).formula)) elements[element] = (elements[element] ?? 0) + amount * count;
  }
  return Object.fromEntries(Object.entries(elements).filter(([, amount]) => amount !== 0));
}

const cache = new Map<Ion, Exchange>();

export function exchangeFor(ion: Ion): Exchange {
  let exchange = cache.get(ion);
  if (!exchange) {
    const e = electrolyte(ion);
    const fuelSpecies = gasChange(e.fuel);
    exchange = { fuelElements: elementChange(fuelSpecies), fuelSpecies, airSpecies: gasChange(e.air) };
    cache.set(ion, exchange);
  }
  return exchange;
}
