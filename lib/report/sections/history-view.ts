/**
 * Section 11, the revision history as the page shows it: one row per sealed revision and one for
 * the working draft, the row of the page itself marked, superseded revisions marked, links to
 * the other revisions' pages where the page belongs to a site, and the change summary of each
 * revision against the one before it where lib/archive supplied one.
 */
import type { RevisionHistoryEntry } from '../history.ts';
import type { RevisionContext } from '../revision.ts';

export interface HistoryRow {
  revision: string;
  status: string;
  date: string;
  note: string;
  prepared: string;
  checked: string;
  approved: string;
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
  /** A sentence for a project with no sealed revision yet, or "". */
  remark: string;
}

export function historySection(entries: readonly RevisionHistoryEntry[], revision: RevisionContext, link: ((path: string) => string) | null): HistorySection {
  const rows = entries.map((e, i) => {
    const current = revision.kind === 'draft' ? e.kind === 'draft' : e.kind === 'sealed' && e.revision === revision.revision;
    return {
      revision: e.kind === 'draft' ? `${e.revision} (draft)` : e.revision,
      status: e.kind === 'draft' ? 'working draft' : e.superseded ? `${e.status}, superseded` : e.status,
      date: e.date || 'not issued',
      note: e.note,
      prepared: e.prepared,
      checked: e.checked,
      approved: e.approved,
      changes: e.changes,
      changesFrom: i > 0 ? entries[i - 1]!.revision : '',
      href: !current && link && e.path ? link(e.path) : null,
      current,
      superseded: e.superseded,
    };
  });
  const sealed = entries.filter((e) => e.kind === 'sealed').length;
  return {
    rows,
    hasChanges: rows.some((r) => r.changes !== null),
    remark: sealed === 0 ? 'No revision of this document has been sealed yet: the working draft below is the only version.' : '',
  };
}
