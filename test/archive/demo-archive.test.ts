// The demo archive committed under projects/ (issued by scripts/issue-demo-archive.ts, README
// "Issuing revisions"): it passes the audit, signed by the committed demo key and by no other;
// the molten carbonate project has revisions A and B with real changes between them, the PEM
// backup project an approved revision 0 with the full sign-off; the archive stays under 10 MB
// (issue 20); and no private key is committed anywhere.
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { expect, it } from 'vitest';
import { auditProject } from '../../lib/archive/audit.ts';
import { readIssuedRevision } from '../../lib/archive/issued-revision.ts';
import { compareRevisions } from '../../lib/archive/compare.ts';
import { keyFingerprint, publicKeyPem, readPublicKey } from '../../lib/archive/signature.ts';
import { PACKAGE_ROOT } from '../../lib/publish/paths.ts';

const DEMO_KEY = join(PACKAGE_ROOT, 'keys', 'cellbasis-demo.pub');
const MCFC = 'corrin-beck-mcfc-biogas';
const BACKUP = 'hob-tor-pem-backup';

function files(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true, recursive: true })
    .filter((e) => e.isFile())
    .map((e) => join(e.parentPath, e.name));
}

it('passes the audit, every revision signed with the demo key only', async () => {
  const trusted = publicKeyPem(readPublicKey(DEMO_KEY));
  for (const [project, revisions] of [
    [MCFC, ['A', 'B']],
    [BACKUP, ['0']],
  ] as const) {
    const { lines, notes } = await auditProject(PACKAGE_ROOT, project, { trustedKeys: [trusted] });
    expect(lines.map((l) => [l.revision, l.problems])).toEqual(revisions.map((r) => [r, []]));
    expect(notes).toEqual([]);
    for (const line of lines) expect(line.signed).toContain(`key cellbasis-demo (${keyFingerprint(trusted).slice(0, 4)}`);
  }
}, 120_000);

it('has revisions A and B of the molten carbonate plant with real changes, and an approved revision 0 of the backup unit signed off in full', () => {
  const a = readIssuedRevision(PACKAGE_ROOT, MCFC, 'A');
  const b = readIssuedRevision(PACKAGE_ROOT, MCFC, 'B');
  expect([a.manifest.status, b.manifest.status]).toEqual(['issued for review', 'issued for approval']);
  expect(b.manifest.previous?.revision).toBe('A');
  const changes = compareRevisions(
    { revision: 'A', basis: a.basis, results: a.results, source: a.basisText },
    { revision: 'B', basis: b.basis, results: b.results, source: b.basisText },
  );
  expect(changes.inputs.map((c) => c.path)).toContain('operating-point.fuel-utilization');
  expect(changes.results.length).toBeGreaterThan(0);
  expect(changes.assumptions.length).toBeGreaterThan(0);

  const approved = readIssuedRevision(PACKAGE_ROOT, BACKUP, '0');
  expect(approved.manifest.status).toBe('approved');
  expect(approved.manifest.signOff.map((s) => s.role)).toEqual(['prepared', 'checked', 'approved']);
  expect(approved.manifest.signatures.map((s) => s.role)).toEqual(['checked', 'approved']);
});

it('keeps the committed archive under 10 MB and commits no private key', () => {
  let total = 0;
  for (const project of [MCFC, BACKUP]) for (const f of files(join(PACKAGE_ROOT, 'projects', project, 'issued'))) total += statSync(f).size;
  expect(total).toBeLessThan(10 * 1024 * 1024);
  for (const f of [...files(join(PACKAGE_ROOT, 'keys')), ...files(join(PACKAGE_ROOT, 'projects'))]) {
    expect(readFileSync(f, 'latin1'), relative(PACKAGE_ROOT, f)).not.toMatch(/-----BEGIN (?:[A-Z0-9 ]+ )?PRIVATE KEY-----/);
  }
});
