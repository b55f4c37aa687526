/**
 * Heat recovery and combined heat and power of a fuel-cell plant:
 *  - The oxidiser's exhaust cooled to the exit temperature, with its water condensed to
 *    saturation there (lib/flowsheet/heat-recovery.ts); the plant's heaters take their net duty D
 *    first, the heat lost to ambient Q_loss = f_loss · LHV is subtracted, and
 *    Q_delivered = Q_recovered − D − Q_loss (+ the stack's coolant heat when recovered).
 *  - CHP: η_el = P_net/LHV, η_th = Q_delivered/LHV, η_CHP = η_el + η_th (on HHV likewise), the
 *    power-to-heat ratio P_net/Q_delivered (e.g. Larminie & Dicks, 2nd ed., §2.5 and ch. 9 for
 *    the definitions).
 */
import { ZERO_CELSIUS_K } from '../core/units.ts';
import { CalculationError } from '../core/errors.ts';
import type { PlantInput } from '../basis/types.ts';
import { exhaustHeatRecovery } from '../flowsheet/heat-recovery.ts';
import { FlowsheetInputError } from '../flowsheet/input-error.ts';
import type { DesignPoint } from './design-point.ts';
import { finding, type Finding } from './findings.ts';
import type { PowerPlantBalance } from './plant-balance-types.ts';
import type { PlantSheet } from './plant-sheet.ts';
import type { OxidiserExhaust } from './off-gas-oxidiser.ts';

/** What the heat recovery leaves: its figures, and the gas and condensate that leave the plant. */
export interface RecoveredExhaust {
  heatRecovery: NonNullable<PowerPlantBalance['heatRecovery']>;
  exitGas: Record<string, number>;
  exitK: number;
  condensate: number;
}

/** The heat the plant's heaters and losses take out of the recovery, W. */
export interface HeatClaims {
  netDutyW: number;
  heatLossW: number;
  stackCoolantW: number;
  /** The hottest feed the exhaust must heat, K. */
  hottestFeedK: number;
}

/** Findings of the heat recovery: an exhaust too cold for the preheat; no heat left to deliver. */
function heatRecoveryFindings(plant: PlantInput, exhaust: OxidiserExhaust, recoveredW: number, claims: HeatClaims, deliveredW: number, findings: Finding[]): void {
  const hr = plant.heatRecovery!;
  if (exhaust.temperatureK < claims.hottestFeedK + hr.minimumApproachK) {
    findings.push(
      finding(
        'exhaust-too-cold-for-preheat',
        'warning',
        'plant.heat-recovery.minimum-approach',
        `the oxidiser's exhaust (${(exhaust.temperatureK - ZERO_CELSIUS_K).toFixed(0)} °C) is not ${hr.minimumApproachK} K hotter than the hottest feed it must heat (${(claims.hottestFeedK - ZERO_CELSIUS_K).toFixed(0)} °C): the preheat needs another heat source`,
        ['conditions.fuel-inlet-temperature', 'conditions.air-inlet-temperature'],
      ),
    );
  }
  if (deliveredW < 0) {
    findings.push(
      finding(
        'exhaust-heat-short',
        'warning',
        'plant.heat-recovery.exhaust-exit-temperature',
        `the exhaust recovers ${(recoveredW / 1000).toPrecision(4)} kW, less than the plant's own heaters and losses take (${((claims.netDutyW + claims.heatLossW) / 1000).toPrecision(4)} kW): no heat is left to deliver`,
      ),
    );
  }
}

/** The exhaust's heat recovered down to the exit temperature and what of it is delivered (the module comment). */
export function exhaustRecovery(point: DesignPoint, plant: PlantInput, exhaust: OxidiserExhaust, claims: HeatClaims, sheet: PlantSheet, findings: Finding[]): RecoveredExhaust {
  const hr = plant.heatRecovery!;
  let r;
  try {
    r = exhaustHeatRecovery({ flowsMolPerS: exhaust.flows, inletTemperatureK: exhaust.temperatureK, exitTemperatureK: hr.exhaustExitTemperatureK, pressureBar: exhaust.pressureBar });
  } catch (error) {
    if (error instanceof FlowsheetInputError) throw new CalculationError(`the heat recovery: the exhaust exit temperature ${error.problem}`, 'exhaust-exit-temperature');
    throw error;
  }
  const delivered = r.heatWithCondensationW - claims.netDutyW - claims.heatLossW + claims.stackCoolantW;
  const heatRecovery = {
    inletTemperatureK: exhaust.temperatureK,
    exitTemperatureK: hr.exhaustExitTemperatureK,
    dewPointK: r.dewPointK,
    heatWithoutCondensationW: r.heatWithoutCondensationW,
    heatWithCondensationW: r.heatWithCondensationW,
    latentHeatW: r.latentHeatW,
    condensedWaterKgPerS: r.condensedWaterKgPerS,
    deliveredHeatW: delivered,
  };
  heatRecoveryFindings(plant, exhaust, r.heatWithCondensationW, claims, delivered, findings);
  const exitK = hr.exhaustExitTemperatureK;
  const condensate = r.condensedWaterMolPerS;
  sheet.add('exhaust', 'exhaust to the stack (chimney)', exitK, exhaust.pressureBar, r.exitGasMolPerS);
  if (condensate > 0) sheet.add('condensate', 'condensate', exitK, exhaust.pressureBar, { 'H2O(L)': condensate });
  return { heatRecovery, exitGas: r.exitGasMolPerS, exitK, condensate };
}

/** The CHP figures from the net power and the heat delivered (the module comment); null without heat recovery. */
export function chpOf(point: DesignPoint, heatRecovery: PowerPlantBalance['heatRecovery']): PowerPlantBalance['chp'] {
  if (!heatRecovery) return null;
  const netPowerW = point.netPowerW;
  const deliveredHeatW = heatRecovery.deliveredHeatW;
  const lhv = point.power!.fuelLhvW;
  const hhv = point.power!.fuelHhvW;
  return {
    netPowerW,
    deliveredHeatW,
    electricalLhv: netPowerW / lhv,
    thermalLhv: deliveredHeatW / lhv,
    totalLhv: (netPowerW + deliveredHeatW) / lhv,
    totalHhv: (netPowerW + deliveredHeatW) / hhv,
    powerToHeat: deliveredHeatW > 0 ? netPowerW / deliveredHeatW : null,
  };
}
