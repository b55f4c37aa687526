/**
 * How the Gibbs minimiser (gibbs-minimiser.ts) says it did not converge: a ConvergenceError
 * naming the method, the iterations spent and the residual, or, where a residual does not
 * describe what happened, an EquilibriumFailure with its own wording.
 */
import { ConvergenceError } from '../core/errors.ts';

export const METHOD = 'gas equilibrium (Gibbs minimisation)';

/**
 * A ConvergenceError (so every caller that handles one handles it) worded for the cases a
 * residual does not describe: an iteration whose numbers stopped being finite, and a system
 * the iteration cannot start from. Its message never says "residual NaN".
 */
export class EquilibriumFailure extends ConvergenceError {
  constructor(iterations: number, message: string) {
    super(METHOD, iterations, Number.NaN);
    this.message = message;
  }
}

/** The error of an iteration that stopped after `iterations`, worded by whether its residual is still a number. */
export function notConverged(iterations: number, residual: number, detail?: string): ConvergenceError {
  if (Number.isFinite(residual)) return new ConvergenceError(METHOD, iterations, residual, detail);
  return new EquilibriumFailure(iterations, `${METHOD} diverged after ${iterations} iterations (its numbers stopped being finite)${detail ? `: ${detail}` : ''}`);
}
