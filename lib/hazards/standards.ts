/**
 * The standards, codes and regulations the hazard cautions cite (data/standards.yaml), parsed
 * and checked at first use, each with the edition (or year) it is cited at. Cited for orientation only; editions and adoption are for the
 * engineer responsible and the authority having jurisdiction to confirm.
 */
import { readDataFile } from '../core/data-file.ts';
import { z } from 'zod';
import type { StandardRef } from './types.ts';

const RawStandard = z.strictObject({
  number: z.string(),
  /** The edition, year or date cited; it must name a year. */
  edition: z.string().regex(/\b(19|20)\d\d\b/, 'the edition must name its year'),
  title: z.string(),
  publisher: z.string(),
  scope: z.string(),
  memory: z.boolean(),
});

export interface Standard extends z.infer<typeof RawStandard> {
  id: string;
}

let cache: Map<string, Standard> | undefined;

export function standards(): Map<string, Standard> {
  if (cache) return cache;
  const raw = readDataFile(new URL('./data/standards.yaml', import.meta.url), z.record(z.string(), RawStandard));
  cache = new Map(Object.entries(raw).map(([id, s]) => [id, { id, ...s }]));
  return cache;
}

export function standard(id: string): Standard {
  const s = standards().get(id);
  if (!s) throw new Error(`lib/hazards: unknown standard "${id}" (not in data/standards.yaml)`);
  return s;
}

/** The reference a caution carries: id, number, edition and title. */
export function standardRef(id: string): StandardRef {
  const s = standard(id);
  return { id, number: s.number, edition: s.edition, title: s.title };
}

/** A standard as texts cite it: its number and edition ("NFPA 2, 2023 edition"). */
export function citation(ref: Pick<StandardRef, 'number' | 'edition'>): string {
  return `${ref.number}, ${ref.edition}`;
}
