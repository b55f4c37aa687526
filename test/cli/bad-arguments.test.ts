// The command-line part of the bad-input corpus: arguments that parse but mean nothing, refused
// with one line and exit 2 before anything runs. Each class holds for every command, taken from
// the command table, so that a new command or option is covered without a line here:
//   repeated    an option given twice (parseArgs would keep the last and drop the other silently)
//   empty       an empty or blank argument or option value (`keygen ""` wrote ".key" and ".pub")
//   feed        a species given twice in a feed, under one name or two (they were summed)
import { mkdtempSync, readdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { COMMANDS } from '../../lib/cli/main.ts';
import { run } from '../helpers/run-cli.ts';

/** A value each string option accepts as far as the parser is concerned. */
const SAMPLE = 'x';

function emptyFolder(): string {
  return mkdtempSync(join(tmpdir(), 'cellbasis-arguments-'));
}

describe('bad arguments', () => {
  const options = COMMANDS.flatMap((c) => c.options.filter((o) => !o.multiple).map((o) => [c.name, o.name, o.type] as const));

  it.each(options)('repeated: %s --%s given twice is refused, and nothing is written', async (command, option, type) => {
    const root = emptyFolder();
    const once = type === 'string' ? [`--${option}`, SAMPLE] : [`--${option}`];
    const r = await run([command, ...once, ...once], root);
    expect(r).toEqual({ code: 2, out: '', err: `cellbasis: ${command}: --${option} is given twice; give it once (see cellbasis ${command} --help)\n` });
    expect(readdirSync(root)).toEqual([]);
  });

  it('repeated: the joined form counts too (--temperature=300K --temperature=400K)', async () => {
    const r = await run(['species', 'H2', '--temperature=300K', '--temperature=400K']);
    expect(r).toEqual({ code: 2, out: '', err: 'cellbasis: species: --temperature is given twice; give it once (see cellbasis species --help)\n' });
  });

  const takingArguments = COMMANDS.filter((c) => c.positionals[1] > 0).map((c) => c.name);

  it.each(takingArguments.flatMap((name) => [[name, ''], [name, '  ']] as const))('empty: %s %j is refused, and nothing is written', async (command, argument) => {
    const root = emptyFolder();
    const r = await run([command, argument], root);
    const what = argument === '' ? 'empty' : 'only spaces';
    expect(r).toEqual({ code: 2, out: '', err: `cellbasis: ${command}: an argument is ${what}; give a project id, a file or a name (see cellbasis ${command} --help)\n` });
    expect(readdirSync(root)).toEqual([]);
  });

  const stringOptions = COMMANDS.flatMap((c) => c.options.filter((o) => o.type === 'string').map((o) => [c.name, o.name] as const));

  it.each(stringOptions)('empty: %s --%s "" is refused', async (command, option) => {
    const root = emptyFolder();
    const r = await run([command, `--${option}`, ''], root);
    expect(r).toEqual({ code: 2, out: '', err: `cellbasis: ${command}: --${option} is given an empty value; give it a value (see cellbasis ${command} --help)\n` });
    expect(readdirSync(root)).toEqual([]);
  });

  it.each([
    ['equilibrium', 'feed', 'CH4=1, H2O=2, CH4=3', 'CH4 is given twice'],
    ['equilibrium', 'feed', 'CH4=1, H2O(g)=2, H2O=1', 'H2O is the same species as H2O(g), already given'],
    ['equilibrium', 'feed', 'CH2O=1, HCHO=1', 'HCHO is the same species as CH2O, already given'],
    ['steam-limit', 'fuel', 'CH4=0.5, CH4=0.5', 'CH4 is given twice'],
  ])('feed: %s --%s "%s" is refused (the amounts were summed)', async (command, option, feed, says) => {
    const rest = ['--temperature', '800C', '--pressure', '1bar'];
    const r = await run([command, `--${option}`, feed, ...rest]);
    expect(r).toEqual({ code: 2, out: '', err: `cellbasis: --${option}: ${says}; give each species once\n` });
  });
});

describe('invisible characters in arguments', () => {
  it('a message repeating an argument shows each invisible or reordering character escaped', async () => {
    const r = await run(['check', 'good\u200b\u202e'], mkdtempSync(join(tmpdir(), 'cellbasis-arguments-')));
    expect(r.code).toBe(2);
    expect(r.err).toBe('cellbasis: check: project id "good\\u200B\\u202E" must be 1 to 64 characters of a-z, 0-9, ".", "_" and "-", starting with a letter or digit\n');
  });
});
