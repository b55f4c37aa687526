// An issue run killed at any moment (SIGKILL of the CLI process and the browser it started) leaves
// either the complete revision or none, never a partial one; the next issue cleans up after it.
import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { ISSUE_STEPS } from '../../lib/archive/issue.ts';
import { readIssuedFolder, LOCK_FILE } from '../../lib/archive/issued-folder.ts';
import { run } from '../helpers/run-cli.ts';
import { until } from '../helpers/child-process.ts';
import { announceChromiumSkip, describeWithChromium } from '../helpers/chromium.ts';
import { basisPath, PROJECT, removeWorkspace, issue, workspace } from '../helpers/archive-workspace.ts';

announceChromiumSkip('the interrupted-issue tests');

const BIN = fileURLToPath(new URL('../../bin/cellbasis.js', import.meta.url));

/** Starts `cellbasis issue` as its own process group (so the kill takes its Chromium too). */
function startIssue(cwd: string, revision: string, pauseAt?: string): { child: ChildProcess; stderr: () => string; exited: Promise<number | null> } {
  const env: NodeJS.ProcessEnv = { ...process.env };
  if (pauseAt) env.CELLBASIS_ISSUE_PAUSE = pauseAt;
  else delete env.CELLBASIS_ISSUE_PAUSE;
  const child = spawn(process.execPath, [BIN, 'issue', PROJECT, '--rev', revision, '--status', 'issued for review', '--date', '2026-11-30'], { cwd, env, detached: true, stdio: ['ignore', 'ignore', 'pipe'] });
  let stderr = '';
  child.stderr!.on('data', (chunk: Buffer) => (stderr += chunk.toString()));
  const exited = new Promise<number | null>((resolve) => child.on('exit', (code) => resolve(code)));
  return { child, stderr: () => stderr, exited };
}

/** Kills the issue run's process group; a run that has already ended with its group (ESRCH) is left to the caller's checks. */
async function kill(issuing: ReturnType<typeof startIssue>): Promise<void> {
  try {
    process.kill(-issuing.child.pid!, 'SIGKILL');
  } catch (error) {
    // The run finished before the kill: the "moments nobody chose" case allows it, and the
    // issue became fast enough (2 December) to finish within the 2.5 s delay.
    if ((error as NodeJS.ErrnoException).code !== 'ESRCH') throw error;
  }
  await issuing.exited;
}

function issuedEntries(cwd: string): string[] {
  const root = join(cwd, 'projects', PROJECT, 'issued');
  return existsSync(root) ? readdirSync(root).sort() : [];
}

describeWithChromium('interrupted issue run', () => {
  let cwd: string;
  let working: string;

  beforeAll(() => {
    cwd = workspace();
    working = readFileSync(basisPath(cwd), 'utf8');
  });

  afterAll(() => removeWorkspace(cwd));

  it('leaves no revision when killed at any step before the rename, and the next issue works', { timeout: 400_000 }, async () => {
    for (const step of ISSUE_STEPS.filter((s) => s !== 'renamed')) {
      const issuing = startIssue(cwd, 'A', step);
      await until(() => issuing.stderr().includes(`issue paused at ${step}`) || issuing.child.exitCode !== null, `the pause at ${step}`);
      expect(issuing.stderr(), step).toContain(`issue paused at ${step}`);
      await kill(issuing);
      const folder = readIssuedFolder(cwd, PROJECT);
      expect(folder.revisions, step).toEqual([]);
      expect(folder.other, step).toEqual([]);
      expect(issuedEntries(cwd).every((e) => e === LOCK_FILE || e.startsWith('.tmp-A-')), step).toBe(true);
      // The audit sees no revision, only what the killed issue run left.
      expect((await run(['audit', PROJECT], cwd)).out).toMatch(/^projects\/demo: no issued revisions\n|^note: /);
    }
    // Killed at moments nobody chose: as soon as the temporary folder appears, and a while later.
    for (const delay of [0, 2500]) {
      const issuing = startIssue(cwd, 'A');
      await until(() => issuedEntries(cwd).some((e) => e.startsWith(`.tmp-A-${issuing.child.pid}`)) || issuing.child.exitCode !== null, 'the temporary folder');
      await new Promise((r) => setTimeout(r, delay));
      await kill(issuing);
      const revisions = readIssuedFolder(cwd, PROJECT).revisions;
      // Either nothing, or (had it finished before the kill) the complete revision.
      if (revisions.length) expect((await run(['audit', PROJECT], cwd)).out).toBe('PASS projects/demo rev A, not signed\n');
      else expect(revisions).toEqual([]);
    }
    if (readIssuedFolder(cwd, PROJECT).revisions.length === 0) {
      const done = await issue(cwd, ['A', '--status', 'issued for review', '--date', '2026-11-30']);
      expect(done.code).toBe(0);
      expect(done.err).toMatch(/removed projects\/demo\/issued\/\.tmp-A-\d+, left by an interrupted issue run/);
    }
    expect(issuedEntries(cwd)).toEqual(['A']);
    expect((await run(['audit', PROJECT], cwd)).out).toBe('PASS projects/demo rev A, not signed\n');
    expect(readFileSync(basisPath(cwd), 'utf8')).toBe(working);
  });

  it('leaves the complete revision when killed after the rename, and the next issue takes over the lock', { timeout: 200_000 }, async () => {
    const issuing = startIssue(cwd, 'B', 'renamed');
    await until(() => issuing.stderr().includes('issue paused at renamed') || issuing.child.exitCode !== null, 'the pause after the rename');
    await kill(issuing);
    expect(issuedEntries(cwd)).toEqual([LOCK_FILE, 'A', 'B']);
    expect((await run(['audit', PROJECT], cwd)).out).toBe('PASS projects/demo rev A, not signed\nPASS projects/demo rev B, not signed\n');
    expect((await issue(cwd, ['C', '--status', 'issued for review', '--date', '2026-11-30'])).code).toBe(0);
    expect(issuedEntries(cwd)).toEqual(['A', 'B', 'C']);
    expect((await run(['audit', PROJECT], cwd)).code).toBe(0);
    expect(readFileSync(basisPath(cwd), 'utf8')).toBe(working);
  });
});
