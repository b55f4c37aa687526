/**
 * `assumptions:` and `references:`, each id given once, and the check that every source or
 * reference written in the basis that looks like an id (R7, A2, REF-3) names one of them.
 * Longer text is a free justification and is kept as written.
 */
import { quotedList } from '../core/suggest.ts';
import type { Path } from './diagnostics.ts';
import type { Reader } from './reader.ts';
import type { Acceptance, Assumption, Reference } from './types.ts';

/** What a reference or assumption id looks like: a few capitals and a short number, e.g. R7, A2, REF-3. */
const ID_LIKE = /^[A-Z]{1,3}-?\d{1,3}[a-z]?$/;

function uniqueIds(reader: Reader, section: 'assumptions' | 'references'): void {
  const seen = new Map<string, number>();
  for (let i = 0; i < reader.length([section]); i++) {
    const id = reader.text([section, i, 'id']);
    if (id === undefined) continue;
    const first = seen.get(id);
    if (first !== undefined) reader.findings.error([section, i, 'id'], `${section === 'assumptions' ? 'assumption' : 'reference'} id ${id} is already used by ${section}[${first}]`);
    else seen.set(id, i);
  }
}

/** The items of a list section, ids checked for uniqueness; items missing a required part are left out (the schema reported them). */
function items<T>(reader: Reader, section: 'assumptions' | 'references', read: (path: Path) => T | undefined): T[] {
  uniqueIds(reader, section);
  const out: T[] = [];
  for (let i = 0; i < reader.length([section]); i++) {
    const item = read([section, i]);
    if (item) out.push(item);
  }
  return out;
}

export function readReferences(reader: Reader): Reference[] {
  return items(reader, 'references', (path) => {
    const id = reader.text([...path, 'id']);
    const citation = reader.text([...path, 'citation']);
    return id !== undefined && citation !== undefined ? { id, citation } : undefined;
  });
}

/** An assumption's `concerns`: each a field or section written in this basis, dotted. */
function concernsOf(reader: Reader, path: Path): string[] {
  const out: string[] = [];
  for (let i = 0; i < reader.length(path); i++) {
    const field = reader.text([...path, i]);
    if (field === undefined) continue;
    if (!reader.has(field.split('.'))) {
      reader.findings.error([...path, i], `${field} is not a field written in this basis (write it dotted, as operating-point.air-utilization)`);
      continue;
    }
    out.push(field);
  }
  return out;
}

export function readAssumptions(reader: Reader): Assumption[] {
  return items(reader, 'assumptions', (path) => {
    const id = reader.text([...path, 'id']);
    const text = reader.text([...path, 'text']);
    const reference = reader.source([...path, 'reference']);
    const concerns = concernsOf(reader, [...path, 'concerns']);
    const open = reader.flag([...path, 'open']) ?? false;
    const accepted = readAcceptance(reader, [...path, 'accepted'], open);
    if (id === undefined || text === undefined) return undefined;
    return { id, text, open, ...(reference !== undefined ? { reference } : {}), concerns, ...(accepted ? { accepted } : {}) };
  });
}

/** `accepted: { reason, by, date }` of an assumption: only an open one can be accepted as open. */
function readAcceptance(reader: Reader, path: Path, open: boolean): Acceptance | undefined {
  if (!reader.has(path)) return undefined;
  const reason = reader.text([...path, 'reason']);
  const by = reader.text([...path, 'by']);
  const date = reader.text([...path, 'date']);
  if (!open && !reader.flaggedAt(path)) {
    reader.findings.error(path, 'only an open assumption is accepted as open; this one is confirmed (open is false or not given): delete accepted, or set open: true', 'key');
    return undefined;
  }
  return reason !== undefined && by !== undefined && date !== undefined ? { reason, by, date } : undefined;
}

/** Every id-like source must name a reference (or, for value sources, an assumption). */
export function checkSources(reader: Reader, references: readonly Reference[], assumptions: readonly Assumption[]): void {
  const referenceIds = references.map((r) => r.id);
  const assumptionIds = assumptions.map((a) => a.id);
  for (const { text, at } of reader.sources) {
    const id = text.trim();
    const fromAssumption = at[0] === 'assumptions';
    const known = fromAssumption ? referenceIds : [...referenceIds, ...assumptionIds];
    if (known.includes(id) || !ID_LIKE.test(id)) continue;
    const defined = known.length ? `; defined: ${quotedList(known, 'and')}` : '; references: defines none';
    reader.findings.error(at, `${id} looks like a reference id, but ${fromAssumption ? 'references' : 'references and assumptions'} define no ${id}${defined}`);
  }
}
