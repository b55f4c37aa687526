/**
 * `cellbasis new ID --technology TECH [--mode MODE]`: writes projects/ID/basis.yaml from the
 * scaffold of that technology and mode (lib/basis/scaffolds), checked valid before it is
 * written, and never over an existing file.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { dirname } from 'node:path';
import type { Command } from '../command.ts';
import { optionalString, requireString } from '../command.ts';
import { technology, technologyIdOf, TECHNOLOGY_NAMES, type Mode, type TechnologyId } from '../../electrochem/technologies.ts';
import { projectBasisPath, BASIS_FILE } from '../../basis/projects.ts';
import { renderScaffold } from '../../basis/scaffolds.ts';
import { loadBasisText } from '../../basis/load.ts';
import { formatDiagnostic } from '../../basis/diagnostics.ts';
import { didYouMean, quotedList } from '../../core/suggest.ts';
import { UserError } from '../../core/errors.ts';

function technologyArg(name: string): TechnologyId {
  const id = technologyIdOf(name);
  if (id === undefined) throw new UserError(`new: unknown technology "${name}"${didYouMean(name, TECHNOLOGY_NAMES)}; technologies: ${TECHNOLOGY_NAMES.join(', ')}`);
  return id;
}

export const newCommand: Command = {
  name: 'new',
  summary: 'write a commented, valid starting design basis for a technology and mode',
  usage: 'new ID --technology TECH [--mode power|electrolysis]',
  details:
    `Writes projects/ID/${BASIS_FILE} under the current folder; never overwrites an existing file.\n` +
    `TECH: ${TECHNOLOGY_NAMES.join(', ')}. The mode defaults to power (electrolysis where that is the only mode).\n` +
    'ID: 1 to 64 characters of a-z, 0-9, ".", "_" and "-", starting with a letter or digit.',
  positionals: [1, 1],
  options: [
    { name: 'technology', type: 'string', value: 'TECH', description: 'cell technology' },
    { name: 'mode', type: 'string', value: 'MODE', description: 'power or electrolysis (default power)' },
  ],
  run(args, io) {
    const id = args.positionals[0]!;
    const tech = technology(technologyArg(requireString(args, 'technology', 'new')));
    const modeText = optionalString(args, 'mode') ?? (tech.modes.includes('power') ? 'power' : tech.modes[0]!);
    if (modeText !== 'power' && modeText !== 'electrolysis') throw new UserError(`new: --mode must be power or electrolysis, got "${modeText}"`);
    const mode = modeText as Mode;
    if (!tech.modes.includes(mode)) throw new UserError(`new: ${tech.id} cells run in ${quotedList(tech.modes)} mode only, not ${mode}`);
    const path = projectBasisPath(id, io.cwd);
    const display = `projects/${id}/${BASIS_FILE}`;
    const text = renderScaffold(tech.id, mode, id, new Date().toISOString().slice(0, 10));
    const check = loadBasisText(text, display, id);
    if (!check.ok) throw new Error(`the ${tech.id}-${mode} scaffold does not validate: ${check.errors.map(formatDiagnostic).join('; ')}`);
    mkdirSync(dirname(path), { recursive: true });
    try {
      writeFileSync(path, text, { flag: 'wx' });
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code === 'EEXIST') throw new UserError(`new: ${display} already exists; nothing written (edit it, or choose another id)`);
      throw error;
    }
    io.out(`wrote ${display} (${tech.id}, ${mode}): replace its invented values with your project's, then run cellbasis check ${id}\n`);
    return 0;
  },
};
