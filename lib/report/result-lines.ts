/**
 * The worked lines of section 6: for each headline figure, the method's equation with this
 * design's numbers and the result from the results object (never recomputed: the line shows
 * how the result follows, and the tests check that the numbers shown give it). Numbers come from
 * the results, the design inputs of the basis and the constants F and R (CODATA 2018).
 */
import type { DesignBasis } from '../basis/types.ts';
import type { Results } from '../plant/results-schema.ts';
import { FARADAY_C_PER_MOL as F, GAS_CONSTANT_J_PER_MOL_K as R } from '../thermo/constants.ts';
import { getSpecies } from '../thermo/species-data.ts';
import { electronsPerMolecule } from '../electrochem/charge.ts';
import { heatingValue } from '../plant/heating-values.ts';
import { calcLine, type CalcLine, type LineSpec, type QuantitySpec } from './calc-line.ts';
import type { EquationBook } from './equation-book.ts';
import { activeQuotient } from '../electrochem/electrolytes.ts';
import { quotientTex } from './nernst-tex.ts';
import { texPressure } from './tex.ts';
import { sectionNumber } from './outline.ts';

export interface LineGroup {
  id: string;
  title: string;
  lines: CalcLine[];
}

const constF: QuantitySpec = { name: 'F', symbol: 'F', value: F, unit: 'C/mol', origin: 'Faraday constant, CODATA 2018' };
const constR: QuantitySpec = { name: 'R', symbol: 'R', value: R, unit: 'J/(mol K)', origin: 'gas constant, CODATA 2018' };

function eqRef(book: EquationBook, key: string): string {
  return `Eq. ${book.get(key).number}`;
}

/** E°, V_tn, ΔH° and ΔS° of the hydrogen reaction at T, from the two voltages of the results. */
function standardLines(r: Results, book: EquationBook): LineSpec[] {
  const t = r.conditions.temperature_K;
  const dH = -2 * F * r.electrochemistry.thermoneutralVoltage_V;
  const dG = -2 * F * r.electrochemistry.standardVoltage_V;
  const dS = (dH - dG) / t;
  const water = r.technology.waterPhase === 'liquid' ? 'liquid' : 'gaseous';
  const T: QuantitySpec = { name: 'T', symbol: 'T', value: t, unit: 'K', origin: 'operating temperature, design input' };
  const H: QuantitySpec = { name: 'dH', symbol: '\\Delta H^\\circ', value: dH, unit: 'J/mol', origin: `Eq. ${book.get('reaction-properties').number}, species data (${water} water)` };
  const S: QuantitySpec = { name: 'dS', symbol: '\\Delta S^\\circ', value: dS, unit: 'J/(mol K)', origin: `Eq. ${book.get('reaction-properties').number}, species data` };
  return [
    {
      id: 'standard-voltage',
      title: 'Standard reversible voltage at the operating temperature',
      equation: 'standard-voltages',
      lhs: 'E^\\circ',
      rhs: '-\\frac{\\Delta H^\\circ - T\\,\\Delta S^\\circ}{2\\,F}',
      quantities: [H, T, S, constF],
      substitute: (n) => `-\\frac{${n.dH} - ${n.T}\\times${n.dS}}{2\\times${n.F}}`,
      value: r.electrochemistry.standardVoltage_V,
      unit: 'V',
    },
    {
      id: 'thermoneutral-voltage',
      title: 'Thermoneutral voltage of the hydrogen reaction',
      equation: 'standard-voltages',
      lhs: 'V_\\mathrm{tn}',
      rhs: '-\\frac{\\Delta H^\\circ}{2\\,F}',
      quantities: [H, constF],
      substitute: (n) => `-\\frac{${n.dH}}{2\\times${n.F}}`,
      value: r.electrochemistry.thermoneutralVoltage_V,
      unit: 'V',
    },
  ];
}

/** The Nernst voltage at one point of the fuel path, with that point's partial pressures. */
function nernstLine(r: Results, book: EquationBook, where: 'inlet' | 'outlet'): LineSpec | null {
  const points = r.fuelPath.points;
  const point = where === 'inlet' ? points[0]! : points[points.length - 1]!;
  const value = where === 'inlet' ? r.headline.inletNernst_V : r.headline.outletNernst_V;
  if (value === null) return null;
  const terms = activeQuotient(r.technology.ion, r.technology.waterPhase);
  const seen = new Set<string>();
  const pressures: QuantitySpec[] = [];
  const nameOf = (species: string, electrode: string) => `p_${species}_${electrode}`;
  for (const term of terms) {
    const name = nameOf(term.species, term.electrode);
    if (seen.has(name)) continue;
    seen.add(name);
    const side = term.electrode === 'f' ? point.fuelSide : point.airSide;
    const total = term.electrode === 'f' ? r.conditions.fuelPressure_bar : r.conditions.airPressure_bar;
    pressures.push({
      name,
      symbol: texPressure(term.species, term.electrode),
      value: (side[term.species] ?? 0) * total,
      unit: 'bar',
      origin: `${term.electrode === 'f' ? 'fuel' : 'air'}-electrode gas at the ${where}: mole fraction × ${term.electrode === 'f' ? 'fuel' : 'air'}-electrode pressure`,
    });
  }
  const lhs = where === 'inlet' ? 'E_\\mathrm{in}' : 'E_\\mathrm{out}';
  return {
    id: `nernst-${where}`,
    title: `Nernst voltage at the ${where} (${where === 'inlet' ? 'u = 0' : `u = ${Number(point.utilization.toPrecision(4))}`})`,
    equation: 'nernst',
    lhs,
    rhs: `E^\\circ + \\frac{R\\,T}{2\\,F}\\,\\ln ${quotientTex(terms)}`,
    quantities: [
      { name: 'E0', symbol: 'E^\\circ', value: r.fuelPath.standardVoltage_V, unit: 'V', origin: 'standard reversible voltage above' },
      constR,
      { name: 'T', symbol: 'T', value: r.conditions.temperature_K, unit: 'K', origin: 'operating temperature, design input' },
      constF,
      ...pressures,
    ],
    substitute: (n) => `${n.E0} + \\frac{${n.R}\\times${n.T}}{2\\times${n.F}}\\,\\ln ${quotientTex(terms, (t) => n[nameOf(t.species, t.electrode)]!, { times: true })}`,
    value,
    unit: 'V',
  };
}

function voltageLines(r: Results, book: EquationBook): LineSpec[] {
  const power = r.technology.mode === 'power';
  const e = r.electrochemistry;
  const h = r.headline;
  const u = e.utilization;
  const lines: LineSpec[] = [
    {
      id: 'mean-nernst',
      title: 'Mean Nernst voltage along the fuel path',
      equation: 'mean-nernst',
      lhs: '\\bar{E}',
      rhs: `\\frac{1}{${power ? 'U_\\mathrm{f}' : 'X'}}\\int_0^{${power ? 'U_\\mathrm{f}' : 'X'}} E(u)\\,\\mathrm{d}u`,
      quantities: [{ name: 'U', symbol: power ? 'U_\\mathrm{f}' : 'X', value: u, unit: '', origin: 'design input' }],
      substitute: (n) => `\\frac{1}{${n.U}}\\int_0^{${n.U}} E(u)\\,\\mathrm{d}u`,
      value: h.meanNernst_V,
      unit: 'V',
      note: `evaluated numerically over the ${r.fuelPath.points.length} points of the fuel path (figure and table in section ${sectionNumber('charts')})`,
    },
  ];
  const j: QuantitySpec = { name: 'j', symbol: 'j', value: r.operatingPoint.currentDensity_A_per_m2 / 1e4, unit: 'A/cm2', origin: 'current density, design input' };
  const asrOhmCm2 = e.areaSpecificResistance_ohm_m2 * 1e4;
  if (power) {
    const t: QuantitySpec = { name: 't', symbol: 't_\\mathrm{ion}', value: e.ionicTransferenceNumber, unit: '', origin: 'design input' };
    const dv: QuantitySpec = { name: 'dV', symbol: '\\Delta V_x', value: e.crossoverAllowance_V, unit: 'V', origin: 'crossover allowance, design input' };
    const mean: QuantitySpec = { name: 'E', symbol: '\\bar{E}', value: h.meanNernst_V, unit: 'V', origin: `mean Nernst voltage, ${eqRef(book, 'mean-nernst')}` };
    if (h.inletNernst_V !== null && h.openCircuit_V !== null) {
      lines.push({
        id: 'open-circuit',
        title: 'Open-circuit voltage at the inlet',
        equation: 'open-circuit',
        lhs: 'E_\\mathrm{oc}',
        rhs: 't_\\mathrm{ion}\\,E_\\mathrm{in} - \\Delta V_x',
        quantities: [t, { name: 'Ein', symbol: 'E_\\mathrm{in}', value: h.inletNernst_V, unit: 'V', origin: 'Nernst voltage at the inlet above' }, dv],
        substitute: (n) => `${n.t}\\times${n.Ein} - ${n.dV}`,
        value: h.openCircuit_V,
        unit: 'V',
      });
    }
    if (e.voltageSource === 'given') {
      lines.push({
        id: 'cell-voltage',
        title: 'Area-specific resistance implied by the given cell voltage',
        equation: 'cell-voltage',
        lhs: '\\mathrm{ASR}',
        rhs: '\\frac{t_\\mathrm{ion}\\,\\bar{E} - \\Delta V_x - V}{j}',
        quantities: [t, mean, dv, { name: 'V', symbol: 'V', value: h.cellVoltage_V, unit: 'V', origin: 'cell voltage, design input' }, j],
        substitute: (n) => `\\frac{${n.t}\\times${n.E} - ${n.dV} - ${n.V}}{${n.j}}`,
        value: asrOhmCm2,
        unit: 'ohm cm2',
        digits: 4,
      });
    } else {
      lines.push({
        id: 'cell-voltage',
        title: 'Cell voltage from the area-specific resistance',
        equation: 'cell-voltage',
        lhs: 'V',
        rhs: 't_\\mathrm{ion}\\,\\bar{E} - \\Delta V_x - j\\,\\mathrm{ASR}',
        quantities: [t, mean, dv, j, { name: 'ASR', symbol: '\\mathrm{ASR}', value: asrOhmCm2, unit: 'ohm cm2', origin: 'design input' }],
        substitute: (n) => `${n.t}\\times${n.E} - ${n.dV} - ${n.j}\\times${n.ASR}`,
        value: h.cellVoltage_V,
        unit: 'V',
      });
    }
  } else {
    const mean: QuantitySpec = { name: 'E', symbol: '\\bar{E}', value: h.meanNernst_V, unit: 'V', origin: `mean Nernst voltage, ${eqRef(book, 'mean-nernst')}` };
    lines.push(
      e.voltageSource === 'given'
        ? {
            id: 'cell-voltage',
            title: 'Area-specific resistance implied by the given cell voltage',
            equation: 'cell-voltage',
            lhs: '\\mathrm{ASR}',
            rhs: '\\frac{V - \\bar{E}}{j}',
            quantities: [{ name: 'V', symbol: 'V', value: h.cellVoltage_V, unit: 'V', origin: 'cell voltage, design input' }, mean, j],
            substitute: (n) => `\\frac{${n.V} - ${n.E}}{${n.j}}`,
            value: asrOhmCm2,
            unit: 'ohm cm2',
            digits: 4,
          }
        : {
            id: 'cell-voltage',
            title: 'Cell voltage from the area-specific resistance',
            equation: 'cell-voltage',
            lhs: 'V',
            rhs: '\\bar{E} + j\\,\\mathrm{ASR}',
            quantities: [mean, j, { name: 'ASR', symbol: '\\mathrm{ASR}', value: asrOhmCm2, unit: 'ohm cm2', origin: 'design input' }],
            substitute: (n) => `${n.E} + ${n.j}\\times${n.ASR}`,
            value: h.cellVoltage_V,
            unit: 'V',
          },
    );
  }
  return lines;
}

function sizeLines(r: Results, basis: DesignBasis, book: EquationBook): LineSpec[] {
  const h = r.headline;
  const op = r.operatingPoint;
  const power = r.technology.mode === 'power';
  const V: QuantitySpec = { name: 'V', symbol: 'V', value: h.cellVoltage_V, unit: 'V', origin: 'cell voltage, above' };
  const Icell: QuantitySpec = { name: 'Icell', symbol: 'I_\\mathrm{cell}', value: h.cellCurrent_A, unit: 'A', origin: 'cell current, above' };
  const N: QuantitySpec = { name: 'N', symbol: 'N', value: h.cells, unit: '', origin: op.cellsFrom === 'cells' ? 'cell count, design input' : 'cell count, above' };
  const lines: LineSpec[] = [
    {
      id: 'cell-current',
      title: 'Current of one cell',
      equation: 'current',
      lhs: 'I_\\mathrm{cell}',
      rhs: 'j\\,A',
      quantities: [
        { name: 'j', symbol: 'j', value: op.currentDensity_A_per_m2, unit: 'A/m2', origin: 'current density, design input' },
        { name: 'A', symbol: 'A', value: op.activeArea_m2, unit: 'm2', origin: 'active area, design input' },
      ],
      substitute: (n) => `${n.j}\\times${n.A}`,
      value: h.cellCurrent_A,
      unit: 'A',
    },
  ];
  const size = basis.operatingPoint.size;
  if (op.cellsFrom === 'power' && size.kind === 'power') {
    const target: QuantitySpec = { name: 'P', symbol: 'P_\\mathrm{target}', value: size.powerW, unit: 'W', origin: 'target power, design input' };
    lines.push(
      power
        ? {
            id: 'cells',
            title: 'Cells to meet the target net power',
            equation: 'cells',
            lhs: 'N',
            rhs: '\\left\\lceil \\frac{P_\\mathrm{target}}{V\\,I_\\mathrm{cell}\\,(1 - f_\\mathrm{par})} \\right\\rceil',
            quantities: [target, V, Icell, { name: 'f', symbol: 'f_\\mathrm{par}', value: op.parasiticFraction, unit: '', origin: 'parasitic load, design input' }],
            substitute: (n) => `\\left\\lceil \\frac{${n.P}}{${n.V}\\times${n.Icell}\\times(1 - ${n.f})} \\right\\rceil`,
            value: h.cells,
            unit: '',
          }
        : {
            id: 'cells',
            title: 'Cells to take the target power input',
            equation: 'cells',
            lhs: 'N',
            rhs: '\\left\\lceil \\frac{P_\\mathrm{target}}{V\\,I_\\mathrm{cell}} \\right\\rceil',
            quantities: [target, V, Icell],
            substitute: (n) => `\\left\\lceil \\frac{${n.P}}{${n.V}\\times${n.Icell}} \\right\\rceil`,
            value: h.cells,
            unit: '',
          },
    );
  } else if (op.cellsFrom === 'hydrogen' && size.kind === 'hydrogen' && h.hydrogenProduction_kg_per_h !== null) {
    lines.push({
      id: 'cells',
      title: 'Cells to meet the target hydrogen production',
      equation: 'cells',
      lhs: 'N',
      rhs: '\\left\\lceil \\frac{\\dot m_\\mathrm{target}}{\\dot m_\\mathrm{cell}} \\right\\rceil',
      quantities: [
        { name: 'm', symbol: '\\dot m_\\mathrm{target}', value: size.kgPerS * 86400, unit: 'kg/day', origin: 'target hydrogen production, design input' },
        { name: 'mc', symbol: '\\dot m_\\mathrm{cell}', value: (h.hydrogenProduction_kg_per_h * 24) / h.cells, unit: 'kg/day', origin: 'hydrogen production per cell, from the results' },
      ],
      substitute: (n) => `\\left\\lceil \\frac{${n.m}}{${n.mc}} \\right\\rceil`,
      value: h.cells,
      unit: '',
    });
  }
  lines.push(
    {
      id: 'stack-current',
      title: 'Stack current (sum of the cell currents)',
      equation: 'current',
      lhs: 'I',
      rhs: 'N\\,I_\\mathrm{cell}',
      quantities: [N, Icell],
      substitute: (n) => `${n.N}\\times${n.Icell}`,
      value: h.totalCurrent_A,
      unit: 'A',
      digits: 6,
    },
    {
      id: 'stack-power',
      title: power ? 'Stack DC power' : 'Stack power input',
      equation: 'current',
      lhs: 'P',
      rhs: 'V\\,I',
      quantities: [V, { name: 'I', symbol: 'I', value: h.totalCurrent_A, unit: 'A', origin: 'stack current, above' }],
      substitute: (n) => `${n.V}\\times${n.I}`,
      value: h.stackPower_W / 1000,
      unit: 'kW',
    },
  );
  if (power) {
    lines.push({
      id: 'net-power',
      title: 'Net power after the balance-of-plant load',
      equation: 'net-power',
      lhs: 'P_\\mathrm{net}',
      rhs: 'P\\,(1 - f_\\mathrm{par})',
      quantities: [
        { name: 'P', symbol: 'P', value: h.stackPower_W / 1000, unit: 'kW', origin: 'stack DC power, above' },
        { name: 'f', symbol: 'f_\\mathrm{par}', value: op.parasiticFraction, unit: '', origin: 'parasitic load, design input' },
      ],
      substitute: (n) => `${n.P}\\times(1 - ${n.f})`,
      value: h.netPower_W / 1000,
      unit: 'kW',
    });
  }
  return lines;
}

/** Σ x_i z_i of the dry fuel: electrons per mole of fuel on complete oxidation. */
export function meanCharge(dry: Readonly<Record<string, number>>): number {
  let z = 0;
  for (const [species, x] of Object.entries(dry)) z += x * electronsPerMolecule(getSpecies(species));
  return z;
}

function flowLines(r: Results, basis: DesignBasis): LineSpec[] {
  const h = r.headline;
  const power = r.technology.mode === 'power';
  const I: QuantitySpec = { name: 'I', symbol: 'I', value: h.totalCurrent_A, unit: 'A', origin: 'stack current, above' };
  const lines: LineSpec[] = [];
  if (power && basis.fuelElectrode) {
    const U: QuantitySpec = { name: 'U', symbol: 'U_\\mathrm{f}', value: r.electrochemistry.utilization, unit: '', origin: 'fuel utilization, design input' };
    const z = meanCharge(basis.fuelElectrode.composition);
    lines.push(
      {
        id: 'charge-basis',
        title: 'Charge of complete oxidation of the fuel fed',
        equation: 'charge-basis',
        lhs: 'Q_1',
        rhs: '\\frac{I}{U_\\mathrm{f}}',
        quantities: [I, U],
        substitute: (n) => `\\frac{${n.I}}{${n.U}}`,
        value: r.electrochemistry.chargeBasis_A,
        unit: 'A',
        digits: 6,
      },
      {
        id: 'fuel-flow',
        title: 'Dry fuel flow',
        equation: 'charge-basis',
        lhs: '\\dot n_\\mathrm{fuel}',
        rhs: '\\frac{I}{U_\\mathrm{f}\\,F\\,\\bar{z}}',
        quantities: [I, U, constF, { name: 'z', symbol: '\\bar{z}', value: z, unit: '', origin: 'electrons per molecule averaged over the dry fuel composition (design input)' }],
        substitute: (n) => `\\frac{${n.I}}{${n.U}\\times${n.F}\\times${n.z}}`,
        value: h.totalCurrent_A / (r.electrochemistry.utilization * F * z),
        unit: 'mol/s',
      },
    );
  }
  if (!power && r.efficiency.hydrogenProduction_mol_per_s !== null) {
    const co = r.efficiency.carbonMonoxideProduction_mol_per_s ?? 0;
    lines.push({
      id: 'hydrogen',
      title: co > 0 ? 'Hydrogen and carbon monoxide produced' : 'Hydrogen produced',
      equation: 'production',
      lhs: co > 0 ? '\\dot n_\\mathrm{H_2} + \\dot n_\\mathrm{CO}' : '\\dot n_\\mathrm{H_2}',
      rhs: '\\frac{I}{2\\,F}',
      quantities: [I, constF],
      substitute: (n) => `\\frac{${n.I}}{2\\times${n.F}}`,
      value: r.efficiency.hydrogenProduction_mol_per_s + co,
      unit: 'mol/s',
    });
  }
  const oxygen = power ? r.operatingPoint.oxygenConsumed_mol_per_s : r.efficiency.oxygenProduction_mol_per_s;
  if (oxygen !== null) {
    lines.push({
      id: 'oxygen',
      title: power ? 'Oxygen consumed' : 'Oxygen produced',
      equation: power ? 'oxygen' : 'production',
      lhs: '\\dot n_\\mathrm{O_2}',
      rhs: '\\frac{I}{4\\,F}',
      quantities: [I, constF],
      substitute: (n) => `\\frac{${n.I}}{4\\times${n.F}}`,
      value: oxygen,
      unit: 'mol/s',
    });
  }
  const air = r.streams.find((s) => s.id === 'air-inlet');
  const uAir = r.operatingPoint.airUtilization;
  if (power && air && oxygen !== null && uAir !== null) {
    lines.push({
      id: 'air-flow',
      title: 'Air-electrode feed',
      equation: 'oxygen',
      lhs: '\\dot n_\\mathrm{air}',
      rhs: '\\frac{\\dot n_\\mathrm{O_2}}{x_\\mathrm{O_2}\\,U_\\mathrm{air}}',
      quantities: [
        { name: 'nO2', symbol: '\\dot n_\\mathrm{O_2}', value: oxygen, unit: 'mol/s', origin: 'oxygen consumed, above' },
        { name: 'x', symbol: 'x_\\mathrm{O_2}', value: air.moleFractions.O2 ?? 0, unit: '', origin: 'air-electrode feed composition' },
        { name: 'U', symbol: 'U_\\mathrm{air}', value: uAir, unit: '', origin: 'air utilization (design input, or from the air ratio)' },
      ],
      substitute: (n) => `\\frac{${n.nO2}}{${n.x}\\times${n.U}}`,
      value: air.flow_mol_per_s,
      unit: 'mol/s',
    });
  }
  return lines;
}

function efficiencyLines(r: Results, book: EquationBook): LineSpec[] {
  const h = r.headline;
  const eff = r.efficiency;
  const T: QuantitySpec = { name: 'T', symbol: 'T', value: r.conditions.temperature_K, unit: 'K', origin: 'operating temperature, design input' };
  const mean: QuantitySpec = { name: 'E', symbol: '\\bar{E}', value: h.meanNernst_V, unit: 'V', origin: `mean Nernst voltage, ${eqRef(book, 'mean-nernst')}` };
  const V: QuantitySpec = { name: 'V', symbol: 'V', value: h.cellVoltage_V, unit: 'V', origin: 'cell voltage, above' };
  if (r.technology.mode === 'power' && eff.fuelLhvInput_W !== null && eff.electricalEfficiencyLhvNet !== null && eff.carnotLimit !== null) {
    return [
      {
        id: 'eff-electrical',
        title: 'Net electrical efficiency (LHV)',
        equation: 'eff-electrical',
        lhs: '\\eta_\\mathrm{el}',
        rhs: '\\frac{P_\\mathrm{net}}{\\dot n_\\mathrm{fuel}\\,\\mathrm{LHV}}',
        quantities: [
          { name: 'P', symbol: 'P_\\mathrm{net}', value: h.netPower_W / 1000, unit: 'kW', origin: 'net power, above' },
          { name: 'L', symbol: '\\dot n_\\mathrm{fuel}\\,\\mathrm{LHV}', value: eff.fuelLhvInput_W / 1000, unit: 'kW', origin: 'fuel flow × its LHV at 25 °C (species data)' },
        ],
        substitute: (n) => `\\frac{${n.P}}{${n.L}}`,
        value: eff.electricalEfficiencyLhvNet,
        unit: '',
        percent: true,
      },
      {
        id: 'eff-voltage',
        title: 'Voltage efficiency',
        equation: 'eff-limit',
        lhs: '\\eta_V',
        rhs: '\\frac{V}{\\bar{E}}',
        quantities: [V, mean],
        substitute: (n) => `\\frac{${n.V}}{${n.E}}`,
        value: eff.voltageEfficiency,
        unit: '',
        percent: true,
      },
      {
        id: 'eff-carnot',
        title: 'Carnot efficiency between stack and ambient, for comparison',
        equation: 'eff-carnot',
        lhs: '\\eta_\\mathrm{C}',
        rhs: '1 - \\frac{T_0}{T}',
        quantities: [{ name: 'T0', symbol: 'T_0', value: r.conditions.ambientTemperature_K, unit: 'K', origin: 'ambient temperature, design input' }, T],
        substitute: (n) => `1 - \\frac{${n.T0}}{${n.T}}`,
        value: eff.carnotLimit,
        unit: '',
        percent: true,
      },
    ];
  }
  const lines: LineSpec[] = [];
  const nH2 = eff.hydrogenProduction_mol_per_s;
  if (nH2 !== null && eff.specificEnergy_kWh_per_kg !== null && eff.electrolysisEfficiencyLhv !== null) {
    const h2 = getSpecies('H2');
    const P: QuantitySpec = { name: 'P', symbol: 'P', value: h.stackPower_W, unit: 'W', origin: 'stack power input, above' };
    const n: QuantitySpec = { name: 'n', symbol: '\\dot n_\\mathrm{H_2}', value: nH2, unit: 'mol/s', origin: 'hydrogen produced, above' };
    lines.push(
      {
        id: 'specific-energy',
        title: 'Specific electric energy per kilogram of hydrogen',
        equation: 'specific-energy',
        lhs: 'w',
        rhs: '\\frac{P}{\\dot n_\\mathrm{H_2}\\,M_\\mathrm{H_2}}',
        quantities: [P, n, { name: 'M', symbol: 'M_\\mathrm{H_2}', value: h2.molarMassKgPerMol, unit: 'kg/mol', origin: 'species data' }],
        substitute: (q) => `\\frac{${q.P}}{${q.n}\\times${q.M}}\\times\\frac{1}{3.6\\times10^{6}}`,
        value: eff.specificEnergy_kWh_per_kg,
        unit: 'kWh/kg',
        note: '1 kWh = 3.6 × 10⁶ J',
      },
      {
        id: 'eff-electrolysis',
        title: 'Electrolysis efficiency on the LHV of hydrogen',
        equation: 'specific-energy',
        lhs: '\\eta_\\mathrm{LHV}',
        rhs: '\\frac{\\dot n_\\mathrm{H_2}\\,\\mathrm{LHV_{H_2}}}{P}',
        quantities: [n, { name: 'L', symbol: '\\mathrm{LHV_{H_2}}', value: heatingValue(h2).lhvJPerMol, unit: 'J/mol', origin: 'species data, 25 °C' }, P],
        substitute: (q) => `\\frac{${q.n}\\times${q.L}}{${q.P}}`,
        value: eff.electrolysisEfficiencyLhv,
        unit: '',
        percent: true,
      },
    );
  }
  lines.push({
    id: 'eff-voltage',
    title: 'Voltage efficiency',
    equation: 'eff-voltage',
    lhs: '\\eta_V',
    rhs: '\\frac{\\bar{E}}{V}',
    quantities: [mean, V],
    substitute: (n) => `\\frac{${n.E}}{${n.V}}`,
    value: eff.voltageEfficiency,
    unit: '',
    percent: true,
  });
  return lines;
}

function heatLines(r: Results): LineSpec[] {
  const power = r.technology.mode === 'power';
  const h = r.headline;
  const heat = r.heat;
  return [
    {
      id: 'heat-voltage',
      title: power ? 'Stack heat from the voltages' : 'Stack heat from the voltages (negative: heat to supply)',
      equation: 'heat-voltage',
      lhs: 'Q',
      rhs: power ? 'I\\,\\left(V_\\mathrm{tn,eff} - V\\right)' : 'I\\,\\left(V - V_\\mathrm{tn,eff}\\right)',
      quantities: [
        { name: 'I', symbol: 'I', value: h.totalCurrent_A, unit: 'A', origin: 'stack current, above' },
        { name: 'Vtn', symbol: 'V_\\mathrm{tn,eff}', value: r.electrochemistry.effectiveThermoneutralVoltage_V, unit: 'V', origin: 'enthalpy released by the reactions over the current' },
        { name: 'V', symbol: 'V', value: h.cellVoltage_V, unit: 'V', origin: 'cell voltage, above' },
      ],
      substitute: (n) => (power ? `${n.I}\\times(${n.Vtn} - ${n.V})` : `${n.I}\\times(${n.V} - ${n.Vtn})`),
      value: heat.isothermalHeat_W / 1000,
      unit: 'kW',
    },
    {
      id: 'heat-balance',
      title: 'Stack heat from the enthalpy balance (isothermal boundary)',
      equation: 'heat-balance',
      lhs: 'Q',
      rhs: '\\sum_\\mathrm{in} \\dot n_i h_i(T) - \\sum_\\mathrm{out} \\dot n_i h_i(T) + W_\\mathrm{in}',
      quantities: [
        { name: 'Hin', symbol: 'H_\\mathrm{in}', value: heat.inletEnthalpyIsothermal_W / 1000, unit: 'kW', origin: 'inlet streams at the stack temperature' },
        { name: 'Hout', symbol: 'H_\\mathrm{out}', value: heat.outletEnthalpy_W / 1000, unit: 'kW', origin: 'outlet streams (stream table)' },
        { name: 'W', symbol: 'W_\\mathrm{in}', value: heat.electricWorkIn_W / 1000, unit: 'kW', origin: power ? 'minus the stack DC power' : 'the stack power input' },
      ],
      substitute: (n) => `${n.Hin} - ${n.Hout} + ${n.W}`,
      value: heat.isothermalHeat_W / 1000,
      unit: 'kW',
    },
  ];
}

function carbonLines(r: Results): LineSpec[] {
  const c = r.carbon;
  if (c.steamToCarbon === null || r.headline.carbonMargin === null || c.minimumSteamToCarbonStack === null) return [];
  const pre = c.minimumSteamToCarbonPreReformer;
  return [
    {
      id: 'carbon-margin',
      title: 'Margin of the steam-to-carbon ratio over the carbon limit',
      equation: 'carbon-margin',
      lhs: '\\Delta(S/C)',
      rhs: pre === null ? '(S/C)_\\mathrm{design} - (S/C)_\\mathrm{min,stack}' : '(S/C)_\\mathrm{design} - \\max\\left[(S/C)_\\mathrm{min,stack},\\ (S/C)_\\mathrm{min,pre}\\right]',
      quantities: [
        { name: 'sc', symbol: '(S/C)_\\mathrm{design}', value: c.steamToCarbon, unit: '', origin: 'design input' },
        { name: 'st', symbol: '(S/C)_\\mathrm{min,stack}', value: c.minimumSteamToCarbonStack, unit: '', origin: 'ratio at which the carbon activity reaches 1 at the stack temperature' },
        ...(pre === null ? [] : [{ name: 'pr', symbol: '(S/C)_\\mathrm{min,pre}', value: pre, unit: '', origin: 'ratio at which the carbon activity reaches 1 at the pre-reformer temperature' }]),
      ],
      substitute: (n) => (pre === null ? `${n.sc} - ${n.st}` : `${n.sc} - \\max\\left[${n.st},\\ ${n.pr}\\right]`),
      value: r.headline.carbonMargin,
      unit: '',
      digits: 4,
    },
  ];
}

/** The worked lines of section 6, in groups. */
export function resultLines(r: Results, basis: DesignBasis, book: EquationBook): LineGroup[] {
  const build = (specs: (LineSpec | null)[]) => specs.filter((s): s is LineSpec => s !== null).map((s) => calcLine(s, book));
  const groups: LineGroup[] = [
    { id: 'results-voltage', title: 'Voltages', lines: build([...standardLines(r, book), nernstLine(r, book, 'inlet'), nernstLine(r, book, 'outlet'), ...voltageLines(r, book)]) },
    { id: 'results-size', title: 'Current, size and power', lines: build(sizeLines(r, basis, book)) },
    { id: 'results-flows', title: "Flows by Faraday's law", lines: build(flowLines(r, basis)) },
    { id: 'results-efficiency', title: 'Efficiency', lines: build(efficiencyLines(r, book)) },
    { id: 'results-heat', title: 'Heat', lines: build(heatLines(r)) },
  ];
  const carbon = build(carbonLines(r));
  if (carbon.length) groups.push({ id: 'results-carbon', title: 'Carbon margin', lines: carbon });
  return groups;
}
