/**
 * Enthalpy and heat capacity of an equilibrium mixture at fixed pressure: the frozen heat
 * capacity (composition held) and the equilibrium one (composition shifting with T as the
 * equilibrium requires), which is dH/dT along the equilibrium and so the derivative the
 * fixed-enthalpy (HP) problem's Newton step on T needs.
 *
 * Method: S. Gordon and B. J. McBride, NASA RP-1311 Part I (1994), ch. 2, "derivatives with
 * respect to temperature" (section and equation numbers quoted from memory). Differentiating the
 * equilibrium conditions μ_j/RT = g°_j/RT + ln(P/P°) + ln(n_j/n) = Σ_i a_ij π_i and the element
 * balances at fixed P with d(g°_j/RT)/d ln T = −h°_j/RT gives, for x_i = ∂π_i/∂ln T,
 * y = ∂ln n/∂ln T and, with graphite present, z = ∂n_c/∂ln T:
 *   Σ_k (Σ_j a_ij a_kj n_j) x_k + b_i^gas y + a_ic z = −Σ_j a_ij n_j h°_j/RT     (each element i)
 *   Σ_k b_k^gas x_k                                  = −Σ_j n_j h°_j/RT         (total amount)
 *   Σ_i a_ic x_i                                     = −h°_c/RT                 (graphite)
 *   ∂ln n_j/∂ln T = h°_j/RT + Σ_i a_ij x_i + y
 * and the equilibrium heat capacity
 *   c_p,eq/R = Σ_j n_j c°_p,j/R + n_c c°_p,c/R + Σ_j n_j (h°_j/RT) ∂ln n_j/∂ln T + (h°_c/RT) z.
 * The first two terms are the frozen heat capacity. The system is symmetric like the
 * minimiser's and is solved the same way (lib/equilibrium/linear.ts).
 */
import { cpOverR, hOverRT } from '../thermo/properties.ts';
import { GAS_CONSTANT_J_PER_MOL_K as R } from '../thermo/constants.ts';
import { solveScaledInPlace } from './linear.ts';
import type { MinimiserResult } from './gibbs-minimiser.ts';
import type { ChemicalSystem } from './species-set.ts';

export interface MixtureEnthalpy {
  /** H = Σ_j n_j h°_j(T) + n_c h°_c(T), J on the amounts' scale (heats of formation included). */
  enthalpyJ: number;
  /** Σ_j n_j |h°_j(T)| + n_c |h°_c(T)|, J: the size of the terms H sums, a scale for its rounding. */
  enthalpyMagnitudeJ: number;
  /** Frozen heat capacity Σ_j n_j c°_p,j + n_c c°_p,c, J/K. */
  frozenHeatCapacityJPerK: number;
  /** Equilibrium heat capacity dH/dT along the equilibrium at fixed P, J/K. */
  equilibriumHeatCapacityJPerK: number;
}

/** Enthalpy and heat capacities of the converged equilibrium `raw` of `system` at T. */
export function equilibriumEnthalpy(system: ChemicalSystem, temperatureK: number, raw: MinimiserResult): MixtureEnthalpy {
  const ns = system.gas.length;
  const graphite = raw.graphite > 0 && system.graphite ? system.graphite : undefined;
  const hRT = new Float64Array(ns);
  let enthalpyRT = 0;
  let magnitudeRT = 0;
  let frozenR = 0;
  for (let j = 0; j < ns; j++) {
    const s = system.gas[j]!;
    hRT[j] = hOverRT(s, temperatureK);
    enthalpyRT += raw.n[j]! * hRT[j]!;
    magnitudeRT += raw.n[j]! * Math.abs(hRT[j]!);
    frozenR += raw.n[j]! * cpOverR(s, temperatureK);
  }
  const hcRT = graphite ? hOverRT(graphite, temperatureK) : 0;
  if (graphite) {
    enthalpyRT += raw.graphite * hcRT;
    magnitudeRT += raw.graphite * Math.abs(hcRT);
    frozenR += raw.graphite * cpOverR(graphite, temperatureK);
  }
  const reactionR = reactionHeatCapacityOverR(system, raw, hRT, graphite ? hcRT : undefined);
  return {
    enthalpyJ: R * temperatureK * enthalpyRT,
    enthalpyMagnitudeJ: R * temperatureK * magnitudeRT,
    frozenHeatCapacityJPerK: R * frozenR,
    equilibriumHeatCapacityJPerK: R * (frozenR + reactionR),
  };
}

/**
 * The reaction part of c_p,eq/R: Σ_j n_j (h°_j/RT) ∂ln n_j/∂ln T + (h°_c/RT) z, from the linear
 * system of the module comment. Amounts are scaled to Σ n = 1 for the solve and scaled back.
 */
function reactionHeatCapacityOverR(system: ChemicalSystem, raw: MinimiserResult, hRT: Float64Array, hcRT: number | undefined): number {
  const ne = system.elements.length;
  const ns = system.gas.length;
  const withGraphite = hcRT !== undefined;
  const size = ne + 1 + (withGraphite ? 1 : 0);
  const last = ne;
  const scale = raw.totalGas + (withGraphite ? raw.graphite : 0);
  const n = new Float64Array(ns);
  for (let j = 0; j < ns; j++) n[j] = raw.n[j]! / scale;
  const matrix = new Float64Array(size * size);
  const rhs = new Float64Array(size);
  const a = system.a;
  for (let j = 0; j < ns; j++) {
    const nj = n[j]!;
    if (nj === 0) continue;
    for (let i = 0; i < ne; i++) {
      const aij = a[j * ne + i]!;
      if (aij === 0) continue;
      rhs[i] = rhs[i]! - aij * nj * hRT[j]!;
      matrix[i * size + last] = matrix[i * size + last]! + aij * nj;
      matrix[last * size + i] = matrix[last * size + i]! + aij * nj;
      for (let k = 0; k < ne; k++) {
        const akj = a[j * ne + k]!;
        if (akj !== 0) matrix[i * size + k] = matrix[i * size + k]! + aij * akj * nj;
      }
    }
    rhs[last] = rhs[last]! - nj * hRT[j]!;
  }
  if (withGraphite) {
    const c = ne + 1;
    const carbon = system.carbonIndex;
    matrix[carbon * size + c] = 1;
    matrix[c * size + carbon] = 1;
    rhs[c] = -hcRT;
  }
  if (!solveScaledInPlace(matrix, rhs, size, ne, new Float64Array(size))) return 0;
  let sum = 0;
  for (let j = 0; j < ns; j++) {
    const nj = n[j]!;
    if (nj === 0) continue;
    let dLn = hRT[j]! + rhs[last]!;
    for (let i = 0; i < ne; i++) dLn += a[j * ne + i]! * rhs[i]!;
    sum += nj * hRT[j]! * dLn;
  }
  if (withGraphite) sum += hcRT! * rhs[ne + 1]!;
  return sum * scale;
}
