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
import type { PlantInput } from '../basis/types.ts';
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

export interface PowerPlantBalance {
  steam: { waterMolPerS: number; saturationTemperatureK: number; liquidHeatingW: number; evaporationW: number; superheatingW: number; latentHeatJPerMol: number } | null;
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

export interface PlantBalance {
  electrical: ElectricalLayout;
  streams: PlantStream[];
  power: PowerPlantBalance | null;
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

/** Cells per stack (default all in one), stacks in series (given, from the bus window, else 1), strings (given, else enough). */
function layoutOf(point: DesignPoint, plant: PlantInput): ElectricalLayout {
  const e = plant.electrical;
  const cells = point.sizing.cells;
  try {
    return electricalLayout({
      mode: point.inputs.mode,
      requiredCells: cells,
      cellsPerStack: e.cellsPerStack ?? cells,
      cellVoltageV: point.voltage.cellVoltageV,
      cellCurrentA: point.cellCurrentA,
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
    const tSat = waterSaturationTemperatureK(pFuel * PA_PER_BAR);
    const latent = waterLatentHeatJPerMol(tSat);
    const liquid = { 'H2O(L)': waterMol };
    const vapour = { H2O: waterMol };
    steam = {
      waterMolPerS: waterMol,
      saturationTemperatureK: tSat,
      liquidHeatingW: H(liquid, tSat) - H(liquid, tWater),
      evaporationW: waterMol * latent,
      superheatingW: H(vapour, tMix) - H(vapour, tSat),
      latentHeatJPerMol: latent,
    };
    duty('feed-water-heating', 'feed water heated to saturation', steam.liquidHeatingW, tWater, tSat);
    duty('evaporation', 'feed water evaporated', steam.evaporationW, tSat, tSat);
    duty('superheating', 'steam superheated to the mixing temperature', steam.superheatingW, tSat, tMix);
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
  const inW = terms.filter((t) => t.side === 'in').reduce((a, t) => a + t.valueW, 0);
  const outW = terms.filter((t) => t.side === 'out').reduce((a, t) => a + t.valueW, 0);
  const energy = { inW, outW, residual: (inW - outW) / lhv, terms: terms.filter((t) => t.valueW !== 0) };

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

/** The plant around the stack of a design point. Electrolysis: the electrical layout and the stack's streams (the electrolysis plant's balance is not built yet). */
export function plantBalance(point: DesignPoint, plant: PlantInput): PlantBalance {
  const findings: Finding[] = [];
  const electrical = layoutOf(point, plant);
  if (point.inputs.mode === 'power' && point.inputs.fuelFeed && point.inputs.airFeed) {
    const { balance, streams } = powerBalance(point, plant, electrical, findings);
    return { electrical, streams, power: balance, findings };
  }
  const streams = point.streams.map((x, k) => ({ number: k + 1, id: x.id, name: x.name, temperatureK: x.temperatureK, pressureBar: x.pressureBar, flows: { ...x.flows } }));
  return { electrical, streams, power: null, findings };
}
