/**
 * The operating voltage of a cell.
 *
 * Power mode:        E_oc = t_ion · E − ΔV_x          (open circuit lowered by electronic
 *                    leakage through a mixed conductor, t_ion < 1, and a crossover allowance)
 *                    V = given, or V = t_ion · Ē − ΔV_x − j · ASR
 * Electrolysis:      V = given, or V = Ē + j · ASR
 * with Ē the charge-averaged Nernst voltage along the fuel path (the uniform-voltage cell of a
 * co-flow stack whose local current follows the local driving force; lumped area-specific
 * resistance model, e.g. O'Hayre et al., Fuel Cell Fundamentals, 3rd ed., ch. 3 and 8).
 * t_ion and the crossover allowance are open-circuit effects of power mode; in electrolysis the
 * faradaic loss of a mixed conductor is not modelled and the basis says so in its method notes.
 */
import type { Mode } from '../electrochem/technologies.ts';
import type { VoltageModel } from '../basis/types.ts';
import { CalculationError } from '../core/errors.ts';

export interface OperatingVoltage {
  cellVoltageV: number;
  /** Effective mean driving voltage t_ion Ē − ΔV_x (power) or Ē (electrolysis), V. */
  effectiveNernstV: number;
  /** Open-circuit voltage at the inlet (t_ion E_in − ΔV_x), V; null for a dry inlet. */
  openCircuitV: number | null;
  /** Area-specific resistance used or implied, ohm m²: (Ē_eff − V)/j, or (V − Ē)/j in electrolysis. */
  areaSpecificResistanceOhmM2: number;
  source: 'given' | 'area-specific-resistance';
}

export function operatingVoltage(
  mode: Mode,
  model: VoltageModel,
  meanNernstV: number,
  inletNernstV: number | null,
  currentDensityAPerM2: number,
  ionicTransferenceNumber: number,
  crossoverAllowanceV: number,
): OperatingVoltage {
  const power = mode === 'power';
  const effective = power ? ionicTransferenceNumber * meanNernstV - crossoverAllowanceV : meanNernstV;
  const openCircuitV = power && inletNernstV !== null ? ionicTransferenceNumber * inletNernstV - crossoverAllowanceV : power ? null : inletNernstV;
  const cellVoltageV =
    model.kind === 'given' ? model.cellVoltageV : power ? effective - currentDensityAPerM2 * model.ohmM2 : effective + currentDensityAPerM2 * model.ohmM2;
  const field = model.kind === 'given' ? 'cell-voltage' : 'area-specific-resistance';
  if (power && !(cellVoltageV < effective)) {
    throw new CalculationError(
      `the cell voltage ${cellVoltageV.toFixed(4)} V is not below the mean Nernst voltage available, ${effective.toFixed(4)} V: the cell would deliver no current at this point`,
      field,
    );
  }
  if (power && !(cellVoltageV > 0)) {
    throw new CalculationError(`the resistance gives a cell voltage of ${cellVoltageV.toFixed(4)} V at this current density: lower the current density or the area-specific resistance`, field);
  }
  if (!power && !(cellVoltageV > effective)) {
    throw new CalculationError(
      `the cell voltage ${cellVoltageV.toFixed(4)} V is not above the mean Nernst voltage ${effective.toFixed(4)} V: electrolysis needs more than the reversible voltage`,
      field,
    );
  }
  return {
    cellVoltageV,
    effectiveNernstV: effective,
    openCircuitV,
    areaSpecificResistanceOhmM2: Math.abs(effective - cellVoltageV) / currentDensityAPerM2,
    source: model.kind === 'given' ? 'given' : 'area-specific-resistance',
  };
}
