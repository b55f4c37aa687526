/**
 * Steam raising: feed water ṅ_w from the liquid at T_w to vapour at T, in three parts that sum to
 * ṅ_w [h°_H2O(T) − h°_H2O(L)(T_w)]:
 *   liquid heating  ṅ_w [h°_H2O(L)(T_s) − h°_H2O(L)(T_w)]
 *   evaporation     ṅ_w L(T_s),  L = h°_H2O − h°_H2O(L)           (lib/thermo/latent-heat.ts)
 *   superheating    ṅ_w [h°_H2O(T) − h°_H2O(T_s)]
 * T_s = T_sat(p) by IAPWS-IF97 region 4 (lib/thermo/water-saturation.ts).
 */
import { mixtureEnthalpyJ } from '../thermo/mixture.ts';
import { waterLatentHeatJPerMol } from '../thermo/latent-heat.ts';
import { waterSaturationTemperatureK } from '../thermo/water-saturation.ts';
import { PA_PER_BAR } from '../thermo/constants.ts';
import type { SteamRaising } from './plant-balance-types.ts';

/** Feed water ṅ_w raised from the liquid at T_w to vapour at T: heated to T_s = T_sat(p) (IAPWS-IF97 region 4), evaporated with L(T_s) of the species data, superheated to T (the module comment's three parts). */
export function raiseSteam(waterMol: number, waterK: number, pressureBar: number, toK: number): SteamRaising {
  const H = mixtureEnthalpyJ;
  const tSat = waterSaturationTemperatureK(pressureBar * PA_PER_BAR);
  const latent = waterLatentHeatJPerMol(tSat);
  const liquid = { 'H2O(L)': waterMol };
  const vapour = { H2O: waterMol };
  return {
    waterMolPerS: waterMol,
    saturationTemperatureK: tSat,
    liquidHeatingW: H(liquid, tSat) - H(liquid, waterK),
    evaporationW: waterMol * latent,
    superheatingW: H(vapour, toK) - H(vapour, tSat),
    latentHeatJPerMol: latent,
  };
}
