/**
 * `cellbasis hazards ID|FILE [--severity LEVEL] [--section NAME]... [--csv | --json]`: the hazard
 * assessment of a basis, standing notice first; --severity keeps the cautions of that level and
 * graver ones, --section prints chosen tables of the document's hazards section, --csv one of them.
 */
import type { Command } from '../command.ts';
import { JSON_OPTION, optionalString } from '../command.ts';
import { loadProject } from '../load-project.ts';
import { json } from '../../core/plain-text.ts';
import { UserError } from '../../core/errors.ts';
import { didYouMean } from '../../core/suggest.ts';
import { SEVERITIES, type Severity } from '../../hazards/types.ts';
import { CSV_OPTION, checkOutputOptions, chosenSections, printTable, sectionOption } from '../table-output.ts';

/** The hazard tables --section chooses from: the cautions, and the document's stream indicators and substances. */
const TABLES = ['cautions', 'hazard-streams', 'substances'] as const;

function severityOption(text: string | undefined): Severity | null {
  if (text === undefined) return null;
  const level = text.trim().toLowerCase();
  if (!(SEVERITIES as readonly string[]).includes(level)) throw new UserError(`hazards: --severity: no level "${text}"${didYouMean(level, SEVERITIES)}; the levels, gravest first: ${SEVERITIES.join(', ')}`);
  return level as Severity;
}

export const hazardsCommand: Command = {
  name: 'hazards',
  summary: 'hazards and handling cautions that follow from the streams of a basis, with their standards',
  usage: 'hazards ID|FILE [--severity LEVEL] [--section NAME]... [--csv | --json]',
  details:
    'Informational only: local codes, the authority having jurisdiction and licensed professional practice govern.\n' +
    `Severity levels, gravest first: ${SEVERITIES.join(', ')}. --severity LEVEL keeps the cautions of that level and the\n` +
    'graver ones, in the text, the cautions table and --json alike. Tables for --section: cautions, hazard-streams (the\n' +
    "indicators of every stream), substances (their hazard data and sources); --csv prints one of them, the cautions\n" +
    'unless --section names another.',
  positionals: [1, 1],
  options: [
    { name: 'severity', type: 'string', value: 'LEVEL', description: `keep only cautions of this level or a graver one (${SEVERITIES.join(', ')})` },
    sectionOption('table (cautions, hazard-streams, substances)'),
    CSV_OPTION,
    JSON_OPTION,
  ],
  async run(args, io) {
    checkOutputOptions(args, 'hazards');
    const level = severityOption(optionalString(args, 'severity'));
    const chosen = chosenSections(args, TABLES, 'hazards');
    if (args.values.json && chosen) throw new UserError('hazards: --json prints the whole assessment; --section chooses the tables of the text or CSV output (see cellbasis hazards --help)');
    if (args.values.csv && chosen && chosen.length !== 1) throw new UserError('hazards: --csv prints one table: name one with --section (see cellbasis hazards --help)');
    const basis = loadProject(args.positionals[0]!, io);
    const { evaluateBasis } = await import('../../plant/calculate.ts');
    const { hazardInput } = await import('../../plant/hazard-streams.ts');
    const { assessHazards } = await import('../../hazards/assessment.ts');
    const { plantBalance } = await import('../../plant/plant-balance.ts');
    const { locateCalculationErrors } = await import('../../plant/located-error.ts');
    const point = evaluateBasis(basis);
    const plant = locateCalculationErrors(basis, () => plantBalance(point, basis.plant));
    const full = assessHazards(hazardInput(basis, point, plant));
    const kept = level === null ? full.cautions : full.cautions.filter((c) => SEVERITIES.indexOf(c.severity) <= SEVERITIES.indexOf(level));
    const assessment = { ...full, cautions: kept };
    if (args.values.json) {
      io.out(json(assessment));
      return 0;
    }
    const { cautionsTable, hazardStreamTable, substancesTable } = await import('../../report/sections/hazards.ts');
    const table = (name: (typeof TABLES)[number]) =>
      name === 'cautions' ? cautionsTable(assessment) : name === 'hazard-streams' ? hazardStreamTable(assessment.streams) : substancesTable(assessment.substances);
    const left = full.cautions.length - kept.length;
    const leftOut = left > 0 ? `(${left} caution${left === 1 ? '' : 's'} below ${level} left out)\n` : '';
    if (args.values.csv) {
      printTable(io, args, table((chosen?.[0] as (typeof TABLES)[number] | undefined) ?? 'cautions'));
      return 0;
    }
    if (chosen) {
      const { wrap } = await import('../../hazards/format-text.ts');
      io.out(wrap(assessment.notice));
      for (const name of chosen) {
        io.out('\n');
        printTable(io, args, table(name as (typeof TABLES)[number]));
        if (name === 'cautions') io.out(leftOut);
      }
      return 0;
    }
    const { formatHazardsText } = await import('../../hazards/format-text.ts');
    io.out(formatHazardsText(assessment));
    io.out(leftOut);
    return 0;
  },
};
