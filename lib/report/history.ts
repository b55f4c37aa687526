/**
 * The revision history of a project for its documents: every issued revision in issue order
 * (ASME Y14.35 sequence, lib/basis/revisions.ts), then the working draft as the draft of the next
 * revision. Each entry can carry a change summary against the revision before it; that comparison
 * belongs to lib/archive, so it is passed in as `changeSummary` (the extension point) and the
 * entries hold null without it.
 */
import type { DesignBasis } from '../basis/types.ts';
import type { ComparableResults } from '../plant/comparable-results.ts';
import { compareRevisions, type IssueStatus } from '../basis/revisions.ts';
import { draftSignOffDate, type SignatureFacts } from './revision.ts';

/**
 * What the history shows of an issued revision, as its manifest records it (lib/archive/layout.ts
 * IssueManifest has these fields; the report names only what it displays, so that it does not
 * depend on the archive above it).
 */
export interface IssuedFacts {
  status: IssueStatus;
  issuedOn: string;
  note: string;
  signOff: readonly { role: 'prepared' | 'checked' | 'approved'; name: string; date?: string }[];
  signatures: readonly SignatureFacts[];
}

/** A revision's content as the comparison needs it: the basis and results as issued (or of the draft). */
export interface RevisionData {
  revision: string;
  /**
   * The validated basis; null for an issued revision whose basis.yaml today's loader does not
   * read (written by an earlier version of cellbasis): its comparison then works on the YAML.
   */
  basis: DesignBasis | null;
  /** Why today's loader does not read an issued basis (with basis null). */
  basisProblem?: string;
  /** The basis.yaml as text, for the structural comparison of its fields. */
  source?: string;
  /** The draft's results, or an issued revision's as far as comparisons read them. */
  results: ComparableResults;
}

/** Readable lines saying what changed from `previous` to `current` (lib/archive/compare.ts provides one). */
export type ChangeSummary = (previous: RevisionData, current: RevisionData) => string[];

export interface IssuedRevisionRecord extends RevisionData {
  manifest: IssuedFacts;
  /** Site path of its page (e.g. projects/x/rev-A/index.html), or null where pages are not linked. */
  path: string | null;
}

/** The working draft: `revision` is the one it becomes when next issued; its basis always validates. */
export interface DraftRecord extends RevisionData {
  basis: DesignBasis;
  path: string | null;
}

export interface RevisionHistoryEntry {
  kind: 'issued' | 'draft';
  revision: string;
  /** The issued status; null for the draft. */
  status: IssueStatus | null;
  /** Issue date, or "" for the draft. */
  date: string;
  note: string;
  prepared: string;
  checked: string;
  approved: string;
  /** The keys that signed an issued revision's manifest; [] for none and for the draft. */
  signatures: readonly SignatureFacts[];
  superseded: boolean;
  path: string | null;
  /** What changed against the entry before it; null where no comparison was given or there is nothing before. */
  changes: string[] | null;
}

type Role = 'prepared' | 'checked' | 'approved';

function signatory(list: IssuedFacts['signOff'], role: Role): string {
  const s = list.find((x) => x.role === role);
  return s ? `${s.name}${s.date ? `, ${s.date}` : ''}` : '';
}

function draftSignatory(basis: DesignBasis, role: Role, last: IssuedRevisionRecord | undefined): string {
  const s = basis.document.signOff[role];
  const lastIssued = last ? { revision: last.revision, status: last.manifest.status, issuedOn: last.manifest.issuedOn } : null;
  return s ? `${s.name}${s.date ? `, ${draftSignOffDate(s.date, lastIssued)}` : ''}` : '';
}

/** Issued revisions in issue order, then the draft; superseded marks every issued one but the last. */
export function revisionHistory(input: { issued: readonly IssuedRevisionRecord[]; draft: DraftRecord | null; changeSummary?: ChangeSummary }): RevisionHistoryEntry[] {
  const issued = [...input.issued].sort((a, b) => compareRevisions(a.revision, b.revision));
  const entries: RevisionHistoryEntry[] = issued.map((s, i) => ({
    kind: 'issued',
    revision: s.revision,
    status: s.manifest.status,
    date: s.manifest.issuedOn,
    note: s.manifest.note,
    prepared: signatory(s.manifest.signOff, 'prepared'),
    checked: signatory(s.manifest.signOff, 'checked'),
    approved: signatory(s.manifest.signOff, 'approved'),
    signatures: s.manifest.signatures,
    superseded: i < issued.length - 1,
    path: s.path,
    changes: i > 0 && input.changeSummary ? input.changeSummary(issued[i - 1]!, s) : null,
  }));
  if (input.draft) {
    const d = input.draft;
    const last = issued[issued.length - 1];
    entries.push({
      kind: 'draft',
      revision: d.revision,
      status: null,
      date: '',
      note: '',
      prepared: draftSignatory(d.basis, 'prepared', last),
      checked: draftSignatory(d.basis, 'checked', last),
      approved: draftSignatory(d.basis, 'approved', last),
      signatures: [],
      superseded: false,
      path: d.path,
      changes: last && input.changeSummary ? input.changeSummary(last, d) : null,
    });
  }
  return entries;
}
