/**
 * Heat recoverable from an exhaust gas cooled from its temperature T_in to a stated exit
 * temperature T_exit (the stack-exit temperature of the heat-recovery unit), at pressure p:
 *
 *   without condensation (all water stays vapour):
 *     Q_dry  = Σ_i ṅ_i [h°_i(T_in) − h°_i(T_exit)]
 *   with condensation down to saturation at the exit, when the exhaust's water would be
 *   supersaturated there (y_H2O p > p_s(T_exit)):
 *     ṅ_vapour,exit = ṅ_dry · p_s(T_exit) / (p − p_s(T_exit))     (gas leaves saturated, Dalton)
 *     ṅ_condensed   = ṅ_H2O − ṅ_vapour,exit
 *     Q_wet  = Q_dry + ṅ_condensed · L(T_exit),   L = h°_H2O(g) − h°_H2O(L)
 *   dew point  T_dp = T_s(y_H2O p).
 * The enthalpies and the latent heat are the species data's (lib/thermo, ideal-gas vapour, so
 * the condensed water's enthalpy balances exactly with every other stream of the plant); the
 * saturation pressure and dew point are IAPWS-IF97 region 4 (lib/thermo/water-saturation.ts).
 * Enthalpy is a state function, so Q depends only on the inlet and exit states, not on where
 * between them the water condenses. The condensate leaves at T_exit. (Energy balance of a
 * steady-flow device, e.g. Y. A. Çengel and M. A. Boles, Thermodynamics: An Engineering
 * Approach, ch. 5; condensation of combustion products by the dew point, ibid. ch. 15.)
 */
import { waterLatentHeatJPerMol } from '../thermo/latent-heat.ts';
import { mixtureEnthalpyJ } from '../thermo/mixture.ts';
import { getSpecies } from '../thermo/species-data.ts';
import { PA_PER_BAR } from '../thermo/constants.ts';
import { saturationRange, waterDewPointK, waterSaturationPressurePa } from '../thermo/water-saturation.ts';
import { FlowsheetInputError } from './input-error.ts';

export interface ExhaustCoolingRequest {
  /** Exhaust gas, species label → mol/s (gas species only; water vapour as "H2O"). */
  flowsMolPerS: Readonly<Record<string, number>>;
  inletTemperatureK: number;
  /** Temperature the exhaust leaves the heat recovery at, K. */
  exitTemperatureK: number;
  pressureBar: number;
}

export interface ExhaustHeatRecovery {
  /** y_H2O · p at the inlet, Pa. */
  waterPartialPressurePa: number;
  /** Dew point of the exhaust, K; null without water, or where y_H2O p is below 611.2 Pa (it would deposit as frost below 0 °C, outside IF97 region 4). */
  dewPointK: number | null;
  /** Q_dry: heat recovered with all water left as vapour, W. */
  heatWithoutCondensationW: number;
  /** Water condensed at the exit, mol/s and kg/s (0 when the exit is above the dew point). */
  condensedWaterMolPerS: number;
  condensedWaterKgPerS: number;
  /** ṅ_condensed · L(T_exit), W. */
  latentHeatW: number;
  /** Q_wet = Q_dry + latent heat, W. */
  heatWithCondensationW: number;
  /** The gas leaving with condensation (water vapour reduced to saturation), species label → mol/s. */
  exitGasMolPerS: Record<string, number>;
}

function validate(request: ExhaustCoolingRequest): void {
  for (const [label, flow] of Object.entries(request.flowsMolPerS)) {
    if (getSpecies(label).phase !== 'gas') throw new FlowsheetInputError('flowsMolPerS', `must hold gas species only, got ${label}`);
    if (!(flow >= 0) || !Number.isFinite(flow)) throw new FlowsheetInputError('flowsMolPerS', `must hold non-negative flows, got ${flow} mol/s of ${label}`);
  }
  if (!(request.pressureBar > 0)) throw new FlowsheetInputError('pressureBar', `must be positive, got ${request.pressureBar}`);
  if (!(request.exitTemperatureK > 0)) throw new FlowsheetInputError('exitTemperatureK', `must be positive, got ${request.exitTemperatureK}`);
  if (!(request.exitTemperatureK <= request.inletTemperatureK)) {
    throw new FlowsheetInputError('exitTemperatureK', `(${request.exitTemperatureK} K) must not exceed the exhaust's inlet temperature (${request.inletTemperatureK} K): heat recovery cools the gas`);
  }
}

/** Water vapour left in a gas saturated at T_exit: ṅ_dry p_s / (p − p_s), mol/s, or null when saturation cannot hold it back (p_s ≥ p or T above the critical point). */
function saturatedVapourMolPerS(dryMolPerS: number, exitTemperatureK: number, pressurePa: number): number | null {
  if (exitTemperatureK >= saturationRange().highK) return null;
  const pSat = waterSaturationPressurePa(exitTemperatureK);
  return pSat < pressurePa ? (dryMolPerS * pSat) / (pressurePa - pSat) : null;
}

/** The exhaust's recoverable heat without and with condensation (the module comment's equations). */
export function exhaustHeatRecovery(request: ExhaustCoolingRequest): ExhaustHeatRecovery {
  validate(request);
  const flows = request.flowsMolPerS;
  const pressurePa = request.pressureBar * PA_PER_BAR;
  const total = Object.values(flows).reduce((s, v) => s + v, 0);
  const water = flows.H2O ?? 0;
  const waterPartialPressurePa = total > 0 ? (water / total) * pressurePa : 0;
  const dewPointK = water > 0 && waterPartialPressurePa >= saturationRange().lowPa ? waterDewPointK(waterPartialPressurePa) : null;
  const heatWithoutCondensationW = mixtureEnthalpyJ(flows, request.inletTemperatureK) - mixtureEnthalpyJ(flows, request.exitTemperatureK);
  const vapour = water > 0 ? saturatedVapourMolPerS(total - water, request.exitTemperatureK, pressurePa) : null;
  const condensedWaterMolPerS = vapour !== null && vapour < water ? water - vapour : 0;
  const latentHeatW = condensedWaterMolPerS > 0 ? condensedWaterMolPerS * waterLatentHeatJPerMol(request.exitTemperatureK) : 0;
  const exitGasMolPerS = { ...flows };
  if (condensedWaterMolPerS > 0) exitGasMolPerS.H2O = water - condensedWaterMolPerS;
  return {
    waterPartialPressurePa,
    dewPointK,
    heatWithoutCondensationW,
    condensedWaterMolPerS,
    condensedWaterKgPerS: condensedWaterMolPerS * getSpecies('H2O').molarMassKgPerMol,
    latentHeatW,
    heatWithCondensationW: heatWithoutCondensationW + latentHeatW,
    exitGasMolPerS,
  };
}
