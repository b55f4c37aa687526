/**
 * The plant section of the results (lib/plant/results-schema.ts) from the plant balance
 * (plant-balance.ts): the same numbers, renamed with their units in the keys (_W, _K, _bar,
 * _mol_per_s; kg/h where the document reads them so), and the streams as the stream table shows them.
 */
import { getSpecies } from '../thermo/species-data.ts';
import { enthalpyFlowW, gasFlow, gasMoleFractions, massFlowKgPerS, normalVolumeM3PerS, totalFlow, type Stream } from './streams.ts';
import type { Results, StreamResult } from './results-schema.ts';
import type { ElectrolysisPlantBalance, PlantBalance, PowerPlantBalance } from './plant-balance-types.ts';

const HOUR = 3600;

type PlantResults = Results['plant'];

/** A plant's first law, for the results. */
function energyOf(energy: PowerPlantBalance['energy']): NonNullable<PlantResults['power']>['energyBalance'] {
  return { in_W: energy.inW, out_W: energy.outW, residual: energy.residual, terms: energy.terms.map((t) => ({ name: t.name, value_W: t.valueW, side: t.side })) };
}

export function streamResult(s: Stream): StreamResult {
  return {
    id: s.id,
    name: s.name,
    temperature_K: s.temperatureK,
    pressure_bar: s.pressureBar,
    flow_mol_per_s: totalFlow(s.flows),
    gasFlow_mol_per_s: gasFlow(s.flows),
    massFlow_kg_per_h: massFlowKgPerS(s.flows) * HOUR,
    normalVolume_Nm3_per_h: normalVolumeM3PerS(s.flows) * HOUR,
    enthalpyFlow_W: enthalpyFlowW(s.flows, s.temperatureK),
    moleFractions: gasMoleFractions(s.flows),
    speciesFlows_mol_per_s: { ...s.flows },
  };
}

/** The electrical layout, for the results. */
function electricalResult(e: PlantBalance['electrical']): PlantResults['electrical'] {
  return {
    cellsPerStack: e.cellsPerStack,
    stacksInSeries: e.stacksInSeries,
    stringsInParallel: e.stringsInParallel,
    stackCount: e.stackCount,
    requiredCells: e.requiredCells,
    installedCells: e.installedCells,
    stacksInSeriesFrom: e.stacksInSeriesFrom,
    stringsInParallelFrom: e.stringsInParallelFrom,
    currentDensity_A_per_m2: e.currentDensityAPerM2,
    cellVoltage_V: e.cellVoltageV,
    cellCurrent_A: e.cellCurrentA,
    stackVoltage_V: e.stackVoltageV,
    stackCurrent_A: e.stackCurrentA,
    stackPower_W: e.stackPowerW,
    stringVoltage_V: e.stringVoltageV,
    stringCurrent_A: e.stringCurrentA,
    busVoltage_V: e.busVoltageV,
    busCurrent_A: e.busCurrentA,
    dcPower_W: e.dcPowerW,
    conversionEfficiency: e.conversionEfficiency,
    acPower_W: e.acPowerW,
    conversionLoss_W: e.conversionLossW,
  };
}

/** The duties of a plant, for the results. */
function dutiesResult(duties: PowerPlantBalance['duties']): NonNullable<PlantResults['power']>['duties'] {
  return duties.map((d) => ({ id: d.id, name: d.name, duty_W: d.dutyW, from_K: d.fromK, to_K: d.toK }));
}

/** The off-gas oxidiser, for the results. */
function oxidiserResult(o: NonNullable<PowerPlantBalance['oxidiser']>): NonNullable<NonNullable<PlantResults['power']>['oxidiser']> {
  return {
    oxidant: o.oxidant,
    airRatio: o.airRatio,
    freshAir_mol_per_s: o.freshAirMolPerS,
    outletTemperature_K: o.outletTemperatureK,
    materialLimit_K: o.materialLimitK,
    pressure_bar: o.pressureBar,
    moleFractions: o.moleFractions,
    carbonMonoxide_ppm: o.carbonMonoxidePpm,
    heatReleased_W: o.heatReleasedW,
    energyBalanceError: o.energyBalanceError,
  };
}

/** The cathode-gas loop, for the results. */
function cathodeLoopResult(l: NonNullable<PowerPlantBalance['cathodeLoop']>): NonNullable<NonNullable<PlantResults['power']>['cathodeLoop']> {
  const total = Object.values(l.inletFlows).reduce((a, b) => a + b, 0);
  return {
    burnerAir_mol_per_s: l.burnerAirMolPerS,
    burnerAir_kg_per_h: l.burnerAirKgPerS * HOUR,
    recycledShare: l.recycledShare,
    inletOxygenFraction: l.inletOxygenFraction,
    airUtilization: l.airUtilization,
    carbonDioxideUtilization: l.carbonDioxideUtilization,
    oxygenDemand_mol_per_s: l.oxygenDemandMolPerS,
    burntProducts_mol_per_s: l.burntProductsMolPerS,
    taken_mol_per_s: l.takenMolPerS,
    oxygenTaken_mol_per_s: l.oxygenTakenMolPerS,
    burnerOutletTemperature_K: l.burnerOutletTemperatureK,
    recycleTemperature_K: l.recycleTemperatureK,
    mixingTemperature_K: l.mixingTemperatureK,
    inletTemperature_K: l.inletTemperatureK,
    heating_W: l.heatingW,
    inletMoleFractions: Object.fromEntries(Object.entries(l.inletFlows).map(([k, v]) => [k, v / total])),
  };
}

/** The power plant's balance, for the results. */
function powerResult(q: PowerPlantBalance): NonNullable<PlantResults['power']> {
  return {
    mixingTemperature_K: q.mixingTemperatureK,
    steam: q.steam && {
      water_mol_per_s: q.steam.waterMolPerS,
      water_kg_per_h: q.steam.waterMolPerS * getSpecies('H2O(L)').molarMassKgPerMol * HOUR,
      saturationTemperature_K: q.steam.saturationTemperatureK,
      latentHeat_J_per_mol: q.steam.latentHeatJPerMol,
      liquidHeating_W: q.steam.liquidHeatingW,
      evaporation_W: q.steam.evaporationW,
      superheating_W: q.steam.superheatingW,
      duty_W: q.steam.liquidHeatingW + q.steam.evaporationW + q.steam.superheatingW,
    },
    duties: dutiesResult(q.duties),
    netDuty_W: q.netDutyW,
    blower: q.blower && {
      inletPressure_bar: q.blower.inletPressureBar,
      outletPressure_bar: q.blower.outletPressureBar,
      inletTemperature_K: q.blower.inletTemperatureK,
      outletTemperature_K: q.blower.outletTemperatureK,
      flow_mol_per_s: q.blower.flowMolPerS,
      isentropicEfficiency: q.blower.isentropicEfficiency,
      power_W: q.blower.powerW,
      parasiticAllowance_W: q.blower.parasiticAllowanceW,
    },
    stackHeat_W: q.stackHeatW,
    stackHeatTo: q.stackHeatTo,
    airExhaustTemperature_K: q.airExhaustTemperatureK,
    oxidiser: q.oxidiser && oxidiserResult(q.oxidiser),
    cathodeLoop: q.cathodeLoop && cathodeLoopResult(q.cathodeLoop),
    heatRecovery: q.heatRecovery && {
      inletTemperature_K: q.heatRecovery.inletTemperatureK,
      exitTemperature_K: q.heatRecovery.exitTemperatureK,
      dewPoint_K: q.heatRecovery.dewPointK,
      heatWithoutCondensation_W: q.heatRecovery.heatWithoutCondensationW,
      heatWithCondensation_W: q.heatRecovery.heatWithCondensationW,
      latentHeat_W: q.heatRecovery.latentHeatW,
      condensate_kg_per_h: q.heatRecovery.condensedWaterKgPerS * HOUR,
      deliveredHeat_W: q.heatRecovery.deliveredHeatW,
    },
    heatLoss_W: q.heatLossW,
    chp: q.chp && {
      netPower_W: q.chp.netPowerW,
      deliveredHeat_W: q.chp.deliveredHeatW,
      electricalEfficiencyLhv: q.chp.electricalLhv,
      thermalEfficiencyLhv: q.chp.thermalLhv,
      totalEfficiencyLhv: q.chp.totalLhv,
      totalEfficiencyHhv: q.chp.totalHhv,
      powerToHeat: q.chp.powerToHeat,
    },
    energyBalance: energyOf(q.energy),
  };
}

/** The feed recuperator, for the results. */
function recuperatorResult(r: NonNullable<ElectrolysisPlantBalance['recuperator']>): NonNullable<NonNullable<PlantResults['electrolysis']>['recuperator']> {
  return {
    minimumApproach_K: r.minimumApproachK,
    duty_W: r.dutyW,
    hotInlet_K: r.hotInletK,
    hotOutlet_K: r.hotOutletK,
    coldOutlet_K: r.coldOutletK,
    smallestApproach_K: r.smallestApproachK,
    limitedBy: r.limitedBy,
    hotDewPoint_K: r.hotDewPointK,
    feeds: r.feeds.map((f) => ({ id: f.id, name: f.name, from_K: f.fromK, to_K: f.toK, vapourFraction: f.vapourFraction, target_K: f.targetK, duty_W: f.dutyW })),
  };
}

/** The electrolysis plant's balance, for the results. */
/** The hydrogen compression, for the results. */
function compressionResult(c: NonNullable<ElectrolysisPlantBalance['compression']>): NonNullable<NonNullable<PlantResults['electrolysis']>['compression']> {
  return {
    inletPressure_bar: c.inletPressureBar,
    deliveryPressure_bar: c.deliveryPressureBar,
    inletTemperature_K: c.inletTemperatureK,
    intercoolTemperature_K: c.intercoolTemperatureK,
    stages: c.stages,
    stagesFrom: c.stagesFrom,
    pressureRatioPerStage: c.pressureRatioPerStage,
    isentropicEfficiency: c.isentropicEfficiency,
    flow_mol_per_s: c.flowMolPerS,
    stageOutletTemperatures_K: c.stageOutletTemperaturesK,
    dischargeLimit_K: c.dischargeLimitK,
    dischargeLimitSource: c.dischargeLimitSource,
    power_W: c.powerW,
    work_J_per_kg: c.workJPerKg,
    intercoolers_W: c.intercoolersW,
    aftercooler_W: c.aftercoolerW,
  };
}

/** The electricity per kilogram of hydrogen, for the results. */
function specificEnergyResult(e: ElectrolysisPlantBalance['specificEnergy']): NonNullable<PlantResults['electrolysis']>['specificEnergy'] {
  return {
    hydrogen_kg_per_h: e.hydrogenKgPerS * HOUR,
    stackDc_W: e.stackDcW,
    conversionLoss_W: e.conversionLossW,
    parasitic_W: e.parasiticW,
    electricHeat_W: e.electricHeatW,
    compressor_W: e.compressorW,
    totalElectric_W: e.totalElectricW,
    stack_kWh_per_kg: e.stackKWhPerKg,
    system_kWh_per_kg: e.systemKWhPerKg,
    systemEfficiencyLhv: e.systemEfficiencyLhv,
    systemEfficiencyHhv: e.systemEfficiencyHhv,
  };
}

function electrolysisResult(x: ElectrolysisPlantBalance): NonNullable<PlantResults['electrolysis']> {
  return {
    feedWater_mol_per_s: x.feedWaterMolPerS,
    feedWater_kg_per_h: x.feedWaterMolPerS * getSpecies('H2O(L)').molarMassKgPerMol * HOUR,
    steam: x.steam.map((s) => ({
      electrode: s.electrode,
      water_mol_per_s: s.waterMolPerS,
      saturationTemperature_K: s.saturationTemperatureK,
      latentHeat_J_per_mol: s.latentHeatJPerMol,
      liquidHeating_W: s.liquidHeatingW,
      evaporation_W: s.evaporationW,
      superheating_W: s.superheatingW,
      to_K: s.toK,
    })),
    waterLoop: x.waterLoop && { makeUp_mol_per_s: x.waterLoop.makeUpMolPerS, return_mol_per_s: x.waterLoop.returnMolPerS, drain_mol_per_s: x.waterLoop.drainMolPerS },
    duties: dutiesResult(x.duties),
    feedHeat_W: x.feedHeatW,
    coolers_W: x.coolersW,
    stackHeat_W: x.stackHeatW,
    heatLoss_W: x.heatLossW,
    stackHeatSupplied_W: x.stackHeatSuppliedW,
    stackHeatRemoved_W: x.stackHeatRemovedW,
    heatSupply: x.heatSupply,
    heatSupplied_W: x.heatSuppliedW,
    recuperator: x.recuperator && recuperatorResult(x.recuperator),
    productCooling: x.productCooling && {
      from_K: x.productCooling.fromK,
      to_K: x.productCooling.toK,
      pressure_bar: x.productCooling.pressureBar,
      duty_W: x.productCooling.dutyW,
      condensed_mol_per_s: x.productCooling.condensedMolPerS,
      dried_mol_per_s: x.productCooling.driedMolPerS,
    },
    compression: x.compression && compressionResult(x.compression),
    specificEnergy: specificEnergyResult(x.specificEnergy),
    energyBalance: energyOf(x.energy),
  };
}

/** The plant section of the results: the layout, the numbered streams and the power or electrolysis plant's balance. */
export function plantOf(b: PlantBalance): PlantResults {
  return {
    electrical: electricalResult(b.electrical),
    streams: b.streams.map((s) => ({ number: s.number, ...streamResult(s) })),
    power: b.power && powerResult(b.power),
    electrolysis: b.electrolysis && electrolysisResult(b.electrolysis),
  };
}
