/**
 * `assumptions:` and `references:`, each id given once across both lists, and the check that
 * every source or reference written in the basis that looks like an id (R7, A2, REF-3) names one
 * of them. Longer text is a free justification and is kept as written.
 *
 * One mistake, one message: an item the schema refused still defines its id when the id itself
 * can be read (a misspelt `citaton:` does not make every use of R1 an error too), and while an
 * item's id cannot be read at all, no use of an id is reported as undefined (that item may be
 * the one it names). An id, and a source that reads as an id, must be written in plain
 * characters: one holding an invisible character or a look-alike of a Latin letter or digit
 * (lib/basis/look-alikes.ts) would match nothing a reader types, or name nothing while it seems to.
 */
import { quotedList } from '../core/suggest.ts';
import { quoted } from '../core/quote.ts';
import { pathText, type Path } from './diagnostics.ts';
import { lookAlikes, lookAlikeText, plainForm } from './look-alikes.ts';
import type { Reader } from './reader.ts';
import type { Acceptance, Assumption, Reference } from './types.ts';

/** What a reference or assumption id looks like: a few capitals and a short number, e.g. R7, A2, REF-3. */
const ID_LIKE = /^[A-Z]{1,3}-?\d{1,3}[a-z]?$/;

type Section = 'assumptions' | 'references';

/** The sections in the order of the schema (and of the scaffolds), so a repeated id is reported where it is written second. */
const SECTIONS: readonly Section[] = ['assumptions', 'references'];

const KIND: Record<Section, string> = { assumptions: 'assumption', references: 'reference' };

/** The number of items written in a list section, whether or not the schema accepted them. */
function written(reader: Reader, section: Section): number {
  const value = reader.raw([section]);
  return Array.isArray(value) ? value.length : 0;
}

/** An id as written (accepted by the schema or not), or undefined when it is no text. */
function writtenId(reader: Reader, path: Path): string | undefined {
  const id = reader.raw([...path, 'id']);
  return typeof id === 'string' ? id : undefined;
}

/** Refuses an id written with invisible characters or look-alikes of Latin letters and digits. */
function plainId(reader: Reader, path: Path, id: string): void {
  const found = lookAlikes(id);
  if (found.length === 0) return;
  const plain = plainForm(id).trim();
  reader.findings.error(
    [...path, 'id'],
    `the id ${quoted(id)} is written with ${lookAlikeText(found)}; write ids in plain Latin letters and digits${plain && plain !== id ? `, such as ${plain}` : ''}`,
  );
}

/** Every id once across assumptions and references; each id in plain characters. */
function uniqueIds(reader: Reader): void {
  const seen = new Map<string, Path>();
  for (const section of SECTIONS) {
    for (let i = 0; i < written(reader, section); i++) {
      const path = [section, i];
      const id = writtenId(reader, path);
      if (id === undefined || id.trim() === '') continue;
      plainId(reader, path, id);
      const first = seen.get(id);
      if (first !== undefined) reader.findings.error([...path, 'id'], `${KIND[section]} id ${id} is already used by ${pathText(first)}; each id names one reference or assumption`);
      else seen.set(id, path);
    }
  }
}

/** The items of a list section; items missing a required part are left out (the schema reported them). */
function items<T>(reader: Reader, section: Section, read: (path: Path) => T | undefined): T[] {
  const out: T[] = [];
  for (let i = 0; i < reader.length([section]); i++) {
    const item = read([section, i]);
    if (item) out.push(item);
  }
  return out;
}

export function readReferences(reader: Reader): Reference[] {
  uniqueIds(reader);
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

/**
 * The ids a section defines as written, the ids it defines as a reader takes them (an id written
 * with a look-alike, refused at the id, also defines its plain form, so its uses are not refused
 * too), and whether every item's id could be read.
 */
function definedIds(reader: Reader, section: Section): { ids: string[]; readAs: Set<string>; complete: boolean } {
  const ids: string[] = [];
  // A section that is written but is no list (the schema said so) may define any id.
  let complete = reader.raw([section]) === undefined || Array.isArray(reader.raw([section]));
  for (let i = 0; i < written(reader, section); i++) {
    const id = writtenId(reader, [section, i]);
    if (id === undefined) complete = false;
    else ids.push(id);
  }
  return { ids, readAs: new Set([...ids, ...ids.map((id) => plainForm(id).trim())]), complete };
}

/**
 * Every id-like source must name a reference (or, for value sources, an assumption); a source
 * that reads as an id only once its invisible characters or look-alikes are set right is refused.
 */
export function checkSources(reader: Reader): void {
  const references = definedIds(reader, 'references');
  const assumptions = definedIds(reader, 'assumptions');
  for (const { text, at } of reader.sources) {
    const id = text.trim();
    const found = lookAlikes(id);
    if (found.length) {
      const plain = plainForm(id).trim();
      if (ID_LIKE.test(plain)) reader.findings.error(at, `${quoted(text)} reads as the id ${plain}, but is written with ${lookAlikeText(found)}; write ${plain} in plain characters`);
      continue;
    }
    const fromAssumption = at[0] === 'assumptions';
    const known = [...new Set(fromAssumption ? references.ids : [...references.ids, ...assumptions.ids])];
    const complete = fromAssumption ? references.complete : references.complete && assumptions.complete;
    const readAs = fromAssumption ? references.readAs : new Set([...references.readAs, ...assumptions.readAs]);
    if (readAs.has(id) || !ID_LIKE.test(id) || !complete) continue;
    const defined = known.length ? `; defined: ${quotedList(known, 'and')}` : '; references: defines none';
    reader.findings.error(at, `${id} looks like a reference id, but ${fromAssumption ? 'references' : 'references and assumptions'} define no ${id}${defined}`);
  }
}
