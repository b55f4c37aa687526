// The command-line part of the bad-input corpus, class "disk" (issue 15 item 8): what the file
// system refuses (a path through a file, a full disk, standard output on a full device) is the
// user's to put right: one line naming the path, what could not be done and what to do, exit 1,
// never "internal error" and never a stack trace, and nothing half-written left behind.
import { closeSync, existsSync, mkdirSync, mkdtempSync, openSync, readdirSync, readFileSync, rmSync, statfsSync, writeFileSync } from 'node:fs';
import { spawnSync } from 'node:child_process';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { run } from '../helpers/run-cli.ts';
import { projectsRoot, scaffoldText } from '../helpers/scaffold-basis.ts';
import { PACKAGE_ROOT } from '../../lib/publish/paths.ts';
import { CHROMIUM } from '../helpers/chromium.ts';
import { treeDigest } from '../helpers/tree-digest.ts';

const CLI = join(PACKAGE_ROOT, 'bin', 'cellbasis.js');

describe('file-system errors are the user\'s, in one line', () => {
  it('build --out through a file: exit 1, the path and what is wrong', async () => {
    const root = projectsRoot('disk-errors', { good: scaffoldText('pem', 'power', 'good') });
    writeFileSync(join(root, 'notes'), 'mine\n');
    const r = await run(['build', '--out', 'notes/site', '--html-only', '--quiet'], root);
    expect(r).toEqual({ code: 1, out: '', err: 'cellbasis: notes/site: cannot reach: a part of the path is not a folder\n' });
  });

  it('new with projects/ a file: exit 1, the path and what is wrong', async () => {
    const root = projectsRoot('disk-errors', {});
    rmSync(join(root, 'projects'), { recursive: true, force: true });
    writeFileSync(join(root, 'projects'), 'not a folder\n');
    const r = await run(['new', 'plant-1', '--technology', 'pem'], root);
    expect(r.code).toBe(1);
    expect(r.err).toMatch(/^cellbasis: projects(\/plant-1)?: cannot [a-z ]+: (a part of the path is not a folder|something of that name exists already)\n$/);
  });

  it('standard output on a full device (/dev/full): exit 1 and one line on stderr', () => {
    const full = openSync('/dev/full', 'w');
    try {
      const r = spawnSync(process.execPath, [CLI, 'schema'], { stdio: ['ignore', full, 'pipe'], encoding: 'utf8' });
      expect(r.stderr).toBe('cellbasis: standard output: cannot write: no space is left on the device: free some space and run again\n');
      expect(r.status).toBe(1);
    } finally {
      closeSync(full);
    }
  }, 60_000);
});

// A full disk needs a small file system of its own: a 300 KiB tmpfs, which only a user allowed to
// mount (root, CAP_SYS_ADMIN) can make. Elsewhere this case is skipped, for that reason.
const small = mkdtempSync(join(tmpdir(), 'cellbasis-full-'));
const mounted = spawnSync('mount', ['-t', 'tmpfs', '-o', 'size=300k', 'tmpfs', small], { stdio: 'ignore' }).status === 0;
// Issuing needs room for one revision (a document of some MB) before the disk is filled: a tmpfs of 64 MiB.
const roomy = mkdtempSync(join(tmpdir(), 'cellbasis-full-'));
const roomyMounted = mounted && spawnSync('mount', ['-t', 'tmpfs', '-o', 'size=64m', 'tmpfs', roomy], { stdio: 'ignore' }).status === 0;
afterAll(() => {
  if (mounted) spawnSync('umount', [small]);
  if (roomyMounted) spawnSync('umount', [roomy]);
  rmSync(small, { recursive: true, force: true });
  rmSync(roomy, { recursive: true, force: true });
});

describe.runIf(mounted)('a full disk (a 300 KiB tmpfs; skipped where this user may not mount one)', () => {
  it('build: exit 1, one line naming the site folder, and nothing left in the full folder', () => {
    const root = projectsRoot('disk-errors', { good: scaffoldText('pem', 'power', 'good') });
    mkdirSync(join(small, 'keep'));
    writeFileSync(join(small, 'keep', 'notes.txt'), 'precious\n');
    const r = spawnSync(process.execPath, [CLI, 'build', '--out', join(small, 'site'), '--html-only', '--quiet'], { cwd: root, encoding: 'utf8' });
    expect(r.stderr).toBe(`cellbasis: ${join(small, 'site')}: the site could not be written: no space is left on the device: free some space and run again; ${join(small, 'site')} was left as it was\n`);
    expect(r.status).toBe(1);
    expect(readdirSync(small)).toEqual(['keep']);
    expect(existsSync(join(small, 'keep', 'notes.txt'))).toBe(true);
  }, 120_000);
});

// Issuing prints the PDF with Chromium: run where it is, and always under CI.
describe.runIf(roomyMounted && (CHROMIUM !== null || process.env.CI))('issuing onto a full disk (a 64 MiB tmpfs filled after revision A; skipped where this user may not mount one or there is no Chromium outside CI)', () => {
  it('issue: exit 1, one line naming the path, nothing partial left in issued/, revision A untouched', async () => {
    const cwd = join(roomy, 'work');
    const basis = join(cwd, 'projects', 'demo', 'basis.yaml');
    mkdirSync(join(cwd, 'projects', 'demo'), { recursive: true });
    writeFileSync(basis, scaffoldText('solid-oxide', 'power', 'demo'));
    const a = await run(['issue', 'demo', '--rev', 'A', '--status', 'issued for review', '--date', '2026-11-30'], cwd);
    expect(a.err).toBe('');
    expect(a.code).toBe(0);
    const issued = join(cwd, 'projects', 'demo', 'issued');
    const before = treeDigest(issued);
    writeFileSync(basis, readFileSync(basis, 'utf8').replace('  title: 250 kW', '  title: 260 kW'));
    // Fill the disk to 256 KiB short of full: less than any revision's document needs.
    const fs = statfsSync(roomy);
    writeFileSync(join(roomy, 'filler'), Buffer.alloc(fs.bavail * fs.bsize - 256 * 1024));
    const b = await run(['issue', 'demo', '--rev', 'B', '--status', 'issued for review', '--date', '2026-12-01'], cwd);
    expect(b.code).toBe(1);
    expect(b.out).toBe('');
    expect(b.err).toMatch(/^cellbasis: projects\/demo\/issued\/\.tmp-B-\d+: cannot write the revision, and nothing was issued: no space is left on the device: free some space and run again\n$/);
    expect(b.err).not.toMatch(/internal error|\n\s+at /);
    // Nothing of B: no revision folder, no temporary folder, no lock; A byte for byte as it was.
    expect(readdirSync(issued)).toEqual(['A']);
    expect(treeDigest(issued)).toEqual(before);
    expect((await run(['audit', 'demo'], cwd)).code).toBe(0);
  }, 300_000);
});
