// The reaction and species commands: JSON keys and values, readable output, exit codes and
// one-line messages for user mistakes (no stack traces).
import { execFileSync, spawnSync } from 'node:child_process';
import { describe, expect, it } from 'vitest';
import { run } from '../helpers/run-cli.ts';
import { COMMANDS } from '../../lib/cli/main.ts';

describe('cellbasis reaction', () => {
  it('--json prints exactly one object with the documented SI keys', async () => {
    const r = await run(['reaction', 'H2 + 0.5 O2 -> H2O', '--temperature', '1000K', '--json']);
    expect(r.code).toBe(0);
    const o = JSON.parse(r.out);
    expect(Object.keys(o).sort()).toEqual(
      [
        'reaction',
        'electrons',
        'temperature_K',
        'deltaH_J_per_mol',
        'deltaS_J_per_mol_K',
        'deltaG_J_per_mol',
        'equilibriumConstant',
        'log10EquilibriumConstant',
        'reversibleVoltage_V',
        'thermoneutralVoltage_V',
        'direction',
      ].sort(),
    );
    expect(o.reversibleVoltage_V).toBeCloseTo(0.998, 3);
    expect(o.direction).toBe('galvanic');
  });

  it('accepts every temperature spelling of the issue: 1000K, 1000 K, 726.85C, 726.85 °C, 1340.33F', async () => {
    for (const t of ['1000K', '1000 K', '726.85C', '726.85 °C', '1340.33F']) {
      const o = JSON.parse((await run(['reaction', 'H2 + 0.5 O2 -> H2O', '--temperature', t, '--json'])).out);
      expect(o.temperature_K, t).toBeCloseTo(1000, 2);
    }
  });

  it('prints a readable table without --json', async () => {
    const r = await run(['reaction', 'CH4 + 2 O2 -> CO2 + 2 H2O', '--temperature', '25 C']);
    expect(r.out).toMatch(/electrons n\s+8/);
    expect(r.out).toMatch(/ΔG°\s+-801(\.\d+)? kJ\/mol/);
  });

  it('user mistakes: one line on stderr, exit code 2, no stack trace', async () => {
    const cases: [string[], RegExp][] = [
      [['reaction', 'H2 + 0.5 O2 -> H2X', '--temperature', '1000K'], /unknown species "H2X"; did you mean/],
      [['reaction', 'H2 + O2 -> H2O', '--temperature', '1000K'], /not balanced: O/],
      [['reaction', 'H2 + 0.5 O2 -> H2O', '--temperature', 'hot'], /--temperature: expected a temperature/],
      [['reaction', 'H2 + 0.5 O2 -> H2O', '--temperature', '3 bar'], /which is a pressure/],
      [['reaction', 'H2 + 0.5 O2 -> H2O(L)', '--temperature', '1000K'], /H2O\(L\).*outside the range.*273\.15 K to 600 K/],
      [['reaction', 'H2 + 0.5 O2 -> H2O'], /--temperature is required/],
      [['reaction', 'H2 + 0.5 O2 -> H2O', '--temperature', '1000K', '--frobnicate'], /unknown option '--frobnicate'/],
      [['species', 'H2O', '--temperature=-300 C'], /absolute zero/],
      [['species', 'H2O', '--temperature', '-300 C'], /--temperature: a value that starts with "-" must be joined to the option/],
      [['species', 'Methane', '--temperature', '300 K'], /unknown species "Methane"/],
    ];
    for (const [argv, pattern] of cases) {
      const r = await run(argv);
      expect(r.code, argv.join(' ')).toBe(2);
      expect(r.err, argv.join(' ')).toMatch(pattern);
      expect(r.err.trim().split('\n'), argv.join(' ')).toHaveLength(1);
      expect(r.err).not.toMatch(/\n\s+at /);
    }
  });
});

describe('cellbasis species', () => {
  it('--json gives cp, h, s, g with units in the keys (H2O at 1000 K: cp 41.27 J/(mol K), JANAF)', async () => {
    const o = JSON.parse((await run(['species', 'H2O', '--temperature', '1000 K', '--json'])).out);
    expect(o.species).toBe('H2O');
    expect(o.cp_J_per_mol_K).toBeCloseTo(41.27, 1);
    expect(o.g_J_per_mol).toBeCloseTo(o.h_J_per_mol - 1000 * o.s_J_per_mol_K, 6);
  });

  it('--list names every species', async () => {
    const r = await run(['species', '--list']);
    expect(r.out).toMatch(/C\(gr\)/);
    expect(r.out).toMatch(/H2O\(L\)\s+H2O\(L\)\s+condensed/);
  });
});

describe('the installed bin', () => {
  it('npx cellbasis runs the TypeScript entry point and sets the exit code', () => {
    const out = execFileSync('node', ['bin/cellbasis.js', 'reaction', 'H2 + 0.5 O2 -> H2O', '--temperature', '1000K', '--json'], { encoding: 'utf8' });
    expect(JSON.parse(out).reversibleVoltage_V).toBeCloseTo(0.998, 3);
    const bad = spawnSync('node', ['bin/cellbasis.js', 'species', 'Xx', '--temperature', '300K'], { encoding: 'utf8' });
    expect(bad.status).toBe(2);
    expect(bad.stderr).toMatch(/^cellbasis: unknown species "Xx"/);
  });

  it('--help lists every command, and each command explains its options', async () => {
    const r = await run(['--help']);
    expect(r.out).toMatch(/reaction/);
    expect(r.out).toMatch(/species/);
    const h = await run(['reaction', '--help']);
    expect(h.out).toMatch(/--temperature T/);
    expect(h.out).toMatch(/--electrons N/);
    expect(h.out).toMatch(/--json/);
  });

  it.each(COMMANDS.map((c) => [c.name, c] as const))('cellbasis %s --help: exit 0, its usage and every option with its explanation', async (name, command) => {
    const overview = await run(['--help']);
    expect(overview.out).toMatch(new RegExp(`^  ${name} +\\S`, 'm'));
    const h = await run([name, '--help']);
    expect(h.code).toBe(0);
    expect(h.out).toContain(`usage: cellbasis ${command.usage}`);
    for (const option of command.options) {
      expect(option.description.length, option.name).toBeGreaterThan(10);
      const line = h.out.split('\n').find((l) => l.trimStart().startsWith(`--${option.name}`));
      expect(line, `--${option.name}`).toBeDefined();
      expect(line!, `--${option.name}`).toContain(option.description);
    }
  });
});
