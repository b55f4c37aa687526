/**
 * The water of a liquid-water cell (PEM, alkaline) at one point of the cell: the water fed to both
 * electrodes plus the water the charge passed so far has formed (power: I/2F) or split
 * (electrolysis: −I/2F), against the vapour that would saturate both dry gases there at cell
 * temperature, n_sat = n_dry · x_s / (1 − x_s) with x_s = a_w p_s(T) / P (p_s by IAPWS-IF97,
 * a_w the activity of the water the gases stand over):
 *
 *   W(q) = W_fed ± q/2F
 *   W(q) ≥ n_sat,f + n_sat,a:  both gases saturated, liquid = W(q) − n_sat,f − n_sat,a
 *   W(q) < n_sat,f + n_sat,a:  no liquid; all the water is vapour, shared in proportion to n_sat
 *
 * (Dalton's law with the vapour pressure of the water as the most vapour a gas can hold; the
 * sharing in proportion, the membrane or electrolyte passing water freely between the sides, is
 * this project's assumption.) The fuel path applies it at every point of a co-flow cell, where the
 * gases at u have met the charge u·Q (fuel-path.ts); the plant at the outlet, q = I.
 */
import { FARADAY_C_PER_MOL as F } from '../thermo/constants.ts';
import type { Mode } from '../electrochem/technologies.ts';

export interface WaterSplit {
  fuelVapour: number;
  airVapour: number;
  liquid: number;
  saturated: boolean;
}

export function liquidCellWater(
  mode: Mode,
  waterInMolPerS: number,
  currentA: number,
  fuelDryMolPerS: number,
  airDryMolPerS: number,
  vapourFractionFuel: number,
  vapourFractionAir: number,
): WaterSplit {
  const formed = (mode === 'power' ? 1 : -1) * (currentA / (2 * F));
  const available = waterInMolPerS + formed;
  const fuelVapour = (fuelDryMolPerS * vapourFractionFuel) / (1 - vapourFractionFuel);
  const airVapour = (airDryMolPerS * vapourFractionAir) / (1 - vapourFractionAir);
  const vapour = fuelVapour + airVapour;
  if (available >= vapour) return { fuelVapour, airVapour, liquid: available - vapour, saturated: true };
  const share = vapour > 0 ? Math.max(0, available) / vapour : 0;
  return { fuelVapour: fuelVapour * share, airVapour: airVapour * share, liquid: 0, saturated: false };
}
