/**
 * Hydrogen compression of an electrolysis plant (optional): the fuel-electrode product cooled to
 * the compressor inlet temperature, its water condensed to saturation
 * (lib/flowsheet/heat-recovery.ts) and the rest removed by a dryer (no energy counted), then
 * compressed in N intercooled stages of equal ratio (N given, or the fewest that keep each stage's
 * ratio at or below a stated maximum, stageCount) (lib/flowsheet/compression.ts: ideal gas,
 * species data c_p(T), isentropic efficiency per stage; Çengel & Boles, Thermodynamics, ch. 7) and
 * after-cooled to the intercooling temperature. The whole dry product is compressed, including any
 * hydrogen fed with the steam.
 */
import { ZERO_CELSIUS_K } from '../core/units.ts';
import { CalculationError } from '../core/errors.ts';
import type { CompressionInput, PlantInput } from '../basis/types.ts';
import { compressGas } from '../flowsheet/compression.ts';
import { exhaustHeatRecovery } from '../flowsheet/heat-recovery.ts';
import type { DesignPoint } from './design-point.ts';
import { totalFlow } from './streams.ts';
import type { ElectrolysisPlantBalance } from './plant-balance-types.ts';
import { without, type PlantSheet } from './plant-sheet.ts';

/** The hydrogen as it leaves the plant, and the water taken out of it on the way. */
export interface HydrogenDelivery {
  productCooling: ElectrolysisPlantBalance['productCooling'];
  compression: ElectrolysisPlantBalance['compression'];
  delivered: { flows: Record<string, number>; temperatureK: number; pressureBar: number };
  condensateMolPerS: number;
  driedMolPerS: number;
}

/**
 * The compression stages: as given, or the fewest of equal ratio that keep each at or below r_max,
 * N = ⌈ln(p_out/p_in) / ln r_max⌉ (at least 1; a quotient within 1e-9 of a whole number is taken as
 * it, so that r_max equal to the ratio of N stages gives N).
 */
export function stageCount(stages: CompressionInput['stages'], overallRatio: number): number {
  if ('given' in stages) return stages.given;
  const n = Math.max(1, Math.ceil(Math.log(overallRatio) / Math.log(stages.maximumStageRatio) - 1e-9));
  if (n > 10) {
    throw new CalculationError(`a stage pressure ratio of at most ${stages.maximumStageRatio} needs ${n} stages to reach the delivery pressure (overall ratio ${overallRatio.toPrecision(4)}); more than 10 are never built`, 'compression-stage-ratio');
  }
  return n;
}

/** The product cooled to the compressor inlet, its water condensed, the rest dried off. */
function productCooling(product: Record<string, number>, fromK: number, c: NonNullable<PlantInput['hydrogenCompression']>, pFuel: number, sheet: PlantSheet) {
  if (!(c.inletTemperatureK < fromK)) {
    throw new CalculationError(`the compressor inlet temperature (${(c.inletTemperatureK - ZERO_CELSIUS_K).toFixed(1)} °C) must lie below the temperature the product gas comes at (${(fromK - ZERO_CELSIUS_K).toFixed(1)} °C, the stack's or after the recuperator): it is cooled to it`, 'compressor-inlet-temperature');
  }
  const cooled = exhaustHeatRecovery({ flowsMolPerS: product, inletTemperatureK: fromK, exitTemperatureK: c.inletTemperatureK, pressureBar: pFuel });
  const condensate = cooled.condensedWaterMolPerS;
  const dried = cooled.exitGasMolPerS.H2O ?? 0;
  const dry = without(cooled.exitGasMolPerS, 'H2O');
  const cooling = { fromK, toK: c.inletTemperatureK, pressureBar: pFuel, dutyW: -cooled.heatWithCondensationW, condensedMolPerS: condensate, driedMolPerS: dried };
  sheet.duty('product-cooling', 'hydrogen product cooled (water condensed) ahead of the dryer', -cooled.heatWithCondensationW, fromK, c.inletTemperatureK);
  sheet.add('product-dried', 'hydrogen product cooled and dried', c.inletTemperatureK, pFuel, dry);
  if (condensate > 0) sheet.add('product-condensate', 'condensate from the product cooler', c.inletTemperatureK, pFuel, { 'H2O(L)': condensate });
  if (dried > 0) sheet.add('dryer-water', 'water vapour removed by the dryer', c.inletTemperatureK, pFuel, { H2O: dried });
  return { cooling, dry, condensate, dried };
}

/** The product as delivered (it comes at productK: the stack's, or after a recuperator): as it comes without compression, else cooled, dried and compressed (the module comment). */
export function hydrogenDelivery(point: DesignPoint, plant: PlantInput, product: Record<string, number>, productK: number, sheet: PlantSheet): HydrogenDelivery {
  const tStack = productK;
  const pFuel = point.inputs.fuelPressureBar;
  const c = plant.hydrogenCompression;
  if (!c) return { productCooling: null, compression: null, delivered: { flows: product, temperatureK: tStack, pressureBar: pFuel }, condensateMolPerS: 0, driedMolPerS: 0 };
  const { cooling, dry, condensate, dried } = productCooling(product, tStack, c, pFuel, sheet);
  const stages = stageCount(c.stages, c.deliveryPressureBar / pFuel);
  const k = compressGas({
    composition: dry,
    molarFlowMolPerS: totalFlow(dry),
    inletTemperatureK: c.inletTemperatureK,
    inletPressureBar: pFuel,
    deliveryPressureBar: c.deliveryPressureBar,
    stages,
    isentropicEfficiency: c.isentropicEfficiency,
    intercoolTemperatureK: c.intercoolTemperatureK,
    deliveryTemperatureK: c.intercoolTemperatureK,
  });
  const compression = {
    inletPressureBar: pFuel,
    deliveryPressureBar: c.deliveryPressureBar,
    inletTemperatureK: c.inletTemperatureK,
    intercoolTemperatureK: c.intercoolTemperatureK,
    stages,
    stagesFrom: 'given' in c.stages ? ('given' as const) : ('maximum-stage-ratio' as const),
    pressureRatioPerStage: k.pressureRatioPerStage,
    isentropicEfficiency: c.isentropicEfficiency,
    flowMolPerS: totalFlow(dry),
    stageOutletTemperaturesK: k.stages.map((x) => x.outletTemperatureK),
    powerW: k.powerW,
    workJPerKg: k.workJPerKg,
    intercoolersW: k.intercoolerDutyW,
    aftercoolerW: k.aftercoolerDutyW,
  };
  if (k.intercoolerDutyW > 0) sheet.duty('intercoolers', 'compressor intercoolers', -k.intercoolerDutyW, Math.max(...k.stages.slice(0, -1).map((x) => x.outletTemperatureK)), c.intercoolTemperatureK);
  if (k.aftercoolerDutyW > 0) sheet.duty('aftercooler', 'compressor after-cooler', -k.aftercoolerDutyW, k.stages.at(-1)!.outletTemperatureK, c.intercoolTemperatureK);
  const delivered = { flows: dry, temperatureK: k.deliveryTemperatureK, pressureBar: c.deliveryPressureBar };
  sheet.add('hydrogen-delivered', 'hydrogen delivered', delivered.temperatureK, delivered.pressureBar, dry);
  return { productCooling: cooling, compression, delivered, condensateMolPerS: condensate, driedMolPerS: dried };
}
