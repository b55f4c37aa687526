/**
 * The revision history as the page shows it: one row per issued revision and one for the working
 * draft (the draft of the next revision, not issued), the row of the page itself marked,
 * superseded revisions marked, the keys that signed each, links to the other revisions' pages
 * where the page belongs to a site, and the change summary of each revision against the one
 * before it where lib/archive supplied one.
 */
import type { RevisionHistoryEntry } from '../history.ts';
import { DRAFT_STATUS, shortFingerprint, type RevisionContext } from '../revision.ts';

export interface HistoryRow {
  revision: string;
  status: string;
  date: string;
  note: string;
  prepared: string;
  checked: string;
  approved: string;
  /** The keys that signed it ("approved: key demo, 1a2b 3c4d 5e6f 7a8b"), "not signed", or "" for the draft. */
  signed: string;
  changes: string[] | null;
  /** The revision the changes are counted from. */
  changesFrom: string;
  href: string | null;
  /** This page's own revision. */
  current: boolean;
  superseded: boolean;
}

export interface HistorySection {
  rows: HistoryRow[];
  /** Whether any row carries a change summary (the column is shown only then). */
  hasChanges: boolean;
  /** A sentence for a project with no issued revision yet, or "". */
  remark: string;
}

function signedText(e: RevisionHistoryEntry): string {
  if (e.kind === 'draft') return '';
  if (e.signatures.length === 0) return 'not signed';
  return e.signatures.map((s) => `${s.role}: key ${s.key}, ${shortFingerprint(s.fingerprint)}`).join('; ');
}

export function historySection(entries: readonly RevisionHistoryEntry[], revision: RevisionContext, link: ((path: string) => string) | null): HistorySection {
  const rows = entries.map((e, i) => {
    const current = revision.kind === 'draft' ? e.kind === 'draft' : e.kind === 'issued' && e.revision === revision.revision;
    return {
      revision: e.kind === 'draft' ? `${e.revision} (draft)` : e.revision,
      status: e.status === null ? DRAFT_STATUS : e.superseded ? `${e.status}, superseded` : e.status,
      date: e.date || 'not issued',
      note: e.note,
      prepared: e.prepared,
      checked: e.checked,
      approved: e.approved,
      signed: signedText(e),
      changes: e.changes,
      changesFrom: i > 0 ? entries[i - 1]!.revision : '',
      href: !current && link && e.path ? link(e.path) : null,
      current,
      superseded: e.superseded,
    };
  });
  const issued = entries.filter((e) => e.kind === 'issued').length;
  return {
    rows,
    hasChanges: rows.some((r) => r.changes !== null),
    remark: issued === 0 ? 'No revision of this document has been issued yet: the working draft below is the only version.' : '',
  };
}
