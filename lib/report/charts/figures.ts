/**
 * The figures of the curves-and-sensitivity section, each drawn from the results (sweeps, fuel path, sensitivities) with
 * the design point marked: voltages and efficiency limits against temperature, Nernst voltage
 * and gas composition along the fuel path, local current density and Nernst voltage along the
 * cell with its hot spot, carbon activity against steam-to-carbon ratio (or a statement where the
 * fuel has no carbon), polarisation, heat and power against current density, the stack at other
 * temperatures, the operating cases on their curves, and a tornado per headline result of the
 * sensitivity study, and where the fuel's energy (power) or the input's (electrolysis) goes in a plant with its balance.
 */
import type { Results } from '../../plant/results-schema.ts';
import { formatNumber, formatPercent } from '../format.ts';
import { jsonForScript } from './json-script.ts';
import { chartData, type ChartColumn, type ChartData } from './data-table.ts';
import type { Axis, ChartSpec, LineSeries } from './spec.ts';
import type { TrustedHtml } from '../trusted-html.ts';
import { speciesText } from '../species-text.ts';
import { ZERO_CELSIUS_K } from '../../core/units.ts';
import { hotSpot } from '../local-current.ts';

const CHART_WIDTH = 640;
const CHART_HEIGHT = 300;

export interface DrawnFigure {
  kind: 'chart';
  id: string;
  number: number;
  title: string;
  caption: string;
  width: number;
  height: number;
  spec: TrustedHtml;
  data: ChartData;
  /** Remarks under the chart (cases that could not be evaluated). */
  notes: string[];
}

export interface StatedFigure {
  kind: 'statement';
  id: string;
  number: number;
  title: string;
  statement: string;
}

export type Figure = DrawnFigure | StatedFigure;

type Draft = Omit<DrawnFigure, 'number' | 'spec' | 'width' | 'height' | 'kind'> & { spec: ChartSpec } | Omit<StatedFigure, 'number'>;

/** °C from K, rounded to the microkelvin so that 923.15 K reads 650 °C on an axis. */
const C = (k: number) => Math.round((k - ZERO_CELSIUS_K) * 1e6) / 1e6;

/**
 * A column of a chart's data: the numbers of the results (`raw`, in `unit`) in the CSV, and on
 * the page as the chart plots them (`show`: °C from K, % from a fraction, kW from W).
 */
function column(head: string, name: string, unit: string, raw: (number | null)[], show: (v: number) => number = (v) => v, digits?: number): ChartColumn {
  return { head, shown: raw.map((v) => (v === null ? null : show(v))), ...(digits === undefined ? {} : { digits }), data: { name, unit, values: raw } };
}

const temperatureColumn = (temperatures: number[]) => column('temperature (°C)', 'Temperature', 'K', temperatures, C, 5);
const percent = (v: number) => v * 100;
const perCm2 = (v: number) => v / 1e4;
const kilo = (v: number) => v / 1000;

function vertical(x: number, y0: number, y1: number, label: string): LineSeries {
  return { label, points: [[x, y0], [x, y1]], style: 0, dashed: true, reference: true };
}

function span(values: number[]): [number, number] {
  const finite = values.filter(Number.isFinite);
  return [Math.min(...finite), Math.max(...finite)];
}

/** The temperature axis over the sweep, in °C. */
function temperatureAxis(r: Results): Axis {
  const t = r.sweeps.temperature.map((p) => C(p.temperature_K));
  return { title: 'Temperature (°C)', min: Math.min(...t), max: Math.max(...t) };
}

function voltagesAgainstTemperature(r: Results): Draft {
  const s = r.sweeps.temperature;
  const fuel = s.some((p) => p.fuelReversibleVoltage_V !== null);
  const series: LineSeries[] = [
    { label: 'reversible voltage E° (H₂)', points: s.map((p) => [C(p.temperature_K), p.reversibleVoltage_V]), style: 0 },
    { label: 'thermoneutral voltage (H₂)', points: s.map((p) => [C(p.temperature_K), p.thermoneutralVoltage_V]), style: 1 },
  ];
  if (fuel) series.push({ label: 'reversible voltage of the fuel, −ΔG°/zF', points: s.filter((p) => p.fuelReversibleVoltage_V !== null).map((p) => [C(p.temperature_K), p.fuelReversibleVoltage_V!]), style: 2, dashed: true });
  const td = C(r.conditions.temperature_K);
  series.push({ label: 'design point: E°, thermoneutral and cell voltage at the operating temperature', points: [[td, r.electrochemistry.standardVoltage_V], [td, r.electrochemistry.thermoneutralVoltage_V], [td, r.headline.cellVoltage_V]], style: 0, marker: true });
  const columns: ChartColumn[] = [
    temperatureColumn(s.map((p) => p.temperature_K)),
    column('reversible voltage E° (V)', 'Reversible voltage E° (H2)', 'V', s.map((p) => p.reversibleVoltage_V), undefined, 5),
    column('thermoneutral voltage (V)', 'Thermoneutral voltage (H2)', 'V', s.map((p) => p.thermoneutralVoltage_V), undefined, 5),
  ];
  if (fuel) columns.push(column('fuel reversible voltage (V)', 'Reversible voltage of the fuel', 'V', s.map((p) => p.fuelReversibleVoltage_V), undefined, 5));
  return {
    id: 'fig-voltage-temperature',
    title: 'Reversible and thermoneutral voltage against temperature',
    caption: `Standard voltages of H₂ + ½O₂ → H₂O (${r.technology.waterPhase === 'liquid' ? 'liquid' : 'gaseous'} water, 1 bar) from the species data; the markers are the design point at ${formatNumber(td, 4)} °C.`,
    spec: { kind: 'line', x: temperatureAxis(r), y: { title: 'Voltage (V)' }, series },
    data: chartData('voltage-temperature', columns),
    notes: [],
  };
}

function limitsAgainstTemperature(r: Results): Draft {
  const s = r.sweeps.temperature;
  const pct = (v: number) => v * 100;
  const series: LineSeries[] = [];
  const columns: ChartColumn[] = [temperatureColumn(s.map((p) => p.temperature_K))];
  const add = (label: string, get: (p: (typeof s)[number]) => number | null, style: number, dashed = false) => {
    if (!s.some((p) => get(p) !== null)) return;
    series.push({ label, points: s.filter((p) => get(p) !== null).map((p) => [C(p.temperature_K), pct(get(p)!)]), style, dashed });
    columns.push(column(`${label} (%)`, label, '', s.map(get), pct));
  };
  const power = r.technology.mode === 'power';
  if (power) {
    add('limit of the fuel, LHV', (p) => p.limitLhv, 0);
    add('limit of the fuel, HHV', (p) => p.limitHhv, 2);
    add('limit of hydrogen, HHV', (p) => p.hydrogenLimitHhv, 1, true);
    add('Carnot, 1 − T₀/T', (p) => p.carnot, 3);
  } else {
    // An electrolyser is bounded the other way: it needs at least ΔG(T) of electric work (lib/plant/sweeps.ts).
    add('reversible electrolyser, LHV', (p) => p.electrolysisLimitLhv ?? null, 0);
    add('reversible electrolyser, HHV', (p) => p.electrolysisLimitHhv ?? null, 2);
  }
  const td = C(r.conditions.temperature_K);
  const eff = power ? r.headline.electricalEfficiencyLhv : r.efficiency.electrolysisEfficiencyLhv;
  if (eff !== null) series.push({ label: power ? 'design point: net electrical efficiency (LHV)' : 'design point: electrolysis efficiency over electricity alone (LHV)', points: [[td, pct(eff)]], style: 0, marker: true });
  const [lo, hi] = span(series.flatMap((x) => x.points.map((p) => p[1])));
  series.push(vertical(td, Math.max(0, lo - 5), power ? Math.min(105, hi + 5) : hi + 5, 'operating temperature'));
  return {
    id: 'fig-efficiency-temperature',
    title: 'Efficiency limits against temperature',
    caption: power
      ? `Thermodynamic limits −ΔG(T)/heating value and the Carnot efficiency between T and ${formatNumber(C(r.conditions.ambientTemperature_K), 3)} °C, with the design point.`
      : 'The efficiency over electricity alone of a reversible electrolyser, the heating value of hydrogen over ΔG(T) of splitting water (no cell needs less electric work than ΔG; above 100 % where the heat TΔS comes from the surroundings), with the design point. The fuel-cell limit −ΔG/HHV and the Carnot efficiency bound no electrolyser and are not drawn.',
    spec: { kind: 'line', x: temperatureAxis(r), y: { title: 'Efficiency (%)' }, series },
    data: chartData('efficiency-temperature', columns),
    notes: [],
  };
}

function pathAxis(r: Results): { title: string; label: string; name: string; design: string } {
  return r.technology.mode === 'power'
    ? { title: 'Fuel utilization (%)', label: 'fuel utilization (%)', name: 'Fuel utilization', design: 'design utilization' }
    : { title: 'Conversion of the feed (%)', label: 'conversion (%)', name: 'Conversion of the feed', design: 'design conversion' };
}

function nernstAlongPath(r: Results): Draft {
  const p = r.fuelPath.points;
  const finite = p.filter((x) => Number.isFinite(x.nernst_V));
  const uEnd = r.electrochemistry.utilization * 100;
  const axis = pathAxis(r);
  const series: LineSeries[] = [
    { label: 'local Nernst voltage', points: finite.map((x) => [x.utilization * 100, x.nernst_V]), style: 0 },
    { label: 'charge-mean Nernst voltage Ē', points: [[0, r.headline.meanNernst_V], [uEnd, r.headline.meanNernst_V]], style: 2, dashed: true },
    { label: 'area-mean Nernst voltage Ē_A', points: [[0, r.electrochemistry.areaMeanNernst_V], [uEnd, r.electrochemistry.areaMeanNernst_V]], style: 3, dashed: true },
    { label: 'cell voltage', points: [[0, r.headline.cellVoltage_V], [uEnd, r.headline.cellVoltage_V]], style: 1 },
    { label: `design point: outlet at the ${axis.design}`, points: [[uEnd, r.headline.outletNernst_V]], style: 0, marker: true },
  ];
  return {
    id: 'fig-nernst-path',
    title: 'Nernst voltage along the fuel path',
    caption: `Local Nernst voltage from inlet to outlet, its charge average (the Gibbs energy per charge), its area average (which sets the cell voltage) and the cell voltage; the marker is the outlet at ${formatPercent(r.electrochemistry.utilization, 3)}.`,
    spec: { kind: 'line', x: { title: axis.title, min: 0, max: uEnd }, y: { title: 'Voltage (V)' }, series },
    data: chartData('nernst-path', [
      column(axis.label, axis.name, '', p.map((x) => x.utilization), percent, 4),
      column('Nernst voltage (V)', 'Nernst voltage', 'V', p.map((x) => (Number.isFinite(x.nernst_V) ? x.nernst_V : null)), undefined, 5),
      column('carbon activity', 'Carbon activity', '', p.map((x) => x.carbonActivity), undefined, 4),
    ]),
    notes: inletNotes(r),
  };
}

/** What the first point of the path stands for where the inlet has no product (fuelPath.inlet). */
function inletNotes(r: Results): string[] {
  if (r.fuelPath.inlet === 'limit') {
    return ['One electrode is fed nothing, so at the inlet it holds no gas: the value shown at 0 % is the limit of the Nernst voltage as the first charge fills it with pure product (u → 0⁺), not the voltage of a gas present there.'];
  }
  if (r.fuelPath.inlet === 'first-increment') {
    return [
      `The inlet gas holds none of the product, so the Nernst voltage is unbounded at 0 % (it rises like −RT/2F ln u, while its integrals stay finite); the curve starts at the first equilibrated increment, ${formatPercent(r.fuelPath.inletUtilization, 3)}, whose value the results give for the inlet.`,
    ];
  }
  return [];
}

/** Local current density (left) and Nernst voltage (right) against the share of the active area from the inlet, with the hot spot marked. */
function currentAlongCell(r: Results): Draft {
  const p = r.fuelPath.points;
  const area = p.map((x) => x.areaFraction * 100);
  const i = p.map((x) => x.currentDensity_A_per_m2 / 1e4);
  const j = r.operatingPoint.currentDensity_A_per_m2 / 1e4;
  const { index, point } = hotSpot(r);
  const max = r.headline.maxLocalCurrentDensity_A_per_m2 / 1e4;
  const power = r.technology.mode === 'power';
  const axis = pathAxis(r);
  const where = index === 0 ? 'at the inlet' : `at ${formatNumber(point.areaFraction * 100, 3)} % of the area`;
  return {
    id: 'fig-current-cell',
    title: 'Local current density and Nernst voltage along the cell',
    caption: `The cell at one voltage ${formatNumber(r.headline.cellVoltage_V, 4)} V: the local current density at the terminals (left axis) follows the ${power ? 'excess of the local Nernst voltage over the cell voltage' : 'excess of the cell voltage over the local Nernst voltage'} (right axis), so ${power ? 'the inlet, where E is highest,' : 'the inlet, where E is lowest,'} carries the most current and the outlet the least. The highest local current density, ${formatNumber(max, 4)} A/cm² ${where}, is ${formatNumber(max / j, 3)} times the mean ${formatNumber(j, 4)} A/cm² (the hot spot, marked).`,
    spec: {
      kind: 'line',
      x: { title: 'Active area from the inlet (%)', min: 0, max: 100 },
      y: { title: 'Local current density (A/cm²)', min: 0 },
      y2: { title: 'Voltage (V)' },
      series: [
        { label: 'local current density', points: p.map((x, k) => [area[k]!, i[k]!]), style: 0 },
        { label: 'mean current density j', points: [[0, j], [100, j]], style: 0, dashed: true, reference: true },
        { label: 'local Nernst voltage', points: p.map((x, k) => [area[k]!, x.nernst_V]), style: 1, right: true },
        { label: 'cell voltage', points: [[0, r.headline.cellVoltage_V], [100, r.headline.cellVoltage_V]], style: 2, right: true, dashed: true },
        { label: 'hot spot: highest local current density', points: [[point.areaFraction * 100, max]], style: 0, marker: true },
      ],
    },
    data: chartData('current-cell', [
      column('active area from the inlet (%)', 'Active area from the inlet', '', p.map((x) => x.areaFraction), percent, 4),
      column(axis.label, axis.name, '', p.map((x) => x.utilization), percent, 4),
      column('local current density (A/cm²)', 'Local current density', 'A/m2', p.map((x) => x.currentDensity_A_per_m2), perCm2, 4),
      column('Nernst voltage (V)', 'Nernst voltage', 'V', p.map((x) => x.nernst_V), undefined, 5),
    ]),
    notes: inletNotes(r),
  };
}

function compositionAlongPath(r: Results): Draft {
  const p = r.fuelPath.points;
  const axis = pathAxis(r);
  const peak = (side: 'fuelSide' | 'airSide', k: string) => Math.max(...p.map((x) => x[side][k] ?? 0));
  const fuel = Object.keys(p[0]!.fuelSide).filter((k) => peak('fuelSide', k) >= 0.01).sort((a, b) => peak('fuelSide', b) - peak('fuelSide', a));
  const air = ['O2', 'H2O', 'CO2'].filter((k) => (p[0]!.airSide[k] ?? 0) > 0 && peak('airSide', k) >= 0.01);
  const series: LineSeries[] = [
    ...fuel.map((k, i): LineSeries => ({ label: `${speciesText(k)}, fuel electrode`, points: p.map((x) => [x.utilization * 100, (x.fuelSide[k] ?? 0) * 100]), style: i })),
    ...air.map((k, i): LineSeries => ({ label: `${speciesText(k)}, air electrode`, points: p.map((x) => [x.utilization * 100, (x.airSide[k] ?? 0) * 100]), style: fuel.length + i, dashed: true })),
  ];
  const uEnd = r.electrochemistry.utilization * 100;
  series.push(vertical(uEnd, 0, 100, axis.design));
  // On the page a species absent from a point reads 0; in the data it is an empty field, as the results hold no number for it.
  const side = (k: string, where: 'fuelSide' | 'airSide', label: string): ChartColumn => ({
    head: `${speciesText(k)} ${label} side (mol %)`,
    shown: p.map((x) => (x[where][k] ?? 0) * 100),
    data: { name: `Mole fraction ${k}, ${label} side`, unit: 'mol/mol', values: p.map((x) => x[where][k] ?? null) },
  });
  const columns: ChartColumn[] = [column(axis.label, axis.name, '', p.map((x) => x.utilization), percent), ...fuel.map((k) => side(k, 'fuelSide', 'fuel')), ...air.map((k) => side(k, 'airSide', 'air'))];
  return {
    id: 'fig-composition-path',
    title: 'Gas composition along the fuel path',
    caption: `Mole fractions of the species that reach 1 % (solid: fuel electrode${r.technology.fuelGasEquilibrium ? ', equilibrated' : ''}; dashed: air electrode), with the ${axis.design} marked.`,
    spec: { kind: 'line', x: { title: axis.title, min: 0, max: uEnd }, y: { title: 'Mole fraction (%)', min: 0, max: 100 }, series },
    data: chartData('composition-path', columns),
    notes: [],
  };
}

function carbonAgainstSteam(r: Results): Draft {
  const s = r.sweeps.steamToCarbon;
  const id = 'fig-carbon-steam';
  const title = 'Carbon activity against steam-to-carbon ratio';
  if (!s.length) {
    const statement =
      r.technology.mode !== 'power'
        ? 'In electrolysis there is no fuel to reform, so the steam-to-carbon ratio does not apply and no carbon-activity curve is drawn.'
        : r.carbon.maxCarbonActivity === null && r.carbon.minimumSteamToCarbonStack === null
          ? 'The fuel contains no carbon, so carbon cannot deposit and there is no carbon-activity curve to draw.'
          : 'The basis adds steam per mole of fuel rather than by steam-to-carbon ratio, so no sweep over the ratio is made; the carbon activities along the fuel path are in the table of the Nernst-voltage figure.';
    return { kind: 'statement', id, title, statement };
  }
  const series: LineSeries[] = [{ label: 'equilibrated fuel gas at the stack temperature', points: s.map((p) => [p.steamToCarbon, p.carbonActivityStack]), style: 0 }];
  const pre = s.some((p) => p.carbonActivityPreReformer !== null);
  if (pre) series.push({ label: 'at the pre-reformer temperature', points: s.filter((p) => p.carbonActivityPreReformer !== null).map((p) => [p.steamToCarbon, p.carbonActivityPreReformer!]), style: 1 });
  const x = s.map((p) => p.steamToCarbon);
  series.push({ label: 'carbon limit: activity 1', points: [[Math.min(...x), 1], [Math.max(...x), 1]], style: 0, dashed: true, reference: true });
  const sc = r.carbon.steamToCarbon;
  const marks: [number, number][] = [];
  if (sc !== null && r.carbon.inletCarbonActivity !== null && r.carbon.inletCarbonActivity > 0) marks.push([sc, r.carbon.inletCarbonActivity]);
  if (sc !== null && r.carbon.preReformerCarbonActivity !== null && r.carbon.preReformerCarbonActivity > 0) marks.push([sc, r.carbon.preReformerCarbonActivity]);
  if (marks.length) series.push({ label: 'design point: design steam-to-carbon ratio', points: marks, style: 0, marker: true });
  const columns: ChartColumn[] = [
    column('steam-to-carbon ratio', 'Steam-to-carbon ratio', '', x),
    column('carbon activity at the stack temperature', 'Carbon activity at the stack temperature', '', s.map((p) => p.carbonActivityStack)),
  ];
  if (pre) columns.push(column('carbon activity at the pre-reformer temperature', 'Carbon activity at the pre-reformer temperature', '', s.map((p) => p.carbonActivityPreReformer)));
  return {
    id,
    title,
    caption: `Carbon activity of the feed brought to equilibrium, on a logarithmic scale; above 1 graphite can deposit.${sc !== null ? ` The design ratio is ${formatNumber(sc)}.` : ''}`,
    spec: { kind: 'line', x: { title: 'Steam-to-carbon ratio (mol H₂O per mol C)' }, y: { title: 'Carbon activity (relative to graphite)', log: true }, series },
    data: chartData('carbon-steam', columns),
    notes: [],
  };
}

function jAxis(): Axis {
  return { title: 'Current density (A/cm²)', min: 0 };
}

function polarisation(r: Results): Draft {
  const s = r.sweeps.currentDensity;
  const j = r.operatingPoint.currentDensity_A_per_m2 / 1e4;
  return {
    id: 'fig-polarisation',
    title: 'Cell voltage against current density',
    caption: `The uniform-voltage cell at the ${pathAxis(r).design} and area-specific resistance (${formatNumber(r.electrochemistry.areaSpecificResistance_ohm_m2 * 1e4)} Ω cm²), the voltage solved again at each current density; the dashed line is the area-mean driving voltage at the design point.`,
    spec: {
      kind: 'line',
      x: jAxis(),
      y: { title: 'Cell voltage (V)' },
      series: [
        { label: 'cell voltage', points: s.map((p) => [p.currentDensity_A_per_m2 / 1e4, p.cellVoltage_V]), style: 0 },
        { label: r.technology.mode === 'power' ? 'area-mean driving voltage at the design point, t_ion Ē_A − ΔV_x' : 'area-mean driving voltage at the design point, t_ion Ē_A', points: [[0, r.electrochemistry.effectiveNernst_V], [Math.max(j, ...s.map((p) => p.currentDensity_A_per_m2 / 1e4)), r.electrochemistry.effectiveNernst_V]], style: 2, dashed: true },
        { label: 'design point', points: [[j, r.headline.cellVoltage_V]], style: 0, marker: true },
      ],
    },
    data: chartData('polarisation', [
      column('current density (A/cm²)', 'Current density', 'A/m2', s.map((p) => p.currentDensity_A_per_m2), perCm2),
      column('cell voltage (V)', 'Cell voltage', 'V', s.map((p) => p.cellVoltage_V), undefined, 5),
    ]),
    notes: [],
  };
}

function heatAndPower(r: Results): Draft {
  const s = r.sweeps.currentDensity;
  const j = r.operatingPoint.currentDensity_A_per_m2 / 1e4;
  const power = r.technology.mode === 'power';
  return {
    id: 'fig-heat-power',
    title: 'Heat release and power against current density',
    caption: `Stack ${power ? 'DC output' : 'power input'} (left axis) and isothermal stack heat (right axis, negative: heat needed) of the ${formatNumber(r.headline.cells)} cells, with the design point.`,
    spec: {
      kind: 'line',
      x: jAxis(),
      y: { title: power ? 'Stack DC power (kW)' : 'Stack power input (kW)' },
      y2: { title: 'Stack heat (kW)' },
      series: [
        { label: power ? 'stack DC power' : 'stack power input', points: s.map((p) => [p.currentDensity_A_per_m2 / 1e4, p.stackPower_W / 1000]), style: 0 },
        { label: 'stack heat', points: s.map((p) => [p.currentDensity_A_per_m2 / 1e4, p.stackHeat_W / 1000]), style: 1, right: true, dashed: true },
        { label: 'design point: power', points: [[j, r.headline.stackPower_W / 1000]], style: 0, marker: true },
        { label: 'design point: heat', points: [[j, r.headline.stackHeat_W / 1000]], style: 0, marker: true, right: true },
      ],
    },
    data: chartData('heat-power', [
      column('current density (A/cm²)', 'Current density', 'A/m2', s.map((p) => p.currentDensity_A_per_m2), perCm2),
      column('stack power (kW)', power ? 'Stack DC power' : 'Stack power input', 'W', s.map((p) => p.stackPower_W), kilo),
      column('stack heat (kW)', 'Stack heat released, isothermal (negative: needed)', 'W', s.map((p) => p.stackHeat_W), kilo),
    ]),
    notes: [],
  };
}

/**
 * What the studies at other temperatures hold the resistance to: its Arrhenius law, or its design
 * value where the basis gives none (then a colder stack shows no rise in resistance), and the
 * activation loss held at its values, said beside every figure that varies the stack temperature.
 */
function resistanceNote(r: Results): string {
  const kinetic = r.electrochemistry.activationLoss
    ? ' The activation loss keeps its Tafel slope and exchange current density at every temperature (the basis gives no temperature law for them), so it does not grow as the stack cools either.'
    : '';
  return `${ohmicNote(r)}${kinetic}`;
}

/** The resistance's part of resistanceNote. */
function ohmicNote(r: Results): string {
  const law = r.electrochemistry.resistanceLaw;
  if (!law) {
    return 'The area-specific resistance is held at its design value at every temperature: the basis gives no resistance-temperature law (operating-point.resistance-temperature-law), so these figures show only the thermodynamic effect of temperature, while a real cell\'s resistance rises as it cools.';
  }
  return `The area-specific resistance follows the Arrhenius law of the basis, ASR(T) = ASR(T_ref) exp[(E_a/R)(1/T − 1/T_ref)] with E_a = ${formatNumber(law.activationEnergy_J_per_mol / 1000, 4)} kJ/mol and T_ref = ${formatNumber(C(law.referenceTemperature_K), 4)} °C (${law.source}).`;
}

/** Cell voltage and efficiency of the same stack at other temperatures (cells, current density and utilization held). */
function stackAgainstTemperature(r: Results): Draft | null {
  const s = r.sweeps.stackTemperature;
  if (s.length < 2) return null;
  const power = r.technology.mode === 'power';
  const t = s.map((p) => C(p.temperature_K));
  const td = C(r.conditions.temperature_K);
  const eff = power ? r.headline.electricalEfficiencyLhv : r.efficiency.electrolysisEfficiencyLhv;
  const series: LineSeries[] = [
    { label: 'cell voltage', points: s.map((p) => [C(p.temperature_K), p.cellVoltage_V]), style: 0 },
    { label: power ? 'net electrical efficiency (LHV)' : 'electrolysis efficiency (LHV)', points: s.map((p) => [C(p.temperature_K), p.efficiency * 100]), style: 1, right: true, dashed: true },
    { label: 'design point: cell voltage', points: [[td, r.headline.cellVoltage_V]], style: 0, marker: true },
  ];
  if (eff !== null) series.push({ label: 'design point: efficiency', points: [[td, eff * 100]], style: 0, marker: true, right: true });
  return {
    id: 'fig-stack-temperature',
    title: 'The stack at other temperatures',
    caption: `The same ${formatNumber(r.headline.cells)} cells at the design current density and ${power ? 'utilization' : 'conversion'}, the cell voltage solved again at each stack temperature; the markers are the design point.`,
    spec: { kind: 'line', x: { title: 'Stack temperature (°C)', min: Math.min(...t), max: Math.max(...t) }, y: { title: 'Cell voltage (V)' }, y2: { title: 'Efficiency (%)' }, series },
    data: chartData('stack-temperature', [
      column('stack temperature (°C)', 'Stack temperature', 'K', s.map((p) => p.temperature_K), C, 5),
      column('area-specific resistance (Ω cm²)', 'Area-specific resistance', 'ohm m2', s.map((p) => p.areaSpecificResistance_ohm_m2), (v) => v * 1e4, 4),
      column('cell voltage (V)', 'Cell voltage', 'V', s.map((p) => p.cellVoltage_V), undefined, 5),
      column('efficiency (%)', power ? 'Net electrical efficiency, LHV' : 'Electrolysis efficiency, LHV', '', s.map((p) => p.efficiency), percent, 4),
      column('stack heat (kW)', 'Stack heat released, isothermal (negative: needed)', 'W', s.map((p) => p.stackHeat_W), kilo, 4),
    ]),
    notes: [resistanceNote(r)],
  };
}

type Output = 'cellVoltage_V' | 'efficiency' | 'stackHeat_W';

/**
 * Axis limits centred on zero that hold every value, on a 1-2-5 step, with a tick spacing that
 * divides them (±5 by 1, ±2 by 0.5), so that no odd tick stands beside a limit (−5, −4, −2, ...).
 */
function symmetric(values: number[]): { min: number; max: number; step: number } {
  const peak = Math.max(...values.map(Math.abs));
  const power = 10 ** Math.floor(Math.log10(peak));
  // Up to 20 × the power of ten: a peak just under the next power (0.994) with its 5 % margin needs it.
  const [limit, tick] = ([[1, 0.2], [2, 0.5], [2.5, 0.5], [5, 1], [10, 2], [20, 5]] as const).find(([k]) => k * power >= peak * 1.05)!;
  return { min: -limit * power, max: limit * power, step: tick * power };
}

function tornado(r: Results, output: Output): Draft {
  const power = r.technology.mode === 'power';
  const meta: Record<Output, { title: string; axis: string; scale: number; file: string; result: string; unit: string }> = {
    cellVoltage_V: { title: 'Sensitivity of the cell voltage', axis: 'Change of the cell voltage (mV)', scale: 1000, file: 'voltage', result: 'Cell voltage', unit: 'V' },
    efficiency: {
      title: power ? 'Sensitivity of the net electrical efficiency' : 'Sensitivity of the electrolysis efficiency',
      axis: 'Change of the efficiency (percentage points)',
      scale: 100,
      file: 'efficiency',
      result: power ? 'Net electrical efficiency, LHV' : 'Electrolysis efficiency, LHV',
      unit: '',
    },
    stackHeat_W: { title: 'Sensitivity of the stack heat', axis: 'Change of the stack heat (kW)', scale: 0.001, file: 'heat', result: 'Stack heat released, isothermal', unit: 'W' },
  };
  const m = meta[output];
  const list = r.sensitivities;
  // Differences at rounding level (a result that does not depend on the input) count as none.
  const delta = (v: number | null, base: number) => (v === null || Math.abs(v - base) <= 1e-9 * Math.max(Math.abs(base), 1e-12) ? 0 : (v - base) * m.scale);
  const low = list.map((e) => delta(e[output].low, e[output].base));
  const high = list.map((e) => delta(e[output].high, e[output].base));
  const labels = list.map((e) => `${e.input} ${e.step}`);
  const notes = list.filter((e) => e.note !== null && (e[output].low === null || e[output].high === null)).map((e) => `${e.input}: ${e.note}`);
  if (list.some((e) => e.path === 'conditions.operating-temperature')) notes.push(`Operating temperature: ${resistanceNote(r)}`);
  const base = list[0]?.[output].base;
  if ([...low, ...high].every((d) => d === 0)) {
    return {
      kind: 'statement',
      id: `fig-tornado-${m.file}`,
      title: m.title,
      statement: `None of the inputs studied moves the ${output === 'efficiency' ? 'efficiency' : output === 'cellVoltage_V' ? 'cell voltage' : 'stack heat'} by more than rounding: it does not depend on them at this design point, so there are no bars to draw.`,
    };
  }
  return {
    id: `fig-tornado-${m.file}`,
    title: m.title,
    caption: `Change from the base case${base === undefined ? '' : ` (${output === 'cellVoltage_V' ? `${formatNumber(base, 5)} V` : output === 'efficiency' ? formatPercent(base) : `${formatNumber(base / 1000)} kW`})`} when one input at a time moves down (low case) or up (high case) by the step given, all else held, the cell count and the area-specific resistance included (the cell voltage is solved again).`,
    spec: { kind: 'tornado', x: { title: m.axis, ...symmetric([...low, ...high]) }, categories: labels, low, high, lowLabel: 'low case', highLabel: 'high case' },
    // The page shows the changes the bars draw; the CSV the results they are the difference of.
    data: chartData(`sensitivity-${m.file}`, [
      { head: 'input and step', shown: labels, data: { name: 'Input', unit: '', values: list.map((e) => e.input) } },
      { data: { name: 'Step', unit: '', values: list.map((e) => e.step) } },
      { data: { name: 'Field', unit: '', values: list.map((e) => e.path) } },
      { head: 'low case', shown: list.map((e) => e.low), data: { name: 'Low case', unit: '', values: list.map((e) => e.low) } },
      { head: 'high case', shown: list.map((e) => e.high), data: { name: 'High case', unit: '', values: list.map((e) => e.high) } },
      { data: { name: `${m.result}, base`, unit: m.unit, values: list.map((e) => e[output].base) } },
      { head: `${m.axis.replace(/^Change of the /, 'change, ')}, low`, shown: list.map((e) => (e[output].low === null ? null : delta(e[output].low, e[output].base))), data: { name: `${m.result}, low case`, unit: m.unit, values: list.map((e) => e[output].low) } },
      { head: `${m.axis.replace(/^Change of the /, 'change, ')}, high`, shown: list.map((e) => (e[output].high === null ? null : delta(e[output].high, e[output].base))), data: { name: `${m.result}, high case`, unit: m.unit, values: list.map((e) => e[output].high) } },
    ]),
    notes,
  };
}

/**
 * Each operating case on its own polarisation and efficiency curve (results.cases[].curve: the
 * case's fuel path, utilization and resistance held, its degradation included), with the case's
 * operating point marked on both; null where no case has a curve.
 */
function casesCurves(r: Results): Draft | null {
  const ran = r.cases.filter((c) => c.curve.length > 0 && c.headline && c.operatingPoint);
  if (ran.length === 0) return null;
  const power = r.technology.mode === 'power';
  const efficiencyOf = (c: (typeof ran)[number]) => (power ? c.efficiency!.electricalEfficiencyLhvNet : c.efficiency!.electrolysisEfficiencyLhv) ?? 0;
  const series: LineSeries[] = ran.flatMap((c, k): LineSeries[] => {
    const j = c.operatingPoint!.currentDensity_A_per_m2 / 1e4;
    return [
      { label: `${c.id}: cell voltage`, points: c.curve.map((p) => [p.currentDensity_A_per_m2 / 1e4, p.cellVoltage_V]), style: k },
      { label: `${c.id}: efficiency`, points: c.curve.map((p) => [p.currentDensity_A_per_m2 / 1e4, p.efficiency * 100]), style: k, dashed: true, right: true },
      { label: `${c.id}: operating point`, points: [[j, c.headline!.cellVoltage_V]], style: k, marker: true },
      { label: `${c.id}: its efficiency`, points: [[j, efficiencyOf(c) * 100]], style: k, marker: true, right: true },
    ];
  });
  const grid = ran.reduce((longest, c) => (c.curve.length > longest.length ? c.curve : longest), ran[0]!.curve);
  const at = (c: (typeof ran)[number], i: number, pick: (p: (typeof grid)[number]) => number) => (c.curve[i] ? pick(c.curve[i]!) : null);
  return {
    id: 'fig-cases',
    title: 'Cell voltage and efficiency of the operating cases',
    caption: `Each case on the hardware of the sizing case: its cell voltage (solid, left axis) and ${power ? 'net electrical efficiency, LHV' : 'electrolysis efficiency on the LHV of hydrogen'} (dashed, right axis) against current density, its utilization, gas and resistance held, with its operating point marked on both.`,
    spec: { kind: 'line', x: jAxis(), y: { title: 'Cell voltage (V)' }, y2: { title: 'Efficiency (%)' }, series },
    data: chartData('case-curves', [
      column('current density (A/cm²)', 'Current density', 'A/m2', grid.map((p) => p.currentDensity_A_per_m2), perCm2),
      ...ran.map((c) => column(`${c.id}: cell voltage (V)`, `Cell voltage, case ${c.id}`, 'V', grid.map((_, i) => at(c, i, (p) => p.cellVoltage_V)), undefined, 5)),
      ...ran.map((c) => column(`${c.id}: efficiency (%)`, `${power ? 'Net electrical efficiency, LHV' : 'Electrolysis efficiency, LHV'}, case ${c.id}`, '', grid.map((_, i) => at(c, i, (p) => p.efficiency)), percent)),
    ]),
    notes: r.cases.filter((c) => !c.ran).map((c) => `Case ${c.id} could not run on the sizing hardware (its finding says why) and is not drawn.`),
  };
}

/**
 * Where the fuel's energy goes, as shares of its LHV input (power mode, with the plant balance):
 * the net electricity, the inverter's and the balance of plant's share of the DC power
 * (P_DC − P_net), the heat delivered, the heat lost to ambient, and the remainder
 * LHV − P_DC − Q_del − Q_loss: what leaves with the exhaust (above 25 °C and as vapour, or as
 * unburnt fuel) and the stack heat a coolant rejects. The parts add up to the LHV input by
 * construction; the first law over the plant on absolute enthalpies is checked apart
 * (plant.power.energyBalance).
 */
function energyFlow(r: Results): Draft | null {
  const p = r.plant.power;
  const lhv = r.efficiency.fuelLhvInput_W;
  if (!p || !lhv) return null;
  const net = r.headline.netPower_W;
  const dc = r.headline.stackPower_W;
  const delivered = p.heatRecovery?.deliveredHeat_W ?? 0;
  const parts: { label: string; name: string; value: number }[] = [
    { label: 'net electricity', name: 'Net AC electricity', value: net },
    { label: 'conversion and balance of plant', name: 'Inverter loss and balance-of-plant load', value: dc - net },
    ...(p.heatRecovery ? [{ label: 'heat delivered', name: 'Heat delivered', value: delivered }] : []),
    ...(p.heatLoss_W ? [{ label: 'lost to ambient', name: 'Heat lost to ambient', value: p.heatLoss_W }] : []),
    {
      label: p.heatRecovery ? 'exhaust and heat not recovered' : 'exhaust and stack heat (no heat recovery)',
      name: 'Remainder: exhaust and heat not recovered',
      value: lhv - dc - delivered - p.heatLoss_W,
    },
  ];
  return {
    id: 'fig-energy-flow',
    title: "Where the fuel's energy goes",
    caption:
      "Shares of the fuel's LHV input: the net electricity, what the inverter and the balance of plant take of the stack's DC power, the heat delivered and lost to ambient (with heat recovery), and the remainder, which leaves with the exhaust or is rejected by the stack's cooling.",
    spec: { kind: 'stacked', x: { title: 'Share of the fuel LHV input (%)', min: 0, max: 100, step: 10 }, categories: ['fuel LHV input'], parts: parts.map((x) => ({ label: x.label, values: [(x.value / lhv) * 100] })) },
    data: chartData('energy-flow', [
      { head: 'where it goes', shown: parts.map((x) => x.label), data: { name: 'Where it goes', unit: '', values: parts.map((x) => x.name) } },
      column('power (kW)', 'Power', 'W', parts.map((x) => x.value), kilo),
      column('share of the fuel LHV input (%)', 'Share of the fuel LHV input', '', parts.map((x) => x.value / lhv), percent),
    ]),
    notes: [],
  };
}

/**
 * Where an electrolysis plant's input goes, as shares of it (with the plant balance): the input
 * I = P_AC + Q_el + P_comp + Q_ext (the electricity the plant takes and any heat from outside) is
 * split into the chemical energy of the products on LHV, the HHV − LHV of the same (the
 * condensation heat of the water they would form), the compressor work (it leaves as heat in
 * its intercoolers and after-cooler), the rectifier's loss, the balance-of-plant load, the stack
 * heat its cooling removes, the other coolers (the water loop, the product cooler), the heat lost
 * to ambient, and the remainder I − Σ of those: the sensible heat the products and condensate
 * carry out above the feeds' (and the small difference between the compression coolers and the
 * work). The parts add up to I by construction; the first law over the plant on absolute
 * enthalpies is checked apart (plant.electrolysis.energyBalance).
 */
function electrolysisEnergyFlow(r: Results): Draft | null {
  const x = r.plant.electrolysis;
  const lhv = r.efficiency.productLhv_W;
  const hhv = r.efficiency.productHhv_W;
  if (!x || lhv === null || hhv === null) return null;
  const e = x.specificEnergy;
  const external = x.heatSupply === 'external' ? x.heatSupplied_W : 0;
  const input = e.totalElectric_W + external;
  const compressionCoolers = x.compression ? x.compression.intercoolers_W + x.compression.aftercooler_W : 0;
  const named: { label: string; name: string; value: number }[] = [
    { label: 'products, LHV', name: 'Chemical energy of the products, LHV', value: lhv },
    { label: 'products, HHV − LHV', name: 'Chemical energy of the products, HHV less LHV', value: hhv - lhv },
    ...(e.compressor_W ? [{ label: 'compression', name: 'Hydrogen compressor work', value: e.compressor_W }] : []),
    ...(e.conversionLoss_W ? [{ label: 'rectifier loss', name: 'Rectifier loss', value: e.conversionLoss_W }] : []),
    ...(e.parasitic_W ? [{ label: 'balance of plant', name: 'Balance-of-plant load', value: e.parasitic_W }] : []),
    ...(x.stackHeatRemoved_W ? [{ label: 'stack heat removed', name: "Stack heat removed by the stack's cooling", value: x.stackHeatRemoved_W }] : []),
    ...(x.coolers_W - compressionCoolers ? [{ label: 'water loop and product coolers', name: 'Heat removed by the water loop and product coolers', value: x.coolers_W - compressionCoolers }] : []),
    ...(x.heatLoss_W ? [{ label: 'lost to ambient', name: 'Heat lost to ambient', value: x.heatLoss_W }] : []),
  ];
  const parts = [
    ...named,
    { label: 'sensible heat of the products', name: 'Remainder: sensible heat the products carry out above the feeds', value: input - named.reduce((a, p) => a + p.value, 0) },
  ];
  const over = external ? 'the electricity and the heat from outside' : 'the electricity';
  return {
    id: 'fig-electrolysis-energy-flow',
    title: "Where the plant's electricity and heat go",
    caption: `Shares of the plant's input (${over}): the chemical energy of the products on LHV and the HHV − LHV of the same, the compressor work, what the rectifier and the balance of plant take, the stack heat its cooling removes, the other coolers, the heat lost to ambient, and the remainder, the sensible heat the products carry out above the feeds'.`,
    spec: { kind: 'stacked', x: { title: `Share of the plant input (%)`, min: 0, max: 100, step: 10 }, categories: ['plant input'], parts: parts.map((p) => ({ label: p.label, values: [(p.value / input) * 100] })) },
    data: chartData('electrolysis-energy-flow', [
      { head: 'where it goes', shown: parts.map((p) => p.label), data: { name: 'Where it goes', unit: '', values: parts.map((p) => p.name) } },
      column('power (kW)', 'Power', 'W', parts.map((p) => p.value), kilo),
      column('share of the plant input (%)', 'Share of the plant input', '', parts.map((p) => p.value / input), percent),
    ]),
    notes: [],
  };
}

export function figures(r: Results): Figure[] {
  const stack = stackAgainstTemperature(r);
  const drafts: Draft[] = [
    voltagesAgainstTemperature(r),
    limitsAgainstTemperature(r),
    nernstAlongPath(r),
    currentAlongCell(r),
    compositionAlongPath(r),
    carbonAgainstSteam(r),
    polarisation(r),
    heatAndPower(r),
    ...(stack ? [stack] : []),
  ];
  const cases = casesCurves(r);
  if (cases) drafts.push(cases);
  if (r.sensitivities.length) drafts.push(tornado(r, 'cellVoltage_V'), tornado(r, 'efficiency'), tornado(r, 'stackHeat_W'));
  const energy = energyFlow(r) ?? electrolysisEnergyFlow(r);
  if (energy) drafts.push(energy);
  return drafts.map((d, i): Figure => {
    if ('kind' in d && d.kind === 'statement') return { ...d, number: i + 1 };
    const drawn = d as Exclude<Draft, { kind: 'statement' }>;
    const data = { ...drawn.data, table: { ...drawn.data.table, title: `Data of figure ${i + 1}` } };
    return { kind: 'chart', ...drawn, data, number: i + 1, width: CHART_WIDTH, height: CHART_HEIGHT, spec: jsonForScript(drawn.spec) };
  });
}
