/**
 * Starting bases for `cellbasis new`: one commented template per technology and mode in
 * lib/basis/scaffolds/<technology>-<mode>.yaml, with `{{project}}` and `{{today}}` filled in.
 */
import { existsSync, readFileSync } from 'node:fs';
import { technologies, type Mode, type TechnologyId } from '../electrochem/technologies.ts';

function templateUrl(technology: TechnologyId, mode: Mode): URL {
  return new URL(`./scaffolds/${technology}-${mode}.yaml`, import.meta.url);
}

/** Every technology and mode with a scaffold: one per mode of each technology. */
export function scaffoldKinds(): { technology: TechnologyId; mode: Mode }[] {
  return [...technologies().values()].flatMap((t) => t.modes.map((mode) => ({ technology: t.id, mode })));
}

export function hasScaffold(technology: TechnologyId, mode: Mode): boolean {
  return existsSync(templateUrl(technology, mode));
}

/** The scaffold text for a project, dated `today` (YYYY-MM-DD). */
export function renderScaffold(technology: TechnologyId, mode: Mode, project: string, today: string): string {
  return readFileSync(templateUrl(technology, mode), 'utf8').replaceAll('{{project}}', project).replaceAll('{{today}}', today);
}
