/**
 * Standard reaction properties and the cell voltages that follow from them.
 *
 *   ΔH°(T) = Σ ν_i h_i(T),  ΔS°(T) = Σ ν_i s_i(T),  ΔG°(T) = ΔH° − TΔS°
 *   E_rev = |ΔG°| / (nF)      (reversible voltage; for ΔG° > 0 the minimum electrolysis voltage)
 *   V_tn  = |ΔH°| / (nF)      (thermoneutral voltage)
 *   dE_rev/dT = −sign(ΔG°) · ΔS° / (nF)
 * Source: the relation ΔG = −nFE of electrochemical thermodynamics, e.g. J. Larminie and
 * A. Dicks, Fuel Cell Systems Explained, 2nd ed. (Wiley, 2003), ch. 2; R. O'Hayre et al.,
 * Fuel Cell Fundamentals, 3rd ed. (Wiley, 2016), ch. 2.
 * Standard state 1 bar, gases ideal, condensed phases pure.
 */
import { FARADAY_C_PER_MOL as F, GAS_CONSTANT_J_PER_MOL_K as R } from '../thermo/constants.ts';
import { enthalpy, entropy } from '../thermo/properties.ts';
import { parseEquation, type Equation, type Term } from './equation.ts';
import { UserError } from '../core/errors.ts';

export type Direction = 'galvanic' | 'electrolytic';

export interface ReactionProperties {
  reaction: string;
  electrons: number;
  temperature_K: number;
  deltaH_J_per_mol: number;
  deltaS_J_per_mol_K: number;
  deltaG_J_per_mol: number;
  reversibleVoltage_V: number;
  thermoneutralVoltage_V: number;
  dEdT_V_per_K: number;
  direction: Direction;
}

/**
 * Electrons transferred per reaction as written: as given, else 4 per net O2 consumed or
 * produced (O2 + 4e⁻ → 2 O²⁻ at the oxygen electrode), else null: a reaction without O2 (steam
 * reforming, the water-gas shift) is taken as a chemical reaction that passes no charge through
 * a cell.
 */
export function inferredElectrons(equation: Equation, override?: number): number | null {
  if (override !== undefined) {
    if (!(override > 0) || !Number.isFinite(override)) throw new UserError(`--electrons must be a positive number, got ${override}`);
    return override;
  }
  const o2 = equation.terms.find((t) => t.species.label === 'O2');
  return o2 ? 4 * Math.abs(o2.nu) : null;
}

/** The electrons of inferredElectrons, which a voltage needs: a reaction without them is refused. */
function electronsOf(equation: Equation, override?: number): number {
  const n = inferredElectrons(equation, override);
  if (n === null) {
    throw new UserError(`equation "${equation.text}" has no O2, so the electrons transferred cannot be inferred; give them with --electrons N`);
  }
  return n;
}

/** The thermodynamics of any reaction, electrochemical or not. */
export interface ChemicalProperties {
  reaction: string;
  temperature_K: number;
  deltaH_J_per_mol: number;
  deltaS_J_per_mol_K: number;
  deltaG_J_per_mol: number;
  /** ln K = −ΔG°/RT. */
  lnEquilibriumConstant: number;
  /** log10 K = ln K / ln 10. */
  log10EquilibriumConstant: number;
  /** K = exp(−ΔG°/RT), pressures in bar (so in bar^Σν); null where it lies beyond double precision (below 2.2e-308 or above 1.8e308). */
  equilibriumConstant: number | null;
}

/**
 * ΔH°, ΔS°, ΔG° = ΔH° − TΔS° and the equilibrium constant K = exp(−ΔG°/RT) of the reaction as
 * written at T (standard state 1 bar: K is in bar^Σν of the gases). Source: the definition of the
 * standard equilibrium constant, e.g. J. M. Smith, H. C. Van Ness and M. M. Abbott, Introduction
 * to Chemical Engineering Thermodynamics, 7th ed. (McGraw-Hill, 2005), § 13.3, eq. 13.11.
 */
export function chemicalProperties(equation: Equation, temperatureK: number): ChemicalProperties {
  const dH = reactionEnthalpy(equation.terms, temperatureK);
  const dS = reactionEntropy(equation.terms, temperatureK);
  const dG = dH - temperatureK * dS;
  const lnK = lnEquilibriumConstant(equation.terms, temperatureK);
  const k = Math.exp(lnK);
  return {
    reaction: equation.text,
    temperature_K: temperatureK,
    deltaH_J_per_mol: dH,
    deltaS_J_per_mol_K: dS,
    deltaG_J_per_mol: dG,
    lnEquilibriumConstant: lnK,
    log10EquilibriumConstant: lnK / Math.LN10,
    equilibriumConstant: Number.isFinite(k) && k >= Number.MIN_VALUE * 2 ** 52 ? k : null,
  };
}

/** Σ ν_i h_i(T), J/mol of reaction as written. */
function reactionEnthalpy(terms: readonly Term[], temperatureK: number): number {
  return terms.reduce((sum, t) => sum + t.nu * enthalpy(t.species, temperatureK), 0);
}

/** Σ ν_i s_i(T), J/(mol K) of reaction as written. */
function reactionEntropy(terms: readonly Term[], temperatureK: number): number {
  return terms.reduce((sum, t) => sum + t.nu * entropy(t.species, temperatureK), 0);
}

export function reactionProperties(equation: Equation, temperatureK: number, electrons?: number): ReactionProperties {
  const n = electronsOf(equation, electrons);
  const { deltaH_J_per_mol: dH, deltaS_J_per_mol_K: dS, deltaG_J_per_mol: dG } = chemicalProperties(equation, temperatureK);
  const direction: Direction = dG < 0 ? 'galvanic' : 'electrolytic';
  return {
    reaction: equation.text,
    electrons: n,
    temperature_K: temperatureK,
    deltaH_J_per_mol: dH,
    deltaS_J_per_mol_K: dS,
    deltaG_J_per_mol: dG,
    reversibleVoltage_V: Math.abs(dG) / (n * F),
    thermoneutralVoltage_V: Math.abs(dH) / (n * F),
    dEdT_V_per_K: ((direction === 'galvanic' ? 1 : -1) * dS) / (n * F),
    direction,
  };
}

/** Parses the equation text and evaluates it. */
export function evaluateReaction(text: string, temperatureK: number, electrons?: number): ReactionProperties {
  return reactionProperties(parseEquation(text), temperatureK, electrons);
}

/** ΔG° = ΔH° − TΔS°, J/mol of reaction as written. */
function reactionGibbsEnergy(terms: readonly Term[], temperatureK: number): number {
  return reactionEnthalpy(terms, temperatureK) - temperatureK * reactionEntropy(terms, temperatureK);
}

/** ln K = −ΔG°/RT of the reaction as written (pressures in bar). */
export function lnEquilibriumConstant(terms: readonly Term[], temperatureK: number): number {
  return -reactionGibbsEnergy(terms, temperatureK) / (R * temperatureK);
}

/**
 * Nernst potential of the reaction as written, galvanic sign (E > 0 when it runs spontaneously):
 *   E = −ΔG°/(nF) − RT/(nF) · Σ ν_i ln a_i
 * with a_i = p_i / 1 bar for gases and a_i = 1 for condensed phases.
 */
export function nernstPotential(
  equation: Equation,
  temperatureK: number,
  partialPressuresBar: Readonly<Record<string, number>>,
  electrons?: number,
): number {
  const n = electronsOf(equation, electrons);
  let lnQ = 0;
  for (const t of equation.terms) {
    if (t.species.phase === 'condensed') continue;
    const p = partialPressuresBar[t.species.label];
    if (p === undefined || !(p > 0)) {
      throw new UserError(`Nernst potential of "${equation.text}": a positive partial pressure of ${t.species.label} is needed`);
    }
    lnQ += t.nu * Math.log(p);
  }
  const dG = reactionGibbsEnergy(equation.terms, temperatureK);
  return (-dG - R * temperatureK * lnQ) / (n * F);
}
