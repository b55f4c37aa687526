/**
 * Revision identifiers and their order, after the drawing-revision practice of ASME Y14.35
 * (Revision of Engineering Drawings and Associated Documents): letters A, B, C, … for the revisions
 * before a document is approved, skipping I, O, Q, S, X and Z (easily misread), then AA, AB, …;
 * numbers 0, 1, 2, … once it is approved for use. A letter revision may be followed by the next
 * letter or by 0; a number only by the next number. The first revision is A or 0.
 */
import { UserError } from '../core/errors.ts';

/**
 * The statuses a revision is issued with, in the order of the review cycle. The working basis has
 * none (it is always the draft of the next revision); a revision becomes superseded when the next
 * one is issued, which the archive shows and never writes.
 */
export type IssueStatus = 'issued for review' | 'issued for approval' | 'approved';

export const ISSUE_STATUSES: readonly IssueStatus[] = ['issued for review', 'issued for approval', 'approved'];

const LETTERS = 'ABCDEFGHJKLMNPRTUVWY'.split('');

const REVISION_PATTERN = /^(?:[A-HJ-NPRT-WY]{1,2}|0|[1-9][0-9]{0,2})$/;

export function isRevision(text: string): boolean {
  return REVISION_PATTERN.test(text);
}

/** Why a revision name is refused, or undefined when it is valid. */
export function revisionProblem(text: string): string | undefined {
  if (isRevision(text)) return undefined;
  return `revision "${text}" is not a revision name: use letters A, B, C, ... (no I, O, Q, S, X, Z; then AA, AB, ...) before approval, or numbers 0, 1, 2, ... after (ASME Y14.35 practice)`;
}

function letterIndex(rev: string): number {
  if (rev.length === 1) return LETTERS.indexOf(rev);
  return LETTERS.length * (LETTERS.indexOf(rev[0]!) + 1) + LETTERS.indexOf(rev[1]!);
}

function letterAt(index: number): string {
  if (index < LETTERS.length) return LETTERS[index]!;
  const rest = index - LETTERS.length;
  return `${LETTERS[Math.floor(rest / LETTERS.length)]!}${LETTERS[rest % LETTERS.length]!}`;
}

/** The revisions that may follow `previous` (null: the first revision). */
export function successors(previous: string | null): string[] {
  if (previous === null) return ['A', '0'];
  if (/^[0-9]+$/.test(previous)) return [String(Number(previous) + 1)];
  return [letterAt(letterIndex(previous) + 1), '0'];
}

/**
 * The revision a working draft becomes when it is next issued, as the draft shows itself: A when
 * none is issued, else the next letter after a letter and the next number after a number. (A
 * letter may also be followed by 0, the first approved revision: `successors` lists both.)
 */
export function nextRevision(last: string | null): string {
  return successors(last)[0]!;
}

/** Sorts revisions in issue order: letters in sequence, then numbers. */
export function compareRevisions(a: string, b: string): number {
  const numeric = (r: string) => /^[0-9]+$/.test(r);
  if (numeric(a) !== numeric(b)) return numeric(a) ? 1 : -1;
  return numeric(a) ? Number(a) - Number(b) : letterIndex(a) - letterIndex(b);
}

/** Throws a UserError when `revision` may not follow `previous`. */
export function checkFollows(previous: string | null, revision: string): void {
  const problem = revisionProblem(revision);
  if (problem) throw new UserError(problem);
  const allowed = successors(previous);
  if (!allowed.includes(revision)) {
    throw new UserError(
      `revision ${revision} does not follow ${previous === null ? 'the start (no revision is issued yet)' : `the last issued revision ${previous}`}: the next revision is ${allowed.join(' or ')}`,
    );
  }
}
