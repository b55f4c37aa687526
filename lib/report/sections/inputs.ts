/**
 * Section 3, the design inputs: first the cell and its feeds as described (technology,
 * materials, compositions), then every dimensional value of the basis as written, in SI, and
 * with its source: a reference resolved to its citation, an assumption to its text, or the
 * justification written beside the value.
 */
import type { AirStream, DesignBasis, FuelStream, InputRecord } from '../../basis/types.ts';
import type { Results } from '../../plant/results-schema.ts';
import { capitalised as capital, formatNumber, formatPercent, formatTemperature, formatTrimmed } from '../format.ts';
import { pairs, table, type Table, type TableRow } from '../table.ts';
import { prettyUnit } from '../units.ts';
import { speciesText } from '../species-text.ts';
import { feedNames } from '../../basis/stream-rules.ts';

export interface InputsSection {
  description: Table;
  values: Table;
  /** Values written without any source. */
  unsourced: number;
}

/** "R1: citation", "A2: assumption text", or the justification as written. */
export function resolveSource(basis: DesignBasis, source: string | undefined): string {
  if (source === undefined) return 'not stated';
  const id = source.trim();
  const reference = basis.references.find((r) => r.id === id);
  if (reference) return `${reference.id}: ${reference.citation}`;
  const assumption = basis.assumptions.find((a) => a.id === id);
  if (assumption) return `${assumption.id} (assumption): ${assumption.text}`;
  return source;
}

function composition(fractions: Readonly<Record<string, number>>): string {
  return Object.entries(fractions)
    .filter(([, x]) => x > 0)
    .sort((a, b) => b[1] - a[1])
    .map(([species, x]) => `${speciesText(species)} ${formatPercent(x, 3)}`)
    .join(', ');
}

function fuelRows(fuel: FuelStream, power: boolean, name: string): [string, string][] {
  const rows: [string, string][] = [[power ? 'Fuel (dry)' : capital(name), `${fuel.compositionName ? `${fuel.compositionName}: ` : ''}${composition(fuel.composition)}`]];
  if (fuel.steamToCarbon !== undefined) rows.push(['Steam addition', `steam-to-carbon ratio ${formatNumber(fuel.steamToCarbon)}`]);
  else if (fuel.steamPerMoleFuel !== undefined) rows.push(['Steam addition', `${formatNumber(fuel.steamPerMoleFuel)} mol per mol of fuel`]);
  const pre = fuel.preReforming;
  rows.push([
    'Pre-reforming',
    pre.kind === 'equilibrium' ? `equilibrium pre-reformer at ${formatTemperature(pre.temperatureK)}` : pre.kind === 'adiabatic' ? `adiabatic pre-reformer, inlet at ${formatTemperature(pre.inletTemperatureK)}` : 'none',
  ]);
  rows.push(['Feed to the stack (before reforming)', composition(fuel.feed)]);
  return rows;
}

function airRows(air: AirStream, name: string): [string, string][] {
  return [[capital(name), `${air.compositionName ? `${air.compositionName}: ` : ''}${composition(air.composition)}`]];
}

function description(basis: DesignBasis, r: Results): Table {
  const cell = basis.cell;
  const power = cell.mode === 'power';
  const rows: [string, string][] = [
    ['Technology and mode', `${r.technology.name}, ${power ? 'power generation' : 'electrolysis'}`],
    ['Ion carried by the electrolyte', r.technology.ion],
    ['Fuel electrode', cell.fuelElectrode ?? 'not stated'],
    ['Air electrode', cell.airElectrode ?? 'not stated'],
    ['Electrolyte', cell.electrolyte ?? 'not stated'],
    ['Nickel in the fuel electrode or catalyst', `${cell.nickelBearing ? 'yes' : 'no'} (${cell.nickelBearingFrom === 'stated' ? 'stated in the basis' : cell.nickelBearingFrom === 'material text' ? 'read from the material text' : 'usual for the technology'})`],
  ];
  const names = feedNames(cell.technology, cell.mode);
  if (basis.fuelElectrode) rows.push(...fuelRows(basis.fuelElectrode, power, names.fuel));
  else rows.push([capital(names.fuel), 'none']);
  if (basis.airElectrode) rows.push(...airRows(basis.airElectrode, names.air));
  else rows.push([capital(names.air), 'none']);
  return pairs(rows, ['Item', 'As designed'], 'left');
}

function inputCells(basis: DesignBasis, i: InputRecord): string[] {
  return [i.label, i.text, `${formatTrimmed(i.si)}${i.siUnit === '1' ? '' : ` ${prettyUnit(i.siUnit)}`}`, resolveSource(basis, i.source), i.path];
}

const GROUPS: [string, string][] = [
  ['cell', 'Cell'],
  ['conditions', 'Conditions'],
  ['mixtures', 'Compositions defined by the project'],
  ['streams', 'Streams'],
  ['operating-point', 'Operating point'],
  ['sensitivity', 'Sensitivity steps'],
];

export function inputsSection(basis: DesignBasis, r: Results): InputsSection {
  const rows: TableRow[] = [];
  for (const [prefix, title] of GROUPS) {
    const inputs = basis.inputs.filter((i) => i.path.split('.')[0] === prefix);
    if (!inputs.length) continue;
    rows.push({ group: title, cells: [] });
    for (const i of inputs) {
      rows.push({ cells: inputCells(basis, i) });
    }
  }
  const other = basis.inputs.filter((i) => !GROUPS.some(([p]) => i.path.split('.')[0] === p));
  if (other.length) {
    rows.push({ group: 'Other', cells: [] });
    for (const i of other) rows.push({ cells: inputCells(basis, i) });
  }
  return {
    description: description(basis, r),
    values: table(['Quantity', 'As written', 'SI value', 'Source or justification', 'Field'], ['left', 'right', 'right', 'left', 'left'], rows),
    unsourced: basis.inputs.filter((i) => i.source === undefined).length,
  };
}
