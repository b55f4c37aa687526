// The exit codes of README.md ("Exit codes"), in process through main(argv, io): 0 success,
// 1 validation failure, 2 usage error, 3 internal error; every failure one message on stderr
// and never a stack trace unless CELLBASIS_DEBUG is set.
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { main } from '../../lib/cli/main.ts';
import type { Io } from '../../lib/cli/command.ts';
import { projectsRoot, scaffoldText } from '../helpers/scaffold-basis.ts';
import { EXIT_INTERNAL, EXIT_OK, EXIT_USAGE, EXIT_VALIDATION } from '../../lib/core/errors.ts';
import { run } from '../helpers/run-cli.ts';

function workspace(): string {
  const good = scaffoldText('solid-oxide', 'power', 'good');
  return projectsRoot('exit', { good, bad: good.replace('fuel-utilization: 0.80', 'fuel-utilization: 1.2') });
}

/** An Io whose standard output fails with a plain Error, as a full disk or a bug would. */
function failingIo(cwd: string): { io: Io; err: () => string } {
  let err = '';
  const io: Io = {
    out: () => {
      throw new Error('simulated failure: standard output refused the write');
    },
    err: (t) => (err += t),
    isTTY: false,
    cwd,
  };
  return { io, err: () => err };
}

afterEach(() => {
  delete process.env.CELLBASIS_DEBUG;
});

describe('exit codes', () => {
  it('the codes are 0, 1, 2 and 3 (lib/core/errors.ts, as README.md documents them)', () => {
    expect([EXIT_OK, EXIT_VALIDATION, EXIT_USAGE, EXIT_INTERNAL]).toEqual([0, 1, 2, 3]);
  });

  it('0: check, calc and hazards of a valid basis; --help and --version', async () => {
    const root = workspace();
    for (const argv of [['check', 'good'], ['calc', 'good'], ['hazards', 'good'], ['--help'], ['--version'], ['calc', '--help']]) {
      const r = await run(argv, root);
      expect(r.code, argv.join(' ')).toBe(0);
      expect(r.out.length, argv.join(' ')).toBeGreaterThan(0);
    }
  });

  it('1: a basis with an error, for check, calc and hazards', async () => {
    const root = workspace();
    for (const command of ['check', 'calc', 'hazards']) {
      const r = await run([command, 'bad'], root);
      expect(r.err, command).toMatch(/projects\/bad\/basis\.yaml:\d+:21: operating-point\.fuel-utilization: the fuel utilization lies strictly between 0 and 1, got 1\.2\n/);
      expect(r.code, command).toBe(1);
    }
  });

  it('2: usage errors: no command, an unknown command, an unknown option, a missing value, too many arguments, an unparsable value, no such project', async () => {
    const root = workspace();
    const cases: [string[], RegExp][] = [
      [[], /^$/],
      [['frobnicate'], /^cellbasis: unknown command "frobnicate"; commands: /],
      [['calc', 'good', '--colour'], /^cellbasis: calc: unknown option '--colour' \(see cellbasis calc --help\)\n$/],
      [['species', 'H2', '--temperature'], /^cellbasis: species: Option '--temperature <value>' argument missing \(see cellbasis species --help\)\n$/],
      [['calc', 'good', 'bad'], /^cellbasis: calc: usage: cellbasis calc ID\|FILE \[--section NAME\]\.\.\. \[--csv \| --json\] \(see cellbasis calc --help\)\n$/],
      [['species', 'H2', '--temperature', 'warm'], /^cellbasis: .*"warm"/],
      [['calc', 'nothing-here'], /^cellbasis: projects\/nothing-here\/basis\.yaml: cannot read the design basis: it does not exist\n$/],
    ];
    for (const [argv, err] of cases) {
      const r = await run(argv, root);
      expect(r.err, argv.join(' ')).toMatch(err);
      expect(r.err, argv.join(' ')).not.toMatch(/\n\s+at /);
      expect(r.code, argv.join(' ')).toBe(2);
    }
  });

  it('3: an error that is not the user\'s (standard output failing) is one line naming it an internal error, in every kind of command', async () => {
    const root = workspace();
    for (const argv of [['--help'], ['--version'], ['check', 'good'], ['calc', 'good', '--json'], ['schema'], ['calc', '--help']]) {
      const { io, err } = failingIo(root);
      const code = await main(argv, io);
      expect(err(), argv.join(' ')).toBe('cellbasis: internal error: simulated failure: standard output refused the write\n');
      expect(code, argv.join(' ')).toBe(3);
    }
  });

  it('3 with CELLBASIS_DEBUG=1: the stack trace follows the message (for bug reports)', async () => {
    process.env.CELLBASIS_DEBUG = '1';
    const { io, err } = failingIo(workspace());
    expect(await main(['schema'], io)).toBe(3);
    expect(err()).toMatch(/^cellbasis: internal error: simulated failure: standard output refused the write\nError: simulated failure: standard output refused the write\n\s+at /);
  });
});
