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
 *
 * This module chooses the starts and the phases; newton-iteration.ts is one run of the
 * iteration, element-balance.ts the balance and its refinement, starting-estimates.ts the starts,
 * minimiser-failure.ts how a run that does not converge is reported.
 */
import type { ChemicalSystem } from './species-set.ts';
import { ConvergenceError } from '../core/errors.ts';
import { elementError } from './element-balance.ts';
import { EquilibriumFailure, METHOD } from './minimiser-failure.ts';
import { iterate, type Attempt } from './newton-iteration.ts';
import { initialEstimate, sumExp, uniformEstimate } from './starting-estimates.ts';

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
/** The element amounts divided by their sum (the iteration's scale), and that sum; refuses an element that is absent or not finite. */
function normalised(system: ChemicalSystem, bMol: Float64Array): { b: Float64Array; scale: number } {
  const ne = system.elements.length;
  let scale = 0;
  for (let i = 0; i < ne; i++) {
    if (!(bMol[i]! > 0) || !Number.isFinite(bMol[i]!)) {
      throw new EquilibriumFailure(0, `${METHOD} cannot start: element ${system.elements[i]} has amount ${bMol[i]}; every element must be present in a positive amount`);
    }
    scale += bMol[i]!;
  }
  const b = new Float64Array(ne);
  for (let i = 0; i < ne; i++) b[i] = bMol[i]! / scale;
  return { b, scale };
}

/**
 * The gas-only equilibrium from the first start that converges: the warm start if given, then
 * the scarcest-element start, then RP-1311's uniform start, each but the last within RESTART_AFTER
 * iterations; a run that cannot converge (EquilibriumFailure) is not tried again. Each start is
 * made when it is tried (most runs converge from the first).
 */
function gasOnly(system: ChemicalSystem, gRT: Float64Array, lnP: number, b: Float64Array, gGraphiteRT: number, options: MinimiserOptions, maxIterations: number): Attempt {
  const ns = system.gas.length;
  const starts: (() => Float64Array)[] = [];
  const warm = options.warmStart;
  if (warm && warm.length === ns) starts.push(() => warm.slice());
  const scarcest = () => {
    const ln = new Float64Array(ns);
    initialEstimate(system, b, ln);
    return ln;
  };
  starts.push(scarcest, () => uniformEstimate(ns));
  let failure: ConvergenceError | undefined;
  let spent = 0;
  for (const [k, start] of starts.entries()) {
    const budget = k === starts.length - 1 ? maxIterations - spent : Math.min(RESTART_AFTER, maxIterations - spent);
    if (budget <= 0) break;
    const ln = start();
    try {
      return iterate(system, gRT, lnP, b, ln, Math.log(sumExp(ln)), false, gGraphiteRT, 0, budget, spent);
    } catch (error) {
      if (!(error instanceof ConvergenceError) || error instanceof EquilibriumFailure) throw error;
      failure = error;
      spent += budget;
    }
  }
  throw failure!;
}

export function minimiseGibbs(
  system: ChemicalSystem,
  gRT: Float64Array,
  lnP: number,
  bMol: Float64Array,
  gGraphiteRT: number,
  options: MinimiserOptions = {},
): MinimiserResult {
  const ns = system.gas.length;
  const { b, scale } = normalised(system, bMol);
  const maxIterations = options.maxIterations ?? 400;
  let attempt = gasOnly(system, gRT, lnP, b, gGraphiteRT, options, maxIterations);
  let carbonActivity = system.carbonIndex >= 0 ? Math.exp(attempt.pi[system.carbonIndex]! - gGraphiteRT) : 0;
  let withGraphite = false;
  if (options.allowGraphite && system.carbonIndex >= 0 && carbonActivity > 1) {
    // Graphite enters where the gas is supersaturated in carbon, and stays only if some forms.
    const graphiteAttempt = iterate(system, gRT, lnP, b, new Float64Array(attempt.ln), attempt.lnTotal, true, gGraphiteRT, 0, maxIterations, attempt.iterations);
    if (graphiteAttempt.graphite > 0) {
      attempt = graphiteAttempt;
      withGraphite = true;
      carbonActivity = 1;
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
