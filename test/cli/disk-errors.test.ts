// The command-line part of the bad-input corpus, class "disk" (issue 15 item 8): what the file
// system refuses (a path through a file, a full disk, standard output on a full device) is the
// user's to put right: one line naming the path, what could not be done and what to do, exit 1,
// never "internal error" and never a stack trace, and nothing half-written left behind.
import { closeSync, existsSync, mkdirSync, mkdtempSync, openSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { spawnSync } from 'node:child_process';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { run } from '../helpers/run-cli.ts';
import { projectsRoot, scaffoldText } from '../helpers/scaffold-basis.ts';
import { PACKAGE_ROOT } from '../../lib/publish/paths.ts';

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
afterAll(() => {
  if (mounted) spawnSync('umount', [small]);
  rmSync(small, { recursive: true, force: true });
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
