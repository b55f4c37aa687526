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
import { pressureName } from './equations.ts';
import { sectionNumber } from './outline.ts';

export interface LineGroup {
  id: string;
  title: string;
  lines: CalcLine[];
}

const constF: QuantitySpec = { name: 'F', value: F, unit: 'C/mol', origin: 'Faraday constant, CODATA 2018' };
const constR: QuantitySpec = { name: 'R', value: R, unit: 'J/(mol K)', origin: 'gas constant, CODATA 2018' };

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
function nernstLine(r: Results, book: EquationBook, where: 'inlet' | 'outlet'): LineSpec | null {
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
      relation: 'mean',
      quantities: [{ name: 'U', value: u, unit: '', origin: 'design input' }],
      value: h.meanNernst_V,
      unit: 'V',
      note: `evaluated numerically over the ${r.fuelPath.points.length} points of the fuel path (figure and table in section ${sectionNumber('charts')})`,
    },
  ];
  const j: QuantitySpec = { name: 'j', value: r.operatingPoint.currentDensity_A_per_m2 / 1e4, unit: 'A/cm2', origin: 'current density, design input' };
  const asrOhmCm2 = e.areaSpecificResistance_ohm_m2 * 1e4;
  if (power) {
    const t: QuantitySpec = { name: 't', value: e.ionicTransferenceNumber, unit: '', origin: 'design input' };
    const dv: QuantitySpec = { name: 'dV', value: e.crossoverAllowance_V, unit: 'V', origin: 'crossover allowance, design input' };
    const mean: QuantitySpec = { name: 'E', value: h.meanNernst_V, unit: 'V', origin: `mean Nernst voltage, ${eqRef(book, 'mean-nernst')}` };
    if (h.inletNernst_V !== null && h.openCircuit_V !== null) {
      lines.push({
        id: 'open-circuit',
        title: 'Open-circuit voltage at the inlet',
        equation: 'open-circuit',
        relation: 'open',
        quantities: [t, { name: 'Ein', value: h.inletNernst_V, unit: 'V', origin: 'Nernst voltage at the inlet above' }, dv],
        value: h.openCircuit_V,
        unit: 'V',
      });
    }
    if (e.voltageSource === 'given') {
      lines.push({
        id: 'cell-voltage',
        title: 'Area-specific resistance implied by the given cell voltage',
        equation: 'cell-voltage',
        relation: 'resistance',
        quantities: [t, mean, dv, { name: 'V', value: h.cellVoltage_V, unit: 'V', origin: 'cell voltage, design input' }, j],
        value: asrOhmCm2,
        unit: 'ohm cm2',
        digits: 4,
      });
    } else {
      lines.push({
        id: 'cell-voltage',
        title: 'Cell voltage from the area-specific resistance',
        equation: 'cell-voltage',
        relation: 'voltage',
        quantities: [t, mean, dv, j, { name: 'ASR', value: asrOhmCm2, unit: 'ohm cm2', origin: 'design input' }],
        value: h.cellVoltage_V,
        unit: 'V',
      });
    }
  } else {
    const mean: QuantitySpec = { name: 'E', value: h.meanNernst_V, unit: 'V', origin: `mean Nernst voltage, ${eqRef(book, 'mean-nernst')}` };
    lines.push(
      e.voltageSource === 'given'
        ? {
            id: 'cell-voltage',
            title: 'Area-specific resistance implied by the given cell voltage',
            equation: 'cell-voltage',
            relation: 'resistance',
            quantities: [{ name: 'V', value: h.cellVoltage_V, unit: 'V', origin: 'cell voltage, design input' }, mean, j],
            value: asrOhmCm2,
            unit: 'ohm cm2',
            digits: 4,
          }
        : {
            id: 'cell-voltage',
            title: 'Cell voltage from the area-specific resistance',
            equation: 'cell-voltage',
            relation: 'voltage',
            quantities: [mean, j, { name: 'ASR', value: asrOhmCm2, unit: 'ohm cm2', origin: 'design input' }],
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
  const V: QuantitySpec = { name: 'V', value: h.cellVoltage_V, unit: 'V', origin: 'cell voltage, above' };
  const Icell: QuantitySpec = { name: 'Icell', value: h.cellCurrent_A, unit: 'A', origin: 'cell current, above' };
  const N: QuantitySpec = { name: 'N', value: h.cells, unit: '', origin: op.cellsFrom === 'cells' ? 'cell count, design input' : 'cell count, above' };
  const lines: LineSpec[] = [
    {
      id: 'cell-current',
      title: 'Current of one cell',
      equation: 'current',
      relation: 'cell',
      quantities: [
        { name: 'j', value: op.currentDensity_A_per_m2, unit: 'A/m2', origin: 'current density, design input' },
        { name: 'A', value: op.activeArea_m2, unit: 'm2', origin: 'active area, design input' },
      ],
      value: h.cellCurrent_A,
      unit: 'A',
    },
  ];
  const size = basis.operatingPoint.size;
  if (op.cellsFrom === 'power' && size.kind === 'power') {
    const target: QuantitySpec = { name: 'P', value: size.powerW, unit: 'W', origin: 'target power, design input' };
    lines.push(
      power
        ? {
            id: 'cells',
            title: 'Cells to meet the target net power',
            equation: 'cells',
            relation: 'count',
            quantities: [target, V, Icell, { name: 'f', value: op.parasiticFraction, unit: '', origin: 'parasitic load, design input' }],
            value: h.cells,
            unit: '',
          }
        : {
            id: 'cells',
            title: 'Cells to take the target power input',
            equation: 'cells',
            relation: 'count',
            quantities: [target, V, Icell],
            value: h.cells,
            unit: '',
          },
    );
  } else if (op.cellsFrom === 'hydrogen' && size.kind === 'hydrogen' && h.hydrogenProduction_kg_per_h !== null) {
    lines.push({
      id: 'cells',
      title: 'Cells to meet the target hydrogen production',
      equation: 'cells',
      relation: 'count',
      quantities: [
        { name: 'm', value: size.kgPerS * 86400, unit: 'kg/day', origin: 'target hydrogen production, design input' },
        { name: 'mc', value: (h.hydrogenProduction_kg_per_h * 24) / h.cells, unit: 'kg/day', origin: 'hydrogen production per cell, from the results' },
      ],
      value: h.cells,
      unit: '',
    });
  }
  lines.push(
    {
      id: 'stack-current',
      title: 'Stack current (sum of the cell currents)',
      equation: 'current',
      relation: 'stack',
      quantities: [N, Icell],
      value: h.totalCurrent_A,
      unit: 'A',
      digits: 6,
    },
    {
      id: 'stack-power',
      title: power ? 'Stack DC power' : 'Stack power input',
      equation: 'current',
      relation: 'power',
      quantities: [V, { name: 'I', value: h.totalCurrent_A, unit: 'A', origin: 'stack current, above' }],
      value: h.stackPower_W / 1000,
      unit: 'kW',
    },
  );
  if (power) {
    lines.push({
      id: 'net-power',
      title: 'Net power after the balance-of-plant load',
      equation: 'net-power',
      relation: 'net',
      quantities: [
        { name: 'P', value: h.stackPower_W / 1000, unit: 'kW', origin: 'stack DC power, above' },
        { name: 'f', value: op.parasiticFraction, unit: '', origin: 'parasitic load, design input' },
      ],
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
  const I: QuantitySpec = { name: 'I', value: h.totalCurrent_A, unit: 'A', origin: 'stack current, above' };
  const lines: LineSpec[] = [];
  if (power && basis.fuelElectrode) {
    const U: QuantitySpec = { name: 'U', value: r.electrochemistry.utilization, unit: '', origin: 'fuel utilization, design input' };
    const z = meanCharge(basis.fuelElectrode.composition);
    lines.push(
      {
        id: 'charge-basis',
        title: 'Charge of complete oxidation of the fuel fed',
        equation: 'charge-basis',
        relation: 'charge',
        quantities: [I, U],
        value: r.electrochemistry.chargeBasis_A,
        unit: 'A',
        digits: 6,
      },
      {
        id: 'fuel-flow',
        title: 'Dry fuel flow',
        equation: 'charge-basis',
        relation: 'fuel',
        quantities: [I, U, constF, { name: 'z', value: z, unit: '', origin: 'electrons per molecule averaged over the dry fuel composition (design input)' }],
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
      relation: 'hydrogen',
      lhs: co > 0 ? '\\dot n_\\mathrm{H_2} + \\dot n_\\mathrm{CO}' : '\\dot n_\\mathrm{H_2}',
      quantities: [I, constF],
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
      relation: 'oxygen',
      quantities: [I, constF],
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
      relation: 'air',
      quantities: [
        { name: 'nO2', value: oxygen, unit: 'mol/s', origin: 'oxygen consumed, above' },
        { name: 'x', value: air.moleFractions.O2 ?? 0, unit: '', origin: 'air-electrode feed composition' },
        { name: 'U', value: uAir, unit: '', origin: 'air utilization (design input, or from the air ratio)' },
      ],
      value: air.flow_mol_per_s,
      unit: 'mol/s',
    });
  }
  return lines;
}

function efficiencyLines(r: Results, book: EquationBook): LineSpec[] {
  const h = r.headline;
  const eff = r.efficiency;
  const T: QuantitySpec = { name: 'T', value: r.conditions.temperature_K, unit: 'K', origin: 'operating temperature, design input' };
  const mean: QuantitySpec = { name: 'E', value: h.meanNernst_V, unit: 'V', origin: `mean Nernst voltage, ${eqRef(book, 'mean-nernst')}` };
  const V: QuantitySpec = { name: 'V', value: h.cellVoltage_V, unit: 'V', origin: 'cell voltage, above' };
  if (r.technology.mode === 'power' && eff.fuelLhvInput_W !== null && eff.electricalEfficiencyLhvNet !== null && eff.carnotLimit !== null) {
    return [
      {
        id: 'eff-electrical',
        title: 'Net electrical efficiency (LHV)',
        equation: 'eff-electrical',
        relation: 'electrical',
        quantities: [
          { name: 'P', value: h.netPower_W / 1000, unit: 'kW', origin: 'net power, above' },
          { name: 'L', value: eff.fuelLhvInput_W / 1000, unit: 'kW', origin: 'fuel flow × its LHV at 25 °C (species data)' },
        ],
        value: eff.electricalEfficiencyLhvNet,
        unit: '',
        percent: true,
      },
      {
        id: 'eff-voltage',
        title: 'Voltage efficiency',
        equation: 'eff-limit',
        relation: 'voltage',
        quantities: [V, mean],
        value: eff.voltageEfficiency,
        unit: '',
        percent: true,
      },
      {
        id: 'eff-carnot',
        title: 'Carnot efficiency between stack and ambient, for comparison',
        equation: 'eff-carnot',
        relation: 'carnot',
        quantities: [{ name: 'T0', value: r.conditions.ambientTemperature_K, unit: 'K', origin: 'ambient temperature, design input' }, T],
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
    const P: QuantitySpec = { name: 'P', value: h.stackPower_W, unit: 'W', origin: 'stack power input, above' };
    const n: QuantitySpec = { name: 'n', value: nH2, unit: 'mol/s', origin: 'hydrogen produced, above' };
    lines.push(
      {
        id: 'specific-energy',
        title: 'Specific electric energy per kilogram of hydrogen',
        equation: 'specific-energy',
        relation: 'specific',
        quantities: [P, n, { name: 'M', value: h2.molarMassKgPerMol, unit: 'kg/mol', origin: 'species data' }],
        conversion: '\\times\\frac{1}{3.6\\times10^{6}}',
        value: eff.specificEnergy_kWh_per_kg,
        unit: 'kWh/kg',
        note: '1 kWh = 3.6 × 10⁶ J',
      },
      {
        id: 'eff-electrolysis',
        title: 'Electrolysis efficiency on the LHV of hydrogen',
        equation: 'specific-energy',
        relation: 'efficiency',
        quantities: [n, { name: 'L', value: heatingValue(h2).lhvJPerMol, unit: 'J/mol', origin: 'species data, 25 °C' }, P],
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
    relation: 'voltage',
    quantities: [mean, V],
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
      relation: 'heat',
      quantities: [
        { name: 'I', value: h.totalCurrent_A, unit: 'A', origin: 'stack current, above' },
        { name: 'Vtn', value: r.electrochemistry.effectiveThermoneutralVoltage_V, unit: 'V', origin: 'enthalpy released by the reactions over the current' },
        { name: 'V', value: h.cellVoltage_V, unit: 'V', origin: 'cell voltage, above' },
      ],
      value: heat.isothermalHeat_W / 1000,
      unit: 'kW',
    },
    {
      id: 'heat-balance',
      title: 'Stack heat from the enthalpy balance (isothermal boundary)',
      equation: 'heat-balance',
      relation: 'balance',
      quantities: [
        { name: 'Hin', value: heat.inletEnthalpyIsothermal_W / 1000, unit: 'kW', origin: 'inlet streams at the stack temperature' },
        { name: 'Hout', value: heat.outletEnthalpy_W / 1000, unit: 'kW', origin: 'outlet streams (stream table)' },
        { name: 'W', value: heat.electricWorkIn_W / 1000, unit: 'kW', origin: power ? 'minus the stack DC power' : 'the stack power input' },
      ],
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
      relation: pre === null ? 'stackOnly' : 'margin',
      quantities: [
        { name: 'sc', value: c.steamToCarbon, unit: '', origin: 'design input' },
        { name: 'st', value: c.minimumSteamToCarbonStack, unit: '', origin: 'ratio at which the carbon activity reaches 1 at the stack temperature' },
        ...(pre === null ? [] : [{ name: 'pr', value: pre, unit: '', origin: 'ratio at which the carbon activity reaches 1 at the pre-reformer temperature' }]),
      ],
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
