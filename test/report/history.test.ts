// The revision history: sealed revisions in ASME Y14.35 order whatever order they come in, all but
// the last superseded, the draft last, links relative to each page, and the change summary of the
// archive (the extension point) against the revision before.
import { describe, expect, it } from 'vitest';
import { revisionHistory, type SealedRevisionRecord } from '../../lib/report/history.ts';
import { historySection } from '../../lib/report/sections/history-view.ts';
import { stampFor } from '../../lib/report/revision.ts';
import { relativeHref, revisionPagePath, draftPagePath } from '../../lib/report/links.ts';
import type { SealManifest } from '../../lib/archive/layout.ts';
import { scaffoldCase } from '../helpers/scaffold-cases.ts';

const c = scaffoldCase('solid-oxide', 'power');

function sealed(revision: string, sealedOn: string): SealedRevisionRecord {
  const manifest: SealManifest = {
    format: 'cellbasis-seal/1',
    project: 'demo',
    documentNumber: 'DB-demo-001',
    title: 'demo',
    revision,
    status: revision === '0' ? 'approved' : 'issued for review',
    note: `note ${revision}`,
    sealedOn,
    tool: { name: 'cellbasis', version: '0.1.0' },
    speciesData_sha256: '0'.repeat(64),
    files: {},
    previous: null,
    signOff: [{ role: 'prepared', name: 'P. Someone', date: sealedOn }],
  };
  return { revision, basis: c.basis, results: c.results, manifest, path: revisionPagePath('demo', revision) };
}

describe('revisionHistory', () => {
  const draft = { revision: 'C', status: 'draft' as const, basis: c.basis, results: c.results, path: draftPagePath('demo') };
  const entries = revisionHistory({ sealed: [sealed('0', '2026-03-01'), sealed('A', '2026-01-10'), sealed('B', '2026-02-01')], draft, changeSummary: (a, b) => [`${a.revision} to ${b.revision}`] });

  it('orders letters before numbers and puts the draft last', () => {
    expect(entries.map((e) => `${e.kind}:${e.revision}`)).toEqual(['sealed:A', 'sealed:B', 'sealed:0', 'draft:C']);
  });
  it('marks every sealed revision but the last as superseded', () => {
    expect(entries.map((e) => e.superseded)).toEqual([true, true, false, false]);
  });
  it('asks the change summary of each revision against the one before, none for the first', () => {
    expect(entries.map((e) => e.changes)).toEqual([null, ['A to B'], ['B to 0'], ['0 to C']]);
  });
  it('holds no change summary when none is given', () => {
    expect(revisionHistory({ sealed: [sealed('A', '2026-01-10'), sealed('B', '2026-02-01')], draft: null }).map((e) => e.changes)).toEqual([null, null]);
  });

  it('links the other revisions relative to the page and marks its own row', () => {
    const view = historySection(entries, { kind: 'sealed', revision: 'B', status: 'issued for review', sealedOn: '2026-02-01', note: '', supersededBy: '0', pdfHref: null }, (p) => relativeHref(revisionPagePath('demo', 'B'), p));
    expect(view.rows.map((r) => r.href)).toEqual(['../rev-A/index.html', null, '../rev-0/index.html', '../index.html']);
    expect(view.rows.map((r) => r.current)).toEqual([false, true, false, false]);
    expect(view.hasChanges).toBe(true);
  });
});

describe('the stamp', () => {
  it('calls a working draft a draft, not issued, whatever its basis says', () => {
    expect(stampFor({ kind: 'draft', date: null }, 'approved', '2').text).toBe('Draft, not issued');
  });
  it('marks a sealed revision with a later one as superseded', () => {
    const s = stampFor({ kind: 'sealed', revision: 'A', status: 'issued for review', sealedOn: '2026-01-10', note: '', supersededBy: 'B', pdfHref: null }, 'draft', 'C');
    expect(s.kind).toBe('superseded');
    expect(s.detail).toContain('revision B');
  });
  it('shows the status of the current sealed revision', () => {
    expect(stampFor({ kind: 'sealed', revision: '0', status: 'approved', sealedOn: '2026-03-01', note: '', supersededBy: null, pdfHref: null }, 'draft', 'C').text).toBe('Approved');
  });
});
