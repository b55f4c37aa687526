/**
 * The feed recuperator of an electrolysis plant fed with steam: a counter-flow exchanger in which
 * the stack's hot gas outlets (the hydrogen product and the oxygen side, both entering at the
 * stack temperature T_hi and leaving at one temperature T_ho) heat the gaseous feeds (the steam
 * as it leaves the evaporator at T_sat, the sweep gas and any gas fed with the steam at their
 * supply temperatures) towards their stack inlet temperatures. Composite curves (Linnhoff et al.,
 * "A User Guide on Process Integration for the Efficient Use of Energy", IChemE 1982, from memory;
 * the method of any heat-integration text):
 *   hot:  Q_h(T) = Σ_j [H_j(T_hi) − H_j(T)]                      (released from T_hi down to T)
 *   cold: C(T) = Σ_i [H_i(min(max(T, T_i,in), T_i,target)) − H_i(T_i,in)]   (absorbed from the cold end up to T)
 * with absolute enthalpies of the species data (ideal gas). The duty Q is the largest for which,
 * at every point of the exchanger, the hot side is at least ΔT_min hotter than the cold side:
 *   T_h(c) − T_c(c) ≥ ΔT_min for every c in [0, Q],  T_c(c): C(T_c) = c,  T_h(c): H_hot(T_h) = H_hot(T_ho) + c,
 * checked at the feeds' inlet and target temperatures (the kinks of the cold curve) and at 48
 * temperatures between, and found by bisection to 1e-9 of the duty. It is capped by the heat the
 * feeds can take (every feed at its target, C_max) and by the hot side's dew point (no water
 * condenses in the recuperator: T_ho ≥ T_dew of each hot stream). Every feed leaves at the one
 * temperature T* with C(T*) = Q (or its target if lower); what is left to heat each feed to its
 * inlet, H_i(T_i,target) − H_i(T*), is the trim heater's duty.
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
  /** The id of the duty that heats it to the stack inlet without the recuperator. */
  dutyId: string;
  id: string;
  name: string;
  flows: Record<string, number>;
  fromK: number;
  targetK: number;
  pressureBar: number;
}

/** A hot gas outlet of the stack, at the stack temperature. */
export interface HotOutlet {
  id: string;
  name: string;
  flows: Record<string, number>;
  pressureBar: number;
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
  feeds: { dutyId: string; id: string; name: string; fromK: number; toK: number; targetK: number; pressureBar: number; flows: Record<string, number>; dutyW: number }[];
  outlets: { id: string; name: string; pressureBar: number; flows: Record<string, number> }[];
}

/** The feed's temperature inside [its inlet, its target]. */
function clampK(t: number, feed: ColdFeed): number {
  return Math.min(Math.max(t, feed.fromK), feed.targetK);
}

/** C(T): heat the feeds take from their inlets up to T, W. */
function coldAbsorbed(feeds: readonly ColdFeed[], t: number): number {
  return feeds.reduce((a, f) => a + H(f.flows, clampK(t, f)) - H(f.flows, f.fromK), 0);
}

/** T with C(T) = c, by bisection between the coldest inlet and the hottest target (C rises with T). */
function coldTemperatureK(feeds: readonly ColdFeed[], c: number, lowK: number, highK: number): number {
  let lo = lowK;
  let hi = highK;
  for (let k = 0; k < 100 && hi - lo > 1e-9; k++) {
    const mid = (lo + hi) / 2;
    if (coldAbsorbed(feeds, mid) < c) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

/** The dew point of a hot outlet, T_sat(x_H2O p) (IAPWS-IF97 region 4), or null without water vapour. */
function dewPointK(outlet: HotOutlet): number | null {
  const water = outlet.flows.H2O ?? 0;
  if (!(water > 0)) return null;
  return waterDewPointK((water / totalFlow(outlet.flows)) * outlet.pressureBar * PA_PER_BAR);
}

/** The temperatures the two sides are at over the exchanger for a duty Q: the hot outlet and the least T_h − T_c (the module comment). */
function profile(feeds: readonly ColdFeed[], hot: Record<string, number>, hotInletK: number, dutyW: number) {
  const lowK = Math.min(...feeds.map((f) => f.fromK));
  const highK = Math.max(...feeds.map((f) => f.targetK));
  const hotOutletK = temperatureAtEnthalpyK(hot, H(hot, hotInletK) - dutyW, hotInletK);
  const hotOut = H(hot, hotOutletK);
  const topK = dutyW >= coldAbsorbed(feeds, highK) ? highK : coldTemperatureK(feeds, dutyW, lowK, highK);
  const points = new Set<number>([lowK, topK]);
  for (const f of feeds) for (const t of [f.fromK, f.targetK]) if (t >= lowK && t <= topK) points.add(t);
  for (let k = 1; k < 48; k++) points.add(lowK + ((topK - lowK) * k) / 48);
  let smallest = Infinity;
  for (const tc of points) {
    const th = temperatureAtEnthalpyK(hot, hotOut + coldAbsorbed(feeds, tc), hotInletK);
    smallest = Math.min(smallest, th - tc);
  }
  return { hotOutletK, coldOutletK: topK, smallestApproachK: smallest };
}

/** The recuperator's duty, temperatures and what limits it (the module comment). */
export function recuperate(outlets: readonly HotOutlet[], hotInletK: number, feeds: readonly ColdFeed[], minimumApproachK: number): Recuperation {
  const hot = plus(...outlets.map((o) => o.flows));
  const highK = Math.max(...feeds.map((f) => f.targetK));
  const dews = outlets.map(dewPointK).filter((t): t is number => t !== null);
  const hotDewPointK = dews.length ? Math.max(...dews) : null;
  const coldMax = coldAbsorbed(feeds, highK);
  const dewCap = hotDewPointK !== null && hotDewPointK < hotInletK ? H(hot, hotInletK) - H(hot, hotDewPointK) : Infinity;
  const cap = Math.min(coldMax, dewCap);
  const feasible = (q: number) => profile(feeds, hot, hotInletK, q).smallestApproachK >= minimumApproachK;
  let dutyW: number;
  let limitedBy: Recuperation['limitedBy'];
  if (feasible(cap)) {
    dutyW = cap;
    limitedBy = cap === coldMax ? 'feeds-at-target' : 'dew-point';
  } else {
    let lo = 0;
    let hi = cap;
    while (hi - lo > 1e-9 * cap) {
      const mid = (lo + hi) / 2;
      if (feasible(mid)) lo = mid;
      else hi = mid;
    }
    dutyW = lo;
    limitedBy = 'minimum-approach';
  }
  const p = profile(feeds, hot, hotInletK, dutyW);
  const heated = feeds.map((f) => {
    const toK = clampK(p.coldOutletK, f);
    return { dutyId: f.dutyId, id: f.id, name: f.name, fromK: f.fromK, toK, targetK: f.targetK, pressureBar: f.pressureBar, flows: f.flows, dutyW: H(f.flows, toK) - H(f.flows, f.fromK) };
  });
  // The duty the feeds take, and the hot outlet that gives exactly it up (the plant's first law closes on these).
  const takenW = heated.reduce((a, f) => a + f.dutyW, 0);
  return {
    minimumApproachK,
    dutyW: takenW,
    hotInletK,
    hotOutletK: temperatureAtEnthalpyK(hot, H(hot, hotInletK) - takenW, p.hotOutletK),
    coldOutletK: p.coldOutletK,
    smallestApproachK: p.smallestApproachK,
    limitedBy,
    hotDewPointK,
    feeds: heated,
    outlets: outlets.map((o) => ({ id: o.id, name: o.name, pressureBar: o.pressureBar, flows: o.flows })),
  };
}
