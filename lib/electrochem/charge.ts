/**
 * Charge a species gives up on complete oxidation, in electrons per molecule:
 *   z = 4 n_C + n_H − 2 n_O     (carbon to CO2, hydrogen to H2O, nitrogen to N2)
 * which gives 2 for H2 and CO, 8 for CH4, 14 for C2H6, 20 for C3H8, 6 for CH3OH, 3 for NH3,
 * 0 for H2O, CO2 and N2, and −4 for O2 (oxygen in a fuel consumes charge). Sulphur is not
 * counted (a trace in fuel gases; it poisons rather than feeds a cell). This is the electron
 * count of the overall oxidation CxHyOz + (x + y/4 − z/2) O2 → x CO2 + y/2 H2O at 4 e⁻ per O2.
 */
import type { Species } from '../thermo/species-data.ts';
import { getSpecies } from '../thermo/species-data.ts';

export function electronsPerMolecule(species: Species): number {
  return electronsOfElements(species.formula);
}

/** The same count for an amount of each element (element symbol → mol, or mol/s): 4 n_C + n_H − 2 n_O. */
export function electronsOfElements(elements: Readonly<Record<string, number>>): number {
  return 4 * (elements.C ?? 0) + (elements.H ?? 0) - 2 * (elements.O ?? 0);
}

/** Σ ṅ_i z_i over a stream (species label → mol/s): mol of electrons per second on full oxidation. */
export function electronsOfStream(stream: Readonly<Record<string, number>>): number {
  let total = 0;
  for (const [name, amount] of Object.entries(stream)) total += amount * electronsPerMolecule(getSpecies(name));
  return total;
}
