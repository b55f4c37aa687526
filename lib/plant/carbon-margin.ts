/**
 * Carbon-deposition margin of the fuel path: the least steam-to-carbon ratio at the stack
 * temperature and at the pre-reformer temperature (lib/equilibrium/carbon.ts), the design ratio's
 * margin over the larger of the two, and the carbon activities the design actually reaches. Where
 * steam alone cannot make the gas carbon-free at one of the temperatures, the limits and margin
 * are null and `notReached` says why (a critical finding of the calculation).
 */
import { equilibriumCarbonActivity, minimumSteamToCarbon, combustibleCarbon, SteamLimitNotReached } from '../equilibrium/carbon.ts';
import type { DesignPoint } from './design-point.ts';
import type { Results } from './results-schema.ts';

export type CarbonMargin = Results['carbon'] & {
  minimum: number | null;
  margin: number | null;
  /** Where no steam-to-carbon ratio up to the search limit is carbon-free (the limit is then null): the reason, one per temperature. */
  notReached: SteamLimitNotReached[];
};

/**
 * The least carbon-free S/C of a dry fuel at a temperature and pressure, or why steam alone cannot
 * reach it, by `JSON.stringify([dry, T, p])`. It depends on nothing else, so the operating cases
 * of one basis share it (the same fuel at the same temperature in several cases): a root search
 * of carbon activities, each a Gibbs minimisation, found once. Made per calculation, not kept.
 */
export type CarbonLimits = Map<string, number | SteamLimitNotReached>;

/** The least carbon-free S/C at T, or null with the reason kept where steam alone cannot reach it. */
function limitAt(dry: Readonly<Record<string, number>>, temperatureK: number, pressureBar: number, notReached: SteamLimitNotReached[], limits: CarbonLimits): number | null {
  const key = JSON.stringify([dry, temperatureK, pressureBar]);
  let found = limits.get(key);
  if (found === undefined) {
    try {
      found = minimumSteamToCarbon(dry, temperatureK, pressureBar).minimumSteamToCarbon;
    } catch (error) {
      if (!(error instanceof SteamLimitNotReached)) throw error;
      found = error;
    }
    limits.set(key, found);
  }
  if (typeof found === 'number') return found;
  notReached.push(found);
  return null;
}

/** The carbon margin of the point; `limits` holds the least S/C already found for a fuel, temperature and pressure (and takes the new ones). */
export function carbonMargin(point: DesignPoint, limits: CarbonLimits = new Map()): CarbonMargin {
  const inputs = point.inputs;
  const dry = inputs.mode === 'power' ? inputs.dryFuel : null;
  const none = { steamToCarbon: null, minimumSteamToCarbonStack: null, minimumSteamToCarbonPreReformer: null, preReformerCarbonActivity: null, inletCarbonActivity: null, maxCarbonActivity: null, minimum: null, margin: null, notReached: [] };
  const pathHasCarbon = point.path.points.some((p) => p.carbonActivity > 0);
  if (!dry || !(combustibleCarbon(dry) > 0)) {
    return pathHasCarbon ? { ...none, maxCarbonActivity: point.path.maxCarbonActivity, inletCarbonActivity: point.path.points[0]!.carbonActivity } : none;
  }
  const notReached: SteamLimitNotReached[] = [];
  const stack = limitAt(dry, inputs.temperatureK, inputs.fuelPressureBar, notReached, limits);
  // The pre-reformer's outlet temperature: stated, or solved for an adiabatic one.
  const preT = point.unit.preReformer?.outletTemperatureK ?? null;
  const pre = preT === null ? null : limitAt(dry, preT, inputs.fuelPressureBar, notReached, limits);
  // No margin where a limit is out of reach: the finding of the calculation says why.
  const minimum = notReached.length ? null : Math.max(stack!, pre ?? 0);
  const preActivity = preT === null ? null : equilibriumCarbonActivity(point.unit.preReformer!.feed, preT, inputs.fuelPressureBar);
  return {
    steamToCarbon: inputs.steamToCarbon ?? null,
    minimumSteamToCarbonStack: stack,
    minimumSteamToCarbonPreReformer: pre,
    preReformerCarbonActivity: preActivity,
    inletCarbonActivity: inputs.technology.fuelGasEquilibrium ? point.path.points[0]!.carbonActivity : null,
    maxCarbonActivity: pathHasCarbon ? point.path.maxCarbonActivity : null,
    minimum,
    margin: inputs.steamToCarbon !== undefined && minimum !== null ? inputs.steamToCarbon - minimum : null,
    notReached,
  };
}
