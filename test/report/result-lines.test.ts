// Each worked line of section 6 must be redoable by hand: its formula, evaluated here on the
// numbers the line shows (line.inputs), gives the result the line states, and that result is the
// number of the results object. The formulas below are written out independently of lib/report.
import { describe, expect, it } from 'vitest';
import { EquationBook } from '../../lib/report/equation-book.ts';
import { methodSection } from '../../lib/report/method.ts';
import { resultLines } from '../../lib/report/result-lines.ts';
import type { CalcLine } from '../../lib/report/calc-line.ts';
import { formatTrimmed } from '../../lib/report/format.ts';
import type { Results } from '../../lib/plant/results-schema.ts';
import { CASES, scaffoldCase } from '../helpers/scaffold-cases.ts';

type Formula = (n: Record<string, number>) => number;

function nernst(n: Record<string, number>, r: Results): number {
  const p = (k: string) => n[k]!;
  const ion = r.technology.ion;
  const liquid = r.technology.waterPhase === 'liquid';
  let lnQ = Math.log(p('p_H2_f')) + 0.5 * Math.log(p('p_O2_a'));
  if (ion === 'oxide' && !liquid) lnQ -= Math.log(p('p_H2O_f'));
  if (ion === 'proton' && !liquid) lnQ -= Math.log(p('p_H2O_a'));
  if (ion === 'carbonate') lnQ += Math.log(p('p_CO2_a')) - Math.log(p('p_H2O_f')) - Math.log(p('p_CO2_f'));
  return n.E0! + ((n.R! * n.T!) / (2 * n.F!)) * lnQ;
}

function formulas(r: Results): Record<string, Formula> {
  const power = r.technology.mode === 'power';
  return {
    'standard-voltage': (n) => -(n.dH! - n.T! * n.dS!) / (2 * n.F!),
    'thermoneutral-voltage': (n) => -n.dH! / (2 * n.F!),
    'nernst-inlet': (n) => nernst(n, r),
    'nernst-outlet': (n) => nernst(n, r),
    'open-circuit': (n) => n.t! * n.Ein! - n.dV!,
    'cell-voltage': (n) =>
      r.electrochemistry.voltageSource === 'given'
        ? power
          ? (n.t! * n.E! - n.dV! - n.V!) / n.j!
          : (n.V! - n.E!) / n.j!
        : power
          ? n.t! * n.E! - n.dV! - n.j! * n.ASR!
          : n.E! + n.j! * n.ASR!,
    'cell-current': (n) => n.j! * n.A!,
    cells: (n) => (n.P !== undefined ? Math.ceil(n.P / (n.V! * n.Icell! * (1 - (n.f ?? 0))) - 1e-9) : Math.ceil(n.m! / n.mc! - 1e-9)),
    'stack-current': (n) => n.N! * n.Icell!,
    'stack-power': (n) => (n.V! * n.I!) / 1000,
    'net-power': (n) => n.P! * (1 - n.f!),
    'charge-basis': (n) => n.I! / n.U!,
    'fuel-flow': (n) => n.I! / (n.U! * n.F! * n.z!),
    hydrogen: (n) => n.I! / (2 * n.F!),
    oxygen: (n) => n.I! / (4 * n.F!),
    'air-flow': (n) => n.nO2! / (n.x! * n.U!),
    'eff-electrical': (n) => n.P! / n.L!,
    'eff-voltage': (n) => (power ? n.V! / n.E! : n.E! / n.V!),
    'eff-carnot': (n) => 1 - n.T0! / n.T!,
    'specific-energy': (n) => n.P! / (n.n! * n.M!) / 3.6e6,
    'eff-electrolysis': (n) => (n.n! * n.L!) / n.P!,
    'heat-voltage': (n) => (power ? (n.I! * (n.Vtn! - n.V!)) / 1000 : (n.I! * (n.V! - n.Vtn!)) / 1000),
    'heat-balance': (n) => n.Hin! - n.Hout! + n.W!,
    'carbon-margin': (n) => n.sc! - Math.max(n.st!, n.pr ?? -Infinity),
  };
}

/** The number of the results object each line states. */
function resultOf(id: string, r: Results): number | null {
  const h = r.headline;
  const table: Record<string, number | null> = {
    'standard-voltage': r.electrochemistry.standardVoltage_V,
    'thermoneutral-voltage': r.electrochemistry.thermoneutralVoltage_V,
    'nernst-inlet': h.inletNernst_V,
    'nernst-outlet': h.outletNernst_V,
    'mean-nernst': h.meanNernst_V,
    'open-circuit': h.openCircuit_V,
    'cell-current': h.cellCurrent_A,
    cells: h.cells,
    'stack-current': h.totalCurrent_A,
    'stack-power': h.stackPower_W / 1000,
    'net-power': h.netPower_W / 1000,
    'charge-basis': r.electrochemistry.chargeBasis_A,
    'heat-voltage': h.stackHeat_W / 1000,
    'heat-balance': h.stackHeat_W / 1000,
    'eff-electrical': h.electricalEfficiencyLhv,
    'eff-voltage': r.efficiency.voltageEfficiency,
    'eff-carnot': r.efficiency.carnotLimit,
    'specific-energy': h.specificEnergy_kWh_per_kg,
    'eff-electrolysis': r.efficiency.electrolysisEfficiencyLhv,
    'carbon-margin': h.carbonMargin,
  };
  if (id === 'cell-voltage') return r.electrochemistry.voltageSource === 'given' ? r.electrochemistry.areaSpecificResistance_ohm_m2 * 1e4 : h.cellVoltage_V;
  return id in table ? table[id]! : null;
}

function lines(c: ReturnType<typeof scaffoldCase>): CalcLine[] {
  const book = new EquationBook();
  methodSection(c.results, book, 5);
  return resultLines(c.results, c.basis, book).flatMap((g) => g.lines);
}

describe.each(CASES)('worked lines of the %s %s scaffold', (technology, mode) => {
  const c = scaffoldCase(technology, mode);
  const all = lines(c);
  const f = formulas(c.results);

  it('has the lines a review needs', () => {
    const ids = all.map((l) => l.id);
    for (const id of ['standard-voltage', 'mean-nernst', 'cell-voltage', 'cell-current', 'stack-current', 'stack-power', 'oxygen', 'heat-voltage', 'heat-balance', 'eff-voltage']) expect(ids).toContain(id);
    expect(ids.some((id) => id.startsWith('nernst-'))).toBe(true);
    expect(ids).toContain(mode === 'power' ? 'fuel-flow' : 'hydrogen');
  });

  it.each(all.filter((l) => l.id !== 'mean-nernst').map((l) => [l.id, l] as const))('%s: the numbers shown give the result shown', (id, line) => {
    const formula = f[id];
    expect(formula, `no formula for ${id}`).toBeDefined();
    const recomputed = formula!(line.inputs);
    // The products of a re-equilibrated fuel gas hold traces of dissociation products (H, OH near
    // 1e-8) that I/2F does not count: 1e-7 relative covers them; every other line is exact.
    const tolerance = id === 'hydrogen' && c.results.technology.fuelGasEquilibrium ? 1e-7 : 1e-9;
    expect(Math.abs(recomputed - line.value)).toBeLessThanOrEqual(tolerance * Math.max(1, Math.abs(line.value)));
    const stated = resultOf(id, c.results);
    if (stated !== null) expect(line.value).toBeCloseTo(stated, 9);
  });

  it('shows every input with the digits it has, and cites an equation of the method', () => {
    for (const line of all) {
      expect(line.equation.number).toBeGreaterThan(0);
      line.quantities.forEach((q, i) => {
        const value = Object.values(line.inputs)[i]!;
        expect(q.value.startsWith(formatTrimmed(value, 6))).toBe(true);
      });
    }
  });
});

it.each(CASES)('the Nernst lines of the %s %s scaffold put a multiplication sign between the partial pressures they substitute', (technology, mode) => {
  const nernst = lines(scaffoldCase(technology, mode)).filter((l) => l.id.startsWith('nernst-'));
  expect(nernst.length).toBeGreaterThan(0);
  for (const line of nernst) {
    // The LaTeX source KaTeX keeps in its MathML annotation; the substituted quotient follows the second \ln.
    const tex = /<annotation encoding="application\/x-tex">([^<]*)<\/annotation>/.exec(line.math.html)![1]!;
    const substituted = tex.split('\\ln ')[2]!;
    expect(substituted, line.id).toMatch(/^\\frac\{|^[\d{]/);
    // A number (or a {number}^{1/2}) followed by another with only a thin space between: two pressures read as one.
    expect(substituted, `${line.id}: ${substituted}`).not.toMatch(/[\d}]\\,[\d{]/);
    if (Object.keys(line.inputs).filter((k) => k.startsWith('p_')).length > 1) expect(substituted, line.id).toContain('\\times');
  }
});

it('the inlet Nernst line uses the partial pressures of the first fuel-path point', () => {
  const c = scaffoldCase('solid-oxide', 'power');
  const line = lines(c).find((l) => l.id === 'nernst-inlet')!;
  const p0 = c.results.fuelPath.points[0]!;
  expect(line.inputs.p_H2_f).toBeCloseTo(p0.fuelSide.H2! * c.results.conditions.fuelPressure_bar, 12);
  expect(line.inputs.p_O2_a).toBeCloseTo(p0.airSide.O2! * c.results.conditions.airPressure_bar, 12);
  expect(line.inputs.E0).toBe(c.results.fuelPath.standardVoltage_V);
});

it('the dry fuel flow by Faraday equals the stream table: methane in the pre-reformer feed over its dry fraction', () => {
  const c = scaffoldCase('solid-oxide', 'power');
  const line = lines(c).find((l) => l.id === 'fuel-flow')!;
  const feed = c.results.streams.find((s) => s.id === 'fuel-feed')!;
  const x = c.basis.fuelElectrode!.composition.CH4!;
  expect(line.value).toBeCloseTo(feed.speciesFlows_mol_per_s.CH4! / x, 9);
});
