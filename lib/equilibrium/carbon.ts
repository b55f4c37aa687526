/**
 * Carbon deposition: the activity of carbon in a gas relative to graphite, and the least steam
 * that keeps an equilibrated fuel gas free of it.
 *
 * Boudouard  2 CO ⇌ C(gr) + CO2:   a_C = K_B · p_CO² / p_CO2,   K_B = exp(−ΔG°_B/RT)
 * Cracking   CH4 ⇌ C(gr) + 2 H2:   a_C = K_M · p_CH4 / p_H2²,   K_M = exp(−ΔG°_M/RT)
 * (pressures in bar). For a gas at equilibrium both equal exp(π_C − g°_C(gr)/RT) from the element
 * potentials; a_C > 1 means graphite can deposit. Sources: J. R. Rostrup-Nielsen, "Catalytic
 * Steam Reforming", in Catalysis Science and Technology vol. 5 (Springer, 1984), §5 (carbon
 * limits from these equilibria); methods note of this project (carbon activity).
 *
 * Steam-to-carbon ratio S/C = mol H2O added / mol of combustible carbon (carbon of every species
 * but CO2), the reformer convention.
 */
import { GAS_CONSTANT_J_PER_MOL_K as R } from '../thermo/constants.ts';
import { gibbs, gOverRT } from '../thermo/properties.ts';
import { getSpecies } from '../thermo/species-data.ts';
import { minimiseGibbs } from './gibbs-minimiser.ts';
import { elementAmounts, elementsOfFeed, gasGibbsOverRT, systemFor } from './species-set.ts';
import { validateFeed } from './equilibrate.ts';
import { UserError, ConvergenceError, EXIT_VALIDATION } from '../core/errors.ts';

function lnK(temperatureK: number, products: [string, number][], reactants: [string, number][]): number {
  let dG = 0;
  for (const [name, nu] of products) dG += nu * gibbs(getSpecies(name), temperatureK);
  for (const [name, nu] of reactants) dG -= nu * gibbs(getSpecies(name), temperatureK);
  return -dG / (R * temperatureK);
}

/** Carbon activity from the Boudouard equilibrium, evaluated on the gas (mole fractions x, pressure P). */
export function boudouardCarbonActivity(x: Readonly<Record<string, number>>, temperatureK: number, pressureBar: number): number {
  const co = (x.CO ?? 0) * pressureBar;
  const co2 = (x.CO2 ?? 0) * pressureBar;
  if (co === 0) return 0;
  if (co2 === 0) return Infinity;
  return Math.exp(lnK(temperatureK, [['C(gr)', 1], ['CO2', 1]], [['CO', 2]]) + 2 * Math.log(co) - Math.log(co2));
}

/** Carbon activity from methane cracking, evaluated on the gas. */
export function crackingCarbonActivity(x: Readonly<Record<string, number>>, temperatureK: number, pressureBar: number): number {
  const ch4 = (x.CH4 ?? 0) * pressureBar;
  const h2 = (x.H2 ?? 0) * pressureBar;
  if (ch4 === 0) return 0;
  if (h2 === 0) return Infinity;
  return Math.exp(lnK(temperatureK, [['C(gr)', 1], ['H2', 2]], [['CH4', 1]]) + Math.log(ch4) - 2 * Math.log(h2));
}

/** Moles of combustible carbon (carbon of every species but CO2) in a stream. */
export function combustibleCarbon(stream: Readonly<Record<string, number>>): number {
  let carbon = 0;
  for (const [name, amount] of Object.entries(stream)) {
    const s = getSpecies(name);
    if (s.label !== 'CO2') carbon += amount * (s.formula.C ?? 0);
  }
  return carbon;
}

/**
 * The fuel with `steamMol` mol of H2O added (amounts in, amounts out: H2O joins the end of the
 * stream, or adds to the water it holds). The one way steam is added to a fuel; by the reformer
 * convention the steam of a steam-to-carbon ratio S/C is S/C × combustibleCarbon(fuel), carbon
 * in hydrocarbons, alcohols and CO counted and carbon already in CO2 not (J. R. Rostrup-Nielsen,
 * Catalytic Steam Reforming, Springer 1984; from memory); per mole of dry fuel with mole
 * fractions x_i that gives feed_i = (x_i + n_steam δ_i,H2O) / (1 + n_steam).
 */
export function addSteam(fuel: Readonly<Record<string, number>>, steamMol: number): Record<string, number> {
  return { ...fuel, H2O: (fuel.H2O ?? 0) + steamMol };
}

/**
 * Carbon activity of the gas-only equilibrium of `feed` at T, P (graphite not allowed to form).
 * A `chain` carries the last solution from call to call (a sweep or a root search over nearby
 * feeds starts each equilibrium from the previous one).
 */
export function equilibriumCarbonActivity(feed: Readonly<Record<string, number>>, temperatureK: number, pressureBar: number, chain?: { last?: { key: string; ln: Float64Array } }): number {
  const system = systemFor(elementsOfFeed(feed));
  if (system.carbonIndex < 0) return 0;
  const key = system.elements.join(',');
  const warm = chain?.last && chain.last.key === key ? { warmStart: chain.last.ln } : {};
  const r = minimiseGibbs(system, gasGibbsOverRT(system, temperatureK), Math.log(pressureBar), elementAmounts(system, feed), gOverRT(system.graphite!, temperatureK), warm);
  if (chain) chain.last = { key, ln: r.lnScaled };
  return r.carbonActivity;
}

/** The largest steam-to-carbon ratio the limit is searched up to; far beyond any reformer's (2–4). */
export const STEAM_TO_CARBON_SEARCH_LIMIT = 64;

/**
 * No steam-to-carbon ratio up to STEAM_TO_CARBON_SEARCH_LIMIT keeps the equilibrated gas free of
 * carbon. A fact about the fuel, not a failure of the search: steam adds H2O, which is already
 * fully oxidised, so it dilutes but does not remove an oxygen deficit. A fuel short of oxygen for
 * its carbon at a low temperature (where CH4 + CO2 ⇌ 2 C + 2 H2O runs forward) keeps a_C > 1 far
 * beyond any practical S/C, falling only as the gas is diluted.
 */
export class SteamLimitNotReached extends UserError {
  constructor(readonly temperatureK: number, readonly carbonActivity: number) {
    super(
      `at ${temperatureK.toFixed(2)} K the equilibrated fuel gas still has carbon activity ${carbonActivity.toPrecision(3)} at a steam-to-carbon ratio of ${STEAM_TO_CARBON_SEARCH_LIMIT}: no practical steam-to-carbon ratio keeps it free of carbon`,
      EXIT_VALIDATION,
    );
    this.name = 'SteamLimitNotReached';
  }
}

export interface SteamLimit {
  /** Least S/C at which the equilibrated gas has carbon activity ≤ 1 (0 if the dry fuel is already carbon-free). */
  minimumSteamToCarbon: number;
  /** Carbon activity of the equilibrated dry fuel (S/C = 0). */
  dryCarbonActivity: number;
  iterations: number;
}

/**
 * Minimum steam-to-carbon ratio: the root of ln a_C(S/C) = 0, where a_C is the carbon activity of
 * the gas-only equilibrium of fuel + S/C·C·H2O at T, P. a_C falls monotonically as steam is added,
 * so the root is bracketed by doubling (up to STEAM_TO_CARBON_SEARCH_LIMIT, beyond which
 * SteamLimitNotReached says so) and then found by the Illinois variant of regula falsi
 * (G. Dahlquist and Å. Björck, Numerical Methods, §6.2) to 1e-7 in S/C.
 */
export function minimumSteamToCarbon(fuel: Readonly<Record<string, number>>, temperatureK: number, pressureBar: number): SteamLimit {
  validateFeed(fuel);
  if (!(combustibleCarbon(fuel) > 0)) {
    throw new UserError('the fuel contains no combustible carbon, so it cannot deposit carbon and a steam-to-carbon ratio is not defined');
  }
  const chain = {};
  const f = (s: number) => Math.log(equilibriumCarbonActivity(addSteam(fuel, s * combustibleCarbon(fuel)), temperatureK, pressureBar, chain));
  const dry = f(0);
  if (dry <= 0) return { minimumSteamToCarbon: 0, dryCarbonActivity: Math.exp(dry), iterations: 1 };
  let low = 0;
  let fLow = dry;
  let high = 0.25;
  let fHigh = f(high);
  let iterations = 2;
  while (fHigh > 0) {
    low = high;
    fLow = fHigh;
    high *= 2;
    iterations++;
    if (high > STEAM_TO_CARBON_SEARCH_LIMIT) throw new SteamLimitNotReached(temperatureK, Math.exp(fHigh));
    fHigh = f(high);
  }
  let side = 0;
  for (let k = 0; k < 200; k++) {
    iterations++;
    const mid = (low * fHigh - high * fLow) / (fHigh - fLow);
    const fMid = f(mid);
    if (Math.abs(high - low) < 1e-7 || fMid === 0) return { minimumSteamToCarbon: mid, dryCarbonActivity: Math.exp(dry), iterations };
    if (fMid > 0) {
      low = mid;
      fLow = fMid;
      if (side === -1) fHigh /= 2;
      side = -1;
    } else {
      high = mid;
      fHigh = fMid;
      if (side === 1) fLow /= 2;
      side = 1;
    }
  }
  throw new ConvergenceError('steam-to-carbon limit', iterations, high - low);
}
