/**
 * Water leaving a liquid-water cell (PEM, alkaline): both outlet gases saturated with vapour at
 * cell temperature, n_vap = n_dry · x_v / (1 − x_v) with x_v = p_sat / P, and the rest of the
 * water as liquid:
 *   liquid out = water in + water formed (power: I/2F) − water split (electrolysis: I/2F) − vapour out
 * Where too little water is left to saturate both gases, the gases leave unsaturated (the water
 * is shared in proportion) and a warning says the membrane or electrolyte would dry out.
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
