/** Hand calculations on the species data that several tests compare with. */
import { enthalpy } from '../../lib/thermo/properties.ts';
import { getSpecies } from '../../lib/thermo/species-data.ts';

/** Σ n_i h_i(T) over a record (species label → amount), by the species data directly, J. */
export function enthalpyBySpecies(amounts: Readonly<Record<string, number>>, temperatureK: number): number {
  return Object.entries(amounts).reduce((sum, [label, n]) => sum + n * enthalpy(getSpecies(label), temperatureK), 0);
}

/**
 * Temperature of complete combustion with fixed products: the T at which the products hold the
 * reactants' enthalpy at 298.15 K, by bisection between 300 and 5000 K (a hand calculation).
 */
export function completeCombustionK(reactants: Readonly<Record<string, number>>, products: Readonly<Record<string, number>>): number {
  const target = enthalpyBySpecies(reactants, 298.15);
  let low = 300;
  let high = 5000;
  for (let k = 0; k < 100; k++) {
    const mid = (low + high) / 2;
    if (enthalpyBySpecies(products, mid) < target) low = mid;
    else high = mid;
  }
  return (low + high) / 2;
}
