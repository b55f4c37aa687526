/**
 * Everything cellbasis computes for one design basis, as the results object of
 * lib/plant/results-schema.ts: the design point of the sizing case (fuel path, voltage, size,
 * streams, heat, efficiency, supplies, degradation), the carbon margin, the chart sweeps, the
 * sensitivities and the hazards; the operating cases on its hardware (cases.ts) and their
 * envelope (envelope.ts).
 * Calculation errors in a valid basis are located at the field they concern.
 */
import { FARADAY_C_PER_MOL as F } from '../thermo/constants.ts';
import { getSpecies, speciesDataHash } from '../thermo/species-data.ts';
import { enthalpy } from '../thermo/properties.ts';
import { evaluateReaction } from '../electrochem/reaction.ts';
import { waterActivityVoltage } from '../electrochem/nernst.ts';
import { activationOverpotentialV } from './activation.ts';
import { assessHazards } from '../hazards/assessment.ts';
import type { AirHumidity, DesignBasis } from '../basis/types.ts';
import { toolVersion } from '../core/version.ts';
import { designInputs } from './design-inputs.ts';
import { evaluateDesignPoint, type DesignPoint } from './design-point.ts';
import { carbonMargin, type CarbonLimits } from './carbon-margin.ts';
import { currentDensitySweep, stackTemperatureSweep, steamToCarbonSweep, temperatureSweep } from './sweeps.ts';
import { sensitivities } from './sensitivity.ts';
import { hazardInput } from './hazard-streams.ts';
import { locateCalculationErrors } from './located-error.ts';
import { fractions } from './plant-sheet.ts';
import { enthalpyFlowW, gasFlow, gasMoleFractions, massFlowKgPerS, normalVolumeM3PerS, totalFlow, type Stream } from './streams.ts';
import type { Results } from './results-schema.ts';
import { plantOf, streamResult } from './plant-results.ts';

export { plantOf };
import { finding, withAssumptions, type Finding } from './findings.ts';
import { caseFindings, caseResults, layoutCases } from './cases.ts';
import { envelopeOf } from './envelope.ts';
import { installedLayout, plantBalance, plantOverRanges, type PlantBalance } from './plant-balance.ts';
import { BasisError } from '../basis/diagnostics.ts';

const HOUR = 3600;

/** Combustibles of a dry fuel other than H2 (a pure-hydrogen fuel has none). */
function onlyHydrogen(dry: Readonly<Record<string, number>> | null): boolean {
  if (!dry) return false;
  return Object.entries(dry).every(([k, v]) => v === 0 || k === 'H2' || ['H2O', 'N2', 'Ar', 'He', 'CO2'].includes(k));
}

/** Water (vapour and liquid) leaving the stack minus water entering it, mol/s. */
function netWater(point: DesignPoint): number {
  const water = (s: Stream) => (s.flows.H2O ?? 0) + (s.flows['H2O(L)'] ?? 0);
  const inlets = point.streams.filter((s) => s.id === 'fuel-inlet' || s.id === 'air-inlet');
  const outlets = point.streams.filter((s) => s.id === 'fuel-outlet' || s.id === 'air-outlet');
  return outlets.reduce((a, s) => a + water(s), 0) - inlets.reduce((a, s) => a + water(s), 0);
}

/** The design point, with the errors of the calculation located at the basis fields they concern. */
export function evaluateBasis(basis: DesignBasis): DesignPoint {
  return locateCalculationErrors(basis, () => evaluateDesignPoint(designInputs(basis)));
}

/** The path of the first number in the value that is NaN or infinite, if any. */
function firstNonFinite(value: unknown, path: string): string | undefined {
  if (typeof value === 'number') return Number.isFinite(value) ? undefined : path;
  if (value === null || typeof value !== 'object') return undefined;
  for (const [key, item] of Object.entries(value)) {
    const found = firstNonFinite(item, Array.isArray(value) ? `${path}[${key}]` : `${path}.${key}`);
    if (found) return found;
  }
  return undefined;
}

/**
 * The results of a basis. A number that is NaN or infinite would be printed and issued as if it
 * were one: that is a gap in the validation, so it stops here as an internal error naming it.
 */
export function calculate(basis: DesignBasis): Results {
  const results = calculateResults(basis);
  const bad = firstNonFinite(results, 'results');
  if (bad) throw new Error(`${basis.file}: the calculation gave a number that is not finite at ${bad}`);
  return results;
}

/** What several sections of the results are computed from: the design point and the figures they share. */
interface Computed {
  point: DesignPoint;
  inputs: DesignPoint['inputs'];
  power: boolean;
  carbon: ReturnType<typeof carbonMargin>;
  airIn: Stream | undefined;
  /** O2 the current consumes (power mode), and O2 fed with the air, mol/s. */
  o2Consumed: number | null;
  o2Fed: number | null;
  h2KgPerH: number | null;
}

function computed(point: DesignPoint, carbon: ReturnType<typeof carbonMargin> = carbonMargin(point)): Computed {
  const inputs = point.inputs;
  const power = inputs.mode === 'power';
  const airIn = point.streams.find((s) => s.id === 'air-inlet');
  const h2MolPerS = point.electrolysis?.hydrogenMolPerS ?? null;
  return {
    point,
    inputs,
    power,
    carbon,
    airIn,
    o2Consumed: power ? point.ionicCurrentA / (4 * F) : null,
    o2Fed: airIn ? (airIn.flows.O2 ?? 0) : null,
    h2KgPerH: h2MolPerS === null ? null : h2MolPerS * getSpecies('H2').molarMassKgPerMol * HOUR,
  };
}

function headlineOf({ point, carbon, airIn, h2KgPerH }: Computed): Results['headline'] {
  const eff = point.power;
  const el = point.electrolysis;
  return {
    meanNernst_V: point.path.meanNernstV,
    inletNernst_V: point.path.inletNernstV,
    outletNernst_V: point.path.outletNernstV,
    openCircuit_V: point.voltage.openCircuitV,
    cellVoltage_V: point.voltage.cellVoltageV,
    stackVoltage_V: point.stackVoltageV,
    cells: point.sizing.cells,
    cellCurrent_A: point.cellCurrentA,
    totalCurrent_A: point.totalCurrentA,
    stackPower_W: point.stackPowerW,
    netPower_W: point.netPowerW,
    electricalEfficiencyLhv: eff?.electricalLhvNet ?? null,
    electricalEfficiencyHhv: eff?.electricalHhvNet ?? null,
    thermodynamicLimitLhv: eff?.limitLhv ?? null,
    thermodynamicLimitHhv: eff?.limitHhv ?? null,
    stackHeat_W: point.heat.isothermalHeatW,
    maxLocalCurrentDensity_A_per_m2: point.voltage.maxLocalCurrentDensityAPerM2,
    airFlow_kg_per_h: airIn ? massFlowKgPerS(airIn.flows) * HOUR : null,
    hydrogenProduction_kg_per_h: h2KgPerH,
    hydrogenProduction_kg_per_day: h2KgPerH === null ? null : h2KgPerH * 24,
    specificEnergy_kWh_per_kg: el?.specificEnergyKWhPerKg ?? null,
    minimumSteamToCarbon: carbon.minimum,
    carbonMargin: carbon.margin,
    maxCarbonActivity: carbon.maxCarbonActivity,
  };
}

/** E° of the fuel path; E and V_tn of H2 + ½O2 → H2O (gas, or liquid where the cell runs with it) at T; the voltages and inputs of the cell. */
function electrochemistryOf({ point, inputs }: Computed): Results['electrochemistry'] {
  const waterLabel = inputs.technology.waterPhase === 'gas' ? 'H2O' : 'H2O(L)';
  const hydrogen = evaluateReaction(`H2 + 1/2 O2 -> ${waterLabel}`, inputs.temperatureK);
  return {
    // E° of pure water: the fuel path's E° carries the electrolyte's water activity (−RT/2F ln a_w, 0 for pure water).
    standardVoltage_V: point.path.standardVoltageV - waterActivityVoltage(inputs.temperatureK, point.path.waterActivity),
    reversibleVoltage_V: hydrogen.reversibleVoltage_V,
    thermoneutralVoltage_V: hydrogen.thermoneutralVoltage_V,
    effectiveThermoneutralVoltage_V: point.heat.thermoneutralVoltageV,
    effectiveNernst_V: point.voltage.effectiveNernstV,
    areaMeanNernst_V: point.voltage.areaMeanNernstV,
    harmonicIntegral_per_V: point.voltage.harmonicIntegralPerV,
    ionicCurrent_A: point.ionicCurrentA,
    ionicCurrentDensity_A_per_m2: point.voltage.ionicCurrentDensityAPerM2,
    leakageCurrentDensity_A_per_m2: point.voltage.leakageCurrentDensityAPerM2,
    areaSpecificResistance_ohm_m2: point.voltage.areaSpecificResistanceOhmM2,
    voltageSource: point.voltage.source,
    ionicTransferenceNumber: inputs.ionicTransferenceNumber,
    crossoverAllowance_V: inputs.crossoverAllowanceV,
    resistanceLaw: inputs.resistanceLaw
      ? { activationEnergy_J_per_mol: inputs.resistanceLaw.activationEnergyJPerMol, referenceTemperature_K: inputs.resistanceLaw.referenceTemperatureK!, source: inputs.resistanceLaw.source }
      : null,
    ...activationLossOf(point, inputs),
    chargeBasis_A: point.path.chargeBasisA * point.scale,
    utilization: inputs.utilization,
    elementBalanceError: point.path.elementBalanceError,
  };
}

/** The activation loss and the breakdown of the point's voltage, where the basis gives the loss. */
function activationLossOf(point: DesignPoint, inputs: DesignPoint['inputs']): Pick<Results['electrochemistry'], 'activationLoss'> {
  const loss = inputs.activationLoss;
  const losses = point.voltage.losses;
  if (!loss || !losses) return {};
  return {
    activationLoss: {
      tafelSlope_V_per_decade: loss.tafelSlopeVPerDecade,
      exchangeCurrentDensity_A_per_m2: loss.exchangeCurrentDensityAPerM2,
      source: loss.source,
      atMeanCurrentDensity_V: activationOverpotentialV(loss, inputs.currentDensityAPerM2),
      areaMean_V: losses.activationV,
      ohmic_V: losses.ohmicV,
    },
  };
}

/** Current density and area, what set the cell count, the air supply and the water made. */
function operatingPointOf({ point, inputs, o2Consumed, o2Fed }: Computed): Results['operatingPoint'] {
  return {
    currentDensity_A_per_m2: inputs.currentDensityAPerM2,
    activeArea_m2: inputs.activeAreaM2,
    totalActiveArea_m2: inputs.activeAreaM2 * point.sizing.cells,
    cellsFrom: point.sizing.from,
    parasiticFraction: inputs.parasiticFraction,
    conversionEfficiency: inputs.conversionEfficiency,
    airUtilization: o2Consumed && o2Fed ? o2Consumed / o2Fed : null,
    airRatio: o2Consumed && o2Fed ? o2Fed / o2Consumed : null,
    oxygenConsumed_mol_per_s: o2Consumed,
    netWaterProduced_mol_per_s: netWater(point),
  };
}

function efficiencyOf({ point, power }: Computed): Results['efficiency'] {
  const eff = point.power;
  const el = point.electrolysis;
  return {
    fuelLhvInput_W: eff?.fuelLhvW ?? null,
    fuelHhvInput_W: eff?.fuelHhvW ?? null,
    thermodynamicLimitLhv: eff?.limitLhv ?? null,
    thermodynamicLimitHhv: eff?.limitHhv ?? null,
    carnotLimit: eff?.carnot ?? null,
    voltageEfficiency: eff?.voltageEfficiency ?? el!.voltageEfficiency,
    faradaicEfficiency: power ? point.totalCurrentA / point.ionicCurrentA : point.ionicCurrentA / point.totalCurrentA,
    electricalEfficiencyLhvGross: eff?.electricalLhvGross ?? null,
    electricalEfficiencyHhvGross: eff?.electricalHhvGross ?? null,
    electricalEfficiencyLhvNet: eff?.electricalLhvNet ?? null,
    electricalEfficiencyHhvNet: eff?.electricalHhvNet ?? null,
    electrolysisEfficiencyLhv: el?.efficiencyLhv ?? null,
    electrolysisEfficiencyHhv: el?.efficiencyHhv ?? null,
    specificEnergy_kWh_per_kg: el?.specificEnergyKWhPerKg ?? null,
    hydrogenProduction_mol_per_s: el?.hydrogenMolPerS ?? null,
    oxygenProduction_mol_per_s: el?.oxygenMolPerS ?? null,
    carbonMonoxideProduction_mol_per_s: el ? el.carbonMonoxideMolPerS : null,
    methaneProduction_mol_per_s: el ? el.methaneMolPerS : null,
    productLhv_W: el?.productLhvW ?? null,
    productHhv_W: el?.productHhvW ?? null,
    steamLatentHeat_W: el?.steamLatentHeatW ?? null,
    heatInclusiveEfficiencyLhv: el?.heatInclusiveEfficiencyLhv ?? null,
    heatInclusiveEfficiencyHhv: el?.heatInclusiveEfficiencyHhv ?? null,
  };
}

/**
 * The heat balance, the air-cooled stack's balance with its feeds as fed and its cooling air, and, for pure hydrogen with gaseous water, the cross-check:
 * the isothermal heat must equal I (−ΔH(T)/2F − V).
 */
function heatOf({ point, inputs, power, o2Consumed }: Computed): Results['heat'] {
  const t = inputs.temperatureK;
  // The air-electrode inlet's own composition: the basis's feed, or what a cathode-gas loop makes of it.
  const fed = inputs.cathodeLoop && point.unit.air ? fractions(point.unit.air) : inputs.airFeed;
  const coolingRatio = point.coolingAirMolPerS !== null && o2Consumed && fed?.O2 ? point.coolingAirMolPerS / (o2Consumed / fed.O2) : null;
  const coolingKgPerH = point.coolingAirMolPerS !== null && fed ? point.coolingAirMolPerS * massFlowKgPerS(fed) * HOUR : null;
  // Pure hydrogen, gaseous water: the isothermal heat must equal I_ion (−ΔH(T)/2F) − I V.
  const crossCheck =
    power && inputs.technology.waterPhase === 'gas' && onlyHydrogen(inputs.dryFuel) && inputs.preReforming.kind === 'none'
      ? (point.ionicCurrentA * -(enthalpy(getSpecies('H2O'), t) - enthalpy(getSpecies('H2'), t) - 0.5 * enthalpy(getSpecies('O2'), t))) / (2 * F) - point.stackPowerW
      : null;
  return {
    isothermalHeat_W: point.heat.isothermalHeatW,
    asFedHeat_W: point.heat.asFedHeatW,
    inletEnthalpyIsothermal_W: point.heat.inletEnthalpyIsothermalW,
    inletEnthalpyAsFed_W: point.heat.inletEnthalpyAsFedW,
    outletEnthalpy_W: point.heat.outletEnthalpyW,
    electricWorkIn_W: point.heat.workInW,
    heatPerCell_W: point.heat.isothermalHeatW / point.sizing.cells,
    heatPerArea_W_per_m2: point.heat.isothermalHeatW / (point.sizing.cells * inputs.activeAreaM2),
    stackBalance: point.stackBalance
      ? {
          fuelHeating_W: point.stackBalance.fuelHeatingW,
          airHeating_W: point.stackBalance.airHeatingW,
          airExhaustTemperature_K: point.stackBalance.exhaustTemperatureK,
          closingAirInletTemperature_K: point.stackBalance.closingAirInletK,
        }
      : null,
    coolingAir_mol_per_s: point.coolingAirMolPerS,
    coolingAir_kg_per_h: coolingKgPerH,
    coolingAirRatio: coolingRatio,
    coolingWater_kg_per_h: point.coolingWaterMolPerS === null ? null : point.coolingWaterMolPerS * getSpecies('H2O(L)').molarMassKgPerMol * HOUR,
    allowedAirTemperatureRise_K: inputs.allowedAirTemperatureRiseK,
    hydrogenCrossCheck_W: crossCheck,
    heatDemand_W: power ? null : Math.max(0, -point.heat.isothermalHeatW),
    liquidWaterOut_mol_per_s: point.water ? point.water.liquid : null,
    outletsSaturated: point.water ? point.water.saturated : null,
  };
}

/**
 * What the plant supplies to the stack: the air-electrode gas (not liquid water). Power mode: the feed of the fuel electrode (before any
 * pre-reformer) is the dry fuel with s mol of steam added per mol of it, so with x the steam's
 * mole fraction in the feed and x_d in the dry fuel, s = (x − x_d)/(1 − x): fuel = ṁ_feed of the
 * dry part, steam = its water beyond the dry fuel's. Electrolysis: the water (vapour and liquid)
 * of the water electrode's inlet, and the water split, the net water the stack consumes.
 */
function supplyOf({ point, inputs, power }: Computed): Results['supply'] {
  const kgPerH = (flows: Readonly<Record<string, number>>) => massFlowKgPerS(flows) * HOUR;
  const waterKgPerH = (mol: number) => mol * getSpecies('H2O').molarMassKgPerMol * HOUR;
  const water = (flows: Readonly<Record<string, number>>) => (flows.H2O ?? 0) + (flows['H2O(L)'] ?? 0);
  const airIn = point.streams.find((s) => s.id === 'air-inlet');
  const air = airIn && !(airIn.flows['H2O(L)'] ?? 0) ? kgPerH(airIn.flows) : null;
  if (power) {
    const feed = point.streams.find((s) => s.id === 'fuel-feed') ?? point.streams.find((s) => s.id === 'fuel-inlet');
    if (!feed || !inputs.dryFuel || !inputs.fuelFeed) return { air_kg_per_h: air, fuel_kg_per_h: null, water_kg_per_h: null, waterSplit_kg_per_h: null };
    const x = inputs.fuelFeed.H2O ?? 0;
    const xDry = inputs.dryFuel.H2O ?? 0;
    const steamPerDry = (x - xDry) / (1 - x);
    const dryMol = totalFlow(feed.flows) / (1 + steamPerDry);
    const dryFlows = Object.fromEntries(Object.entries(inputs.dryFuel).map(([k, v]) => [k, v * dryMol]));
    return { air_kg_per_h: air, fuel_kg_per_h: kgPerH(dryFlows), water_kg_per_h: steamPerDry > 0 ? waterKgPerH(dryMol * steamPerDry) : null, waterSplit_kg_per_h: null };
  }
  const inlet = point.streams.find((s) => s.id === (inputs.technology.waterElectrode === 'fuel' ? 'fuel-inlet' : 'air-inlet'));
  const fed = inlet ? water(inlet.flows) : 0;
  return { air_kg_per_h: air, fuel_kg_per_h: null, water_kg_per_h: fed > 0 ? waterKgPerH(fed) : null, waterSplit_kg_per_h: waterKgPerH(Math.max(0, -netWater(point))) };
}

/** The degradation of the point, with the beginning-of-life cell it follows from; null at the beginning of life. */
function degradationOf({ point, inputs }: Computed): Results['degradation'] {
  const d = inputs.degradation;
  if (!d || !point.degradation) return null;
  return {
    of: d.of,
    rate_per_h: d.ratePerS * HOUR,
    operatingTime_h: d.operatingTimeS / HOUR,
    fraction: point.degradation.fraction,
    beginningOfLifeCellVoltage_V: point.degradation.beginningOfLifeCellVoltageV,
    beginningOfLifeAreaSpecificResistance_ohm_m2: point.degradation.beginningOfLifeResistanceOhmM2,
  };
}

/** The findings of the design point and the one the carbon margin adds when it is negative, with the assumptions that bear on them. */
function findingsOf({ point, inputs, carbon }: Computed, basis: DesignBasis, plantFindings: readonly Finding[]): Results['findings'] {
  const found = [...point.findings, ...plantFindings];
  for (const reason of carbon.notReached) {
    found.push(finding('steam-to-carbon-limit-not-reached', 'critical', 'streams.fuel-electrode.steam-to-carbon', reason.message, ['streams.fuel-electrode.fuel', 'conditions.operating-temperature']));
  }
  if (carbon.margin !== null && carbon.margin < 0) {
    found.push(
      finding(
        'steam-to-carbon-below-minimum',
        'critical',
        'streams.fuel-electrode.steam-to-carbon',
        `the steam-to-carbon ratio ${inputs.steamToCarbon} is below the carbon-free minimum ${carbon.minimum!.toFixed(3)}`,
        ['streams.fuel-electrode.pre-reforming'],
      ),
    );
  }
  return withAssumptions(found, basis);
}

/**
 * The plant of a case on the sizing case's hardware: its electrical layout fixed (the sizing
 * case's cells per stack, stacks in series and strings in parallel, whether given or derived from
 * the DC bus window), the plant blocks' design choices those of the basis, each block then
 * balanced at the case's own flows and temperatures (plant-balance.ts). The layout was made for
 * the cell voltages of every case (a bus window fitting none of them refuses the basis at the
 * window), so no case leaves the window; a case whose plant cannot be balanced (the
 * off-gas too lean to burn, an exhaust that cannot reach its exit temperature...) keeps its stack
 * results, its plant null, with the reason as a critical finding `case-plant-cannot-run`.
 */
export function casePlant(point: DesignPoint, basis: DesignBasis, layout: PlantBalance['electrical']): { plant: PlantBalance | null; findings: Finding[] } {
  const electrical = { cellsPerStack: layout.cellsPerStack, stacksInSeries: layout.stacksInSeries, stringsInParallel: layout.stringsInParallel };
  let plant: PlantBalance;
  try {
    const balanced = locateCalculationErrors(basis, () => plantBalance(point, { ...basis.plant, electrical }));
    // The layout is the sizing case's: it says where that came from (given, or the bus window) and the cells the sizing calculation required.
    plant = { ...balanced, electrical: { ...balanced.electrical, requiredCells: layout.requiredCells, stacksInSeriesFrom: layout.stacksInSeriesFrom, stringsInParallelFrom: layout.stringsInParallelFrom } };
  } catch (error) {
    if (!(error instanceof BasisError)) throw error;
    const e = error.errors[0]!;
    return { plant: null, findings: [finding('case-plant-cannot-run', 'critical', e.path, `the plant around the stack cannot be balanced at this case: ${error.errors.map((d) => d.message).join('; ')}`)] };
  }
  // No case leaves the DC bus window: the sizing layout was made for every case's cell voltage.
  return { plant, findings: [...plant.findings] };
}

/** A case's sections with its plant (casePlant), as cases.ts assembles them. */
export type CasePointResults = PointResults & { plant: Results['plant'] | null };

/** The sections of a case on the sizing case's layout: its point results and its plant. */
export function casePointResults(layout: PlantBalance['electrical']) {
  return (point: DesignPoint, basis: DesignBasis, carbon?: ReturnType<typeof carbonMargin>): CasePointResults => {
    const own = casePlant(point, basis, layout);
    return { ...pointResults(point, basis, carbon, own.findings), plant: own.plant && plantOf(own.plant) };
  };
}

/** The sections of the results that every operating point has (the sizing case and every other case). */
export type PointResults = Pick<Results, 'conditions' | 'headline' | 'electrochemistry' | 'operatingPoint' | 'streams' | 'efficiency' | 'heat' | 'carbon' | 'supply' | 'degradation' | 'findings'>;

/**
 * The sections of one operating point; `carbon` is its carbon margin when already found (a case on
 * the same fuel gas); `plantFindings` those of its plant balance.
 */
export function pointResults(point: DesignPoint, basis: DesignBasis, carbon?: ReturnType<typeof carbonMargin>, plantFindings: readonly Finding[] = []): PointResults {
  const c = computed(point, carbon);
  const margin = c.carbon;
  return {
    conditions: conditionsOf(c, basis),
    headline: headlineOf(c),
    electrochemistry: electrochemistryOf(c),
    operatingPoint: operatingPointOf(c),
    streams: point.streams.map(streamResult),
    efficiency: efficiencyOf(c),
    heat: heatOf(c),
    carbon: {
      steamToCarbon: margin.steamToCarbon,
      minimumSteamToCarbonStack: margin.minimumSteamToCarbonStack,
      minimumSteamToCarbonPreReformer: margin.minimumSteamToCarbonPreReformer,
      preReformerCarbonActivity: margin.preReformerCarbonActivity,
      inletCarbonActivity: margin.inletCarbonActivity,
      maxCarbonActivity: margin.maxCarbonActivity,
    },
    supply: supplyOf(c),
    degradation: degradationOf(c),
    findings: findingsOf(c, basis, plantFindings),
  };
}

function conditionsOf({ inputs }: Computed, basis: DesignBasis): Results['conditions'] {
  return {
    temperature_K: inputs.temperatureK,
    fuelPressure_bar: inputs.fuelPressureBar,
    airPressure_bar: inputs.airPressureBar,
    fuelInletTemperature_K: inputs.fuelInletTemperatureK,
    airInletTemperature_K: inputs.airInletTemperatureK,
    ambientTemperature_K: inputs.ambientTemperatureK,
    airHumidity: airHumidityOf(basis.airElectrode?.humidity),
  };
}

/** The humidity of a humid-air feed as the basis states it and converts it (lib/basis/humid-air.ts), in the results' units. */
function airHumidityOf(h: AirHumidity | undefined): Results['conditions']['airHumidity'] {
  if (!h) return null;
  return {
    form: h.form,
    temperature_K: h.temperatureK,
    relativeHumidity: h.relativeHumidity,
    saturationPressure_Pa: h.saturationPressurePa,
    pressure_Pa: h.pressurePa,
    pressureOf: h.pressureOf,
    waterFraction: h.waterFraction,
  };
}

/** The points along the fuel path with their local Nernst voltage, area fraction, current density and carbon activity. */
function fuelPathOf(point: DesignPoint): Results['fuelPath'] {
  return {
    points: point.path.points.map((p, k) => ({
      utilization: p.utilization,
      nernst_V: p.nernstV,
      areaFraction: point.voltage.local[k]!.areaFraction,
      currentDensity_A_per_m2: point.voltage.local[k]!.currentDensityAPerM2,
      carbonActivity: p.carbonActivity,
      fuelSide: p.fuelSide,
      airSide: p.airSide,
      fuelCouple_bar: p.fuelCoupleBar,
    })),
    inlet: point.path.inlet,
    inletUtilization: point.path.inletUtilization,
    nernstForm: point.path.nernstForm,
    standardVoltage_V: point.path.standardVoltageV,
    waterActivity: point.path.waterActivity,
  };
}

/** The chart sweeps of the sizing point over the basis's sweep range. */
function sweepsOf(point: DesignPoint, sizingBasis: DesignBasis): Results['sweeps'] {
  return {
    temperature: temperatureSweep(point, sizingBasis.conditions.sweepFromK, sizingBasis.conditions.sweepToK),
    currentDensity: currentDensitySweep(point),
    stackTemperature: stackTemperatureSweep(point, sizingBasis.conditions.sweepFromK, sizingBasis.conditions.sweepToK),
    steamToCarbon: steamToCarbonSweep(point),
  };
}

/**
 * The results of the basis: those of its sizing case (the basis itself, or the case marked
 * sizing with its overrides) at the top level, as a basis without cases has them, and every case
 * on the sizing case's hardware with the envelope over them.
 */
function calculateResults(basis: DesignBasis): Results {
  const sizingCase = basis.cases.find((k) => k.sizing);
  const sizingBasis = sizingCase?.basis ?? basis;
  const point = evaluateBasis(sizingBasis);
  // The least carbon-free S/C of a fuel at a temperature, found once for the sizing case and every case that shares it.
  const limits: CarbonLimits = new Map();
  // Every case's point first, on the cells installed, and the sizing case on them: the electrical layout must hold the bus over all their cell voltages (cases.ts layoutCases).
  const { staged, installed, plant } = locateCalculationErrors(sizingBasis, () => layoutCases(basis.cases, point, limits, plantOverRanges(point, sizingBasis.plant)));
  const carbon = carbonMargin(point, limits);
  const own = pointResults(point, sizingBasis, carbon, plant.findings);
  const findings = sizingCase ? caseFindings(own.findings, sizingCase) : own.findings;
  // The bus is that of the installed cells at the sizing case's load (cases.ts installedPoint), never the required cells' current on the installed strings.
  const plantResults = plantOf({ ...plant, electrical: locateCalculationErrors(sizingBasis, () => installedLayout(installed, sizingBasis.plant, plant.electrical)) });
  const cases = basis.cases.length ? caseResults(staged, point, { point: installed, carbon }, casePointResults(plant.electrical)) : [];
  const inputs = point.inputs;
  const tech = inputs.technology;
  return {
    format: 'cellbasis-results/1',
    tool: { name: 'cellbasis', version: toolVersion() },
    speciesData_sha256: speciesDataHash(),
    project: { id: basis.id, title: basis.document.title, number: basis.document.number },
    technology: { id: tech.id, name: tech.name, mode: inputs.mode, ion: tech.ion, waterPhase: tech.waterPhase, fuelGasEquilibrium: tech.fuelGasEquilibrium },
    conditions: own.conditions,
    headline: own.headline,
    electrochemistry: own.electrochemistry,
    operatingPoint: own.operatingPoint,
    streams: own.streams,
    efficiency: own.efficiency,
    heat: own.heat,
    carbon: own.carbon,
    supply: own.supply,
    degradation: own.degradation,
    fuelPath: fuelPathOf(point),
    sweeps: sweepsOf(point, sizingBasis),
    sensitivities: sensitivities(point, basis.sensitivity),
    plant: plantResults,
    hazards: assessHazards(hazardInput(sizingBasis, point, plant)),
    findings,
    cases,
    envelope: envelopeOf(cases),
  };
}
