/**
 * The worked lines of current, size and power: the cell current, the cell count from a target,
 * the stack current and power, and the net power.
 */
import type { DesignBasis } from '../../basis/types.ts';
import type { Results } from '../../plant/results-schema.ts';
import type { LineSpec, QuantitySpec } from '../calc-line.ts';
import { conversionEfficiency } from './common.ts';

/** The quantities several lines of the group put in: the cell voltage, the cell current and the cell count. */
function sizeQuantities(r: Results): { V: QuantitySpec; Icell: QuantitySpec; N: QuantitySpec } {
  const h = r.headline;
  return {
    V: { name: 'V', value: h.cellVoltage_V, unit: 'V', origin: 'cell voltage, above' },
    Icell: { name: 'Icell', value: h.cellCurrent_A, unit: 'A', origin: 'cell current, above' },
    N: { name: 'N', value: h.cells, unit: '', origin: r.operatingPoint.cellsFrom === 'cells' ? 'cell count, design input' : 'cell count, above' },
  };
}

/** The cell count from the target that set it (none where the basis gives the count). */
function cellsLine(r: Results, basis: DesignBasis): LineSpec | null {
  const h = r.headline;
  const op = r.operatingPoint;
  const { V, Icell } = sizeQuantities(r);
  const size = basis.operatingPoint.size;
  const count = { id: 'cells', equation: 'cells', relation: 'count', value: h.cells, unit: '' };
  if (op.cellsFrom === 'power' && size.kind === 'power') {
    const target: QuantitySpec = { name: 'P', value: size.powerW, unit: 'W', origin: 'target power, design input' };
    const plantShares: QuantitySpec[] = [
      conversionEfficiency(basis, r.plant.electrical.conversionEfficiency),
      { name: 'f', value: op.parasiticFraction, unit: '', origin: 'parasitic load, design input' },
    ];
    return r.technology.mode === 'power'
      ? { ...count, title: 'Cells to meet the target net power', quantities: [target, V, Icell, ...plantShares] }
      : { ...count, title: 'Cells to take the target power input', quantities: [target, V, Icell, ...plantShares] };
  }
  if (op.cellsFrom === 'hydrogen' && size.kind === 'hydrogen' && h.hydrogenProduction_kg_per_h !== null) {
    return {
      ...count,
      title: 'Cells to meet the target hydrogen production',
      quantities: [
        { name: 'm', value: size.kgPerS * 86400, unit: 'kg/day', origin: 'target hydrogen production, design input' },
        { name: 'mc', value: (h.hydrogenProduction_kg_per_h * 24) / h.cells, unit: 'kg/day', origin: 'hydrogen production per cell, from the results' },
      ],
    };
  }
  return null;
}

/** The stack current and power, and the net power of a fuel cell. */
function stackLines(r: Results, basis: DesignBasis): LineSpec[] {
  const h = r.headline;
  const power = r.technology.mode === 'power';
  const { V, Icell, N } = sizeQuantities(r);
  const lines: LineSpec[] = [
    { id: 'stack-current', title: 'Sum of the cell currents (no conductor carries it: the stack and bus currents are under the plant)', equation: 'current', relation: 'stack', quantities: [N, Icell], value: h.totalCurrent_A, unit: 'A', digits: 6 },
    {
      id: 'stack-power',
      title: power ? 'Stack DC power' : 'Stack power input',
      equation: 'current',
      relation: 'power',
      quantities: [V, { name: 'I', value: h.totalCurrent_A, unit: 'A', origin: 'sum of the cell currents, above' }],
      value: h.stackPower_W / 1000,
      unit: 'kW',
    },
  ];
  if (power) {
    lines.push({
      id: 'net-power',
      title: 'Net AC power after the inverter and the balance-of-plant load',
      equation: 'net-power',
      relation: 'net',
      quantities: [
        { name: 'P', value: h.stackPower_W / 1000, unit: 'kW', origin: 'stack DC power, above' },
        conversionEfficiency(basis, r.plant.electrical.conversionEfficiency),
        { name: 'f', value: r.operatingPoint.parasiticFraction, unit: '', origin: 'parasitic load, design input' },
      ],
      value: h.netPower_W / 1000,
      unit: 'kW',
    });
  }
  return lines;
}

/** A mixed conductor's ionic current, which the flows follow: the stack current with the electronic leakage added (power) or taken off (electrolysis). */
function ionicLines(r: Results): LineSpec[] {
  const e = r.electrochemistry;
  if (e.ionicTransferenceNumber >= 1) return [];
  const op = r.operatingPoint;
  return [
    {
      id: 'ionic-current',
      title: 'Ionic current of the stack (the electronic leakage carries no ions)',
      equation: 'current',
      relation: 'ionic',
      quantities: [
        { name: 'N', value: r.headline.cells, unit: '', origin: op.cellsFrom === 'cells' ? 'cell count, design input' : 'cell count, above' },
        { name: 'A', value: op.activeArea_m2 * 1e4, unit: 'cm2', origin: 'active area, design input' },
        { name: 'j', value: op.currentDensity_A_per_m2 / 1e4, unit: 'A/cm2', origin: 'current density, design input' },
        { name: 't', value: e.ionicTransferenceNumber, unit: '', origin: 'ionic transference number, design input' },
        { name: 'V', value: r.headline.cellVoltage_V, unit: 'V', origin: 'cell voltage, above' },
        { name: 'ASR', value: e.areaSpecificResistance_ohm_m2 * 1e4, unit: 'ohm cm2', origin: e.voltageSource === 'given' ? 'implied by the given voltage, above' : 'design input' },
      ],
      value: e.ionicCurrent_A,
      unit: 'A',
      digits: 6,
    },
  ];
}

export function sizeLines(r: Results, basis: DesignBasis): LineSpec[] {
  const op = r.operatingPoint;
  const cellCurrent: LineSpec = {
    id: 'cell-current',
    title: 'Current of one cell',
    equation: 'current',
    relation: 'cell',
    quantities: [
      { name: 'j', value: op.currentDensity_A_per_m2, unit: 'A/m2', origin: 'current density, design input' },
      { name: 'A', value: op.activeArea_m2, unit: 'm2', origin: 'active area, design input' },
    ],
    value: r.headline.cellCurrent_A,
    unit: 'A',
  };
  const cells = cellsLine(r, basis);
  return [cellCurrent, ...(cells ? [cells] : []), ...stackLines(r, basis), ...ionicLines(r)];
}
