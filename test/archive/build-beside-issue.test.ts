// A site build running beside an ordinary issue run on the same projects folder (issue 15 item 3):
// two child processes started together, in whatever order the machine runs them. Whatever the
// interleaving, both succeed; the site is complete and consistent with one state of the archive
// (revision B shown with its issued files, the draft then the draft of C; or B not yet shown, its
// issue run at most named in a warning, the draft the draft of B); and revision B is intact (the
// audit passes), with nothing of the issue run left behind. No sleep decides anything: the test
// checks what must hold for every interleaving.
import { existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { temporaryNote } from '../../lib/archive/issued-folder.ts';
import { cellbasis, expectCompleteSite } from '../helpers/child-process.ts';
import { announceChromiumSkip, describeWithChromium } from '../helpers/chromium.ts';
import { basisPath, ISSUE_TIMEOUT, issue, issuedPath, PROJECT, removeWorkspace, workspace } from '../helpers/archive-workspace.ts';

announceChromiumSkip('the build beside an issue run');

describeWithChromium('a build beside an issue run', () => {
  let cwd: string;
  beforeAll(async () => {
    cwd = workspace();
    const a = await issue(cwd, ['A', '--status', 'issued for review', '--date', '2026-11-30']);
    expect(a.err).toBe('');
    expect(a.code).toBe(0);
    writeFileSync(basisPath(cwd), readFileSync(basisPath(cwd), 'utf8').replace('  title: 250 kW', '  title: 260 kW'));
  }, ISSUE_TIMEOUT);
  afterAll(() => removeWorkspace(cwd));

  it('both succeed, the site is complete and shows one state of the archive, and revision B is intact', { timeout: ISSUE_TIMEOUT }, async () => {
    const [built, issued] = await Promise.all([
      cellbasis(['build', '--quiet'], cwd),
      cellbasis(['issue', PROJECT, '--rev', 'B', '--status', 'issued for review', '--date', '2026-12-01'], cwd),
    ]);
    expect(issued.err).toBe('');
    expect(issued.code).toBe(0);
    expect(built.code, built.err).toBe(0);
    // At most the note that B was being issued while the build read the archive (running still, or ended since).
    for (const line of built.err.split('\n').filter(Boolean)) {
      expect(line).toMatch(/projects\/demo\/issued\/\.tmp-B-\d+: revision B (is being issued now \(process \d+\); not a revision until that run ends|was being issued while the archive was read \(process \d+, ended since\); not shown here: read it again to see it)$/);
    }

    const site = join(cwd, 'site');
    const shown = existsSync(join(site, 'projects', PROJECT, 'rev-B'));
    const revisions = shown ? ['A', 'B'] : ['A'];
    // The register pages complete; each issued document (self-contained) and PDF as issued.
    expectCompleteSite(
      site,
      [PROJECT],
      revisions.map((r) => `projects/${PROJECT}/rev-${r}/index.html`),
    );
    for (const r of revisions) {
      for (const name of ['document.html', 'document.pdf']) {
        expect(readFileSync(join(site, 'projects', PROJECT, `rev-${r}`, name)).equals(readFileSync(issuedPath(cwd, r, name))), `rev-${r}/${name}`).toBe(true);
      }
    }
    const draft = readFileSync(join(site, 'projects', PROJECT, 'index.html'), 'utf8');
    expect(draft).toContain(shown ? 'Draft of revision C; revision B issued for review on 2026-12-01' : 'Draft of revision B; revision A issued for review on 2026-11-30');

    // Revision B whole, nothing of the run left, and the archive passes its audit.
    expect(readdirSync(join(cwd, 'projects', PROJECT, 'issued')).sort()).toEqual(['A', 'B']);
    const audit = await cellbasis(['audit', PROJECT], cwd);
    expect(audit.out).toBe(`PASS projects/${PROJECT} rev A, not signed\nPASS projects/${PROJECT} rev B, not signed\n`);
    expect(audit.code).toBe(0);
  });
});

describe('temporaryNote', () => {
  it('words an issue run\'s temporary folder by what it is when read: running, ended since it was listed (renamed into place), or left by a killed run', () => {
    const root = mkdtempSync(join(tmpdir(), 'cellbasis-temporary-'));
    try {
      const issued = join(root, 'projects', PROJECT, 'issued');
      // A process id no process has: above the kernel's largest (pid_max is at most 2^22).
      const gone = 2 ** 22 + 1;
      mkdirSync(join(issued, `.tmp-C-${gone}`), { recursive: true });
      expect(temporaryNote(root, PROJECT, `.tmp-C-${gone}`)).toBe(
        `projects/${PROJECT}/issued/.tmp-C-${gone}: left by an interrupted issue run, not a revision; the next cellbasis issue of this project removes it`,
      );
      expect(temporaryNote(root, PROJECT, `.tmp-B-${gone}`)).toBe(
        `projects/${PROJECT}/issued/.tmp-B-${gone}: revision B was being issued while the archive was read (process ${gone}, ended since); not shown here: read it again to see it`,
      );
      // The parent of this test process runs.
      expect(temporaryNote(root, PROJECT, `.tmp-B-${process.ppid}`)).toBe(
        `projects/${PROJECT}/issued/.tmp-B-${process.ppid}: revision B is being issued now (process ${process.ppid}); not a revision until that run ends`,
      );
    } finally {
      rmSync(root, { recursive: true, force: true });
    }
  });
});
