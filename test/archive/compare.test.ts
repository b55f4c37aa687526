// compareRevisions: the change summary of two revisions, checked against two independent runs of
// calculate() on the bases it compares; and `cellbasis compare` between an issued revision and the
// working draft.
import { readFileSync, writeFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parse } from 'csv-parse/sync';
import { run } from '../helpers/run-cli.ts';
import { announceChromiumSkip, describeWithChromium } from '../helpers/chromium.ts';
import { ISSUE_TIMEOUT, basisPath, issue, issuedPath, PROJECT, removeWorkspace, workspace } from '../helpers/archive-workspace.ts';
import { renderScaffold } from '../../lib/basis/scaffolds.ts';
import { loadBasisText } from '../../lib/basis/load.ts';
import { calculate } from '../../lib/plant/calculate.ts';
import type { Results } from '../../lib/plant/results-schema.ts';
import type { DesignBasis } from '../../lib/basis/types.ts';
import { compareRevisions, type RevisionSide } from '../../lib/archive/compare.ts';
import { edit } from '../helpers/basis-text.ts';

const BASE = renderScaffold('solid-oxide', 'power', 'demo', '2026-11-30');

function side(text: string, revision = 'A'): Omit<RevisionSide, 'results' | 'basis'> & { basis: DesignBasis; results: Results } {
  const loaded = loadBasisText(text, 'projects/demo/basis.yaml', 'demo', { formerRevisionKeys: true });
  if (!loaded.ok) throw new Error(loaded.errors.map((e) => e.message).join('\n'));
  return { revision, basis: loaded.basis, results: calculate(loaded.basis), source: text };
}

describe('compareRevisions', () => {
  const colder = edit(BASE, ['value: "800 C", source: A1', 'value: "780 C", source: A1']);

  it('reports a changed operating temperature as written and the change in Nernst voltage it causes', () => {
    const a = side(BASE);
    const b = side(colder);
    const changes = compareRevisions(a, b);
    expect(changes.inputs).toEqual([
      expect.objectContaining({ path: 'conditions.operating-temperature', kind: 'changed', sameValue: false, text: 'operating temperature 800 C → 780 C' }),
    ]);
    expect(changes.inputs[0]!.old).toMatchObject({ text: '800 C', si: 1073.15, siUnit: 'K' });
    expect(changes.inputs[0]!.new).toMatchObject({ text: '780 C', si: 1053.15 });
    expect(changes.fields).toEqual([]);

    // Two independent calculations give the numbers the comparison must report.
    const before = calculate(side(BASE).basis).headline.meanNernst_V;
    const after = calculate(side(colder).basis).headline.meanNernst_V;
    const nernst = changes.results.find((r) => r.key === 'meanNernst_V')!;
    expect(nernst.old).toBe(before);
    expect(nernst.new).toBe(after);
    expect(nernst.delta).toBeCloseTo(after - before, 15);
    expect(nernst.relative).toBeCloseTo((after - before) / before, 15);
    const mV = ((after - before) * 1000).toPrecision(2);
    const pct = (((after - before) / before) * 100).toPrecision(2);
    expect(nernst.text).toBe(`mean Nernst voltage ${before.toFixed(4)} V → ${after.toFixed(4)} V (+${Number(mV)} mV, +${Number(pct)} %)`);
    // A colder SOFC on the same gas has the higher Nernst voltage (ΔS of H2 oxidation < 0).
    expect(after).toBeGreaterThan(before);
    expect(changes.summary[0]).toBe('operating temperature 800 C → 780 C');
    expect(changes.unchanged).toBe(false);
  });

  it('finds no change between a revision and itself, and ignores the revision and status a revision of format 1 wrote in its basis', () => {
    const former = edit(BASE, ['  client:', '  revision: B\n  status: approved\n  client:']);
    const changes = compareRevisions({ ...side(BASE), status: 'issued for review' }, { ...side(former, 'B'), status: 'approved' });
    expect(changes.summary).toEqual([]);
    expect(changes.unchanged).toBe(true);
    expect(changes.from).toEqual({ revision: 'A', status: 'issued for review' });
    expect(changes.to).toEqual({ revision: 'B', status: 'approved' });
  });

  it('reports assumptions, open flags, references, sources and other fields', () => {
    const changed = edit(
      BASE,
      ['open: true, reference: R1 }', 'open: false, reference: R1 }'],
      ['  title: 250 kW', '  title: 260 kW'],
      ['    # checked: { name: ..., date: ... }', '    checked: { name: B. Checker, date: 2026-12-01 }'],
      ['value: "800 C", source: A1', 'value: "1073.15 K", source: R1'],
      ['  - { id: R1, citation:', '  - { id: R2, citation: "Stack supplier datasheet (invented)" }\n  - { id: R1, citation:'],
      ['  - { id: A1, text: The stack runs isothermal at the operating temperature., open: false }\n', ''],
    );
    const withA3 = changed.replace('\nreferences:', '  - { id: A3, text: Pressure drop is neglected., open: true }\n\nreferences:');
    const changes = compareRevisions(side(BASE), side(withA3));
    expect(changes.inputs.map((c) => c.text)).toEqual(['operating temperature 800 C → 1073.15 K (same value); source A1 → R1']);
    expect(changes.fields.map((c) => c.text)).toEqual([
      'document.title: 250 kW solid oxide CHP module, stack design basis → 260 kW solid oxide CHP module, stack design basis',
      'document.sign-off.checked added: {"name":"B. Checker","date":"2026-12-01"}',
    ]);
    expect(changes.assumptions.map((c) => c.text)).toEqual([
      'assumption A1 removed: The stack runs isothermal at the operating temperature.',
      'assumption A2 closed (no longer open)',
      'assumption A3 added (open): Pressure drop is neglected.',
    ]);
    expect(changes.references.map((c) => c.text)).toEqual(['reference R2 added: Stack supplier datasheet (invented)']);
    expect(changes.results).toEqual([]);
  });

  it('compares the data of the bases when their texts are not given', () => {
    const { source: _a, ...a } = side(BASE);
    const { source: _b, ...b } = side(edit(BASE, ['  title: 250 kW', '  title: 260 kW']));
    expect(compareRevisions(a, b).fields.map((c) => c.path)).toEqual(['document.title']);
  });

  it('compares the YAML of a revision whose basis today\'s loader does not read, and says what it could not compare one by one', () => {
    // As a revision issued by an earlier version would be after a key was renamed: no validated
    // basis, only its text (lib/archive/issued-revision.ts). The temperature change and the new
    // reference then appear as changes of YAML fields, the inputs and references lists are empty.
    const changed = edit(BASE, ['value: "800 C", source: A1', 'value: "780 C", source: A1']);
    const a = { ...side(BASE), basis: null, basisProblem: 'projects/demo/issued/A/basis.yaml:12:3: conditions.stack-temp: unknown field' };
    const b = side(changed, 'B');
    const changes = compareRevisions(a, b);
    expect(changes.inputs).toEqual([]);
    expect(changes.assumptions).toEqual([]);
    expect(changes.references).toEqual([]);
    expect(changes.fields.map((f) => f.text)).toEqual(['conditions.operating-temperature.value: 800 C → 780 C']);
    expect(changes.notCompared).toEqual([
      'design inputs, assumptions and references one by one: the basis of revision A does not load with this version of cellbasis (projects/demo/issued/A/basis.yaml:12:3: conditions.stack-temp: unknown field); they are compared as fields of its YAML',
    ]);
    expect(changes.summary).toContain('conditions.operating-temperature.value: 800 C → 780 C');
    expect(changes.unchanged).toBe(false);
    // The results are still compared: both sides carry them.
    expect(changes.results.map((r) => r.key)).toContain('meanNernst_V');
    // The same text on both sides: no field changes, only the note.
    const same = compareRevisions(a, { ...side(BASE, 'B') });
    expect(same.fields).toEqual([]);
    expect(same.unchanged).toBe(true);
  });

  it('reports added, removed and changed cases and the envelope values they move', () => {
    const cases = (turndown: string, extra = '') =>
      `${BASE}\ncases:\n  rated: { title: Rated, purpose: Sizing., sizing: true }\n  turndown:\n    title: Turndown\n    purpose: The least fuel flow.\n    overrides:\n      operating-point:\n        current-density: "${turndown}"\n${extra}`;
    const hot = '  hot:\n    title: Hot\n    purpose: The hottest stack.\n    overrides:\n      conditions:\n        operating-temperature: "820 C"\n';
    const a = side(cases('0.10 A/cm2', hot));
    const b = side(cases('0.12 A/cm2'));
    const changes = compareRevisions(a, b);
    // The sizing case is the same: its numbers and the top-level results do not change.
    expect(changes.results).toEqual([]);
    expect(changes.cases.map((c) => [c.id, c.kind])).toEqual([
      ['turndown', 'changed'],
      ['hot', 'removed'],
    ]);
    // Two independent calculations: the turndown case's cell voltage before and after.
    const before = a.results.cases.find((c) => c.id === 'turndown')!.headline!.cellVoltage_V;
    const after = b.results.cases.find((c) => c.id === 'turndown')!.headline!.cellVoltage_V;
    const voltage = changes.cases[0]!.results.find((r) => r.key === 'cellVoltage_V')!;
    expect(voltage.old).toBe(before);
    expect(voltage.new).toBe(after);
    // More current through the same resistance: a lower voltage (power mode).
    expect(after).toBeLessThan(before);
    expect(changes.cases[0]!.text).toMatch(/^case turndown: .*cell voltage /);
    expect(changes.cases[1]!.text).toBe('case hot removed: Hot');
    // The least fuel flow is the turndown case's in both, and it grew with its current density.
    const least = changes.envelope.find((e) => e.id === 'fuel-flow-least')!;
    expect(least).toMatchObject({ kind: 'changed', old: { case: 'turndown' }, new: { case: 'turndown' } });
    expect(least.new!.value / least.old!.value).toBeCloseTo(0.12 / 0.1, 9);
    expect(changes.summary).toContain(changes.cases[0]!.text);
    expect(changes.summary).toContain(least.text);
    // And back: the case is added again.
    expect(compareRevisions(b, a).cases.find((c) => c.id === 'hot')).toMatchObject({ kind: 'added', text: 'case hot added: Hot' });
  });
});

announceChromiumSkip('the compare command tests');

describeWithChromium('cellbasis compare', () => {
  let cwd: string;

  beforeAll(async () => {
    cwd = workspace();
    expect((await issue(cwd, ['A', '--status', 'issued for review', '--date', '2026-11-30'])).code).toBe(0);
  }, ISSUE_TIMEOUT);

  afterAll(() => removeWorkspace(cwd));

  it('reports the changed temperature as written and the Nernst voltage of two independent calculations, the draft named as revision B', async () => {
    const text = readFileSync(basisPath(cwd), 'utf8').replace('value: "800 C", source: A1', 'value: "780 C", source: A1');
    writeFileSync(basisPath(cwd), text);
    const issued = loadBasisText(readFileSync(issuedPath(cwd, 'A', 'basis.yaml')), 's.yaml', PROJECT);
    const draft = loadBasisText(text, 'd.yaml', PROJECT);
    if (!issued.ok || !draft.ok) throw new Error('bases');
    const before = calculate(issued.basis).headline.meanNernst_V;
    const after = calculate(draft.basis).headline.meanNernst_V;
    const change = `+${Number(((after - before) * 1000).toPrecision(2))} mV, +${Number((((after - before) / before) * 100).toPrecision(2))} %`;

    const table = await run(['compare', PROJECT, 'A', 'draft'], cwd);
    expect(table.code).toBe(0);
    expect(table.out).toMatch(/^projects\/demo: revision A \(issued for review on 2026-11-30\) → draft of revision B \(working basis\)\n/);
    expect(table.out).toMatch(/\noperating temperature +800 C \[A1\] +780 C \[A1\] +conditions\.operating-temperature\n/);
    expect(table.out).toMatch(new RegExp(`\\nmean Nernst voltage +${before.toFixed(4)} V +${after.toFixed(4)} V +${change.replace(/[+.]/g, '\\$&')}\\n`));

    const json = JSON.parse((await run(['compare', PROJECT, 'A', 'draft', '--json'], cwd)).out);
    expect(json.inputs).toEqual([expect.objectContaining({ path: 'conditions.operating-temperature', old: expect.objectContaining({ text: '800 C' }), new: expect.objectContaining({ text: '780 C' }) })]);
    expect(json.results.find((r: { key: string }) => r.key === 'meanNernst_V')).toMatchObject({ old: before, new: after });
    expect(json.from).toMatchObject({ revision: 'A', status: 'issued for review' });
    expect(json.to).toMatchObject({ revision: 'B', status: 'draft, not issued' });
    expect(json.summary[0]).toBe('operating temperature 800 C → 780 C');

    // --csv: the headline results changed, in SI, read back by csv-parse.
    const rows = parse((await run(['compare', PROJECT, 'A', 'draft', '--csv'], cwd)).out, { record_delimiter: '\r\n' }) as string[][];
    expect(rows[0]).toEqual(['Result', 'Key', 'SI unit', 'Old in SI', 'New in SI', 'Change in SI', 'Relative change']);
    expect(rows.find((r) => r[1] === 'meanNernst_V')!.slice(2, 5)).toEqual(['V', String(before), String(after)]);

    expect((await run(['compare', PROJECT, 'A', 'A'], cwd)).out).toMatch(/\n\nno changes\n$/);
    const missing = await run(['compare', PROJECT, 'A', 'B'], cwd);
    expect(missing).toMatchObject({ code: 2, err: 'cellbasis: revision B of projects/demo is not issued (issued: A; "draft" is the working basis)\n' });
  });
});
