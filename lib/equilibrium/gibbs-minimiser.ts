/**
 * Ideal-gas chemical equilibrium at fixed temperature and pressure by Gibbs-energy minimisation
 * with element potentials (Lagrange multipliers), optionally with graphite as a pure condensed
 * phase.
 *
 * Minimise  G/RT = Σ_j n_j (g°_j/RT + ln(P/P°) + ln(n_j/n)) + n_c g°_c/RT
 * subject to Σ_j a_ij n_j + a_ic n_c = b_i for each element i, n_j ≥ 0.
 *
 * Method: S. Gordon and B. J. McBride, "Computer Program for Calculation of Complex Chemical
 * Equilibrium Compositions and Applications, I. Analysis", NASA RP-1311 (1994), ch. 2-3: Newton
 * iteration on the corrections Δln n_j, the element potentials π_i, Δn_c and Δln n, reduced to
 * (elements + condensed + 1) equations (RP-1311 eqs. 2.24-2.26 for fixed T and P):
 *   Σ_k Σ_j a_kj a_ij n_j π_k + Σ_c a_ic Δn_c + b_i^gas Δln n = b_i° − b_i + Σ_j a_ij n_j μ_j/RT
 *   Σ_i a_ic π_i = μ_c/RT                                         (each condensed phase c)
 *   Σ_i b_i^gas π_i + (Σ_j n_j − n) Δln n = n − Σ_j n_j + Σ_j n_j μ_j/RT
 *   Δln n_j = −μ_j/RT + Σ_i a_ij π_i + Δln n
 * with RP-1311's step control (eqs. 3.1-3.2): no major species' ln n_j moves by more than 2 per
 * iteration, and a trace species (mole fraction below 1e-8) rises at most to 1e-4; in addition
 * no species rises above 1e4 times what the feed holds of its scarcest element. A run that has
 * not converged after RESTART_AFTER iterations starts again from RP-1311's uniform estimate; one
 * that settles with a major element off balance lifts its species back to their starting amounts
 * and goes on (at most MAX_RESEEDS times). The linear
 * system is solved after symmetric diagonal scaling, since element amounts may differ by 30
 * orders of magnitude.
 * Amounts are carried as logarithms, so mole fractions far below 1e-30 neither underflow the
 * iteration nor ever become negative. The last digits of each element balance are refined on
 * the element potentials alone (polishElements), trace elements first. Graphite enters when the converged gas has carbon
 * activity exp(π_C − g°_C/RT) above 1 (RP-1311 §3.5) and leaves if its amount turns negative.
 * The same element-potential formulation is derived in W. R. Smith and R. W. Missen, Chemical
 * Reaction Equilibrium Analysis (Wiley, 1982), ch. 6.
 */
import { solveScaledInPlace } from './linear.ts';
import type { ChemicalSystem } from './species-set.ts';
import { ConvergenceError } from '../core/errors.ts';

const METHOD = 'gas equilibrium (Gibbs minimisation)';

/**
 * A ConvergenceError (so every caller that handles one handles it) worded for the cases a
 * residual does not describe: an iteration whose numbers stopped being finite, and a system
 * the iteration cannot start from. Its message never says "residual NaN".
 */
class EquilibriumFailure extends ConvergenceError {
  constructor(iterations: number, message: string) {
    super(METHOD, iterations, Number.NaN);
    this.message = message;
  }
}

/** The error of an iteration that stopped after `iterations`, worded by whether its residual is still a number. */
function notConverged(iterations: number, residual: number, detail?: string): ConvergenceError {
  if (Number.isFinite(residual)) return new ConvergenceError(METHOD, iterations, residual, detail);
  return new EquilibriumFailure(iterations, `${METHOD} diverged after ${iterations} iterations (its numbers stopped being finite)${detail ? `: ${detail}` : ''}`);
}

export interface MinimiserOptions {
  /** ln n_j of a previous solution on the normalised scale (Σ b = 1), to start from. */
  warmStart?: Float64Array;
  /** Let graphite form as a pure phase (default false: gas only). */
  allowGraphite?: boolean;
  maxIterations?: number;
}

export interface MinimiserResult {
  /** Gas amounts n_j, mol, on the scale of the element amounts given. */
  n: Float64Array;
  /** ln n_j on the normalised scale (Σ b = 1): pass as warmStart to a neighbouring problem. */
  lnScaled: Float64Array;
  /** Total gas amount, mol. */
  totalGas: number;
  /** Graphite formed, mol (0 when gas only). */
  graphite: number;
  /** Element potentials π_i = μ_i/RT at equilibrium. */
  pi: Float64Array;
  /** Carbon activity relative to graphite, exp(π_C − g°_C(gr)/RT); 0 without carbon; 1 with graphite present. */
  carbonActivity: number;
  iterations: number;
  /** Largest relative element-balance error max_i |b_i − Σ a_ij n_j − a_ic n_c| / b_i. */
  elementBalanceError: number;
}

/** ln(1e-8): below it a species is "trace" for step control (RP-1311 SIZE = 18.420681). */
const TRACE_LN = -18.420681;
/** ln(1e-4): the highest a trace species may rise in one step (RP-1311 eq. 3.2, 9.2103404). */
const TRACE_CAP_LN = -9.2103404;
/**
 * Convergence: a full step whose corrections, weighted by mole fraction (RP-1311 §3.3, tightened
 * from 5e-6 to 1e-12), are negligible, and every element conserved to 1e-13 relative. Trace
 * species are not held to an unweighted test: where the feed fixes an element ratio more finely
 * than double precision resolves (CO2 with 1e-30 of extra carbon), their amounts are determined
 * only to that precision, while they always stay mutually at equilibrium.
 */
const CONVERGED = 1e-12;
const ELEMENT_TOLERANCE = 5e-13;
/**
 * In those ill-conditioned cases the weighted correction stalls at the rounding floor instead
 * of reaching 1e-12; a step is then accepted when it is below 1e-9, elements balance, and it has
 * not halved over the last STALL iterations.
 */
const STALLED = 1e-9;
/**
 * The all-element refinement is for the last digits only: tried while an element is still off
 * by 6e-10 (a stalled step, oxygen awaiting a trace of CO), it moved the iteration far away.
 */
const REFINE_ALL_BELOW = 1e-10;
/** At most this many lifts of the species back to their starting shares in one run. */
const MAX_RESEEDS = 3;
const STALL = 4;

interface Work {
  matrix: Float64Array;
  rhs: Float64Array;
  mu: Float64Array;
  dln: Float64Array;
  nj: Float64Array;
}

/** The formula matrix by species as sparse (element, count) entries. */
interface SparseFormula {
  start: Int32Array;
  element: Int32Array;
  count: Float64Array;
}

const sparseCache = new WeakMap<ChemicalSystem, SparseFormula>();

function sparseFormula(system: ChemicalSystem): SparseFormula {
  const cached = sparseCache.get(system);
  if (cached) return cached;
  const ne = system.elements.length;
  const ns = system.gas.length;
  const start = new Int32Array(ns + 1);
  const elements: number[] = [];
  const counts: number[] = [];
  for (let j = 0; j < ns; j++) {
    start[j] = elements.length;
    for (let i = 0; i < ne; i++) {
      const aij = system.a[j * ne + i]!;
      if (aij !== 0) {
        elements.push(i);
        counts.push(aij);
      }
    }
  }
  start[ns] = elements.length;
  const sparse = { start, element: Int32Array.from(elements), count: Float64Array.from(counts) };
  sparseCache.set(system, sparse);
  return sparse;
}

const works = new Map<string, Work>();

/** Scratch arrays, reused across calls of the same shape (no allocation inside a fuel path). */
function workFor(ns: number, size: number): Work {
  const key = `${ns}:${size}`;
  let w = works.get(key);
  if (!w) {
    w = { matrix: new Float64Array(size * size), rhs: new Float64Array(size), mu: new Float64Array(ns), dln: new Float64Array(ns), nj: new Float64Array(ns) };
    works.set(key, w);
  }
  return w;
}

interface Attempt {
  ln: Float64Array;
  lnTotal: number;
  graphite: number;
  pi: Float64Array;
  iterations: number;
}

/**
 * How high a species may rise in one step: ln n_j ≤ min_i ln(b_i / a_ij) + ln 1e4, never ten
 * thousand times more of an element than the feed holds (an addition to RP-1311's step control,
 * eqs. 3.1-3.2). RP-1311 lets a trace species rise to a mole fraction of 1e-4, which for an
 * element present at 1e-25 (carbon traces in nitrogen) overshoots by twenty orders; the
 * iteration then takes its "small" weighted corrections for convergence while that element is
 * far from balance. The margin is wide so that the cap binds only on such overshoots: at e
 * (tried first) it bound near the solution and a trace species oscillated about it.
 */
const CEILING_MARGIN_LN = 9.2103404;

function elementCeilings(system: ChemicalSystem, b: Float64Array): Float64Array {
  const ne = system.elements.length;
  const ns = system.gas.length;
  const ceiling = new Float64Array(ns);
  for (let j = 0; j < ns; j++) {
    let c = Infinity;
    for (let i = 0; i < ne; i++) {
      const aij = system.a[j * ne + i]!;
      if (aij > 0) c = Math.min(c, Math.log(b[i]! / aij) + CEILING_MARGIN_LN);
    }
    ceiling[j] = c;
  }
  return ceiling;
}

/** One Newton iteration sequence with or without graphite, on the normalised element amounts. */
function iterate(
  system: ChemicalSystem,
  gRT: Float64Array,
  lnP: number,
  b: Float64Array,
  ln: Float64Array,
  lnTotalStart: number,
  withGraphite: boolean,
  gGraphite: number,
  graphiteStart: number,
  maxIterations: number,
  iterationsSoFar: number,
): Attempt {
  const ne = system.elements.length;
  const ns = system.gas.length;
  const a = system.a;
  const cIndex = system.carbonIndex;
  const hasC = withGraphite && cIndex >= 0;
  const size = ne + (hasC ? 1 : 0) + 1;
  const last = size - 1;
  const w = workFor(ns, size);
  const { matrix, rhs, mu, dln, nj } = w;
  const sparse = sparseFormula(system);
  const bGasWork = new Float64Array(ne);
  const aNMuWork = new Float64Array(ne);
  const ceiling = elementCeilings(system, b);
  let lnTotal = lnTotalStart;
  let graphite = hasC ? graphiteStart : 0;
  const pi = new Float64Array(ne);
  let residual = Infinity;
  let best = Infinity;
  let sinceBest = 0;
  /** Where this run started. */
  const start = ln.slice();
  /** Times the species were seeded again after the iteration settled with an element off balance. */
  let reseeds = 0;

  for (let iteration = 1; iteration <= maxIterations; iteration++) {
    const total = Math.exp(lnTotal);
    let sumN = 0;
    let sumNMu = 0;
    for (let j = 0; j < ns; j++) {
      const n = Math.exp(ln[j]!);
      nj[j] = n;
      const m = gRT[j]! + lnP + ln[j]! - lnTotal;
      mu[j] = m;
      sumN += n;
      sumNMu += n * m;
    }
    matrix.fill(0);
    rhs.fill(0);
    // Element sums over the sparse formula entries; a species too scarce to matter for any of its
    // elements (n_j a_ij below 1e-18 of b_i) is left out of the Jacobian only.
    bGasWork.fill(0);
    aNMuWork.fill(0);
    for (let j = 0; j < ns; j++) {
      const n = nj[j]!;
      const m = mu[j]!;
      const start = sparse.start[j]!;
      const end = sparse.start[j + 1]!;
      let keep = false;
      for (let e = start; e < end; e++) {
        const i = sparse.element[e]!;
        const aij = sparse.count[e]!;
        bGasWork[i] = bGasWork[i]! + aij * n;
        aNMuWork[i] = aNMuWork[i]! + aij * n * m;
        if (n * aij > 1e-18 * b[i]!) keep = true;
      }
      if (!keep) continue;
      for (let e = start; e < end; e++) {
        const i = sparse.element[e]!;
        const ai = sparse.count[e]! * n;
        for (let f = start; f < end; f++) {
          const k = sparse.element[f]!;
          matrix[i * size + k] = matrix[i * size + k]! + ai * sparse.count[f]!;
        }
      }
    }
    for (let i = 0; i < ne; i++) {
      const bGas = bGasWork[i]!;
      const bNow = bGas + (hasC && i === cIndex ? graphite : 0);
      rhs[i] = b[i]! - bNow + aNMuWork[i]!;
      matrix[i * size + last] = bGas;
      matrix[last * size + i] = bGas;
    }
    if (hasC) {
      const row = ne;
      matrix[cIndex * size + row] = 1;
      matrix[row * size + cIndex] = 1;
      rhs[row] = gGraphite;
    }
    matrix[last * size + last] = sumN - total;
    rhs[last] = total - sumN + sumNMu;

    if (!solveScaledInPlace(matrix, rhs, size, ne, pi)) {
      throw notConverged(iterationsSoFar + iteration, residual, 'the element-potential matrix is singular');
    }
    for (let i = 0; i < ne; i++) pi[i] = rhs[i]!;
    const dGraphite = hasC ? rhs[ne]! : 0;
    const dlnTotal = rhs[last]!;

    // Corrections and step control (RP-1311 eqs. 3.1-3.2).
    let maxMajor = 5 * Math.abs(dlnTotal);
    let lambda2 = 1;
    let maxChange = Math.abs(dlnTotal);
    const weight = 1 / sumN;
    for (let j = 0; j < ns; j++) {
      let s = -mu[j]! + dlnTotal;
      for (let i = 0; i < ne; i++) {
        const aij = a[j * ne + i]!;
        if (aij !== 0) s += aij * pi[i]!;
      }
      dln[j] = s;
      const lnX = ln[j]! - lnTotal;
      if (lnX > TRACE_LN) {
        if (s > maxMajor) maxMajor = s;
      } else if (s >= 0 && s - dlnTotal > 0) {
        const cap = Math.abs((-lnX + TRACE_CAP_LN) / (s - dlnTotal));
        if (cap < lambda2) lambda2 = cap;
      }
      if (s > 0 && ln[j]! < ceiling[j]!) {
        const cap = (ceiling[j]! - ln[j]!) / s;
        if (cap < lambda2) lambda2 = cap;
      }
      maxChange = Math.max(maxChange, nj[j]! * weight * Math.abs(s));
    }
    const lambda1 = maxMajor > 2 ? 2 / maxMajor : 1;
    const lambda = Math.min(1, lambda1, lambda2);
    if (!Number.isFinite(lambda) || !Number.isFinite(dlnTotal)) {
      throw notConverged(iterationsSoFar + iteration, residual, 'the iteration produced a non-finite step');
    }
    for (let j = 0; j < ns; j++) ln[j] = ln[j]! + lambda * dln[j]!;
    lnTotal += lambda * dlnTotal;
    graphite += lambda * dGraphite;
    residual = maxChange;
    if (maxChange < best / 2) {
      best = maxChange;
      sinceBest = 0;
    } else sinceBest++;
    const small = maxChange < CONVERGED || (maxChange < STALLED && sinceBest >= STALL);
    if (lambda === 1 && small && Math.abs(dGraphite) <= STALLED * (1 + Math.abs(graphite))) {
      // A full Newton step leaves every species, trace ones included, at μ_j = Σ a_ij π_i, so all
      // reactions among them are at equilibrium; what remains is that every element balances.
      for (let j = 0; j < ns; j++) nj[j] = Math.exp(ln[j]!);
      if (elementError(system, b, nj, hasC ? graphite : 0) >= ELEMENT_TOLERANCE) polishElements(system, b, ln, pi, nj, traceElements(system, b, hasC));
      const left = elementError(system, b, nj, hasC ? graphite : 0);
      if (left >= ELEMENT_TOLERANCE && left < REFINE_ALL_BELOW) {
        // Kept only if it helps: even close to balance the all-element refinement could wander off.
        const lnBefore = ln.slice();
        const piBefore = pi.slice();
        polishElements(system, b, ln, pi, nj, gasElements(system, hasC));
        if (!(elementError(system, b, nj, hasC ? graphite : 0) < left)) {
          ln.set(lnBefore);
          pi.set(piBefore);
          for (let j = 0; j < ns; j++) nj[j] = Math.exp(ln[j]!);
        }
      }
      const after = elementError(system, b, nj, hasC ? graphite : 0);
      if (after < ELEMENT_TOLERANCE) {
        return { ln, lnTotal, graphite, pi, iterations: iterationsSoFar + iteration };
      }
      // Settled with a major element far off balance: the species that could carry the ratio of two
      // elements fell so low on the way that the system is singular without them (H2 at 1e-20
      // beside steam at 400 K leaves H and O held by H2O alone, in a fixed ratio), and a Newton
      // step cannot raise them. Each species is lifted back to at least its amount at this
      // run's start, the major ones kept, and the iteration goes on.
      if (reseeds < MAX_RESEEDS && elementError(system, b, nj, hasC ? graphite : 0, TRACE_ELEMENT) >= REFINE_ALL_BELOW) {
        reseeds++;
        for (let j = 0; j < ns; j++) ln[j] = Math.max(ln[j]!, start[j]!);
        let sum = 0;
        for (let j = 0; j < ns; j++) sum += Math.exp(ln[j]!);
        lnTotal = Math.log(sum);
        best = Infinity;
        sinceBest = 0;
      }
    }
  }
  throw notConverged(iterationsSoFar + maxIterations, residual);
}

/** Elements below this share of all atoms are "trace" for the polishing step. */
const TRACE_ELEMENT = 1e-6;

/** The trace elements (share below TRACE_ELEMENT), carbon excepted when graphite fixes its potential. */
function traceElements(system: ChemicalSystem, b: Float64Array, graphite: boolean): number[] {
  const trace: number[] = [];
  for (let i = 0; i < b.length; i++) if (b[i]! < TRACE_ELEMENT && !(graphite && i === system.carbonIndex)) trace.push(i);
  return trace;
}

/** Every element whose potential the gas alone sets: all of them, carbon excepted when graphite is present. */
function gasElements(system: ChemicalSystem, graphite: boolean): number[] {
  return system.elements.map((_, i) => i).filter((i) => !(graphite && i === system.carbonIndex));
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
function polishElements(system: ChemicalSystem, b: Float64Array, ln: Float64Array, pi: Float64Array, nj: Float64Array, chosen: number[]): void {
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
  const matrix = new Float64Array(m * m);
  const rhs = new Float64Array(m);
  const residual = new Float64Array(m);
  const previous = new Float64Array(m);
  const matrixCopy = new Float64Array(m * m);
  let best = Infinity;
  let sinceBest = 0;
  for (let iteration = 0; iteration < 100; iteration++) {
    for (let j = 0; j < ns; j++) nj[j] = Math.exp(ln[j]!);
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
    if (worst < 1e-15) break;
    // At the rounding floor the balance stops improving: once well inside the tolerance, two
    // steps without halving it end the refinement; anywhere, ten.
    if (worst < best / 2) {
      best = worst;
      sinceBest = 0;
    } else if (++sinceBest >= (worst < ELEMENT_TOLERANCE / 10 ? 2 : 10)) break;
    // Newton's step, damped (Levenberg-Marquardt: H + μ diag H) until no potential moves by more
    // than 2: where an element's balance hardly depends on some direction (oxygen held only by
    // CO, carbon by CO and a hydrocarbon) the undamped step runs off along it.
    matrixCopy.set(matrix);
    let damping = 0;
    for (;;) {
      matrix.set(matrixCopy);
      for (let p = 0; p < m; p++) matrix[p * m + p] = matrixCopy[p * m + p]! * (1 + damping);
      rhs.set(residual);
      if (!solveScaledInPlace(matrix, rhs, m, m, previous)) return;
      let largest = 0;
      for (let p = 0; p < m; p++) largest = Math.max(largest, Math.abs(rhs[p]!));
      if (largest <= 2 || damping > 1e12) {
        if (!Number.isFinite(largest)) return;
        if (largest > 2) for (let p = 0; p < m; p++) rhs[p] = (rhs[p]! * 2) / largest;
        break;
      }
      damping = damping === 0 ? 1e-6 : damping * 10;
    }
    for (let p = 0; p < m; p++) {
      const i = chosen[p]!;
      pi[i] = pi[i]! + rhs[p]!;
      for (const j of moved) {
        const aij = a[j * ne + i]!;
        if (aij !== 0) ln[j] = ln[j]! + aij * rhs[p]!;
      }
    }
  }
  for (let j = 0; j < ns; j++) nj[j] = Math.exp(ln[j]!);
}

/** Largest relative balance error over the elements whose share is at least `atLeast` (all by default). */
function elementError(system: ChemicalSystem, b: Float64Array, n: Float64Array, graphite: number, atLeast = 0): number {
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

/**
 * Starting amounts: each species gets the share of its scarcest element, n_j = min_i b_i / (a_ij S_i)
 * with S_i the number of species containing element i. (RP-1311 starts every species at 0.1/NS;
 * that overstates an element present at 1e-30 by thirty orders and costs dozens of damped
 * iterations, whereas this start never puts more of an element in play than the feed holds.)
 * Returns ln of the total.
 */
function initialEstimate(system: ChemicalSystem, b: Float64Array, ln: Float64Array): number {
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

function sumExp(ln: Float64Array): number {
  let s = 0;
  for (let j = 0; j < ln.length; j++) s += Math.exp(ln[j]!);
  return s;
}

/** RP-1311's own start (§3.1): every species at 0.1/NS on the normalised scale. */
function uniformEstimate(ns: number): Float64Array {
  return new Float64Array(ns).fill(Math.log(0.1 / ns));
}

/**
 * Iterations from one start before the next start is tried. Converging runs take 5 to 60
 * (measured over random feeds); the rare run that cycles at the rounding floor, where an element
 * ratio is fixed more finely than the major amounts resolve, is started again from elsewhere.
 */
const RESTART_AFTER = 120;

/**
 * Equilibrium of `system` at T (through gRT = g°_j/RT at T) and pressure P (lnP = ln(P/1 bar))
 * for element amounts b (mol, all positive, in system.elements order). gGraphiteRT is g°/RT of
 * graphite at T (needed only with allowGraphite).
 */
export function minimiseGibbs(
  system: ChemicalSystem,
  gRT: Float64Array,
  lnP: number,
  bMol: Float64Array,
  gGraphiteRT: number,
  options: MinimiserOptions = {},
): MinimiserResult {
  const ne = system.elements.length;
  const ns = system.gas.length;
  let scale = 0;
  for (let i = 0; i < ne; i++) {
    if (!(bMol[i]! > 0) || !Number.isFinite(bMol[i]!)) {
      throw new EquilibriumFailure(0, `${METHOD} cannot start: element ${system.elements[i]} has amount ${bMol[i]}; every element must be present in a positive amount`);
    }
    scale += bMol[i]!;
  }
  const b = new Float64Array(ne);
  for (let i = 0; i < ne; i++) b[i] = bMol[i]! / scale;
  const maxIterations = options.maxIterations ?? 400;

  const starts: Float64Array[] = [];
  if (options.warmStart && options.warmStart.length === ns) starts.push(options.warmStart.slice());
  const scarcest = new Float64Array(ns);
  initialEstimate(system, b, scarcest);
  starts.push(scarcest, uniformEstimate(ns));
  let attempt: Attempt | undefined;
  let failure: ConvergenceError | undefined;
  let spent = 0;
  for (const [k, ln] of starts.entries()) {
    const budget = k === starts.length - 1 ? maxIterations - spent : Math.min(RESTART_AFTER, maxIterations - spent);
    if (budget <= 0) break;
    try {
      attempt = iterate(system, gRT, lnP, b, ln, Math.log(sumExp(ln)), false, gGraphiteRT, 0, budget, spent);
      break;
    } catch (error) {
      if (!(error instanceof ConvergenceError) || error instanceof EquilibriumFailure) throw error;
      failure = error;
      spent += budget;
    }
  }
  if (!attempt) throw failure!;
  let carbonActivity = system.carbonIndex >= 0 ? Math.exp(attempt.pi[system.carbonIndex]! - gGraphiteRT) : 0;
  let withGraphite = false;
  if (options.allowGraphite && system.carbonIndex >= 0 && carbonActivity > 1) {
    const gasOnly = attempt;
    const graphiteAttempt = iterate(system, gRT, lnP, b, new Float64Array(attempt.ln), attempt.lnTotal, true, gGraphiteRT, 0, maxIterations, attempt.iterations);
    if (graphiteAttempt.graphite > 0) {
      attempt = graphiteAttempt;
      withGraphite = true;
      carbonActivity = 1;
    } else {
      attempt = gasOnly;
    }
  }

  const n = new Float64Array(ns);
  let total = 0;
  for (let j = 0; j < ns; j++) {
    n[j] = Math.exp(attempt.ln[j]!) * scale;
    total += n[j]!;
  }
  const graphite = withGraphite ? attempt.graphite * scale : 0;
  return {
    n,
    lnScaled: attempt.ln,
    totalGas: total,
    graphite,
    pi: attempt.pi,
    carbonActivity,
    iterations: attempt.iterations,
    elementBalanceError: elementError(system, bMol, n, graphite),
  };
}
