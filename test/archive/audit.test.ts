// Audit: an issued revision passes, saying who signed it; any changed byte of any issued file
// fails naming that file; signatures by another key fail; the audit checks what was issued, so
// changed species data fail no intact revision, and with --recalculate a recalculation that
// differs is reported field by field; the chain of revisions is checked, its signatures included.
import { cpSync, mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { createPrivateKey } from 'node:crypto';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { run } from '../helpers/run-cli.ts';
import { manifestBytes, parseManifest } from '../../lib/archive/manifest.ts';
import { sha256Hex } from '../../lib/archive/hash.ts';
import { keyFingerprint, newKeyPair, publicKeyPem, signBytes } from '../../lib/archive/signature.ts';
import type { IssueManifest } from '../../lib/archive/layout.ts';
import { auditProject } from '../../lib/archive/audit.ts';
import { getSpecies } from '../../lib/thermo/species-data.ts';
import type { NasaInterval } from '../../lib/thermo/nasa-glenn.ts';
import { announceChromiumSkip, describeWithChromium } from '../helpers/chromium.ts';
import { ISSUE_TIMEOUT, basisPath, flipByte, keygen, PROJECT, removeWorkspace, issue, issuedPath, workspace } from '../helpers/archive-workspace.ts';

announceChromiumSkip('the audit tests');

const ISSUED_FILE_NAMES = ['basis.yaml', 'results.json', 'document.html', 'document.pdf', 'manifest.json', 'manifest.prepared.sig'];

/** Rewrites results.json of a revision and its hash in manifest.json, as if it had been issued so. */
function replaceResults(cwd: string, revision: string, change: (results: any) => void): void {
  const resultsPath = issuedPath(cwd, revision, 'results.json');
  const results = JSON.parse(readFileSync(resultsPath, 'utf8'));
  change(results);
  const bytes = Buffer.from(`${JSON.stringify(results, null, 2)}\n`);
  writeFileSync(resultsPath, bytes);
  const manifestPath = issuedPath(cwd, revision, 'manifest.json');
  const parsed = parseManifest(readFileSync(manifestPath));
  if (!parsed.ok) throw new Error(parsed.problems.join('\n'));
  writeFileSync(manifestPath, manifestBytes({ ...parsed.manifest, files: { ...parsed.manifest.files, 'results.json': sha256Hex(bytes) } }));
}

describeWithChromium('audit', () => {
  /** Revisions A (unsigned) and B (signed, following A). */
  let base: string;
  /** Revision A only, unsigned: nothing but the cross-checks protects its manifest. */
  let single: string;
  const copies: string[] = [];

  /** A copy of an issued workspace to damage. */
  function copy(from = base): string {
    const cwd = mkdtempSync(join(tmpdir(), 'cellbasis-audit-'));
    cpSync(from, cwd, { recursive: true });
    copies.push(cwd);
    return cwd;
  }

  beforeAll(async () => {
    single = workspace();
    expect((await issue(single, ['A', '--status', 'issued for review', '--date', '2026-11-30', '--note', 'issued for the kick-off'])).code).toBe(0);
    base = workspace();
    expect((await keygen(base, 'signer')).code).toBe(0);
    expect((await issue(base, ['A', '--status', 'issued for review', '--date', '2026-11-30', '--note', 'first issue for the review meeting'])).code).toBe(0);
    const text = readFileSync(basisPath(base), 'utf8')
      .replace('value: "800 C", source: A1', 'value: "780 C", source: A1')
      .replace('    # checked: { name: ..., date: ... }\n', '    checked: { name: C. Checker, date: 2026-12-01 }\n');
    writeFileSync(basisPath(base), text);
    const b = await issue(base, ['B', '--status', 'issued for approval', '--date', '2026-12-01', '--key', 'prepared=keys/signer.key', '--note', 'colder stack']);
    expect(b.err).toBe('');
    expect(b.code).toBe(0);
  }, ISSUE_TIMEOUT);

  afterAll(() => {
    removeWorkspace(base);
    removeWorkspace(single);
    for (const c of copies) rmSync(c, { recursive: true, force: true });
  });

  it('passes issued revisions, one line each, exit 0', async () => {
    const audit = await run(['audit'], base);
    expect(audit.out).toMatch(new RegExp(`^PASS projects/${PROJECT} rev A, not signed\\nPASS projects/${PROJECT} rev B, signed for prepared by key signer \\([0-9a-f]{4} [0-9a-f]{4} [0-9a-f]{4} [0-9a-f]{4}\\)\\n$`));
    expect(audit.err).toBe('audit: 2 revisions checked, 0 failed\n');
    expect(audit.code).toBe(0);
    expect((await run(['audit', PROJECT, '--key', 'keys/signer.pub'], base)).out).toMatch(/PASS .* rev B, signed[^\n]*\n$/);
  });

  it('shows what changed from A to B in compare and in the revision history of the issued document of B', async () => {
    const nernst = (revision: string) => JSON.parse(readFileSync(issuedPath(base, revision, 'results.json'), 'utf8')).headline.meanNernst_V as number;
    const [before, after] = [nernst('A'), nernst('B')];
    expect(after).toBeGreaterThan(before); // a colder cell has the higher reversible voltage
    const change = `+${Number(((after - before) * 1000).toPrecision(2))} mV, +${Number((((after - before) / before) * 100).toPrecision(2))} %`;
    const table = await run(['compare', PROJECT, 'A', 'B'], base);
    expect(table.code).toBe(0);
    expect(table.out).toMatch(/^projects\/demo: revision A \(issued for review on 2026-11-30\) → revision B \(issued for approval on 2026-12-01\)\n/);
    expect(table.out).toMatch(/\noperating temperature +800 C \[A1\] +780 C \[A1\] +conditions\.operating-temperature\n/);
    expect(table.out).toMatch(new RegExp(`\\nmean Nernst voltage +${before.toFixed(4)} V +${after.toFixed(4)} V +${change.replace(/[+.]/g, '\\$&')}\\n`));
    const history = readFileSync(issuedPath(base, 'B', 'document.html'), 'utf8');
    const section = history.slice(history.indexOf('id="history"'));
    for (const text of ['operating temperature 800 C → 780 C', 'colder stack', 'first issue for the review meeting', '2026-12-01', 'issued for approval']) expect(section, text).toContain(text);
  });

  const cases: [label: string, from: () => string, revision: string, name: string][] = [
    ...ISSUED_FILE_NAMES.map((name) => ['signed revision B', () => base, 'B', name] as [string, () => string, string, string]),
    ['the only revision, unsigned', () => single, 'A', 'manifest.json'],
  ];
  for (const [label, from, revision, name] of cases) {
    it(`fails when one byte of ${name} of ${label} changes, naming ${name}`, { timeout: 180_000 }, async () => {
      const positions = name === 'manifest.json' ? Array.from({ length: 16 }, (_, i) => (i + 0.5) / 16) : [0.02, 0.5, 0.97];
      for (const at of positions) {
        const cwd = copy(from());
        flipByte(issuedPath(cwd, revision, name), at);
        const audit = await run(['audit', PROJECT], cwd);
        expect(audit.code, `${name} at ${at}`).toBe(1);
        const block = audit.out.slice(audit.out.indexOf(`FAIL projects/${PROJECT} rev ${revision}`));
        expect(block, `${name} at ${at}:\n${audit.out}`).toMatch(new RegExp(`^FAIL projects/${PROJECT} rev ${revision}[^:]*: .*${name.replace(/\./g, '\\.')}`));
        if (revision === 'B') expect(audit.out).toMatch(/^PASS projects\/demo rev A, not signed\n/);
        rmSync(cwd, { recursive: true, force: true });
      }
    });
  }

  it("fails revision A's link when A's manifest changes, naming it in B", async () => {
    const cwd = copy();
    flipByte(issuedPath(cwd, 'A', 'manifest.json'), 0.5);
    const audit = await run(['audit', PROJECT], cwd);
    expect(audit.out).toMatch(/^FAIL projects\/demo rev A[^:]*: .*manifest\.json/m);
    expect(audit.out).toMatch(/^FAIL projects\/demo rev B[^:]*: manifest\.json's link to revision A does not match that revision's manifest\.json/m);
  });

  it('fails a signature made with another key than the recorded one, and a key other than the required one', async () => {
    const cwd = copy();
    const other = newKeyPair();
    const bytes = readFileSync(issuedPath(cwd, 'B', 'manifest.json'));
    writeFileSync(issuedPath(cwd, 'B', 'manifest.prepared.sig'), signBytes(bytes, createPrivateKey(other.privatePem)));
    const audit = await run(['audit', PROJECT], cwd);
    expect(audit.code).toBe(1);
    expect(audit.out).toMatch(/^FAIL projects\/demo rev B, signed for prepared by key signer \([0-9a-f ]{19}\): manifest\.prepared\.sig does not verify over manifest\.json with the public key manifest\.json records for prepared\n {6}made with another key than [0-9a-f ]{19}/m);

    writeFileSync(join(base, 'other.pub'), other.publicPem);
    const required = await run(['audit', PROJECT, '--key', 'other.pub'], base);
    expect(required.code).toBe(1);
    expect(required.out).toMatch(/^FAIL projects\/demo rev A, not signed: not signed, but a signature by key [0-9a-f ]{19} is required/m);
    expect(required.out).toMatch(/^FAIL projects\/demo rev B, signed[^:]*: signed for prepared with key [0-9a-f ]{19}, not with the required key [0-9a-f ]{19}/m);
    rmSync(join(base, 'other.pub'));
  });

  it('checks what was issued, not what the library now calculates: changed species data fail no revision, and --recalculate shows the change', async () => {
    // The enthalpy constant b1 of H2O shifted by 1000 K (8.3 kJ/mol) in this process, as a
    // corrected data file would; the file itself, and so its hash, is unchanged.
    const water = getSpecies('H2O').record.intervals as NasaInterval[];
    const shift = (delta: number) => water.forEach((i) => (i.b1 += delta));
    shift(1000);
    try {
      const intact = await auditProject(base, PROJECT);
      expect(intact.lines.map((l) => [l.revision, l.problems])).toEqual([
        ['A', []],
        ['B', []],
      ]);
      const recalculated = await auditProject(base, PROJECT, { recalculate: true });
      for (const line of recalculated.lines) expect(line.problems.map((p) => p.reason).join('\n')).toMatch(/^results\.json differs from a recalculation of the issued basis in \d+ fields?$/);
    } finally {
      shift(-1000);
    }
    expect((await auditProject(base, PROJECT, { recalculate: true })).lines.flatMap((l) => l.problems)).toEqual([]);
  });

  it('reports each field where the issued results differ from a recalculation (--recalculate): path, issued and recomputed value', async () => {
    const cwd = copy();
    let recomputed = 0;
    replaceResults(cwd, 'A', (results) => {
      recomputed = results.headline.meanNernst_V;
      results.headline.meanNernst_V = recomputed * (1 + 1e-9);
      results.streams[0].temperature_K += 0.5;
    });
    expect((await run(['audit', PROJECT], cwd)).out).not.toMatch(/differs from a recalculation/);
    const audit = await run(['audit', PROJECT, '--recalculate'], cwd);
    expect(audit.out).toMatch(/^FAIL projects\/demo rev A, not signed: results\.json differs from a recalculation of the issued basis in 2 fields/m);
    expect(audit.out).toContain(`headline.meanNernst_V: issued ${recomputed * (1 + 1e-9)}, recomputed ${recomputed} (relative difference`);
    expect(audit.out).toMatch(/streams\[0\]\.temperature_K: issued [\d.]+, recomputed [\d.]+/);
  });

  it('lets a difference at rounding level pass (1e-14 relative)', async () => {
    const cwd = copy(single);
    replaceResults(cwd, 'A', (results) => {
      results.headline.meanNernst_V *= 1 + 1e-14;
    });
    const audit = await run(['audit', PROJECT, '--recalculate'], cwd);
    // Only the PDF's attached copy of results.json tells the two apart; the recalculation agrees.
    expect(audit.out).not.toMatch(/differs from a recalculation/);
    expect(audit.out).toMatch(/^FAIL projects\/demo rev A, not signed: document\.pdf: its attached results\.json differs from the issued results\.json/);
  });

  it('checks the chain: a missing earlier revision, a stale temporary folder, a stray entry', async () => {
    const cwd = copy();
    rmSync(issuedPath(cwd, 'A'), { recursive: true });
    mkdirSync(join(cwd, 'projects', PROJECT, 'issued', '.tmp-C-999999'));
    writeFileSync(join(cwd, 'projects', PROJECT, 'issued', 'notes.txt'), 'x');
    const audit = await run(['audit'], cwd);
    expect(audit.code).toBe(1);
    expect(audit.out).toMatch(/^FAIL projects\/demo rev B[^:]*: revision B does not follow the start/m);
    expect(audit.out).toMatch(/manifest\.json names previous revision A, which is not issued/);
    expect(audit.out).toMatch(/^FAIL projects\/demo issued\/notes\.txt: not a revision folder/m);
    expect(audit.out).toMatch(/^note: projects\/demo\/issued\/\.tmp-C-999999: left by an interrupted issue run, not a revision/m);
    expect(audit.err).toBe('audit: 1 revision checked, 2 failed\n');
  });

  /**
   * Rewrites the manifest of `revision` in a copy and signs it again with the keys given by role
   * (none: unsigned), then links the revision after it to the new manifest (signed again with its
   * own keys), as a forger with write access and keys of their own could.
   */
  function resign(cwd: string, revision: 'A' | 'B', keys: Partial<Record<'prepared', string>>, others: Partial<Record<'prepared', string>> = {}): void {
    const write = (rev: string, change: (m: IssueManifest) => IssueManifest, signers: Partial<Record<'prepared', string>>) => {
      const path = issuedPath(cwd, rev, 'manifest.json');
      const parsed = parseManifest(readFileSync(path));
      if (!parsed.ok) throw new Error(parsed.problems.join('\n'));
      const signatures = Object.entries(signers).map(([role, pem]) => ({ role: role as 'prepared', key: pem === signerPem() ? 'signer' : 'other', fingerprint: keyFingerprint(createPrivateKey(pem!)), publicKey: publicKeyPem(createPrivateKey(pem!)) }));
      const m = { ...change(parsed.manifest), signatures };
      const bytes = manifestBytes(m);
      writeFileSync(path, bytes);
      rmSync(issuedPath(cwd, rev, 'manifest.prepared.sig'), { force: true });
      for (const [role, pem] of Object.entries(signers)) writeFileSync(issuedPath(cwd, rev, `manifest.${role}.sig`), signBytes(bytes, createPrivateKey(pem!)));
      return bytes;
    };
    const bytes = write(revision, (m) => m, keys);
    if (revision === 'A') write('B', (m) => ({ ...m, previous: { revision: 'A', manifest_sha256: sha256Hex(bytes) } }), others);
  }
  const signerPem = () => readFileSync(join(base, 'keys', 'signer.key'), 'utf8');

  it('fails a later revision that loses the signature the one before it had', async () => {
    const cwd = copy();
    resign(cwd, 'A', { prepared: signerPem() }, {});
    const audit = await run(['audit', PROJECT], cwd);
    expect(audit.out).toMatch(/^PASS projects\/demo rev A, signed for prepared by key signer \([0-9a-f ]{19}\)\n/);
    expect(audit.out).toMatch(/^FAIL projects\/demo rev B, not signed: not signed, but revision A before it is \(prepared: key [0-9a-f ]{19}\): once a revision is signed, every later one is$/m);
    expect(audit.code).toBe(1);
  });

  it('fails a role signed with another key than before, unless the auditor trusts both keys', async () => {
    const cwd = copy();
    const other = newKeyPair();
    resign(cwd, 'A', { prepared: signerPem() }, { prepared: other.privatePem });
    const audit = await run(['audit', PROJECT], cwd);
    expect(audit.out).toMatch(/^FAIL projects\/demo rev B, signed for prepared by key other \([0-9a-f ]{19}\): signed for prepared with key [0-9a-f ]{19}, where revision A was signed for prepared with key [0-9a-f ]{19}: the key changed$/m);
    expect(audit.out).toContain('if the change is genuine, audit with --key for each key you trust');
    writeFileSync(join(cwd, 'other.pub'), other.publicPem);
    const trusted = await run(['audit', PROJECT, '--key', 'keys/signer.pub', '--key', 'other.pub'], cwd);
    expect(trusted.out).toMatch(/^PASS projects\/demo rev A, signed[^\n]*\nPASS projects\/demo rev B, signed for prepared by key other[^\n]*\n$/);
    expect(trusted.code).toBe(0);
  });

  it('checks each recorded fingerprint against the key recorded beside it', async () => {
    const cwd = copy();
    const path = issuedPath(cwd, 'B', 'manifest.json');
    const parsed = parseManifest(readFileSync(path));
    if (!parsed.ok) throw new Error('manifest');
    const m = { ...parsed.manifest, signatures: parsed.manifest.signatures.map((s) => ({ ...s, fingerprint: 'f'.repeat(64) })) };
    writeFileSync(path, manifestBytes(m));
    writeFileSync(issuedPath(cwd, 'B', 'manifest.prepared.sig'), signBytes(manifestBytes(m), createPrivateKey(signerPem())));
    const audit = await run(['audit', PROJECT], cwd);
    expect(audit.out).toMatch(/manifest\.json: the fingerprint recorded for prepared \(ffff ffff ffff ffff\) is not that of the key recorded beside it \([0-9a-f ]{19}\)/);
  });

  it('refuses a private key given where the auditor\'s public key is expected (exit 2), reading nothing of the archive', async () => {
    const r = await run(['audit', PROJECT, '--key', 'keys/signer.key'], base);
    expect(r).toMatchObject({ code: 2, out: '' });
    expect(r.err).toMatch(/^cellbasis: keys\/signer\.key: this is a private key, where a public key is expected/);
  });

  it('says when there is nothing to audit', async () => {
    const cwd = workspace();
    copies.push(cwd);
    expect(await run(['audit'], cwd)).toMatchObject({ code: 0, out: 'no issued revisions under projects/ here\n' });
    expect(await run(['audit', PROJECT], cwd)).toMatchObject({ code: 0, out: 'projects/demo: no issued revisions\n' });
    expect((await run(['audit', '../x'], cwd)).code).toBe(2);
  });
});

// Needs no Chromium: nothing is issued. A mistyped id must not pass as a clean audit of nothing
// (it did: "0 revisions checked", exit 0), so a script gating on the exit code would pass.
it('refuses an id that names no project: exit 2, the id named, nothing reported as checked', async () => {
  const cwd = workspace();
  try {
    const typo = await run(['audit', 'dmeo'], cwd);
    expect(typo).toEqual({ code: 2, out: '', err: 'cellbasis: audit: projects/dmeo: no such project (no folder projects/dmeo/ here)\n' });
    // The control: the project that does exist, with nothing issued, is audited (exit 0).
    expect(await run(['audit', PROJECT], cwd)).toMatchObject({ code: 0, out: 'projects/demo: no issued revisions\n' });
  } finally {
    removeWorkspace(cwd);
  }
});
