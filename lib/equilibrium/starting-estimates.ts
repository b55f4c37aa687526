/**
 * Where the Gibbs minimiser (gibbs-minimiser.ts) starts: each species at the share of its
 * scarcest element, or RP-1311's uniform start (S. Gordon and B. J. McBride, NASA RP-1311, 1994,
 * §3.1) for a run that has to begin again.
 */
import type { ChemicalSystem } from './species-set.ts';

/**
 * Starting amounts: each species gets the share of its scarcest element, n_j = min_i b_i / (a_ij S_i)
 * with S_i the number of species containing element i. (RP-1311 starts every species at 0.1/NS;
 * that overstates an element present at 1e-30 by thirty orders and costs dozens of damped
 * iterations, whereas this start never puts more of an element in play than the feed holds.)
 * Returns ln of the total.
 */
export function initialEstimate(system: ChemicalSystem, b: Float64Array, ln: Float64Array): number {
  const ne = system.elements.length;
  const ns = system.gas.length;
  const holders = new Float64Array(ne);
  for (let j = 0; j < ns; j++) for (let i = 0; i < ne; i++) if (system.a[j * ne + i]! > 0) holders[i] = holders[i]! + 1;
  let total = 0;
  for (let j = 0; j < ns; j++) {
    let share = Infinity;
    for (let i = 0; i < ne; i++) {
      const aij = system.a[j * ne + i]!;
      if (aij > 0) share = Math.min(share, b[i]! / (aij * holders[i]!));
    }
    ln[j] = Math.log(share);
    total += share;
  }
  return Math.log(total);
}

export function sumExp(ln: Float64Array): number {
  let s = 0;
  for (let j = 0; j < ln.length; j++) s += Math.exp(ln[j]!);
  return s;
}

/** RP-1311's own start (§3.1): every species at 0.1/NS on the normalised scale. */
export function uniformEstimate(ns: number): Float64Array {
  return new Float64Array(ns).fill(Math.log(0.1 / ns));
}
