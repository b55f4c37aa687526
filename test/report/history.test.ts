// The revision history: issued revisions in ASME Y14.35 order whatever order they come in, all but
// the last superseded, the draft last as the draft of the next revision, links relative to each
// page, the keys that signed each, and the change summary of the archive (the extension point)
// against the revision before; the status mark of a page from the archive alone.
import { describe, expect, it } from 'vitest';
import { revisionHistory, type IssuedRevisionRecord } from '../../lib/report/history.ts';
import { historySection } from '../../lib/report/sections/history-view.ts';
import { revisionLabel, statusMarkFor } from '../../lib/report/revision.ts';
import { relativeHref, revisionPagePath, draftPagePath } from '../../lib/report/links.ts';
import type { IssuedFacts } from '../../lib/report/history.ts';
import { scaffoldCase } from '../helpers/scaffold-cases.ts';

const c = scaffoldCase('solid-oxide', 'power');

function issued(revision: string, issuedOn: string): IssuedRevisionRecord {
  const manifest: IssuedFacts = {
    status: revision === '0' ? 'approved' : 'issued for review',
    note: `note ${revision}`,
    issuedOn,
    signOff: [{ role: 'prepared', name: 'P. Someone', date: issuedOn }],
    signatures: revision === '0' ? [{ role: 'approved', key: 'a-approver', fingerprint: `1a2b3c4d5e6f7a8b${'0'.repeat(48)}` }] : [],
  };
  return { revision, basis: c.basis, results: c.results, manifest, path: revisionPagePath('demo', revision) };
}

describe('revisionHistory', () => {
  const draft = { revision: '1', basis: c.basis, results: c.results, path: draftPagePath('demo') };
  const entries = revisionHistory({ issued: [issued('0', '2026-03-01'), issued('A', '2026-01-10'), issued('B', '2026-02-01')], draft, changeSummary: (a, b) => [`${a.revision} to ${b.revision}`] });

  it('orders letters before numbers and puts the draft last', () => {
    expect(entries.map((e) => `${e.kind}:${e.revision}`)).toEqual(['issued:A', 'issued:B', 'issued:0', 'draft:1']);
  });
  it('marks every issued revision but the last as superseded', () => {
    expect(entries.map((e) => e.superseded)).toEqual([true, true, false, false]);
  });
  it('asks the change summary of each revision against the one before, none for the first', () => {
    expect(entries.map((e) => e.changes)).toEqual([null, ['A to B'], ['B to 0'], ['0 to 1']]);
  });
  it('holds no change summary when none is given', () => {
    expect(revisionHistory({ issued: [issued('A', '2026-01-10'), issued('B', '2026-02-01')], draft: null }).map((e) => e.changes)).toEqual([null, null]);
  });

  it('links the other revisions relative to the page and marks its own row', () => {
    const view = historySection(entries, { kind: 'issued', revision: 'B', status: 'issued for review', issuedOn: '2026-02-01', note: '', signatures: [], pdfHref: null }, (p) => relativeHref(revisionPagePath('demo', 'B'), p));
    expect(view.rows.map((r) => r.href)).toEqual(['../rev-A/index.html', null, '../rev-0/index.html', '../index.html']);
    expect(view.rows.map((r) => r.current)).toEqual([false, true, false, false]);
    expect(view.hasChanges).toBe(true);
  });

  it('names the draft as the draft of the next revision, not issued, and says who signed each issued revision', () => {
    const view = historySection(entries, { kind: 'draft', revision: '1', lastIssued: null, date: null }, null);
    expect(view.rows.map((r) => [r.revision, r.status, r.date, r.signed])).toEqual([
      ['A', 'issued for review, superseded', '2026-01-10', 'not signed'],
      ['B', 'issued for review, superseded', '2026-02-01', 'not signed'],
      ['0', 'approved', '2026-03-01', 'approved: key a-approver, 1a2b 3c4d 5e6f 7a8b'],
      ['1 (draft)', 'draft, not issued', 'not issued', ''],
    ]);
  });
});

describe('the status mark', () => {
  it('calls a working draft the draft of its next revision, not issued, and names the revision issued last', () => {
    const draft = { kind: 'draft' as const, revision: 'B', lastIssued: { revision: 'A', status: 'issued for review' as const, issuedOn: '2026-01-10' }, date: null };
    expect(statusMarkFor(draft)).toEqual({ kind: 'draft', text: 'Draft, not issued', detail: 'Draft of revision B; revision A issued for review on 2026-01-10' });
    expect(revisionLabel(draft)).toBe('B, draft, not issued');
    expect(statusMarkFor({ ...draft, revision: 'A', lastIssued: null }).detail).toBe('Draft of revision A; no revision issued yet');
  });
  it('shows the status of an issued revision as its manifest records it', () => {
    const mark = statusMarkFor({ kind: 'issued', revision: '0', status: 'approved', issuedOn: '2026-03-01', note: '', signatures: [], pdfHref: null });
    expect(mark).toEqual({ kind: 'approved', text: 'Approved', detail: 'Revision 0, issued 2026-03-01' });
  });
});
