// The real binary, node bin/cellbasis.js, as a child process: the exit codes README.md documents
// (0 success, 1 validation failure, 2 usage error, 3 internal error) end to end, the corpus
// cases marked "process" giving the same stderr as in process, never a stack trace, and a
// reader that closes the pipe early ending the command quietly. exit-codes.test.ts has the
// same codes in process, for every kind of command.
import { spawn } from 'node:child_process';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { projectsRoot, scaffoldText } from '../helpers/scaffold-basis.ts';
import { corpusCases, expectOutcome, placeCase } from '../basis/bad-input.ts';

const BIN = fileURLToPath(new URL('../../bin/cellbasis.js', import.meta.url));
const FAILING_STDOUT = fileURLToPath(new URL('../helpers/fixtures/failing-stdout.mjs', import.meta.url));

interface Ran {
  code: number;
  out: string;
  err: string;
}

/** Runs the binary to its end; `closeStdout` closes our end of its stdout at once, as `| head -c0` would. */
function cellbasis(argv: string[], cwd: string, options: { env?: Record<string, string>; nodeArgs?: string[]; closeStdout?: boolean } = {}): Promise<Ran> {
  return new Promise((resolve, reject) => {
    const env = { ...process.env, ...options.env };
    delete env.CELLBASIS_DEBUG;
    Object.assign(env, options.env);
    const child = spawn(process.execPath, [...(options.nodeArgs ?? []), BIN, ...argv], { cwd, env, stdio: ['ignore', 'pipe', 'pipe'] });
    let out = '';
    let err = '';
    if (options.closeStdout) child.stdout.destroy();
    else child.stdout.on('data', (d: Buffer) => (out += d.toString()));
    child.stderr.on('data', (d: Buffer) => (err += d.toString()));
    child.on('error', reject);
    child.on('close', (code) => resolve({ code: code ?? -1, out, err }));
  });
}

function workspace(): string {
  return projectsRoot('process', { good: scaffoldText('solid-oxide', 'power', 'good') });
}

// Each child costs seconds of start-up (tsx), so only a handful run: exit 0 and 1 come from the
// corpus cases marked "process"; 2, 3 and the closed pipe have their own.
describe.concurrent('exit codes of node bin/cellbasis.js (README.md, "Exit codes")', () => {
  it('2: a usage error (an unknown option) is one line, without a stack trace', async () => {
    const r = await cellbasis(['check', '--colour'], workspace());
    expect(r).toMatchObject({ code: 2, out: '', err: "cellbasis: check: unknown option '--colour' (see cellbasis check --help)\n" });
  });

  it('3: an internal error (standard output failing, provoked from outside by a preloaded module) is one line without a stack trace', async () => {
    const r = await cellbasis(['check', 'good'], workspace(), { nodeArgs: ['--import', FAILING_STDOUT] });
    expect(r.err).toBe('cellbasis: internal error: simulated failure: standard output refused the write\n');
    expect(r.code).toBe(3);
  });

  it('a reader that closes the pipe early ends the command quietly, without EPIPE or a stack trace', async () => {
    const r = await cellbasis(['species', '--list'], workspace(), { closeStdout: true });
    expect(r.err).toBe('');
    expect(r.code).toBe(0);
  });
});

describe.concurrent('corpus cases as child processes', () => {
  const cases = corpusCases().filter((c) => c.process);
  it('a handful are marked to run as processes, exit 0 and 1 among them', () => {
    expect(cases.length).toBeGreaterThanOrEqual(5);
    const exits = cases.flatMap((c) => c.process!.map((command) => c.commands[command]!.exit));
    expect(new Set(exits)).toEqual(new Set([0, 1]));
  });
  for (const c of cases) {
    for (const command of c.process!) {
      it(`${c.name} (${command})`, async () => {
        const root = mkdtempSync(join(tmpdir(), 'cellbasis-corpus-process-'));
        placeCase(c, root);
        expectOutcome(`${c.name} (${command}, child process)`, await cellbasis([command, c.name], root), c.commands[command]!);
      });
    }
  }
});
