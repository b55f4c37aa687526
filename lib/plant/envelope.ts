/**
 * The envelope of the operating cases: for each sizing quantity of lib/plant/data/envelope.yaml
 * (one table: quantity, results path, unit, max or min, what it sizes), the governing value over
 * the cases that ran and the case that sets it,
 *
 *   value = max_k x_k  (or min_k x_k),  case = the first k that reaches it,
 *
 * where x_k is the case's number at the path (null where it does not apply). A path is dotted
 * keys; a key written name[id] takes, from the array at name, the element whose id is id (the
 * plant's duties: plant.power.duties[air-preheat].duty_W). On values equal to
 * rounding (within 1e-12 of each other, relative) the earlier case in the order of the basis
 * governs, the sizing case first. A quantity null in every case is left out. Pure: a layer above
 * that adds sections to the cases (the plant balance) calls it again with its own rows.
 */
import { z } from 'zod';
import { readDataFile } from '../core/data-file.ts';
import { resultsSchema, type CaseResult, type EnvelopeRow } from './results-schema.ts';

const quantitySchema = z.strictObject({
  id: z.string().regex(/^[a-z][a-z0-9-]*$/),
  quantity: z.string().min(1),
  path: z.string().regex(/^[A-Za-z_0-9]+(\.[A-Za-z_0-9]+(\[[a-z][a-z0-9-]*\])?)+$/),
  unit: z.string(),
  governs: z.enum(['max', 'min']),
  sizes: z.string().min(1),
});

export type EnvelopeQuantity = z.infer<typeof quantitySchema>;

/** A key of a path: its name and, for name[id], the id of the array element it takes. */
function keyOf(segment: string): { name: string; id: string | null } {
  const m = /^([^[]+)(?:\[([^\]]+)\])?$/.exec(segment)!;
  return { name: m[1]!, id: m[2] ?? null };
}

/** The schema a dotted path names in the results of a case, or null where it names none. */
function schemaAt(path: string): z.ZodType | null {
  let current: z.ZodType = resultsSchema.shape.cases.element;
  const unwrap = () => {
    while (current instanceof z.ZodNullable || current instanceof z.ZodOptional) current = current.unwrap() as z.ZodType;
  };
  for (const segment of path.split('.')) {
    const { name, id } = keyOf(segment);
    unwrap();
    if (!(current instanceof z.ZodObject)) return null;
    const next = (current.shape as Record<string, z.ZodType>)[name];
    if (!next) return null;
    current = next;
    if (id !== null) {
      unwrap();
      if (!(current instanceof z.ZodArray)) return null;
      current = current.element as z.ZodType;
    }
  }
  return current;
}

/** Whether the path names a number (or a nullable one) of a case's results. */
function numberPath(path: string): boolean {
  let at = schemaAt(path);
  while (at instanceof z.ZodNullable) at = at.unwrap() as z.ZodType;
  return at instanceof z.ZodNumber;
}

/** The quantities of data/envelope.yaml, each path checked to name a number of a case's results. */
export const ENVELOPE_QUANTITIES: readonly EnvelopeQuantity[] = (() => {
  const { quantities } = readDataFile(new URL('./data/envelope.yaml', import.meta.url), z.strictObject({ quantities: z.array(quantitySchema) }));
  const ids = new Set<string>();
  for (const q of quantities) {
    if (ids.has(q.id)) throw new Error(`lib/plant/data/envelope.yaml: the id ${q.id} is given twice`);
    ids.add(q.id);
    if (!numberPath(q.path)) throw new Error(`lib/plant/data/envelope.yaml: ${q.id}: ${q.path} names no number of a case's results`);
  }
  return quantities;
})();

/** The number at a dotted path of a case's results, or null. */
export function valueAt(result: unknown, path: string): number | null {
  let current = result;
  for (const segment of path.split('.')) {
    const { name, id } = keyOf(segment);
    if (current === null || typeof current !== 'object') return null;
    current = (current as Record<string, unknown>)[name];
    if (id !== null) current = Array.isArray(current) ? current.find((item: unknown) => (item as { id?: unknown } | null)?.id === id) : undefined;
  }
  return typeof current === 'number' ? current : null;
}

/** Whether `x` beats `best` for the extreme, by more than rounding. */
function beats(x: number, best: number, governs: 'max' | 'min'): boolean {
  const tolerance = 1e-12 * Math.max(Math.abs(x), Math.abs(best));
  return governs === 'max' ? x > best + tolerance : x < best - tolerance;
}

/** The envelope of the cases over the quantities (those of data/envelope.yaml unless given). */
export function envelopeOf(cases: readonly CaseResult[], quantities: readonly EnvelopeQuantity[] = ENVELOPE_QUANTITIES): EnvelopeRow[] {
  const sizing = cases.find((c) => c.sizing);
  const rows: EnvelopeRow[] = [];
  for (const q of quantities) {
    let best: { value: number; case: string } | null = null;
    for (const c of cases) {
      if (!c.ran) continue;
      const x = valueAt(c, q.path);
      if (x === null) continue;
      if (best === null || beats(x, best.value, q.governs)) best = { value: x, case: c.id };
    }
    if (best === null) continue;
    rows.push({ ...q, value: best.value, case: best.case, sizingValue: sizing ? valueAt(sizing, q.path) : null });
  }
  return rows;
}
