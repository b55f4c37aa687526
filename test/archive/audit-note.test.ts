// The audit finds an issued revision's note in document.html as the templates escaped it. A note with a
// backslash (a Windows share, \\fs01\projects; LaTeX; the hostile corpus) was reported as missing
// from a genuine revision, because the audit escaped it without the backslash while Nunjucks writes
// it as &#92;. lib/report/trusted-html.ts's escapeHtml is now the templates' escaping exactly.
import { describe, expect, it } from 'vitest';
import { manifestProblems } from '../../lib/archive/audit-manifest.ts';
import type { IssueManifest } from '../../lib/archive/layout.ts';
import { manifestBytes } from '../../lib/archive/manifest.ts';
import { nunjucksEnvironment } from '../../lib/publish/nunjucks-env.ts';
import { escapeHtml } from '../../lib/report/trusted-html.ts';
import { hostileText } from '../helpers/hostile-basis.ts';

const NOTES = ['issued for review', 'files on \\\\fs01\\projects\\TDC', `it's "final" & <checked>`, hostileText('note'), '\\href{x}{y} {{ 7*7 }}'];

function manifestWith(note: string): IssueManifest {
  return {
    format: 'cellbasis-issue/2',
    project: 'p',
    documentNumber: 'DB-1',
    title: 't',
    revision: 'A',
    status: 'issued for review',
    note,
    issuedOn: '2026-11-30',
    issuedAt: '2026-11-30T00:00:00.000Z',
    tool: { name: 'cellbasis', version: '0.1.0' },
    speciesData_sha256: '0'.repeat(64),
    files: {},
    previous: null,
    signOff: [],
    signatures: [],
  };
}

describe('the note in the audit', () => {
  it.each(NOTES.map((n) => [n]))('escapeHtml writes %j exactly as the templates do', (note) => {
    expect(escapeHtml(note)).toBe(nunjucksEnvironment().renderString('{{ note }}', { note }));
  });

  it.each(NOTES.map((n) => [n]))('finds the note %j in a page the templates rendered', (note) => {
    const html = nunjucksEnvironment().renderString('<table><tr><td>{{ note }}</td></tr></table>', { note });
    const m = manifestWith(note);
    expect(manifestProblems(m, manifestBytes(m), 'p', 'A', { html })).toEqual([]);
  });

  it('still reports a note the page does not show', () => {
    const m = manifestWith('files on \\\\fs01\\projects');
    const html = nunjucksEnvironment().renderString('<td>{{ note }}</td>', { note: 'another note' });
    expect(manifestProblems(m, manifestBytes(m), 'p', 'A', { html }).map((f) => f.reason)).toEqual([`manifest.json: the note ${JSON.stringify(m.note)} does not appear in document.html`]);
  });
});
