// cellbasis new, check and schema, run in-process with a captured Io in temporary folders.
import { mkdirSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { main } from '../../lib/cli/main.ts';
import type { Io } from '../../lib/cli/command.ts';
import { scaffoldKinds } from '../../lib/basis/scaffolds.ts';
import { SCHEMA_FILE } from '../../lib/basis/json-schema.ts';

async function run(argv: string[], cwd: string): Promise<{ code: number; out: string; err: string }> {
  let out = '';
  let err = '';
  const io: Io = { out: (t) => (out += t), err: (t) => (err += t), isTTY: false, cwd };
  const code = await main(argv, io);
  return { code, out, err };
}

const temp = () => mkdtempSync(join(tmpdir(), 'cellbasis-cli-'));

describe('cellbasis new', () => {
  it('writes a valid starting basis for every technology and mode', async () => {
    const cwd = temp();
    for (const { technology, mode } of scaffoldKinds()) {
      const id = `${technology}-${mode}`;
      const r = await run(['new', id, '--technology', technology, '--mode', mode], cwd);
      expect(r.code, id).toBe(0);
      expect(r.out).toBe(`wrote projects/${id}/basis.yaml (${technology}, ${mode}): replace its invented values with your project's, then run cellbasis check ${id}\n`);
      expect(readFileSync(join(cwd, 'projects', id, 'basis.yaml'), 'utf8')).toContain(`number: DB-${id}-001`);
    }
    const check = await run(['check'], cwd);
    expect(check.err).toBe('');
    expect(check.code).toBe(0);
    expect(check.out.match(/: valid\n/g)).toHaveLength(scaffoldKinds().length);
  });

  it('defaults to power mode, and reads phosphoric-acid as ht-pem', async () => {
    const cwd = temp();
    expect((await run(['new', 'a', '--technology', 'solid-oxide'], cwd)).out).toMatch(/\(solid-oxide, power\)/);
    expect((await run(['new', 'b', '--technology', 'phosphoric-acid'], cwd)).out).toMatch(/\(ht-pem, power\)/);
  });

  it('refuses to overwrite: exit 2, the existing file byte-identical', async () => {
    const cwd = temp();
    mkdirSync(join(cwd, 'projects', 'mine'), { recursive: true });
    const path = join(cwd, 'projects', 'mine', 'basis.yaml');
    const before = Buffer.from('# my own basis, hands off\ndocument: {}\n\u00e9\n');
    writeFileSync(path, before);
    const r = await run(['new', 'mine', '--technology', 'pem', '--mode', 'electrolysis'], cwd);
    expect(r.code).toBe(2);
    expect(r.err).toBe('cellbasis: new: projects/mine/basis.yaml already exists; nothing written (edit it, or choose another id)\n');
    expect(readFileSync(path).equals(before)).toBe(true);
  });

  it('refuses a mode the technology does not have, an unknown technology and a bad id, writing nothing', async () => {
    const cwd = temp();
    const cases: [string[], string][] = [
      [['new', 'x', '--technology', 'ht-pem', '--mode', 'electrolysis'], 'cellbasis: new: ht-pem cells run in "power" mode only, not electrolysis\n'],
      [['new', 'x', '--technology', 'molten-carbonate', '--mode', 'electrolysis'], 'cellbasis: new: molten-carbonate cells run in "power" mode only, not electrolysis\n'],
      [['new', 'x', '--technology', 'sofc'], 'cellbasis: new: unknown technology "sofc"; technologies: solid-oxide, proton-ceramic, pem, ht-pem, alkaline, molten-carbonate, phosphoric-acid\n'],
      [['new', 'x', '--technology', 'solid-oxid'], 'cellbasis: new: unknown technology "solid-oxid"; did you mean "solid-oxide"?; technologies: solid-oxide, proton-ceramic, pem, ht-pem, alkaline, molten-carbonate, phosphoric-acid\n'],
      [['new', 'x', '--technology', 'pem', '--mode', 'both'], 'cellbasis: new: --mode must be power or electrolysis, got "both"\n'],
      [['new', 'x'], 'cellbasis: new: --technology is required (see cellbasis new --help)\n'],
      [['new', 'a..b', '--technology', 'pem'], 'cellbasis: project id "a..b" may not contain ".."\n'],
    ];
    for (const [argv, message] of cases) {
      const r = await run(argv, cwd);
      expect(r.code, argv.join(' ')).toBe(2);
      expect(r.err, argv.join(' ')).toBe(message);
    }
    expect(await run(['check'], cwd)).toMatchObject({ code: 2, err: 'cellbasis: check: no design bases under projects/ here; create one with cellbasis new ID --technology TECH\n' });
  });
});

describe('cellbasis check', () => {
  it('prints a summary with the headline voltages of each valid basis; exit 0', async () => {
    const cwd = temp();
    await run(['new', 'chp', '--technology', 'solid-oxide'], cwd);
    const r = await run(['check', 'chp'], cwd);
    expect(r.code).toBe(0);
    expect(r.err).toBe('');
    expect(r.out).toMatch(/^projects\/chp\/basis\.yaml: valid\n/);
    expect(r.out).toMatch(/technology +solid oxide \(oxide-ion conducting\), power mode\n/);
    expect(r.out).toMatch(/operating temperature +1073\.15 K \(800 °C\)\n/);
    expect(r.out).toMatch(/open assumptions +1 of 2\n/);
    // E° = 0.98 V at 800 °C for H2 + ½ O2 → H2O(g) (Larminie & Dicks, Fuel Cell Systems Explained, 2nd ed., Table 2.2, read in a reproduction of its p. 33 at scribd.com/document/389709165)
    const e = Number(/standard reversible voltage +([\d.]+) V/.exec(r.out)![1]);
    expect(e).toBeCloseTo(0.98, 2);
    expect(r.out).toMatch(/standard thermoneutral voltage +1\.28\d+ V\n/);
  });

  it('liquid water for the cells that run with it: E° = 1.229 V at 25 °C (the O2/H2O standard potential of the CRC Handbook table, read in a reproduction, reference check EC-01)', async () => {
    const cwd = temp();
    await run(['new', 'el', '--technology', 'pem', '--mode', 'electrolysis'], cwd);
    const path = join(cwd, 'projects', 'el', 'basis.yaml');
    writeFileSync(path, readFileSync(path, 'utf8').replace('operating-temperature: "60 C"', 'operating-temperature: "25 C"').replace('air-inlet-temperature: "55 C"', 'air-inlet-temperature: "25 C"'));
    const r = await run(['check', 'projects/el/basis.yaml'], cwd);
    expect(r.code).toBe(0);
    expect(Number(/standard reversible voltage +([\d.]+) V \(H2 \+ 0\.5 O2 -> H2O\(L\)/.exec(r.out)![1])).toBeCloseTo(1.229, 3);
    expect(Number(/standard thermoneutral voltage +([\d.]+) V/.exec(r.out)![1])).toBeCloseTo(1.481, 3);
  });

  it('reports errors as file:line:col: path: message on stderr; exit 1; other bases still checked', async () => {
    const cwd = temp();
    await run(['new', 'good', '--technology', 'pem'], cwd);
    await run(['new', 'bad', '--technology', 'pem'], cwd);
    const path = join(cwd, 'projects', 'bad', 'basis.yaml');
    const text = readFileSync(path, 'utf8').replace('fuel-utilization: 0.90', 'fuel-utilization: 1.2');
    writeFileSync(path, text);
    const line = text.split('\n').findIndex((l) => l.includes('fuel-utilization: 1.2')) + 1;
    const r = await run(['check'], cwd);
    expect(r.code).toBe(1);
    expect(r.err).toBe(
      `projects/bad/basis.yaml:${line}:21: operating-point.fuel-utilization: the fuel utilization lies strictly between 0 and 1, got 1.2\nprojects/bad/basis.yaml: 1 error\n`,
    );
    expect(r.out).toMatch(/^projects\/good\/basis\.yaml: valid\n/);
    // Several bases named on the command line: each checked, in the order given.
    const named = await run(['check', 'bad', 'projects/good/basis.yaml'], cwd);
    expect(named.code).toBe(1);
    expect(named.err).toBe(r.err);
    expect(named.out).toMatch(/^projects\/good\/basis\.yaml: valid\n/);
  });

  it('warnings are printed but do not fail; a missing project is a usage error (exit 2)', async () => {
    const cwd = temp();
    await run(['new', 'hot', '--technology', 'solid-oxide'], cwd);
    const path = join(cwd, 'projects', 'hot', 'basis.yaml');
    writeFileSync(path, readFileSync(path, 'utf8').replace('temperature-sweep: { from: "650 C", to: "950 C" }', 'temperature-sweep: { from: "650 C", to: "1150 C" }').replace('{ value: "800 C", source: A1 }', '{ value: "1050 C", source: A1 }').replace('cell-voltage: "0.80 V"', 'cell-voltage: "0.70 V"')); // at 1050 °C the outlet Nernst voltage is 0.75 V
    const r = await run(['check', 'hot'], cwd);
    expect(r.code).toBe(0);
    expect(r.err).toMatch(/^projects\/hot\/basis\.yaml:\d+:\d+: warning: conditions\.operating-temperature\.value: 1050 C is outside the typical range of solid-oxide cells/);
    expect(r.out).toMatch(/^projects\/hot\/basis\.yaml: valid \(1 warning\)\n/);
    const missing = await run(['check', 'nothing-here'], cwd);
    expect(missing).toMatchObject({ code: 2, err: 'cellbasis: check: projects/nothing-here/basis.yaml: cannot read the design basis: it does not exist\n' });
  });
});

describe('cellbasis schema', () => {
  it(`prints the JSON Schema, the same as ${SCHEMA_FILE}`, async () => {
    const r = await run(['schema'], temp());
    expect(r.code).toBe(0);
    expect(r.out).toBe(readFileSync(new URL(`../../${SCHEMA_FILE}`, import.meta.url), 'utf8'));
    expect(JSON.parse(r.out).$schema).toBe('http://json-schema.org/draft-07/schema#');
  });
});
