/**
 * One evaluation of the stack at its design point: the fuel path on a unit scale, the operating
 * voltage of the uniform-voltage cell (voltage.ts), the cell count, the stack scale from the
 * ionic current (Faraday: I_ion = N j_ion A sets every flow; with a mixed conductor the stack
 * draws or delivers I = N j A, the electronic leakage carrying no ions), the process
 * streams, the heat balance and the efficiency figures. Pure: the same inputs give the same
 * numbers, which the sensitivity study relies on.
 */
import { getSpecies } from '../thermo/species-data.ts';
import { fuelPath, type FuelPath, type FuelPathRequest } from '../equilibrium/fuel-path.ts';
import type { DesignInputs } from './design-inputs.ts';
import { unitFeeds, type UnitFeeds } from './unit-feeds.ts';
import { voltageModelAt, type CellVoltageRequest, type OperatingVoltage } from './voltage.ts';
import { agedVoltage, type AgedCell } from './degradation.ts';
import { sizeStack, type Sizing } from './sizing.ts';
import { liquidCellWater, type WaterSplit } from '../equilibrium/liquid-water.ts';
import { heatBalance, coolantMolPerS, type HeatBalance } from './heat.ts';
import { stackHeatBalance, stackBalanceFindings, type StackHeatBalance } from './stack-heat-balance.ts';
import { electrolysisEfficiency, powerEfficiency, type ElectrolysisEfficiency, type PowerEfficiency } from './efficiency.ts';
import { gasFlow, scaled, totalFlow, type Stream } from './streams.ts';
import { finding, type Finding } from './findings.ts';
import { AGREEMENT } from './sizing.ts';
import { CalculationError } from '../core/errors.ts';

export interface DesignPoint {
  inputs: DesignInputs;
  unit: UnitFeeds;
  /** The fuel path on the unit scale. */
  path: FuelPath;
  /** Stack flows = unit flows × scale. */
  scale: number;
  sizing: Sizing;
  voltage: OperatingVoltage;
  /** The beginning-of-life cell where the basis gives a degradation, else null. */
  degradation: AgedCell | null;
  /** Current of one cell at its terminals, j A. */
  cellCurrentA: number;
  /** Σ over the cells of the cell current at the terminals, N j A. */
  totalCurrentA: number;
  /** Σ over the cells of the ionic current, N j_ion A: the charge rate that sets the flows, A. */
  ionicCurrentA: number;
  stackVoltageV: number;
  /** Stack DC power: output in power mode, input in electrolysis, W. */
  stackPowerW: number;
  /** Power mode: net output after the balance of plant; electrolysis: the stack input. */
  netPowerW: number;
  streams: Stream[];
  water: WaterSplit | null;
  heat: HeatBalance;
  /** Power mode, air-cooled cells: the stack heat balance with the feeds at their inlet temperatures (stack-heat-balance.ts), else null. */
  stackBalance: StackHeatBalance | null;
  /** Its air flow that closes the balance at the stated air inlet temperature, mol/s (null where none does, or the cells are not air-cooled). */
  coolingAirMolPerS: number | null;
  /** Electrolysis fed liquid water at its water electrode: the water that carries the stack heat at the allowed rise, mol/s. */
  coolingWaterMolPerS: number | null;
  power: PowerEfficiency | null;
  electrolysis: (ElectrolysisEfficiency & { hydrogenMolPerS: number; oxygenMolPerS: number; carbonMonoxideMolPerS: number; methaneMolPerS: number }) | null;
  /** The anode off-gas recycle: its ratio and how far the recycle fed differs from that share of the fuel path's off-gas (relative to the recycled flow); null without one. */
  recycle: { ratio: number; residual: number } | null;
  findings: Finding[];
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

/** What the cell voltage of the design point is solved from (voltage.ts), for the design point and the sweeps. */
export function cellRequest({ inputs, path }: Pick<DesignPoint, 'inputs' | 'path'>): CellVoltageRequest {
  return {
    mode: inputs.mode,
    model: voltageModelAt(inputs.voltage, inputs.resistanceLaw, inputs.temperatureK),
    profile: path.profile,
    utilization: inputs.utilization,
    currentDensityAPerM2: inputs.currentDensityAPerM2,
    ionicTransferenceNumber: inputs.ionicTransferenceNumber,
    crossoverAllowanceV: inputs.crossoverAllowanceV,
    inletNernstV: path.inletNernstV,
    points: path.points,
    ...(inputs.activationLoss ? { activation: inputs.activationLoss } : {}),
  };
}

/** The fuel path on the unit scale of `unit`. */
function unitPath(inputs: DesignInputs, unit: UnitFeeds): FuelPath {
  return fuelPath(fuelPathRequest(inputs, unit));
}

/** What the fuel path on the unit scale of `unit` is computed from: all of it (fuel-path.ts is pure in it). */
export function fuelPathRequest(inputs: DesignInputs, unit: UnitFeeds): FuelPathRequest {
  return {
    technology: inputs.technology,
    mode: inputs.mode,
    temperatureK: inputs.temperatureK,
    fuelPressureBar: inputs.fuelPressureBar,
    airPressureBar: inputs.airPressureBar,
    fuelFeed: unit.fuelStackInlet,
    airFeed: unit.air,
    ...(inputs.kohMassFraction !== undefined ? { kohMassFraction: inputs.kohMassFraction } : {}),
    utilization: inputs.utilization,
    intervals: inputs.intervals,
    refineV: inputs.refineV,
    ...(inputs.seeds ? { seeds: inputs.seeds } : {}),
  };
}

/**
 * What one cell delivers of a target's quantity at the voltage: net AC power (power mode, after the
 * inverter and the balance-of-plant share), AC input power (electrolysis, the rectifier's and the
 * balance of plant's included; plantPowerShare), or hydrogen, kg/s, from its ionic current.
 */
export function deliveredPerCell(inputs: DesignInputs, path: FuelPath, voltage: OperatingVoltage, target: 'power' | 'hydrogen'): number {
  const power = inputs.mode === 'power';
  const cellPowerW = voltage.cellVoltageV * inputs.currentDensityAPerM2 * inputs.activeAreaM2;
  if (target === 'power') return cellPowerW * plantPowerShare(inputs);
  const cellIonicCurrentA = voltage.ionicCurrentDensityAPerM2 * inputs.activeAreaM2;
  const unitHydrogen = power ? 0 : Math.max(0, (path.fuelOutlet.H2 ?? 0) - (path.fuelInlet.H2 ?? 0));
  return unitHydrogen * (cellIonicCurrentA / path.currentA) * getSpecies('H2').molarMassKgPerMol;
}

/** The cell's voltage after any degradation, and the cell before it. */
export type CellVoltage = { voltage: OperatingVoltage; aged: AgedCell | null };

/** The cell's voltage (after any degradation) at the inputs' current density. */
export function cellVoltageOf(inputs: DesignInputs, path: FuelPath): CellVoltage {
  return agedVoltage(cellRequest({ inputs, path }), inputs.degradation);
}

/**
 * The cell's voltage and currents, the cell count, and the stack's currents, scale (stack flows per
 * unit flow, from the ionic current) and power; `cell` is cellVoltageOf of these inputs and path
 * where the caller has it already (a target's root search ends on it).
 */
function stackSize(inputs: DesignInputs, path: FuelPath, cell: CellVoltage = cellVoltageOf(inputs, path)) {
  const { voltage, aged } = cell;
  const cellCurrentA = inputs.currentDensityAPerM2 * inputs.activeAreaM2;
  const cellIonicCurrentA = voltage.ionicCurrentDensityAPerM2 * inputs.activeAreaM2;
  const cellPowerW = voltage.cellVoltageV * cellCurrentA;
  // What one cell delivers of the sizing target.
  const perCell = deliveredPerCell(inputs, path, voltage, inputs.size.kind === 'hydrogen' ? 'hydrogen' : 'power');
  const sizing = sizeStack(inputs.size, inputs.statedCells, perCell, inputs.mode);
  const totalCurrentA = sizing.cells * cellCurrentA;
  const ionicCurrentA = sizing.cells * cellIonicCurrentA;
  const stackPowerW = sizing.cells * cellPowerW;
  return {
    voltage,
    aged,
    cellCurrentA,
    sizing,
    totalCurrentA,
    ionicCurrentA,
    scale: ionicCurrentA / path.currentA,
    stackPowerW,
    netPowerW: stackPowerW * plantPowerShare(inputs),
  };
}

/**
 * The plant's AC power per unit of stack DC power. Power mode: the inverter converts the stack's
 * DC output with efficiency η and the balance of plant draws the share f of the stack DC power
 * from the AC side, P_net = P_DC (η − f). Electrolysis: the rectifier draws P_DC/η and the
 * balance of plant f P_DC more, P_in = P_DC (1/η + f). With η = 1 and f = 0 both are P_DC.
 */
function plantPowerShare(inputs: Pick<DesignInputs, 'mode' | 'conversionEfficiency' | 'parasiticFraction'>): number {
  return inputs.mode === 'power' ? inputs.conversionEfficiency - inputs.parasiticFraction : 1 / inputs.conversionEfficiency + inputs.parasiticFraction;
}

/** The process streams on the stack scale: the pre-reformer's, the inlets, and the outlets (of a liquid-water cell with their vapour and liquid water). */
function stackStreams(inputs: DesignInputs, unit: UnitFeeds, path: FuelPath, scale: number, ionicCurrentA: number, findings: Finding[]) {
  const power = inputs.mode === 'power';
  const tech = inputs.technology;
  const p = { fuel: inputs.fuelPressureBar, air: inputs.airPressureBar };
  const t = inputs.temperatureK;
  const inlets: Stream[] = [];
  const outlets: Stream[] = [];
  const extra: Stream[] = [];
  if (unit.preReformer) {
    extra.push(stream('fuel-feed', 'fuel feed to the pre-reformer', unit.preReformer.inletTemperatureK, p.fuel, scaled(unit.preReformer.feed, scale)));
    extra.push(stream('pre-reformer-outlet', 'pre-reformer outlet', unit.preReformer.outletTemperatureK, p.fuel, scaled(unit.fuelStackInlet!, scale)));
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
    waterSplit = liquidCellWater(inputs.mode, waterIn, ionicCurrentA, gasFlow(fuelOut), gasFlow(airOut), path.vapourFractionFuel, path.vapourFractionAir);
    if (!waterSplit.saturated) {
      findings.push(
        finding(
          'dry-out',
          'critical',
          'conditions.operating-temperature',
          'the water formed and fed is not enough to saturate both outlet gases at this temperature and pressure: the membrane or electrolyte would dry out (humidify the feeds, or raise the pressure)',
          ['conditions.fuel-electrode-pressure', 'conditions.air-electrode-pressure'],
        ),
      );
    }
    const liquidWithFuel = tech.waterElectrode === 'fuel';
    fuelOut = wetted(fuelOut, waterSplit.fuelVapour, liquidWithFuel ? waterSplit.liquid : 0);
    airOut = wetted(airOut, waterSplit.airVapour, liquidWithFuel ? 0 : waterSplit.liquid);
  }
  const hydrogenSide = power ? 'fuel-electrode outlet (anode off-gas)' : 'fuel-electrode outlet (hydrogen product)';
  const oxygenSide = power ? 'air-electrode outlet (cathode exhaust)' : 'air-electrode outlet (oxygen product)';
  if (totalFlow(fuelOut) > 0) outlets.push(stream('fuel-outlet', hydrogenSide, t, p.fuel, fuelOut));
  if (totalFlow(airOut) > 0) outlets.push(stream('air-outlet', oxygenSide, t, p.air, airOut));
  return { extra, inlets, outlets, fuelInletFlows, airInletFlows, fuelOut, airOut, waterSplit };
}

/**
 * The share a short coolant carries, in whole percent; just short of all of it with one decimal,
 * rounded down, so that a finding never reads "carries only 100 %" (it is raised above 0.01 % short).
 */
function shortShare(fraction: number): string {
  const whole = (fraction * 100).toFixed(0);
  return whole === '100' ? (Math.floor(fraction * 1000) / 10).toFixed(1) : whole;
}

/**
 * Power mode, air-cooled cells (the high-temperature ones; low-temperature cells have a liquid
 * coolant): the stack heat balance with the feeds at their inlet temperatures
 * (stack-heat-balance.ts), whose closing air flow is the cooling air, with its findings.
 */
function airCooledBalance(inputs: DesignInputs, heat: HeatBalance, streams: ReturnType<typeof stackStreams>, findings: Finding[]): StackHeatBalance | null {
  const airInlet = streams.inlets.find((s) => s.id === 'air-inlet');
  if (!airInlet || !inputs.technology.fuelGasEquilibrium) return null;
  const fuelInlet = streams.inlets.find((s) => s.id === 'fuel-inlet') ?? null;
  const t = inputs.temperatureK;
  const balance = stackHeatBalance({ heat, fuelInlet, airInlet, airOutletGas: gasOnly(streams.airOut), stackTemperatureK: t });
  const airField = inputs.air.kind === 'ratio' ? 'operating-point.air-ratio' : 'operating-point.air-utilization';
  findings.push(...stackBalanceFindings(balance, airInlet, fuelInlet, t, { airField, air: inputs.air, allowedRiseK: inputs.allowedAirTemperatureRiseK, stackTemperatureK: t }));
  return balance;
}

/** A stream's gas, its liquid water left out. */
function gasOnly(flows: Readonly<Record<string, number>>): Record<string, number> {
  const { ['H2O(L)']: _liquid, ...gas } = flows;
  return gas;
}

/** Σ outlets − Σ inlets of each species, mol/s. */
function netChange(outlets: readonly Readonly<Record<string, number>>[], inlets: readonly Readonly<Record<string, number>>[]): Record<string, number> {
  const out: Record<string, number> = {};
  for (const flows of outlets) for (const [s, n] of Object.entries(flows)) out[s] = (out[s] ?? 0) + n;
  for (const flows of inlets) for (const [s, n] of Object.entries(flows)) out[s] = (out[s] ?? 0) - n;
  return out;
}

/** The basis field that sets the cell voltage, and the utilization or conversion. */
function voltageFieldOf(inputs: DesignInputs): string {
  return inputs.voltage.kind === 'given' ? 'operating-point.cell-voltage' : 'operating-point.area-specific-resistance';
}

function utilizationFieldOf(inputs: DesignInputs): string {
  return inputs.mode === 'power' ? 'operating-point.fuel-utilization' : 'operating-point.steam-conversion';
}

/** Electrolysis: the hydrogen, oxygen and carbon monoxide made and the efficiency, with a finding where the stack needs heat supplied. */
function electrolysisFigures(inputs: DesignInputs, streams: ReturnType<typeof stackStreams>, heat: HeatBalance, size: ReturnType<typeof stackSize>, path: FuelPath, findings: Finding[]): NonNullable<DesignPoint['electrolysis']> {
  const { fuelOut, airOut, airInletFlows } = streams;
  const fuelIn = streams.fuelInletFlows ?? {};
  const hydrogenMolPerS = (fuelOut.H2 ?? 0) - (fuelIn.H2 ?? 0);
  const oxygenMolPerS = (airOut.O2 ?? 0) - (airInletFlows?.O2 ?? 0);
  const carbonMonoxideMolPerS = (fuelOut.CO ?? 0) - (fuelIn.CO ?? 0);
  const producedMolPerS = netChange([fuelOut, airOut], [fuelIn, airInletFlows ?? {}]);
  const efficiency = electrolysisEfficiency({ producedMolPerS, powerInW: size.stackPowerW, isothermalHeatW: heat.isothermalHeatW, meanNernstV: path.meanNernstV, cellVoltageV: size.voltage.cellVoltageV });
  const figures = { ...efficiency, hydrogenMolPerS, oxygenMolPerS, carbonMonoxideMolPerS, methaneMolPerS: producedMolPerS.CH4 ?? 0 };
  // Below thermoneutral every electrolyser absorbs heat, fed with steam or with liquid water alike.
  if (heat.isothermalHeatW < 0) {
    const how = inputs.technology.waterPhase === 'gas' ? 'superheated feed, heated sweep or electric heating' : 'a heated water or lye loop, or electric heating';
    findings.push(
      finding(
        'heat-demand',
        'info',
        voltageFieldOf(inputs),
        `below the thermoneutral voltage (${heat.thermoneutralVoltageV.toFixed(4)} V) the stack absorbs ${(-heat.isothermalHeatW / 1000).toPrecision(4)} kW of heat: it must be supplied (${how})`,
      ),
    );
  }
  return figures;
}

/**
 * Electrolysis fed liquid water at its water electrode: the water loop that carries the stack
 * heat away at the allowed rise (the same sensible-heat balance as the cooling air), with a
 * finding where the water fed falls short.
 */
function coolingWater(inputs: DesignInputs, streams: ReturnType<typeof stackStreams>, heat: HeatBalance, findings: Finding[]): number | null {
  const tech = inputs.technology;
  const waterFeed = tech.waterElectrode === 'fuel' ? streams.fuelInletFlows : streams.airInletFlows;
  const waterFed = waterFeed?.['H2O(L)'] ?? 0;
  if (!(tech.waterPhase === 'liquid' && waterFed > 0 && heat.isothermalHeatW > 0)) return null;
  const needed = coolantMolPerS(heat.isothermalHeatW, { 'H2O(L)': 1 }, inputs.temperatureK, inputs.allowedAirTemperatureRiseK);
  if (needed > waterFed * 1.0001) {
    const kgPerH = (mol: number) => ((mol * getSpecies('H2O(L)').molarMassKgPerMol * 3600) / 1000).toPrecision(4);
    findings.push(
      finding(
        'water-loop-short',
        'warning',
        utilizationFieldOf(inputs),
        `the water fed (${kgPerH(waterFed)} t/h, ${(1 / inputs.utilization).toPrecision(3)} times the water split) carries only ${shortShare(waterFed / needed)} % of the stack heat (${(heat.isothermalHeatW / 1000).toPrecision(4)} kW) at a ${inputs.allowedAirTemperatureRiseK} K rise; ${kgPerH(needed)} t/h would be needed, or another heat sink`,
        ['conditions.allowed-air-temperature-rise'],
      ),
    );
  }
  return needed;
}

/** The feeds and the fuel path on the unit scale: what the design point does not scale (it does not depend on the current density, the cell count, the resistance or a degradation). */
export interface UnitStage {
  unit: UnitFeeds;
  path: FuelPath;
}

function unitStage(inputs: DesignInputs): UnitStage {
  const unit = unitFeeds(inputs);
  return { unit, path: unitPath(inputs, unit) };
}

/**
 * The recycle loop as the fuel path closes it: the largest difference between the recycle fed
 * and the ratio's share of the path's off-gas, over the recycled flow; refused above the basis's
 * tolerance.
 */
function recycleResidual(inputs: DesignInputs, unit: UnitFeeds, path: FuelPath): DesignPoint['recycle'] {
  if (!inputs.anodeRecycle || !unit.recycle) return null;
  const { ratio, tolerance } = inputs.anodeRecycle;
  const total = totalFlow(unit.recycle);
  let worst = 0;
  for (const label of new Set([...Object.keys(unit.recycle), ...Object.keys(path.fuelOutlet)])) {
    worst = Math.max(worst, Math.abs((path.fuelOutlet[label] ?? 0) * ratio - (unit.recycle[label] ?? 0)) / total);
  }
  if (worst > tolerance) {
    throw new CalculationError(`the anode recycle loop closes only to ${worst.toExponential(2)} of the recycled flow, above the tolerance ${tolerance}`, 'anode-recycle');
  }
  return { ratio, residual: worst };
}

/**
 * The design point; `stage` is the unit stage of the same inputs when already evaluated (cases that
 * share one), `cell` the cell's voltage at these inputs on its path when already found (the same
 * numbers: cellVoltageOf is pure in them).
 */
export function evaluateDesignPoint(inputs: DesignInputs, stage: UnitStage = unitStage(inputs), cell?: CellVoltage): DesignPoint {
  const power = inputs.mode === 'power';
  const findings: Finding[] = [];
  const { unit, path } = stage;
  const recycle = recycleResidual(inputs, unit, path);
  const size = stackSize(inputs, path, cell);
  const { voltage, sizing, totalCurrentA, ionicCurrentA, scale, stackPowerW, netPowerW } = size;
  const streams = stackStreams(inputs, unit, path, scale, ionicCurrentA, findings);
  const t = inputs.temperatureK;
  const heat = heatBalance(inputs.mode, streams.inlets, streams.outlets, t, stackPowerW, ionicCurrentA);
  const stackBalance = power ? airCooledBalance(inputs, heat, streams, findings) : null;
  const powerEff = power
    ? powerEfficiency(unit.fuelRaw ? scaled(unit.fuelRaw, scale) : {}, t, inputs.ambientTemperatureK, inputs.technology.waterPhase, voltage.cellVoltageV, path.meanNernstV, stackPowerW, netPowerW)
    : null;
  const electrolysis = power ? null : electrolysisFigures(inputs, streams, heat, size, path, findings);
  const waterLoop = power ? null : coolingWater(inputs, streams, heat, findings);
  if (path.maxCarbonActivity > 1) {
    findings.push(
      finding(
        'carbon-deposition',
        'critical',
        'streams.fuel-electrode',
        `the fuel-electrode gas reaches carbon activity ${path.maxCarbonActivity.toPrecision(3)} (above 1: carbon can deposit on the electrode); add steam or change the temperature`,
        ['streams.fuel-electrode.steam-to-carbon'],
      ),
    );
  }
  findings.push(...cellFindings(inputs, voltage, sizing));
  return {
    inputs,
    unit,
    path,
    scale,
    sizing,
    voltage,
    degradation: size.aged,
    cellCurrentA: size.cellCurrentA,
    totalCurrentA,
    ionicCurrentA,
    stackVoltageV: sizing.cells * voltage.cellVoltageV,
    stackPowerW,
    netPowerW,
    streams: [...streams.extra, ...streams.inlets, ...streams.outlets],
    water: streams.waterSplit,
    heat,
    stackBalance,
    coolingAirMolPerS: stackBalance?.closingAirMolPerS ?? null,
    coolingWaterMolPerS: waterLoop,
    power: powerEff,
    electrolysis,
    recycle,
    findings,
  };
}

/** The share of the mean current density below which the outlet is said to be nearly out of use (a screening threshold of this project, common practice, no source). */
const IDLE_CURRENT = 0.1;

/** Findings of the cell model and the sizing: the local current along the cell, the mixed conductor, inputs that do not apply, the cell count against its target. */
function cellFindings(inputs: DesignInputs, voltage: OperatingVoltage, sizing: Sizing): Finding[] {
  const out: Finding[] = [];
  const voltageField = voltageFieldOf(inputs);
  const j = inputs.currentDensityAPerM2;
  const local = voltage.local;
  const lowest = Math.min(...local.map((p) => p.currentDensityAPerM2));
  if (lowest < 0) {
    out.push(
      finding(
        'local-current-reversed',
        'warning',
        'cell.ionic-transference-number',
        `toward the outlet the electronic leakage (${(voltage.leakageCurrentDensityAPerM2 / 1e4).toPrecision(3)} A/cm2) exceeds the ionic current: the local current at the terminals falls to ${(lowest / 1e4).toPrecision(3)} A/cm2, so that part of the cell draws current from the rest`,
        [voltageField],
      ),
    );
  }
  const outlet = local[local.length - 1]!.currentDensityAPerM2;
  if (lowest >= 0 && outlet < IDLE_CURRENT * j) {
    let idle = 0;
    for (let k = 1; k < local.length; k++) {
      if ((local[k - 1]!.currentDensityAPerM2 + local[k]!.currentDensityAPerM2) / 2 < IDLE_CURRENT * j) idle += local[k]!.areaFraction - local[k - 1]!.areaFraction;
    }
    const what = inputs.mode === 'power' ? 'fuel utilization' : 'steam conversion';
    out.push(
      finding(
        'outlet-idle',
        'warning',
        utilizationFieldOf(inputs),
        `the local current density at the outlet is ${(outlet / 1e4).toPrecision(3)} A/cm2, under ${IDLE_CURRENT * 100} % of the mean ${(j / 1e4).toPrecision(3)} A/cm2 (${(idle * 100).toFixed(1)} % of the active area carries less): the cell voltage lies within a tenth of j·ASR of the outlet Nernst voltage, so the ${what} is near the most this resistance and current density can reach, and the inlet carries ${(voltage.maxLocalCurrentDensityAPerM2 / j).toFixed(1)} times the mean`,
        [voltageField],
      ),
    );
  }
  if (inputs.mode === 'electrolysis' && inputs.crossoverAllowanceV > 0) {
    out.push(finding('input-unused', 'info', 'cell.crossover-allowance', 'the crossover allowance lowers the open-circuit voltage in power mode only; this electrolysis calculation does not use it'));
  }
  if (sizing.targetGap !== undefined && sizing.targetGap !== 0) {
    const gap = sizing.targetGap;
    out.push(
      finding(
        'cells-against-target',
        gap < 0 ? 'warning' : 'info',
        'operating-point.cells',
        `the ${sizing.cells} cells ${gap < 0 ? 'fall short of' : 'exceed'} the target by ${(Math.abs(gap) * 100).toFixed(2)} % (accepted within ${AGREEMENT * 100} %)`,
        [inputs.size.kind === 'hydrogen' ? 'operating-point.target-hydrogen' : 'operating-point.target-power'],
      ),
    );
  }
  return out;
}
