/**
 * Which revision a document shows, and the status mark, date and links that follow from it. The issued
 * revisions (lib/archive) decide every revision and status: a page is either the working draft
 * of a project, shown as the draft of the revision it will be issued as and never as issued, or
 * a revision being issued, as its manifest records it. An issued revision's document is rendered
 * once, when it is issued, and never again (the site shows the file issued).
 */
import type { IssueStatus } from '../basis/revisions.ts';

/** A digital signature of an issued revision's manifest, as the manifest records it. */
export interface SignatureFacts {
  role: 'prepared' | 'checked' | 'approved';
  /** The key's name (the name it was made with, cellbasis keygen NAME). */
  key: string;
  /** SHA-256 of the public key (SPKI DER), lower-case hex. */
  fingerprint: string;
}

/** The revision last issued, as a draft names it. */
export interface IssuedSummary {
  revision: string;
  status: IssueStatus;
  issuedOn: string;
}

export type RevisionContext =
  | {
      kind: 'draft';
      /** The revision this draft becomes when it is next issued (lib/basis/revisions.ts nextRevision). */
      revision: string;
      /** The revision issued last, or null when none is. */
      lastIssued: IssuedSummary | null;
      /** The date the draft is shown with (YYYY-MM-DD): SOURCE_DATE_EPOCH, else its latest sign-off date; null when neither exists. */
      date: string | null;
      /** Link to the draft's PDF beside the page (relative), when the build prints one. */
      pdfHref?: string | null;
    }
  | {
      kind: 'issued';
      revision: string;
      status: IssueStatus;
      /** The issue date (YYYY-MM-DD) of manifest.json. */
      issuedOn: string;
      /** The note given when the revision was issued, or "". */
      note: string;
      /** The signatures its manifest records, in sign-off order. */
      signatures: readonly SignatureFacts[];
      /** Link to the issued PDF beside the document (relative), or null when there is none. */
      pdfHref: string | null;
    };

export type StatusMarkKind = 'draft' | 'issued' | 'approved';

export interface StatusMark {
  kind: StatusMarkKind;
  /** The words of the status mark, e.g. "Draft, not issued". */
  text: string;
  /** One line under it, e.g. "Draft of revision B; revision A issued for review on 2026-09-22". */
  detail: string;
}

/** A status as the status mark writes it: "Issued for review". */
export function statusWords(status: IssueStatus): string {
  return status.charAt(0).toUpperCase() + status.slice(1);
}

export function statusMarkFor(revision: RevisionContext): StatusMark {
  if (revision.kind === 'draft') {
    const last = revision.lastIssued;
    const before = last ? `revision ${last.revision} ${last.status} on ${last.issuedOn}` : 'no revision issued yet';
    return { kind: 'draft', text: 'Draft, not issued', detail: `Draft of revision ${revision.revision}; ${before}` };
  }
  return {
    kind: revision.status === 'approved' ? 'approved' : 'issued',
    text: statusWords(revision.status),
    detail: `Revision ${revision.revision}, issued ${revision.issuedOn}`,
  };
}

/** The revision the page shows: "B", or "B, draft, not issued" for the working draft. */
export function revisionLabel(revision: RevisionContext): string {
  return revision.kind === 'issued' ? revision.revision : `${revision.revision}, draft, not issued`;
}

/** The status the page states (PDF header and properties): the issued one, or "draft, not issued". */
export function statusLabel(revision: RevisionContext): string {
  return revision.kind === 'issued' ? revision.status : DRAFT_STATUS;
}

/** What a working draft states as its status, on its page and in its PDF. */
export const DRAFT_STATUS = 'draft, not issued';

/** The date of the page: the issue date, or the draft's date. */
export function revisionDate(revision: RevisionContext): string | null {
  return revision.kind === 'issued' ? revision.issuedOn : revision.date;
}

/** A fingerprint as a document writes it: its first 16 hex digits in groups of four. */
export function shortFingerprint(fingerprint: string): string {
  return fingerprint.slice(0, 16).replace(/(.{4})(?=.)/g, '$1 ');
}

/**
 * A draft's sign-off date as the page writes it: a date before the revision issued last was
 * issued belongs to that revision's sign-off, kept in the basis, not to this draft, and says so
 * (the issue refuses it, or notes it, when the basis changed since: lib/archive/issue-rules.ts).
 */
export function draftSignOffDate(date: string, lastIssued: IssuedSummary | null): string {
  return lastIssued && date && date < lastIssued.issuedOn ? `${date} (before revision ${lastIssued.revision} was issued, ${lastIssued.issuedOn})` : date;
}
