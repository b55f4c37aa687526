/**
 * The temperature at which a mixture of fixed composition has a given enthalpy or standard
 * entropy: the inverse of H(T) = Σ n_i h°_i(T) and S°(T) = Σ n_i s°_i(T), both rising with T
 * (dH/dT = C_p > 0, dS°/dT = C_p/T > 0). Newton's method with the mixture's C_p, safeguarded
 * by bisection inside a bracket (W. H. Press et al., Numerical Recipes, 3rd ed., §9.4,
 * "rtsafe"), over the range where every species has data; converged to 1e-12 K-relative.
 */
import { mixtureEnthalpyJ, mixtureHeatCapacityJPerK, mixtureStandardEntropyJPerK } from './mixture.ts';
import { getSpecies } from './species-data.ts';
import { ConvergenceError, UserError } from '../core/errors.ts';

type Amounts = Readonly<Record<string, number>>;

function range(amounts: Amounts): { lowK: number; highK: number } {
  let lowK = 0;
  let highK = Infinity;
  for (const [label, amount] of Object.entries(amounts)) {
    if (amount === 0) continue;
    const s = getSpecies(label);
    lowK = Math.max(lowK, s.lowK);
    highK = Math.min(highK, s.highK);
  }
  return { lowK, highK };
}

/** Root of a rising f on the mixture's range, f' given; `what` names the quantity in errors. */
function solveRising(amounts: Amounts, f: (t: number) => number, slope: (t: number) => number, guessK: number, what: string): number {
  const { lowK, highK } = range(amounts);
  if (f(lowK) > 0) throw new UserError(`no temperature in the species data's range (${lowK} K to ${highK} K) gives this ${what}: it lies below the range`);
  if (f(highK) < 0) throw new UserError(`no temperature in the species data's range (${lowK} K to ${highK} K) gives this ${what}: it lies above the range`);
  let low = lowK;
  let high = highK;
  let t = Math.min(highK, Math.max(lowK, guessK));
  for (let iteration = 0; iteration < 200; iteration++) {
    const value = f(t);
    if (value === 0) return t;
    if (value < 0) low = t;
    else high = t;
    let next = t - value / slope(t);
    if (!(next > low && next < high)) next = 0.5 * (low + high);
    if (Math.abs(next - t) <= 1e-12 * t || high - low <= 4 * Number.EPSILON * high) return next;
    t = next;
  }
  throw new ConvergenceError(`temperature from ${what}`, 200, high - low);
}

/** T, K, at which Σ n_i h°_i(T) = enthalpyJ (heats of formation included). */
export function temperatureAtEnthalpyK(amounts: Amounts, enthalpyJ: number, guessK: number): number {
  return solveRising(amounts, (t) => mixtureEnthalpyJ(amounts, t) - enthalpyJ, (t) => mixtureHeatCapacityJPerK(amounts, t), guessK, 'enthalpy');
}

/** The same, or null where no temperature in the species data's range gives this enthalpy (a figure that is only reported, never needed). */
export function temperatureAtEnthalpyInRangeK(amounts: Amounts, enthalpyJ: number, guessK: number): number | null {
  const { lowK, highK } = range(amounts);
  if (mixtureEnthalpyJ(amounts, lowK) > enthalpyJ || mixtureEnthalpyJ(amounts, highK) < enthalpyJ) return null;
  return temperatureAtEnthalpyK(amounts, enthalpyJ, guessK);
}

/** T, K, at which Σ n_i s°_i(T) = entropyJPerK (standard entropies at 1 bar). */
export function temperatureAtStandardEntropyK(amounts: Amounts, entropyJPerK: number, guessK: number): number {
  return solveRising(
    amounts,
    (t) => mixtureStandardEntropyJPerK(amounts, t) - entropyJPerK,
    (t) => mixtureHeatCapacityJPerK(amounts, t) / t,
    guessK,
    'entropy',
  );
}
