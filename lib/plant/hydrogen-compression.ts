/**
 * Hydrogen compression of an electrolysis plant (optional): the fuel-electrode product cooled to
 * the compressor inlet temperature, its water condensed to saturation
 * (lib/flowsheet/heat-recovery.ts) and the rest removed by a dryer (no energy counted), then
 * compressed in N intercooled stages of equal ratio (lib/flowsheet/compression.ts: ideal gas,
 * species data c_p(T), isentropic efficiency per stage; Çengel & Boles, Thermodynamics, ch. 7) and
 * after-cooled to the intercooling temperature. The whole dry product is compressed, including any
 * hydrogen fed with the steam.
 *
 * N is given, or the fewest that keep each stage's ratio at or below a stated maximum (stageCount)
 * and each stage's discharge temperature at or below a stated maximum (N raised one at a time
 * from the ratio's count, or from 1, until the hottest stage outlet is within it: the outlet
 * temperature of a stage falls as N rises, its ratio (p_out/p_in)^(1/N) falling). Every stage's
 * discharge is checked against the basis's maximum or, where it states none, against the limit
 * of data/compressor-discharge.yaml for the gas's molar mass (API 618, 5th edition, 2007, from
 * memory): a stage above it is a warning finding.
 */
import { z } from 'zod';
import { ZERO_CELSIUS_K } from '../core/units.ts';
import { CalculationError } from '../core/errors.ts';
import { readDataFile } from '../core/data-file.ts';
import type { CompressionInput, PlantInput } from '../basis/types.ts';
import { compressGas, type Compression } from '../flowsheet/compression.ts';
import { mixtureMolarMassKgPerMol } from '../thermo/mixture.ts';
import { exhaustHeatRecovery } from '../flowsheet/heat-recovery.ts';
import type { DesignPoint } from './design-point.ts';
import { totalFlow } from './streams.ts';
import type { ElectrolysisPlantBalance, StagesFrom } from './plant-balance-types.ts';
import { without, type PlantSheet } from './plant-sheet.ts';
import { finding, type Finding } from './findings.ts';

const DISCHARGE = readDataFile(
  new URL('./data/compressor-discharge.yaml', import.meta.url),
  z.strictObject({
    standard: z.string(),
    memory: z.boolean(),
    limits: z.array(z.strictObject({ service: z.string(), molarMassAtMost_g_per_mol: z.number().positive(), dischargeAtMost_K: z.number().positive() })).min(1),
  }),
);

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
export function stageCount(stages: { given: number } | { maximumStageRatio: number }, overallRatio: number): number {
  if ('given' in stages) return stages.given;
  const n = Math.max(1, Math.ceil(Math.log(overallRatio) / Math.log(stages.maximumStageRatio) - 1e-9));
  if (n > 10) {
    throw new CalculationError(`a stage pressure ratio of at most ${stages.maximumStageRatio} needs ${n} stages to reach the delivery pressure (overall ratio ${overallRatio.toPrecision(4)}); more than 10 are never built`, 'compression-stage-ratio');
  }
  return n;
}

/** The discharge temperature the stages are held at or checked against: the basis's, or the reference's for the gas's molar mass (the module comment). */
function dischargeLimit(c: CompressionInput, composition: Record<string, number>): { limitK: number; source: string } {
  if (c.maximumDischargeTemperatureK !== null) return { limitK: c.maximumDischargeTemperatureK, source: 'the basis' };
  const gramsPerMol = mixtureMolarMassKgPerMol(composition) * 1000;
  const limit = DISCHARGE.limits.find((l) => gramsPerMol <= l.molarMassAtMost_g_per_mol) ?? DISCHARGE.limits.at(-1)!;
  return { limitK: limit.dischargeAtMost_K, source: `${DISCHARGE.standard}, ${limit.service}${DISCHARGE.memory ? ', from memory' : ''}` };
}

/** The hottest stage outlet of a compression, K. */
function hottestOutletK(k: Compression): number {
  return Math.max(...k.stages.map((x) => x.outletTemperatureK));
}

/**
 * The compression in its stages: N as given, or the fewest of equal ratio within the basis's
 * maximum stage ratio and maximum discharge temperature (the module comment), and which rule set N.
 */
function stagedCompression(c: CompressionInput, run: (stages: number) => Compression, overallRatio: number): { k: Compression; stages: number; stagesFrom: StagesFrom } {
  if ('given' in c.stages) return { k: run(c.stages.given), stages: c.stages.given, stagesFrom: 'given' };
  const ratio = c.stages.maximumStageRatio;
  const fromRatio = ratio === null ? 1 : stageCount({ maximumStageRatio: ratio }, overallRatio);
  const limitK = c.maximumDischargeTemperatureK;
  for (let n = fromRatio; ; n++) {
    const k = run(n);
    if (limitK === null || hottestOutletK(k) <= limitK) return { k, stages: n, stagesFrom: ratio === null || n > fromRatio ? 'maximum-discharge-temperature' : 'maximum-stage-ratio' };
    if (n >= 10) {
      throw new CalculationError(`ten stages still discharge at ${(hottestOutletK(k) - ZERO_CELSIUS_K).toFixed(1)} °C, above the maximum discharge temperature of ${(limitK - ZERO_CELSIUS_K).toFixed(1)} °C (overall ratio ${overallRatio.toPrecision(4)}); more than 10 are never built: lower the inlet or intercooling temperature, or raise the limit`, 'compression-discharge-temperature');
    }
  }
}

/** A warning where a stage discharges above the limit (given stages against the basis's limit, or any stages against the reference's). */
function dischargeFinding(c: CompressionInput, k: Compression, limit: { limitK: number; source: string }): Finding[] {
  const hotK = hottestOutletK(k);
  if (!(hotK > limit.limitK)) return [];
  const stage = k.stages.findIndex((x) => x.outletTemperatureK === hotK) + 1;
  const celsius = (t: number) => `${(t - ZERO_CELSIUS_K).toFixed(1)} °C`;
  const ofBasis = c.maximumDischargeTemperatureK !== null;
  const what = ofBasis ? 'the maximum discharge temperature of the basis' : `the limit of ${limit.source} (the basis states no maximum-discharge-temperature)`;
  const path = ofBasis || 'given' in c.stages ? 'plant.hydrogen-compression.stages' : 'plant.hydrogen-compression.maximum-stage-ratio';
  const related = ofBasis ? ['plant.hydrogen-compression.maximum-discharge-temperature'] : [];
  return [finding('compressor-discharge-hot', 'warning', path, `stage ${stage} of the hydrogen compressor discharges at ${celsius(hotK)}, above ${celsius(limit.limitK)}, ${what}: more stages, a lower stage ratio or cooler intercooling keep it within; or state the limit of the machine chosen as maximum-discharge-temperature`, related)];
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
  // The vapour the dryer takes, at its partial pressure in the gas it is taken from (saturation at the cooler's exit): as pure water at the gas's pressure it would be liquid.
  const vapourBar = (dried / (dried + totalFlow(dry))) * pFuel;
  if (dried > 0) sheet.add('dryer-water', 'water vapour removed by the dryer (at its partial pressure in the wet gas)', c.inletTemperatureK, vapourBar, { H2O: dried });
  return { cooling, dry, condensate, dried };
}

/** The product as delivered (it comes at productK: the stack's, or after a recuperator): as it comes without compression, else cooled, dried and compressed (the module comment). */
export function hydrogenDelivery(point: DesignPoint, plant: PlantInput, product: Record<string, number>, productK: number, sheet: PlantSheet, findings: Finding[]): HydrogenDelivery {
  const tStack = productK;
  const pFuel = point.inputs.fuelPressureBar;
  const c = plant.hydrogenCompression;
  if (!c) return { productCooling: null, compression: null, delivered: { flows: product, temperatureK: tStack, pressureBar: pFuel }, condensateMolPerS: 0, driedMolPerS: 0 };
  const { cooling, dry, condensate, dried } = productCooling(product, tStack, c, pFuel, sheet);
  const run = (stages: number) =>
    compressGas({
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
  const { k, stages, stagesFrom } = stagedCompression(c, run, c.deliveryPressureBar / pFuel);
  const limit = dischargeLimit(c, dry);
  findings.push(...dischargeFinding(c, k, limit));
  const compression = {
    inletPressureBar: pFuel,
    deliveryPressureBar: c.deliveryPressureBar,
    inletTemperatureK: c.inletTemperatureK,
    intercoolTemperatureK: c.intercoolTemperatureK,
    stages,
    stagesFrom,
    pressureRatioPerStage: k.pressureRatioPerStage,
    isentropicEfficiency: c.isentropicEfficiency,
    flowMolPerS: totalFlow(dry),
    stageOutletTemperaturesK: k.stages.map((x) => x.outletTemperatureK),
    dischargeLimitK: limit.limitK,
    dischargeLimitSource: limit.source,
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
