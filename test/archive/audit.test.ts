// Audit: a sealed revision passes; any changed byte of any sealed file fails naming that file;
// signatures by another key fail; a recalculation that differs is reported field by field; the
// chain of revisions is checked.
import { cpSync, mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { createPrivateKey } from 'node:crypto';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { run } from '../helpers/run-cli.ts';
import { manifestBytes, parseManifest } from '../../lib/archive/manifest.ts';
import { sha256Hex } from '../../lib/archive/hash.ts';
import { newKeyPair, signBytes } from '../../lib/archive/signature.ts';
import { announceChromiumSkip, describeWithChromium } from '../helpers/chromium.ts';
import { SEAL_TIMEOUT, basisPath, flipByte, PROJECT, removeWorkspace, seal, sealedPath, workspace } from '../helpers/archive-workspace.ts';

announceChromiumSkip('the audit tests');

const SEALED_FILE_NAMES = ['basis.yaml', 'results.json', 'document.html', 'document.pdf', 'manifest.json', 'manifest.sig'];

/** Rewrites results.json of a revision and its hash in manifest.json, as if it had been sealed so. */
function replaceResults(cwd: string, revision: string, change: (results: any) => void): void {
  const resultsPath = sealedPath(cwd, revision, 'results.json');
  const results = JSON.parse(readFileSync(resultsPath, 'utf8'));
  change(results);
  const bytes = Buffer.from(`${JSON.stringify(results, null, 2)}\n`);
  writeFileSync(resultsPath, bytes);
  const manifestPath = sealedPath(cwd, revision, 'manifest.json');
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

  /** A copy of a sealed workspace to damage. */
  function copy(from = base): string {
    const cwd = mkdtempSync(join(tmpdir(), 'cellbasis-audit-'));
    cpSync(from, cwd, { recursive: true });
    copies.push(cwd);
    return cwd;
  }

  beforeAll(async () => {
    single = workspace();
    expect((await seal(single, ['A', '--status', 'issued for review', '--date', '2026-11-30', '--note', 'issued for the kick-off'])).code).toBe(0);
    base = workspace();
    expect((await run(['keygen', 'signer'], base)).code).toBe(0);
    expect((await seal(base, ['A', '--status', 'issued for review', '--date', '2026-11-30', '--note', 'first issue for the review meeting'])).code).toBe(0);
    const text = readFileSync(basisPath(base), 'utf8').replace('value: "800 C", source: A1', 'value: "780 C", source: A1');
    writeFileSync(basisPath(base), text);
    expect((await seal(base, ['B', '--status', 'issued for approval', '--date', '2026-12-01', '--key', 'signer.key', '--note', 'colder stack'])).code).toBe(0);
  }, SEAL_TIMEOUT);

  afterAll(() => {
    removeWorkspace(base);
    removeWorkspace(single);
    for (const c of copies) rmSync(c, { recursive: true, force: true });
  });

  it('passes sealed revisions, one line each, exit 0', async () => {
    const audit = await run(['audit'], base);
    expect(audit.out).toBe(`PASS projects/${PROJECT} rev A\nPASS projects/${PROJECT} rev B\n`);
    expect(audit.err).toBe('audit: 2 revisions checked, 0 failed\n');
    expect(audit.code).toBe(0);
    expect((await run(['audit', PROJECT, '--key', 'signer.pub'], base)).out).toMatch(/PASS .* rev B\n$/);
  });

  it('shows what changed from A to B in compare and in the revision history of the sealed document of B', async () => {
    const nernst = (revision: string) => JSON.parse(readFileSync(sealedPath(base, revision, 'results.json'), 'utf8')).headline.meanNernst_V as number;
    const [before, after] = [nernst('A'), nernst('B')];
    expect(after).toBeGreaterThan(before); // a colder cell has the higher reversible voltage
    const change = `+${Number(((after - before) * 1000).toPrecision(2))} mV, +${Number((((after - before) / before) * 100).toPrecision(2))} %`;
    const table = await run(['compare', PROJECT, 'A', 'B'], base);
    expect(table.code).toBe(0);
    expect(table.out).toMatch(/^projects\/demo: revision A \(issued for review, sealed 2026-11-30\) → revision B \(issued for approval, sealed 2026-12-01\)\n/);
    expect(table.out).toMatch(/\noperating temperature +800 C \[A1\] +780 C \[A1\] +conditions\.operating-temperature\n/);
    expect(table.out).toMatch(new RegExp(`\\nmean Nernst voltage +${before.toFixed(4)} V +${after.toFixed(4)} V +${change.replace(/[+.]/g, '\\$&')}\\n`));
    const history = readFileSync(sealedPath(base, 'B', 'document.html'), 'utf8');
    const section = history.slice(history.indexOf('id="history"'));
    for (const text of ['operating temperature 800 C → 780 C', 'colder stack', 'first issue for the review meeting', '2026-12-01', 'issued for approval']) expect(section, text).toContain(text);
  });

  const cases: [label: string, from: () => string, revision: string, name: string][] = [
    ...SEALED_FILE_NAMES.map((name) => ['signed revision B', () => base, 'B', name] as [string, () => string, string, string]),
    ['the only revision, unsigned', () => single, 'A', 'manifest.json'],
  ];
  for (const [label, from, revision, name] of cases) {
    it(`fails when one byte of ${name} of ${label} changes, naming ${name}`, { timeout: 180_000 }, async () => {
      const positions = name === 'manifest.json' ? Array.from({ length: 16 }, (_, i) => (i + 0.5) / 16) : [0.02, 0.5, 0.97];
      for (const at of positions) {
        const cwd = copy(from());
        flipByte(sealedPath(cwd, revision, name), at);
        const audit = await run(['audit', PROJECT], cwd);
        expect(audit.code, `${name} at ${at}`).toBe(1);
        const block = audit.out.slice(audit.out.indexOf(`FAIL projects/${PROJECT} rev ${revision}:`));
        expect(block, `${name} at ${at}:\n${audit.out}`).toMatch(new RegExp(`^FAIL projects/${PROJECT} rev ${revision}: .*${name.replace('.', '\\.')}`));
        if (revision === 'B') expect(audit.out).toMatch(/^PASS projects\/demo rev A\n/);
        rmSync(cwd, { recursive: true, force: true });
      }
    });
  }

  it("fails revision A's link when A's manifest changes, naming it in B", async () => {
    const cwd = copy();
    flipByte(sealedPath(cwd, 'A', 'manifest.json'), 0.5);
    const audit = await run(['audit', PROJECT], cwd);
    expect(audit.out).toMatch(/^FAIL projects\/demo rev A: .*manifest\.json/m);
    expect(audit.out).toMatch(/^FAIL projects\/demo rev B: manifest\.json's link to revision A does not match that revision's manifest\.json/m);
  });

  it('fails a signature made with another key than the recorded one, and a key other than the required one', async () => {
    const cwd = copy();
    const other = newKeyPair();
    const bytes = readFileSync(sealedPath(cwd, 'B', 'manifest.json'));
    writeFileSync(sealedPath(cwd, 'B', 'manifest.sig'), signBytes(bytes, createPrivateKey(other.privatePem)));
    const audit = await run(['audit', PROJECT], cwd);
    expect(audit.code).toBe(1);
    expect(audit.out).toMatch(/^FAIL projects\/demo rev B: manifest\.sig does not verify over manifest\.json with the public key manifest\.json records\n {6}made with another key than [0-9a-f]{16}/m);

    writeFileSync(join(base, 'other.pub'), other.publicPem);
    const required = await run(['audit', PROJECT, '--key', 'other.pub'], base);
    expect(required.code).toBe(1);
    expect(required.out).toMatch(/^FAIL projects\/demo rev A: not signed, but a signature by key [0-9a-f]{16} is required/m);
    expect(required.out).toMatch(/^FAIL projects\/demo rev B: signed with key [0-9a-f]{16}, not with the required key [0-9a-f]{16}/m);
    rmSync(join(base, 'other.pub'));
  });

  it('reports each field where the sealed results differ from a recalculation: path, sealed and recomputed value', async () => {
    const cwd = copy();
    let recomputed = 0;
    replaceResults(cwd, 'A', (results) => {
      recomputed = results.headline.meanNernst_V;
      results.headline.meanNernst_V = recomputed * (1 + 1e-9);
      results.streams[0].temperature_K += 0.5;
    });
    const audit = await run(['audit', PROJECT], cwd);
    expect(audit.out).toMatch(/^FAIL projects\/demo rev A: results\.json differs from a recalculation of the sealed basis in 2 fields/m);
    expect(audit.out).toContain(`headline.meanNernst_V: sealed ${recomputed * (1 + 1e-9)}, recomputed ${recomputed} (relative difference`);
    expect(audit.out).toMatch(/streams\[0\]\.temperature_K: sealed [\d.]+, recomputed [\d.]+/);
  });

  it('lets a difference at rounding level pass (1e-14 relative)', async () => {
    const cwd = copy(single);
    replaceResults(cwd, 'A', (results) => {
      results.headline.meanNernst_V *= 1 + 1e-14;
    });
    const audit = await run(['audit', PROJECT], cwd);
    // Only the PDF's attached copy of results.json tells the two apart; the recalculation agrees.
    expect(audit.out).not.toMatch(/differs from a recalculation/);
    expect(audit.out).toMatch(/^FAIL projects\/demo rev A: document\.pdf: its attached results\.json differs from the sealed results\.json/);
  });

  it('checks the chain: a missing earlier revision, a stale temporary folder, a stray entry', async () => {
    const cwd = copy();
    rmSync(sealedPath(cwd, 'A'), { recursive: true });
    mkdirSync(join(cwd, 'projects', PROJECT, 'sealed', '.tmp-C-999999'));
    writeFileSync(join(cwd, 'projects', PROJECT, 'sealed', 'notes.txt'), 'x');
    const audit = await run(['audit'], cwd);
    expect(audit.code).toBe(1);
    expect(audit.out).toMatch(/^FAIL projects\/demo rev B: revision B does not follow the start/m);
    expect(audit.out).toMatch(/manifest\.json names previous revision A, which is not sealed/);
    expect(audit.out).toMatch(/^FAIL projects\/demo sealed\/notes\.txt: not a revision folder/m);
    expect(audit.out).toMatch(/^note: projects\/demo\/sealed\/\.tmp-C-999999: left by an interrupted seal/m);
    expect(audit.err).toBe('audit: 1 revision checked, 2 failed\n');
  });

  it('says when there is nothing to audit', async () => {
    const cwd = workspace();
    copies.push(cwd);
    expect(await run(['audit'], cwd)).toMatchObject({ code: 0, out: 'no sealed revisions under projects/ here\n' });
    expect(await run(['audit', PROJECT], cwd)).toMatchObject({ code: 0, out: 'projects/demo: no sealed revisions\n' });
    expect((await run(['audit', '../x'], cwd)).code).toBe(2);
  });
});

// Needs no Chromium: nothing is sealed. A mistyped id must not pass as a clean audit of nothing
// (it did: "0 revisions checked", exit 0), so a script gating on the exit code would pass.
it('refuses an id that names no project: exit 2, the id named, nothing reported as checked', async () => {
  const cwd = workspace();
  try {
    const typo = await run(['audit', 'dmeo'], cwd);
    expect(typo).toEqual({ code: 2, out: '', err: 'cellbasis: audit: projects/dmeo: no such project (no folder projects/dmeo/ here)\n' });
    // The control: the project that does exist, with nothing sealed, is audited (exit 0).
    expect(await run(['audit', PROJECT], cwd)).toMatchObject({ code: 0, out: 'projects/demo: no sealed revisions\n' });
  } finally {
    removeWorkspace(cwd);
  }
});
