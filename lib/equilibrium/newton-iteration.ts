/**
 * One run of the Gibbs minimiser's Newton iteration (gibbs-minimiser.ts has the method and its
 * sources): from a start, with or without graphite, on the normalised element amounts, until a
 * full step is negligible and every element balances, or the iterations run out. Each iteration
 * assembles the reduced system of RP-1311 (S. Gordon and B. J. McBride, NASA RP-1311, 1994,
 * eqs. 2.24-2.26), solves it for the element potentials, and steps with RP-1311's step control
 * (eqs. 3.1-3.2) and the element ceilings; a full, small step is then settled on the element
 * balance (element-balance.ts).
 */
import { solveScaledInPlace } from './linear.ts';
import type { ChemicalSystem } from './species-set.ts';
import { ELEMENT_TOLERANCE, TRACE_ELEMENT, elementError, gasElements, polishElements, traceElements } from './element-balance.ts';
import { notConverged } from './minimiser-failure.ts';

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

export interface Attempt {
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

/** What a run carries from one iteration to the next. */
interface Run {
  system: ChemicalSystem;
  gRT: Float64Array;
  lnP: number;
  b: Float64Array;
  ln: Float64Array;
  /** Graphite present as a phase (and carbon in the system). */
  hasC: boolean;
  gGraphite: number;
  /** Unknowns of the reduced system: the element potentials, Δn of graphite, Δln n. */
  size: number;
  work: Work;
  sparse: SparseFormula;
  bGas: Float64Array;
  aNMu: Float64Array;
  ceiling: Float64Array;
  lnTotal: number;
  graphite: number;
  pi: Float64Array;
  residual: number;
  best: number;
  sinceBest: number;
  /** Where this run started. */
  start: Float64Array;
  /** Times the species were seeded again after the iteration settled with an element off balance. */
  reseeds: number;
}

/** The amounts n_j = exp(ln n_j) and chemical potentials μ_j/RT at the current iterate (in run.work), with Σ n_j and Σ n_j μ_j/RT. */
function potentials(run: Run): { sumN: number; sumNMu: number } {
  const { gRT, lnP, ln } = run;
  const { mu, nj } = run.work;
  const lnTotal = run.lnTotal;
  let sumN = 0;
  let sumNMu = 0;
  for (let j = 0; j < run.system.gas.length; j++) {
    const n = Math.exp(ln[j]!);
    nj[j] = n;
    const m = gRT[j]! + lnP + ln[j]! - lnTotal;
    mu[j] = m;
    sumN += n;
    sumNMu += n * m;
  }
  return { sumN, sumNMu };
}

/** The reduced Newton system (RP-1311 eqs. 2.24-2.26) at the current iterate, in run.work; returns Σ n_j. */
function assemble(run: Run): number {
  const { system, b, hasC, size, sparse, bGas: bGasWork, aNMu: aNMuWork } = run;
  const { matrix, rhs, mu, nj } = run.work;
  const ne = system.elements.length;
  const ns = system.gas.length;
  const cIndex = system.carbonIndex;
  const last = size - 1;
  const total = Math.exp(run.lnTotal);
  const { sumN, sumNMu } = potentials(run);
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
    const bNow = bGas + (hasC && i === cIndex ? run.graphite : 0);
    rhs[i] = b[i]! - bNow + aNMuWork[i]!;
    matrix[i * size + last] = bGas;
    matrix[last * size + i] = bGas;
  }
  if (hasC) {
    const row = ne;
    matrix[cIndex * size + row] = 1;
    matrix[row * size + cIndex] = 1;
    rhs[row] = run.gGraphite;
  }
  matrix[last * size + last] = sumN - total;
  rhs[last] = total - sumN + sumNMu;
  return sumN;
}

/**
 * The corrections Δln n_j = −μ_j/RT + Σ_i a_ij π_i + Δln n (in run.work.dln) and the step size
 * λ: RP-1311's control (eqs. 3.1-3.2; no major species' ln n_j moves by more than 2, a trace
 * species rises at most to a mole fraction of 1e-4) and the element ceilings. Returns λ and the
 * largest correction weighted by mole fraction.
 */
function stepSize(run: Run, sumN: number, dlnTotal: number): { lambda: number; maxChange: number } {
  const { system, ln, pi, ceiling } = run;
  const { mu, dln, nj } = run.work;
  const ne = system.elements.length;
  const ns = system.gas.length;
  const a = system.a;
  const lnTotal = run.lnTotal;
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
  return { lambda: Math.min(1, lambda1, lambda2), maxChange };
}

/**
 * After a full, negligible step: balances the elements to the last digits and says whether the
 * run has converged. A full Newton step leaves every species, trace ones included, at
 * μ_j = Σ a_ij π_i, so all reactions among them are at equilibrium; what remains is that every
 * element balances. A run that settled with a major element far off balance is seeded again.
 */
function settle(run: Run): boolean {
  const { system, b, ln, pi, hasC } = run;
  const { nj } = run.work;
  const ns = system.gas.length;
  const graphite = hasC ? run.graphite : 0;
  for (let j = 0; j < ns; j++) nj[j] = Math.exp(ln[j]!);
  if (elementError(system, b, nj, graphite) >= ELEMENT_TOLERANCE) polishElements(system, b, ln, pi, nj, traceElements(system, b, hasC));
  const left = elementError(system, b, nj, graphite);
  if (left >= ELEMENT_TOLERANCE && left < REFINE_ALL_BELOW) {
    // Kept only if it helps: even close to balance the all-element refinement could wander off.
    const lnBefore = ln.slice();
    const piBefore = pi.slice();
    polishElements(system, b, ln, pi, nj, gasElements(system, hasC));
    if (!(elementError(system, b, nj, graphite) < left)) {
      ln.set(lnBefore);
      pi.set(piBefore);
      for (let j = 0; j < ns; j++) nj[j] = Math.exp(ln[j]!);
    }
  }
  if (elementError(system, b, nj, graphite) < ELEMENT_TOLERANCE) return true;
  // Settled with a major element far off balance: the species that could carry the ratio of two
  // elements fell so low on the way that the system is singular without them (H2 at 1e-20
  // beside steam at 400 K leaves H and O held by H2O alone, in a fixed ratio), and a Newton
  // step cannot raise them. Each species is lifted back to at least its amount at this
  // run's start, the major ones kept, and the iteration goes on.
  if (run.reseeds < MAX_RESEEDS && elementError(system, b, nj, graphite, TRACE_ELEMENT) >= REFINE_ALL_BELOW) {
    run.reseeds++;
    for (let j = 0; j < ns; j++) ln[j] = Math.max(ln[j]!, run.start[j]!);
    let sum = 0;
    for (let j = 0; j < ns; j++) sum += Math.exp(ln[j]!);
    run.lnTotal = Math.log(sum);
    run.best = Infinity;
    run.sinceBest = 0;
  }
  return false;
}

/** A run from `ln` (which it updates in place), with its scratch arrays. */
function startRun(system: ChemicalSystem, gRT: Float64Array, lnP: number, b: Float64Array, ln: Float64Array, lnTotal: number, hasC: boolean, gGraphite: number, graphite: number): Run {
  const ne = system.elements.length;
  const size = ne + (hasC ? 1 : 0) + 1;
  return {
    system,
    gRT,
    lnP,
    b,
    ln,
    hasC,
    gGraphite,
    size,
    work: workFor(system.gas.length, size),
    sparse: sparseFormula(system),
    bGas: new Float64Array(ne),
    aNMu: new Float64Array(ne),
    ceiling: elementCeilings(system, b),
    lnTotal,
    graphite: hasC ? graphite : 0,
    pi: new Float64Array(ne),
    residual: Infinity,
    best: Infinity,
    sinceBest: 0,
    start: ln.slice(),
    reseeds: 0,
  };
}

/** One Newton iteration sequence with or without graphite, on the normalised element amounts. */
export function iterate(
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
  const run = startRun(system, gRT, lnP, b, ln, lnTotalStart, withGraphite && system.carbonIndex >= 0, gGraphite, graphiteStart);
  const { hasC, size } = run;
  const { rhs, dln } = run.work;
  for (let iteration = 1; iteration <= maxIterations; iteration++) {
    const sumN = assemble(run);
    if (!solveScaledInPlace(run.work.matrix, rhs, size, ne, run.pi)) {
      throw notConverged(iterationsSoFar + iteration, run.residual, 'the element-potential matrix is singular');
    }
    for (let i = 0; i < ne; i++) run.pi[i] = rhs[i]!;
    const dGraphite = hasC ? rhs[ne]! : 0;
    const dlnTotal = rhs[size - 1]!;
    const { lambda, maxChange } = stepSize(run, sumN, dlnTotal);
    if (!Number.isFinite(lambda) || !Number.isFinite(dlnTotal)) {
      throw notConverged(iterationsSoFar + iteration, run.residual, 'the iteration produced a non-finite step');
    }
    for (let j = 0; j < ns; j++) ln[j] = ln[j]! + lambda * dln[j]!;
    run.lnTotal += lambda * dlnTotal;
    run.graphite += lambda * dGraphite;
    run.residual = maxChange;
    if (maxChange < run.best / 2) {
      run.best = maxChange;
      run.sinceBest = 0;
    } else run.sinceBest++;
    const small = maxChange < CONVERGED || (maxChange < STALLED && run.sinceBest >= STALL);
    if (lambda === 1 && small && Math.abs(dGraphite) <= STALLED * (1 + Math.abs(run.graphite)) && settle(run)) {
      return { ln, lnTotal: run.lnTotal, graphite: run.graphite, pi: run.pi, iterations: iterationsSoFar + iteration };
    }
  }
  throw notConverged(iterationsSoFar + maxIterations, run.residual);
}
