import type { Command } from '../command.ts';
import { JSON_OPTION, requireString } from '../command.ts';
import { equilibrate } from '../../equilibrium/equilibrate.ts';
import { parseFeedOption } from '../feed.ts';
import { pressureOption, temperatureOption } from '../values.ts';
import { grid, json, sig, table } from '../../core/plain-text.ts';
import { kelvinWithCelsius } from '../../core/temperature-text.ts';

export const equilibriumCommand: Command = {
  name: 'equilibrium',
  summary: 'ideal-gas equilibrium composition of a feed at a temperature and pressure (Gibbs minimisation)',
  usage: 'equilibrium --temperature T --pressure P --feed "CH4=1, H2O=2" [--graphite] [--json]',
  details:
    'Every gas species of the species data made of the feed\'s elements is considered.\n' +
    'Carbon activity is relative to graphite (above 1: carbon can deposit). With --graphite, solid\n' +
    'carbon may form as a pure phase.',
  positionals: [0, 0],
  options: [
    { name: 'temperature', type: 'string', value: 'T', description: 'temperature with unit (K, C, F)' },
    { name: 'pressure', type: 'string', value: 'P', description: 'absolute pressure with unit (bar, kPa, psi, atm; gauge as barg)' },
    { name: 'feed', type: 'string', value: 'FEED', description: 'species and amounts, "CH4=1, H2O=2" (mol; only ratios matter)' },
    { name: 'graphite', type: 'boolean', description: 'let graphite form as a pure solid phase' },
    JSON_OPTION,
  ],
  run(args, io) {
    const temperatureK = temperatureOption(requireString(args, 'temperature', 'equilibrium'));
    const pressureBar = pressureOption(requireString(args, 'pressure', 'equilibrium'));
    const feed = parseFeedOption(requireString(args, 'feed', 'equilibrium'));
    const e = equilibrate({ temperatureK, pressureBar, feed, allowGraphite: args.values.graphite === true });
    if (args.values.json) {
      io.out(
        json({
          temperature_K: temperatureK,
          pressure_bar: pressureBar,
          moleFractions: e.moleFractions,
          carbonActivity: e.carbonActivity,
          elementBalanceError: e.elementBalanceError,
          ...(args.values.graphite ? { graphite_mol_per_mol_feed: e.graphite / Object.values(feed).reduce((a, b) => a + b, 0) } : {}),
        }),
      );
      return 0;
    }
    io.out(
      table([
        ['temperature', kelvinWithCelsius(temperatureK, sig)],
        ['pressure', `${sig(pressureBar)} bar`],
        ['feed', Object.entries(feed).map(([k, v]) => `${k}=${sig(v)}`).join(', ')],
        ['carbon activity', `${sig(e.carbonActivity, 4)}${e.carbonActivity > 1 ? ' (above 1: carbon can deposit)' : ''}`],
        ...(args.values.graphite ? [['graphite formed', `${sig(e.graphite, 4)} mol`] as [string, string]] : []),
        ['element balance error', sig(e.elementBalanceError, 2)],
        ['iterations', String(e.iterations)],
      ]),
    );
    io.out('\n');
    const rows = Object.entries(e.moleFractions)
      .sort((a, b) => b[1] - a[1])
      .map(([k, v]) => [k, v >= 1e-4 ? v.toFixed(6) : v.toExponential(3)]);
    io.out(grid(['species', 'mole fraction'], rows));
    return 0;
  },
};
