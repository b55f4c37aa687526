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
  const text = readFileSync(templateUrl(technology, mode), 'utf8').replaceAll('{{project}}', project).replaceAll('{{today}}', today);
  return text.replace(/\nassumptions:/, `\n${casesExample(text)}\nassumptions:`);
}

/**
 * Operating cases as a commented example, written for the scaffold so that removing the leading
 * "# " gives a valid basis: a turndown at 30 % of its design current density (an illustration,
 * no source) and the end of life at an illustrative degradation rate, both on the hardware the
 * base values size.
 */
function casesExample(text: string): string {
  const design = /^ {2}current-density: "([\d.]+) A\/cm2"/m.exec(text);
  const turndown = design ? `${Number((Number(design[1]) * 0.3).toPrecision(2))} A/cm2` : '0.1 A/cm2';
  return [
    '# cases:                            # operating cases on the hardware the base values size (README: Operating cases)',
    '#   turndown:',
    '#     title: Minimum turndown',
    '#     purpose: The least flows the plant must control, and the cells at their lowest current.',
    '#     overrides:',
    '#       operating-point:',
    `#         current-density: "${turndown}"   # or target-power / target-hydrogen, met on the same cells`,
    '#   end-of-life:',
    '#     title: End of stack life',
    '#     purpose: The cells after their operating life, at the design current density.',
    '#     overrides:',
    '#       operating-point:',
    '#         degradation: { rate: "0.5 %/kh", of: cell-voltage, operating-time: "40000 h" }   # the maker\'s rate',
    '',
  ].join('\n');
}
