/**
 * The revision history of a project for its documents: every sealed revision in issue order
 * (ASME Y14.35 sequence, lib/basis/revisions.ts), then the working draft. Each entry can carry a
 * change summary against the revision before it; that comparison belongs to lib/archive, so it is
 * passed in as `changeSummary` (the extension point) and the entries hold null without it.
 */
import type { DesignBasis, DocumentStatus } from '../basis/types.ts';
import type { Results } from '../plant/results-schema.ts';
import { compareRevisions } from '../basis/revisions.ts';

/**
 * What the history shows of a sealed revision, as its manifest records it (lib/archive/layout.ts
 * SealManifest has these fields; the report names only what it displays, so that it does not
 * depend on the archive above it).
 */
export interface SealedFacts {
  status: DocumentStatus;
  sealedOn: string;
  note: string;
  signOff: readonly { role: 'prepared' | 'checked' | 'approved'; name: string; date?: string }[];
}

/** A revision's content as the comparison needs it: the basis and results as sealed (or of the draft). */
export interface RevisionData {
  revision: string;
  basis: DesignBasis;
  results: Results;
}

/** Readable lines saying what changed from `previous` to `current` (lib/archive/compare.ts provides one). */
export type ChangeSummary = (previous: RevisionData, current: RevisionData) => string[];

export interface SealedRevisionRecord extends RevisionData {
  manifest: SealedFacts;
  /** Site path of its page (e.g. projects/x/rev-A/index.html), or null where pages are not linked. */
  path: string | null;
}

export interface DraftRecord extends RevisionData {
  status: DocumentStatus;
  path: string | null;
}

export interface RevisionHistoryEntry {
  kind: 'sealed' | 'draft';
  revision: string;
  status: DocumentStatus;
  /** Seal date, or "" for the draft. */
  date: string;
  note: string;
  prepared: string;
  checked: string;
  approved: string;
  superseded: boolean;
  path: string | null;
  /** What changed against the entry before it; null where no comparison was given or there is nothing before. */
  changes: string[] | null;
}

function signatory(list: SealedFacts['signOff'], role: 'prepared' | 'checked' | 'approved'): string {
  const s = list.find((x) => x.role === role);
  return s ? `${s.name}${s.date ? `, ${s.date}` : ''}` : '';
}

function draftSignatory(basis: DesignBasis, role: 'prepared' | 'checked' | 'approved'): string {
  const s = basis.document.signOff[role];
  return s ? `${s.name}${s.date ? `, ${s.date}` : ''}` : '';
}

/** Sealed revisions in issue order, then the draft; superseded marks every sealed one but the last. */
export function revisionHistory(input: { sealed: readonly SealedRevisionRecord[]; draft: DraftRecord | null; changeSummary?: ChangeSummary }): RevisionHistoryEntry[] {
  const sealed = [...input.sealed].sort((a, b) => compareRevisions(a.revision, b.revision));
  const entries: RevisionHistoryEntry[] = sealed.map((s, i) => ({
    kind: 'sealed',
    revision: s.revision,
    status: s.manifest.status,
    date: s.manifest.sealedOn,
    note: s.manifest.note,
    prepared: signatory(s.manifest.signOff, 'prepared'),
    checked: signatory(s.manifest.signOff, 'checked'),
    approved: signatory(s.manifest.signOff, 'approved'),
    superseded: i < sealed.length - 1 || s.manifest.status === 'superseded',
    path: s.path,
    changes: i > 0 && input.changeSummary ? input.changeSummary(sealed[i - 1]!, s) : null,
  }));
  if (input.draft) {
    const d = input.draft;
    const last = sealed[sealed.length - 1];
    entries.push({
      kind: 'draft',
      revision: d.revision,
      status: d.status,
      date: '',
      note: `basis status: ${d.status}`,
      prepared: draftSignatory(d.basis, 'prepared'),
      checked: draftSignatory(d.basis, 'checked'),
      approved: draftSignatory(d.basis, 'approved'),
      superseded: false,
      path: d.path,
      changes: last && input.changeSummary ? input.changeSummary(last, d) : null,
    });
  }
  return entries;
}
