/**
 * Chemical equilibrium at fixed enthalpy and pressure (the HP problem): the products of a set
 * of reactant streams at the temperature where their equilibrium mixture has the reactants'
 * enthalpy (plus any heat added): the adiabatic flame temperature of an off-gas oxidiser, the
 * outlet of an adiabatic pre-reformer.
 *
 *   find T such that  H_eq(T) = Σ_k Σ_i n_ik h°_i(T_k) + Q_added
 *   where H_eq(T) = Σ_j n_j(T) h°_j(T) + n_c(T) h°_c(T) with n(T) minimising G at (T, P)
 *
 * Equivalent to minimising G subject to the element balances and the energy equation, as NASA
 * RP-1311 (S. Gordon and B. J. McBride, 1994, ch. 2) poses the HP problem; here the composition
 * at each T is the project's element-potential minimiser (gibbs-minimiser.ts), and T is found by
 * Newton's method on the energy equation, T ← T − (H_eq(T) − H_target)/c_p,eq(T), with the
 * equilibrium heat capacity c_p,eq = dH_eq/dT of RP-1311 (equilibrium-heat-capacity.ts). Newton
 * is safeguarded by a bracket (W. H. Press et al., Numerical Recipes, 3rd ed., §9.4, "rtsafe"):
 * H_eq(T) rises with T, so each evaluation narrows [T_low, T_high], and a step that leaves the
 * bracket, or one that has not halved the residual, is replaced by bisection; it converges
 * whenever the root lies in the species data's temperature range, and says so when it does not.
 * Converged when |H_eq − H_target| ≤ 1e-12 · Σ_j n_j |h°_j| (the size of the terms summed).
 */
import { gOverRT } from '../thermo/properties.ts';
import { mixtureEnthalpyJ } from '../thermo/mixture.ts';
import { ConvergenceError, UserError } from '../core/errors.ts';
import { minimiseGibbs, type MinimiserResult } from './gibbs-minimiser.ts';
import { elementAmounts, elementsOfFeed, gasGibbsOverRT, systemFor, type ChemicalSystem } from './species-set.ts';
import { describe, validateFeed, type Equilibrium } from './equilibrate.ts';
import { equilibriumEnthalpy, type MixtureEnthalpy } from './equilibrium-heat-capacity.ts';

const METHOD = 'adiabatic equilibrium (Newton on temperature)';
const MAX_ITERATIONS = 100;
/** Converged energy balance, relative to the size of the enthalpy terms (Σ n_j |h°_j|). */
const TOLERANCE = 1e-12;
/** Accepted when the bracket has closed to rounding but the residual still sits above TOLERANCE. */
const ACCEPTABLE = 1e-10;

/** A reactant stream: species label → amount (mol, or mol/s for flows) at its own temperature. */
export interface ReactantStream {
  amounts: Readonly<Record<string, number>>;
  temperatureK: number;
}

export interface AdiabaticRequest {
  reactants: readonly ReactantStream[];
  pressureBar: number;
  /** Heat added to the reactants, J on their scale (W for flows); negative for a heat loss. Default 0. */
  heatAddedJ?: number;
  /** Let graphite form as a pure solid (default false). */
  allowGraphite?: boolean;
  /** Restrict the gas species considered to these labels (default: every species of the elements present). */
  species?: readonly string[];
  /** Where Newton starts, K (default: the hottest reactant's temperature). */
  initialTemperatureK?: number;
}

export interface AdiabaticEquilibrium extends Equilibrium {
  /** Σ reactant enthalpies + heat added: the enthalpy the products must carry, J on the feed's scale. */
  targetEnthalpyJ: number;
  /** Enthalpy of the products found, J. */
  productEnthalpyJ: number;
  /** |productEnthalpyJ − targetEnthalpyJ| / Σ_j n_j |h°_j(T)| of the products. */
  energyBalanceError: number;
  /** Frozen and equilibrium heat capacity of the products at T, J/K. */
  frozenHeatCapacityJPerK: number;
  equilibriumHeatCapacityJPerK: number;
  /** Temperature iterations (each one a Gibbs minimisation). */
  temperatureIterations: number;
}

/** The reactants' streams merged into one feed (species label → amount), for the element balance. */
function mergedFeed(reactants: readonly ReactantStream[]): Record<string, number> {
  const feed: Record<string, number> = {};
  for (const stream of reactants) {
    for (const [label, amount] of Object.entries(stream.amounts)) feed[label] = (feed[label] ?? 0) + amount;
  }
  return feed;
}

/** Adiabatic (fixed-enthalpy, fixed-pressure) equilibrium of reactant streams each at its own temperature. */
export function adiabaticEquilibrium(request: AdiabaticRequest): AdiabaticEquilibrium {
  if (request.reactants.length === 0) throw new UserError('adiabatic equilibrium: give at least one reactant stream');
  for (const stream of request.reactants) {
    if (!(stream.temperatureK > 0)) throw new UserError(`adiabatic equilibrium: a reactant temperature must be positive, got ${stream.temperatureK} K`);
  }
  const feed = mergedFeed(request.reactants);
  validateFeed(feed);
  const heatAddedJ = request.heatAddedJ ?? 0;
  if (!Number.isFinite(heatAddedJ)) throw new UserError(`adiabatic equilibrium: the heat added must be a finite number, got ${heatAddedJ}`);
  const targetEnthalpyJ = request.reactants.reduce((h, s) => h + mixtureEnthalpyJ(s.amounts, s.temperatureK), heatAddedJ);
  return equilibrateAtEnthalpy({
    feed,
    enthalpyJ: targetEnthalpyJ,
    pressureBar: request.pressureBar,
    initialTemperatureK: request.initialTemperatureK ?? Math.max(...request.reactants.map((s) => s.temperatureK)),
    ...(request.allowGraphite !== undefined ? { allowGraphite: request.allowGraphite } : {}),
    ...(request.species ? { species: request.species } : {}),
  });
}

export interface EnthalpyRequest {
  /** Species label → amount: sets the element amounts only. */
  feed: Readonly<Record<string, number>>;
  /** The enthalpy the equilibrium products must have, J on the feed's scale (heats of formation included). */
  enthalpyJ: number;
  pressureBar: number;
  initialTemperatureK: number;
  allowGraphite?: boolean;
  species?: readonly string[];
}

interface State {
  temperatureK: number;
  raw: MinimiserResult;
  heat: MixtureEnthalpy;
}

/** Equilibrium of the feed's elements at fixed enthalpy and pressure (the module comment's method). */
export function equilibrateAtEnthalpy(request: EnthalpyRequest): AdiabaticEquilibrium {
  const { feed, enthalpyJ, pressureBar } = request;
  validateFeed(feed);
  if (!(pressureBar > 0)) throw new UserError(`adiabatic equilibrium: pressure must be positive, got ${pressureBar} bar`);
  const system = systemFor(elementsOfFeed(feed), request.species);
  const b = elementAmounts(system, feed);
  const allowGraphite = request.allowGraphite === true;
  const range = temperatureRange(system, allowGraphite);
  let warmStart: Float64Array | undefined;
  const evaluate = (temperatureK: number): State => {
    const gRT = gasGibbsOverRT(system, temperatureK);
    const gGraphite = system.graphite ? gOverRT(system.graphite, temperatureK) : 0;
    const raw = minimiseGibbs(system, gRT, Math.log(pressureBar), b, gGraphite, { allowGraphite, ...(warmStart ? { warmStart } : {}) });
    warmStart = raw.lnScaled;
    return { temperatureK, raw, heat: equilibriumEnthalpy(system, temperatureK, raw) };
  };
  const { state, iterations } = solveTemperature(evaluate, enthalpyJ, range, request.initialTemperatureK);
  const residual = Math.abs(state.heat.enthalpyJ - enthalpyJ) / state.heat.enthalpyMagnitudeJ;
  return {
    ...describe(system, state.temperatureK, pressureBar, state.raw),
    targetEnthalpyJ: enthalpyJ,
    productEnthalpyJ: state.heat.enthalpyJ,
    energyBalanceError: residual,
    frozenHeatCapacityJPerK: state.heat.frozenHeatCapacityJPerK,
    equilibriumHeatCapacityJPerK: state.heat.equilibriumHeatCapacityJPerK,
    temperatureIterations: iterations,
  };
}

/** Where every species of the system has data: [max of the lower limits, min of the upper ones]. */
function temperatureRange(system: ChemicalSystem, allowGraphite: boolean): { lowK: number; highK: number } {
  const species = [...system.gas, ...(allowGraphite && system.graphite ? [system.graphite] : [])];
  return { lowK: Math.max(...species.map((s) => s.lowK)), highK: Math.min(...species.map((s) => s.highK)) };
}

/**
 * Safeguarded Newton on f(T) = H_eq(T) − H_target with f' = c_p,eq (rtsafe). The bracket starts
 * at the species data's range, unverified; an end becomes verified once f has been seen with
 * the right sign there. A step beyond an unverified end goes to that end, so a root outside the
 * range is found out by evaluating there.
 */
function solveTemperature(
  evaluate: (temperatureK: number) => State,
  targetJ: number,
  range: { lowK: number; highK: number },
  startK: number,
): { state: State; iterations: number } {
  let low = range.lowK;
  let high = range.highK;
  let lowSeen = false;
  let highSeen = false;
  let temperatureK = Math.min(high, Math.max(low, startK));
  let previous = Infinity;
  let last: State | undefined;
  for (let iteration = 1; iteration <= MAX_ITERATIONS; iteration++) {
    const state = evaluate(temperatureK);
    last = state;
    const f = state.heat.enthalpyJ - targetJ;
    const scale = state.heat.enthalpyMagnitudeJ;
    if (Math.abs(f) <= TOLERANCE * scale) return { state, iterations: iteration };
    if (f < 0) {
      if (temperatureK >= range.highK) throw outOfRange('above', range, targetJ, state);
      low = temperatureK;
      lowSeen = true;
    } else {
      if (temperatureK <= range.lowK) throw outOfRange('below', range, targetJ, state);
      high = temperatureK;
      highSeen = true;
    }
    if (lowSeen && highSeen && high - low <= 4 * Number.EPSILON * high) {
      if (Math.abs(f) <= ACCEPTABLE * scale) return { state, iterations: iteration };
      throw new ConvergenceError(METHOD, iteration, Math.abs(f) / scale, 'the temperature bracket closed before the energy balance did');
    }
    let next = temperatureK - f / state.heat.equilibriumHeatCapacityJPerK;
    const slow = Math.abs(f) > 0.5 * previous && lowSeen && highSeen;
    if (!Number.isFinite(next) || next >= high || next <= low || slow) {
      if (!(next < high) && !highSeen) next = high;
      else if (!(next > low) && !lowSeen) next = low;
      else next = 0.5 * (low + high);
    }
    previous = Math.abs(f);
    temperatureK = next;
  }
  const residual = last ? Math.abs(last.heat.enthalpyJ - targetJ) / last.heat.enthalpyMagnitudeJ : Number.NaN;
  throw new ConvergenceError(METHOD, MAX_ITERATIONS, residual);
}

function outOfRange(side: 'above' | 'below', range: { lowK: number; highK: number }, targetJ: number, state: State): UserError {
  const end = side === 'above' ? range.highK : range.lowK;
  return new UserError(
    `adiabatic equilibrium: the products would need a temperature ${side} ${end} K to carry the reactants' enthalpy ` +
      `(${targetJ.toPrecision(6)} J; at ${end} K they carry ${state.heat.enthalpyJ.toPrecision(6)} J), ` +
      `outside the species data's range ${range.lowK} K to ${range.highK} K`,
  );
}

