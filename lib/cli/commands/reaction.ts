import type { Command } from '../command.ts';
import { JSON_OPTION, requireString, optionalString } from '../command.ts';
import { evaluateReaction } from '../../electrochem/reaction.ts';
import { temperatureOption } from '../values.ts';
import { json, sig, table } from '../../core/plain-text.ts';
import { UserError } from '../../core/errors.ts';
import { kelvinWithCelsius } from '../../core/temperature-text.ts';

export const reactionCommand: Command = {
  name: 'reaction',
  summary: 'standard reaction properties and reversible and thermoneutral voltage at a temperature',
  usage: 'reaction "EQUATION" --temperature T [--electrons N] [--json]',
  details:
    'EQUATION such as "CH4 + 2 O2 -> CO2 + 2 H2O"; coefficients may be decimals or fractions (1/2).\n' +
    'Electrons default to 4 per O2 consumed or produced. Standard state 1 bar; liquid water is H2O(L).\n' +
    'T accepts 1000K, 1000 K, 726.85C, 726.85 °C or 1340.33F.',
  positionals: [1, 1],
  options: [
    { name: 'temperature', type: 'string', value: 'T', description: 'temperature with unit (K, C, F)' },
    { name: 'electrons', type: 'string', value: 'N', description: 'electrons transferred per reaction as written (default: 4 per O2)' },
    JSON_OPTION,
  ],
  run(args, io) {
    const temperatureK = temperatureOption(requireString(args, 'temperature', 'reaction'));
    const electronsText = optionalString(args, 'electrons');
    let electrons: number | undefined;
    if (electronsText !== undefined) {
      electrons = Number(electronsText);
      if (!(electrons > 0)) throw new UserError(`--electrons: expected a positive number, got "${electronsText}"`);
    }
    const r = evaluateReaction(args.positionals[0]!, temperatureK, electrons);
    if (args.values.json) {
      // Exactly the documented keys; dE/dT is in the table and in the library result.
      const { dEdT_V_per_K: _dEdT, ...documented } = r;
      io.out(json(documented));
      return 0;
    }
    io.out(
      table([
        ['reaction', r.reaction],
        ['temperature', kelvinWithCelsius(r.temperature_K, sig)],
        ['electrons n', sig(r.electrons)],
        ['ΔH°', `${sig(r.deltaH_J_per_mol / 1000)} kJ/mol`],
        ['ΔS°', `${sig(r.deltaS_J_per_mol_K)} J/(mol K)`],
        ['ΔG°', `${sig(r.deltaG_J_per_mol / 1000)} kJ/mol`],
        ['direction', `${r.direction} (ΔG° ${r.direction === 'galvanic' ? '< 0' : '> 0'})`],
        [r.direction === 'galvanic' ? 'reversible voltage |ΔG°|/nF' : 'minimum voltage |ΔG°|/nF', `${sig(r.reversibleVoltage_V, 5)} V`],
        ['thermoneutral voltage |ΔH°|/nF', `${sig(r.thermoneutralVoltage_V, 5)} V`],
        ['dE/dT', `${sig(r.dEdT_V_per_K * 1000, 4)} mV/K`],
      ]),
    );
    return 0;
  },
};
