// A seal killed at any moment (SIGKILL of the CLI process and the browser it started) leaves
// either the complete revision or none, never a partial one; the next seal cleans up after it.
import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { SEAL_STEPS } from '../../lib/archive/seal.ts';
import { readSealedFolder, LOCK_FILE } from '../../lib/archive/sealed-folder.ts';
import { run } from '../helpers/run-cli.ts';
import { until } from '../helpers/child-process.ts';
import { announceChromiumSkip, describeWithChromium } from '../helpers/chromium.ts';
import { basisPath, PROJECT, removeWorkspace, seal, workspace } from '../helpers/archive-workspace.ts';

announceChromiumSkip('the interrupted-seal tests');

const BIN = fileURLToPath(new URL('../../bin/cellbasis.js', import.meta.url));

/** Starts `cellbasis seal` as its own process group (so the kill takes its Chromium too). */
function startSeal(cwd: string, revision: string, pauseAt?: string): { child: ChildProcess; stderr: () => string; exited: Promise<number | null> } {
  const env: NodeJS.ProcessEnv = { ...process.env };
  if (pauseAt) env.CELLBASIS_SEAL_PAUSE = pauseAt;
  else delete env.CELLBASIS_SEAL_PAUSE;
  const child = spawn(process.execPath, [BIN, 'seal', PROJECT, '--rev', revision, '--status', 'issued for review', '--date', '2026-11-30'], { cwd, env, detached: true, stdio: ['ignore', 'ignore', 'pipe'] });
  let stderr = '';
  child.stderr!.on('data', (chunk: Buffer) => (stderr += chunk.toString()));
  const exited = new Promise<number | null>((resolve) => child.on('exit', (code) => resolve(code)));
  return { child, stderr: () => stderr, exited };
}

/** Kills the seal's process group; a seal that has already ended with its group (ESRCH) is left to the caller's checks. */
async function kill(seal: ReturnType<typeof startSeal>): Promise<void> {
  try {
    process.kill(-seal.child.pid!, 'SIGKILL');
  } catch (error) {
    // The seal finished before the kill: the "moments nobody chose" case allows it, and the
    // seal became fast enough (2 December) to finish within the 2.5 s delay.
    if ((error as NodeJS.ErrnoException).code !== 'ESRCH') throw error;
  }
  await seal.exited;
}

function sealedEntries(cwd: string): string[] {
  const root = join(cwd, 'projects', PROJECT, 'sealed');
  return existsSync(root) ? readdirSync(root).sort() : [];
}

describeWithChromium('interrupted seal', () => {
  let cwd: string;
  let working: string;

  beforeAll(() => {
    cwd = workspace();
    working = readFileSync(basisPath(cwd), 'utf8');
  });

  afterAll(() => removeWorkspace(cwd));

  it('leaves no revision when killed at any step before the rename, and the next seal works', { timeout: 400_000 }, async () => {
    for (const step of SEAL_STEPS.filter((s) => s !== 'renamed')) {
      const sealing = startSeal(cwd, 'A', step);
      await until(() => sealing.stderr().includes(`seal paused at ${step}`) || sealing.child.exitCode !== null, `the pause at ${step}`);
      expect(sealing.stderr(), step).toContain(`seal paused at ${step}`);
      await kill(sealing);
      const folder = readSealedFolder(cwd, PROJECT);
      expect(folder.revisions, step).toEqual([]);
      expect(folder.other, step).toEqual([]);
      expect(sealedEntries(cwd).every((e) => e === LOCK_FILE || e.startsWith('.tmp-A-')), step).toBe(true);
      // The audit sees no revision, only what the killed seal left.
      expect((await run(['audit', PROJECT], cwd)).out).toMatch(/^projects\/demo: no sealed revisions\n|^note: /);
    }
    // Killed at moments nobody chose: as soon as the temporary folder appears, and a while later.
    for (const delay of [0, 2500]) {
      const sealing = startSeal(cwd, 'A');
      await until(() => sealedEntries(cwd).some((e) => e.startsWith(`.tmp-A-${sealing.child.pid}`)) || sealing.child.exitCode !== null, 'the temporary folder');
      await new Promise((r) => setTimeout(r, delay));
      await kill(sealing);
      const revisions = readSealedFolder(cwd, PROJECT).revisions;
      // Either nothing, or (had it finished before the kill) the complete revision.
      if (revisions.length) expect((await run(['audit', PROJECT], cwd)).out).toBe('PASS projects/demo rev A\n');
      else expect(revisions).toEqual([]);
    }
    if (readSealedFolder(cwd, PROJECT).revisions.length === 0) {
      const done = await seal(cwd, ['A', '--status', 'issued for review', '--date', '2026-11-30']);
      expect(done.code).toBe(0);
      expect(done.err).toMatch(/removed projects\/demo\/sealed\/\.tmp-A-\d+, left by an interrupted seal/);
    }
    expect(sealedEntries(cwd)).toEqual(['A']);
    expect((await run(['audit', PROJECT], cwd)).out).toBe('PASS projects/demo rev A\n');
    expect(readFileSync(basisPath(cwd), 'utf8')).toBe(working);
  });

  it('leaves the complete revision when killed after the rename, and the next seal takes over the lock', { timeout: 200_000 }, async () => {
    const sealing = startSeal(cwd, 'B', 'renamed');
    await until(() => sealing.stderr().includes('seal paused at renamed') || sealing.child.exitCode !== null, 'the pause after the rename');
    await kill(sealing);
    expect(sealedEntries(cwd)).toEqual([LOCK_FILE, 'A', 'B']);
    expect((await run(['audit', PROJECT], cwd)).out).toBe('PASS projects/demo rev A\nPASS projects/demo rev B\n');
    expect((await seal(cwd, ['C', '--status', 'issued for review', '--date', '2026-11-30'])).code).toBe(0);
    expect(sealedEntries(cwd)).toEqual(['A', 'B', 'C']);
    expect((await run(['audit', PROJECT], cwd)).code).toBe(0);
    expect(readFileSync(basisPath(cwd), 'utf8')).toBe(working);
  });
});
