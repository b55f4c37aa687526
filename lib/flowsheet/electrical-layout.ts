/**
 * Electrical layout of the cells: cells in series in a stack, stacks in series in a string,
 * strings in parallel on the DC bus, and the power conversion between the bus and the grid.
 * Series elements carry one current and add their voltages; parallel strings share one
 * voltage and add their currents (Kirchhoff's laws):
 *   stack:   V_stack  = N_cells/stack · V_cell        I_stack  = I_cell
 *   string:  V_string = N_stacks/string · V_stack    I_string = I_cell
 *   bus:     V_bus    = V_string                      I_bus    = N_strings · I_cell
 *   P_DC = V_bus · I_bus = N_installed · V_cell · I_cell
 *   AC:      power mode (inverter)       P_AC = η_conv · P_DC   (delivered)
 *            electrolysis (rectifier)    P_AC = P_DC / η_conv   (drawn)
 * Stacks in series, when not given, is the least whole number that keeps the bus at or above
 * the window's minimum at the lowest cell voltage; it must then keep the bus at or below its
 * maximum at the highest cell voltage:
 *   N_series = ⌈V_bus,min / (N_cells/stack · V_cell,min)⌉,  N_series · N_cells/stack · V_cell,max ≤ V_bus,max
 * Strings in parallel, when not given, is the least number whose cells cover the requirement:
 *   N_strings = ⌈⌈N_required / N_cells/stack⌉ / N_series⌉.
 * (Circuit laws; the bus-window sizing is the usual practice of matching a string to an
 * inverter's or rectifier's DC input range, common practice, no source.)
 */
import type { Mode } from '../electrochem/technologies.ts';
import { FlowsheetInputError } from './input-error.ts';

/** A voltage range, V. */
export interface VoltageRangeV {
  minV: number;
  maxV: number;
}

export interface LayoutRequest {
  mode: Mode;
  /** Cells the design needs (the stack sizing's count), a whole number ≥ 1. */
  requiredCells: number;
  /** Cells in series in one stack (the stack's design), a whole number ≥ 1. */
  cellsPerStack: number;
  /** One cell's voltage at the design point, V. */
  cellVoltageV: number;
  /** One cell's current at the design point (j · A), A. */
  cellCurrentA: number;
  /** The cell voltage's range over the operating range (load, life), V; default the design point alone. */
  cellVoltageRangeV?: VoltageRangeV;
  /** Stacks in series per string; derived from busVoltageWindowV when not given. */
  stacksInSeries?: number;
  /** Strings in parallel on the bus; derived from requiredCells when not given. */
  stringsInParallel?: number;
  /** The DC bus voltage window the strings must stay within over cellVoltageRangeV, V. */
  busVoltageWindowV?: VoltageRangeV;
  /** Inverter (power mode) or rectifier (electrolysis) efficiency, in (0, 1]. */
  conversionEfficiency: number;
}

export interface ElectricalLayout {
  cellsPerStack: number;
  stacksInSeries: number;
  stringsInParallel: number;
  /** stacksInSeries · stringsInParallel. */
  stackCount: number;
  requiredCells: number;
  /** stackCount · cellsPerStack ≥ requiredCells. */
  installedCells: number;
  stacksInSeriesFrom: 'given' | 'bus-voltage-window';
  stringsInParallelFrom: 'given' | 'required-cells';
  cellVoltageV: number;
  cellCurrentA: number;
  /** One stack: its terminal voltage and the current through it (= one cell's). */
  stackVoltageV: number;
  stackCurrentA: number;
  stackPowerW: number;
  /** One string of stacks in series. */
  stringVoltageV: number;
  stringCurrentA: number;
  /** The DC bus: the strings' voltage and the sum of their currents. */
  busVoltageV: number;
  busCurrentA: number;
  /** The bus voltage at the ends of the cell-voltage range, V. */
  busVoltageRangeV: VoltageRangeV;
  /** DC power at the bus: delivered by the stacks (power mode) or taken by them (electrolysis), W. */
  dcPowerW: number;
  conversionEfficiency: number;
  /** AC power at the grid side: delivered (power mode, η · P_DC) or drawn (electrolysis, P_DC / η), W. */
  acPowerW: number;
  /** |P_AC − P_DC|, W: the heat of the inverter or rectifier. */
  conversionLossW: number;
}

function wholeNumber(field: string, value: number | undefined): void {
  if (value !== undefined && !(Number.isInteger(value) && value >= 1)) throw new FlowsheetInputError(field, `must be a whole number of at least 1, got ${value}`);
}

function validate(request: LayoutRequest): VoltageRangeV {
  wholeNumber('requiredCells', request.requiredCells);
  wholeNumber('cellsPerStack', request.cellsPerStack);
  wholeNumber('stacksInSeries', request.stacksInSeries);
  wholeNumber('stringsInParallel', request.stringsInParallel);
  if (!(request.cellVoltageV > 0)) throw new FlowsheetInputError('cellVoltageV', `must be positive, got ${request.cellVoltageV}`);
  if (!(request.cellCurrentA > 0) || !Number.isFinite(request.cellCurrentA)) throw new FlowsheetInputError('cellCurrentA', `must be positive, got ${request.cellCurrentA}`);
  if (!(request.conversionEfficiency > 0 && request.conversionEfficiency <= 1)) {
    throw new FlowsheetInputError('conversionEfficiency', `must lie in (0, 1], got ${request.conversionEfficiency}`);
  }
  const range = request.cellVoltageRangeV ?? { minV: request.cellVoltageV, maxV: request.cellVoltageV };
  if (!(range.minV > 0 && range.maxV >= range.minV)) throw new FlowsheetInputError('cellVoltageRangeV', `must have 0 < min ≤ max, got ${range.minV} V to ${range.maxV} V`);
  if (request.cellVoltageV < range.minV || request.cellVoltageV > range.maxV) {
    throw new FlowsheetInputError('cellVoltageRangeV', `(${range.minV} V to ${range.maxV} V) must contain the design cell voltage ${request.cellVoltageV} V`);
  }
  const window = request.busVoltageWindowV;
  if (window && !(window.minV > 0 && window.maxV > window.minV)) throw new FlowsheetInputError('busVoltageWindowV', `must have 0 < min < max, got ${window.minV} V to ${window.maxV} V`);
  if (request.stacksInSeries === undefined && !window) throw new FlowsheetInputError('stacksInSeries', 'must be given, or derived from a DC bus voltage window (busVoltageWindowV)');
  return range;
}

/** Stacks in series: given, or the least that reaches the window's minimum at the lowest cell voltage. */
function seriesStacks(request: LayoutRequest, range: VoltageRangeV): { count: number; from: ElectricalLayout['stacksInSeriesFrom'] } {
  if (request.stacksInSeries !== undefined) return { count: request.stacksInSeries, from: 'given' };
  const window = request.busVoltageWindowV!;
  return { count: Math.max(1, Math.ceil(window.minV / (request.cellsPerStack * range.minV) - 1e-12)), from: 'bus-voltage-window' };
}

/** The layout of the module comment. */
export function electricalLayout(request: LayoutRequest): ElectricalLayout {
  const range = validate(request);
  const series = seriesStacks(request, range);
  const stackRange = { minV: request.cellsPerStack * range.minV, maxV: request.cellsPerStack * range.maxV };
  const busVoltageRangeV = { minV: series.count * stackRange.minV, maxV: series.count * stackRange.maxV };
  const window = request.busVoltageWindowV;
  if (window && (busVoltageRangeV.minV < window.minV * (1 - 1e-12) || busVoltageRangeV.maxV > window.maxV * (1 + 1e-12))) {
    const bus = `a bus of ${busVoltageRangeV.minV.toPrecision(4)} V to ${busVoltageRangeV.maxV.toPrecision(4)} V over the cell voltage range`;
    const stacks = `${series.count} stacks in series of ${request.cellsPerStack} cells`;
    if (series.from === 'given') {
      throw new FlowsheetInputError('stacksInSeries', `(${series.count}) does not fit the bus window ${window.minV} V to ${window.maxV} V: ${stacks} give ${bus}`);
    }
    throw new FlowsheetInputError(
      'busVoltageWindowV',
      `(${window.minV} V to ${window.maxV} V) fits no whole number of stacks in series: ${stacks}, the fewest that reach its minimum, give ${bus}; widen the window or change the cells per stack`,
    );
  }
  const stacksNeeded = Math.ceil(request.requiredCells / request.cellsPerStack);
  const strings = request.stringsInParallel ?? Math.ceil(stacksNeeded / series.count);
  const installedCells = strings * series.count * request.cellsPerStack;
  if (installedCells < request.requiredCells) {
    throw new FlowsheetInputError('stringsInParallel', `(${strings}) is too few: ${strings} strings of ${series.count} stacks of ${request.cellsPerStack} cells install ${installedCells} cells, fewer than the ${request.requiredCells} required`);
  }
  const stackVoltageV = request.cellsPerStack * request.cellVoltageV;
  const busVoltageV = series.count * stackVoltageV;
  const busCurrentA = strings * request.cellCurrentA;
  const dcPowerW = busVoltageV * busCurrentA;
  const acPowerW = request.mode === 'power' ? dcPowerW * request.conversionEfficiency : dcPowerW / request.conversionEfficiency;
  return {
    cellsPerStack: request.cellsPerStack,
    stacksInSeries: series.count,
    stringsInParallel: strings,
    stackCount: strings * series.count,
    requiredCells: request.requiredCells,
    installedCells,
    stacksInSeriesFrom: series.from,
    stringsInParallelFrom: request.stringsInParallel === undefined ? 'required-cells' : 'given',
    cellVoltageV: request.cellVoltageV,
    cellCurrentA: request.cellCurrentA,
    stackVoltageV,
    stackCurrentA: request.cellCurrentA,
    stackPowerW: stackVoltageV * request.cellCurrentA,
    stringVoltageV: busVoltageV,
    stringCurrentA: request.cellCurrentA,
    busVoltageV,
    busCurrentA,
    busVoltageRangeV,
    dcPowerW,
    conversionEfficiency: request.conversionEfficiency,
    acPowerW,
    conversionLossW: Math.abs(acPowerW - dcPowerW),
  };
}
