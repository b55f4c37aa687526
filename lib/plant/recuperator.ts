/**
 * The feed recuperator of an electrolysis plant fed with steam: a counter-flow exchanger in which
 * the stack's hot gas outlets (the hydrogen product and the oxygen side, both entering at the
 * stack temperature T_hi and leaving at one temperature T_ho) heat the feeds towards their stack
 * inlet temperatures: the feed water from its supply temperature T_w (heated as liquid to
 * T_sat = T_sat(p) of its electrode, evaporated at T_sat, superheated), the sweep gas and any gas
 * fed with the steam from their supply temperatures. Composite curves (Linnhoff et al., "A User
 * Guide on Process Integration for the Efficient Use of Energy", IChemE 1982, from memory; the
 * method of any heat-integration text, where an evaporating stream is a horizontal segment of
 * the cold composite curve at its saturation temperature):
 *   hot:  Q_h(T) = Σ_j [H_j(T_hi) − H_j(T)]                      (released from T_hi down to T)
 *   cold: C(T, x) = Σ_i [H_i(min(max(T, T_i,in), T_i,target), x) − H_i(T_i,in)]   (absorbed from the cold end up to T)
 * with absolute enthalpies of the species data (ideal gas; the water as H2O(L) below T_sat and
 * H2O above, so that H_H2O(T_sat) − H_H2O(L)(T_sat) = ṅ_w L(T_sat), lib/thermo/latent-heat.ts). At
 * T_sat the feed water is evaporated by the fraction x: C rises there from C(T_sat, 0) to
 * C(T_sat, 1) at one temperature (the flat segment). The duty Q is the largest for which, at every
 * point of the exchanger, the hot side is at least ΔT_min hotter than the cold side:
 *   T_h(c) − T_c(c) ≥ ΔT_min for every c in [0, Q],  T_c(c): C(T_c, x) = c,  T_h(c): H_hot(T_h) = H_hot(T_ho) + c,
 * checked at the feeds' inlet, target and saturation temperatures (the kinks of the cold curve;
 * at T_sat at both ends of the flat segment, c = C(T_sat, 0) and C(T_sat, 1), where the duty
 * reaches them), at 11 temperatures between each two of these and at the cold outlet, and found
 * by bisection to 1e-9 of the duty (the least approach falls as Q grows: the hot curve moves down).
 * It is capped by the heat the feeds can take (every feed at its target, C_max), by the hot side's
 * dew point (no water condenses in the recuperator: T_ho ≥ T_dew of each hot stream) and by the
 * cold end (T_ho ≥ the coldest feed inlet + ΔT_min, the approach at c = 0).
 * Every feed leaves at the one cold state (T*, x*) with C(T*, x*) = Q (or its target if lower):
 * the feed water liquid below T_sat, partly evaporated at it, or superheated above it. What is
 * left to take each feed to its inlet is its heaters' duty (electrolysis-plant.ts).
 */
import { mixtureEnthalpyJ } from '../thermo/mixture.ts';
import { temperatureAtEnthalpyK } from '../thermo/mixture-temperature.ts';
import { waterDewPointK } from '../thermo/water-saturation.ts';
import { PA_PER_BAR } from '../thermo/constants.ts';
import { totalFlow } from './streams.ts';
import { plus } from './plant-sheet.ts';

const H = mixtureEnthalpyJ;

/** A feed the recuperator heats: from its inlet temperature towards its target (the stack inlet). */
export interface ColdFeed {
  id: string;
  name: string;
  /** The feed as it reaches its target: a gas, or the feed water's ṅ_w as vapour { H2O: ṅ_w }. */
  flows: Record<string, number>;
  fromK: number;
  targetK: number;
  /** Feed water only: it is liquid below this temperature (T_sat at its pressure), evaporates at it and is vapour above; null for a gas. */
  saturationK: number | null;
  pressureBar: number;
}

/** A hot gas outlet of the stack, at the stack temperature. */
export interface HotOutlet {
  id: string;
  name: string;
  flows: Record<string, number>;
  pressureBar: number;
}

/** A feed as it leaves the recuperator: its temperature, the fraction of its water evaporated and its phases' flows. */
export interface RecuperatedFeed {
  id: string;
  name: string;
  fromK: number;
  toK: number;
  targetK: number;
  saturationK: number | null;
  pressureBar: number;
  /** The feed water's evaporated fraction as it leaves (0 liquid, 1 vapour); null for a gas. */
  vapourFraction: number | null;
  /** Its flows as it leaves, the water split into H2O(L) and H2O. */
  flows: Record<string, number>;
  dutyW: number;
}

export interface Recuperation {
  minimumApproachK: number;
  dutyW: number;
  hotInletK: number;
  hotOutletK: number;
  /** The temperature every feed leaves at (or its target, if lower), K. */
  coldOutletK: number;
  /** The least temperature difference between the two sides found over the exchanger, K. */
  smallestApproachK: number;
  /** What stops the duty growing: the minimum approach, every feed at its target, or the hot side's dew point. */
  limitedBy: 'minimum-approach' | 'feeds-at-target' | 'dew-point';
  /** The lowest temperature the hot side may leave at without condensing, K (null: no water in it). */
  hotDewPointK: number | null;
  feeds: RecuperatedFeed[];
  outlets: { id: string; name: string; pressureBar: number; flows: Record<string, number> }[];
}

/** A point of the cold side: the feeds' temperature T and, at a saturation temperature, the fraction x of the water evaporating there (0: before, 1: after the flat segment). */
interface ColdState {
  temperatureK: number;
  vapourFraction: number;
}

/** The feed's temperature inside [its inlet, its target]. */
function clampK(t: number, feed: ColdFeed): number {
  return Math.min(Math.max(t, feed.fromK), feed.targetK);
}

/** A feed's flows at T: feed water liquid below T_sat, vapour above, at T_sat evaporated by the fraction x; a gas as it is. */
function phaseFlows(feed: ColdFeed, t: number, x: number): Record<string, number> {
  const s = feed.saturationK;
  if (s === null) return feed.flows;
  const n = feed.flows.H2O ?? 0;
  const vapour = t > s ? 1 : t < s ? 0 : x;
  if (vapour === 0) return { 'H2O(L)': n };
  if (vapour === 1) return { H2O: n };
  return { 'H2O(L)': n * (1 - vapour), H2O: n * vapour };
}

/** H_i at the cold state, the feed's temperature held inside [its inlet, its target]. */
function feedEnthalpyJ(feed: ColdFeed, state: ColdState): number {
  const t = clampK(state.temperatureK, feed);
  return H(phaseFlows(feed, t, state.vapourFraction), t);
}

/** H_i at the feed's inlet (feed water: liquid). */
function inletEnthalpyJ(feed: ColdFeed): number {
  return H(phaseFlows(feed, feed.fromK, 0), feed.fromK);
}

/** C(T, x): heat the feeds take from their inlets up to the cold state, W. */
function coldAbsorbed(feeds: readonly ColdFeed[], state: ColdState): number {
  return feeds.reduce((a, f) => a + feedEnthalpyJ(f, state) - inletEnthalpyJ(f), 0);
}

/** The saturation temperatures the feed water evaporates at (the flat segments of the cold curve). */
function saturationsK(feeds: readonly ColdFeed[]): number[] {
  return [...new Set(feeds.map((f) => f.saturationK).filter((s): s is number => s !== null))];
}

/**
 * The cold state with C = c (the inverse of the cold composite curve): on a flat segment, T = T_sat
 * and x = (c − C(T_sat, 0)) / (C(T_sat, 1) − C(T_sat, 0)); elsewhere T by bisection between the
 * coldest inlet and the hottest target (C rises with T), to 1e-9 K.
 */
function coldStateAt(feeds: readonly ColdFeed[], c: number, lowK: number, highK: number): ColdState {
  for (const s of saturationsK(feeds)) {
    const before = coldAbsorbed(feeds, { temperatureK: s, vapourFraction: 0 });
    const after = coldAbsorbed(feeds, { temperatureK: s, vapourFraction: 1 });
    if (c >= before && c <= after && after > before) return { temperatureK: s, vapourFraction: (c - before) / (after - before) };
  }
  let lo = lowK;
  let hi = highK;
  for (let k = 0; k < 100 && hi - lo > 1e-9; k++) {
    const mid = (lo + hi) / 2;
    if (coldAbsorbed(feeds, { temperatureK: mid, vapourFraction: 1 }) < c) lo = mid;
    else hi = mid;
  }
  return { temperatureK: (lo + hi) / 2, vapourFraction: 1 };
}

/** The dew point of a hot outlet, T_sat(x_H2O p) (IAPWS-IF97 region 4), or null without water vapour. */
function dewPointK(outlet: HotOutlet): number | null {
  const water = outlet.flows.H2O ?? 0;
  if (!(water > 0)) return null;
  return waterDewPointK((water / totalFlow(outlet.flows)) * outlet.pressureBar * PA_PER_BAR);
}

/**
 * The cold states the approach is checked at, up to the cold outlet T*: every feed's inlet and
 * target and every saturation temperature, each end of the evaporation (x = 0 and x = 1) where the
 * duty reaches it, 12 temperatures between each two of these, and the cold outlet itself.
 */
function checkedStates(feeds: readonly ColdFeed[], lowK: number, top: ColdState, dutyW: number): { state: ColdState; c: number }[] {
  const kinks = [...new Set([lowK, top.temperatureK, ...feeds.flatMap((f) => [f.fromK, f.targetK, ...(f.saturationK === null ? [] : [f.saturationK])])])]
    .filter((t) => t >= lowK && t <= top.temperatureK)
    .sort((a, b) => a - b);
  const states: ColdState[] = [];
  kinks.forEach((t, i) => {
    states.push({ temperatureK: t, vapourFraction: 0 }, { temperatureK: t, vapourFraction: 1 });
    const next = kinks[i + 1];
    if (next !== undefined) for (let k = 1; k < 12; k++) states.push({ temperatureK: t + ((next - t) * k) / 12, vapourFraction: 1 });
  });
  const points = states.map((state) => ({ state, c: coldAbsorbed(feeds, state) })).filter((p) => p.c <= dutyW);
  points.push({ state: top, c: dutyW });
  return points;
}

/** The temperatures the two sides are at over the exchanger for a duty Q: the hot outlet, the cold outlet state and the least T_h − T_c (the module comment). */
function profile(feeds: readonly ColdFeed[], hot: Record<string, number>, hotInletK: number, dutyW: number) {
  const lowK = Math.min(...feeds.map((f) => f.fromK));
  const highK = Math.max(...feeds.map((f) => f.targetK));
  const hotOutletK = temperatureAtEnthalpyK(hot, H(hot, hotInletK) - dutyW, hotInletK);
  const hotOut = H(hot, hotOutletK);
  const top: ColdState = dutyW >= coldAbsorbed(feeds, { temperatureK: highK, vapourFraction: 1 }) ? { temperatureK: highK, vapourFraction: 1 } : coldStateAt(feeds, dutyW, lowK, highK);
  let smallest = Infinity;
  for (const { state, c } of checkedStates(feeds, lowK, top, dutyW)) {
    const th = temperatureAtEnthalpyK(hot, hotOut + c, hotInletK);
    smallest = Math.min(smallest, th - state.temperatureK);
  }
  return { hotOutletK, top, smallestApproachK: smallest };
}

/** The largest duty in [0, cap] that keeps the minimum approach (to 1e-9 K: at the cold-end cap the approach is ΔT_min only to rounding), by bisection to 1e-9 of the cap (feasibility falls as the duty grows), and what limits it. */
function largestDuty(feeds: readonly ColdFeed[], hot: Record<string, number>, hotInletK: number, minimumApproachK: number, caps: { coldMax: number; dewCap: number; coldEndCap: number }): { dutyW: number; limitedBy: Recuperation['limitedBy'] } {
  const feasible = (q: number) => profile(feeds, hot, hotInletK, q).smallestApproachK >= minimumApproachK - 1e-9;
  const cap = Math.min(caps.coldMax, caps.dewCap, caps.coldEndCap);
  if (feasible(cap)) return { dutyW: cap, limitedBy: cap === caps.coldMax ? 'feeds-at-target' : cap === caps.dewCap ? 'dew-point' : 'minimum-approach' };
  let lo = 0;
  let hi = cap;
  while (hi - lo > 1e-9 * cap) {
    const mid = (lo + hi) / 2;
    if (feasible(mid)) lo = mid;
    else hi = mid;
  }
  return { dutyW: lo, limitedBy: 'minimum-approach' };
}

/** The recuperator's duty, temperatures and what limits it (the module comment). */
export function recuperate(outlets: readonly HotOutlet[], hotInletK: number, feeds: readonly ColdFeed[], minimumApproachK: number): Recuperation {
  const hot = plus(...outlets.map((o) => o.flows));
  const highK = Math.max(...feeds.map((f) => f.targetK));
  const dews = outlets.map(dewPointK).filter((t): t is number => t !== null);
  const hotDewPointK = dews.length ? Math.max(...dews) : null;
  const coldMax = coldAbsorbed(feeds, { temperatureK: highK, vapourFraction: 1 });
  const dewCap = hotDewPointK !== null && hotDewPointK < hotInletK ? H(hot, hotInletK) - H(hot, hotDewPointK) : Infinity;
  // The hot side leaves no colder than the coldest feed's inlet plus the minimum approach (the cold end of the exchanger).
  const coldEndK = Math.min(...feeds.map((f) => f.fromK)) + minimumApproachK;
  const coldEndCap = coldEndK < hotInletK ? H(hot, hotInletK) - H(hot, coldEndK) : 0;
  const { dutyW, limitedBy } = largestDuty(feeds, hot, hotInletK, minimumApproachK, { coldMax, dewCap, coldEndCap });
  const p = profile(feeds, hot, hotInletK, dutyW);
  const heated = feeds.map((f): RecuperatedFeed => {
    const toK = clampK(p.top.temperatureK, f);
    const flows = phaseFlows(f, toK, p.top.vapourFraction);
    const vapourFraction = f.saturationK === null ? null : (flows.H2O ?? 0) / (f.flows.H2O ?? 0);
    return { id: f.id, name: f.name, fromK: f.fromK, toK, targetK: f.targetK, saturationK: f.saturationK, pressureBar: f.pressureBar, vapourFraction, flows, dutyW: H(flows, toK) - inletEnthalpyJ(f) };
  });
  // The duty the feeds take, and the hot outlet that gives exactly it up (the plant's first law closes on these).
  const takenW = heated.reduce((a, f) => a + f.dutyW, 0);
  return {
    minimumApproachK,
    dutyW: takenW,
    hotInletK,
    hotOutletK: temperatureAtEnthalpyK(hot, H(hot, hotInletK) - takenW, p.hotOutletK),
    coldOutletK: p.top.temperatureK,
    smallestApproachK: p.smallestApproachK,
    limitedBy,
    hotDewPointK,
    feeds: heated,
    outlets: outlets.map((o) => ({ id: o.id, name: o.name, pressureBar: o.pressureBar, flows: o.flows })),
  };
}
