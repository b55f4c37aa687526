/**
 * Steam added to a dry fuel, by the reformer convention: the steam-to-carbon ratio S/C is mol of
 * H2O added per mol of combustible carbon of the dry fuel, carbon in hydrocarbons, alcohols and
 * CO counted and carbon already in CO2 not (the convention of steam-reforming practice, e.g.
 * J. R. Rostrup-Nielsen, Catalytic Steam Reforming, Springer 1984; from memory). Per mole of
 * dry fuel:
 *   n_steam = S/C · Σ x_i c_i      (c_i carbon atoms of species i, CO2 excluded)
 *   feed_i  = (x_i + n_steam δ_i,H2O) / (1 + n_steam)
 */

/** Mol of combustible carbon per mol of the mixture (CO2's carbon excluded): one definition, lib/equilibrium/carbon.ts. */
export { combustibleCarbon } from '../equilibrium/carbon.ts';

/** The feed after adding `steamPerMole` mol of H2O per mol of dry fuel, mole fractions summing to 1. */
export function addSteam(fractions: Readonly<Record<string, number>>, steamPerMole: number): Record<string, number> {
  const total = 1 + steamPerMole;
  const feed: Record<string, number> = {};
  for (const [label, x] of Object.entries(fractions)) feed[label] = x / total;
  if (steamPerMole > 0) feed.H2O = (feed.H2O ?? 0) + steamPerMole / total;
  return feed;
}
