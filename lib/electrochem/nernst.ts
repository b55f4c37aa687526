/**
 * Nernst (equilibrium) voltage of a hydrogen–oxygen cell for each electrolyte, from the local
 * partial pressures at both electrodes (bar; 1 bar standard state):
 *
 *   E = E° + RT/2F · ln Q,   Q = Π p_i^ν_i
 *
 * over the gases the electrode reactions of the ion consume (ν > 0) and form (ν < 0), each at its
 * electrode (lib/electrochem/electrolytes.ts, data/electrolytes.yaml), which gives
 *
 *   oxide ion O²⁻    Q = p_H2,a · p_O2,c^½ / p_H2O,a
 *   proton H⁺        Q = p_H2,a · p_O2,c^½ / p_H2O,c
 *   carbonate CO3²⁻  Q = p_H2,a · p_O2,c^½ · p_CO2,c / (p_H2O,a · p_CO2,a)
 *   hydroxide OH⁻    Q = p_H2,a · p_O2,c^½ / a_w   (a_w the electrolyte's water activity)
 *
 * a = fuel electrode, c = air electrode; E° = −ΔG°/2F of H2 + ½O2 → H2O at T, with gaseous
 * water, or liquid water (activity 1, the water term dropped) where the cell runs with liquid
 * water. Each row follows from equal electrochemical potentials across both electrode reactions
 * and no driving force for the ion across the electrolyte (e.g. R. O'Hayre et al., Fuel Cell
 * Fundamentals, 3rd ed., ch. 2; J. Larminie and A. Dicks, Fuel Cell Systems Explained, 2nd ed.,
 * §2.5 and ch. 7-8). When the fuel gas is at equilibrium, writing the fuel-electrode reaction
 * with CO or CH4 instead of H2 gives the same E.
 *
 * A fuel gas with no hydrogen (CO with CO2) has no H2/H2O couple to write the rows above with.
 * What an oxide-ion electrolyte equalises is the oxygen potential: with O2 + 4e⁻ ⇌ 2O²⁻ at both
 * electrodes the cell is an oxygen concentration cell (the Nernst equation of the zirconia oxygen
 * sensor, e.g. E. C. Subbarao and H. S. Maiti, Solid State Ionics 11 (1984) 317; from memory).
 * In general, the air-electrode reaction of an ion it forms from gases alone (the ion's couple,
 * electrolytes.ts `potentialCouple`), written at both electrodes, gives
 *
 *   E = RT/2F · Σ ν_i ln( p_i,c / p_i,a )    over the gases of the couple, ν for two electrons:
 *   oxide ion        E = RT/4F · ln( p_O2,c / p_O2,a )
 *   carbonate        E = RT/4F · ln( p_O2,c / p_O2,a ) + RT/2F · ln( p_CO2,c / p_CO2,a )
 *
 * (carbonate: ½O2 + CO2 + 2e⁻ ⇌ CO3²⁻ at both electrodes), with p_O2,a the oxygen partial
 * pressure of the equilibrated fuel gas. Where the fuel gas holds H2 and H2O at equilibrium,
 * p_O2,a = (p_H2O / (K p_H2))² with K = exp(−ΔG°/RT) of H2 + ½O2 → H2O, and the oxide row of the
 * table follows; with CO and CO2, p_O2,a = (p_CO2 / (K_CO p_CO))² gives
 * E = E°_CO + RT/2F · ln( p_CO · p_O2,c^½ / p_CO2 ), E°_CO = −ΔG°/2F of CO + ½O2 → CO2.
 */
import { FARADAY_C_PER_MOL as F, GAS_CONSTANT_J_PER_MOL_K as R } from '../thermo/constants.ts';
import { gibbs } from '../thermo/properties.ts';
import { getSpecies } from '../thermo/species-data.ts';
import type { Ion } from './technologies.ts';
import { activeQuotient, potentialCouple, type QuotientTerm } from './electrolytes.ts';

/** Partial pressures in bar by species label. */
export type PartialPressures = Readonly<Record<string, number>>;

/** E° = −ΔG°/2F of H2 + ½O2 → H2O(g) or H2O(l) at T, V. */
export function hydrogenStandardVoltage(temperatureK: number, waterPhase: 'gas' | 'liquid'): number {
  const water = getSpecies(waterPhase === 'gas' ? 'H2O' : 'H2O(L)');
  const dG = gibbs(water, temperatureK) - gibbs(getSpecies('H2'), temperatureK) - 0.5 * gibbs(getSpecies('O2'), temperatureK);
  return -dG / (2 * F);
}

/** The quotient of an ion and water phase as its evaluation needs it: gases at one electrode, and gases carried from one to the other. */
interface QuotientPlan {
  single: QuotientTerm[];
  /** A gas the ion carries across (CO2 of the carbonate ion): its factor at the electrode that consumes it, then at the one that forms it. */
  carried: [QuotientTerm, QuotientTerm][];
}

const plans = new Map<string, QuotientPlan>();

function planOf(ion: Ion, waterPhase: 'gas' | 'liquid'): QuotientPlan {
  const key = `${ion}/${waterPhase}`;
  let plan = plans.get(key);
  if (!plan) {
    const terms = activeQuotient(ion, waterPhase);
    const both = (t: QuotientTerm) => terms.filter((u) => u.species === t.species).length > 1;
    const carried = terms.filter((t) => both(t) && t.power > 0).map((t): [QuotientTerm, QuotientTerm] => [t, terms.find((u) => u.species === t.species && u.power < 0)!]);
    plan = { single: terms.filter((t) => !both(t)), carried };
    plans.set(key, plan);
  }
  return plan;
}

/**
 * ln Q for the ion, Σ ν_i ln p_i: first the gases at one electrode, then each gas the ion carries
 * across as ln(p at the electrode that consumes it) − ln(p at the one that forms it).
 */
export function nernstLogQuotient(ion: Ion, waterPhase: 'gas' | 'liquid', fuel: PartialPressures, air: PartialPressures): number {
  const p = (t: QuotientTerm) => (t.electrode === 'f' ? fuel : air)[t.species] ?? 0;
  const plan = planOf(ion, waterPhase);
  let lnQ = 0;
  for (const t of plan.single) lnQ += t.power * Math.log(p(t));
  for (const [consumed, formed] of plan.carried) lnQ += consumed.power * Math.log(p(consumed)) + formed.power * Math.log(p(formed));
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

/**
 * Nernst voltage from the potentials of the ion's couple across the electrolyte, V (the general
 * form in this file's comment): E = RT/2F · Σ ν_i (ln p_i,c − ln p_i,a), that is RT/4F · ln of the
 * oxygen ratio for the oxide ion, plus RT/2F · ln of the CO2 ratio for the carbonate ion. The fuel
 * side is given as ln of its partial pressures in bar by species (an equilibrated fuel gas may
 * hold O2 at 1e-20 bar and less, which its element potentials give exactly). Throws for an ion
 * without a couple (the air electrode consumes it).
 */
export function oxygenPotentialNernstV(ion: Ion, temperatureK: number, fuelLnBar: Readonly<Record<string, number>>, air: PartialPressures): number {
  const couple = potentialCouple(ion);
  if (!couple) throw new Error(`the ${ion} ion has no couple of air-electrode gases for the oxygen-potential form`);
  let sum = 0;
  for (const { species, coefficient } of couple) sum += coefficient * (Math.log(air[species] ?? 0) - (fuelLnBar[species] ?? Number.NaN));
  return ((R * temperatureK) / (2 * F)) * sum;
}

/**
 * The liquid water's activity in the Nernst voltage: with the cell reaction H2 + ½O2 → H2O(l) at
 * water activity a_w (an alkaline cell's KOH solution, lib/thermo/koh-solution.ts) the quotient
 * carries 1/a_w, so E = E° + RT/2F ln Q − RT/2F ln a_w; this returns −RT/2F ln a_w, V (0 for pure
 * water; +7.3 mV for 30 wt % KOH at 80 °C, a_w = 0.617).
 */
export function waterActivityVoltage(temperatureK: number, waterActivity: number): number {
  return -((R * temperatureK) / (2 * F)) * Math.log(waterActivity);
}
