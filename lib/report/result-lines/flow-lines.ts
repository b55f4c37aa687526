/**
 * The worked lines of the flows by Faraday's law: the charge basis and the dry fuel flow (power
 * mode), the hydrogen produced (electrolysis), the oxygen and the air-electrode feed, each from the
 * ionic current (the current the ions carry; the stack current for a pure ionic conductor).
 */
import type { DesignBasis } from '../../basis/types.ts';
import type { Results } from '../../plant/results-schema.ts';
import { FARADAY_C_PER_MOL as F } from '../../thermo/constants.ts';
import { getSpecies } from '../../thermo/species-data.ts';
import { electronsPerMolecule } from '../../electrochem/charge.ts';
import type { LineSpec, QuantitySpec } from '../calc-line.ts';
import { constF } from './common.ts';
import { humidityLine } from './humidity-lines.ts';

/** Σ x_i z_i of the dry fuel: electrons per mole of fuel on complete oxidation. */
function meanCharge(dry: Readonly<Record<string, number>>): number {
  let z = 0;
  for (const [species, x] of Object.entries(dry)) z += x * electronsPerMolecule(getSpecies(species));
  return z;
}

/** The current Faraday's law takes: the ionic current (the stack current for a pure ionic conductor). */
export const ionicCurrent = (r: Results): QuantitySpec => ({
  name: 'I',
  value: r.electrochemistry.ionicCurrent_A,
  unit: 'A',
  origin: r.electrochemistry.ionicTransferenceNumber < 1 ? 'ionic current, above' : 'sum of the cell currents, above (t_ion = 1: all of it ionic)',
});

/** The charge of the fuel fed and the dry fuel flow of a fuel cell, by Faraday's law. */
function fuelLines(r: Results, basis: DesignBasis): LineSpec[] {
  if (r.technology.mode !== 'power' || !basis.fuelElectrode) return [];
  const I = ionicCurrent(r);
  const U: QuantitySpec = { name: 'U', value: r.electrochemistry.utilization, unit: '', origin: 'fuel utilization, design input' };
  const z = meanCharge(basis.fuelElectrode.composition);
  return [
    { id: 'charge-basis', title: 'Charge of complete oxidation of the fuel fed', equation: 'charge-basis', relation: 'charge', quantities: [I, U], value: r.electrochemistry.chargeBasis_A, unit: 'A', digits: 6 },
    {
      id: 'fuel-flow',
      title: 'Dry fuel flow',
      equation: 'charge-basis',
      relation: 'fuel',
      quantities: [I, U, constF, { name: 'z', value: z, unit: '', origin: 'electrons per molecule averaged over the dry fuel composition (design input)' }],
      value: r.electrochemistry.ionicCurrent_A / (r.electrochemistry.utilization * F * z),
      unit: 'mol/s',
    },
  ];
}

/** The hydrogen (and carbon monoxide) an electrolyser makes, by Faraday's law. */
function productLines(r: Results): LineSpec[] {
  if (r.technology.mode === 'power' || r.efficiency.hydrogenProduction_mol_per_s === null) return [];
  const co = r.efficiency.carbonMonoxideProduction_mol_per_s ?? 0;
  return [
    {
      id: 'hydrogen',
      title: co > 0 ? 'Hydrogen and carbon monoxide produced' : 'Hydrogen produced',
      equation: 'production',
      relation: 'hydrogen',
      lhs: co > 0 ? '\\dot n_\\mathrm{H_2} + \\dot n_\\mathrm{CO}' : '\\dot n_\\mathrm{H_2}',
      quantities: [ionicCurrent(r), constF],
      value: r.efficiency.hydrogenProduction_mol_per_s + co,
      unit: 'mol/s',
    },
  ];
}

/** Where the O2 fraction of the air-electrode feed comes from: the cathode-gas loop's computed inlet, humid air, or the stated composition. */
function airOxygenOrigin(basis: DesignBasis, humid: boolean): string {
  if (basis.airElectrode?.cathodeLoop) return "air-electrode feed: the cathode-gas loop's inlet, its O2 fraction held at the design input (the loop's mole balance, plant section)";
  return humid ? "air-electrode feed composition, humid air: the dry air's O2 fraction times 1 − x_H2O (water in the air-electrode feed)" : 'air-electrode feed composition';
}

/** The oxygen consumed (fuel cell) or produced (electrolyser), the water of a humid-air feed, and the air-electrode feed of a fuel cell. */
function oxygenLines(r: Results, basis: DesignBasis): LineSpec[] {
  const power = r.technology.mode === 'power';
  const oxygen = power ? r.operatingPoint.oxygenConsumed_mol_per_s : r.efficiency.oxygenProduction_mol_per_s;
  if (oxygen === null) return [];
  const lines: LineSpec[] = [
    { id: 'oxygen', title: power ? 'Oxygen consumed' : 'Oxygen produced', equation: power ? 'oxygen' : 'production', relation: 'oxygen', quantities: [ionicCurrent(r), constF], value: oxygen, unit: 'mol/s' },
  ];
  const humidity = humidityLine(r, basis);
  if (humidity) lines.push(humidity);
  const air = r.streams.find((s) => s.id === 'air-inlet');
  const uAir = r.operatingPoint.airUtilization;
  if (power && air && uAir !== null) {
    lines.push({
      id: 'air-flow',
      title: 'Air-electrode feed',
      equation: 'oxygen',
      relation: 'air',
      quantities: [
        { name: 'nO2', value: oxygen, unit: 'mol/s', origin: 'oxygen consumed, above' },
        { name: 'x', value: air.moleFractions.O2 ?? 0, unit: '', origin: airOxygenOrigin(basis, humidity !== null) },
        { name: 'U', value: uAir, unit: '', origin: 'air utilization (design input, or from the air ratio)' },
      ],
      value: air.flow_mol_per_s,
      unit: 'mol/s',
    });
  }
  return lines;
}

export function flowLines(r: Results, basis: DesignBasis): LineSpec[] {
  return [...fuelLines(r, basis), ...productLines(r), ...oxygenLines(r, basis)];
}
