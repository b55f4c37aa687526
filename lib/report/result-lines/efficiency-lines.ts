/**
 * The worked lines of the efficiencies: net electrical, voltage and Carnot efficiency of a fuel
 * cell; specific energy, efficiency on the LHV of hydrogen and voltage efficiency of an
 * electrolyser.
 */
import type { Results } from '../../plant/results-schema.ts';
import { getSpecies } from '../../thermo/species-data.ts';
import type { LineSpec, QuantitySpec } from '../calc-line.ts';
import type { EquationBook } from '../equation-book.ts';
import { eqRef } from './common.ts';

/** The mean Nernst voltage and the cell voltage, as the voltage efficiency puts them in. */
function voltages(r: Results, book: EquationBook): { mean: QuantitySpec; V: QuantitySpec } {
  return {
    mean: { name: 'E', value: r.headline.meanNernst_V, unit: 'V', origin: `charge-mean Nernst voltage, ${eqRef(book, 'mean-nernst')}` },
    V: { name: 'V', value: r.headline.cellVoltage_V, unit: 'V', origin: 'cell voltage, above' },
  };
}

/** Net electrical, voltage and Carnot efficiency of a fuel cell; null where its results lack them. */
function powerLines(r: Results, book: EquationBook): LineSpec[] | null {
  const eff = r.efficiency;
  if (r.technology.mode !== 'power' || eff.fuelLhvInput_W === null || eff.electricalEfficiencyLhvNet === null || eff.carnotLimit === null) return null;
  const { mean, V } = voltages(r, book);
  const T: QuantitySpec = { name: 'T', value: r.conditions.temperature_K, unit: 'K', origin: 'operating temperature, design input' };
  const ratio = { unit: '', percent: true };
  return [
    {
      id: 'eff-electrical',
      title: 'Net electrical efficiency (LHV)',
      equation: 'eff-electrical',
      relation: 'electrical',
      quantities: [
        { name: 'P', value: r.headline.netPower_W / 1000, unit: 'kW', origin: 'net power, above' },
        { name: 'L', value: eff.fuelLhvInput_W / 1000, unit: 'kW', origin: 'fuel flow × its LHV at 25 °C (species data)' },
      ],
      value: eff.electricalEfficiencyLhvNet,
      ...ratio,
    },
    { id: 'eff-voltage', title: 'Voltage efficiency', equation: 'eff-limit', relation: 'voltage', quantities: [V, mean], value: eff.voltageEfficiency, ...ratio },
    {
      id: 'eff-carnot',
      title: 'Carnot efficiency between stack and ambient, for comparison',
      equation: 'eff-carnot',
      relation: 'carnot',
      quantities: [{ name: 'T0', value: r.conditions.ambientTemperature_K, unit: 'K', origin: 'ambient temperature, design input' }, T],
      value: eff.carnotLimit,
      ...ratio,
    },
  ];
}

/** Specific energy and efficiency on the LHV of the hydrogen an electrolyser makes (where the results have them), and its voltage efficiency. */
function electrolysisLines(r: Results, book: EquationBook): LineSpec[] {
  const eff = r.efficiency;
  const { mean, V } = voltages(r, book);
  const lines: LineSpec[] = [];
  const nH2 = eff.hydrogenProduction_mol_per_s;
  if (nH2 !== null && eff.specificEnergy_kWh_per_kg !== null && eff.electrolysisEfficiencyLhv !== null) {
    const h2 = getSpecies('H2');
    const P: QuantitySpec = { name: 'P', value: r.headline.stackPower_W, unit: 'W', origin: 'stack power input, above' };
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
        title: 'Electrolysis efficiency over electricity alone, on the LHV of the products',
        equation: 'specific-energy',
        relation: 'efficiency',
        quantities: [{ name: 'Lp', value: eff.productLhv_W!, unit: 'W', origin: 'LHV (25 °C, species data) of the combustibles made, net of the feed: hydrogen, and in co-electrolysis carbon monoxide and methane' }, P],
        value: eff.electrolysisEfficiencyLhv,
        unit: '',
        percent: true,
      },
    );
  }
  lines.push({ id: 'eff-voltage', title: 'Voltage efficiency', equation: 'eff-voltage', relation: 'voltage', quantities: [mean, V], value: eff.voltageEfficiency, unit: '', percent: true });
  return lines;
}

export function efficiencyLines(r: Results, book: EquationBook): LineSpec[] {
  return powerLines(r, book) ?? electrolysisLines(r, book);
}
