/**
 * Which revision a document page shows, and the stamp, date and links that follow from it: the
 * working draft of a project (never issued, whatever status its basis states) or a sealed
 * revision, which is superseded once a later revision of the same project is sealed.
 */
import type { DocumentStatus } from '../basis/types.ts';

export type RevisionContext =
  | {
      kind: 'draft';
      /** The date the draft is shown with (YYYY-MM-DD): SOURCE_DATE_EPOCH, else its latest sign-off date; null when neither exists. */
      date: string | null;
      /** Link to the draft's PDF beside the page (relative), when the build prints one. */
      pdfHref?: string | null;
    }
  | {
      kind: 'sealed';
      revision: string;
      status: DocumentStatus;
      /** The seal date (YYYY-MM-DD) of manifest.json. */
      sealedOn: string;
      /** The note given when the revision was sealed, or "". */
      note: string;
      /** The later sealed revision that replaces this one, or null for the current one. */
      supersededBy: string | null;
      /** Link to the sealed PDF beside the page (relative), or null when there is none. */
      pdfHref: string | null;
    };

export type StampKind = 'draft' | 'issued' | 'approved' | 'superseded';

export interface Stamp {
  kind: StampKind;
  /** The words of the stamp, e.g. "Draft, not issued". */
  text: string;
  /** One line under it, e.g. "Superseded by revision C". */
  detail: string;
}

function statusWords(status: DocumentStatus): string {
  return status.charAt(0).toUpperCase() + status.slice(1);
}

export function stampFor(revision: RevisionContext, basisStatus: DocumentStatus, basisRevision: string): Stamp {
  if (revision.kind === 'draft') {
    return { kind: 'draft', text: 'Draft, not issued', detail: `Working draft of revision ${basisRevision} (basis status: ${basisStatus})` };
  }
  if (revision.supersededBy !== null || revision.status === 'superseded') {
    const by = revision.supersededBy === null ? 'a later revision' : `revision ${revision.supersededBy}`;
    return { kind: 'superseded', text: 'Superseded', detail: `Revision ${revision.revision}, ${revision.status}; superseded by ${by}` };
  }
  return {
    kind: revision.status === 'approved' ? 'approved' : 'issued',
    text: statusWords(revision.status),
    detail: `Sealed revision ${revision.revision}, ${revision.sealedOn}`,
  };
}

/** The revision the page shows: the sealed one, else the draft's revision as its basis states it. */
export function revisionLabel(revision: RevisionContext, basisRevision: string): string {
  return revision.kind === 'sealed' ? revision.revision : `${basisRevision} (draft)`;
}

/** The date of the page: the seal date, or the draft's date. */
export function revisionDate(revision: RevisionContext): string | null {
  return revision.kind === 'sealed' ? revision.sealedOn : revision.date;
}
