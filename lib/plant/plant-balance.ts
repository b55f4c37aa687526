/**
 * The plant around the stack (issue 18), built on the design point: the electrical layout
 * (lib/flowsheet/electrical-layout.ts), and the heat-and-material balance of numbered streams
 * with a first-law balance over the plant, one module a block:
 *  - power plant (power-plant.ts): steam raising (steam-raising.ts), fuel preheat, pre-reformer,
 *    air blower and preheat, the stack's outlets (power-feeds.ts); the off-gas oxidiser
 *    (off-gas-oxidiser.ts), or a carbonate cell's cathode-gas loop in its place
 *    (power-cathode-loop.ts); heat recovery and combined heat and power (power-heat-recovery.ts);
 *  - electrolysis plant (electrolysis-plant.ts): feed water, steam and sweep, the water loop, the
 *    stack heat supplied or removed, the specific energy; hydrogen compression
 *    (hydrogen-compression.ts).
 * The streams and duties are written on one sheet (plant-sheet.ts), whose module comment states
 * the enthalpy convention: absolute enthalpies, H = Σ ṅ_i h°_i(T), a duty Q = H_out − H_in.
 */
import { CalculationError, type CalculationInput } from '../core/errors.ts';
import type { PlantInput } from '../basis/types.ts';
import { electricalLayout, type ElectricalLayout } from '../flowsheet/electrical-layout.ts';
import { FlowsheetInputError } from '../flowsheet/input-error.ts';
import type { DesignPoint } from './design-point.ts';
import type { Finding } from './findings.ts';
import type { PlantBalance } from './plant-balance-types.ts';
import { powerBalance } from './power-plant.ts';
import { electrolysisBalance } from './electrolysis-plant.ts';

export type { ElectrodeSteam, ElectrolysisPlantBalance, PlantBalance, PlantDuty, PlantStream, PowerPlantBalance, SteamRaising } from './plant-balance-types.ts';
export { stageCount } from './hydrogen-compression.ts';

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
function layoutOf(point: DesignPoint, plant: PlantInput, cellVoltageRangeV?: { minV: number; maxV: number }): PlantBalance['electrical'] {
  const e = plant.electrical;
  const cells = point.sizing.cells;
  try {
    const layout = electricalLayout({
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
    return { ...layout, currentDensityAPerM2: point.inputs.currentDensityAPerM2 };
  } catch (error) {
    layoutError(error, e.busVoltageWindowV !== undefined);
  }
}

/**
 * The sizing case's layout (`layout`: cells per stack, stacks in series and strings in parallel,
 * found over the cases' cell voltages) carrying the cell voltage and current of a point on the
 * cells it installs (the sizing case at its load on them, cases.ts installedPoint): the bus, DC
 * and AC power of the installed cells, and the cells the sizing calculation required.
 */
export function installedLayout(point: DesignPoint, plant: PlantInput, layout: PlantBalance['electrical']): PlantBalance['electrical'] {
  const fixed = layoutOf(point, { ...plant, electrical: { cellsPerStack: layout.cellsPerStack, stacksInSeries: layout.stacksInSeries, stringsInParallel: layout.stringsInParallel } });
  return { ...fixed, requiredCells: layout.requiredCells, stacksInSeriesFrom: layout.stacksInSeriesFrom, stringsInParallelFrom: layout.stringsInParallelFrom };
}

/** The plant around the stack of a design point: the electrical layout, and the power plant's or the electrolysis plant's balance. */
export function plantBalance(point: DesignPoint, plant: PlantInput, cellVoltageRangeV?: { minV: number; maxV: number }): PlantBalance {
  const electrical = layoutOf(point, plant, cellVoltageRangeV);
  return { electrical, ...plantBlocks(point, plant) };
}

/**
 * `plantBalance` over one cell-voltage range after another (cases.ts layoutCases lays the plant
 * out a round at a time): only the electrical layout depends on the range, so the blocks are
 * balanced once, on the first call, and every layout shares them.
 */
export function plantOverRanges(point: DesignPoint, plant: PlantInput): (cellVoltageRangeV: { minV: number; maxV: number }) => PlantBalance {
  let blocks: Omit<PlantBalance, 'electrical'> | null = null;
  return (range) => {
    const electrical = layoutOf(point, plant, range);
    blocks ??= plantBlocks(point, plant);
    return { electrical, ...blocks };
  };
}

/** The power plant's or the electrolysis plant's balance of a design point, with its findings. */
function plantBlocks(point: DesignPoint, plant: PlantInput): Omit<PlantBalance, 'electrical'> {
  const findings: Finding[] = [];
  if (point.inputs.mode === 'power' && point.inputs.fuelFeed && point.inputs.airFeed) {
    const { balance, streams } = powerBalance(point, plant, findings);
    return { streams, power: balance, electrolysis: null, findings };
  }
  if (point.inputs.mode === 'electrolysis' && point.electrolysis) {
    const { balance, streams } = electrolysisBalance(point, plant, findings);
    return { streams, power: null, electrolysis: balance, findings };
  }
  const streams = point.streams.map((x, k) => ({ number: k + 1, id: x.id, name: x.name, temperatureK: x.temperatureK, pressureBar: x.pressureBar, flows: { ...x.flows } }));
  return { streams, power: null, electrolysis: null, findings };
}
