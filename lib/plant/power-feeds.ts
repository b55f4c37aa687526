/**
 * The feeds of a fuel-cell (power) plant up to the stack, and the stack's outlets:
 *  - Steam raising (lib/plant/steam-raising.ts) from the feed water to the mixing temperature
 *    T_mix, the pre-reformer's inlet or else the fuel-electrode inlet.
 *  - Fuel preheat: dry fuel from its supply temperature to T_mix; a recycled off-gas cooled from
 *    the stack temperature to T_mix (it gives heat to the mix).
 *  - Pre-reformer: Q = H_out(T_out) − H_feed(T_in) (zero when adiabatic); reformed gas heated to
 *    the fuel-electrode inlet temperature.
 *  - Air blower: one adiabatic stage from its inlet pressure to the air-electrode pressure
 *    (lib/flowsheet/compression.ts: isentropic outlet on s°(T), work over the isentropic
 *    efficiency); air then heated to the air-electrode inlet temperature (a carbonate cell's
 *    cathode-gas loop takes the burner air instead: power-cathode-loop.ts). Fresh oxidiser air, where
 *    the oxidiser burns with air of its own, is λ times the O2 complete combustion of the off-gas
 *    needs, Σ ṅ_i z_i / 4 (lib/electrochem/charge.ts), and passes the same blower.
 *  - Stack: Q_stack = H_in(T_in) − H_out(T_stack) − P_DC (heat.ts, "as fed"). Cells cooled by
 *    their air (the high-temperature cells) reject it into the air-electrode exhaust, at the
 *    temperature the stack heat balance gives it (stack-heat-balance.ts: the stack's one
 *    statement of it, with its findings where the exhaust leaves off the stack temperature);
 *    other cells reject it to their coolant (recovered as heat, or rejected, as the basis says).
 */
import { mixtureEnthalpyJ } from '../thermo/mixture.ts';
import { saturationRange, waterSaturationPressurePa } from '../thermo/water-saturation.ts';
import { PA_PER_BAR } from '../thermo/constants.ts';
import { electronsOfStream } from '../electrochem/charge.ts';
import type { PlantInput } from '../basis/types.ts';
import { compressGas } from '../flowsheet/compression.ts';
import type { DesignPoint } from './design-point.ts';
import { scaled, totalFlow } from './streams.ts';
import { finding, type Finding } from './findings.ts';
import type { PowerPlantBalance, SteamRaising } from './plant-balance-types.ts';
import { plus, without, type PlantSheet } from './plant-sheet.ts';
import { raiseSteam } from './steam-raising.ts';

const H = mixtureEnthalpyJ;

/** The fuel side's feeds: the dry fuel, the feed water raised to steam, the recycle, and the temperatures they come at. */
export interface FuelFeeds {
  fuel: Record<string, number>;
  waterMol: number;
  recycle: Record<string, number> | null;
  steam: SteamRaising | null;
  mixingTemperatureK: number;
  fuelSupplyK: number;
  feedWaterK: number;
}

/** The air side's feeds: the stack air with any fresh oxidiser air, the blower and the temperature after it. */
export interface AirFeeds {
  freshAir: Record<string, number> | null;
  airTotal: Record<string, number>;
  supplyK: number;
  blownK: number;
  blower: PowerPlantBalance['blower'];
}

/** The fuel-electrode off-gas (less any recycle), its liquid water taken off, and the air-electrode exhaust with the stack heat it carries. */
export interface StackOutlets {
  offGasFlows: Record<string, number>;
  liquidOffGas: number;
  offGas: Record<string, number>;
  airOutlet: Record<string, number>;
  liquidAir: number;
  stackHeatW: number;
  airCooled: boolean;
  airExhaustK: number;
  stackHeatTo: PowerPlantBalance['stackHeatTo'];
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
export function oxygenDemand(flows: Readonly<Record<string, number>>): number {
  return electronsOfStream(flows) / 4;
}

/** The pre-reformer's streams and duties: its duty Q = H_out(T_out) − H_feed(T_in) (zero when adiabatic), then the reformed gas heated to the fuel-electrode inlet. */
function preReformer(point: DesignPoint, sheet: PlantSheet, stackFuelIn: Record<string, number>): void {
  const inputs = point.inputs;
  const pre = point.unit.preReformer!;
  const pFuel = inputs.fuelPressureBar;
  const feed = scaled(pre.feed, point.scale);
  sheet.add('pre-reformer-feed', 'pre-reformer feed', pre.inletTemperatureK, pFuel, feed);
  sheet.add('pre-reformer-outlet', 'pre-reformer outlet', pre.outletTemperatureK, pFuel, stackFuelIn);
  const q = inputs.preReforming.kind === 'adiabatic' ? 0 : H(stackFuelIn, pre.outletTemperatureK) - H(feed, pre.inletTemperatureK);
  sheet.duty('pre-reformer', inputs.preReforming.kind === 'adiabatic' ? 'pre-reformer (adiabatic)' : 'pre-reformer held at its temperature', q, pre.inletTemperatureK, pre.outletTemperatureK);
  sheet.duty('reformed-gas-heating', 'reformed gas heated to the fuel-electrode inlet', H(stackFuelIn, inputs.fuelInletTemperatureK) - H(stackFuelIn, pre.outletTemperatureK), pre.outletTemperatureK, inputs.fuelInletTemperatureK);
}

/** The fuel side up to the fuel-electrode inlet: dry fuel, feed water raised to steam, recycle, preheat to T_mix, pre-reformer (the module comment). */
export function fuelPreparation(point: DesignPoint, plant: PlantInput, sheet: PlantSheet): FuelFeeds {
  const inputs = point.inputs;
  const unit = point.unit;
  const pFuel = inputs.fuelPressureBar;
  const tStack = inputs.temperatureK;
  const fresh = scaled(unit.fuelRaw ?? {}, point.scale);
  const { fuel, steam: waterMol } = inputs.dryFuel ? dryAndSteam(fresh, inputs.dryFuel) : { fuel: fresh, steam: 0 };
  const recycle = unit.recycle ? scaled(unit.recycle, point.scale) : null;
  const tMix = unit.preReformer ? unit.preReformer.inletTemperatureK : inputs.fuelInletTemperatureK;
  const tFuel = plant.fuelSupplyTemperatureK;
  const tWater = plant.feedWaterTemperatureK;
  sheet.add('fuel-supply', 'fuel supply (dry)', tFuel, pFuel, fuel);
  sheet.add('feed-water', 'feed water', tWater, pFuel, waterMol > 0 ? { 'H2O(L)': waterMol } : {});
  if (recycle) sheet.add('recycle', 'recycled fuel-electrode off-gas', tStack, pFuel, recycle);
  let steam: SteamRaising | null = null;
  if (waterMol > 0) {
    steam = raiseSteam(waterMol, tWater, pFuel, tMix);
    sheet.duty('feed-water-heating', 'feed water heated to saturation', steam.liquidHeatingW, tWater, steam.saturationTemperatureK);
    sheet.duty('evaporation', 'feed water evaporated', steam.evaporationW, steam.saturationTemperatureK, steam.saturationTemperatureK);
    sheet.duty('superheating', 'steam superheated to the mixing temperature', steam.superheatingW, steam.saturationTemperatureK, tMix);
  }
  sheet.duty('fuel-preheat', 'fuel heated to the mixing temperature', H(fuel, tMix) - H(fuel, tFuel), tFuel, tMix);
  if (recycle) sheet.duty('recycle-cooling', 'recycled off-gas cooled to the mixing temperature', H(recycle, tMix) - H(recycle, tStack), tStack, tMix);
  const stackFuelIn = scaled(unit.fuelStackInlet ?? {}, point.scale);
  if (unit.preReformer) preReformer(point, sheet, stackFuelIn);
  sheet.add('fuel-inlet', 'fuel-electrode inlet', inputs.fuelInletTemperatureK, pFuel, stackFuelIn);
  return { fuel, waterMol, recycle, steam, mixingTemperatureK: tMix, fuelSupplyK: tFuel, feedWaterK: tWater };
}

/** The air blower: one adiabatic stage from its inlet pressure to the air-electrode pressure, with a finding where it alone takes more than the parasitic load allowed. */
function airBlower(point: DesignPoint, plant: PlantInput, airTotal: Record<string, number>, findings: Finding[]): PowerPlantBalance['blower'] {
  if (!plant.airBlower) return null;
  const tAir = plant.airSupplyTemperatureK;
  const pAir = point.inputs.airPressureBar;
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
  const blower = {
    inletPressureBar: plant.airBlower.inletPressureBar,
    outletPressureBar: pAir,
    inletTemperatureK: tAir,
    outletTemperatureK: b.stages[0]!.outletTemperatureK,
    flowMolPerS: totalFlow(airTotal),
    powerW: b.powerW,
    isentropicEfficiency: plant.airBlower.isentropicEfficiency,
    parasiticAllowanceW: point.inputs.parasiticFraction * point.stackPowerW,
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
  return blower;
}

/**
 * The vapour pressure of the air feed at its supply state, and the most saturation allows there,
 * where the first exceeds the second (else null): such a feed cannot reach the plant as vapour.
 * The saturation pressure is IF97's p_s(T) from 0 °C up; below it, p_s(0 °C) bounds the vapour
 * pressure over water or ice from above (it rises with T), so a partial pressure above that bound
 * is above saturation at the colder supply temperature too.
 */
function supersaturation(plant: PlantInput, airTotal: Record<string, number>, supplyBar: number): { waterPa: number; saturationPa: number; belowZero: boolean } | null {
  const tAir = plant.airSupplyTemperatureK;
  const waterPa = ((airTotal.H2O ?? 0) / totalFlow(airTotal)) * supplyBar * PA_PER_BAR;
  const { lowK, highK } = saturationRange();
  if (!(waterPa > 0) || tAir >= highK) return null;
  const saturationPa = waterSaturationPressurePa(Math.max(tAir, lowK));
  return waterPa > saturationPa ? { waterPa, saturationPa, belowZero: tAir < lowK } : null;
}

/**
 * A supersaturated air feed (supersaturation above) matters to the numbers where the heat recovery
 * condenses its water: a finding then. Without heat recovery the stream table says it in the
 * supply stream's name (airSupply).
 */
function airSaturationFinding(plant: PlantInput, excess: NonNullable<ReturnType<typeof supersaturation>>, findings: Finding[]): void {
  if (!plant.heatRecovery) return;
  const kPa = (x: number) => (x / 1000).toPrecision(3);
  const allowed = excess.belowZero ? `less than ${kPa(excess.saturationPa)} kPa, the saturation pressure at 0 °C, below which it lies` : `${kPa(excess.saturationPa)} kPa`;
  findings.push(
    finding(
      'air-feed-above-saturation',
      'warning',
      'streams.air-electrode.composition',
      `the air-electrode feed holds more water vapour (${kPa(excess.waterPa)} kPa) than saturation allows at its supply temperature (${allowed}): it cannot be a feed from outside as stated (a gas recycled within the plant, such as a carbonate cathode's burnt anode gas, is not modelled as such), and its water condensing in the heat recovery overstates the heat delivered`,
      ['plant.feed-temperatures.air'],
    ),
  );
}

/** The name of an air supply whose water could not be vapour at its supply state: what the stream table shows is not a state the air can be in. */
const SUPERSATURATED_SUPPLY = 'air supply (supersaturated: its humidifier or recycle is not modelled)';

/** The air side up to the air-electrode inlet: stack air and any fresh oxidiser air, the blower, the preheat (the module comment). */
export function airSupply(point: DesignPoint, plant: PlantInput, offGas: Record<string, number>, sheet: PlantSheet, findings: Finding[]): AirFeeds {
  const inputs = point.inputs;
  const pAir = inputs.airPressureBar;
  const stackAir = point.streams.find((x) => x.id === 'air-inlet')!.flows;
  const loop = point.unit.cathodeLoop;
  const ox = plant.offGasOxidiser;
  const airPerMolO2 = 1 / (inputs.airFeed!.O2 ?? 1);
  const freshAir =
    ox?.oxidant.kind === 'fresh-air' ? scaled(inputs.airFeed!, ox.oxidant.airRatio * oxygenDemand(offGas) * airPerMolO2) : null;
  // A cathode-gas loop takes the burner air; the loop (power-cathode-loop.ts) makes the stack's air from it.
  const supplied = loop ? scaled(loop.burnerAir, point.scale) : stackAir;
  const airTotal = freshAir ? plus(supplied, freshAir) : supplied;
  const tAir = plant.airSupplyTemperatureK;
  const blower = airBlower(point, plant, airTotal, findings);
  const tBlown = blower ? blower.outletTemperatureK : tAir;
  const supplyBar = plant.airBlower?.inletPressureBar ?? pAir;
  const excess = supersaturation(plant, airTotal, supplyBar);
  if (excess) airSaturationFinding(plant, excess, findings);
  sheet.add('air-supply', excess ? SUPERSATURATED_SUPPLY : loop ? 'burner air supply' : 'air supply', tAir, supplyBar, airTotal);
  if (blower) sheet.add('blower-outlet', 'air after the blower', tBlown, pAir, airTotal);
  if (loop) return { freshAir, airTotal, supplyK: tAir, blownK: tBlown, blower };
  sheet.duty('air-preheat', 'air heated to the air-electrode inlet', H(stackAir, inputs.airInletTemperatureK) - H(stackAir, tBlown), tBlown, inputs.airInletTemperatureK);
  sheet.add('air-inlet', 'air-electrode inlet', inputs.airInletTemperatureK, pAir, stackAir);
  return { freshAir, airTotal, supplyK: tAir, blownK: tBlown, blower };
}

/** The fuel-electrode off-gas to the oxidiser, the recycle taken off: ṅ_off = (1 − r) ṅ_fuel-outlet, its liquid water apart, mol/s. */
export function offGasOf(point: DesignPoint, plant: PlantInput): Pick<StackOutlets, 'offGasFlows' | 'liquidOffGas' | 'offGas'> {
  const fuelOutlet = point.streams.find((x) => x.id === 'fuel-outlet')?.flows ?? {};
  const ratio = plant.anodeRecycle?.ratio ?? 0;
  const offGasFlows = scaled(fuelOutlet, 1 - ratio);
  return { offGasFlows, liquidOffGas: offGasFlows['H2O(L)'] ?? 0, offGas: without(offGasFlows, 'H2O(L)') };
}

/** The stack's outlets (liquid water of a low-temperature cell taken off as its own stream); the air-cooled stack's heat leaves with its air (the module comment). */
export function stackOutlets(point: DesignPoint, plant: PlantInput, offGas: Pick<StackOutlets, 'offGasFlows' | 'liquidOffGas' | 'offGas'>, recycled: boolean, sheet: PlantSheet): StackOutlets {
  const inputs = point.inputs;
  const tStack = inputs.temperatureK;
  const airOutletAll = point.streams.find((x) => x.id === 'air-outlet')!.flows;
  const liquidAir = airOutletAll['H2O(L)'] ?? 0;
  const airOutlet = without(airOutletAll, 'H2O(L)');
  const stackHeatW = point.heat.asFedHeatW;
  const airCooled = point.stackBalance !== null;
  const airExhaustK = point.stackBalance ? point.stackBalance.exhaustTemperatureK : tStack;
  const stackHeatTo: PowerPlantBalance['stackHeatTo'] = airCooled ? 'air-electrode exhaust' : (plant.heatRecovery?.stackHeat ?? 'rejected');
  sheet.add('fuel-outlet', recycled ? 'fuel-electrode off-gas to the oxidiser (after the recycle is taken)' : 'fuel-electrode off-gas', tStack, inputs.fuelPressureBar, offGas.offGasFlows);
  sheet.add('air-outlet', 'air-electrode exhaust', airExhaustK, inputs.airPressureBar, airOutletAll);
  return { ...offGas, airOutlet, liquidAir, stackHeatW, airCooled, airExhaustK, stackHeatTo };
}
