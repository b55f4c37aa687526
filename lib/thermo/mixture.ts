/**
 * Properties of a mixture given as species label → amount (ideal gas, ideal mixing). Its enthalpy:
 *   H = Σ_i n_i h°_i(T),  J on the amounts' scale (W for mol/s)
 * with h° from the species data, heats of formation included (NASA convention, so that
 * reacting mixtures balance), ideal mixing (no heat of mixing). Liquid water as "H2O(L)".
 */
import { cp, enthalpy, entropy } from './properties.ts';
import { getSpecies } from './species-data.ts';

export function mixtureEnthalpyJ(amounts: Readonly<Record<string, number>>, temperatureK: number): number {
  let total = 0;
  for (const [label, amount] of Object.entries(amounts)) if (amount !== 0) total += amount * enthalpy(getSpecies(label), temperatureK);
  return total;
}

/**
 * Standard entropy of a mixture of fixed composition, Σ_i n_i s°_i(T), J/K on the amounts'
 * scale (1 bar; the mixing term −R Σ n_i ln x_i and the pressure term −R n ln(p/p°) are left
 * to the caller: at fixed composition they cancel in any difference but the pressure one).
 */
export function mixtureStandardEntropyJPerK(amounts: Readonly<Record<string, number>>, temperatureK: number): number {
  let total = 0;
  for (const [label, amount] of Object.entries(amounts)) if (amount !== 0) total += amount * entropy(getSpecies(label), temperatureK);
  return total;
}

/** Heat capacity of a mixture of fixed composition, Σ_i n_i c°_p,i(T), J/K on the amounts' scale. */
export function mixtureHeatCapacityJPerK(amounts: Readonly<Record<string, number>>, temperatureK: number): number {
  let total = 0;
  for (const [label, amount] of Object.entries(amounts)) if (amount !== 0) total += amount * cp(getSpecies(label), temperatureK);
  return total;
}

/** Mass of a mixture, Σ_i n_i M_i, kg on the amounts' scale (kg/s for mol/s). */
export function mixtureMassKg(amounts: Readonly<Record<string, number>>): number {
  let mass = 0;
  for (const [label, amount] of Object.entries(amounts)) if (amount !== 0) mass += amount * getSpecies(label).molarMassKgPerMol;
  return mass;
}

/** Molar mass of a mixture, kg/mol: Σ_i n_i M_i / Σ_i n_i. */
export function mixtureMolarMassKgPerMol(amounts: Readonly<Record<string, number>>): number {
  let total = 0;
  for (const amount of Object.values(amounts)) total += amount;
  return mixtureMassKg(amounts) / total;
}
