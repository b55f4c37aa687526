/**
 * The element balance of the Gibbs minimiser (gibbs-minimiser.ts): how far a set of amounts is
 * off it, which elements count as trace, and the refinement that balances chosen elements to the
 * last digits on the element potentials alone.
 */
import { solveScaledInPlace } from './linear.ts';
import type { ChemicalSystem } from './species-set.ts';

/**
 * Every element conserved to this, relative, for a run to count as converged (RP-1311 §3.3,
 * tightened; newton-iteration.ts says why).
 */
export const ELEMENT_TOLERANCE = 5e-13;

/** Elements below this share of all atoms are "trace" for the polishing step. */
export const TRACE_ELEMENT = 1e-6;

/** The trace elements (share below TRACE_ELEMENT), carbon excepted when graphite fixes its potential. */
export function traceElements(system: ChemicalSystem, b: Float64Array, graphite: boolean): number[] {
  const trace: number[] = [];
  for (let i = 0; i < b.length; i++) if (b[i]! < TRACE_ELEMENT && !(graphite && i === system.carbonIndex)) trace.push(i);
  return trace;
}

/** Every element whose potential the gas alone sets: all of them, carbon excepted when graphite is present. */
export function gasElements(system: ChemicalSystem, graphite: boolean): number[] {
  return system.elements.map((_, i) => i).filter((i) => !(graphite && i === system.carbonIndex));
}

/** Largest relative balance error over the elements whose share is at least `atLeast` (all by default). */
export function elementError(system: ChemicalSystem, b: Float64Array, n: Float64Array, graphite: number, atLeast = 0): number {
  const ne = system.elements.length;
  let worst = 0;
  for (let i = 0; i < ne; i++) {
    if (b[i]! < atLeast) continue;
    let s = i === system.carbonIndex ? graphite : 0;
    for (let j = 0; j < system.gas.length; j++) s += system.a[j * ne + i]! * n[j]!;
    worst = Math.max(worst, Math.abs(b[i]! - s) / b[i]!);
  }
  return worst;
}

/** The rows of one refinement step: the chosen elements' balance matrix, their residuals, and the worst relative residual. */
interface Rows {
  matrix: Float64Array;
  rhs: Float64Array;
  residual: Float64Array;
  previous: Float64Array;
  matrixCopy: Float64Array;
}

/** Σ_j a_ij a_kj n_j over the moved species, and b_i − Σ_j a_ij n_j, for the chosen elements; returns max |residual| / b_i. */
function balanceRows(system: ChemicalSystem, b: Float64Array, nj: Float64Array, chosen: number[], moved: number[], rows: Rows): number {
  const ne = system.elements.length;
  const a = system.a;
  const m = chosen.length;
  const { matrix, rhs, residual } = rows;
  matrix.fill(0);
  let worst = 0;
  for (let p = 0; p < m; p++) {
    const i = chosen[p]!;
    let held = 0;
    for (const j of moved) {
      const aij = a[j * ne + i]!;
      if (aij === 0) continue;
      held += aij * nj[j]!;
      for (let q = 0; q < m; q++) {
        const akj = a[j * ne + chosen[q]!]!;
        if (akj !== 0) matrix[p * m + q] = matrix[p * m + q]! + aij * akj * nj[j]!;
      }
    }
    rhs[p] = b[i]! - held;
    residual[p] = rhs[p]!;
    worst = Math.max(worst, Math.abs(rhs[p]!) / b[i]!);
  }
  return worst;
}

/**
 * Newton's step on the rows, damped (Levenberg-Marquardt: H + μ diag H) until no potential moves
 * by more than 2: where an element's balance hardly depends on some direction (oxygen held only
 * by CO, carbon by CO and a hydrocarbon) the undamped step runs off along it. Leaves the step in
 * rows.rhs; false where the rows cannot be solved or the step is not finite.
 */
function dampedStep(rows: Rows, m: number): boolean {
  const { matrix, rhs, residual, previous, matrixCopy } = rows;
  matrixCopy.set(matrix);
  let damping = 0;
  for (;;) {
    matrix.set(matrixCopy);
    for (let p = 0; p < m; p++) matrix[p * m + p] = matrixCopy[p * m + p]! * (1 + damping);
    rhs.set(residual);
    if (!solveScaledInPlace(matrix, rhs, m, m, previous)) return false;
    let largest = 0;
    for (let p = 0; p < m; p++) largest = Math.max(largest, Math.abs(rhs[p]!));
    if (largest <= 2 || damping > 1e12) {
      if (!Number.isFinite(largest)) return false;
      if (largest > 2) for (let p = 0; p < m; p++) rhs[p] = (rhs[p]! * 2) / largest;
      return true;
    }
    damping = damping === 0 ? 1e-6 : damping * 10;
  }
}

/**
 * Balances the chosen elements exactly, holding the potentials of the others: Newton on their
 * rows alone, Σ_k (Σ_j a_ij a_kj n_j) Δπ_k = b_i − Σ_j a_ij n_j, moving only species that
 * contain them, so every species stays at μ_j = Σ a_ij π_i (iterative refinement of the element
 * potentials, Smith and Missen 1982 ch. 6, where the residual is formed directly from the amounts
 * and is accurate to each element's own scale). First the trace elements: a trace element cannot
 * move the major species, but its balance, relative to its own tiny amount, feels every
 * rounding-level drift of the major potentials. Then, where a trace species also carries a
 * major element whose balance is fixed only by a tiny difference (carbon and oxygen equal to
 * twelve digits, the excess carried by a trace hydrocarbon), all elements together. Steps are damped
 * (Levenberg-Marquardt) until no potential moves by more than 2.
 */
export function polishElements(system: ChemicalSystem, b: Float64Array, ln: Float64Array, pi: Float64Array, nj: Float64Array, chosen: number[]): void {
  const ne = system.elements.length;
  const ns = system.gas.length;
  const a = system.a;
  const m = chosen.length;
  if (m === 0) return;
  // The species that hold any chosen element: only they move.
  const moved: number[] = [];
  for (let j = 0; j < ns; j++) {
    for (let p = 0; p < m; p++) {
      if (a[j * ne + chosen[p]!] !== 0) {
        moved.push(j);
        break;
      }
    }
  }
  const rows: Rows = { matrix: new Float64Array(m * m), rhs: new Float64Array(m), residual: new Float64Array(m), previous: new Float64Array(m), matrixCopy: new Float64Array(m * m) };
  let best = Infinity;
  let sinceBest = 0;
  for (let iteration = 0; iteration < 100; iteration++) {
    for (let j = 0; j < ns; j++) nj[j] = Math.exp(ln[j]!);
    const worst = balanceRows(system, b, nj, chosen, moved, rows);
    if (worst < 1e-15) break;
    // At the rounding floor the balance stops improving: once well inside the tolerance, two
    // steps without halving it end the refinement; anywhere, ten.
    if (worst < best / 2) {
      best = worst;
      sinceBest = 0;
    } else if (++sinceBest >= (worst < ELEMENT_TOLERANCE / 10 ? 2 : 10)) break;
    if (!dampedStep(rows, m)) return;
    for (let p = 0; p < m; p++) {
      const i = chosen[p]!;
      pi[i] = pi[i]! + rows.rhs[p]!;
      for (const j of moved) {
        const aij = a[j * ne + i]!;
        if (aij !== 0) ln[j] = ln[j]! + aij * rows.rhs[p]!;
      }
    }
  }
  for (let j = 0; j < ns; j++) nj[j] = Math.exp(ln[j]!);
}
