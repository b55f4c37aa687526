/**
 * `cellbasis calc ID|FILE [--json]`: everything the calculation gives for one design basis;
 * with --json the results object of lib/plant/results-schema.ts (schema/results.schema.json).
 */
import type { Command } from '../command.ts';
import { JSON_OPTION } from '../command.ts';
import { loadProject } from '../load-project.ts';
import { json, table } from '../../core/plain-text.ts';
import { envelopeRows, headlineRows } from '../results-table.ts';

export const calcCommand: Command = {
  name: 'calc',
  summary: 'compute the design point, efficiencies, heat, carbon margin, sweeps, sensitivities and hazards of a basis',
  usage: 'calc ID|FILE [--json]',
  details: 'With --json prints one results object (documented by schema/results.schema.json; units in the key names).',
  positionals: [1, 1],
  options: [JSON_OPTION],
  async run(args, io) {
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
    io.out(`${basis.file}: ${results.project.title} (${results.technology.name}, ${results.technology.mode} mode)\n`);
    io.out(table(headlineRows(results)));
    if (results.cases.length) {
      const sizing = results.cases.find((c) => c.sizing)!;
      io.out(`\nthe figures above are those of the sizing case, ${sizing.id}; the envelope over the ${results.cases.length} cases (${results.cases.map((c) => c.id).join(', ')}):\n`);
      io.out(table(envelopeRows(results)));
    }
    return 0;
  },
};
