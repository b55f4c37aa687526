/**
 * A gas as amounts over a fixed list of species labels (typed arrays: the fuel path evaluates
 * hundreds of states per cell), with the conversions to mole fractions and partial pressures.
 */

export interface GasLayout {
  labels: readonly string[];
  index: ReadonlyMap<string, number>;
}

export function layout(labels: Iterable<string>): GasLayout {
  const list = [...new Set(labels)];
  return { labels: list, index: new Map(list.map((l, i) => [l, i])) };
}

/** Amounts (mol/s) of a stream on a layout; species absent from the layout are an error. */
export function amountsOn(gas: GasLayout, stream: Readonly<Record<string, number>> | null): Float64Array {
  const n = new Float64Array(gas.labels.length);
  if (!stream) return n;
  for (const [k, v] of Object.entries(stream)) {
    const i = gas.index.get(k);
    if (i === undefined) throw new Error(`species ${k} is not in the gas layout`);
    n[i] = n[i]! + v;
  }
  return n;
}

/** n + factor · change, for a change given by label. */
export function shifted(gas: GasLayout, base: Float64Array, change: Readonly<Record<string, number>>, factor: number): Float64Array {
  const n = new Float64Array(base);
  for (const [k, v] of Object.entries(change)) {
    const i = gas.index.get(k)!;
    n[i] = n[i]! + v * factor;
  }
  return n;
}

export function sum(n: ArrayLike<number>): number {
  let s = 0;
  for (let i = 0; i < n.length; i++) s += n[i]!;
  return s;
}

/**
 * Mole fractions. With vapourFraction > 0 (a liquid-water cell) the gas is saturated: water is
 * set to p_sat/P and the other species share the rest in proportion to their amounts.
 */
export function moleFractions(gas: GasLayout, n: Float64Array, vapourFraction: number): Float64Array {
  const x = new Float64Array(n.length);
  const water = gas.index.get('H2O');
  let dry = 0;
  for (let i = 0; i < n.length; i++) if (i !== water || vapourFraction === 0) dry += Math.max(0, n[i]!);
  const share = vapourFraction > 0 ? 1 - vapourFraction : 1;
  for (let i = 0; i < n.length; i++) {
    if (vapourFraction > 0 && i === water) continue;
    x[i] = dry > 0 ? (Math.max(0, n[i]!) / dry) * share : 0;
  }
  if (vapourFraction > 0 && water !== undefined) x[water] = vapourFraction;
  return x;
}

/** A record label → value of the entries above `threshold` (all when threshold is undefined). */
export function toRecord(gas: GasLayout, values: ArrayLike<number>, threshold?: number): Record<string, number> {
  const out: Record<string, number> = {};
  gas.labels.forEach((label, i) => {
    const v = values[i]!;
    if (threshold === undefined || v > threshold) out[label] = v;
  });
  return out;
}
