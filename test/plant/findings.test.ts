// Findings of the calculation (lib/plant/findings.ts): each kind raised by a basis that has it and
// by no other, located at its basis field, linked to the assumptions that bear on its fields, and
// a confirmed assumption the numbers disprove flagged. Where a finding states a number, the number
// is recomputed here from its definition (heat carried by water: ṅ (h(T) − h(T − ΔT)) of liquid
// water, NASA Glenn data, whose cp near 75.3 J/(mol K) at 60 °C is that of the IAPWS-95 steam
// tables, from memory).
import { describe, expect, it } from 'vitest';
import { calculate } from '../../lib/plant/calculate.ts';
import { finding, withAssumptions, type Finding } from '../../lib/plant/findings.ts';
import { enthalpy } from '../../lib/thermo/properties.ts';
import { getSpecies } from '../../lib/thermo/species-data.ts';
import { resultsSchema } from '../../lib/plant/results-schema.ts';
import { basisFrom } from '../helpers/scaffold-basis.ts';
import type { Assumption, InputRecord } from '../../lib/basis/types.ts';

const codes = (findings: readonly Finding[]) => findings.map((f) => f.code);
const assumption = (id: string, open: boolean, concerns: string[] = []): Assumption => ({ id, text: `assumption ${id}`, open, concerns });
const input = (path: string, source?: string): InputRecord => ({ path, label: path, text: '1', unit: '', si: 1, siUnit: '1', ...(source ? { source } : {}) });

describe('linking findings to assumptions', () => {
  const basis = {
    assumptions: [assumption('A1', false, ['conditions']), assumption('A2', true, ['conditions.allowed-air-temperature-rise']), assumption('A3', false), assumption('A4', false)],
    inputs: [input('operating-point.air-utilization', 'A3'), input('operating-point.parasitic-load', 'A4')],
  };

  it('names the assumptions cited as the source of its field or naming its fields or their section under concerns', () => {
    const [f] = withAssumptions([finding('cooling-air-short', 'warning', 'operating-point.air-utilization', 'm', ['conditions.allowed-air-temperature-rise'])], basis).filter((x) => x.code === 'cooling-air-short');
    expect(f!.assumptions).toEqual(['A1', 'A2', 'A3']);
    // A source is linked through the finding's own field only: A4 (the parasitic load's source) is not.
    const [g] = withAssumptions([finding('heat-demand', 'info', 'operating-point.cell-voltage', 'm', ['operating-point.parasitic-load'])], basis);
    expect(g!.assumptions).toEqual([]);
  });

  it('flags each confirmed assumption behind a warning or critical finding, once, most severe first; an open one and an info finding are not flagged', () => {
    const out = withAssumptions(
      [finding('cooling-air-short', 'warning', 'operating-point.air-utilization', 'air short', ['conditions.allowed-air-temperature-rise']), finding('heat-demand', 'info', 'operating-point.parasitic-load', 'noted')],
      basis,
    );
    expect(codes(out)).toEqual(['assumption-contradicted', 'assumption-contradicted', 'cooling-air-short', 'heat-demand']);
    expect(out[0]).toMatchObject({ severity: 'critical', path: 'assumptions.0.open', assumptions: ['A1'] });
    expect(out[0]!.message).toBe('assumption A1 is marked confirmed (open: false), but the results contradict it: operating-point.air-utilization: air short');
    expect(out[1]).toMatchObject({ path: 'assumptions.2.open', assumptions: ['A3'] });
    // Linking again (as a later layer does after adding its own) gives the same list.
    expect(withAssumptions(out, basis)).toEqual(out);
  });
});

describe('findings of the stack calculation', () => {
  it('a PEM electrolyser whose water loop cannot carry its heat, with a confirmed assumption that it does (the case of a demo whose document said "no findings")', () => {
    const r = calculate(
      basisFrom('pem', 'electrolysis', {
        // 20 times the water split circulates (the scaffold: 250 times).
        'operating-point.steam-conversion': 0.05,
        assumptions: [{ id: 'A1', text: 'The water loop removes the heat at the stated temperature rise.', open: false, concerns: ['conditions.allowed-air-temperature-rise'] }],
      }),
    );
    expect(codes(r.findings)).toEqual(['assumption-contradicted', 'water-loop-short']);
    const loop = r.findings[1]!;
    expect(loop).toMatchObject({ severity: 'warning', path: 'operating-point.steam-conversion', related: ['conditions.allowed-air-temperature-rise'], assumptions: ['A1'] });
    // The water needed: Q / (h(T) − h(T − 5 K)) of liquid water (the scaffold: 60 °C stack, 5 K rise).
    const t = r.conditions.temperature_K;
    const perMol = enthalpy(getSpecies('H2O(L)'), t) - enthalpy(getSpecies('H2O(L)'), t - 5);
    expect(perMol / 5).toBeGreaterThan(75.0);
    expect(perMol / 5).toBeLessThan(75.6);
    const needed = (r.heat.isothermalHeat_W / perMol) * 0.01801528 * 3600;
    expect(r.heat.coolingWater_kg_per_h! / needed).toBeCloseTo(1, 12);
    expect(loop.message).toContain(`${(needed / 1000).toPrecision(4)} t/h would be needed`);
    expect(r.findings[0]!.severity).toBe('critical');
    expect(resultsSchema.safeParse(r).success).toBe(true);
    // Findings replace the notes of earlier results: a results object carries no notes key.
    expect('notes' in r).toBe(false);
  });

  it('says a loop just short of the heat carries 99.8 %, never "only 100 %"', () => {
    // Water fed ∝ 1 / steam-conversion: the share at 0.05 sets the conversion at which 99.85 % is carried.
    const at = (conversion: number) => calculate(basisFrom('pem', 'electrolysis', { 'operating-point.steam-conversion': conversion }));
    const first = at(0.05);
    const share = first.supply.water_kg_per_h! / first.heat.coolingWater_kg_per_h!;
    const r = at((0.05 * share) / 0.9985);
    const loop = r.findings.find((f) => f.code === 'water-loop-short')!;
    expect(loop.message).toContain('carries only 99.8 % of the stack heat');
  });

  it('air that cannot carry the stack heat, with its air utilization taken from a confirmed assumption', () => {
    const r = calculate(
      basisFrom('solid-oxide', 'power', {
        'operating-point.air-utilization': { value: 0.4, source: 'A3' },
        'assumptions.2': { id: 'A3', text: 'The air utilization of 0.4 keeps the stack within its temperature rise.', open: false },
      }),
    );
    expect(codes(r.findings)).toEqual(['assumption-contradicted', 'cooling-air-short']);
    expect(r.findings[1]!.path).toBe('operating-point.air-utilization');
  });

  it('steam-to-carbon below the carbon-free minimum: carbon on the fuel path and the margin, both critical', () => {
    const r = calculate(basisFrom('solid-oxide', 'power', { 'streams.fuel-electrode.steam-to-carbon': 0.3 }));
    const critical = r.findings.filter((f) => f.severity === 'critical');
    expect(codes(critical)).toEqual(['carbon-deposition', 'steam-to-carbon-below-minimum']);
    // The rest is the stack heat balance of this changed feed (its own findings are tested in stack-heat-balance.test.ts).
    expect(codes(r.findings.filter((f) => f.severity !== 'critical')).every((c) => ['stack-heat-short', 'cooling-air-short'].includes(c))).toBe(true);
    expect(r.carbon.maxCarbonActivity!).toBeGreaterThan(1);
  });

  it('a fuel that no practical steam keeps free of carbon: a critical finding at the steam-to-carbon field, no limit and no margin', () => {
    // The fuel and the hand check of its carbon activity: test/equilibrium/carbon.test.ts (330 K: a_C 0.968 by hand, > 1 computed).
    const r = calculate(
      basisFrom('pem', 'power', {
        'conditions.operating-temperature': '330 K',
        'streams.fuel-electrode.composition': { H2: 0.041407, CO2: 0.93789, CH3OH: 0.020702 },
        'operating-point.fuel-utilization': 0.3,
      }),
    );
    const f = r.findings.find((x) => x.code === 'steam-to-carbon-limit-not-reached');
    expect(f).toMatchObject({ severity: 'critical', path: 'streams.fuel-electrode.steam-to-carbon' });
    expect(f!.message).toMatch(/^at 330\.00 K the equilibrated fuel gas still has carbon activity 1\.\d+ at a steam-to-carbon ratio of 64/);
    expect(r.carbon.minimumSteamToCarbonStack).toBeNull();
    expect(r.headline.minimumSteamToCarbon).toBeNull();
    expect(r.headline.carbonMargin).toBeNull();
    expect(resultsSchema.safeParse(r).success).toBe(true);
  });

  it('heat to supply below the thermoneutral voltage is noted (info), at the voltage field', () => {
    const r = calculate(basisFrom('solid-oxide', 'electrolysis', { 'operating-point.cell-voltage': '1.20 V' }));
    expect(r.findings).toHaveLength(1);
    expect(r.findings[0]).toMatchObject({ code: 'heat-demand', severity: 'info', path: 'operating-point.cell-voltage' });
  });

  it('a crossover allowance given to an electrolyser, which does not use it, is noted', () => {
    const r = calculate(basisFrom('solid-oxide', 'electrolysis', { 'cell.crossover-allowance': '10 mV' }));
    expect(codes(r.findings)).toEqual(['input-unused']);
    expect(r.findings[0]!.path).toBe('cell.crossover-allowance');
  });

  it('a stated cell count within 2 % of its target: short of it is a warning, over it a note', () => {
    const r = calculate(basisFrom('solid-oxide', 'power'));
    const exact = r.headline.cells;
    const short = calculate(basisFrom('solid-oxide', 'power', { 'operating-point.cells': exact - 1 }));
    expect(short.findings).toHaveLength(1);
    expect(short.findings[0]).toMatchObject({ code: 'cells-against-target', severity: 'warning', path: 'operating-point.cells', related: ['operating-point.target-power'] });
    const over = calculate(basisFrom('solid-oxide', 'power', { 'operating-point.cells': exact + 1 }));
    expect(over.findings[0]).toMatchObject({ code: 'cells-against-target', severity: 'info' });
  });

  it('a mixed conductor whose leakage exceeds the ionic current near the outlet: the local current at the terminals turns negative there', () => {
    // Humidified hydrogen to 90 %: E falls by about 0.2 V along the cell; with t_ion = 0.5 and a small
    // j ASR, V = t Ē_A − j ASR lies above t E_out, so (t E_out − V)/ASR < 0 at the outlet.
    const r = calculate(
      basisFrom('solid-oxide', 'power', {
        'streams.fuel-electrode': { composition: { H2: 0.97, H2O: 0.03 }, 'pre-reforming': 'none' },
        'operating-point.fuel-utilization': 0.9,
        'operating-point.current-density': '0.05 A/cm2',
        'operating-point.cell-voltage': undefined,
        'operating-point.area-specific-resistance': '0.3 ohm cm2',
        'cell.ionic-transference-number': 0.5,
      }),
    );
    const last = r.fuelPath.points[r.fuelPath.points.length - 1]!;
    expect(last.currentDensity_A_per_m2).toBeLessThan(0);
    expect(codes(r.findings)).toContain('local-current-reversed');
  });

  it('a utilization at the limit of what the resistance reaches (0.9999 at 0.3 ohm cm2): the outlet nearly idle, the inlet carrying several times the mean', () => {
    const r = calculate(
      basisFrom('solid-oxide', 'power', {
        'streams.fuel-electrode': { composition: { H2: 0.97, H2O: 0.03 }, 'pre-reforming': 'none' },
        'operating-point.fuel-utilization': 0.9999,
        'operating-point.cell-voltage': undefined,
        'operating-point.area-specific-resistance': '0.3 ohm cm2',
      }),
    );
    const idle = r.findings.find((f) => f.code === 'outlet-idle')!;
    expect(idle).toMatchObject({ severity: 'warning', path: 'operating-point.fuel-utilization', related: ['operating-point.area-specific-resistance'] });
    const p = r.fuelPath.points;
    const j = r.operatingPoint.currentDensity_A_per_m2;
    expect(p[p.length - 1]!.currentDensity_A_per_m2).toBeLessThan(0.1 * j);
    expect(idle.message).toContain(`the inlet carries ${(r.headline.maxLocalCurrentDensity_A_per_m2 / j).toFixed(1)} times the mean`);
    // The local current density at the inlet, (E_in − V)/ASR: this design's hot spot.
    expect(r.headline.maxLocalCurrentDensity_A_per_m2).toBeCloseTo((r.headline.inletNernst_V! - r.headline.cellVoltage_V) / 0.3e-4, 6);
  });

  it('the scaffolds of solid oxide power and PEM power have no findings', () => {
    expect(calculate(basisFrom('solid-oxide', 'power')).findings).toEqual([]);
    expect(calculate(basisFrom('pem', 'power')).findings).toEqual([]);
  });
});

describe('assumptions naming fields', () => {
  it('refuses a field that the basis does not write, at its place in concerns', () => {
    expect(() => basisFrom('pem', 'electrolysis', { assumptions: [{ id: 'A1', text: 'x', concerns: ['conditions.allowed-air-rise'] }] })).toThrow(
      'assumptions[0].concerns[0]: conditions.allowed-air-rise is not a field written in this basis (write it dotted, as operating-point.air-utilization)',
    );
  });
});
