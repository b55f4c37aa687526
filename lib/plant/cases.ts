/**
 * The operating cases of a basis on the hardware of its sizing case. The sizing case is evaluated
 * as any basis is (calculate.ts) and fixes the hardware: its cell count, the active area of a
 * cell and the cells' area-specific resistance at the beginning of life, at the sizing case's
 * temperature (given, or implied by a given voltage; a resistance law scales it from there).
 * Every other case is its own basis (the base values with its overrides, lib/basis/read-cases.ts)
 * evaluated with that hardware:
 *
 *   cells N                       those installed: the whole stacks of the sizing case's layout
 *                                 (N_inst ≥ the N_req the sizing case needs; layoutCases);
 *   active area A                 from the sizing case;
 *   resistance                    the sizing case's, unless the case gives its own cell-voltage or
 *                                 area-specific-resistance; its degradation on top;
 *   current density               the case's (its own, or the base current density when it states
 *                                 no load), or, for a target-power or target-hydrogen case, the
 *                                 current density at which the N cells meet it (case-load.ts).
 *
 * So each case's results are exactly those of a basis written with the case's values, the
 * installed cell count, the sizing case's active area and resistance, and that current density (the tests
 * check this). Its plant (calculate.ts casePlant) is that basis's plant with the sizing case's
 * electrical layout (cells per stack, stacks in series, strings in parallel) given. A case that cannot run there (no current density meets its target, a voltage
 * beyond the reversible limit, a fuel that cannot reach its utilization) is a critical finding
 * of that case, `case-cannot-run`, with its figures null; the basis still calculates.
 *
 * Cases that share the fuel path's inputs (the same feeds, utilization, temperature and pressures:
 * StageMemo) share its fuel path and carbon margin, which do not depend on the load or the
 * resistance, and cases
 * on the same dry fuel at the same temperature and pressure (the sizing case among them) share
 * its least carbon-free steam-to-carbon ratio, whatever their air side: each is evaluated once and
 * reused, which gives the same numbers as evaluating it again.
 */
import type { DesignBasis, OperatingCase } from '../basis/types.ts';
import { BasisError } from '../basis/diagnostics.ts';
import { CalculationError, UserError } from '../core/errors.ts';
import { designInputs, type DesignInputs } from './design-inputs.ts';
import { cellRequest, cellVoltageOf, evaluateDesignPoint, fuelPathRequest, type DesignPoint, type UnitStage } from './design-point.ts';
import { unitFeeds, type UnitFeeds } from './unit-feeds.ts';
import { fuelPath, type FuelPath, type FuelPathRequest } from '../equilibrium/fuel-path.ts';
import { carbonMargin, type CarbonLimits } from './carbon-margin.ts';
import { currentDensityForTarget } from './case-load.ts';
import { locateCalculationErrors } from './located-error.ts';
import { finding, withAssumptions, type Finding } from './findings.ts';
import type { CaseResult } from './results-schema.ts';
import type { CasePointResults } from './calculate.ts';

/** The hardware the sizing case fixes. */
export interface Hardware {
  cells: number;
  activeAreaM2: number;
  /** Area-specific resistance at the beginning of life, at `temperatureK`, ohm m². */
  resistanceOhmM2: number;
  temperatureK: number;
}

function hardwareOf(point: DesignPoint): Hardware {
  return {
    cells: point.sizing.cells,
    activeAreaM2: point.inputs.activeAreaM2,
    resistanceOhmM2: point.degradation?.beginningOfLifeResistanceOhmM2 ?? point.voltage.areaSpecificResistanceOhmM2,
    temperatureK: point.inputs.temperatureK,
  };
}

/** Whether the case gives its own cell-voltage or area-specific-resistance. */
function ownResistance(c: OperatingCase): boolean {
  return c.overridden.includes('operating-point.cell-voltage') || c.overridden.includes('operating-point.area-specific-resistance');
}

/** The design inputs of a case on the hardware, at the current density its basis states. */
function caseInputs(c: OperatingCase, hardware: Hardware): DesignInputs {
  return onHardware(designInputs(c.basis), hardware, ownResistance(c));
}

/** Inputs on the hardware: its cells and active area, and its resistance unless the inputs give their own. */
function onHardware(own: DesignInputs, hardware: Hardware, ownResistance: boolean): DesignInputs {
  const inputs: DesignInputs = { ...own, size: { kind: 'cells', cells: hardware.cells }, activeAreaM2: hardware.activeAreaM2 };
  delete inputs.statedCells;
  if (!ownResistance) {
    inputs.voltage = { kind: 'area-specific-resistance', ohmM2: hardware.resistanceOhmM2 };
    if (own.resistanceLaw) inputs.resistanceLaw = { ...own.resistanceLaw, referenceTemperatureK: hardware.temperatureK };
  }
  return inputs;
}

/**
 * The sizing case on the installed hardware: the N_inst cells the layout installs (whole stacks,
 * N_inst ≥ N_req), with the sizing case's active area and resistance, at the sizing case's load.
 * Where N_inst = N_req the sizing point is itself on the installed hardware: it is that point.
 * Otherwise a sizing case that sizes its cells from a target (power or hydrogen) runs at the
 * current density at which the N_inst cells meet that target (case-load.ts), below its design
 * current density; one whose cells are given runs at its own current density. The sizing calculation (N_req = ⌈target / what one cell delivers at the
 * design current density⌉, sizing.ts) stays the top level of the results; this is the point the
 * plant is built for and the sizing case's entry among the cases, its bus and its envelope
 * values, so that no number of a case counts the required cells against the installed ones.
 */
export function installedPoint(sizing: DesignPoint, cells: number, stages: StageMemo = new StageMemo()): DesignPoint {
  if (cells === sizing.sizing.cells) return sizing;
  const from = sizing.sizing.from;
  const hardware = { ...hardwareOf(sizing), cells };
  let inputs = onHardware(sizing.inputs, hardware, false);
  const stage = stages.stage(inputs);
  if (from !== 'cells') {
    const size = sizing.inputs.size;
    const value = size.kind === 'power' ? size.powerW : size.kind === 'hydrogen' ? size.kgPerS : NaN;
    const solved = currentDensityForTarget(inputs, stage.path, cells, from, value);
    // N_inst ≥ N_req cells meet the target at the design current density, so a current density at or below it meets it on the installed cells.
    if (!solved.ok) throw new CalculationError(`the cells installed cannot meet the target of the sizing case: ${solved.message}`, 'cells');
    inputs = { ...inputs, currentDensityAPerM2: solved.currentDensityAPerM2 };
    return evaluateDesignPoint(inputs, stage, solved.cell);
  }
  return evaluateDesignPoint(inputs, stage);
}

/** Every field of the design inputs that unit-feeds.ts reads: cases with the same key have the same unit feeds. */
function feedsKey(i: DesignInputs): string {
  return JSON.stringify([i.technology.id, i.mode, i.temperatureK, i.fuelPressureBar, i.utilization, i.air, i.fuelFeed, i.airFeed, i.cathodeLoop, i.anodeRecycle, i.preReforming]);
}

/** The whole request of a fuel path (technology by its id; JSON numbers round-trip exactly): requests with the same key are the same request. */
function pathKey(request: FuelPathRequest): string {
  const { technology, seeds: _seeds, ...rest } = request;
  return JSON.stringify([technology.id, rest]);
}

/**
 * The unit feeds and fuel paths of one calculation, each kept under everything it is computed
 * from (feedsKey: the inputs unit-feeds.ts reads; pathKey: the fuel path's whole request), so that
 * a case whose inputs to them equal an earlier one's (the sizing case's first) takes that result
 * instead of solving the equilibria again: a case that changes only its load, its air-electrode
 * inlet temperature, the ambient or the degradation, for one. Both functions are pure, so the
 * results are the same bytes as when each is computed again (a test checks). A case that changes
 * the air ratio changes the air-electrode gas along the path, so the Nernst voltage of its fuel
 * path: it is computed again, but its fuel gas is the one an earlier path equilibrated, and it
 * takes those equilibria from the paths already found (fuel-path.ts `earlier`). A request with
 * seeds (a neighbouring path's equilibria to start from) is not kept, since its result depends on
 * them. `reuse: false` computes every stage.
 */
export class StageMemo {
  private readonly feeds = new Map<string, UnitFeeds>();
  private readonly paths = new Map<string, FuelPath>();
  /** The carbon margins found, by what they depend on (carbonKey): every round of layoutCases shares them. */
  readonly carbons = new Map<string, ReturnType<typeof carbonMargin>>();
  /** The fuel paths solved (not taken from the memo). */
  solved = 0;

  constructor(private readonly reuse = true) {}

  /** Keeps a stage already evaluated (the sizing case's) under its inputs. */
  keep(inputs: DesignInputs, stage: UnitStage): void {
    if (!this.reuse) return;
    this.feeds.set(feedsKey(inputs), stage.unit);
    const request = fuelPathRequest(inputs, stage.unit);
    if (!request.seeds) this.paths.set(pathKey(request), stage.path);
  }

  stage(inputs: DesignInputs): UnitStage {
    const fKey = feedsKey(inputs);
    let unit = this.reuse ? this.feeds.get(fKey) : undefined;
    if (!unit) {
      unit = unitFeeds(inputs);
      if (this.reuse) this.feeds.set(fKey, unit);
    }
    const request = fuelPathRequest(inputs, unit);
    const key = this.reuse && !request.seeds ? pathKey(request) : null;
    let path = key === null ? undefined : this.paths.get(key);
    if (!path) {
      // The fuel paths already found lend it their fuel-gas equilibria where it asks the same (a case that changes only the air side).
      path = fuelPath(request, this.reuse ? [...this.paths.values()] : []);
      this.solved++;
      if (key !== null) this.paths.set(key, path);
    }
    return { unit, path };
  }
}

/** What the carbon margin depends on: the fuel path and the unit feeds (the pre-reformer's), the dry fuel and the steam added. */
function carbonKey(i: DesignInputs, stage: UnitStage): string {
  return JSON.stringify([feedsKey(i), pathKey(fuelPathRequest(i, stage.unit)), i.dryFuel, i.steamToCarbon ?? null]);
}

/** A finding's paths where the case's file places them: a field the case overrides, at its override. */
export function caseFindings(findings: readonly Finding[], c: OperatingCase): Finding[] {
  if (!c.overridden.length) return [...findings];
  const place = (path: string) => {
    const key = c.overridden.find((k) => path === k || path.startsWith(`${k}.`));
    return key ? `cases.${c.id}.overrides.${path}` : path;
  };
  return findings.map((f) => ({ ...f, path: place(f.path), related: f.related.map(place) }));
}

/** Points of a case's curve: each is a uniform-voltage solve (about 1.5 ms), and the curves are smooth. */
const CURVE_POINTS = 12;

/** A curve's cells: the voltage and ionic current density at each of its current densities, up to the first where the cell has none. */
type CurveCells = { j: number; cellVoltageV: number; ionicCurrentDensityAPerM2: number }[];

/**
 * The curves' cells found in one calculation, by fuel path (the same object: the same E(u)) and by
 * everything else cellVoltageOf reads of the inputs held along a curve (curveKey): cases whose
 * curves have the same inputs (a turndown on the rated case's hardware, gas and law) solve them
 * once, and take the same numbers as solving them again.
 */
type CurveMemo = Map<FuelPath, Map<string, CurveCells>>;

/**
 * Every input of a curve's cells but its fuel path: the cell request (design-point.ts cellRequest:
 * mode, voltage model at the temperature, utilization, transference number, crossover) without
 * the path's fields and the current density, which the curve sets, with the degradation
 * (cellVoltageOf) and the highest current density.
 */
function curveKey(held: DesignInputs, path: FuelPath, jMax: number): string {
  const { profile: _profile, points: _points, inletNernstV: _inlet, currentDensityAPerM2: _j, ...rest } = cellRequest({ inputs: held, path });
  return JSON.stringify([rest, held.degradation ?? null, jMax]);
}

/** The cells of a curve (curveOf), from the memo where the same curve was solved before. */
function curveCells(held: DesignInputs, path: FuelPath, jMax: number, memo: CurveMemo): CurveCells {
  const key = curveKey(held, path, jMax);
  let byKey = memo.get(path);
  if (!byKey) memo.set(path, (byKey = new Map()));
  const known = byKey.get(key);
  if (known) return known;
  const out: CurveCells = [];
  for (let k = 1; k <= CURVE_POINTS; k++) {
    const j = (jMax * k) / CURVE_POINTS;
    let voltage;
    try {
      voltage = cellVoltageOf({ ...held, currentDensityAPerM2: j }, path).voltage;
    } catch (error) {
      if (error instanceof UserError) break;
      throw error;
    }
    if (!(voltage.cellVoltageV > 0)) break;
    out.push({ j, cellVoltageV: voltage.cellVoltageV, ionicCurrentDensityAPerM2: voltage.ionicCurrentDensityAPerM2 });
  }
  byKey.set(key, out);
  return out;
}

/**
 * The case's cell voltage and efficiency against current density, its fuel path, utilization and
 * resistance held (degradation included), over (0, jMax]. The efficiency follows from the case's
 * own by the flows' proportionality to the ionic current at fixed utilization:
 *   power:        η(j) = η_case · (j V(j) / j_ion(j)) / (j_c V_c / j_ion,c)
 *   electrolysis: η(j) = η_case · (j_ion(j) / (j V(j))) / (j_ion,c / (j_c V_c))
 * A current density at which the cell has no voltage ends the curve. A case whose voltage is
 * given runs along the curve on the resistance that voltage implies.
 */
function curveOf(point: DesignPoint, efficiency: number, jMax: number, memo: CurveMemo): CaseResult['curve'] {
  const power = point.inputs.mode === 'power';
  const ratio = (j: number, v: number, ionic: number) => (power ? (j * v) / ionic : ionic / (j * v));
  const own = ratio(point.inputs.currentDensityAPerM2, point.voltage.cellVoltageV, point.voltage.ionicCurrentDensityAPerM2);
  // A given voltage holds at its own current density only: along the curve the cell has the resistance it implies.
  const held: DesignInputs =
    point.inputs.voltage.kind === 'given'
      ? { ...point.inputs, voltage: { kind: 'area-specific-resistance', ohmM2: point.degradation?.beginningOfLifeResistanceOhmM2 ?? point.voltage.areaSpecificResistanceOhmM2 } }
      : point.inputs;
  return curveCells(held, point.path, jMax, memo).map((c) => ({
    currentDensity_A_per_m2: c.j,
    cellVoltage_V: c.cellVoltageV,
    efficiency: (efficiency * ratio(c.j, c.cellVoltageV, c.ionicCurrentDensityAPerM2)) / own,
  }));
}

function efficiencyOf(results: CasePointResults): number {
  return results.efficiency.electricalEfficiencyLhvNet ?? results.efficiency.electrolysisEfficiencyLhv!;
}

/** The case's figures, or nulls where it cannot run. */
type Figures = Omit<CaseResult, 'id' | 'title' | 'purpose' | 'sizing' | 'load' | 'overrides' | 'curve'> & { point: DesignPoint | null };

function ranFigures(results: CasePointResults, point: DesignPoint, resistance: CaseResult['resistance']): Figures {
  return { ran: true, resistance, ...results, point };
}

function notRun(c: OperatingCase, path: string, message: string): Figures {
  const placed = caseFindings(withAssumptions([finding('case-cannot-run', 'critical', path, `the case cannot run on the hardware of the sizing case: ${message}`)], c.basis), c);
  return {
    ran: false,
    resistance: null,
    conditions: null,
    headline: null,
    electrochemistry: null,
    operatingPoint: null,
    streams: [],
    efficiency: null,
    heat: null,
    carbon: null,
    supply: null,
    degradation: null,
    plant: null,
    findings: placed,
    point: null,
  };
}

type Assemble = (point: DesignPoint, basis: DesignBasis, carbon?: ReturnType<typeof carbonMargin>) => CasePointResults;

/** A case's point on the sizing case's hardware, before its sections are made (stageCases); null for the sizing case and a case that cannot run, whose figures are then given or to come. */
export interface StagedCase {
  case: OperatingCase;
  run: { point: DesignPoint; carbon: ReturnType<typeof carbonMargin>; resistance: CaseResult['resistance']; inputs: DesignInputs } | null;
  notRun: Figures | null;
}

/**
 * Phase one of the cases: each case's design point on the sizing case's hardware (`sizing`),
 * and its carbon margin. The plant around the stack is laid out for every case's cell voltage
 * (calculate.ts: the lowest and highest of them size the string against the DC bus window), so
 * the points come before any case's plant. `limits` are the least carbon-free steam-to-carbon
 * ratios found so far, which the cases share with the sizing case and add to.
 */
export function stageCases(cases: readonly OperatingCase[], sizing: DesignPoint, limits: CarbonLimits = new Map(), stages: StageMemo = new StageMemo(), installedCells = sizing.sizing.cells): StagedCase[] {
  const hardware = { ...hardwareOf(sizing), cells: installedCells };
  stages.keep(sizing.inputs, { unit: sizing.unit, path: sizing.path });
  return cases.map((c) => (c.sizing ? { case: c, run: null, notRun: null } : stageCase(c, hardware, stages, stages.carbons, limits)));
}

/** What `layoutCases` needs of the plant laid out over a cell-voltage range: the cells its whole stacks install, and how they are arranged. */
export interface LaidOut {
  electrical: { installedCells: number; cellsPerStack: number; stacksInSeries: number; stringsInParallel: number };
}

/** The most layouts `layoutCases` tries before it gives up: in practice the second is the first again. */
const LAYOUT_ROUNDS = 4;

/** A cell-voltage range, V. */
type Range = { minV: number; maxV: number };

/**
 * The cases on the installed hardware, the sizing case on it (installedPoint), and the plant laid
 * out for them. The sizing case finds the cells it needs, N_req, at its own design point; the
 * layout installs whole stacks, N_inst ≥ N_req (electrical-layout.ts); every case runs on the
 * N_inst cells installed, so that its stack, its flows and its DC bus count the same cells (its
 * target met by N_inst cells: j = what N_inst cells deliver it at). The layout sizes the string
 * over the cases' cell voltages, which depend on the cells they run on, so the two are solved
 * together: stage on N_req, lay out, stage again on the cells that layout installs, until the
 * layout installs the cells the cases ran on (the second round, as a rule). Starting from N_req
 * finds the fewest cells that settle: more than one layout can hold its own cases (on more
 * cells the cases' lowest cell voltage is higher and may take a stack fewer in series), and a
 * start from a larger guess can settle on a larger one. Each layout
 * holds the bus over the cell voltages of every round so far (a range that only widens), so the
 * fewest stacks in series only grow and the rounds cannot cycle: more cells raise the lowest cell
 * voltage, and a layout over that alone could take a stack fewer in series, install fewer cells,
 * and lower it again. The cases of a later round share the fuel paths of the first (StageMemo).
 * Refused at the DC bus window if the layouts do not settle within a few rounds.
 */
export function layoutCases<P extends LaidOut>(
  cases: readonly OperatingCase[],
  sizing: DesignPoint,
  limits: CarbonLimits,
  layout: (range: Range) => P,
): { staged: StagedCase[]; installed: DesignPoint; plant: P } {
  const stages = new StageMemo();
  let range: Range | null = null;
  let cells = sizing.sizing.cells;
  const seen: string[] = [];
  for (let round = 0; round < LAYOUT_ROUNDS; round++) {
    // The least carbon-free ratios do not depend on the cells: every round shares (and adds to) the same.
    const staged = stageCases(cases, sizing, limits, stages, cells);
    const installed = installedPoint(sizing, cells, stages);
    // The range of every round so far: it only widens, so the fewest stacks in series only grow and the layouts cannot cycle.
    const own = cellVoltageRange(sizing, staged, installed);
    range = range ? { minV: Math.min(range.minV, own.minV), maxV: Math.max(range.maxV, own.maxV) } : own;
    const plant = layout(range);
    const e = plant.electrical;
    if (e.installedCells === cells) return { staged, installed, plant };
    seen.push(`${e.stacksInSeries} × ${e.stringsInParallel} stacks of ${e.cellsPerStack} cells (${e.installedCells} cells)`);
    cells = e.installedCells;
  }
  throw new CalculationError(`the electrical layout does not settle over the cases' cell voltages on the cells it installs: ${seen.join(', then ')}; widen the window or state the stacks in series`, 'dc-bus-window');
}

/**
 * The cell voltages the sizing point, the sizing case on the installed cells and the cases that
 * run reach: the range the electrical layout must hold on its bus, V.
 */
export function cellVoltageRange(sizing: DesignPoint, staged: readonly StagedCase[], installed: DesignPoint = sizing): Range {
  const voltages = [sizing.voltage.cellVoltageV, installed.voltage.cellVoltageV, ...staged.flatMap((s) => (s.run ? [s.run.point.voltage.cellVoltageV] : []))];
  return { minV: Math.min(...voltages), maxV: Math.max(...voltages) };
}

/**
 * Every case of the basis, in its order (phase two): the sizing case on the installed hardware
 * (`installed`, layoutCases; its carbon margin that of the sizing point, whose fuel path it
 * shares), every other case from its staged point, each with its sections made by `assemble`
 * (calculate.ts casePointResults, with the plant on the sizing case's layout).
 */
export function caseResults(staged: readonly StagedCase[], sizing: DesignPoint, installed: { point: DesignPoint; carbon: ReturnType<typeof carbonMargin> }, assemble: Assemble): CaseResult[] {
  const hardware = hardwareOf(sizing);
  const sizingResistance = { from: 'case' as const, beginningOfLife_ohm_m2: hardware.resistanceOhmM2, referenceTemperature_K: hardware.temperatureK };
  const figures = staged.map((s): Figures => {
    if (s.case.sizing) {
      const results = assemble(installed.point, s.case.basis, installed.carbon);
      return ranFigures({ ...results, findings: caseFindings(results.findings, s.case) }, installed.point, sizingResistance);
    }
    if (!s.run) return s.notRun!;
    const { point, carbon, resistance, inputs } = s.run;
    const results = assemble(point, s.case.basis, carbon);
    return ranFigures({ ...results, findings: caseFindings(results.findings, s.case) }, point, resistance ?? { from: 'case', beginningOfLife_ohm_m2: point.degradation?.beginningOfLifeResistanceOhmM2 ?? point.voltage.areaSpecificResistanceOhmM2, referenceTemperature_K: inputs.temperatureK });
  });
  // The curves span the current densities of all the cases that ran, a quarter beyond the highest.
  const jMax = 1.25 * Math.max(...figures.map((f) => f.operatingPoint?.currentDensity_A_per_m2 ?? 0));
  const curves: CurveMemo = new Map();
  return staged.map(({ case: c }, k) => {
    const { point, ...f } = figures[k]!;
    return {
      id: c.id,
      title: c.title,
      purpose: c.purpose,
      sizing: c.sizing,
      load: c.load,
      overrides: c.overrides.map((o) => ({ path: o.path, text: o.text, source: o.source ?? null })),
      ...f,
      curve: point && f.ran ? curveOf(point, efficiencyOf(f as CasePointResults), jMax, curves) : [],
    };
  });
}

function stageCase(c: OperatingCase, hardware: Hardware, stages: StageMemo, carbons: Map<string, ReturnType<typeof carbonMargin>>, limits: CarbonLimits): StagedCase {
  let inputs = caseInputs(c, hardware);
  const resistance: CaseResult['resistance'] = ownResistance(c)
    ? null
    : { from: 'sizing-case', beginningOfLife_ohm_m2: hardware.resistanceOhmM2, referenceTemperature_K: hardware.temperatureK };
  let point: DesignPoint;
  try {
    point = locateCalculationErrors(c.basis, () => {
      const stage = stages.stage(inputs);
      if (c.load === 'target-power' || c.load === 'target-hydrogen') {
        const size = c.basis.operatingPoint.size;
        const value = size.kind === 'power' ? size.powerW : size.kind === 'hydrogen' ? size.kgPerS : NaN;
        const solved = currentDensityForTarget(inputs, stage.path, hardware.cells, c.load === 'target-power' ? 'power' : 'hydrogen', value);
        if (!solved.ok) throw new TargetNotMet(`operating-point.${c.load}`, solved.message);
        inputs = { ...inputs, currentDensityAPerM2: solved.currentDensityAPerM2 };
        return evaluateDesignPoint(inputs, stage, solved.cell);
      }
      return evaluateDesignPoint(inputs, stage);
    });
  } catch (error) {
    if (error instanceof TargetNotMet) return { case: c, run: null, notRun: notRun(c, error.path, error.message) };
    if (error instanceof BasisError) return { case: c, run: null, notRun: notRun(c, error.errors[0]!.path, error.errors.map((e) => e.message).join('; ')) };
    throw error;
  }
  const key = carbonKey(inputs, point);
  let carbon = carbons.get(key);
  if (!carbon) {
    carbon = carbonMargin(point, limits);
    carbons.set(key, carbon);
  }
  return { case: c, run: { point, carbon, resistance, inputs }, notRun: null };
}

/** A target no current density meets on the hardware, at the target's field. */
class TargetNotMet extends Error {
  constructor(
    readonly path: string,
    message: string,
  ) {
    super(message);
  }
}
