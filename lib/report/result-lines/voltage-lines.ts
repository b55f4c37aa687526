/**
 * The worked lines of the voltages: E° and V_tn of the hydrogen reaction, the Nernst voltage at
 * the inlet and the outlet with their partial pressures (by the quotient, or by the oxygen
 * potential where the fuel gas holds no hydrogen), the charge-mean Nernst voltage, the
 * open-circuit voltage, the uniform-voltage condition with the solved voltage (or the implied
 * resistance), the cell voltage in the area-mean form, and the highest local current density.
 */
import type { Results } from '../../plant/results-schema.ts';
import { FARADAY_C_PER_MOL as F, PA_PER_BAR } from '../../thermo/constants.ts';
import { activeQuotient, type QuotientTerm } from '../../electrochem/electrolytes.ts';
import type { LineSpec, QuantitySpec } from '../calc-line.ts';
import type { EquationBook } from '../equation-book.ts';
import { coupleQuotient, liquidWaterTerm, pressureName, WATER_SATURATION } from '../equations.ts';
import { waterSaturationPressurePa } from '../../thermo/water-saturation.ts';
import { formatNumber } from '../format.ts';
import { unitText } from '../units.ts';
import { hotSpot } from '../local-current.ts';
import { sectionNumber } from '../outline.ts';
import { constF, constR, eqRef, quantitiesOf } from './common.ts';

/** E°, V_tn, ΔH° and ΔS° of the hydrogen reaction at T, from the two voltages of the results. */
export function standardLines(r: Results, book: EquationBook): LineSpec[] {
  const t = r.conditions.temperature_K;
  const dH = -2 * F * r.electrochemistry.thermoneutralVoltage_V;
  const dG = -2 * F * r.electrochemistry.standardVoltage_V;
  const dS = (dH - dG) / t;
  const water = r.technology.waterPhase === 'liquid' ? 'liquid' : 'gaseous';
  const T: QuantitySpec = { name: 'T', value: t, unit: 'K', origin: 'operating temperature, design input' };
  const H: QuantitySpec = { name: 'dH', value: dH, unit: 'J/mol', origin: `Eq. ${book.get('reaction-properties').number}, species data (${water} water)` };
  const S: QuantitySpec = { name: 'dS', value: dS, unit: 'J/(mol K)', origin: `Eq. ${book.get('reaction-properties').number}, species data` };
  return [
    {
      id: 'standard-voltage',
      title: 'Standard reversible voltage at the operating temperature',
      equation: 'standard-voltages',
      relation: 'reversible',
      quantities: [H, T, S, constF],
      value: r.electrochemistry.standardVoltage_V,
      unit: 'V',
    },
    {
      id: 'thermoneutral-voltage',
      title: 'Thermoneutral voltage of the hydrogen reaction',
      equation: 'standard-voltages',
      relation: 'thermoneutral',
      quantities: [H, constF],
      value: r.electrochemistry.thermoneutralVoltage_V,
      unit: 'V',
    },
  ];
}

/** Where the inlet value of the path comes from, for the title and note of the inlet line. */
function inletText(r: Results): { at: string; note: string } {
  const u1 = Number((r.fuelPath.inletUtilization * 100).toPrecision(3));
  switch (r.fuelPath.inlet) {
    case 'limit':
      return { at: 'u → 0⁺, a limit', note: 'one electrode is fed nothing: its gas is the pure product of the first increment, and this is the limit of E as u → 0⁺, not the value of a gas present at u = 0' };
    case 'first-increment':
      return { at: `first increment, u = ${u1} %`, note: `the inlet gas holds no product, so E is unbounded at u = 0; this is E of the first equilibrated increment, u = ${u1} % of the ${r.technology.mode === 'power' ? 'utilization' : 'conversion'}, where the path starts` };
    default:
      return { at: 'u = 0', note: '' };
  }
}

/** The partial pressures a Nernst line puts in, in the order of its terms: from the gas of the point, or, for the fuel side of the couple, from its element potentials. */
function pressuresAt(r: Results, point: Results['fuelPath']['points'][number], where: string, terms: readonly QuotientTerm[], couple: boolean): QuantitySpec[] {
  const seen = new Set<string>();
  const pressures: QuantitySpec[] = [];
  for (const term of terms) {
    const name = pressureName(term);
    if (seen.has(name)) continue;
    seen.add(name);
    const fuel = term.electrode === 'f';
    if (couple && fuel) {
      pressures.push({ name, value: point.fuelCouple_bar![term.species]!, unit: 'bar', origin: `equilibrated fuel-electrode gas at the ${where}: from its element potentials` });
      continue;
    }
    const side = fuel ? point.fuelSide : point.airSide;
    const total = fuel ? r.conditions.fuelPressure_bar : r.conditions.airPressure_bar;
    pressures.push({
      name,
      value: (side[term.species] ?? 0) * total,
      unit: 'bar',
      origin: `${fuel ? 'fuel' : 'air'}-electrode gas at the ${where}: ${term.water && r.technology.waterPhase === 'liquid' ? 'vapour mole fraction of the water balance at this point' : 'mole fraction'} × ${fuel ? 'fuel' : 'air'}-electrode pressure`,
    });
  }
  return pressures;
}

/** The Nernst voltage at one point of the fuel path, with that point's partial pressures, by the form a reader can evaluate it with (fuelPath.nernstForm). */
export function nernstLine(r: Results, book: EquationBook, where: 'inlet' | 'outlet'): LineSpec {
  const points = r.fuelPath.points;
  const point = where === 'inlet' ? points[0]! : points[points.length - 1]!;
  const value = where === 'inlet' ? r.headline.inletNernst_V : r.headline.outletNernst_V;
  const couple = r.fuelPath.nernstForm === 'oxygen-potential';
  const water = couple ? null : liquidWaterTerm(r);
  const terms = couple ? coupleQuotient(r) : [...activeQuotient(r.technology.ion, r.technology.waterPhase), ...(water ? [water] : [])];
  const inlet = inletText(r);
  const T: QuantitySpec = { name: 'T', value: r.conditions.temperature_K, unit: 'K', origin: 'operating temperature, design input' };
  const aw = r.fuelPath.waterActivity;
  const e0Origin = aw === 1 ? 'standard reversible voltage above' : `standard reversible voltage above less RT/2F ln a_w, the electrolyte's water activity a_w = ${Number(aw.toPrecision(4))} (Balej 1985)`;
  const standard: QuantitySpec[] = couple ? [] : [{ name: 'E0', value: r.fuelPath.standardVoltage_V, unit: 'V', origin: e0Origin }];
  return {
    id: `nernst-${where}`,
    title: `Nernst voltage at the ${where} (${where === 'inlet' ? inlet.at : `u = ${Number(point.utilization.toPrecision(4))}`})${couple ? ', from the oxygen potential' : ''}`,
    equation: couple ? 'nernst-oxygen' : 'nernst',
    relation: 'voltage',
    lhs: where === 'inlet' ? 'E_\\mathrm{in}' : 'E_\\mathrm{out}',
    quantities: [...standard, constR, T, constF, ...pressuresAt(r, point, where, terms, couple), ...(water ? [waterSaturation(r)] : [])],
    value,
    unit: 'V',
    ...(where === 'inlet' && inlet.note ? { note: inlet.note } : {}),
  };
}

/** The vapour pressure of a liquid-water cell's water at T, a_w p_s(T), against which the Nernst line takes the water's activity. */
function waterSaturation(r: Results): QuantitySpec {
  const aw = r.fuelPath.waterActivity;
  const pSatBar = waterSaturationPressurePa(r.conditions.temperature_K) / PA_PER_BAR;
  return {
    name: WATER_SATURATION,
    value: aw * pSatBar,
    unit: 'bar',
    origin: `vapour pressure of the cell's water at T: IAPWS-IF97 region 4${aw === 1 ? '' : `, × a_w = ${Number(aw.toPrecision(4))}`} (the gas's own vapour pressure equals it where the water balance leaves liquid)`,
  };
}

/** Numbers the voltage lines share: the transference number, the crossover allowance, the current density and resistance, the cell voltage, the utilization. */
function voltagePool(r: Results, book: EquationBook): Record<string, QuantitySpec> {
  const e = r.electrochemistry;
  const h = r.headline;
  const given = e.voltageSource === 'given';
  const power = r.technology.mode === 'power';
  return {
    U: { name: 'U', value: e.utilization, unit: '', origin: `${power ? 'fuel utilization' : 'conversion of the feed'}, design input` },
    t: { name: 't', value: e.ionicTransferenceNumber, unit: '', origin: 'ionic transference number, design input' },
    dV: { name: 'dV', value: e.crossoverAllowance_V, unit: 'V', origin: 'crossover allowance, design input' },
    V: { name: 'V', value: h.cellVoltage_V, unit: 'V', origin: given ? 'cell voltage, design input' : `cell voltage: the root of ${eqRef(book, 'uniform-voltage')}` },
    j: { name: 'j', value: r.operatingPoint.currentDensity_A_per_m2 / 1e4, unit: 'A/cm2', origin: 'current density, design input' },
    ASR: {
      name: 'ASR',
      value: e.areaSpecificResistance_ohm_m2 * 1e4,
      unit: 'ohm cm2',
      origin: given ? `implied by the given voltage: the root of ${eqRef(book, 'uniform-voltage')}` : e.resistanceLaw ? 'design input, at the operating temperature by its Arrhenius law' : 'design input',
    },
    EA: { name: 'EA', value: e.areaMeanNernst_V, unit: 'V', origin: `area-mean Nernst voltage, ${eqRef(book, 'cell-voltage')}, weighted by the local current of ${eqRef(book, 'local-current')} at this V` },
    ...activationPool(r, book),
  };
}

/** The activation loss's numbers: the Tafel slope, the exchange current density and the area-mean loss; none without the loss. */
function activationPool(r: Results, book: EquationBook): Record<string, QuantitySpec> {
  const a = r.electrochemistry.activationLoss;
  if (!a) return {};
  return {
    b: { name: 'b', value: a.tafelSlope_V_per_decade, unit: 'V', origin: 'Tafel slope (per decade of current density), design input' },
    i0: { name: 'i0', value: a.exchangeCurrentDensity_A_per_m2 / 1e4, unit: 'A/cm2', origin: 'exchange current density, design input' },
    eta: { name: 'eta', value: a.areaMean_V, unit: 'V', origin: `area-mean activation loss, ${eqRef(book, 'cell-voltage')}, over the local current of ${eqRef(book, 'local-current')} at this V` },
  };
}

/** The activation loss at the mean current density of the design, where the basis gives the loss. */
function activationLine(r: Results, book: EquationBook): LineSpec[] {
  const a = r.electrochemistry.activationLoss;
  if (!a) return [];
  const pool = voltagePool(r, book);
  return [
    {
      id: 'activation-loss',
      title: 'Activation loss at the mean current density',
      equation: 'activation-loss',
      relation: 'loss',
      quantities: [pool.b!, pool.i0!, { ...pool.j!, name: 'i' }],
      value: a.atMeanCurrentDensity_V,
      unit: 'V',
      digits: 6,
      note: `its area mean over the cell, ${formatNumber(a.areaMean_V * 1000, 5)} mV, enters the cell voltage below: the local current density is highest where E is ${r.technology.mode === 'power' ? 'highest' : 'lowest'}`,
    },
  ];
}

/** The uniform-voltage condition with this design's numbers (both sides the same number at the solved V or the implied ASR), and the cell voltage or resistance in the area-mean form. */
function cellVoltageLines(r: Results, book: EquationBook): LineSpec[] {
  const e = r.electrochemistry;
  const h = r.headline;
  const given = e.voltageSource === 'given';
  const pool = voltagePool(r, book);
  const uniform: LineSpec = {
    id: 'uniform-voltage',
    title: given
      ? `Uniform-voltage condition at the given ${formatNumber(h.cellVoltage_V, 5)} V, solved for the resistance`
      : `Uniform-voltage condition, solved for the cell voltage V = ${formatNumber(h.cellVoltage_V, 6)} V`,
    equation: 'uniform-voltage',
    relation: 'balance',
    quantities: quantitiesOf(book, 'uniform-voltage', 'balance', pool),
    value: e.harmonicIntegral_per_V,
    unit: '1/V',
    digits: 6,
    note: `both sides give the number shown; the integral runs over E(u) of the ${r.fuelPath.points.length} points of the fuel path (linear between them${r.fuelPath.inlet === 'first-increment' ? ', logarithmic near the inlet' : ''}; figure and table in section ${sectionNumber('charts')})`,
  };
  const relation = given ? 'resistance' : 'voltage';
  const line = { id: 'cell-voltage', equation: 'cell-voltage', relation, quantities: quantitiesOf(book, 'cell-voltage', relation, pool) };
  const cell: LineSpec = given
    ? { ...line, title: 'Area-specific resistance implied by the given cell voltage (area-mean form)', value: e.areaSpecificResistance_ohm_m2 * 1e4, unit: 'ohm cm2', digits: 4 }
    : { ...line, title: 'Cell voltage from the area-specific resistance (area-mean form)', value: h.cellVoltage_V, unit: 'V' };
  return [uniform, cell];
}

/** The highest local current density: the local current of the terminals where it peaks (the inlet, the hot spot). */
function hotSpotLine(r: Results, book: EquationBook): LineSpec {
  const { index, point } = hotSpot(r);
  const at = index === 0 ? `the inlet${r.fuelPath.inlet === 'first-increment' ? ' (first increment)' : ''}` : `u = ${Number(point.utilization.toPrecision(4))}`;
  return localCurrentLine(r, book, point.nernst_V, at);
}

/**
 * The local current density at the terminals where the Nernst voltage is `nernstV` (at `at`), as
 * the highest along the cell: i = (t E − ΔV_x − V)/ASR in power mode, (V − t E)/ASR in electrolysis,
 * with the voltages and resistance of `r` (a case's, whose hot spot is its inlet).
 */
export function localCurrentLine(r: Results, book: EquationBook, nernstV: number, at: string): LineSpec {
  const pool = voltagePool(r, book);
  const E: QuantitySpec = { name: 'E', value: nernstV, unit: 'V', origin: `Nernst voltage at ${at}, the ${r.technology.mode === 'power' ? 'highest' : 'lowest'} along the cell` };
  if (r.electrochemistry.activationLoss) return kineticLocalCurrentLine(r, book, { ...pool, E }, at);
  return {
    id: 'hot-spot',
    title: `Highest local current density, at ${at} (the hot spot)`,
    equation: 'local-current',
    relation: 'terminal',
    lhs: 'i_\\mathrm{max}',
    quantities: quantitiesOf(book, 'local-current', 'terminal', { ...pool, E }),
    value: r.headline.maxLocalCurrentDensity_A_per_m2 / 1e4,
    unit: 'A/cm2',
    note: `${formatNumber(r.headline.maxLocalCurrentDensity_A_per_m2 / r.operatingPoint.currentDensity_A_per_m2, 3)} times the mean current density`,
  };
}

/**
 * The highest local current density with the activation loss: the root of the local balance of
 * the cell, shown by putting it in, with the Nernst voltage at `at`, to give back the cell voltage.
 */
function kineticLocalCurrentLine(r: Results, book: EquationBook, pool: Record<string, QuantitySpec>, at: string): LineSpec {
  const iMax = r.headline.maxLocalCurrentDensity_A_per_m2;
  const i: QuantitySpec = { name: 'i', value: iMax / 1e4, unit: 'A/cm2', origin: `highest local current density, at ${at}: the root of this balance` };
  return {
    id: 'hot-spot',
    title: `Highest local current density, at ${at} (the hot spot): i_max = ${formatNumber(iMax / 1e4, 5)} ${unitText('A/cm2')} meets the local balance`,
    equation: 'local-current',
    relation: 'terminal',
    quantities: quantitiesOf(book, 'local-current', 'terminal', { ...pool, i }),
    value: r.headline.cellVoltage_V,
    unit: 'V',
    digits: 6,
    note: `${formatNumber(iMax / r.operatingPoint.currentDensity_A_per_m2, 3)} times the mean current density; the balance gives back the cell voltage`,
  };
}

/** The charge-mean Nernst voltage (an indicator), the open-circuit voltage of a fuel cell, the uniform-voltage condition, the cell voltage and the hot spot. */
export function voltageLines(r: Results, book: EquationBook): LineSpec[] {
  const e = r.electrochemistry;
  const h = r.headline;
  const lines: LineSpec[] = [
    {
      id: 'mean-nernst',
      title: 'Charge-mean Nernst voltage along the fuel path (an indicator: the Gibbs energy per unit charge)',
      equation: 'mean-nernst',
      relation: 'mean',
      quantities: [{ name: 'U', value: e.utilization, unit: '', origin: 'design input' }],
      value: h.meanNernst_V,
      unit: 'V',
      note: `evaluated numerically over the ${r.fuelPath.points.length} points of the fuel path (figure and table in section ${sectionNumber('charts')})`,
    },
  ];
  if (r.technology.mode === 'power') {
    lines.push({
      id: 'open-circuit',
      title: 'Open-circuit voltage at the inlet',
      equation: 'open-circuit',
      relation: 'open',
      quantities: [
        { name: 't', value: e.ionicTransferenceNumber, unit: '', origin: 'design input' },
        { name: 'Ein', value: h.inletNernst_V, unit: 'V', origin: 'Nernst voltage at the inlet above' },
        { name: 'dV', value: e.crossoverAllowance_V, unit: 'V', origin: 'crossover allowance, design input' },
      ],
      value: h.openCircuit_V,
      unit: 'V',
    });
  }
  return [...lines, ...activationLine(r, book), ...cellVoltageLines(r, book), hotSpotLine(r, book)];
}
