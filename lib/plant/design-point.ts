/**
 * One evaluation of the stack at its design point: the fuel path on a unit scale, the operating
 * voltage, the cell count, the stack scale from the current (Faraday: I = N j A), the process
 * streams, the heat balance and the efficiency figures. Pure: the same inputs give the same
 * numbers, which the sensitivity study relies on.
 */
import { getSpecies } from '../thermo/species-data.ts';
import { fuelPath, type FuelPath } from '../equilibrium/fuel-path.ts';
import type { DesignInputs } from './design-inputs.ts';
import { unitFeeds, type UnitFeeds } from './unit-feeds.ts';
import { operatingVoltage, type OperatingVoltage } from './voltage.ts';
import { sizeStack, type Sizing } from './sizing.ts';
import { liquidCellWater, type WaterSplit } from './water-balance.ts';
import { heatBalance, coolingAirMolPerS, type HeatBalance } from './heat.ts';
import { electrolysisEfficiency, powerEfficiency, type ElectrolysisEfficiency, type PowerEfficiency } from './efficiency.ts';
import { gasFlow, scaled, totalFlow, type Stream } from './streams.ts';

export interface CalculationNote {
  /** Basis field the note concerns (for its location). */
  path: string;
  message: string;
}

export interface DesignPoint {
  inputs: DesignInputs;
  unit: UnitFeeds;
  /** The fuel path on the unit scale. */
  path: FuelPath;
  /** Stack flows = unit flows × scale. */
  scale: number;
  sizing: Sizing;
  voltage: OperatingVoltage;
  cellCurrentA: number;
  /** Σ over the cells of the cell current: the charge rate that sets the flows, A. */
  totalCurrentA: number;
  stackVoltageV: number;
  /** Stack DC power: output in power mode, input in electrolysis, W. */
  stackPowerW: number;
  /** Power mode: net output after the balance of plant; electrolysis: the stack input. */
  netPowerW: number;
  streams: Stream[];
  water: WaterSplit | null;
  heat: HeatBalance;
  /** Power mode: air for the allowed temperature rise, mol/s, and its ratio to the air fed. */
  coolingAirMolPerS: number | null;
  power: PowerEfficiency | null;
  electrolysis: (ElectrolysisEfficiency & { hydrogenMolPerS: number; oxygenMolPerS: number; carbonMonoxideMolPerS: number }) | null;
  notes: CalculationNote[];
}

function stream(id: string, name: string, temperatureK: number, pressureBar: number, flows: Record<string, number>): Stream {
  return { id, name, temperatureK, pressureBar, flows };
}

function water(flows: Readonly<Record<string, number>>): number {
  return (flows.H2O ?? 0) + (flows['H2O(L)'] ?? 0);
}

/** Adds vapour and liquid water to a dry outlet gas of a liquid-water cell. */
function wetted(flows: Record<string, number>, vapour: number, liquid: number): Record<string, number> {
  const out = { ...flows };
  if (vapour > 0) out.H2O = (out.H2O ?? 0) + vapour;
  if (liquid > 0) out['H2O(L)'] = liquid;
  return out;
}

export function evaluateDesignPoint(inputs: DesignInputs): DesignPoint {
  const tech = inputs.technology;
  const power = inputs.mode === 'power';
  const notes: CalculationNote[] = [];
  const unit = unitFeeds(inputs);
  const path = fuelPath({
    technology: tech,
    mode: inputs.mode,
    temperatureK: inputs.temperatureK,
    fuelPressureBar: inputs.fuelPressureBar,
    airPressureBar: inputs.airPressureBar,
    fuelFeed: unit.fuelStackInlet,
    airFeed: unit.air,
    utilization: inputs.utilization,
    intervals: inputs.intervals,
    refineV: inputs.refineV,
    ...(inputs.seeds ? { seeds: inputs.seeds } : {}),
  });
  const voltage = operatingVoltage(inputs.mode, inputs.voltage, path.meanNernstV, path.inletNernstV, inputs.currentDensityAPerM2, inputs.ionicTransferenceNumber, inputs.crossoverAllowanceV);
  const cellCurrentA = inputs.currentDensityAPerM2 * inputs.activeAreaM2;
  const cellPowerW = voltage.cellVoltageV * cellCurrentA;
  // What one cell delivers of the sizing target.
  const unitHydrogen = power ? 0 : Math.max(0, (path.fuelOutlet.H2 ?? 0) - (path.fuelInlet.H2 ?? 0));
  const hydrogenPerCellKgPerS = (unitHydrogen * (cellCurrentA / path.currentA)) * getSpecies('H2').molarMassKgPerMol;
  const perCell =
    inputs.size.kind === 'hydrogen' ? hydrogenPerCellKgPerS : power ? cellPowerW * (1 - inputs.parasiticFraction) : cellPowerW;
  const sizing = sizeStack(inputs.size, inputs.statedCells, perCell, inputs.mode);
  const totalCurrentA = sizing.cells * cellCurrentA;
  const scale = totalCurrentA / path.currentA;
  const stackPowerW = sizing.cells * cellPowerW;
  const netPowerW = power ? stackPowerW * (1 - inputs.parasiticFraction) : stackPowerW;

  // Streams on the stack scale.
  const p = { fuel: inputs.fuelPressureBar, air: inputs.airPressureBar };
  const t = inputs.temperatureK;
  const inlets: Stream[] = [];
  const outlets: Stream[] = [];
  const extra: Stream[] = [];
  if (unit.fuelRaw && inputs.preReforming.kind === 'equilibrium') {
    extra.push(stream('fuel-feed', 'fuel feed to the pre-reformer', inputs.preReforming.temperatureK, p.fuel, scaled(unit.fuelRaw, scale)));
    extra.push(stream('pre-reformer-outlet', 'pre-reformer outlet', inputs.preReforming.temperatureK, p.fuel, scaled(unit.fuelStackInlet!, scale)));
  }
  const fuelInletFlows = unit.fuelStackInlet ? scaled(unit.fuelStackInlet, scale) : null;
  const airInletFlows = unit.air ? scaled(unit.air, scale) : null;
  if (fuelInletFlows) inlets.push(stream('fuel-inlet', 'fuel-electrode inlet', inputs.fuelInletTemperatureK, p.fuel, fuelInletFlows));
  if (airInletFlows) inlets.push(stream('air-inlet', 'air-electrode inlet', inputs.airInletTemperatureK, p.air, airInletFlows));
  let fuelOut = scaled(path.fuelOutlet, scale);
  let airOut = scaled(path.airOutlet, scale);
  let waterSplit: WaterSplit | null = null;
  if (tech.waterPhase === 'liquid') {
    const waterIn = inlets.reduce((s, st) => s + water(st.flows), 0);
    waterSplit = liquidCellWater(inputs.mode, waterIn, totalCurrentA, gasFlow(fuelOut), gasFlow(airOut), path.vapourFractionFuel, path.vapourFractionAir);
    if (!waterSplit.saturated) {
      notes.push({ path: 'conditions.operating-temperature', message: 'the water formed and fed is not enough to saturate both outlet gases at this temperature and pressure: the membrane or electrolyte would dry out (humidify the feeds, or raise the pressure)' });
    }
    const liquidWithFuel = tech.waterElectrode === 'fuel';
    fuelOut = wetted(fuelOut, waterSplit.fuelVapour, liquidWithFuel ? waterSplit.liquid : 0);
    airOut = wetted(airOut, waterSplit.airVapour, liquidWithFuel ? 0 : waterSplit.liquid);
  }
  const hydrogenSide = power ? 'fuel-electrode outlet (anode off-gas)' : 'fuel-electrode outlet (hydrogen product)';
  const oxygenSide = power ? 'air-electrode outlet (cathode exhaust)' : 'air-electrode outlet (oxygen product)';
  if (totalFlow(fuelOut) > 0) outlets.push(stream('fuel-outlet', hydrogenSide, t, p.fuel, fuelOut));
  if (totalFlow(airOut) > 0) outlets.push(stream('air-outlet', oxygenSide, t, p.air, airOut));

  const heat = heatBalance(inputs.mode, inlets, outlets, t, stackPowerW, totalCurrentA);
  let coolingAir: number | null = null;
  let powerEff: PowerEfficiency | null = null;
  let electrolysis: DesignPoint['electrolysis'] = null;
  if (power) {
    // Air cools the stack in high-temperature cells; low-temperature cells have a liquid coolant.
    if (inputs.airFeed && tech.fuelGasEquilibrium) {
      coolingAir = coolingAirMolPerS(heat.isothermalHeatW, inputs.airFeed, t, inputs.allowedAirTemperatureRiseK);
      const fed = airInletFlows ? totalFlow(airInletFlows) : 0;
      if (coolingAir > fed * 1.0001) {
        notes.push({
          path: inputs.air.kind === 'ratio' ? 'operating-point.air-ratio' : 'operating-point.air-utilization',
          message: `the air fed (${fed.toPrecision(4)} mol/s) carries only ${((fed / coolingAir) * 100).toFixed(0)} % of the stack heat at a ${inputs.allowedAirTemperatureRiseK} K rise; ${coolingAir.toPrecision(4)} mol/s of air would be needed, or another heat sink`,
        });
      }
    }
    powerEff = powerEfficiency(unit.fuelRaw ? scaled(unit.fuelRaw, scale) : {}, t, inputs.ambientTemperatureK, tech.waterPhase, voltage.cellVoltageV, path.meanNernstV, stackPowerW, netPowerW);
  } else {
    const fuelIn = fuelInletFlows ?? {};
    const hydrogenMolPerS = (fuelOut.H2 ?? 0) - (fuelIn.H2 ?? 0);
    const oxygenMolPerS = (airOut.O2 ?? 0) - (airInletFlows?.O2 ?? 0);
    const carbonMonoxideMolPerS = (fuelOut.CO ?? 0) - (fuelIn.CO ?? 0);
    electrolysis = { ...electrolysisEfficiency(hydrogenMolPerS, stackPowerW, path.meanNernstV, voltage.cellVoltageV), hydrogenMolPerS, oxygenMolPerS, carbonMonoxideMolPerS };
    if (heat.isothermalHeatW < 0 && inputs.technology.waterPhase === 'gas') {
      notes.push({ path: inputs.voltage.kind === 'given' ? 'operating-point.cell-voltage' : 'operating-point.area-specific-resistance', message: `below the thermoneutral voltage (${heat.thermoneutralVoltageV.toFixed(4)} V) the stack absorbs ${(-heat.isothermalHeatW / 1000).toPrecision(4)} kW of heat: it must be supplied (superheated feed, heated sweep or electric heating)` });
    }
  }
  if (path.maxCarbonActivity > 1) {
    notes.push({ path: 'streams.fuel-electrode', message: `the fuel-electrode gas reaches carbon activity ${path.maxCarbonActivity.toPrecision(3)} (above 1: carbon can deposit on the electrode); add steam or change the temperature` });
  }
  return {
    inputs,
    unit,
    path,
    scale,
    sizing,
    voltage,
    cellCurrentA,
    totalCurrentA,
    stackVoltageV: sizing.cells * voltage.cellVoltageV,
    stackPowerW,
    netPowerW,
    streams: [...extra, ...inlets, ...outlets],
    water: waterSplit,
    heat,
    coolingAirMolPerS: coolingAir,
    power: powerEff,
    electrolysis,
    notes,
  };
}
