/**
 * The date a working draft is shown with, so that two builds of the same inputs give the same
 * bytes: SOURCE_DATE_EPOCH (seconds since 1970, the reproducible-builds convention) when set,
 * else the latest sign-off date of the basis or the issue date of the revision issued last,
 * whichever is later (a draft of the next revision is never dated before the revision it follows:
 * the sign-offs of a basis that kept the last revision's dates predate it), else none. The clock
 * is never read. Issued revisions always show their issue date.
 */
import type { DesignBasis } from '../basis/types.ts';
import { UserError } from '../core/errors.ts';

/** SOURCE_DATE_EPOCH as a date (YYYY-MM-DD, UTC), or null when it is not set. */
function sourceDateEpoch(env: NodeJS.ProcessEnv = process.env): string | null {
  const raw = env.SOURCE_DATE_EPOCH;
  if (raw === undefined || raw === '') return null;
  if (!/^\d{1,12}$/.test(raw)) throw new UserError(`SOURCE_DATE_EPOCH must be a whole number of seconds since 1970-01-01, got "${raw}"`);
  return new Date(Number(raw) * 1000).toISOString().slice(0, 10);
}

export function draftDate(basis: DesignBasis, env: NodeJS.ProcessEnv = process.env, lastIssuedOn: string | null = null): string | null {
  const epoch = sourceDateEpoch(env);
  if (epoch) return epoch;
  const dates = [...Object.values(basis.document.signOff).map((s) => s?.date), lastIssuedOn]
    .filter((d): d is string => typeof d === 'string')
    .sort();
  return dates[dates.length - 1] ?? null;
}
