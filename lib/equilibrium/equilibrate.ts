/**
 * Equilibrium of a gas feed at fixed T and P, in the terms a user gives: species label → amount
 * (any units of amount; results are mole fractions and amounts on the feed's scale).
 * The computation is lib/equilibrium/gibbs-minimiser.ts; this module maps names and units.
 */
import { gOverRT } from '../thermo/properties.ts';
import { getSpecies } from '../thermo/species-data.ts';
import { minimiseGibbs, type MinimiserResult } from './gibbs-minimiser.ts';
import { elementAmounts, elementsOfFeed, gasGibbsOverRT, systemFor, systemWithInerts, type ChemicalSystem } from './species-set.ts';
import { UserError } from '../core/errors.ts';

export interface EquilibriumRequest {
  temperatureK: number;
  pressureBar: number;
  /** Species label → amount (mol or mol/s; only ratios matter for the composition). */
  feed: Readonly<Record<string, number>>;
  /** Let graphite form as a pure solid (default false: gas only, carbon activity reported). */
  allowGraphite?: boolean;
  /** Restrict the gas species considered to these labels (default: every species of the elements present). */
  species?: readonly string[];
  /** Species of the feed that take no part in any reaction but dilute the gas (lib/equilibrium/species-set.ts systemWithInerts). */
  inert?: readonly string[];
}

export interface Equilibrium {
  temperatureK: number;
  pressureBar: number;
  system: ChemicalSystem;
  /** Gas mole fractions by species label, every species considered (graphite excluded). */
  moleFractions: Record<string, number>;
  /** Gas amounts on the feed's scale. */
  amounts: Record<string, number>;
  totalGas: number;
  graphite: number;
  carbonActivity: number;
  elementBalanceError: number;
  iterations: number;
  raw: MinimiserResult;
}

/** Checks a feed map: known species, finite non-negative amounts, positive total. */
export function validateFeed(feed: Readonly<Record<string, number>>): void {
  const entries = Object.entries(feed);
  if (entries.length === 0) throw new UserError('the feed is empty: give species and amounts such as "CH4=1, H2O=2"');
  let total = 0;
  for (const [name, amount] of entries) {
    getSpecies(name);
    if (!Number.isFinite(amount) || amount < 0) throw new UserError(`feed: the amount of ${name} must be a non-negative number, got ${amount}`);
    total += amount;
  }
  if (!(total > 0)) throw new UserError('feed: the total amount must be positive');
}

export function equilibrate(request: EquilibriumRequest): Equilibrium {
  const { temperatureK, pressureBar, feed } = request;
  validateFeed(feed);
  if (!(pressureBar > 0)) throw new UserError(`equilibrium: pressure must be positive, got ${pressureBar} bar`);
  const system = request.inert?.length ? inertSystem(feed, request.inert, request.species) : systemFor(elementsOfFeed(feed), request.species);
  const gRT = gasGibbsOverRT(system, temperatureK);
  const gGraphite = system.graphite ? gOverRT(system.graphite, temperatureK) : 0;
  const b = elementAmounts(system, feed);
  const raw = minimiseGibbs(system, gRT, Math.log(pressureBar), b, gGraphite, { allowGraphite: request.allowGraphite === true });
  return describe(system, temperatureK, pressureBar, raw);
}

/**
 * Equilibrium of a gas given by its element amounts (element symbol → mol, or mol/s) rather
 * than by species: what a gas becomes once a known amount of each element has been added to or
 * taken from it (an electrode's exchange, a recycle loop balanced on elements).
 */
export function equilibrateElements(request: { temperatureK: number; pressureBar: number; elements: Readonly<Record<string, number>> }): Equilibrium {
  const { temperatureK, pressureBar, elements } = request;
  const names = Object.keys(elements).filter((e) => elements[e]! > 0);
  for (const [e, amount] of Object.entries(elements)) {
    if (!Number.isFinite(amount) || amount < 0) throw new UserError(`equilibrium: the amount of element ${e} must be a non-negative number, got ${amount}`);
  }
  if (!names.length) throw new UserError('equilibrium: no element has a positive amount');
  if (!(pressureBar > 0)) throw new UserError(`equilibrium: pressure must be positive, got ${pressureBar} bar`);
  const system = systemFor(names);
  const b = new Float64Array(system.elements.length);
  system.elements.forEach((e, i) => (b[i] = elements[e] ?? 0));
  const raw = minimiseGibbs(system, gasGibbsOverRT(system, temperatureK), Math.log(pressureBar), b, system.graphite ? gOverRT(system.graphite, temperatureK) : 0, { allowGraphite: false });
  return describe(system, temperatureK, pressureBar, raw);
}

/** The system of a feed with inert species: each must be in the feed, and something else must react. */
function inertSystem(feed: Readonly<Record<string, number>>, inert: readonly string[], only?: readonly string[]): ChemicalSystem {
  const labels = inert.map((name) => getSpecies(name).label);
  const inFeed = new Map(Object.entries(feed).map(([name, amount]) => [getSpecies(name).label, amount]));
  for (const label of labels) {
    if (!((inFeed.get(label) ?? 0) > 0)) throw new UserError(`inert species ${label} is not in the feed; an inert species is one of the feed's that does not react`);
  }
  const reacting = Object.fromEntries([...inFeed].filter(([label]) => !labels.includes(label)));
  const elements = elementsOfFeed(reacting);
  if (elements.length === 0) throw new UserError(`with ${labels.join(', ')} inert, nothing in the feed reacts`);
  return systemWithInerts(elements, labels, only);
}

/** Names the result of a minimisation by species label. */
export function describe(system: ChemicalSystem, temperatureK: number, pressureBar: number, raw: MinimiserResult): Equilibrium {
  const moleFractions: Record<string, number> = {};
  const amounts: Record<string, number> = {};
  const lnTotal = logSumExp(raw.lnScaled);
  system.gas.forEach((s, j) => {
    amounts[s.label] = raw.n[j]!;
    moleFractions[s.label] = Math.exp(raw.lnScaled[j]! - lnTotal);
  });
  return {
    temperatureK,
    pressureBar,
    system,
    moleFractions,
    amounts,
    totalGas: raw.totalGas,
    graphite: raw.graphite,
    carbonActivity: raw.carbonActivity,
    elementBalanceError: raw.elementBalanceError,
    iterations: raw.iterations,
    raw,
  };
}

/** ln Σ exp(v), without overflow or underflow. */
function logSumExp(ln: Float64Array): number {
  let m = -Infinity;
  for (const v of ln) m = Math.max(m, v);
  let s = 0;
  for (const v of ln) s += Math.exp(v - m);
  return m + Math.log(s);
}

/** Gibbs energy G/RT of a gas mixture (amounts n_j) at T, P: Σ n_j (g°_j/RT + ln P + ln x_j). */
export function mixtureGibbsOverRT(system: ChemicalSystem, temperatureK: number, pressureBar: number, n: ArrayLike<number>): number {
  const gRT = gasGibbsOverRT(system, temperatureK);
  let total = 0;
  for (let j = 0; j < n.length; j++) total += n[j]!;
  let g = 0;
  for (let j = 0; j < n.length; j++) {
    const nj = n[j]!;
    if (nj > 0) g += nj * (gRT[j]! + Math.log(pressureBar) + Math.log(nj / total));
  }
  return g;
}

