/**
 * Degradation of the cell over its operating time, at a constant rate r (per unit of time) for a
 * time t: the loss grows linearly, r t (a constant rate is how stack makers and test reports
 * quote it, "0.5 %/kh"; the linear law over the life is common practice, no source):
 *
 *   area-specific-resistance:  ASR(t) = ASR₀ (1 + r t)
 *   cell-voltage:              V(t) = V₀ (1 − r t)   (power mode: the voltage falls)
 *                              V(t) = V₀ (1 + r t)   (electrolysis: the voltage rises)
 *
 * with ASR₀ and V₀ the beginning-of-life values at the same temperature, utilization and current
 * density: the resistance the basis gives (or implies by its voltage), and the voltage of the
 * uniform-voltage cell with it (voltage.ts). A voltage rate is applied at the point's own current
 * density, as the rate is defined (the loss of voltage at constant current); the cell's
 * resistance at the point is then the one that voltage implies.
 */
import type { Degradation } from '../basis/types.ts';
import { operatingVoltage, type CellVoltageRequest, type OperatingVoltage } from './voltage.ts';

/** The beginning-of-life cell and what the degradation makes of it. */
export interface AgedCell {
  /** r t: the fraction lost (voltage) or gained (resistance). */
  fraction: number;
  /** The cell voltage and area-specific resistance at the beginning of life, same point. */
  beginningOfLifeCellVoltageV: number;
  beginningOfLifeResistanceOhmM2: number;
}

/** r t of a degradation. */
function degradedFraction(degradation: Degradation): number {
  return degradation.ratePerS * degradation.operatingTimeS;
}

/**
 * The operating voltage of the cell after its degradation (none: the beginning of life), and the
 * beginning-of-life values it follows from.
 */
export function agedVoltage(request: CellVoltageRequest, degradation: Degradation | undefined): { voltage: OperatingVoltage; aged: AgedCell | null } {
  const fresh = operatingVoltage(request);
  if (!degradation) return { voltage: fresh, aged: null };
  const fraction = degradedFraction(degradation);
  const aged: AgedCell = { fraction, beginningOfLifeCellVoltageV: fresh.cellVoltageV, beginningOfLifeResistanceOhmM2: fresh.areaSpecificResistanceOhmM2 };
  const sign = request.mode === 'power' ? -1 : 1;
  const model =
    degradation.of === 'area-specific-resistance'
      ? ({ kind: 'area-specific-resistance', ohmM2: fresh.areaSpecificResistanceOhmM2 * (1 + fraction) } as const)
      : ({ kind: 'given', cellVoltageV: fresh.cellVoltageV * (1 + sign * fraction) } as const);
  // The source stays what the basis gives at the beginning of life.
  return { voltage: operatingVoltage({ ...request, model }, fresh.source), aged };
}
