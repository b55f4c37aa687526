/**
 * Nernst (equilibrium) voltage of a hydrogen–oxygen cell for each electrolyte, from the local
 * partial pressures at both electrodes (bar; 1 bar standard state):
 *
 *   oxide ion O²⁻    E = E° + RT/2F · ln( p_H2,a · p_O2,c^½ / p_H2O,a )
 *   proton H⁺        E = E° + RT/2F · ln( p_H2,a · p_O2,c^½ / p_H2O,c )
 *   carbonate CO3²⁻  E = E° + RT/2F · ln( p_H2,a · p_O2,c^½ · p_CO2,c / (p_H2O,a · p_CO2,a) )
 *   hydroxide OH⁻    E = E° + RT/2F · ln( p_H2,a · p_O2,c^½ )   (electrolyte water activity 1)
 *
 * a = fuel electrode, c = air electrode; E° = −ΔG°/2F of H2 + ½O2 → H2O at T, with gaseous
 * water, or liquid water (activity 1, the water term dropped) where the cell runs with liquid
 * water. Each row follows from equal electrochemical potentials across both electrode reactions
 * and no driving force for the ion across the electrolyte (e.g. R. O'Hayre et al., Fuel Cell
 * Fundamentals, 3rd ed., ch. 2; J. Larminie and A. Dicks, Fuel Cell Systems Explained, 2nd ed.,
 * §2.5 and ch. 7-8). When the fuel gas is at equilibrium, writing the fuel-electrode reaction
 * with CO or CH4 instead of H2 gives the same E.
 */
import { FARADAY_C_PER_MOL as F, GAS_CONSTANT_J_PER_MOL_K as R } from '../thermo/constants.ts';
import { gibbs } from '../thermo/properties.ts';
import { getSpecies } from '../thermo/species-data.ts';
import type { Ion } from './technologies.ts';

/** Partial pressures in bar by species label. */
export type PartialPressures = Readonly<Record<string, number>>;

/** E° = −ΔG°/2F of H2 + ½O2 → H2O(g) or H2O(l) at T, V. */
export function hydrogenStandardVoltage(temperatureK: number, waterPhase: 'gas' | 'liquid'): number {
  const water = getSpecies(waterPhase === 'gas' ? 'H2O' : 'H2O(L)');
  const dG = gibbs(water, temperatureK) - gibbs(getSpecies('H2'), temperatureK) - 0.5 * gibbs(getSpecies('O2'), temperatureK);
  return -dG / (2 * F);
}

/** ln of the Nernst pressure quotient for the ion (the bracket in the table above). */
export function nernstLogQuotient(ion: Ion, waterPhase: 'gas' | 'liquid', fuel: PartialPressures, air: PartialPressures): number {
  const p = (side: PartialPressures, name: string) => side[name] ?? 0;
  let lnQ = Math.log(p(fuel, 'H2')) + 0.5 * Math.log(p(air, 'O2'));
  const waterCounts = waterPhase === 'gas';
  switch (ion) {
    case 'oxide':
      if (waterCounts) lnQ -= Math.log(p(fuel, 'H2O'));
      break;
    case 'proton':
      if (waterCounts) lnQ -= Math.log(p(air, 'H2O'));
      break;
    case 'carbonate':
      if (waterCounts) lnQ -= Math.log(p(fuel, 'H2O'));
      lnQ += Math.log(p(air, 'CO2')) - Math.log(p(fuel, 'CO2'));
      break;
    case 'hydroxide':
      break;
  }
  return lnQ;
}

/**
 * Nernst voltage, V. Returns ±Infinity when a species of the quotient is absent (a dry feed at
 * the inlet): the limit is unbounded but integrable along utilization.
 */
export function nernstVoltage(
  ion: Ion,
  waterPhase: 'gas' | 'liquid',
  temperatureK: number,
  fuel: PartialPressures,
  air: PartialPressures,
  standardVoltageV: number = hydrogenStandardVoltage(temperatureK, waterPhase),
): number {
  return standardVoltageV + ((R * temperatureK) / (2 * F)) * nernstLogQuotient(ion, waterPhase, fuel, air);
}
