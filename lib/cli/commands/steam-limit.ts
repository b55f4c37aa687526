import type { Command } from '../command.ts';
import { JSON_OPTION, requireString } from '../command.ts';
import { minimumSteamToCarbon } from '../../equilibrium/carbon.ts';
import { parseFeedOption } from '../feed.ts';
import { pressureOption, temperatureOption } from '../values.ts';
import { json, sig } from '../../core/plain-text.ts';
import { pairsTable, quantity } from '../../report/table.ts';
import { CSV_OPTION, checkOutputOptions, printTable } from '../table-output.ts';
import { kelvinWithCelsius } from '../../core/temperature-text.ts';

export const steamLimitCommand: Command = {
  name: 'steam-limit',
  summary: 'least steam-to-carbon ratio that keeps the equilibrated fuel gas free of carbon',
  usage: 'steam-limit --fuel "CH4=1" --temperature T --pressure P [--csv | --json]',
  details:
    'S/C counts mol of steam per mol of combustible carbon (every carbon but that of CO2). The limit is\n' +
    'the S/C at which the gas-only equilibrium has carbon activity 1 relative to graphite.',
  positionals: [0, 0],
  options: [
    { name: 'fuel', type: 'string', value: 'FUEL', description: 'dry fuel composition, "CH4=0.95, C2H6=0.03, CO2=0.02"' },
    { name: 'temperature', type: 'string', value: 'T', description: 'temperature with unit (K, C, F)' },
    { name: 'pressure', type: 'string', value: 'P', description: 'absolute pressure with unit' },
    CSV_OPTION,
    JSON_OPTION,
  ],
  run(args, io) {
    checkOutputOptions(args, 'steam-limit');
    const fuel = parseFeedOption(requireString(args, 'fuel', 'steam-limit'), 'fuel');
    const temperatureK = temperatureOption(requireString(args, 'temperature', 'steam-limit'));
    const pressureBar = pressureOption(requireString(args, 'pressure', 'steam-limit'));
    const limit = minimumSteamToCarbon(fuel, temperatureK, pressureBar);
    if (args.values.json) {
      io.out(json({ temperature_K: temperatureK, pressure_bar: pressureBar, fuel, minimumSteamToCarbon: limit.minimumSteamToCarbon }));
      return 0;
    }
    const fuelText = Object.entries(fuel).map(([k, v]) => `${k}=${sig(v)}`).join(', ');
    const rows = [
      quantity('fuel', fuelText, '', fuelText),
      quantity('temperature', temperatureK, 'K', kelvinWithCelsius(temperatureK, sig)),
      quantity('pressure', pressureBar, 'bar', `${sig(pressureBar)} bar`),
      quantity('carbon activity without steam', limit.dryCarbonActivity, '', sig(limit.dryCarbonActivity, 4)),
      quantity('minimum steam-to-carbon ratio', limit.minimumSteamToCarbon, '', sig(limit.minimumSteamToCarbon, 4)),
    ];
    printTable(io, args, pairsTable('steam-limit', 'Carbon limit', rows));
    return 0;
  },
};
