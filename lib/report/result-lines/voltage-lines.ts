/**
 * The worked lines of the voltages: E° and V_tn of the hydrogen reaction, the Nernst voltage at
 * the inlet and the outlet with their partial pressures, the mean Nernst voltage, the open-circuit
 * and the cell voltage (or the resistance a given voltage implies).
 */
import type { Results } from '../../plant/results-schema.ts';
import { FARADAY_C_PER_MOL as F } from '../../thermo/constants.ts';
import { activeQuotient } from '../../electrochem/electrolytes.ts';
import type { LineSpec, QuantitySpec } from '../calc-line.ts';
import type { EquationBook } from '../equation-book.ts';
import { pressureName } from '../equations.ts';
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

/** The Nernst voltage at one point of the fuel path, with that point's partial pressures. */
export function nernstLine(r: Results, book: EquationBook, where: 'inlet' | 'outlet'): LineSpec | null {
  const points = r.fuelPath.points;
  const point = where === 'inlet' ? points[0]! : points[points.length - 1]!;
  const value = where === 'inlet' ? r.headline.inletNernst_V : r.headline.outletNernst_V;
  if (value === null) return null;
  const terms = activeQuotient(r.technology.ion, r.technology.waterPhase);
  const seen = new Set<string>();
  const pressures: QuantitySpec[] = [];
  for (const term of terms) {
    const name = pressureName(term);
    if (seen.has(name)) continue;
    seen.add(name);
    const side = term.electrode === 'f' ? point.fuelSide : point.airSide;
    const total = term.electrode === 'f' ? r.conditions.fuelPressure_bar : r.conditions.airPressure_bar;
    pressures.push({
      name,
      value: (side[term.species] ?? 0) * total,
      unit: 'bar',
      origin: `${term.electrode === 'f' ? 'fuel' : 'air'}-electrode gas at the ${where}: mole fraction × ${term.electrode === 'f' ? 'fuel' : 'air'}-electrode pressure`,
    });
  }
  return {
    id: `nernst-${where}`,
    title: `Nernst voltage at the ${where} (${where === 'inlet' ? 'u = 0' : `u = ${Number(point.utilization.toPrecision(4))}`})`,
    equation: 'nernst',
    relation: 'voltage',
    lhs: where === 'inlet' ? 'E_\\mathrm{in}' : 'E_\\mathrm{out}',
    quantities: [
      { name: 'E0', value: r.fuelPath.standardVoltage_V, unit: 'V', origin: 'standard reversible voltage above' },
      constR,
      { name: 'T', value: r.conditions.temperature_K, unit: 'K', origin: 'operating temperature, design input' },
      constF,
      ...pressures,
    ],
    value,
    unit: 'V',
  };
}

/** The cell voltage from the resistance, or the resistance a given voltage implies: the relation of Eq. cell-voltage that applies, with its quantities in its order. */
function cellVoltageLine(r: Results, book: EquationBook): LineSpec {
  const e = r.electrochemistry;
  const h = r.headline;
  const asrOhmCm2 = e.areaSpecificResistance_ohm_m2 * 1e4;
  const given = e.voltageSource === 'given';
  const pool: Record<string, QuantitySpec> = {
    t: { name: 't', value: e.ionicTransferenceNumber, unit: '', origin: 'design input' },
    E: { name: 'E', value: h.meanNernst_V, unit: 'V', origin: `mean Nernst voltage, ${eqRef(book, 'mean-nernst')}` },
    dV: { name: 'dV', value: e.crossoverAllowance_V, unit: 'V', origin: 'crossover allowance, design input' },
    V: { name: 'V', value: h.cellVoltage_V, unit: 'V', origin: 'cell voltage, design input' },
    j: { name: 'j', value: r.operatingPoint.currentDensity_A_per_m2 / 1e4, unit: 'A/cm2', origin: 'current density, design input' },
    ASR: { name: 'ASR', value: asrOhmCm2, unit: 'ohm cm2', origin: 'design input' },
  };
  const relation = given ? 'resistance' : 'voltage';
  const line = { id: 'cell-voltage', equation: 'cell-voltage', relation, quantities: quantitiesOf(book, 'cell-voltage', relation, pool) };
  return given
    ? { ...line, title: 'Area-specific resistance implied by the given cell voltage', value: asrOhmCm2, unit: 'ohm cm2', digits: 4 }
    : { ...line, title: 'Cell voltage from the area-specific resistance', value: h.cellVoltage_V, unit: 'V' };
}

/** The mean Nernst voltage, the open-circuit voltage of a fuel cell at a wet inlet, and the cell voltage. */
export function voltageLines(r: Results, book: EquationBook): LineSpec[] {
  const e = r.electrochemistry;
  const h = r.headline;
  const lines: LineSpec[] = [
    {
      id: 'mean-nernst',
      title: 'Mean Nernst voltage along the fuel path',
      equation: 'mean-nernst',
      relation: 'mean',
      quantities: [{ name: 'U', value: e.utilization, unit: '', origin: 'design input' }],
      value: h.meanNernst_V,
      unit: 'V',
      note: `evaluated numerically over the ${r.fuelPath.points.length} points of the fuel path (figure and table in section ${sectionNumber('charts')})`,
    },
  ];
  if (r.technology.mode === 'power' && h.inletNernst_V !== null && h.openCircuit_V !== null) {
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
  return [...lines, cellVoltageLine(r, book)];
}
