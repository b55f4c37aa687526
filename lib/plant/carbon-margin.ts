/**
 * Carbon-deposition margin of the fuel path: the least steam-to-carbon ratio at the stack
 * temperature and at the pre-reformer temperature (lib/equilibrium/carbon.ts), the design ratio's
 * margin over the larger of the two, and the carbon activities the design actually reaches.
 */
import { equilibriumCarbonActivity, minimumSteamToCarbon, combustibleCarbon } from '../equilibrium/carbon.ts';
import type { DesignPoint } from './design-point.ts';
import type { Results } from './results-schema.ts';

export function carbonMargin(point: DesignPoint): Results['carbon'] & { minimum: number | null; margin: number | null } {
  const inputs = point.inputs;
  const dry = inputs.mode === 'power' ? inputs.dryFuel : null;
  const none = { steamToCarbon: null, minimumSteamToCarbonStack: null, minimumSteamToCarbonPreReformer: null, preReformerCarbonActivity: null, inletCarbonActivity: null, maxCarbonActivity: null, minimum: null, margin: null };
  const pathHasCarbon = point.path.points.some((p) => p.carbonActivity > 0);
  if (!dry || !(combustibleCarbon(dry) > 0)) {
    return pathHasCarbon ? { ...none, maxCarbonActivity: point.path.maxCarbonActivity, inletCarbonActivity: point.path.points[0]!.carbonActivity } : none;
  }
  const stack = minimumSteamToCarbon(dry, inputs.temperatureK, inputs.fuelPressureBar).minimumSteamToCarbon;
  // The pre-reformer's outlet temperature: stated, or solved for an adiabatic one.
  const preT = point.unit.preReformer?.outletTemperatureK ?? null;
  const pre = preT === null ? null : minimumSteamToCarbon(dry, preT, inputs.fuelPressureBar).minimumSteamToCarbon;
  const minimum = Math.max(stack, pre ?? 0);
  const preActivity = preT === null ? null : equilibriumCarbonActivity(point.unit.preReformer!.feed, preT, inputs.fuelPressureBar);
  return {
    steamToCarbon: inputs.steamToCarbon ?? null,
    minimumSteamToCarbonStack: stack,
    minimumSteamToCarbonPreReformer: pre,
    preReformerCarbonActivity: preActivity,
    inletCarbonActivity: inputs.technology.fuelGasEquilibrium ? point.path.points[0]!.carbonActivity : null,
    maxCarbonActivity: pathHasCarbon ? point.path.maxCarbonActivity : null,
    minimum,
    margin: inputs.steamToCarbon !== undefined ? inputs.steamToCarbon - minimum : null,
  };
}
