// The section on the operating cases: every governing value of the envelope is marked in words in
// the per-case table, each exactly once; the envelope table lists every row; and each worked line
// of a case, evaluated here on the numbers it shows with its formula written out independently
// of lib/report, gives the result it states, which is the case's number in the results.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { loadBasisText } from '../../lib/basis/load.ts';
import type { DesignBasis } from '../../lib/basis/types.ts';
import { calculate } from '../../lib/plant/calculate.ts';
import type { CaseResult, Results } from '../../lib/plant/results-schema.ts';
import { ENVELOPE_QUANTITIES } from '../../lib/plant/envelope.ts';
import { documentView } from '../../lib/report/document.ts';
import { CASE_ROWS } from '../../lib/report/sections/cases.ts';
import { renderDocumentHtml } from '../../lib/publish/render.ts';
import type { RevisionContext } from '../../lib/report/revision.ts';

function demo(id: string): { basis: DesignBasis; results: Results } {
  const loaded = loadBasisText(readFileSync(new URL(`../../projects/${id}/basis.yaml`, import.meta.url), 'utf8'), `projects/${id}/basis.yaml`, id);
  if (!loaded.ok) throw new Error(id);
  return { basis: loaded.basis, results: calculate(loaded.basis) };
}

const draft: RevisionContext = { kind: 'draft', revision: 'A', lastIssued: null, date: null };

/** Each case line's formula on its shown numbers (power mode's sign of the degradation below). */
function formula(id: string, n: Record<string, number>, power: boolean): number {
  if (id.endsWith('-load')) return n.M !== undefined ? ((n.N! * n.j! * n.A! * n.M!) / (2 * n.F!)) * 86400 : (n.N! * n.j! * n.A! * n.V! * (1 - (n.f ?? 0))) / 1000;
  if (id.endsWith('-degradation')) return n.V0 !== undefined ? n.V0 * (1 + (power ? -1 : 1) * n.r! * n.t!) : n.R0! * (1 + n.r! * n.t!);
  if (id.endsWith('-cell-current')) return n.j! * n.A!;
  if (id.endsWith('-stack-power')) return (n.V! * n.I!) / 1000;
  if (id.endsWith('-fuel-flow')) return n.I! / (n.U! * n.F! * n.z!);
  if (id.endsWith('-air-flow')) return n.nO2! / (n.x! * n.U!);
  if (id.endsWith('-hydrogen')) return n.I! / (2 * n.F!);
  if (id.endsWith('-heat-balance')) return n.Hin! - n.Hout! + n.W!;
  if (id.endsWith('-carbon-margin')) return n.sc! - Math.max(n.st!, n.pr ?? -Infinity);
  throw new Error(`no formula for ${id}`);
}

/** The number of the case's results each line states. */
function resultOf(id: string, c: CaseResult): number {
  const h = c.headline!;
  if (id.endsWith('-load')) return h.hydrogenProduction_kg_per_day ?? h.netPower_W / 1000;
  if (id.endsWith('-degradation')) return c.degradation!.of === 'cell-voltage' ? h.cellVoltage_V : c.electrochemistry!.areaSpecificResistance_ohm_m2 * 1e4;
  if (id.endsWith('-cell-current')) return h.cellCurrent_A;
  if (id.endsWith('-stack-power')) return h.stackPower_W / 1000;
  if (id.endsWith('-heat-balance')) return h.stackHeat_W / 1000;
  if (id.endsWith('-carbon-margin')) return h.carbonMargin!;
  return NaN;
}

describe.each(['thistlemere-sofc-chp', 'kestrelford-pem-electrolyser', 'corrin-beck-mcfc-biogas'])('the cases section of %s', (id) => {
  const { basis, results } = demo(id);
  const view = documentView({ basis, results, revision: draft, history: [] }, { assetBase: './', checks: [] });
  const section = view.cases;

  it('marks every governing value in words, once, in the column of its case', () => {
    const marked = section.comparison!.rows.flatMap((row) => row.cells.slice(1).map((cell, k) => ({ label: row.cells[0]!, caseId: results.cases[k]!.id, words: /\((highest|lowest)(, (highest|lowest))?\)$/.exec(cell) })));
    const count = marked.reduce((sum, m) => sum + (m.words ? m.words[0].split(',').length : 0), 0);
    expect(count).toBe(results.envelope.length);
    for (const e of results.envelope) {
      const row = CASE_ROWS.find((r) => r.path === e.path)!;
      const cell = marked.find((m) => m.label.startsWith(row.label) && m.caseId === e.case)!;
      expect(cell.words?.[0], `${e.id}`).toContain(e.governs === 'max' ? 'highest' : 'lowest');
    }
    expect(section.envelope!.rows).toHaveLength(results.envelope.length);
  });

  it('each worked line of a case gives, on its own numbers, the number the case reports', () => {
    expect(section.lines.length).toBeGreaterThan(0);
    const power = results.technology.mode === 'power';
    for (const group of section.lines) {
      const c = results.cases.find((k) => group.id === `cases-${k.id}`)!;
      for (const line of group.lines) {
        // The line's numbers are its exact inputs: the formula gives the stated value to rounding.
        expect(Math.abs(formula(line.id, line.inputs, power) - line.value), line.id).toBeLessThanOrEqual(1e-9 * Math.abs(line.value));
        const stated = resultOf(line.id, c);
        if (!Number.isNaN(stated)) expect(Math.abs(line.value - stated), line.id).toBeLessThanOrEqual(1e-9 * Math.abs(stated));
      }
    }
  });

  it('is in the page, with its tables', () => {
    const html = renderDocumentHtml({ basis, results, revision: draft, history: [] }, { assetBase: './', checks: [] });
    expect(html).toContain('id="cases"');
    expect(html).toContain('id="cases-envelope"');
    for (const c of results.cases) expect(html).toContain(c.title);
  });
});

it('the per-case table can show every quantity of the envelope', () => {
  for (const q of ENVELOPE_QUANTITIES) expect(CASE_ROWS.map((r) => r.path), q.id).toContain(q.path);
});

it('the end-of-life lines follow the degradation by hand: 0.7587 V × (1 − 0.003/kh × 40 kh) = 0.6677 V', () => {
  const { basis, results } = demo('thistlemere-sofc-chp');
  const view = documentView({ basis, results, revision: draft, history: [] }, { assetBase: './', checks: [] });
  const line = view.cases.lines.flatMap((g) => g.lines).find((l) => l.id === 'case-end-of-life-degradation')!;
  expect(line.inputs.r).toBeCloseTo(0.003, 12);
  expect(line.inputs.t).toBeCloseTo(40, 12);
  expect(line.value).toBeCloseTo(line.inputs.V0! * 0.88, 12);
  expect(line.result).toBe('0.66768 V');
});

it('draws each case on its own curve: the operating point lies between the curve\'s neighbouring points, voltage falling with current in power mode and rising in electrolysis', () => {
  for (const id of ['thistlemere-sofc-chp', 'kestrelford-pem-electrolyser']) {
    const { basis, results } = demo(id);
    const view = documentView({ basis, results, revision: draft, history: [] }, { assetBase: './', checks: [] });
    const figure = view.figures.find((f) => f.id === 'fig-cases');
    expect(figure?.kind, id).toBe('chart');
    const power = results.technology.mode === 'power';
    for (const c of results.cases) {
      const j = c.operatingPoint!.currentDensity_A_per_m2;
      const k = c.curve.findIndex((p) => p.currentDensity_A_per_m2 >= j);
      expect(k, `${id} ${c.id}`).toBeGreaterThan(0);
      const [lo, hi] = [c.curve[k - 1]!, c.curve[k]!];
      const v = c.headline!.cellVoltage_V;
      expect(v, `${id} ${c.id}`).toBeLessThanOrEqual(Math.max(lo.cellVoltage_V, hi.cellVoltage_V) + 1e-12);
      expect(v, `${id} ${c.id}`).toBeGreaterThanOrEqual(Math.min(lo.cellVoltage_V, hi.cellVoltage_V) - 1e-12);
      for (let i = 1; i < c.curve.length; i++) {
        const dv = c.curve[i]!.cellVoltage_V - c.curve[i - 1]!.cellVoltage_V;
        expect(power ? dv < 0 : dv > 0, `${id} ${c.id} at ${i}`).toBe(true);
      }
    }
  }
});
