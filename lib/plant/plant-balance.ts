/**
 * The plant around the stack (issue 18), built on the design point: the electrical layout, the
 * fuel processing, the air blower, the off-gas oxidiser, the heat recovery and the
 * heat-and-material balance of numbered streams, with a first-law balance over the plant.
 *
 * Enthalpies are absolute (heats of formation included, species data, ideal gas), so one sum
 * holds reactions and sensible heat alike: H = Σ ṅ_i h°_i(T). A duty is what a heater gives a
 * stream, Q = H_out − H_in (negative: the stream gives heat up).
 *
 *  - Steam raising (feed water ṅ_w from the liquid at T_w to vapour at the mixing temperature
 *    T_mix, the pre-reformer's inlet or else the fuel-electrode inlet), in three parts that sum
 *    to ṅ_w [h°_H2O(T_mix) − h°_H2O(L)(T_w)]:
 *      liquid heating  ṅ_w [h°_H2O(L)(T_s) − h°_H2O(L)(T_w)]
 *      evaporation     ṅ_w L(T_s),  L = h°_H2O − h°_H2O(L)           (lib/thermo/latent-heat.ts)
 *      superheating    ṅ_w [h°_H2O(T_mix) − h°_H2O(T_s)]
 *    T_s = T_sat(p_fuel) by IAPWS-IF97 region 4 (lib/thermo/water-saturation.ts).
 *  - Fuel preheat: dry fuel from its supply temperature to T_mix; a recycled off-gas cooled from
 *    the stack temperature to T_mix (it gives heat to the mix).
 *  - Pre-reformer: Q = H_out(T_out) − H_feed(T_in) (zero when adiabatic); reformed gas heated to
 *    the fuel-electrode inlet temperature.
 *  - Air blower: one adiabatic stage from its inlet pressure to the air-electrode pressure
 *    (lib/flowsheet/compression.ts: isentropic outlet on s°(T), work over the isentropic
 *    efficiency); air then heated to the air-electrode inlet temperature.
 *  - Stack: Q_stack = H_in(T_in) − H_out(T_stack) − P_DC (heat.ts, "as fed"). Cells cooled by
 *    their air (the high-temperature cells) reject it into the air-electrode exhaust, which
 *    leaves at the temperature where H_exh(T) = H_out,air(T_stack) + Q_stack; other cells
 *    reject it to their coolant (recovered as heat, or rejected, as the basis says).
 *  - Off-gas oxidiser: the off-gas (less any recycle) with the air-electrode exhaust or with
 *    fresh air of ratio λ to the O2 complete combustion needs, products at chemical equilibrium at
 *    the adiabatic temperature (lib/equilibrium/adiabatic.ts, Gibbs minimum at fixed H and p).
 *    Heat released: H_reactants(25 °C) − H_products(25 °C) of the outlet composition.
 *  - Heat recovery: the oxidiser's exhaust cooled to the exit temperature, with its water
 *    condensed to saturation there (lib/flowsheet/heat-recovery.ts); the plant's heaters take
 *    their net duty D first, the heat lost to ambient Q_loss = f_loss · LHV is subtracted, and
 *    Q_delivered = Q_recovered − D − Q_loss (+ the stack's coolant heat when recovered).
 *  - CHP: η_el = P_net/LHV, η_th = Q_delivered/LHV, η_CHP = η_el + η_th (on HHV likewise), the
 *    power-to-heat ratio P_net/Q_delivered (e.g. Larminie & Dicks, 2nd ed., §2.5 and ch. 9 for
 *    the definitions).
 *  - First law over the plant boundary (feeds in, exhaust, condensate, electricity and heat out):
 *      H_fuel + H_water + H_air + W_blower = P_DC + Q_delivered + Q_loss + Q_rejected + H_exhaust + H_condensate
 *    evaluated from the streams independently of how the duties were chained; its residual over
 *    the LHV input is reported and must be below 1e-9.
 *
 * Electrolysis (the stack's inlets and outlets as the design point gives them):
 *  - Water fed as vapour is raised from the feed water at T_w as above (liquid heating, L(T_s) at
 *    T_s = T_sat(p) of its electrode, superheating to the electrode's inlet temperature). Water fed
 *    as liquid circulates in a loop: the liquid leaving the stack returns to its inlet (cooled by
 *    the loop cooler), and the make-up ṅ_mu = ṅ_L,in − ṅ_L,out (the water split and the vapour the
 *    gases carry off) is heated from T_w to the inlet temperature. Other gases of an inlet (hydrogen
 *    fed with the steam, sweep air) are fed from outside at the fuel or air supply temperature and
 *    heated to the inlet temperature: no heat is recovered from the products to the feeds (a
 *    recuperator is not modelled), so the heat supplied is an upper bound.
 *  - Stack: Q_stack = H_in(fed) − H_out(T_stack) + P_DC (heat.ts, "as fed"); the heat lost to ambient
 *    Q_loss = f_loss · P_AC is taken from it: Q_net = Q_stack − Q_loss. Where Q_net < 0 a water loop's
 *    cooler first removes that much less (it returns the water at the inlet temperature), and the
 *    rest, −Q_net, is supplied to the stack (below thermoneutral); where Q_net > 0 the stack's cooling
 *    removes it.
 *  - Heat supplied Q_sup = Σ (positive duties) + stack supply: by electric heaters (counted in the
 *    electricity) or from outside the plant, as plant.heat-supply says.
 *  - Hydrogen compression (optional): the fuel-electrode product cooled to the compressor inlet
 *    temperature, its water condensed to saturation (lib/flowsheet/heat-recovery.ts) and the rest
 *    removed by a dryer (no energy counted), then compressed in N intercooled stages of equal ratio
 *    (N given, or the fewest that keep each stage's ratio at or below a stated maximum, stageCount)
 *    (lib/flowsheet/compression.ts: ideal gas, species data c_p(T), isentropic efficiency per stage;
 *    Çengel & Boles, Thermodynamics, ch. 7) and after-cooled to the intercooling temperature. The
 *    whole dry product is compressed, including any hydrogen fed with the steam.
 *  - Specific energy: e = (P_AC + P_heat,el + P_comp) / ṁ_H2 (kWh/kg), P_AC = P_DC (1/η_conv + f_BOP)
 *    (design-point.ts), ṁ_H2 the net hydrogen made; the system efficiency is the products' LHV (HHV)
 *    over the electricity and any heat from outside.
 *  - First law over the plant: H_water + H_gases + P_DC + Q_sup + W_comp = H_H2 + H_O2 + H_condensate
 *    + H_dryer + Q_coolers + Q_stack,removed + Q_loss, its residual over the electricity below 1e-9.
 */
import { getSpecies } from '../thermo/species-data.ts';
import { mixtureEnthalpyJ } from '../thermo/mixture.ts';
import { temperatureAtEnthalpyK } from '../thermo/mixture-temperature.ts';
import { waterLatentHeatJPerMol } from '../thermo/latent-heat.ts';
import { saturationRange, waterSaturationPressurePa, waterSaturationTemperatureK } from '../thermo/water-saturation.ts';
import { PA_PER_BAR } from '../thermo/constants.ts';
import { electronsOfStream } from '../electrochem/charge.ts';
import { adiabaticEquilibrium } from '../equilibrium/adiabatic.ts';
import { CalculationError, type CalculationInput } from '../core/errors.ts';
import type { CompressionInput, PlantInput } from '../basis/types.ts';
import { electricalLayout, type ElectricalLayout } from '../flowsheet/electrical-layout.ts';
import { compressGas } from '../flowsheet/compression.ts';
import { exhaustHeatRecovery } from '../flowsheet/heat-recovery.ts';
import { FlowsheetInputError } from '../flowsheet/input-error.ts';
import type { DesignPoint } from './design-point.ts';
import { scaled, totalFlow } from './streams.ts';
import { finding, type Finding } from './findings.ts';

const REFERENCE_K = 298.15;

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
  productCooling: { fromK: number; toK: number; pressureBar: number; dutyW: number; condensedMolPerS: number; driedMolPerS: number } | null;
  compression: {
    inletPressureBar: number;
    deliveryPressureBar: number;
    inletTemperatureK: number;
    intercoolTemperatureK: number;
    stages: number;
    stagesFrom: 'given' | 'maximum-stage-ratio';
    pressureRatioPerStage: number;
    isentropicEfficiency: number;
    flowMolPerS: number;
    stageOutletTemperaturesK: number[];
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
  electrical: ElectricalLayout;
  streams: PlantStream[];
  power: PowerPlantBalance | null;
  electrolysis: ElectrolysisPlantBalance | null;
  findings: Finding[];
}

/** The calculation inputs the layout's fields stand for (a bad layout is located at the basis field). */
function layoutError(error: unknown, windowGiven: boolean): never {
  if (!(error instanceof FlowsheetInputError)) throw error;
  const fields: Record<string, CalculationInput> = {
    cellsPerStack: 'cells-per-stack',
    stacksInSeries: windowGiven ? 'dc-bus-window' : 'stacks-in-series',
    busVoltageWindowV: 'dc-bus-window',
    stringsInParallel: 'strings-in-parallel',
    conversionEfficiency: 'power-conversion-efficiency',
  };
  const labels: Record<string, string> = {
    cellsPerStack: 'the number of cells per stack',
    stacksInSeries: 'the number of stacks in series',
    busVoltageWindowV: 'the DC bus window',
    stringsInParallel: 'the number of strings in parallel',
    conversionEfficiency: 'the power-conversion efficiency',
  };
  throw new CalculationError(`${labels[error.field] ?? error.field} ${error.problem}`, fields[error.field] ?? 'cells');
}

/**
 * Cells per stack (default all in one), stacks in series (given, from the bus window, else 1),
 * strings (given, else enough); the bus over `cellVoltageRangeV`, the cell voltages of every
 * operating case on this hardware (default the point's alone), so that a string sized by the bus
 * window holds it at the lowest cell voltage (end of life, full load) and the highest (turndown).
 */
function layoutOf(point: DesignPoint, plant: PlantInput, cellVoltageRangeV?: { minV: number; maxV: number }): ElectricalLayout {
  const e = plant.electrical;
  const cells = point.sizing.cells;
  try {
    return electricalLayout({
      mode: point.inputs.mode,
      requiredCells: cells,
      cellsPerStack: e.cellsPerStack ?? cells,
      cellVoltageV: point.voltage.cellVoltageV,
      cellCurrentA: point.cellCurrentA,
      ...(cellVoltageRangeV ? { cellVoltageRangeV } : {}),
      ...(e.busVoltageWindowV ? { busVoltageWindowV: e.busVoltageWindowV } : { stacksInSeries: e.stacksInSeries ?? 1 }),
      ...(e.stringsInParallel !== undefined ? { stringsInParallel: e.stringsInParallel } : {}),
      conversionEfficiency: point.inputs.conversionEfficiency,
    });
  } catch (error) {
    layoutError(error, e.busVoltageWindowV !== undefined);
  }
}

function without(flows: Readonly<Record<string, number>>, label: string): Record<string, number> {
  const out = { ...flows };
  delete out[label];
  return out;
}

function plus(...streams: Readonly<Record<string, number>>[]): Record<string, number> {
  const out: Record<string, number> = {};
  for (const s of streams) for (const [k, v] of Object.entries(s)) out[k] = (out[k] ?? 0) + v;
  return out;
}

/** The dry fuel and the steam added to it, from the fresh feed (dry fuel + steam) and the dry composition, mol/s. */
function dryAndSteam(fresh: Readonly<Record<string, number>>, dry: Readonly<Record<string, number>>): { fuel: Record<string, number>; steam: number } {
  const notWater = (x: Readonly<Record<string, number>>) => Object.entries(x).reduce((s, [k, v]) => s + (k === 'H2O' ? 0 : v), 0);
  const dryTotal = notWater(fresh) / notWater(dry);
  const steam = (fresh.H2O ?? 0) - dryTotal * (dry.H2O ?? 0);
  const fuel = without(fresh, 'H2O');
  if ((dry.H2O ?? 0) > 0) fuel.H2O = dryTotal * dry.H2O!;
  return { fuel, steam: Math.max(0, steam) };
}

/** O2 that complete combustion of a gas needs (C → CO2, H → H2O): a quarter of the electrons its oxidation gives up, Σ ṅ_i z_i / 4 (lib/electrochem/charge.ts), mol/s. */
function oxygenDemand(flows: Readonly<Record<string, number>>): number {
  return electronsOfStream(flows) / 4;
}

function fractions(flows: Readonly<Record<string, number>>): Record<string, number> {
  const total = totalFlow(flows);
  return Object.fromEntries(Object.entries(flows).filter(([, v]) => v / total > 1e-12).map(([k, v]) => [k, v / total]));
}

/** The first law over the plant from its terms: Σ in, Σ out and (in − out) / scale; the terms that are zero left out. */
function firstLaw(terms: PowerPlantBalance['energy']['terms'], scaleW: number): PowerPlantBalance['energy'] {
  const sum = (side: 'in' | 'out') => terms.filter((t) => t.side === side).reduce((a, t) => a + t.valueW, 0);
  const inW = sum('in');
  const outW = sum('out');
  return { inW, outW, residual: (inW - outW) / scaleW, terms: terms.filter((t) => t.valueW !== 0) };
}

/** Feed water ṅ_w raised from the liquid at T_w to vapour at T: heated to T_s = T_sat(p) (IAPWS-IF97 region 4), evaporated with L(T_s) of the species data, superheated to T (the module comment's three parts). */
function raiseSteam(waterMol: number, waterK: number, pressureBar: number, toK: number): SteamRaising {
  const H = mixtureEnthalpyJ;
  const tSat = waterSaturationTemperatureK(pressureBar * PA_PER_BAR);
  const latent = waterLatentHeatJPerMol(tSat);
  const liquid = { 'H2O(L)': waterMol };
  const vapour = { H2O: waterMol };
  return {
    waterMolPerS: waterMol,
    saturationTemperatureK: tSat,
    liquidHeatingW: H(liquid, tSat) - H(liquid, waterK),
    evaporationW: waterMol * latent,
    superheatingW: H(vapour, toK) - H(vapour, tSat),
    latentHeatJPerMol: latent,
  };
}

/** The balance of a power plant (the module comment's equations). */
function powerBalance(point: DesignPoint, plant: PlantInput, layout: ElectricalLayout, findings: Finding[]): { balance: PowerPlantBalance; streams: PlantStream[] } {
  const inputs = point.inputs;
  const unit = point.unit;
  const s = point.scale;
  const pFuel = inputs.fuelPressureBar;
  const pAir = inputs.airPressureBar;
  const tStack = inputs.temperatureK;
  const streams: PlantStream[] = [];
  const add = (id: string, name: string, temperatureK: number, pressureBar: number, flows: Record<string, number>) => {
    if (totalFlow(flows) > 0) streams.push({ number: streams.length + 1, id, name, temperatureK, pressureBar, flows });
  };
  const H = mixtureEnthalpyJ;
  const duties: PlantDuty[] = [];
  const duty = (id: string, name: string, dutyW: number, fromK: number, toK: number) => duties.push({ id, name, dutyW, fromK, toK });

  // Feeds: dry fuel, feed water, recycle, mixed at T_mix.
  const fresh = scaled(unit.fuelRaw ?? {}, s);
  const { fuel, steam: waterMol } = inputs.dryFuel ? dryAndSteam(fresh, inputs.dryFuel) : { fuel: fresh, steam: 0 };
  const recycle = unit.recycle ? scaled(unit.recycle, s) : null;
  const tMix = unit.preReformer ? unit.preReformer.inletTemperatureK : inputs.fuelInletTemperatureK;
  const tFuel = plant.fuelSupplyTemperatureK;
  const tWater = plant.feedWaterTemperatureK;
  add('fuel-supply', 'fuel supply (dry)', tFuel, pFuel, fuel);
  add('feed-water', 'feed water', tWater, pFuel, waterMol > 0 ? { 'H2O(L)': waterMol } : {});
  if (recycle) add('recycle', 'recycled fuel-electrode off-gas', tStack, pFuel, recycle);
  let steam: PowerPlantBalance['steam'] = null;
  if (waterMol > 0) {
    steam = raiseSteam(waterMol, tWater, pFuel, tMix);
    duty('feed-water-heating', 'feed water heated to saturation', steam.liquidHeatingW, tWater, steam.saturationTemperatureK);
    duty('evaporation', 'feed water evaporated', steam.evaporationW, steam.saturationTemperatureK, steam.saturationTemperatureK);
    duty('superheating', 'steam superheated to the mixing temperature', steam.superheatingW, steam.saturationTemperatureK, tMix);
  }
  duty('fuel-preheat', 'fuel heated to the mixing temperature', H(fuel, tMix) - H(fuel, tFuel), tFuel, tMix);
  if (recycle) duty('recycle-cooling', 'recycled off-gas cooled to the mixing temperature', H(recycle, tMix) - H(recycle, tStack), tStack, tMix);
  const stackFuelIn = scaled(unit.fuelStackInlet ?? {}, s);
  if (unit.preReformer) {
    const pre = unit.preReformer;
    const feed = scaled(pre.feed, s);
    add('pre-reformer-feed', 'pre-reformer feed', pre.inletTemperatureK, pFuel, feed);
    add('pre-reformer-outlet', 'pre-reformer outlet', pre.outletTemperatureK, pFuel, stackFuelIn);
    const q = inputs.preReforming.kind === 'adiabatic' ? 0 : H(stackFuelIn, pre.outletTemperatureK) - H(feed, pre.inletTemperatureK);
    duty('pre-reformer', inputs.preReforming.kind === 'adiabatic' ? 'pre-reformer (adiabatic)' : 'pre-reformer held at its temperature', q, pre.inletTemperatureK, pre.outletTemperatureK);
    duty('reformed-gas-heating', 'reformed gas heated to the fuel-electrode inlet', H(stackFuelIn, inputs.fuelInletTemperatureK) - H(stackFuelIn, pre.outletTemperatureK), pre.outletTemperatureK, inputs.fuelInletTemperatureK);
  }
  add('fuel-inlet', 'fuel-electrode inlet', inputs.fuelInletTemperatureK, pFuel, stackFuelIn);

  // Air: blower (stack air and any fresh oxidiser air), then heated to the air-electrode inlet.
  const stackAir = point.streams.find((x) => x.id === 'air-inlet')!.flows;
  const fuelOutlet = point.streams.find((x) => x.id === 'fuel-outlet')?.flows ?? {};
  const ratio = plant.anodeRecycle?.ratio ?? 0;
  const offGasFlows = scaled(fuelOutlet, 1 - ratio);
  const liquidOffGas = offGasFlows['H2O(L)'] ?? 0;
  const offGas = without(offGasFlows, 'H2O(L)');
  const ox = plant.offGasOxidiser;
  const airPerMolO2 = 1 / (inputs.airFeed!.O2 ?? 1);
  const freshAir =
    ox?.oxidant.kind === 'fresh-air' ? scaled(inputs.airFeed!, ox.oxidant.airRatio * oxygenDemand(offGas) * airPerMolO2) : null;
  const airTotal = freshAir ? plus(stackAir, freshAir) : stackAir;
  const tAir = plant.airSupplyTemperatureK;
  let tBlown = tAir;
  let blower: PowerPlantBalance['blower'] = null;
  if (plant.airBlower) {
    const b = compressGas({
      composition: airTotal,
      molarFlowMolPerS: totalFlow(airTotal),
      inletTemperatureK: tAir,
      inletPressureBar: plant.airBlower.inletPressureBar,
      deliveryPressureBar: pAir,
      stages: 1,
      isentropicEfficiency: plant.airBlower.isentropicEfficiency,
      intercoolTemperatureK: tAir,
    });
    tBlown = b.stages[0]!.outletTemperatureK;
    blower = {
      inletPressureBar: plant.airBlower.inletPressureBar,
      outletPressureBar: pAir,
      inletTemperatureK: tAir,
      outletTemperatureK: tBlown,
      flowMolPerS: totalFlow(airTotal),
      powerW: b.powerW,
      isentropicEfficiency: plant.airBlower.isentropicEfficiency,
      parasiticAllowanceW: inputs.parasiticFraction * point.stackPowerW,
    };
    if (b.powerW > blower.parasiticAllowanceW) {
      findings.push(
        finding(
          'blower-above-parasitic-load',
          'warning',
          'operating-point.parasitic-load',
          `the air blower alone takes ${(b.powerW / 1000).toPrecision(4)} kW, more than the whole parasitic load allowed (${(blower.parasiticAllowanceW / 1000).toPrecision(4)} kW)`,
          ['plant.air-blower.isentropic-efficiency'],
        ),
      );
    }
  }
  const supplyBar = plant.airBlower?.inletPressureBar ?? pAir;
  // Water vapour above saturation at the supply state cannot reach the plant as vapour (IF97 p_s(T),
  // from 0 °C up); it matters to the numbers where the heat recovery condenses it.
  const waterPa = ((airTotal.H2O ?? 0) / totalFlow(airTotal)) * supplyBar * PA_PER_BAR;
  const { lowK, highK } = saturationRange();
  if (plant.heatRecovery && waterPa > 0 && tAir >= lowK && tAir < highK && waterPa > waterSaturationPressurePa(tAir)) {
    findings.push(
      finding(
        'air-feed-above-saturation',
        'warning',
        'streams.air-electrode.composition',
        `the air-electrode feed holds more water vapour (${(waterPa / 1000).toPrecision(3)} kPa) than saturation allows at its supply temperature (${(waterSaturationPressurePa(tAir) / 1000).toPrecision(3)} kPa): it cannot be a feed from outside as stated (a gas recycled within the plant, such as a carbonate cathode's burnt anode gas, is not modelled as such), and its water condensing in the heat recovery overstates the heat delivered`,
        ['plant.feed-temperatures.air'],
      ),
    );
  }
  add('air-supply', 'air supply', tAir, supplyBar, airTotal);
  if (blower) add('blower-outlet', 'air after the blower', tBlown, pAir, airTotal);
  duty('air-preheat', 'air heated to the air-electrode inlet', H(stackAir, inputs.airInletTemperatureK) - H(stackAir, tBlown), tBlown, inputs.airInletTemperatureK);
  add('air-inlet', 'air-electrode inlet', inputs.airInletTemperatureK, pAir, stackAir);

  // Stack outlets (liquid water of a low-temperature cell taken off as its own stream); the air-cooled stack's heat leaves with its air.
  const airOutletAll = point.streams.find((x) => x.id === 'air-outlet')!.flows;
  const liquidAir = airOutletAll['H2O(L)'] ?? 0;
  const airOutlet = without(airOutletAll, 'H2O(L)');
  const stackHeatW = point.heat.asFedHeatW;
  const airCooled = inputs.technology.fuelGasEquilibrium;
  const airExhaustK = airCooled ? temperatureAtEnthalpyK(airOutlet, H(airOutlet, tStack) + stackHeatW, tStack) : tStack;
  const stackHeatTo: PowerPlantBalance['stackHeatTo'] = airCooled ? 'air-electrode exhaust' : (plant.heatRecovery?.stackHeat ?? 'rejected');
  add('fuel-outlet', recycle ? 'fuel-electrode off-gas to the oxidiser (after the recycle is taken)' : 'fuel-electrode off-gas', tStack, pFuel, offGasFlows);
  add('air-outlet', 'air-electrode exhaust', airExhaustK, pAir, airOutletAll);

  // Off-gas oxidiser.
  let oxidiser: PowerPlantBalance['oxidiser'] = null;
  let exhaust: { flows: Record<string, number>; temperatureK: number; pressureBar: number } | null = null;
  if (ox) {
    const oxidant = freshAir ? { amounts: freshAir, temperatureK: tBlown } : { amounts: airOutlet, temperatureK: airExhaustK };
    const pOx = Math.min(pFuel, pAir);
    const reactants = [{ amounts: offGas, temperatureK: tStack }, oxidant];
    const e = adiabaticEquilibrium({ reactants, pressureBar: pOx });
    const products = e.amounts;
    const fr = fractions(products);
    oxidiser = {
      oxidant: ox.oxidant.kind,
      airRatio: ox.oxidant.kind === 'fresh-air' ? ox.oxidant.airRatio : null,
      freshAirMolPerS: freshAir ? totalFlow(freshAir) : null,
      outletTemperatureK: e.temperatureK,
      materialLimitK: ox.materialLimitK,
      pressureBar: pOx,
      products,
      moleFractions: fr,
      carbonMonoxidePpm: (fr.CO ?? 0) * 1e6,
      heatReleasedW: H(offGas, REFERENCE_K) + H(oxidant.amounts, REFERENCE_K) - H(products, REFERENCE_K),
      energyBalanceError: e.energyBalanceError,
    };
    const o2Left = products.O2 ?? 0;
    if (!(o2Left > 0) || oxygenDemand(offGas) > (oxidant.amounts.O2 ?? 0)) {
      findings.push(finding('oxidiser-short-of-oxygen', 'critical', 'plant.off-gas-oxidiser.oxidant', 'the oxidant carries less oxygen than complete combustion of the off-gas needs: fuel leaves the oxidiser unburnt'));
    }
    if (e.temperatureK > ox.materialLimitK) {
      findings.push(
        finding(
          'oxidiser-above-material-limit',
          'critical',
          'plant.off-gas-oxidiser.material-limit',
          `the oxidiser's adiabatic outlet temperature ${(e.temperatureK - 273.15).toFixed(0)} °C exceeds its material limit ${(ox.materialLimitK - 273.15).toFixed(0)} °C`,
          ['operating-point.fuel-utilization', 'plant.off-gas-oxidiser.oxidant'],
        ),
      );
    }
    if (freshAir) add('oxidiser-air', 'oxidiser air', tBlown, pAir, freshAir);
    add('oxidiser-outlet', 'oxidiser outlet', e.temperatureK, pOx, products);
    exhaust = { flows: products, temperatureK: e.temperatureK, pressureBar: pOx };
    if (freshAir) {
      // The air-electrode exhaust joins the oxidiser's products ahead of the heat recovery (adiabatic mixing, no reaction).
      const mixed = plus(products, airOutlet);
      const t = temperatureAtEnthalpyK(mixed, H(products, e.temperatureK) + H(airOutlet, airExhaustK), e.temperatureK);
      exhaust = { flows: mixed, temperatureK: t, pressureBar: pOx };
      add('exhaust-mixed', 'oxidiser products with the air-electrode exhaust', t, pOx, mixed);
    }
  }

  // Heat recovery and what is delivered.
  const netDutyW = duties.reduce((a, d) => a + d.dutyW, 0);
  const lhv = point.power!.fuelLhvW;
  // Heat lost to ambient is counted against the recovered heat, so only where there is heat recovery.
  const heatLossW = plant.heatRecovery ? plant.heatLossFraction * lhv : 0;
  let heatRecovery: PowerPlantBalance['heatRecovery'] = null;
  const stackCoolantW = !airCooled && stackHeatTo === 'recovered' ? stackHeatW : 0;
  const rejectedW = !airCooled && stackHeatTo === 'rejected' ? stackHeatW : 0;
  let exitGas: Record<string, number>;
  let exitK: number;
  let condensate = 0;
  if (plant.heatRecovery && exhaust) {
    const hr = plant.heatRecovery;
    let r;
    try {
      r = exhaustHeatRecovery({ flowsMolPerS: exhaust.flows, inletTemperatureK: exhaust.temperatureK, exitTemperatureK: hr.exhaustExitTemperatureK, pressureBar: exhaust.pressureBar });
    } catch (error) {
      if (error instanceof FlowsheetInputError) throw new CalculationError(`the heat recovery: the exhaust exit temperature ${error.problem}`, 'exhaust-exit-temperature');
      throw error;
    }
    const delivered = r.heatWithCondensationW - netDutyW - heatLossW + stackCoolantW;
    heatRecovery = {
      inletTemperatureK: exhaust.temperatureK,
      exitTemperatureK: hr.exhaustExitTemperatureK,
      dewPointK: r.dewPointK,
      heatWithoutCondensationW: r.heatWithoutCondensationW,
      heatWithCondensationW: r.heatWithCondensationW,
      latentHeatW: r.latentHeatW,
      condensedWaterKgPerS: r.condensedWaterKgPerS,
      deliveredHeatW: delivered,
    };
    const hottest = Math.max(inputs.fuelInletTemperatureK, inputs.airInletTemperatureK, tMix);
    if (exhaust.temperatureK < hottest + hr.minimumApproachK) {
      findings.push(
        finding(
          'exhaust-too-cold-for-preheat',
          'warning',
          'plant.heat-recovery.minimum-approach',
          `the oxidiser's exhaust (${(exhaust.temperatureK - 273.15).toFixed(0)} °C) is not ${hr.minimumApproachK} K hotter than the hottest feed it must heat (${(hottest - 273.15).toFixed(0)} °C): the preheat needs another heat source`,
          ['conditions.fuel-inlet-temperature', 'conditions.air-inlet-temperature'],
        ),
      );
    }
    if (delivered < 0) {
      findings.push(
        finding(
          'exhaust-heat-short',
          'warning',
          'plant.heat-recovery.exhaust-exit-temperature',
          `the exhaust recovers ${(r.heatWithCondensationW / 1000).toPrecision(4)} kW, less than the plant's own heaters and losses take (${((netDutyW + heatLossW) / 1000).toPrecision(4)} kW): no heat is left to deliver`,
        ),
      );
    }
    exitGas = r.exitGasMolPerS;
    exitK = hr.exhaustExitTemperatureK;
    condensate = r.condensedWaterMolPerS;
    add('exhaust', 'exhaust to the stack (chimney)', exitK, exhaust.pressureBar, exitGas);
    if (condensate > 0) add('condensate', 'condensate', exitK, exhaust.pressureBar, { 'H2O(L)': condensate });
  } else if (exhaust) {
    exitGas = exhaust.flows;
    exitK = exhaust.temperatureK;
  } else {
    exitGas = plus(offGas, airOutlet);
    exitK = NaN;
  }
  if (liquidOffGas > 0) add('fuel-electrode-water', 'liquid water from the fuel electrode', tStack, pFuel, { 'H2O(L)': liquidOffGas });
  if (liquidAir > 0) add('air-electrode-water', 'liquid water from the air electrode', tStack, pAir, { 'H2O(L)': liquidAir });

  // CHP figures.
  const netPowerW = point.netPowerW;
  const deliveredHeatW = heatRecovery?.deliveredHeatW ?? 0;
  const hhv = point.power!.fuelHhvW;
  const chp = heatRecovery
    ? {
        netPowerW,
        deliveredHeatW,
        electricalLhv: netPowerW / lhv,
        thermalLhv: deliveredHeatW / lhv,
        totalLhv: (netPowerW + deliveredHeatW) / lhv,
        totalHhv: (netPowerW + deliveredHeatW) / hhv,
        powerToHeat: deliveredHeatW > 0 ? netPowerW / deliveredHeatW : null,
      }
    : null;

  // First law over the plant: feeds in, products out, from the streams themselves.
  const terms: PowerPlantBalance['energy']['terms'] = [
    { name: 'fuel', valueW: H(fuel, tFuel), side: 'in' },
    { name: 'feed water', valueW: waterMol > 0 ? H({ 'H2O(L)': waterMol }, tWater) : 0, side: 'in' },
    { name: 'air', valueW: H(airTotal, tAir), side: 'in' },
    { name: 'blower work', valueW: blower?.powerW ?? 0, side: 'in' },
    { name: 'stack DC power', valueW: point.stackPowerW, side: 'out' },
  ];
  if (heatRecovery) {
    terms.push({ name: 'heat delivered', valueW: heatRecovery.deliveredHeatW, side: 'out' });
    terms.push({ name: 'heat lost to ambient', valueW: heatLossW, side: 'out' });
    terms.push({ name: 'exhaust', valueW: H(exitGas, exitK), side: 'out' });
    terms.push({ name: 'condensate', valueW: condensate > 0 ? H({ 'H2O(L)': condensate }, exitK) : 0, side: 'out' });
  } else {
    // Without heat recovery the heaters are supplied from outside the balance: their net duty is an input.
    terms.push({ name: "heaters' net duty", valueW: netDutyW, side: 'in' });
    if (exhaust) terms.push({ name: 'oxidiser exhaust', valueW: H(exitGas, exitK), side: 'out' });
    else {
      terms.push({ name: 'fuel-electrode off-gas', valueW: H(offGas, tStack), side: 'out' });
      terms.push({ name: 'air-electrode exhaust', valueW: H(airOutlet, airExhaustK), side: 'out' });
    }
  }
  if (rejectedW !== 0) terms.push({ name: 'stack heat rejected', valueW: rejectedW, side: 'out' });
  if (liquidOffGas + liquidAir > 0) terms.push({ name: 'liquid water from the stack', valueW: H({ 'H2O(L)': liquidOffGas + liquidAir }, tStack), side: 'out' });
  const energy = firstLaw(terms, lhv);

  return {
    streams,
    balance: {
      steam,
      mixingTemperatureK: tMix,
      duties,
      netDutyW,
      blower,
      stackHeatW,
      stackHeatTo,
      airExhaustTemperatureK: airExhaustK,
      oxidiser,
      heatRecovery,
      heatLossW,
      chp,
      energy,
    },
  };
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

/** The balance of an electrolysis plant (the module comment's equations). */
function electrolysisBalance(point: DesignPoint, plant: PlantInput): { balance: ElectrolysisPlantBalance; streams: PlantStream[] } {
  const inputs = point.inputs;
  const tStack = inputs.temperatureK;
  const H = mixtureEnthalpyJ;
  const streams: PlantStream[] = [];
  const add = (id: string, name: string, temperatureK: number, pressureBar: number, flows: Record<string, number>) => {
    if (totalFlow(flows) > 0) streams.push({ number: streams.length + 1, id, name, temperatureK, pressureBar, flows });
  };
  const duties: PlantDuty[] = [];
  const duty = (id: string, name: string, dutyW: number, fromK: number, toK: number) => duties.push({ id, name, dutyW, fromK, toK });
  const tWater = plant.feedWaterTemperatureK;
  const inlets = (['fuel', 'air'] as const)
    .map((electrode) => ({ electrode, stream: point.streams.find((x) => x.id === `${electrode}-inlet`) }))
    .filter((x): x is { electrode: 'fuel' | 'air'; stream: NonNullable<typeof x.stream> } => x.stream !== undefined);
  const outlets = point.streams.filter((x) => x.id === 'fuel-outlet' || x.id === 'air-outlet');
  const liquidOut = outlets.reduce((a, x) => a + (x.flows['H2O(L)'] ?? 0), 0);
  const liquidIn = inlets.reduce((a, x) => a + (x.stream.flows['H2O(L)'] ?? 0), 0);
  const returned = Math.min(liquidIn, liquidOut);
  const makeUp = liquidIn - returned;
  const drain = liquidOut - returned;
  const steam: ElectrodeSteam[] = [];
  const gasFeeds: { electrode: 'fuel' | 'air'; flows: Record<string, number>; temperatureK: number }[] = [];
  const feedWaterMol = inlets.reduce((a, x) => a + (x.stream.flows.H2O ?? 0), 0) + makeUp;
  add('feed-water', 'feed water', tWater, Math.max(...inlets.map((x) => x.stream.pressureBar)), feedWaterMol > 0 ? { 'H2O(L)': feedWaterMol } : {});
  for (const { electrode, stream } of inlets) {
    const side = electrode === 'fuel' ? 'fuel-electrode' : 'air-electrode';
    const suffix = electrode === 'fuel' ? '' : '-air';
    const vapourMol = stream.flows.H2O ?? 0;
    const liquidMol = stream.flows['H2O(L)'] ?? 0;
    const gases = without(without(stream.flows, 'H2O'), 'H2O(L)');
    const tIn = stream.temperatureK;
    if (vapourMol > 0) {
      const s = { electrode, toK: tIn, ...raiseSteam(vapourMol, tWater, stream.pressureBar, tIn) };
      steam.push(s);
      duty(`feed-water-heating${suffix}`, `feed water heated to saturation (${side} steam)`, s.liquidHeatingW, tWater, s.saturationTemperatureK);
      duty(`evaporation${suffix}`, `feed water evaporated (${side} steam)`, s.evaporationW, s.saturationTemperatureK, s.saturationTemperatureK);
      duty(`superheating${suffix}`, `steam superheated to the ${side} inlet`, s.superheatingW, s.saturationTemperatureK, tIn);
    }
    if (liquidMol > 0) {
      const own = liquidMol === liquidIn ? makeUp : (makeUp * liquidMol) / liquidIn;
      const back = liquidMol - own;
      duty(`make-up-heating${suffix}`, `make-up water heated to the ${side} inlet`, H({ 'H2O(L)': own }, tIn) - H({ 'H2O(L)': own }, tWater), tWater, tIn);
      if (back > 0) duty(`loop-cooling${suffix}`, `water loop cooler (the returned water brought back to the ${side} inlet)`, H({ 'H2O(L)': back }, tIn) - H({ 'H2O(L)': back }, tStack), tStack, tIn);
    }
    if (totalFlow(gases) > 0) {
      const tSupply = electrode === 'fuel' ? plant.fuelSupplyTemperatureK : plant.airSupplyTemperatureK;
      gasFeeds.push({ electrode, flows: gases, temperatureK: tSupply });
      add(`${electrode}-gas-supply`, electrode === 'fuel' ? 'gas fed with the steam (fuel electrode)' : 'sweep gas supply', tSupply, stream.pressureBar, gases);
      duty(`${electrode}-gas-preheat`, `${electrode === 'fuel' ? 'gas fed with the steam' : 'sweep gas'} heated to the ${side} inlet`, H(gases, tIn) - H(gases, tSupply), tSupply, tIn);
    }
  }
  for (const { stream } of inlets) add(stream.id, stream.name, stream.temperatureK, stream.pressureBar, { ...stream.flows });
  const gasOf = (id: string) => without(point.streams.find((x) => x.id === id)?.flows ?? {}, 'H2O(L)');
  const pFuel = inputs.fuelPressureBar;
  const product = gasOf('fuel-outlet');
  const oxygen = gasOf('air-outlet');
  add('fuel-outlet', 'fuel-electrode outlet (hydrogen product)', tStack, pFuel, product);
  add('air-outlet', 'air-electrode outlet (oxygen product)', tStack, inputs.airPressureBar, oxygen);
  if (returned > 0) add('loop-return', 'water returned from the stack to its inlet', tStack, Math.max(...inlets.map((x) => x.stream.pressureBar)), { 'H2O(L)': returned });
  if (drain > 0) add('stack-drain', 'liquid water drained from the stack', tStack, pFuel, { 'H2O(L)': drain });

  // Stack heat: what the losses leave of it is removed by the stack's cooling, or, below zero, supplied.
  const acInW = point.netPowerW;
  const heatLossW = plant.heatLossFraction * acInW;
  const stackHeatW = point.heat.asFedHeatW;
  let stackNet = stackHeatW - heatLossW;
  // A water loop returns its water at the inlet temperature: where the stack would need heat to warm
  // it, the loop's cooler removes that much less (it takes out only what the stack put in).
  const loop = duties.find((d) => d.id.startsWith('loop-cooling'));
  if (loop && stackNet < 0) {
    const shift = Math.min(-stackNet, -loop.dutyW);
    loop.dutyW += shift;
    stackNet += shift;
  }
  const stackHeatSuppliedW = Math.max(0, -stackNet);
  const stackHeatRemovedW = Math.max(0, stackNet);

  // Product cooled, dried and compressed.
  let productCooling: ElectrolysisPlantBalance['productCooling'] = null;
  let compression: ElectrolysisPlantBalance['compression'] = null;
  let delivered = { flows: product, temperatureK: tStack, pressureBar: pFuel };
  let condensate = 0;
  let dried = 0;
  const c = plant.hydrogenCompression;
  if (c) {
    if (!(c.inletTemperatureK < tStack)) {
      throw new CalculationError(`the compressor inlet temperature (${(c.inletTemperatureK - 273.15).toFixed(1)} °C) must lie below the stack temperature (${(tStack - 273.15).toFixed(1)} °C): the product gas is cooled to it`, 'compressor-inlet-temperature');
    }
    const cooled = exhaustHeatRecovery({ flowsMolPerS: product, inletTemperatureK: tStack, exitTemperatureK: c.inletTemperatureK, pressureBar: pFuel });
    condensate = cooled.condensedWaterMolPerS;
    dried = cooled.exitGasMolPerS.H2O ?? 0;
    const dry = without(cooled.exitGasMolPerS, 'H2O');
    productCooling = { fromK: tStack, toK: c.inletTemperatureK, pressureBar: pFuel, dutyW: -cooled.heatWithCondensationW, condensedMolPerS: condensate, driedMolPerS: dried };
    duty('product-cooling', 'hydrogen product cooled (water condensed) ahead of the dryer', -cooled.heatWithCondensationW, tStack, c.inletTemperatureK);
    add('product-dried', 'hydrogen product cooled and dried', c.inletTemperatureK, pFuel, dry);
    if (condensate > 0) add('product-condensate', 'condensate from the product cooler', c.inletTemperatureK, pFuel, { 'H2O(L)': condensate });
    if (dried > 0) add('dryer-water', 'water vapour removed by the dryer', c.inletTemperatureK, pFuel, { H2O: dried });
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
    compression = {
      inletPressureBar: pFuel,
      deliveryPressureBar: c.deliveryPressureBar,
      inletTemperatureK: c.inletTemperatureK,
      intercoolTemperatureK: c.intercoolTemperatureK,
      stages,
      stagesFrom: 'given' in c.stages ? 'given' : 'maximum-stage-ratio',
      pressureRatioPerStage: k.pressureRatioPerStage,
      isentropicEfficiency: c.isentropicEfficiency,
      flowMolPerS: totalFlow(dry),
      stageOutletTemperaturesK: k.stages.map((x) => x.outletTemperatureK),
      powerW: k.powerW,
      workJPerKg: k.workJPerKg,
      intercoolersW: k.intercoolerDutyW,
      aftercoolerW: k.aftercoolerDutyW,
    };
    if (k.intercoolerDutyW > 0) duty('intercoolers', 'compressor intercoolers', -k.intercoolerDutyW, Math.max(...k.stages.slice(0, -1).map((x) => x.outletTemperatureK)), c.intercoolTemperatureK);
    if (k.aftercoolerDutyW > 0) duty('aftercooler', 'compressor after-cooler', -k.aftercoolerDutyW, k.stages.at(-1)!.outletTemperatureK, c.intercoolTemperatureK);
    delivered = { flows: dry, temperatureK: k.deliveryTemperatureK, pressureBar: c.deliveryPressureBar };
    add('hydrogen-delivered', 'hydrogen delivered', delivered.temperatureK, delivered.pressureBar, dry);
  }

  const feedHeatW = duties.reduce((a, d) => a + Math.max(0, d.dutyW), 0);
  const coolersW = duties.reduce((a, d) => a + Math.max(0, -d.dutyW), 0);
  const heatSuppliedW = feedHeatW + stackHeatSuppliedW;
  const electricHeatW = plant.heatSupply === 'electric' ? heatSuppliedW : 0;
  const externalHeatW = plant.heatSupply === 'external' ? heatSuppliedW : 0;
  const compressorW = compression?.powerW ?? 0;
  const e = point.electrolysis!;
  const hydrogenKgPerS = e.hydrogenMolPerS * getSpecies('H2').molarMassKgPerMol;
  const parasiticW = inputs.parasiticFraction * point.stackPowerW;
  const totalElectricW = acInW + electricHeatW + compressorW;
  const perKg = (w: number) => w / hydrogenKgPerS / 3.6e6;
  const specificEnergy = {
    hydrogenKgPerS,
    stackDcW: point.stackPowerW,
    conversionLossW: acInW - point.stackPowerW - parasiticW,
    parasiticW,
    electricHeatW,
    compressorW,
    totalElectricW,
    stackKWhPerKg: perKg(point.stackPowerW),
    systemKWhPerKg: perKg(totalElectricW),
    systemEfficiencyLhv: e.productLhvW / (totalElectricW + externalHeatW),
    systemEfficiencyHhv: e.productHhvW / (totalElectricW + externalHeatW),
  };

  // First law over the plant: feeds, electricity and heat in; products, condensate and heat out.
  const terms: PowerPlantBalance['energy']['terms'] = [
    { name: 'feed water', valueW: feedWaterMol > 0 ? H({ 'H2O(L)': feedWaterMol }, tWater) : 0, side: 'in' },
    ...gasFeeds.map((g) => ({ name: g.electrode === 'fuel' ? 'gas fed with the steam' : 'sweep gas', valueW: H(g.flows, g.temperatureK), side: 'in' as const })),
    { name: 'stack DC power', valueW: point.stackPowerW, side: 'in' },
    { name: plant.heatSupply === 'electric' ? 'heat supplied electrically' : 'heat supplied from outside', valueW: heatSuppliedW, side: 'in' },
    { name: 'compressor work', valueW: compressorW, side: 'in' },
    { name: compression ? 'hydrogen delivered' : 'hydrogen product', valueW: H(delivered.flows, delivered.temperatureK), side: 'out' },
    { name: 'oxygen product', valueW: H(oxygen, tStack), side: 'out' },
    { name: 'condensate', valueW: condensate > 0 ? H({ 'H2O(L)': condensate }, c!.inletTemperatureK) : 0, side: 'out' },
    { name: 'water removed by the dryer', valueW: dried > 0 ? H({ H2O: dried }, c!.inletTemperatureK) : 0, side: 'out' },
    { name: 'liquid water drained', valueW: drain > 0 ? H({ 'H2O(L)': drain }, tStack) : 0, side: 'out' },
    { name: 'heat removed by the coolers', valueW: coolersW, side: 'out' },
    { name: "heat removed by the stack's cooling", valueW: stackHeatRemovedW, side: 'out' },
    { name: 'heat lost to ambient', valueW: heatLossW, side: 'out' },
  ];
  const energy = firstLaw(terms, totalElectricW);

  return {
    streams,
    balance: {
      feedWaterMolPerS: feedWaterMol,
      steam,
      waterLoop: liquidIn > 0 ? { makeUpMolPerS: makeUp, returnMolPerS: returned, drainMolPerS: drain } : null,
      duties,
      feedHeatW,
      coolersW,
      stackHeatW,
      heatLossW,
      stackHeatSuppliedW,
      stackHeatRemovedW,
      heatSupply: plant.heatSupply,
      heatSuppliedW,
      productCooling,
      compression,
      specificEnergy,
      energy,
    },
  };
}

/** The plant around the stack of a design point: the electrical layout, and the power plant's or the electrolysis plant's balance. */
export function plantBalance(point: DesignPoint, plant: PlantInput, cellVoltageRangeV?: { minV: number; maxV: number }): PlantBalance {
  const findings: Finding[] = [];
  const electrical = layoutOf(point, plant, cellVoltageRangeV);
  if (point.inputs.mode === 'power' && point.inputs.fuelFeed && point.inputs.airFeed) {
    const { balance, streams } = powerBalance(point, plant, electrical, findings);
    return { electrical, streams, power: balance, electrolysis: null, findings };
  }
  if (point.inputs.mode === 'electrolysis' && point.electrolysis) {
    const { balance, streams } = electrolysisBalance(point, plant);
    return { electrical, streams, power: null, electrolysis: balance, findings };
  }
  const streams = point.streams.map((x, k) => ({ number: k + 1, id: x.id, name: x.name, temperatureK: x.temperatureK, pressureBar: x.pressureBar, flows: { ...x.flows } }));
  return { electrical, streams, power: null, electrolysis: null, findings };
}
