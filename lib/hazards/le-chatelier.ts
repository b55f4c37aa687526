/**
 * Le Chatelier's mixing rule for the flammability limits of a mixture of combustibles:
 *
 *   L_mix = 1 / Σ_i (y_i / L_i)
 *
 * with y_i the mole fractions of the combustibles normalised over the combustibles only
 * (Σ y_i = 1) and L_i their limits in air, vol %. Source: H. Le Chatelier (1891), as stated in
 * H. F. Coward and G. W. Jones, Limits of Flammability of Gases and Vapors, US Bureau of Mines
 * Bulletin 503 (1952), and M. G. Zabetakis, US Bureau of Mines Bulletin 627 (1965).
 *
 * Known limits: reasonable for the lower limit of mixtures of similar fuels (hydrogen, carbon
 * monoxide, light hydrocarbons); not reliable for the upper limit; not for mixtures that already
 * contain oxygen; valid only at the temperature and pressure of the component limits.
 */

export interface LimitShare {
  /** Amount of the combustible in any consistent measure (mole fraction of a stream, mol). */
  amount: number;
  /** Its flammability limit in air, vol % (> 0). */
  limit_percent: number;
}

/** Mixture limit in vol % by Le Chatelier's rule; the amounts are normalised here. */
export function leChatelier(shares: readonly LimitShare[]): number {
  const total = shares.reduce((sum, s) => sum + s.amount, 0);
  if (!(total > 0)) throw new Error('Le Chatelier: the mixture has no combustible');
  let reciprocal = 0;
  for (const s of shares) {
    if (!(s.amount >= 0) || !(s.limit_percent > 0)) throw new Error(`Le Chatelier: invalid share ${JSON.stringify(s)}`);
    reciprocal += s.amount / total / s.limit_percent;
  }
  return 1 / reciprocal;
}
