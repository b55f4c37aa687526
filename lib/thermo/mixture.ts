/**
 * Enthalpy of a mixture given as species label → amount at one temperature:
 *   H = Σ_i n_i h°_i(T),  J on the amounts' scale (W for mol/s)
 * with h° from the species data, heats of formation included (NASA convention, so that
 * reacting mixtures balance), ideal mixing (no heat of mixing). Liquid water as "H2O(L)".
 */
import { enthalpy } from './properties.ts';
import { getSpecies } from './species-data.ts';

export function mixtureEnthalpyJ(amounts: Readonly<Record<string, number>>, temperatureK: number): number {
  let total = 0;
  for (const [label, amount] of Object.entries(amounts)) if (amount !== 0) total += amount * enthalpy(getSpecies(label), temperatureK);
  return total;
}
