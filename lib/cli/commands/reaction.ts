/**
 * `cellbasis reaction "EQUATION" --temperature T [--electrons N] [--csv | --json]`: ΔH°, ΔS°, ΔG°
 * and the equilibrium constant of any reaction at T, and, where electrons pass (a reaction with
 * O2, or --electrons given), the reversible and thermoneutral voltages.
 */
import type { Command } from '../command.ts';
import { JSON_OPTION, requireString, optionalString } from '../command.ts';
import { chemicalProperties, inferredElectrons, reactionProperties, type ChemicalProperties, type ReactionProperties } from '../../electrochem/reaction.ts';
import { parseEquation, type Equation } from '../../electrochem/equation.ts';
import { temperatureOption } from '../values.ts';
import { json, sig } from '../../core/plain-text.ts';
import { UserError } from '../../core/errors.ts';
import { kelvinWithCelsius } from '../../core/temperature-text.ts';
import { pairsTable, quantity, type Pair } from '../../report/table.ts';
import { CSV_OPTION, checkOutputOptions, printTable } from '../table-output.ts';

/** The electrons of --electrons: a positive number, or undefined where the option is not given. */
function electronsOption(text: string | undefined): number | undefined {
  if (text === undefined) return undefined;
  const given = Number(text);
  if (!(given > 0) || !Number.isFinite(given)) throw new UserError(`--electrons: expected a positive number, got "${text}"`);
  return given;
}

/** The rows every reaction gets: ΔH°, ΔS°, ΔG° and K, in bar to the power of the change in gas moles. */
function chemicalRows(equation: Equation, c: ChemicalProperties, electrons: number | null): Pair[] {
  const gasMoles = equation.terms.filter((t) => t.species.phase === 'gas').reduce((sum, t) => sum + t.nu, 0);
  const kUnit = Math.abs(gasMoles) < 1e-12 ? '' : `bar^${Number(gasMoles.toPrecision(12))}`;
  return [
    quantity('reaction', c.reaction, '', c.reaction),
    quantity('temperature', c.temperature_K, 'K', kelvinWithCelsius(c.temperature_K, sig)),
    quantity('electrons n', electrons, '', electrons === null ? 'none: a chemical reaction (no O2; give --electrons N for a cell reaction)' : sig(electrons)),
    quantity('ΔH°', c.deltaH_J_per_mol, 'J/mol', `${sig(c.deltaH_J_per_mol / 1000)} kJ/mol`),
    quantity('ΔS°', c.deltaS_J_per_mol_K, 'J/(mol K)', `${sig(c.deltaS_J_per_mol_K)} J/(mol K)`),
    quantity('ΔG°', c.deltaG_J_per_mol, 'J/mol', `${sig(c.deltaG_J_per_mol / 1000)} kJ/mol`),
    quantity(
      'equilibrium constant K',
      c.equilibriumConstant,
      kUnit,
      c.equilibriumConstant === null ? 'beyond double precision (see log10 K)' : `${sig(c.equilibriumConstant)}${kUnit ? ` ${kUnit}` : ''} (pressures in bar)`,
    ),
    quantity('log10 K', c.log10EquilibriumConstant, '', sig(c.log10EquilibriumConstant)),
  ];
}

/** Where electrons pass, the direction and the reversible and thermoneutral voltages; else which side equilibrium favours. */
function cellRows(c: ChemicalProperties, cell: ReactionProperties | null): Pair[] {
  if (!cell) {
    return [quantity('at equilibrium', c.deltaG_J_per_mol < 0 ? 'products favoured' : 'reactants favoured', '', `${c.deltaG_J_per_mol < 0 ? 'products' : 'reactants'} favoured at 1 bar (ΔG° ${c.deltaG_J_per_mol < 0 ? '< 0' : '≥ 0'})`)];
  }
  return [
    quantity('direction', cell.direction, '', `${cell.direction} (ΔG° ${cell.direction === 'galvanic' ? '< 0' : '> 0'})`),
    quantity(cell.direction === 'galvanic' ? 'reversible voltage |ΔG°|/nF' : 'minimum voltage |ΔG°|/nF', cell.reversibleVoltage_V, 'V', `${sig(cell.reversibleVoltage_V, 5)} V`),
    quantity('thermoneutral voltage |ΔH°|/nF', cell.thermoneutralVoltage_V, 'V', `${sig(cell.thermoneutralVoltage_V, 5)} V`),
    quantity('dE/dT', cell.dEdT_V_per_K, 'V/K', `${sig(cell.dEdT_V_per_K * 1000, 4)} mV/K`),
  ];
}

export const reactionCommand: Command = {
  name: 'reaction',
  summary: 'standard reaction properties and equilibrium constant at a temperature, and the cell voltages where electrons pass',
  usage: 'reaction "EQUATION" --temperature T [--electrons N] [--csv | --json]',
  details:
    'EQUATION such as "CH4 + 2 O2 -> CO2 + 2 H2O" or "CO + H2O -> CO2 + H2"; coefficients may be decimals or fractions (1/2).\n' +
    'Every reaction gets ΔH°, ΔS°, ΔG° and its equilibrium constant K = exp(−ΔG°/RT) with log10 K (standard state\n' +
    '1 bar, so K is in bar to the power of the change in gas moles). Electrons default to 4 per O2 consumed or\n' +
    'produced; a reaction without O2 (reforming, shift) passes none, and gets the reversible and thermoneutral\n' +
    'voltages only when --electrons gives them. Liquid water is H2O(L). T accepts 1000K, 1000 K, 726.85C,\n' +
    '726.85 °C or 1340.33F.',
  positionals: [1, 1],
  options: [
    { name: 'temperature', type: 'string', value: 'T', description: 'temperature with unit (K, C, F)' },
    { name: 'electrons', type: 'string', value: 'N', description: 'electrons transferred per reaction as written (default: 4 per O2; none without O2)' },
    CSV_OPTION,
    JSON_OPTION,
  ],
  run(args, io) {
    checkOutputOptions(args, 'reaction');
    const temperatureK = temperatureOption(requireString(args, 'temperature', 'reaction'));
    const given = electronsOption(optionalString(args, 'electrons'));
    const equation = parseEquation(args.positionals[0]!);
    const c = chemicalProperties(equation, temperatureK);
    const electrons = inferredElectrons(equation, given);
    const cell = electrons === null ? null : reactionProperties(equation, temperatureK, electrons);
    if (args.values.json) {
      io.out(
        json({
          reaction: c.reaction,
          electrons,
          temperature_K: c.temperature_K,
          deltaH_J_per_mol: c.deltaH_J_per_mol,
          deltaS_J_per_mol_K: c.deltaS_J_per_mol_K,
          deltaG_J_per_mol: c.deltaG_J_per_mol,
          equilibriumConstant: c.equilibriumConstant,
          log10EquilibriumConstant: c.log10EquilibriumConstant,
          reversibleVoltage_V: cell?.reversibleVoltage_V ?? null,
          thermoneutralVoltage_V: cell?.thermoneutralVoltage_V ?? null,
          direction: cell?.direction ?? null,
        }),
      );
      return 0;
    }
    printTable(io, args, pairsTable('reaction', 'Reaction', [...chemicalRows(equation, c, electrons), ...cellRows(c, cell)]));
    return 0;
  },
};
