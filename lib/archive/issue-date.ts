/**
 * The issue date: the one date every timestamp of an issued revision uses (manifest, PDF
 * properties, attachment dates, the document's own date), so that issuing the same inputs on
 * the same date gives the same files. From `issue --date YYYY-MM-DD` (00:00 UTC of that day),
 * else SOURCE_DATE_EPOCH (that second, https://reproducible-builds.org/specs/source-date-epoch/),
 * else today (00:00 UTC). Never the time of day of the clock.
 */
import { UserError } from '../core/errors.ts';

export interface IssueDate {
  /** YYYY-MM-DD (UTC). */
  day: string;
  /** The timestamp written into the files. */
  at: Date;
  from: '--date' | 'SOURCE_DATE_EPOCH' | 'today';
}

/** A YYYY-MM-DD that names a real calendar day, as 00:00 UTC; undefined otherwise. */
function parseDay(text: string): Date | undefined {
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(text);
  if (!m) return undefined;
  const date = new Date(Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3])));
  return date.toISOString().slice(0, 10) === text ? date : undefined;
}

export function resolveIssueDate(option: string | undefined, env: Record<string, string | undefined>, now: () => Date = () => new Date()): IssueDate {
  if (option !== undefined) {
    const at = parseDay(option);
    if (!at) throw new UserError(`issue: --date must be a calendar date written YYYY-MM-DD, got "${option}"`);
    return { day: option, at, from: '--date' };
  }
  const epoch = env.SOURCE_DATE_EPOCH;
  if (epoch !== undefined && epoch !== '') {
    if (!/^\d{1,12}$/.test(epoch)) throw new UserError(`SOURCE_DATE_EPOCH must be whole seconds since 1970-01-01 UTC, got "${epoch}"`);
    const at = new Date(Number(epoch) * 1000);
    return { day: at.toISOString().slice(0, 10), at, from: 'SOURCE_DATE_EPOCH' };
  }
  const day = now().toISOString().slice(0, 10);
  return { day, at: parseDay(day)!, from: 'today' };
}
