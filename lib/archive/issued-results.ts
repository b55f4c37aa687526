/**
 * Reading the results of an issued revision for what the site and `compare` do with them: the
 * headline numbers, the operating cases and the envelope (lib/plant/comparable-results.ts), taken
 * from results.json field by field and never checked against today's results schema. An issued
 * revision is a frozen record, written by whatever version of cellbasis issued it: a field this
 * version does not know is ignored, a part or headline number it does not carry is left out (the
 * comparison names it as not compared), and only a field that is needed and missing, or present
 * with the wrong type, is a problem, named by its field and what was expected.
 *
 *   const read = readIssuedResults(JSON.parse(text));
 *   if (!read.ok) throw ... `results.json: ${read.field}: ${read.problem}`;
 */
import type { ComparableCase, ComparableEnvelopeRow, ComparableResults, HeadlineNumbers } from '../plant/comparable-results.ts';
import { HEADLINE_QUANTITIES } from './headline-quantities.ts';

export type IssuedResultsRead = { ok: true; results: ComparableResults } | { ok: false; field: string; problem: string };

/** The problem of a field that is not `what`: missing, or found as something else. */
function wrong(field: string, what: string, value: unknown): Unreadable {
  return new Unreadable(field, value === undefined ? `missing; expected ${what}` : `expected ${what}, ${found(value)}`);
}

/** A field that cannot be read: where, and what was expected. */
class Unreadable extends Error {
  constructor(
    readonly field: string,
    readonly problem: string,
  ) {
    super(`${field}: ${problem}`);
  }
}

function found(value: unknown): string {
  if (value === null) return 'found null';
  if (Array.isArray(value)) return 'found a list';
  if (typeof value === 'object') return 'found an object';
  if (typeof value === 'string') return `found the text ${JSON.stringify(value.length > 40 ? `${value.slice(0, 40)}…` : value)}`;
  return `found ${typeof value} ${String(value)}`;
}

function object(value: unknown, field: string, what: string): Record<string, unknown> {
  if (typeof value === 'object' && value !== null && !Array.isArray(value)) return value as Record<string, unknown>;
  throw wrong(field, what, value);
}

function list(value: unknown, field: string, what: string): unknown[] {
  if (Array.isArray(value)) return value;
  throw wrong(field, `a list of ${what}`, value);
}

function text(value: unknown, field: string): string {
  if (typeof value === 'string') return value;
  throw wrong(field, 'a text', value);
}

function finite(value: unknown, field: string): number {
  if (typeof value === 'number' && Number.isFinite(value)) return value;
  throw wrong(field, 'a number', value);
}

/** Each headline number the comparison reports that the object carries (a number or null); the rest of it is ignored. */
function headline(value: unknown, field: string): HeadlineNumbers {
  const raw = object(value, field, 'an object of the headline numbers');
  const out: HeadlineNumbers = {};
  for (const q of HEADLINE_QUANTITIES) {
    if (!(q.key in raw)) continue;
    const v = raw[q.key];
    if (v !== null && (typeof v !== 'number' || !Number.isFinite(v))) throw wrong(`${field}.${q.key}`, 'a number or null', v);
    out[q.key] = v;
  }
  return out;
}

/** Copies the optional field `key` of `raw` into `out` when present, checked by `check`. */
function optional<T>(raw: Record<string, unknown>, key: string, field: string, check: (v: unknown, field: string) => T): T | undefined {
  return key in raw ? check(raw[key], `${field}.${key}`) : undefined;
}

function flag(value: unknown, field: string): boolean {
  if (typeof value === 'boolean') return value;
  throw wrong(field, 'true or false', value);
}

function caseOf(value: unknown, field: string): ComparableCase {
  const raw = object(value, field, 'an operating case');
  const out: ComparableCase = { id: text(raw.id, `${field}.id`), title: text(raw.title, `${field}.title`) };
  const purpose = optional(raw, 'purpose', field, text);
  const sizing = optional(raw, 'sizing', field, flag);
  const ran = optional(raw, 'ran', field, flag);
  if (purpose !== undefined) out.purpose = purpose;
  if (sizing !== undefined) out.sizing = sizing;
  if (ran !== undefined) out.ran = ran;
  if ('headline' in raw) out.headline = raw.headline === null ? null : headline(raw.headline, `${field}.headline`);
  return out;
}

function envelopeRow(value: unknown, field: string): ComparableEnvelopeRow {
  const raw = object(value, field, 'an envelope quantity');
  return {
    id: text(raw.id, `${field}.id`),
    quantity: text(raw.quantity, `${field}.quantity`),
    unit: text(raw.unit, `${field}.unit`),
    value: finite(raw.value, `${field}.value`),
    case: text(raw.case, `${field}.case`),
  };
}

/** The comparable part of a parsed results.json; the field paths are those of the JSON (`cases[2].headline.cells`). */
export function readIssuedResults(raw: unknown): IssuedResultsRead {
  try {
    const top = object(raw, '(the whole file)', 'an object of cellbasis results');
    const results: ComparableResults = { headline: headline(top.headline, 'headline') };
    if ('cases' in top) results.cases = list(top.cases, 'cases', 'operating cases').map((c, i) => caseOf(c, `cases[${i}]`));
    if ('envelope' in top) results.envelope = list(top.envelope, 'envelope', 'envelope quantities').map((e, i) => envelopeRow(e, `envelope[${i}]`));
    return { ok: true, results };
  } catch (error) {
    if (error instanceof Unreadable) return { ok: false, field: error.field, problem: error.problem };
    throw error;
  }
}
