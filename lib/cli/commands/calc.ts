/**
 * `cellbasis calc ID|FILE [--section NAME]... [--csv | --json]`: everything the calculation gives
 * for one design basis. As text, the sections a reviewer reads (lib/cli/calc-sections.ts), or
 * those --section names; with --csv one section's table as CSV, the file the document offers;
 * with --json the results object of lib/plant/results-schema.ts (schema/results.schema.json).
 */
import type { Command } from '../command.ts';
import { JSON_OPTION } from '../command.ts';
import { loadProject } from '../load-project.ts';
import { json } from '../../core/plain-text.ts';
import { UserError } from '../../core/errors.ts';
import { CSV_OPTION, checkOutputOptions, chosenSections, sectionOption, tableText } from '../table-output.ts';
import { CALC_SECTIONS, sectionHelp } from '../calc-sections.ts';
import { tableCsv } from '../../report/table.ts';


export const calcCommand: Command = {
  name: 'calc',
  summary: 'compute the design point, efficiencies, heat, carbon margin, sweeps, sensitivities and hazards of a basis',
  usage: 'calc ID|FILE [--section NAME]... [--csv | --json]',
  // The list of sections comes from the registry itself, so the help names every section there is.
  details:
    'Prints the sections marked "printed by default" as tables, or those --section names, in the order given.\n' +
    'With --csv prints one section\'s table as CSV, exactly the file the document offers beside the table.\n' +
    'With --json prints the whole results object (documented by schema/results.schema.json; units in the key names).\n' +
    'Sections:\n' +
    sectionHelp(),
  positionals: [1, 1],
  options: [sectionOption('section of the list above'), CSV_OPTION, JSON_OPTION],
  async run(args, io) {
    checkOutputOptions(args, 'calc');
    const list = CALC_SECTIONS;
    const chosen = chosenSections(args, list.map((s) => s.name), 'calc');
    if (args.values.json && chosen) throw new UserError('calc: --json prints the whole results object; --section chooses the tables of the text or CSV output (see cellbasis calc --help)');
    if (args.values.csv && chosen?.length !== 1) throw new UserError('calc: --csv prints one table: name it with --section NAME (see cellbasis calc --help)');
    const basis = loadProject(args.positionals[0]!, io);
    const { calculate } = await import('../../plant/calculate.ts');
    const { formatFinding } = await import('../../plant/located-error.ts');
    const { everyFinding } = await import('../../plant/findings.ts');
    const results = calculate(basis);
    for (const finding of everyFinding(results)) io.err(`${formatFinding(basis, finding)}\n`);
    if (args.values.json) {
      io.out(json(results));
      return 0;
    }
    const wanted = chosen ? chosen.map((name) => list.find((s) => s.name === name)!) : list.filter((s) => s.standard);
    if (args.values.csv) {
      const section = wanted[0]!;
      const t = await section.table({ basis, results });
      if (!t) throw new UserError(`calc: ${basis.file} has no table "${section.name}" (${section.title}): its results do not hold one`, 1);
      io.out(tableCsv(t));
      return 0;
    }
    io.out(`${basis.file}: ${results.project.title} (${results.technology.name}, ${results.technology.mode} mode)\n`);
    for (const section of wanted) {
      const t = await section.table({ basis, results });
      io.out(`\n${t ? tableText(t, section.title) : `${section.title}\n(none: the results of this basis hold no such table)\n`}`);
    }
    if (!chosen && results.cases.length) {
      // The tables above are the sizing case's: say so, and print the envelope over the cases.
      const sizing = results.cases.find((c) => c.sizing)!;
      const envelope = await list.find((s) => s.name === 'envelope')!.table({ basis, results });
      io.out(`\nthe figures above are those of the sizing case, ${sizing.id}; the envelope over the ${results.cases.length} cases (${results.cases.map((c) => c.id).join(', ')}):\n`);
      if (envelope) io.out(tableText(envelope, null));
    }
    return 0;
  },
};
