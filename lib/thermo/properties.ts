/**
 * Properties of one species at temperature T from its NASA 9-coefficient polynomials.
 *
 * With t = T/K (McBride, Zehe & Gordon, NASA/TP-2002-211556, eqs. 1-3):
 *   cp/R = a1 t^-2 + a2 t^-1 + a3 + a4 t + a5 t^2 + a6 t^3 + a7 t^4
 *   h/RT = -a1 t^-2 + a2 ln(t)/t + a3 + a4 t/2 + a5 t^2/3 + a6 t^3/4 + a7 t^4/5 + b1/t
 *   s/R  = -a1 t^-2/2 - a2 t^-1 + a3 ln(t) + a4 t + a5 t^2/2 + a6 t^3/3 + a7 t^4/4 + b2
 *   g = h - T s
 * h includes the heat of formation at 298.15 K (NASA convention); s is the absolute entropy
 * at the 1 bar standard state.
 */
import { GAS_CONSTANT_J_PER_MOL_K as R } from './constants.ts';
import type { NasaInterval } from './nasa-glenn.ts';
import { elementReference, type Species } from './species-data.ts';
import { TemperatureRangeError, UserError } from '../core/errors.ts';

/** Tolerance on a record's range, K: the published ranges are given to 0.001 K. */
const RANGE_SLACK_K = 1e-6;

function intervalAt(species: Species, temperatureK: number): NasaInterval {
  if (!(temperatureK >= species.lowK - RANGE_SLACK_K && temperatureK <= species.highK + RANGE_SLACK_K)) {
    throw new TemperatureRangeError(species.label, temperatureK, species.lowK, species.highK);
  }
  const intervals = species.record.intervals;
  for (const interval of intervals) {
    if (temperatureK <= interval.highK) return interval;
  }
  return intervals[intervals.length - 1]!;
}

export function inRange(species: Species, temperatureK: number): boolean {
  return temperatureK >= species.lowK - RANGE_SLACK_K && temperatureK <= species.highK + RANGE_SLACK_K;
}

/** cp/R (dimensionless). */
export function cpOverR(species: Species, temperatureK: number): number {
  const [a1, a2, a3, a4, a5, a6, a7] = intervalAt(species, temperatureK).a;
  const t = temperatureK;
  return a1 / (t * t) + a2 / t + a3 + t * (a4 + t * (a5 + t * (a6 + t * a7)));
}

/** h/RT (dimensionless), heat of formation included. */
export function hOverRT(species: Species, temperatureK: number): number {
  const { a, b1 } = intervalAt(species, temperatureK);
  const [a1, a2, a3, a4, a5, a6, a7] = a;
  const t = temperatureK;
  return -a1 / (t * t) + (a2 * Math.log(t)) / t + a3 + t * (a4 / 2 + t * (a5 / 3 + t * (a6 / 4 + (t * a7) / 5))) + b1 / t;
}

/** s/R (dimensionless) at the 1 bar standard state. */
function sOverR(species: Species, temperatureK: number): number {
  const { a, b2 } = intervalAt(species, temperatureK);
  const [a1, a2, a3, a4, a5, a6, a7] = a;
  const t = temperatureK;
  return -a1 / (2 * t * t) - a2 / t + a3 * Math.log(t) + t * (a4 + t * (a5 / 2 + t * (a6 / 3 + (t * a7) / 4))) + b2;
}

/** g/RT = h/RT - s/R (dimensionless), the standard chemical potential over RT. */
export function gOverRT(species: Species, temperatureK: number): number {
  return hOverRT(species, temperatureK) - sOverR(species, temperatureK);
}

/** Molar heat capacity at constant pressure, J/(mol K). */
export function cp(species: Species, temperatureK: number): number {
  return R * cpOverR(species, temperatureK);
}

/** Molar enthalpy including the heat of formation at 298.15 K, J/mol. */
export function enthalpy(species: Species, temperatureK: number): number {
  return R * temperatureK * hOverRT(species, temperatureK);
}

/** Molar standard entropy at 1 bar, J/(mol K). */
export function entropy(species: Species, temperatureK: number): number {
  return R * sOverR(species, temperatureK);
}

/** Molar standard Gibbs energy g = h - T s, J/mol. */
export function gibbs(species: Species, temperatureK: number): number {
  return R * temperatureK * gOverRT(species, temperatureK);
}

export interface SpeciesProperties {
  species: string;
  temperature_K: number;
  cp_J_per_mol_K: number;
  h_J_per_mol: number;
  s_J_per_mol_K: number;
  g_J_per_mol: number;
}

/** All four properties at T, keyed with their units (the `cellbasis species --json` object). */
export function speciesProperties(species: Species, temperatureK: number): SpeciesProperties {
  return {
    species: species.label,
    temperature_K: temperatureK,
    cp_J_per_mol_K: cp(species, temperatureK),
    h_J_per_mol: enthalpy(species, temperatureK),
    s_J_per_mol_K: entropy(species, temperatureK),
    g_J_per_mol: gibbs(species, temperatureK),
  };
}

/**
 * Property of formation at T: X_f(T) = x_species(T) − Σ_e (n_e / atoms_e) x_ref,e(T), with each
 * element in its reference state (H2, O2, N2, C(gr), Ar, He), as tabulated in NIST-JANAF.
 */
function formationProperty(
  species: Species,
  temperatureK: number,
  property: (s: Species, t: number) => number,
): number {
  let value = property(species, temperatureK);
  for (const [element, count] of Object.entries(species.formula)) {
    const ref = elementReference(element);
    if (!ref) throw new UserError(`${species.label}: no reference state for element ${element} in the species data`);
    value -= (count / ref.atoms) * property(ref.species, temperatureK);
  }
  return value;
}

/** Heat of formation ΔfH°(T), J/mol. */
export function formationEnthalpy(species: Species, temperatureK: number): number {
  return formationProperty(species, temperatureK, enthalpy);
}

/** Gibbs energy of formation ΔfG°(T), J/mol. */
export function formationGibbs(species: Species, temperatureK: number): number {
  return formationProperty(species, temperatureK, gibbs);
}
