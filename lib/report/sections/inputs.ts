/**
 * Section 3, the design inputs: first the cell and its feeds as described (technology,
 * materials, compositions), then every dimensional value of the basis as written, in SI, and
 * with its source: a reference resolved to its citation, an assumption to its text, or the
 * justification written beside the value.
 */
import type { DesignBasis, FuelStream, InputRecord } from '../../basis/types.ts';
import type { Results } from '../../plant/results-schema.ts';
import { capitalised as capital, formatNumber, formatPercent, formatTemperature, formatTrimmed } from '../format.ts';
import { pairsTable, recordsTable, textPair, type Pair, type RecordColumn, type Table } from '../table.ts';
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
function resolveSource(basis: DesignBasis, source: string | undefined): string {
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

/**
 * A composition row: its name and mole fractions as text, and in the data the name and a mole
 * fraction per species, under `dataLabel` (the label, unless two rows share it).
 */
function compositionPair(label: string, name: string | undefined, fractions: Readonly<Record<string, number>>, dataLabel = label): Pair {
  const present = Object.entries(fractions).filter(([, x]) => x > 0);
  return {
    label,
    text: `${name ? `${name}: ` : ''}${composition(fractions)}`,
    data: [
      ...(name ? [{ name: `${dataLabel}, composition`, unit: '', value: name }] : []),
      ...present.map(([species, x]) => ({ name: `${dataLabel}, mole fraction ${species}`, unit: 'mol/mol', value: x })),
    ],
  };
}

function fuelRows(fuel: FuelStream, power: boolean, name: string, dataLabel: string): Pair[] {
  const rows: Pair[] = [power ? compositionPair('Fuel (dry)', fuel.compositionName, fuel.composition) : compositionPair(capital(name), fuel.compositionName, fuel.composition, dataLabel)];
  if (fuel.steamToCarbon !== undefined) rows.push({ label: 'Steam addition', text: `steam-to-carbon ratio ${formatNumber(fuel.steamToCarbon)}`, data: [{ name: 'Steam-to-carbon ratio', unit: '', value: fuel.steamToCarbon }] });
  else if (fuel.steamPerMoleFuel !== undefined) rows.push({ label: 'Steam addition', text: `${formatNumber(fuel.steamPerMoleFuel)} mol per mol of fuel`, data: [{ name: 'Steam per mole of fuel', unit: 'mol/mol', value: fuel.steamPerMoleFuel }] });
  const pre = fuel.preReforming;
  rows.push(
    pre.kind === 'equilibrium'
      ? { label: 'Pre-reforming', text: `equilibrium pre-reformer at ${formatTemperature(pre.temperatureK)}`, data: [{ name: 'Pre-reforming', unit: '', value: 'equilibrium' }, { name: 'Pre-reformer temperature', unit: 'K', value: pre.temperatureK }] }
      : pre.kind === 'adiabatic'
        ? { label: 'Pre-reforming', text: `adiabatic pre-reformer, inlet at ${formatTemperature(pre.inletTemperatureK)}`, data: [{ name: 'Pre-reforming', unit: '', value: 'adiabatic' }, { name: 'Pre-reformer inlet temperature', unit: 'K', value: pre.inletTemperatureK }] }
        : textPair('Pre-reforming', 'none'),
  );
  rows.push(compositionPair('Feed to the stack (before reforming)', undefined, fuel.feed));
  return rows;
}

function description(basis: DesignBasis, r: Results): Table {
  const cell = basis.cell;
  const power = cell.mode === 'power';
  const nickelFrom = cell.nickelBearingFrom === 'stated' ? 'stated in the basis' : cell.nickelBearingFrom === 'material text' ? 'read from the material text' : 'usual for the technology';
  const rows: Pair[] = [
    {
      label: 'Technology and mode',
      text: `${r.technology.name}, ${power ? 'power generation' : 'electrolysis'}`,
      data: [
        { name: 'Technology', unit: '', value: r.technology.name },
        { name: 'Mode', unit: '', value: power ? 'power generation' : 'electrolysis' },
      ],
    },
    textPair('Ion carried by the electrolyte', r.technology.ion),
    textPair('Fuel electrode', cell.fuelElectrode ?? 'not stated'),
    textPair('Air electrode', cell.airElectrode ?? 'not stated'),
    textPair('Electrolyte', cell.electrolyte ?? 'not stated'),
    {
      label: 'Nickel in the fuel electrode or catalyst',
      text: `${cell.nickelBearing ? 'yes' : 'no'} (${nickelFrom})`,
      data: [
        { name: 'Nickel in the fuel electrode or catalyst', unit: '', value: cell.nickelBearing },
        { name: 'Nickel in the fuel electrode or catalyst, known from', unit: '', value: nickelFrom },
      ],
    },
  ];
  const names = feedNames(cell.technology, cell.mode);
  // An alkaline electrolyser's two feeds share a name (water to the electrolyte): the data names the electrode too.
  const shared = names.fuel === names.air;
  const fuelData = shared ? `${capital(names.fuel)}, fuel electrode` : capital(names.fuel);
  const airData = shared ? `${capital(names.air)}, air electrode` : capital(names.air);
  if (basis.fuelElectrode) rows.push(...fuelRows(basis.fuelElectrode, power, names.fuel, fuelData));
  else rows.push({ label: capital(names.fuel), text: 'none', data: [{ name: fuelData, unit: '', value: 'none' }] });
  // A cathode-gas loop's feed is computed (the plant section shows it); the basis gives its burner air.
  const airLabel = basis.airElectrode?.cathodeLoop ? `${capital(names.air)}: burner air of its cathode-gas loop` : capital(names.air);
  if (basis.airElectrode) rows.push(compositionPair(airLabel, basis.airElectrode.compositionName, basis.airElectrode.composition, airData));
  else rows.push({ label: capital(names.air), text: 'none', data: [{ name: airData, unit: '', value: 'none' }] });
  return pairsTable('cell-and-feeds', 'The cell and its feeds', rows, ['Item', 'As designed'], 'left');
}

const siUnit = (i: InputRecord) => (i.siUnit === '1' ? '' : i.siUnit);

const INPUT_COLUMNS: RecordColumn<{ basis: DesignBasis; input: InputRecord }>[] = [
  { head: 'Quantity', align: 'left', text: ({ input }) => input.label, data: [{ name: 'Quantity', unit: '', value: ({ input }) => input.label }] },
  { head: 'As written', align: 'right', text: ({ input }) => input.text, data: [{ name: 'As written', unit: '', value: ({ input }) => input.text }] },
  {
    head: 'SI value',
    align: 'right',
    text: ({ input }) => `${formatTrimmed(input.si)}${siUnit(input) === '' ? '' : ` ${prettyUnit(input.siUnit)}`}`,
    data: [
      { name: 'SI value', unit: '', value: ({ input }) => input.si },
      { name: 'SI unit', unit: '', value: ({ input }) => siUnit(input) },
    ],
  },
  { head: 'Source or justification', align: 'left', text: ({ basis, input }) => resolveSource(basis, input.source), data: [{ name: 'Source or justification', unit: '', value: ({ basis, input }) => resolveSource(basis, input.source) }] },
  { head: 'Field', align: 'left', text: ({ input }) => input.path, data: [{ name: 'Field', unit: '', value: ({ input }) => input.path }] },
];

const GROUPS: [string, string][] = [
  ['cell', 'Cell'],
  ['conditions', 'Conditions'],
  ['mixtures', 'Compositions defined by the project'],
  ['streams', 'Streams'],
  ['operating-point', 'Operating point'],
  ['plant', 'The plant around the stack'],
  ['sensitivity', 'Sensitivity steps'],
];

export function inputsSection(basis: DesignBasis, r: Results): InputsSection {
  const prefix = (i: InputRecord) => i.path.split('.')[0];
  const groups = [
    ...GROUPS.map(([p, title]) => ({ title, items: basis.inputs.filter((i) => prefix(i) === p) })),
    { title: 'Other', items: basis.inputs.filter((i) => !GROUPS.some(([p]) => prefix(i) === p)) },
  ].map((g) => ({ title: g.title, items: g.items.map((input) => ({ basis, input })) }));
  return {
    description: description(basis, r),
    values: recordsTable({ name: 'inputs', title: 'Design inputs', columns: INPUT_COLUMNS, groups }),
    unsourced: basis.inputs.filter((i) => i.source === undefined).length,
  };
}
