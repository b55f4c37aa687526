/**
 * `cellbasis equilibrium --temperature T --pressure P --feed FEED [--inert SPECIES]...
 * [--min-fraction X] [--graphite] [--csv | --json]`: the ideal-gas equilibrium of a feed by Gibbs
 * minimisation (lib/equilibrium/equilibrate.ts), its composition as a table of the species at or
 * above the print threshold.
 */
import type { Command } from '../command.ts';
import { JSON_OPTION, optionalString, requireString } from '../command.ts';
import { equilibrate } from '../../equilibrium/equilibrate.ts';
import { getSpecies } from '../../thermo/species-data.ts';
import { parseFeedOption } from '../feed.ts';
import { pressureOption, temperatureOption } from '../values.ts';
import { json, sig, table } from '../../core/plain-text.ts';
import { UserError } from '../../core/errors.ts';
import { kelvinWithCelsius } from '../../core/temperature-text.ts';
import { recordsTable } from '../../report/table.ts';
import { CSV_OPTION, checkOutputOptions, printTable } from '../table-output.ts';

/** Mole fractions below this are left out of the table unless --min-fraction says otherwise: 1 ppm. */
const DEFAULT_MIN_FRACTION = 1e-6;

function minFraction(text: string | undefined): number {
  if (text === undefined) return DEFAULT_MIN_FRACTION;
  const value = Number(text);
  if (text.trim() === '' || !Number.isFinite(value) || value < 0 || value > 1) throw new UserError(`--min-fraction: expected a mole fraction from 0 to 1 such as 1e-6, got "${text}"`);
  return value;
}

function inertOption(given: string | boolean | string[] | undefined): string[] {
  const list = given === undefined ? [] : Array.isArray(given) ? given : [String(given)];
  return [...new Set(list.flatMap((v) => v.split(',')).map((v) => v.trim()).filter((v) => v !== '').map((v) => getSpecies(v).label))];
}

export const equilibriumCommand: Command = {
  name: 'equilibrium',
  summary: 'ideal-gas equilibrium composition of a feed at a temperature and pressure (Gibbs minimisation)',
  usage: 'equilibrium --temperature T --pressure P --feed "CH4=1, H2O=2" [--inert SPECIES]... [--min-fraction X] [--graphite] [--csv | --json]',
  details:
    "Every gas species of the species data made of the feed's elements is considered, except that an --inert\n" +
    'species of the feed reacts with nothing (neither forms nor is consumed) but still dilutes the gas.\n' +
    'Carbon activity is relative to graphite (above 1: carbon can deposit). With --graphite, solid\n' +
    'carbon may form as a pure phase. The table lists the species at or above --min-fraction (default 1e-6)\n' +
    'and says how many it leaves out; --json gives every species considered.',
  positionals: [0, 0],
  options: [
    { name: 'temperature', type: 'string', value: 'T', description: 'temperature with unit (K, C, F)' },
    { name: 'pressure', type: 'string', value: 'P', description: 'absolute pressure with unit (bar, kPa, psi, atm; gauge as barg)' },
    { name: 'feed', type: 'string', value: 'FEED', description: 'species and amounts, "CH4=1, H2O=2" (mol; only ratios matter)' },
    { name: 'inert', type: 'string', value: 'SPECIES', multiple: true, description: 'a species of the feed that takes part in no reaction (repeat, or separate with commas): "N2"' },
    { name: 'min-fraction', type: 'string', value: 'X', description: 'list only species with a mole fraction of at least X (default 1e-6; 0 lists every one)' },
    { name: 'graphite', type: 'boolean', description: 'let graphite form as a pure solid phase' },
    CSV_OPTION,
    JSON_OPTION,
  ],
  run(args, io) {
    checkOutputOptions(args, 'equilibrium');
    const temperatureK = temperatureOption(requireString(args, 'temperature', 'equilibrium'));
    const pressureBar = pressureOption(requireString(args, 'pressure', 'equilibrium'));
    const feed = parseFeedOption(requireString(args, 'feed', 'equilibrium'));
    const inert = inertOption(args.values.inert);
    const threshold = minFraction(optionalString(args, 'min-fraction'));
    const e = equilibrate({ temperatureK, pressureBar, feed, allowGraphite: args.values.graphite === true, inert });
    const feedTotal = Object.values(feed).reduce((a, b) => a + b, 0);
    if (args.values.json) {
      io.out(
        json({
          temperature_K: temperatureK,
          pressure_bar: pressureBar,
          ...(inert.length ? { inert } : {}),
          moleFractions: e.moleFractions,
          carbonActivity: e.carbonActivity,
          elementBalanceError: e.elementBalanceError,
          ...(args.values.graphite ? { graphite_mol_per_mol_feed: e.graphite / feedTotal } : {}),
        }),
      );
      return 0;
    }
    const listed = Object.entries(e.moleFractions)
      .filter(([, x]) => x >= threshold)
      .sort((a, b) => b[1] - a[1]);
    const composition = recordsTable<[string, number]>({
      name: 'equilibrium',
      title: 'Equilibrium composition',
      columns: [
        { head: 'species', align: 'left', text: ([k]) => `${k}${inert.includes(k) ? ' (inert)' : ''}`, data: [{ name: 'Species', unit: '', value: ([k]) => k }] },
        { head: 'mole fraction', align: 'right', text: ([, x]) => (x >= 1e-4 ? x.toFixed(6) : x.toExponential(3)), data: [{ name: 'Mole fraction', unit: 'mol/mol', value: ([, x]) => x }] },
        { head: 'mol per mol of feed', align: 'right', text: ([k]) => sig(e.amounts[k]! / feedTotal, 6), data: [{ name: 'Amount per mole of feed', unit: 'mol/mol', value: ([k]) => e.amounts[k]! / feedTotal }] },
      ],
      groups: [{ items: listed }],
    });
    if (args.values.csv) {
      printTable(io, args, composition);
      return 0;
    }
    io.out(
      table([
        ['temperature', kelvinWithCelsius(temperatureK, sig)],
        ['pressure', `${sig(pressureBar)} bar`],
        ['feed', Object.entries(feed).map(([k, v]) => `${k}=${sig(v)}`).join(', ')],
        ...(inert.length ? [['inert', inert.join(', ')] as [string, string]] : []),
        ['carbon activity', `${sig(e.carbonActivity, 4)}${e.carbonActivity > 1 ? ' (above 1: carbon can deposit)' : ''}`],
        ...(args.values.graphite ? [['graphite formed', `${sig(e.graphite, 4)} mol`] as [string, string]] : []),
        ['element balance error', sig(e.elementBalanceError, 2)],
        ['iterations', String(e.iterations)],
      ]),
    );
    io.out('\n');
    printTable(io, args, composition);
    const left = Object.keys(e.moleFractions).length - listed.length;
    if (left > 0) io.out(`(${left} species below a mole fraction of ${threshold.toExponential()} left out; --min-fraction 0 lists them)\n`);
    return 0;
  },
};
