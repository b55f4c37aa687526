import type { Command } from '../command.ts';
import { JSON_OPTION, requireString } from '../command.ts';
import { allSpecies, getSpecies } from '../../thermo/species-data.ts';
import { speciesProperties } from '../../thermo/properties.ts';
import { temperatureOption } from '../values.ts';
import { grid, json, sig, table } from '../../core/plain-text.ts';
import { UserError } from '../../core/errors.ts';

export const speciesCommand: Command = {
  name: 'species',
  summary: 'properties of one species at a temperature (NASA Glenn data), or the list of species',
  usage: 'species NAME --temperature T [--json] | species --list',
  details: 'cp, h (heat of formation at 298.15 K included), s (1 bar) and g = h − Ts. T as for reaction.',
  positionals: [0, 1],
  options: [
    { name: 'temperature', type: 'string', value: 'T', description: 'temperature with unit (K, C, F)' },
    { name: 'list', type: 'boolean', description: 'list every species in the data with its formula and valid range' },
    JSON_OPTION,
  ],
  run(args, io) {
    if (args.values.list) {
      const rows = allSpecies().map((s) => [
        s.label,
        s.nasaName,
        s.phase,
        Object.entries(s.formula).map(([e, n]) => `${e}${n === 1 ? '' : n}`).join(' '),
        sig(s.molarMassKgPerMol * 1000, 7),
        `${s.lowK}-${s.highK}`,
      ]);
      if (args.values.json) io.out(json(rows.map(([label, nasa, phase, formula, mm, range]) => ({ label, nasa, phase, formula, molarMass_g_per_mol: Number(mm), range_K: range }))));
      else io.out(grid(['species', 'NASA record', 'phase', 'formula', 'M g/mol', 'range K'], rows));
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
    io.out(
      table([
        ['species', `${p.species} (NASA record ${species.nasaName}, ${species.phase})`],
        ['formula', Object.entries(species.formula).map(([e, n]) => `${e}${n === 1 ? '' : n}`).join(' ')],
        ['molar mass', `${sig(species.molarMassKgPerMol * 1000, 7)} g/mol`],
        ['valid range', `${species.lowK} K to ${species.highK} K`],
        ['temperature', `${sig(p.temperature_K)} K`],
        ['cp', `${sig(p.cp_J_per_mol_K)} J/(mol K)`],
        ['h', `${sig(p.h_J_per_mol / 1000)} kJ/mol`],
        ['s', `${sig(p.s_J_per_mol_K)} J/(mol K)`],
        ['g = h − Ts', `${sig(p.g_J_per_mol / 1000)} kJ/mol`],
      ]),
    );
    return 0;
  },
};
