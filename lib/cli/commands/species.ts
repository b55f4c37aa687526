import type { Command } from '../command.ts';
import { JSON_OPTION, requireString } from '../command.ts';
import { allSpecies, getSpecies } from '../../thermo/species-data.ts';
import { speciesProperties } from '../../thermo/properties.ts';
import { temperatureOption } from '../values.ts';
import { json, sig } from '../../core/plain-text.ts';
import { UserError } from '../../core/errors.ts';
import { pairsTable, quantity, recordsTable, type RecordColumn } from '../../report/table.ts';
import { CSV_OPTION, checkOutputOptions, printTable } from '../table-output.ts';
import type { Species } from '../../thermo/species-data.ts';

const formulaText = (s: Species) => Object.entries(s.formula).map(([e, n]) => `${e}${n === 1 ? '' : n}`).join(' ');

/** One column of the species list, its cell and its datum the same text. */
const listed = (head: string, get: (s: Species) => string): RecordColumn<Species> => ({ head, align: 'left', text: get, data: [{ name: head, unit: '', value: get }] });

const LIST_COLUMNS: RecordColumn<Species>[] = [
  listed('species', (s) => s.label),
  listed('NASA record', (s) => s.nasaName),
  listed('phase', (s) => s.phase),
  listed('formula', formulaText),
  { head: 'M g/mol', align: 'right', text: (s) => sig(s.molarMassKgPerMol * 1000, 7), data: [{ name: 'molar mass', unit: 'kg/mol', value: (s) => s.molarMassKgPerMol }] },
  {
    head: 'range K',
    align: 'right',
    text: (s) => `${s.lowK}-${s.highK}`,
    data: [
      { name: 'lowest temperature', unit: 'K', value: (s) => s.lowK },
      { name: 'highest temperature', unit: 'K', value: (s) => s.highK },
    ],
  },
];

export const speciesCommand: Command = {
  name: 'species',
  summary: 'properties of one species at a temperature (NASA Glenn data), or the list of species',
  usage: 'species NAME --temperature T [--csv | --json] | species --list [--csv | --json]',
  details: 'cp, h (heat of formation at 298.15 K included), s (1 bar) and g = h − Ts. T as for reaction.',
  positionals: [0, 1],
  options: [
    { name: 'temperature', type: 'string', value: 'T', description: 'temperature with unit (K, C, F)' },
    { name: 'list', type: 'boolean', description: 'list every species in the data with its formula and valid range' },
    CSV_OPTION,
    JSON_OPTION,
  ],
  run(args, io) {
    checkOutputOptions(args, 'species');
    if (args.values.list) {
      const all = allSpecies();
      if (args.values.json) {
        io.out(json(all.map((s) => ({ label: s.label, nasa: s.nasaName, phase: s.phase, formula: formulaText(s), molarMass_g_per_mol: Number(sig(s.molarMassKgPerMol * 1000, 7)), range_K: `${s.lowK}-${s.highK}` }))));
      } else {
        const t = recordsTable({ name: 'species', title: 'Species', columns: LIST_COLUMNS, groups: [{ items: all }] });
        // The list has no title line: `species --list | head` shows the header first.
        printTable(io, args, t, null);
      }
      return 0;
    }
    const name = args.positionals[0];
    if (name === undefined) throw new UserError('species: give a species NAME, or --list (see cellbasis species --help)');
    const species = getSpecies(name);
    const temperatureK = temperatureOption(requireString(args, 'temperature', 'species'));
    const p = speciesProperties(species, temperatureK);
    if (args.values.json) {
      io.out(json(p));
      return 0;
    }
    const rows = [
      quantity('species', p.species, '', `${p.species} (NASA record ${species.nasaName}, ${species.phase})`),
      quantity('formula', formulaText(species), '', formulaText(species)),
      quantity('molar mass', species.molarMassKgPerMol, 'kg/mol', `${sig(species.molarMassKgPerMol * 1000, 7)} g/mol`),
      {
        label: 'valid range',
        text: `${species.lowK} K to ${species.highK} K`,
        data: [
          { name: 'lowest temperature', unit: 'K', value: species.lowK },
          { name: 'highest temperature', unit: 'K', value: species.highK },
        ],
      },
      quantity('temperature', p.temperature_K, 'K', `${sig(p.temperature_K)} K`),
      quantity('cp', p.cp_J_per_mol_K, 'J/(mol K)', `${sig(p.cp_J_per_mol_K)} J/(mol K)`),
      quantity('h', p.h_J_per_mol, 'J/mol', `${sig(p.h_J_per_mol / 1000)} kJ/mol`),
      quantity('s', p.s_J_per_mol_K, 'J/(mol K)', `${sig(p.s_J_per_mol_K)} J/(mol K)`),
      quantity('g = h − Ts', p.g_J_per_mol, 'J/mol', `${sig(p.g_J_per_mol / 1000)} kJ/mol`),
    ];
    printTable(io, args, pairsTable('species', 'Species properties', rows));
    return 0;
  },
};
