/**
 * What a revision comparison reads of a results object: the headline numbers, the operating
 * cases and the envelope, each part optional where results of some version of cellbasis may not
 * carry it. The results of today's calculation (results-schema.ts) are such an object; so are the
 * results of an issued revision, read by lib/archive/issued-results.ts from a results.json that
 * an earlier (or later) version of cellbasis wrote, whose other fields are never read. A part or
 * headline number absent on one side is reported as not compared (lib/archive/compare.ts).
 */
import type { Results } from './results-schema.ts';

/** The keys of results.headline whose value is a number or null. */
export type HeadlineKey = { [K in keyof Results['headline']]: Results['headline'][K] extends number | null ? K : never }[keyof Results['headline']];

/** Headline numbers by key; a key absent where the results that carried them did not have it. */
export type HeadlineNumbers = { [K in HeadlineKey]?: number | null };

export interface ComparableCase {
  id: string;
  title: string;
  purpose?: string;
  sizing?: boolean;
  ran?: boolean;
  /** null where the case did not run; absent where the results carried no headline for it. */
  headline?: HeadlineNumbers | null;
}

export interface ComparableEnvelopeRow {
  id: string;
  quantity: string;
  unit: string;
  value: number;
  case: string;
}

export interface ComparableResults {
  headline: HeadlineNumbers;
  /** Absent in results written before operating cases existed. */
  cases?: readonly ComparableCase[];
  /** Absent in results written before the envelope existed. */
  envelope?: readonly ComparableEnvelopeRow[];
}
