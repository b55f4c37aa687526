/** `cellbasis hazards ID|FILE [--json]`: the hazard assessment of a basis, standing notice first. */
import type { Command } from '../command.ts';
import { JSON_OPTION } from '../command.ts';
import { loadProject } from '../load-project.ts';
import { json } from '../../core/plain-text.ts';

export const hazardsCommand: Command = {
  name: 'hazards',
  summary: 'hazards and handling cautions that follow from the streams of a basis, with their standards',
  usage: 'hazards ID|FILE [--json]',
  details: 'Informational only: local codes, the authority having jurisdiction and licensed professional practice govern.',
  positionals: [1, 1],
  options: [JSON_OPTION],
  async run(args, io) {
    const basis = loadProject(args.positionals[0]!, io);
    const { evaluateBasis } = await import('../../plant/calculate.ts');
    const { hazardInput } = await import('../../plant/hazard-streams.ts');
    const { assessHazards } = await import('../../hazards/assessment.ts');
    const { formatHazardsText } = await import('../../hazards/format-text.ts');
    const { plantBalance } = await import('../../plant/plant-balance.ts');
    const { locateCalculationErrors } = await import('../../plant/located-error.ts');
    const point = evaluateBasis(basis);
    const plant = locateCalculationErrors(basis, () => plantBalance(point, basis.plant));
    const assessment = assessHazards(hazardInput(basis, point, plant));
    io.out(args.values.json ? json(assessment) : formatHazardsText(assessment));
    return 0;
  },
};
