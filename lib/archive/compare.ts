/**
 * What changed between two revisions of a design basis: `compareRevisions(a, b)` is a pure
 * function of the two revisions' bases and results (the earlier first) and returns a
 * `RevisionChanges`, the one source of the `cellbasis compare` table and of the revision-history
 * section of the document (each revision's change summary against the one before it).
 *
 *   - inputs: every design input by its field path (basis.inputs), as written with its unit:
 *     "operating temperature 800 C → 780 C"; added and removed inputs; source changes;
 *   - fields: other changes of the YAML data (title, sign-off, materials, composition names,
 *     mixture sources), found by a structural diff of the two YAML texts when `source` is given,
 *     else of the document and cell data of the bases; revision and status are in from/to (and
 *     the document.revision and document.status that revisions of format 1 wrote are left out);
 *   - assumptions and references by id: added, removed, changed (text, open flag, reference);
 *   - results: the headline numbers that changed, with old, new, absolute and relative change:
 *     "mean Nernst voltage 0.9286 V → 0.9340 V (+5.4 mV, +0.58 %)". Numbers that agree within
 *     rounding (tolerance.ts) count as unchanged;
 *   - cases by id: added, removed, and changed (title, purpose, whether it ran, its headline
 *     numbers as above: "case turndown: cell voltage 0.8724 V → 0.8690 V (...)"); the sizing
 *     case's numbers are the results above and are not repeated;
 *   - envelope values by quantity: added, removed, and a changed value or governing case;
 *   - notCompared: what the results of one side do not carry, a headline number or the cases or
 *     envelope of results issued by another version of cellbasis (issued-results.ts reads only
 *     these parts of an issued results.json): "highest carbon activity: not in the results of
 *     revision A"; the rest is compared.
 *
 * `summary` holds one readable line per change, in that order, then one per part not compared
 * ("not compared: ..."); `unchanged` is true when nothing both sides carry changed. Usage (site build, revision history):
 *
 *   const changes = compareRevisions({ revision: 'A', basis: basisA, results: resultsA, source: yamlA },
 *                                    { revision: 'B', basis: basisB, results: resultsB, source: yamlB });
 *   changes.summary   // ["operating temperature 800 C → 780 C", "mean Nernst voltage …", …]
 */
import { parse as parseYaml } from 'yaml';
import type { Assumption, DesignBasis, InputRecord, Reference } from '../basis/types.ts';
import type { ComparableResults, HeadlineNumbers } from '../plant/comparable-results.ts';
import { childPath, diffTrees, treeText, type Tree } from './tree-diff.ts';
import { sameWithinRounding } from './tolerance.ts';
import { HEADLINE_QUANTITIES, formatChange, formatValue } from './headline-quantities.ts';
import { sig } from '../core/plain-text.ts';

export interface RevisionSide {
  /** The revision ("A", "0"), or for the working draft the one it becomes when next issued. */
  revision: string;
  /** Its issued status, or "draft, not issued" for the working draft; "" when not known. */
  status?: string;
  /**
   * The validated basis; null for an issued revision whose basis.yaml today's loader does not
   * read (issued by an earlier version of cellbasis, lib/archive/issued-revision.ts). Without it
   * the inputs, assumptions and references are compared as YAML fields (its `source`), and a
   * note says so.
   */
  basis: DesignBasis | null;
  /** Why today's loader does not read the basis (with basis null), for that note. */
  basisProblem?: string;
  /** Today's results (the draft's), or an issued revision's as far as comparisons read them (issued-results.ts). */
  results: ComparableResults;
  /** The YAML text of the basis, for the structural diff of the fields that are not inputs. */
  source?: string;
}

export interface InputValue {
  /** As written, unit included ("800 C"). */
  text: string;
  unit: string;
  si: number;
  siUnit: string;
  source?: string;
}

export interface InputChange {
  path: string;
  label: string;
  kind: 'added' | 'removed' | 'changed';
  old?: InputValue;
  new?: InputValue;
  /** Changed: whether the SI value is the same (only the writing or the source changed). */
  sameValue?: boolean;
  text: string;
}

export interface FieldChange {
  path: string;
  kind: 'added' | 'removed' | 'changed';
  old?: string;
  new?: string;
  text: string;
}

export interface AssumptionChange {
  id: string;
  kind: 'added' | 'removed' | 'changed';
  old?: Assumption;
  new?: Assumption;
  /** Changed: which parts. */
  parts: ('text' | 'open' | 'reference')[];
  text: string;
}

export interface ReferenceChange {
  id: string;
  kind: 'added' | 'removed' | 'changed';
  old?: string;
  new?: string;
  text: string;
}

export interface ResultChange {
  /** Key in results.headline. */
  key: string;
  label: string;
  /** SI unit of old, new and delta ("V", "W", "1" for fractions and counts). */
  unit: string;
  old: number | null;
  new: number | null;
  /** new − old (SI), null when either is null. */
  delta: number | null;
  /** delta / |old|, null when either is null or old is 0. */
  relative: number | null;
  /** As the document writes them: "0.9286 V", "0.9340 V", "+5.4 mV, +0.58 %" ("" when either is none). */
  oldText: string;
  newText: string;
  changeText: string;
  text: string;
}

export interface CaseChange {
  id: string;
  kind: 'added' | 'removed' | 'changed';
  /** Changed: its headline numbers that changed (as in `results`). */
  results: ResultChange[];
  text: string;
}

export interface EnvelopeChange {
  /** The quantity's id in lib/plant/data/envelope.yaml. */
  id: string;
  kind: 'added' | 'removed' | 'changed';
  old?: { value: number; case: string };
  new?: { value: number; case: string };
  text: string;
}

export interface RevisionChanges {
  from: { revision: string; status: string };
  to: { revision: string; status: string };
  inputs: InputChange[];
  fields: FieldChange[];
  assumptions: AssumptionChange[];
  references: ReferenceChange[];
  results: ResultChange[];
  cases: CaseChange[];
  envelope: EnvelopeChange[];
  /**
   * What could not be compared because one side's results do not carry it (results issued by
   * another version of cellbasis): "highest carbon activity: not in the results of revision A";
   * and, for a side whose basis today's loader does not read, that its inputs, assumptions and
   * references are compared as YAML fields instead.
   */
  notCompared: string[];
  /** One line per change, then one per part not compared ("not compared: ..."). */
  summary: string[];
  /** No change in anything both sides carry. */
  unchanged: boolean;
}

function inputValue(record: InputRecord): InputValue {
  return { text: record.text, unit: record.unit, si: record.si, siUnit: record.siUnit, ...(record.source ? { source: record.source } : {}) };
}

function inputChanges(a: InputRecord[], b: InputRecord[]): InputChange[] {
  const before = new Map(a.map((r) => [r.path, r]));
  const after = new Map(b.map((r) => [r.path, r]));
  const out: InputChange[] = [];
  for (const old of a) {
    const next = after.get(old.path);
    if (!next) {
      out.push({ path: old.path, label: old.label, kind: 'removed', old: inputValue(old), text: `${old.label} ${old.text} removed` });
      continue;
    }
    const textChanged = old.text !== next.text;
    const sourceChanged = (old.source ?? '') !== (next.source ?? '');
    if (!textChanged && !sourceChanged) continue;
    const parts: string[] = [];
    if (textChanged) parts.push(`${next.label} ${old.text} → ${next.text}${old.si === next.si ? ' (same value)' : ''}`);
    if (sourceChanged) parts.push(`${textChanged ? 'source' : `${next.label}: source`} ${old.source ?? 'none'} → ${next.source ?? 'none'}`);
    out.push({ path: old.path, label: next.label, kind: 'changed', old: inputValue(old), new: inputValue(next), sameValue: old.si === next.si, text: parts.join('; ') });
  }
  for (const next of b) {
    if (!before.has(next.path)) out.push({ path: next.path, label: next.label, kind: 'added', new: inputValue(next), text: `${next.label} ${next.text} added` });
  }
  return out;
}

/** The data of a basis that is not an input, named as in the YAML, when its text is not at hand. */
function projection(basis: DesignBasis): Tree {
  const d = basis.document;
  const signOff: Record<string, Tree> = {};
  for (const [role, person] of Object.entries(d.signOff)) if (person) signOff[role] = { ...person };
  const optional = (value: string | undefined): Tree => value ?? null;
  return {
    document: { title: d.title, number: d.number, client: d.client, site: d.site, paper: d.paper, purpose: d.purpose, scope: d.scope, 'sign-off': signOff },
    cell: {
      technology: basis.cell.technology,
      mode: basis.cell.mode,
      'fuel-electrode': optional(basis.cell.fuelElectrode),
      'air-electrode': optional(basis.cell.airElectrode),
      electrolyte: optional(basis.cell.electrolyte),
      'nickel-bearing': basis.cell.nickelBearing,
    },
    streams: {
      'fuel-electrode': basis.fuelElectrode ? { composition: basis.fuelElectrode.compositionName ?? null, 'pre-reforming': basis.fuelElectrode.preReforming.kind } : null,
      'air-electrode': !basis.airElectrode
        ? null
        : basis.airElectrode.cathodeLoop
          ? { 'cathode-loop': { 'burner-air': { composition: basis.airElectrode.compositionName ?? null } } }
          : { composition: basis.airElectrode.compositionName ?? null },
    },
  };
}

const OWN_SECTIONS = new Set(['assumptions', 'references', 'document.revision', 'document.status']);

/** The path and each path above it: `a.b[2].c`, `a.b[2]`, `a.b`, `a`. */
function selfAndAncestors(path: string): string[] {
  const out: string[] = [];
  for (let p = path; p !== ''; ) {
    out.push(p);
    const parent = p.replace(/(?:\.[^.[\]]+|\[\d+\])$/, '');
    if (parent === p) break;
    p = parent;
  }
  return out;
}

/** Whether a path is an input, lies below one, or is handled by its own section (none of them when a side has no validated basis). */
function coveredBy(inputPaths: Set<string>, ownSections: boolean): (path: string) => boolean {
  return (path) => selfAndAncestors(path).some((p) => inputPaths.has(p) || (ownSections && OWN_SECTIONS.has(p)));
}

/** A subtree with the covered paths removed; undefined when nothing is left. */
function prune(value: Tree, path: string, covered: (path: string) => boolean): Tree | undefined {
  if (covered(path)) return undefined;
  if (typeof value !== 'object' || value === null) return value;
  if (Array.isArray(value)) {
    const items = value.map((v, i) => prune(v, childPath(path, i), covered));
    return items.every((v) => v === undefined) ? undefined : items.map((v) => v ?? null);
  }
  const out: Record<string, Tree> = {};
  for (const [key, child] of Object.entries(value)) {
    const kept = prune(child, childPath(path, key), covered);
    if (kept !== undefined) out[key] = kept;
  }
  return Object.keys(out).length ? out : undefined;
}

/** A side's YAML tree: its text parsed, else the projection of its basis (a side has one or the other). */
function treeOf(side: RevisionSide, useSource: boolean): Tree {
  if (useSource || !side.basis) return parseYaml(side.source ?? '') as Tree;
  return projection(side.basis);
}

function fieldChanges(a: RevisionSide, b: RevisionSide): FieldChange[] {
  const useSource = a.source !== undefined && b.source !== undefined;
  const trees: [Tree, Tree] = [treeOf(a, useSource), treeOf(b, useSource)];
  // Inputs, assumptions and references have their own comparisons only when both bases validate.
  const covered = a.basis && b.basis ? coveredBy(new Set([...a.basis.inputs, ...b.basis.inputs].map((r) => r.path)), true) : coveredBy(new Set(), false);
  const out: FieldChange[] = [];
  for (const d of diffTrees(trees[0], trees[1], { skip: covered })) {
    const old = d.old === undefined ? undefined : prune(d.old, d.path, covered);
    const next = d.new === undefined ? undefined : prune(d.new, d.path, covered);
    if (d.kind !== 'changed' && old === undefined && next === undefined) continue;
    const text =
      d.kind === 'added' ? `${d.path} added: ${treeText(next)}` : d.kind === 'removed' ? `${d.path} removed (was ${treeText(old)})` : `${d.path}: ${treeText(old)} → ${treeText(next)}`;
    out.push({ path: d.path, kind: d.kind, ...(old !== undefined ? { old: treeText(old) } : {}), ...(next !== undefined ? { new: treeText(next) } : {}), text });
  }
  return out;
}

function assumptionChanges(a: Assumption[], b: Assumption[]): AssumptionChange[] {
  const after = new Map(b.map((x) => [x.id, x]));
  const before = new Set(a.map((x) => x.id));
  const open = (x: Assumption) => (x.open ? ' (open)' : '');
  const out: AssumptionChange[] = [];
  for (const old of a) {
    const next = after.get(old.id);
    if (!next) {
      out.push({ id: old.id, kind: 'removed', old, parts: [], text: `assumption ${old.id} removed: ${old.text}` });
      continue;
    }
    const parts: AssumptionChange['parts'] = [];
    const words: string[] = [];
    if (old.text !== next.text) {
      parts.push('text');
      words.push(`text "${old.text}" → "${next.text}"`);
    }
    if (old.open !== next.open) {
      parts.push('open');
      words.push(next.open ? 'reopened (open again)' : 'closed (no longer open)');
    }
    if ((old.reference ?? '') !== (next.reference ?? '')) {
      parts.push('reference');
      words.push(`reference ${old.reference ?? 'none'} → ${next.reference ?? 'none'}`);
    }
    if (parts.length) out.push({ id: old.id, kind: 'changed', old, new: next, parts, text: `assumption ${old.id} ${words.join('; ')}` });
  }
  for (const next of b) if (!before.has(next.id)) out.push({ id: next.id, kind: 'added', new: next, parts: [], text: `assumption ${next.id} added${open(next)}: ${next.text}` });
  return out;
}

function referenceChanges(a: Reference[], b: Reference[]): ReferenceChange[] {
  const after = new Map(b.map((x) => [x.id, x.citation]));
  const before = new Set(a.map((x) => x.id));
  const out: ReferenceChange[] = [];
  for (const old of a) {
    const next = after.get(old.id);
    if (next === undefined) out.push({ id: old.id, kind: 'removed', old: old.citation, text: `reference ${old.id} removed: ${old.citation}` });
    else if (next !== old.citation) out.push({ id: old.id, kind: 'changed', old: old.citation, new: next, text: `reference ${old.id} changed: "${old.citation}" → "${next}"` });
  }
  for (const next of b) if (!before.has(next.id)) out.push({ id: next.id, kind: 'added', new: next.citation, text: `reference ${next.id} added: ${next.citation}` });
  return out;
}

/** Where one side's results lack what the other's carry: the comparison's record of it. */
interface Sides {
  a: string;
  b: string;
  /** Told each quantity or part that only one side carries. */
  missing: (what: string, side: string) => void;
}

function resultChanges(a: HeadlineNumbers | null, b: HeadlineNumbers | null, sides: Sides, prefix = ''): ResultChange[] {
  const out: ResultChange[] = [];
  for (const q of HEADLINE_QUANTITIES) {
    const old = a ? a[q.key] : null;
    const next = b ? b[q.key] : null;
    // A headline number the results of one side do not carry (another version wrote them) is not compared.
    if (old === undefined || next === undefined) {
      if (old !== next) sides.missing(`${prefix}${q.label}`, old === undefined ? sides.a : sides.b);
      continue;
    }
    if (old === null && next === null) continue;
    if (old !== null && next !== null && sameWithinRounding(old, next)) continue;
    const delta = old !== null && next !== null ? next - old : null;
    const relative = delta !== null && old !== 0 ? delta / Math.abs(old!) : null;
    const oldText = formatValue(q, old);
    const newText = formatValue(q, next);
    const changeText = delta === null ? '' : formatChange(q, delta, relative);
    const text = `${q.label} ${oldText} → ${newText}${changeText ? ` (${changeText})` : ''}`;
    out.push({ key: q.key, label: q.label, unit: q.unit, old, new: next, delta, relative, oldText, newText, changeText, text });
  }
  return out;
}

/** Whether both sides carry a part of the results (cases, envelope); tells `sides` when only one does. */
function bothCarry(a: unknown, b: unknown, what: string, sides: Sides): boolean {
  if (a === undefined && b !== undefined) sides.missing(what, sides.a);
  if (b === undefined && a !== undefined) sides.missing(what, sides.b);
  return a !== undefined && b !== undefined;
}

/** The cases of two results by id (not compared where the results of one side carry none: issued before cases existed). */
function caseChanges(a: ComparableResults, b: ComparableResults, sides: Sides): CaseChange[] {
  if (!bothCarry(a.cases, b.cases, 'operating cases', sides)) return [];
  const before = a.cases!;
  const after = new Map(b.cases!.map((c) => [c.id, c]));
  const out: CaseChange[] = [];
  for (const old of before) {
    const next = after.get(old.id);
    if (!next) {
      out.push({ id: old.id, kind: 'removed', results: [], text: `case ${old.id} removed: ${old.title}` });
      continue;
    }
    const words: string[] = [];
    const both = (part: string, x: unknown, y: unknown) => bothCarry(x, y, `case ${old.id}: ${part}`, sides);
    if (old.title !== next.title) words.push(`title "${old.title}" → "${next.title}"`);
    if (both('purpose', old.purpose, next.purpose) && old.purpose !== next.purpose) words.push(`purpose "${old.purpose}" → "${next.purpose}"`);
    if (both('whether it is the sizing case', old.sizing, next.sizing) && old.sizing !== next.sizing) words.push(next.sizing ? 'now the sizing case' : 'no longer the sizing case');
    if (both('whether it runs', old.ran, next.ran) && old.ran !== next.ran) words.push(next.ran ? 'now runs' : 'no longer runs on the sizing hardware');
    // The sizing case's numbers are the top-level results, compared there.
    const results =
      (old.sizing && next.sizing) || !both('headline numbers', old.headline, next.headline) ? [] : resultChanges(old.headline!, next.headline!, sides, `case ${old.id}: `);
    words.push(...results.map((r) => r.text));
    if (words.length) out.push({ id: old.id, kind: 'changed', results, text: `case ${old.id}: ${words.join('; ')}` });
  }
  const ids = new Set(before.map((c) => c.id));
  for (const next of b.cases!) if (!ids.has(next.id)) out.push({ id: next.id, kind: 'added', results: [], text: `case ${next.id} added: ${next.title}` });
  return out;
}

/** The envelope of two results by quantity: a governing value or case that changed (not compared where one side carries none). */
function envelopeChanges(a: ComparableResults, b: ComparableResults, sides: Sides): EnvelopeChange[] {
  if (!bothCarry(a.envelope, b.envelope, 'the envelope', sides)) return [];
  const before = a.envelope!;
  const after = new Map(b.envelope!.map((e) => [e.id, e]));
  const shown = (value: number, unit: string) => `${sig(value, 4)}${unit === '1' ? '' : ` ${unit}`}`;
  const out: EnvelopeChange[] = [];
  for (const old of before) {
    const next = after.get(old.id);
    const was = { value: old.value, case: old.case };
    if (!next) {
      out.push({ id: old.id, kind: 'removed', old: was, text: `envelope: ${old.quantity} no longer applies (was ${shown(old.value, old.unit)}, case ${old.case})` });
      continue;
    }
    if (sameWithinRounding(old.value, next.value) && old.case === next.case) continue;
    out.push({
      id: old.id,
      kind: 'changed',
      old: was,
      new: { value: next.value, case: next.case },
      text: `envelope: ${next.quantity} ${shown(old.value, old.unit)} (case ${old.case}) → ${shown(next.value, next.unit)} (case ${next.case})`,
    });
  }
  const ids = new Set(before.map((e) => e.id));
  for (const next of b.envelope!) {
    if (!ids.has(next.id)) out.push({ id: next.id, kind: 'added', new: { value: next.value, case: next.case }, text: `envelope: ${next.quantity} ${shown(next.value, next.unit)} (case ${next.case}) added` });
  }
  return out;
}

/** The note for a side whose basis does not validate today: what is compared instead. */
function unreadBasisNote(side: RevisionSide): string {
  return `design inputs, assumptions and references one by one: the basis of revision ${side.revision} does not load with this version of cellbasis (${side.basisProblem ?? 'not read'}); they are compared as fields of its YAML`;
}

export function compareRevisions(a: RevisionSide, b: RevisionSide): RevisionChanges {
  const both = a.basis && b.basis ? { a: a.basis, b: b.basis } : null;
  const inputs = both ? inputChanges(both.a.inputs, both.b.inputs) : [];
  const fields = fieldChanges(a, b);
  const assumptions = both ? assumptionChanges(both.a.assumptions, both.b.assumptions) : [];
  const references = both ? referenceChanges(both.a.references, both.b.references) : [];
  const notCompared: string[] = [a, b].filter((side) => !side.basis).map(unreadBasisNote);
  const sides: Sides = { a: a.revision, b: b.revision, missing: (what, side) => notCompared.push(`${what}: not in the results of revision ${side}`) };
  const results = resultChanges(a.results.headline, b.results.headline, sides);
  const cases = caseChanges(a.results, b.results, sides);
  const envelope = envelopeChanges(a.results, b.results, sides);
  const changed = [...inputs, ...fields, ...assumptions, ...references, ...results, ...cases, ...envelope].map((c) => c.text);
  return {
    from: { revision: a.revision, status: a.status ?? '' },
    to: { revision: b.revision, status: b.status ?? '' },
    inputs,
    fields,
    assumptions,
    references,
    results,
    cases,
    envelope,
    notCompared,
    summary: [...changed, ...notCompared.map((n) => `not compared: ${n}`)],
    unchanged: changed.length === 0,
  };
}
