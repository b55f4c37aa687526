// The figures of section 7: at least six drawn charts for every technology, the design point
// marked, a statement instead of an empty chart where the fuel has no carbon, the data table and
// a CSV download under each, and chart JSON that parses back to the numbers of the results.
import { describe, expect, it } from 'vitest';
import { figures, type DrawnFigure } from '../../lib/report/charts/figures.ts';
import type { ChartSpec } from '../../lib/report/charts/spec.ts';
import { CASES, scaffoldCase } from '../helpers/scaffold-cases.ts';
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { loadBasisText } from '../../lib/basis/load.ts';
import { calculate } from '../../lib/plant/calculate.ts';
import { PACKAGE_ROOT } from '../../lib/publish/paths.ts';
import { tableCsv } from '../../lib/report/table.ts';
import { parse } from 'csv-parse/sync';

function drawn(list: ReturnType<typeof figures>): DrawnFigure[] {
  return list.filter((f): f is DrawnFigure => f.kind === 'chart');
}

/** The rows of the CSV of a figure, read by an RFC 4180 parser of its own (csv-parse). */
function csvOf(f: DrawnFigure): string[][] {
  return parse(tableCsv(f.data.table), { record_delimiter: '\r\n' }) as string[][];
}

describe.each(CASES)('figures of the %s %s scaffold', (technology, mode) => {
  const c = scaffoldCase(technology, mode);
  const list = figures(c.results);
  const charts = drawn(list);

  it('draws at least six charts, numbered in order, each with titled axes and units', () => {
    expect(charts.length).toBeGreaterThanOrEqual(6);
    expect(list.map((f) => f.number)).toEqual(list.map((_, i) => i + 1));
    for (const f of charts) {
      const spec = JSON.parse(f.spec.html) as ChartSpec;
      expect(spec.x.title).toMatch(/\(.+\)/);
      if (spec.kind === 'line') expect(spec.y.title).toMatch(/\(.+\)/);
    }
  });

  it('marks the design point on every line chart', () => {
    for (const f of charts) {
      const spec = JSON.parse(f.spec.html) as ChartSpec;
      if (spec.kind !== 'line') continue;
      expect(spec.series.some((s) => s.marker || s.reference), f.id).toBe(true);
    }
  });

  it('puts its data under each chart as a table and a CSV with one row per point', () => {
    for (const f of charts) {
      expect(f.data.table.rows.length).toBeGreaterThan(0);
      expect(f.data.table.rows.length).toBeLessThanOrEqual(32);
      expect(f.data.table.name).toMatch(/^[a-z]+(-[a-z]+)*$/);
      const rows = csvOf(f);
      expect(rows[0]!.length).toBe(f.data.table.data.columns.length);
    }
    const path = charts.find((f) => f.id === 'fig-nernst-path')!;
    expect(csvOf(path).length - 1).toBe(c.results.fuelPath.points.length);
    expect(Number(csvOf(path)[1]![0])).toBe(0);
  });
});

it('the voltage chart carries the sweep of the results unchanged', () => {
  const c = scaffoldCase('solid-oxide', 'power');
  const f = drawn(figures(c.results)).find((x) => x.id === 'fig-voltage-temperature')!;
  const spec = JSON.parse(f.spec.html) as Extract<ChartSpec, { kind: 'line' }>;
  const rev = spec.series[0]!;
  expect(rev.points.map((p) => p[1])).toEqual(c.results.sweeps.temperature.map((p) => p.reversibleVoltage_V));
});

it('draws an electrolyser\'s efficiency limit as heating value over ΔG of splitting (above its design point), not the fuel cell\'s −ΔG/HHV or Carnot', () => {
  // A reversible electrolyser needs ΔG(T) of electric work: its efficiency over electricity alone is
  // HHV/ΔG, 1.481/1.229 = 120 % at 25 °C (textbook E_rev and V_tn of liquid water, Larminie & Dicks,
  // 2nd ed., §2.3); the fuel cell's −ΔG/HHV (83 %) and the Carnot efficiency bound no electrolyser.
  const c = scaffoldCase('pem', 'electrolysis');
  const f = drawn(figures(c.results)).find((x) => x.id === 'fig-efficiency-temperature')!;
  const spec = JSON.parse(f.spec.html) as Extract<ChartSpec, { kind: 'line' }>;
  const labels = spec.series.map((s) => s.label);
  expect(labels.some((l) => /Carnot/.test(l))).toBe(false);
  expect(labels.some((l) => /limit of hydrogen/.test(l))).toBe(false);
  const hhv = spec.series.find((s) => s.label === 'reversible electrolyser, HHV')!;
  expect(hhv.points.map((p) => p[1])).toEqual(c.results.sweeps.temperature.map((p) => p.electrolysisLimitHhv! * 100));
  const design = spec.series.find((s) => s.marker)!;
  const lhv = spec.series.find((s) => s.label === 'reversible electrolyser, LHV')!;
  for (const p of lhv.points) expect(p[1]).toBeGreaterThan(design.points[0]![1]);
  expect(f.caption).toMatch(/ΔG\(T\) of splitting water/);
});

it('says that a fuel without carbon has no carbon curve, and still draws six charts', () => {
  const c = scaffoldCase('pem', 'power');
  const list = figures(c.results);
  const carbon = list.find((f) => f.id === 'fig-carbon-steam')!;
  expect(carbon.kind).toBe('statement');
  expect(carbon.kind === 'statement' && carbon.statement).toMatch(/no carbon/);
  expect(drawn(list).length).toBeGreaterThanOrEqual(6);
});

it('draws the carbon activity on a logarithmic axis with the design ratio marked', () => {
  const c = scaffoldCase('solid-oxide', 'power');
  const f = drawn(figures(c.results)).find((x) => x.id === 'fig-carbon-steam')!;
  const spec = JSON.parse(f.spec.html) as Extract<ChartSpec, { kind: 'line' }>;
  expect(spec.y.log).toBe(true);
  const marker = spec.series.find((s) => s.marker)!;
  expect(marker.points.every((p) => p[0] === c.results.carbon.steamToCarbon)).toBe(true);
});

it('tornado bars are the deviations of the low and high cases from the base', () => {
  const c = scaffoldCase('solid-oxide', 'power');
  const f = drawn(figures(c.results)).find((x) => x.id === 'fig-tornado-heat')!;
  const spec = JSON.parse(f.spec.html) as Extract<ChartSpec, { kind: 'tornado' }>;
  const s = c.results.sensitivities;
  expect(spec.categories.length).toBe(s.length);
  s.forEach((e, i) => {
    expect(spec.low[i]).toBeCloseTo(((e.stackHeat_W.low ?? e.stackHeat_W.base) - e.stackHeat_W.base) / 1000, 9);
    expect(spec.high[i]).toBeCloseTo(((e.stackHeat_W.high ?? e.stackHeat_W.base) - e.stackHeat_W.base) / 1000, 9);
  });
});

it('states that no input moves a result rather than drawing bars of rounding noise', () => {
  // Every case within 1e-12 of its base (rounding, not a dependence): a statement, no bars.
  const c = scaffoldCase('pem', 'electrolysis');
  const noise = (x: { base: number }) => ({ base: x.base, low: x.base * (1 + 1e-12), high: x.base * (1 - 1e-12) });
  const flat = { ...c.results, sensitivities: c.results.sensitivities.map((e) => ({ ...e, efficiency: noise(e.efficiency) })) };
  const f = figures(flat).find((x) => x.id === 'fig-tornado-efficiency')!;
  expect(f.kind).toBe('statement');
  expect(f.kind === 'statement' && f.statement).toMatch(/None of the inputs studied moves the efficiency by more than rounding/);
  // With the cell count and the resistance held, the efficiency of the real study does move.
  expect(figures(c.results).find((x) => x.id === 'fig-tornado-efficiency')!.kind).toBe('chart');
});

it('centres the tornado axis on zero', () => {
  const c = scaffoldCase('solid-oxide', 'power');
  const f = drawn(figures(c.results)).find((x) => x.id === 'fig-tornado-voltage')!;
  const spec = JSON.parse(f.spec.html) as Extract<ChartSpec, { kind: 'tornado' }>;
  expect(spec.x.min).toBe(-spec.x.max!);
  expect(Math.max(...spec.low.map(Math.abs), ...spec.high.map(Math.abs))).toBeLessThanOrEqual(spec.x.max!);
});

it('centres every tornado axis of the scaffolds and the demo projects on zero, its ticks evenly spaced from the limit', () => {
  // The demo PEM backup unit's efficiency peaks just under a power of ten (0.994 percentage points):
  // with its margin the limit lies beyond 1, where a ladder of 1, 2, 2.5, 5 and 10 times 0.1 has none.
  const demos = readdirSync(join(PACKAGE_ROOT, 'projects')).map((id) => {
    const file = `projects/${id}/basis.yaml`;
    const loaded = loadBasisText(readFileSync(join(PACKAGE_ROOT, file)), file, id);
    if (!loaded.ok) throw new Error(id);
    return [id, calculate(loaded.basis)] as const;
  });
  const all = [...CASES.map(([technology, mode]) => [`${technology} ${mode}`, scaffoldCase(technology, mode).results] as const), ...demos];
  for (const [name, results] of all) {
    for (const f of drawn(figures(results)).filter((x) => x.id.startsWith('fig-tornado'))) {
      const spec = JSON.parse(f.spec.html) as Extract<ChartSpec, { kind: 'tornado' }>;
      const { x } = spec;
      const where = `${name} ${f.id}: ±${x.max} by ${x.step}`;
      expect(Number.isFinite(x.max) && x.max! > 0 && x.min === -x.max!, where).toBe(true);
      expect(Math.max(...spec.low.map(Math.abs), ...spec.high.map(Math.abs)), where).toBeLessThanOrEqual(x.max!);
      const ticks = x.max! / x.step!;
      expect(Math.abs(ticks - Math.round(ticks)), where).toBeLessThan(1e-9);
      expect(Math.round(ticks), where).toBeGreaterThanOrEqual(2);
      expect(Math.round(ticks), where).toBeLessThanOrEqual(5);
    }
  }
});

describe.each(CASES)('the current-density figure of the %s %s scaffold', (technology, mode) => {
  const c = scaffoldCase(technology, mode);
  const r = c.results;
  const f = drawn(figures(r)).find((x) => x.id === 'fig-current-cell')!;
  const spec = JSON.parse(f.spec.html) as Extract<ChartSpec, { kind: 'line' }>;

  it('draws the local current density of the results against the share of the area, and the Nernst voltage on the right axis', () => {
    const local = spec.series.find((s) => s.label === 'local current density')!;
    expect(local.points).toEqual(r.fuelPath.points.map((p) => [p.areaFraction * 100, p.currentDensity_A_per_m2 / 1e4]));
    const nernst = spec.series.find((s) => s.label === 'local Nernst voltage')!;
    expect(nernst.right).toBe(true);
    expect(nernst.points.map((p) => p[1])).toEqual(r.fuelPath.points.map((p) => p.nernst_V));
    // The area runs from the inlet (0 %) to the outlet (100 %).
    expect(local.points[0]![0]).toBe(0);
    expect(local.points[local.points.length - 1]![0]).toBeCloseTo(100, 9);
  });

  it('marks the hot spot at the highest local current density, and says how far above the mean it lies', () => {
    const marker = spec.series.find((s) => s.marker)!;
    const max = r.headline.maxLocalCurrentDensity_A_per_m2 / 1e4;
    expect(marker.points).toHaveLength(1);
    expect(marker.points[0]![1]).toBe(max);
    expect(Math.max(...r.fuelPath.points.map((p) => p.currentDensity_A_per_m2 / 1e4))).toBe(max);
    expect(f.caption).toContain(`${(max / (r.operatingPoint.currentDensity_A_per_m2 / 1e4)).toPrecision(3)} times the mean`);
  });
});

it('says beside the temperature sensitivity and the stack-temperature figure that the resistance is held without a law, and names the law where there is one', () => {
  const held = figures(scaffoldCase('solid-oxide', 'power').results);
  for (const id of ['fig-tornado-voltage', 'fig-stack-temperature']) {
    const f = drawn(held).find((x) => x.id === id)!;
    expect(f.notes.join(' '), id).toMatch(/area-specific resistance is held at its design value at every temperature: the basis gives no resistance-temperature law/);
  }
  const withLaw = scaffoldCase('solid-oxide', 'power', (y) => y.replace(/\n( *)cell-voltage: [^\n]*/, '\n$1area-specific-resistance: "0.35 ohm cm2"\n$1resistance-temperature-law: { activation-energy: "0.8 eV", reference-temperature: "750 C", source: R1 }'));
  expect(withLaw.results.electrochemistry.resistanceLaw).not.toBeNull();
  const f = drawn(figures(withLaw.results)).find((x) => x.id === 'fig-stack-temperature')!;
  // 0.8 eV × 96.485 kJ/(mol eV) = 77.19 kJ/mol (CODATA 2018 Faraday constant).
  expect(f.notes.join(' ')).toMatch(/follows the Arrhenius law of the basis, .* E_a = 77\.19 kJ\/mol and T_ref = 750 °C/);
});

describe("the figure of where the fuel's energy goes", () => {
  it('stacks the net electricity, conversion, heat delivered, losses and the remainder to the LHV input, as the plant balance gives them', () => {
    const text = readFileSync(join(PACKAGE_ROOT, 'projects', 'thistlemere-sofc-chp', 'basis.yaml'), 'utf8');
    const loaded = loadBasisText(text, 'projects/thistlemere-sofc-chp/basis.yaml', 'thistlemere-sofc-chp');
    if (!loaded.ok) throw new Error('the demo basis is invalid');
    const r = calculate(loaded.basis);
    const f = drawn(figures(r)).find((x) => x.id === 'fig-energy-flow')!;
    const spec = JSON.parse(f.spec.html) as Extract<ChartSpec, { kind: 'stacked' }>;
    expect(spec.kind).toBe('stacked');
    const share = (label: string) => spec.parts.find((p) => p.label === label)!.values[0]!;
    const lhv = r.efficiency.fuelLhvInput_W!;
    // The net electricity is the net electrical efficiency on LHV; the heat delivered the CHP thermal efficiency.
    expect(share('net electricity') / 100).toBeCloseTo(r.plant.power!.chp!.electricalEfficiencyLhv, 12);
    expect(share('heat delivered') / 100).toBeCloseTo(r.plant.power!.chp!.thermalEfficiencyLhv, 12);
    expect(share('lost to ambient') / 100).toBeCloseTo(r.plant.power!.heatLoss_W / lhv, 12);
    // The parts add up to the LHV input, and every one is a real share (the remainder is not negative).
    expect(spec.parts.reduce((a, p) => a + p.values[0]!, 0)).toBeCloseTo(100, 9);
    for (const p of spec.parts) expect(p.values[0]!).toBeGreaterThanOrEqual(0);
    // Its data: a CSV row per part, with the power and the share.
    expect(csvOf(f).length).toBe(spec.parts.length + 1);
  });

  it('is not drawn in electrolysis, which has no fuel', () => {
    expect(figures(scaffoldCase('pem', 'electrolysis').results).some((x) => x.id === 'fig-energy-flow')).toBe(false);
  });
});

describe("the figure of where an electrolysis plant's electricity and heat go", () => {
  it('stacks the products on LHV and HHV, compression, balance of plant, stack heat, coolers, losses and the remainder to the plant input', () => {
    const text = readFileSync(join(PACKAGE_ROOT, 'projects', 'kestrelford-pem-electrolyser', 'basis.yaml'), 'utf8');
    const loaded = loadBasisText(text, 'projects/kestrelford-pem-electrolyser/basis.yaml', 'kestrelford-pem-electrolyser');
    if (!loaded.ok) throw new Error('the demo basis is invalid');
    const r = calculate(loaded.basis);
    const x = r.plant.electrolysis!;
    const f = drawn(figures(r)).find((d) => d.id === 'fig-electrolysis-energy-flow')!;
    const spec = JSON.parse(f.spec.html) as Extract<ChartSpec, { kind: 'stacked' }>;
    const share = (label: string) => spec.parts.find((p) => p.label === label)!.values[0]! / 100;
    // The products' LHV share is the plant's LHV efficiency (its heat comes electrically here).
    expect(x.heatSupply).toBe('electric');
    expect(share('products, LHV')).toBeCloseTo(x.specificEnergy.systemEfficiencyLhv, 12);
    // HHV/LHV of hydrogen: 285.83/241.83 kJ/mol at 25 °C (NIST-JANAF formation enthalpies of liquid
    // and gaseous water, from memory), so HHV − LHV is 0.182 of the LHV (3 digits: the species data
    // agree with the tables to better than 0.05 %).
    expect(share('products, HHV − LHV') / share('products, LHV')).toBeCloseTo(0.182, 3);
    expect(share('compression')).toBeCloseTo(x.specificEnergy.compressor_W / x.specificEnergy.totalElectric_W, 12);
    // The rectifier and transformer lose P_DC (1/η − 1) at the demo's η = 96 % (R6 of the basis):
    // 2086.8 kW × (1/0.96 − 1) = 86.95 kW of the 2238.17 kW of electricity, 0.03885 (recomputed
    // outside the project from the stack DC, heater and compressor powers).
    expect(share('rectifier loss')).toBeCloseTo((x.specificEnergy.stackDc_W * (1 / 0.96 - 1)) / x.specificEnergy.totalElectric_W, 12);
    expect(share('rectifier loss')).toBeCloseTo(0.03885, 5);
    // The water loop carries the whole stack heat at its 7 K rise (the demo's circulation is set so), so
    // no other stack cooling is drawn and the loop cooler takes it with the product coolers.
    expect(x.stackHeatRemoved_W).toBe(0);
    expect(spec.parts.some((p) => p.label === 'stack heat removed')).toBe(false);
    const compressionCoolers = x.compression!.intercoolers_W + x.compression!.aftercooler_W;
    expect(share('water loop and product coolers')).toBeCloseTo((x.coolers_W - compressionCoolers) / x.specificEnergy.totalElectric_W, 12);
    // The parts add up to the input by construction, and the remainder (sensible heat out) is a real share.
    expect(spec.parts.reduce((a, p) => a + p.values[0]!, 0)).toBeCloseTo(100, 9);
    for (const p of spec.parts) expect(p.values[0]!).toBeGreaterThanOrEqual(0);
    expect(csvOf(f).length).toBe(spec.parts.length + 1);
  });

  it('is not drawn in power mode, whose figure is the fuel\'s', () => {
    expect(figures(scaffoldCase('solid-oxide', 'power').results).some((d) => d.id === 'fig-electrolysis-energy-flow')).toBe(false);
  });
});

it('calls the electrolyser\'s path coordinate its conversion, not a fuel utilization, in every figure', () => {
  // An electrolyser has no fuel to utilize: its path runs over the conversion of the feed (steam-conversion of the basis).
  const c = scaffoldCase('pem', 'electrolysis');
  for (const f of drawn(figures(c.results))) {
    const spec = JSON.parse(f.spec.html) as ChartSpec;
    const words = [f.caption, ...(spec.kind === 'line' ? spec.series.map((s) => s.label) : [])].join(' ');
    expect(words, f.id).not.toMatch(/utilization/);
  }
  const composition = drawn(figures(c.results)).find((f) => f.id === 'fig-composition-path')!;
  expect(composition.caption).toMatch(/design conversion marked/);
});
