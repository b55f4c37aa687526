/**
 * Steam raising: feed water ṅ_w from the liquid at T_w to vapour at T, in three parts that sum to
 * ṅ_w [h°_H2O(T) − h°_H2O(L)(T_w)]:
 *   liquid heating  ṅ_w [h°_H2O(L)(T_s) − h°_H2O(L)(T_w)]
 *   evaporation     ṅ_w L(T_s),  L = h°_H2O − h°_H2O(L)           (lib/thermo/latent-heat.ts)
 *   superheating    ṅ_w [h°_H2O(T) − h°_H2O(T_s)]
 * T_s = T_sat(p) by IAPWS-IF97 region 4 (lib/thermo/water-saturation.ts).
 *
 * After a feed recuperator (recuperator.ts) has taken the water to T* with ṅ_v of it evaporated,
 * the heaters do the rest of the same three parts:
 *   liquid heating  ṅ_w [h°_H2O(L)(T_s) − h°_H2O(L)(T*)]   where T* < T_s, else 0, from min(T*, T_s)
 *   evaporation     (ṅ_w − ṅ_v) L(T_s)                      (ṅ_v = 0 below T_s, ṅ_w above)
 *   superheating    ṅ_w [h°_H2O(T) − h°_H2O(max(T*, T_s))], from max(T*, T_s)
 * whose sum with the recuperator's ṅ_w h°(T*) − ṅ_w h°_H2O(L)(T_w) (the water's phases at T*) is
 * the whole steam raising above.
 */
import { mixtureEnthalpyJ } from '../thermo/mixture.ts';
import { waterLatentHeatJPerMol } from '../thermo/latent-heat.ts';
import { waterSaturationTemperatureK } from '../thermo/water-saturation.ts';
import { PA_PER_BAR } from '../thermo/constants.ts';
import type { SteamRaising } from './plant-balance-types.ts';

const H = mixtureEnthalpyJ;

/** Feed water ṅ_w raised from the liquid at T_w to vapour at T: heated to T_s = T_sat(p) (IAPWS-IF97 region 4), evaporated with L(T_s) of the species data, superheated to T (the module comment's three parts). */
export function raiseSteam(waterMol: number, waterK: number, pressureBar: number, toK: number): SteamRaising {
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

/** The heaters' three duties that take feed water from T* (ṅ_v of it evaporated, at T_s) on to vapour at T, each with the temperature it starts from (the module comment's second set). */
export function steamHeatersAfter(waterMol: number, saturationK: number, fromK: number, vapourMol: number, toK: number) {
  const liquid = { 'H2O(L)': waterMol };
  const vapour = { H2O: waterMol };
  const liquidFromK = Math.min(fromK, saturationK);
  const vapourFromK = Math.max(fromK, saturationK);
  const evaporated = fromK > saturationK ? waterMol : fromK < saturationK ? 0 : vapourMol;
  return {
    liquidHeatingW: H(liquid, saturationK) - H(liquid, liquidFromK),
    liquidFromK,
    evaporationW: (waterMol - evaporated) * waterLatentHeatJPerMol(saturationK),
    superheatingW: H(vapour, toK) - H(vapour, vapourFromK),
    vapourFromK,
  };
}
