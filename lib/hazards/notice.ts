/**
 * The standing notice of the hazards section and its method notes (data/texts.yaml): the notice
 * is shown first in the design document's hazards section and in the CLI hazards output.
 */
import { readDataFile } from '../core/data-file.ts';
import { z } from 'zod';
import { dataValue } from './data-values.ts';
import { renderTemplate } from './template.ts';
import type { MethodNote } from './types.ts';

const Texts = z.strictObject({
  notice: z.string(),
  method: z.array(z.strictObject({ id: z.string(), text: z.string() })),
});

const TEXTS = readDataFile(new URL('./data/texts.yaml', import.meta.url), Texts);

/** Informational only; defers to local codes, the authority having jurisdiction and licensed practice. */
export const HAZARD_NOTICE: string = TEXTS.notice;

/** How the indicators are computed and the limits of those methods. */
export function methodNotes(): MethodNote[] {
  return TEXTS.method.map((m) => ({ id: m.id, text: renderTemplate(m.text, (name) => dataValue(name), `texts.yaml method ${m.id}`) }));
}
