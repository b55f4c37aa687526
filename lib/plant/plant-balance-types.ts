/**
 * The shapes of the plant around the stack (plant-balance.ts): the numbered streams, the duties,
 * and the power plant's or the electrolysis plant's balance, in SI (W, K, bar, mol/s).
 */
import type { ElectricalLayout } from '../flowsheet/electrical-layout.ts';
import type { Finding } from './findings.ts';
import type { Recuperation } from './recuperator.ts';

/** Where a hydrogen compression's stage count comes from: the basis, or the rule that sets it. */
export type StagesFrom = 'given' | 'maximum-stage-ratio' | 'maximum-discharge-temperature';

/** A numbered stream of the heat-and-material balance. */
export interface PlantStream {
  number: number;
  id: string;
  name: string;
  temperatureK: number;
  pressureBar: number;
  flows: Record<string, number>;
}

/** A heater's or reactor's duty: heat given to the stream (negative: heat it gives up), W. */
export interface PlantDuty {
  id: string;
  name: string;
  dutyW: number;
  fromK: number;
  toK: number;
}

/** Feed water raised to steam: its flow, saturation temperature and the three parts of the duty. */
export interface SteamRaising {
  waterMolPerS: number;
  saturationTemperatureK: number;
  liquidHeatingW: number;
  evaporationW: number;
  superheatingW: number;
  latentHeatJPerMol: number;
}

export interface PowerPlantBalance {
  steam: SteamRaising | null;
  mixingTemperatureK: number;
  duties: PlantDuty[];
  /** Σ of the duties: the heat the plant's heaters need net, W. */
  netDutyW: number;
  blower: { inletPressureBar: number; outletPressureBar: number; inletTemperatureK: number; outletTemperatureK: number; flowMolPerS: number; powerW: number; isentropicEfficiency: number; parasiticAllowanceW: number } | null;
  /** Q_stack with the inlets as fed, W; where it goes. */
  stackHeatW: number;
  stackHeatTo: 'air-electrode exhaust' | 'recovered' | 'rejected';
  airExhaustTemperatureK: number;
  oxidiser: {
    oxidant: 'air-electrode-exhaust' | 'fresh-air';
    airRatio: number | null;
    freshAirMolPerS: number | null;
    outletTemperatureK: number;
    materialLimitK: number;
    pressureBar: number;
    products: Record<string, number>;
    moleFractions: Record<string, number>;
    carbonMonoxidePpm: number;
    heatReleasedW: number;
    energyBalanceError: number;
  } | null;
  /** A carbonate cell's cathode-gas loop (power-cathode-loop.ts); null without one. */
  cathodeLoop: {
    burnerAirMolPerS: number;
    burnerAirKgPerS: number;
    recycledShare: number;
    inletOxygenFraction: number;
    airUtilization: number;
    carbonDioxideUtilization: number;
    oxygenDemandMolPerS: number;
    burntProductsMolPerS: number;
    takenMolPerS: number;
    oxygenTakenMolPerS: number;
    burnerOutletTemperatureK: number;
    recycleTemperatureK: number;
    mixingTemperatureK: number;
    inletTemperatureK: number;
    heatingW: number;
    inletFlows: Record<string, number>;
  } | null;
  heatRecovery: {
    inletTemperatureK: number;
    exitTemperatureK: number;
    dewPointK: number | null;
    heatWithoutCondensationW: number;
    heatWithCondensationW: number;
    latentHeatW: number;
    condensedWaterKgPerS: number;
    deliveredHeatW: number;
  } | null;
  heatLossW: number;
  chp: { netPowerW: number; deliveredHeatW: number; electricalLhv: number; thermalLhv: number; totalLhv: number; totalHhv: number; powerToHeat: number | null } | null;
  energy: { inW: number; outW: number; residual: number; terms: { name: string; valueW: number; side: 'in' | 'out' }[] };
}

/** Feed water raised to steam for one electrode of an electrolyser. */
export interface ElectrodeSteam extends SteamRaising {
  electrode: 'fuel' | 'air';
  /** The electrode's inlet temperature the steam is superheated to, K. */
  toK: number;
}

export interface ElectrolysisPlantBalance {
  /** Liquid feed water taken into the plant at its supply temperature (the steam raised and the loop's make-up), mol/s. */
  feedWaterMolPerS: number;
  steam: ElectrodeSteam[];
  /** A liquid-fed cell's water loop: the make-up and the water returned from the stack's outlets to its inlet, mol/s. */
  waterLoop: { makeUpMolPerS: number; returnMolPerS: number; drainMolPerS: number } | null;
  duties: PlantDuty[];
  /** Σ of the positive duties: the heat the feed heaters and the evaporator take, W. */
  feedHeatW: number;
  /** Σ of the negative duties, as a positive number: the heat the coolers remove, W. */
  coolersW: number;
  /** Q_stack with the inlets as fed, W (negative: heat the stack absorbs). */
  stackHeatW: number;
  heatLossW: number;
  /** Heat supplied to the stack (its heat demand and the losses it cannot cover), W, and the stack heat removed by its cooling, W. */
  stackHeatSuppliedW: number;
  stackHeatRemovedW: number;
  heatSupply: 'electric' | 'external';
  /** feedHeatW + stackHeatSuppliedW: the heat supplied by electric heaters or from outside, W. */
  heatSuppliedW: number;
  /** The feed recuperator (recuperator.ts), where the basis has one. */
  recuperator: Recuperation | null;
  productCooling: { fromK: number; toK: number; pressureBar: number; dutyW: number; condensedMolPerS: number; driedMolPerS: number } | null;
  compression: {
    inletPressureBar: number;
    deliveryPressureBar: number;
    inletTemperatureK: number;
    intercoolTemperatureK: number;
    stages: number;
    stagesFrom: StagesFrom;
    pressureRatioPerStage: number;
    isentropicEfficiency: number;
    flowMolPerS: number;
    stageOutletTemperaturesK: number[];
    /** The discharge temperature the stages are held at or checked against, K, and whose it is (the basis's, or the reference's citation). */
    dischargeLimitK: number;
    dischargeLimitSource: string;
    powerW: number;
    workJPerKg: number;
    intercoolersW: number;
    aftercoolerW: number;
  } | null;
  /** Net hydrogen made, kg/s, and the electricity per kg of it, with what it is made of, W. */
  specificEnergy: {
    hydrogenKgPerS: number;
    stackDcW: number;
    conversionLossW: number;
    parasiticW: number;
    electricHeatW: number;
    compressorW: number;
    totalElectricW: number;
    stackKWhPerKg: number;
    systemKWhPerKg: number;
    /** Heating value of the combustibles made over the electricity and any heat from outside. */
    systemEfficiencyLhv: number;
    systemEfficiencyHhv: number;
  };
  energy: PowerPlantBalance['energy'];
}

export interface PlantBalance {
  /** The layout with the current density of the point whose cell current it carries, A/m². */
  electrical: ElectricalLayout & { currentDensityAPerM2: number };
  streams: PlantStream[];
  power: PowerPlantBalance | null;
  electrolysis: ElectrolysisPlantBalance | null;
  findings: Finding[];
}

