/**
 * Checks the plain data of a basis against the schema (schema.ts) and turns zod's issues into
 * findings a user can act on: one per unknown key (at the key, with did-you-mean), "required
 * but missing" at the mapping that lacks the key, and for a value that may take several forms
 * (a unit string or `{ value, source }`) the problems of the form the value was written in.
 * Returns the paths found wrong, so the later checks skip them instead of repeating the error.
 */
import type { z } from 'zod';
import { basisSchema } from './schema.ts';
import { describeValue } from './schema-parts.ts';
import { pathText, type Findings, type Path } from './diagnostics.ts';
import { closest } from '../core/suggest.ts';

type Issue = z.core.$ZodIssue;

const EXPECTED: Record<string, string> = {
  string: 'text',
  number: 'a number',
  boolean: 'true or false',
  object: 'a mapping',
  array: 'a list',
  record: 'a mapping',
};

/** Messages for the issues no schema part words itself (mostly wrong types). */
function generalMessage(issue: z.core.$ZodRawIssue): string | undefined {
  if (issue.code !== 'invalid_type') return undefined;
  if ((issue.path ?? []).length === 0) {
    return `a design basis is a mapping of sections (document:, cell:, conditions:, streams:, operating-point:, ...), got ${describeValue(issue.input)}`;
  }
  const expected = EXPECTED[issue.expected] ?? issue.expected;
  const quoteHint = issue.expected === 'string' && ((typeof issue.input === 'number' && Number.isFinite(issue.input)) || typeof issue.input === 'boolean') ? ` (to keep it as text, quote it: "${String(issue.input)}")` : '';
  return `expected ${expected}, got ${describeValue(issue.input)}${quoteHint}`;
}

function valueAt(data: unknown, path: Path): { present: boolean } {
  let current: unknown = data;
  for (const segment of path) {
    if (current === null || typeof current !== 'object' || !Object.hasOwn(current, String(segment))) return { present: false };
    current = (current as Record<string, unknown>)[String(segment)];
  }
  return { present: current !== undefined };
}

/** The branch of a failed union the value was evidently written for: the one whose top-level type matched, if only one did. */
function chosenBranch(branches: Issue[][]): Issue[] | undefined {
  const typed = branches.filter((branch) => !branch.some((i) => i.code === 'invalid_type' && i.path.length === 0));
  return typed.length === 1 ? typed[0] : undefined;
}

interface Pending {
  path: Path;
  message: string;
  kind: 'unknown' | 'missing' | 'value';
}

function collect(issue: Issue, prefix: Path, data: unknown, out: Pending[]): void {
  const path = [...prefix, ...(issue.path as (string | number)[])];
  if (issue.code === 'invalid_union') {
    const branch = chosenBranch(issue.errors);
    if (branch) {
      for (const inner of branch) collect(inner, path, data, out);
      return;
    }
  }
  if (issue.code === 'invalid_key') {
    // A key of a record that its key schema refuses (a case id): that schema's own message, at the key.
    out.push({ path, message: issue.issues[0]?.message ?? issue.message, kind: 'unknown' });
    return;
  }
  if (issue.code === 'unrecognized_keys') {
    const messages = issue.message.split('\n');
    issue.keys.forEach((key, i) => out.push({ path: [...path, key], message: messages[i] ?? messages[0]!, kind: 'unknown' }));
    return;
  }
  if (path.length > 0 && !valueAt(data, path).present) out.push({ path, message: 'this key is required but missing', kind: 'missing' });
  else out.push({ path, message: issue.message, kind: 'value' });
}

/** A missing key is not reported again when an unknown key beside it is evidently its misspelling. */
function misspelt(missing: Pending, all: Pending[]): boolean {
  const parent = pathText(missing.path.slice(0, -1));
  const key = String(missing.path[missing.path.length - 1]);
  return all.some((p) => p.kind === 'unknown' && pathText(p.path.slice(0, -1)) === parent && closest(String(p.path[p.path.length - 1]), [key]).length > 0);
}

/** Adds the schema's findings; returns the paths found wrong. */
export function schemaFindings(data: unknown, findings: Findings): Path[] {
  const result = basisSchema.safeParse(data, { error: generalMessage });
  if (result.success) return [];
  const pending: Pending[] = [];
  for (const issue of result.error.issues) collect(issue, [], data, pending);
  for (const p of pending) {
    if (p.kind === 'missing' && misspelt(p, pending)) continue;
    findings.error(p.path, p.message, p.kind === 'unknown' ? 'key' : p.kind === 'missing' ? 'missing' : 'value');
  }
  return pending.map((p) => p.path);
}
