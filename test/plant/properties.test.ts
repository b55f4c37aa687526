// Random valid and nearly valid design bases (YAML written from random parameters on the
// scaffold of each technology and mode) through validation and calculation. Each gives either
// results that keep the balances (energy, first law for steady flow: P + Q = Σ_in ṅh − Σ_out ṅh,
// recomputed here from results.streams with the species data; every element in = out) and hold
// no NaN or Infinity anywhere, or located errors (the loader's diagnostics, or a BasisError
// from the calculation). Anything else thrown is a failure.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { parseDocument } from 'yaml';
import { renderScaffold, scaffoldKinds } from '../../lib/basis/scaffolds.ts';
import { loadBasisText } from '../../lib/basis/load.ts';
import { BasisError } from '../../lib/basis/diagnostics.ts';
import { calculate } from '../../lib/plant/calculate.ts';
import type { Results } from '../../lib/plant/results-schema.ts';
import { technology } from '../../lib/electrochem/technologies.ts';
import { allSpecies, getSpecies } from '../../lib/thermo/species-data.ts';
import { enthalpy } from '../../lib/thermo/properties.ts';
import type { Diagnostic } from '../../lib/basis/types.ts';

const KINDS = scaffoldKinds();
const GASES = allSpecies().filter((s) => s.phase === 'gas').map((s) => s.label);
const FUELS = ['H2', 'CH4', 'CO', 'C2H6', 'C3H8', 'NH3', 'CH3OH'];
const DILUENTS = ['H2O', 'CO2', 'N2', 'Ar', 'He'];

/** A mole-fraction mapping over `species`: fractions from the weights, scaled by `sum` (1 unless nearly valid). */
const composition = (pool: readonly string[], sum: fc.Arbitrary<number>) =>
  fc
    .record({
      species: fc.uniqueArray(fc.constantFrom(...pool), { minLength: 1, maxLength: 4 }),
      weights: fc.array(fc.double({ min: 0.01, max: 1, noNaN: true }), { minLength: 4, maxLength: 4 }),
      sum,
    })
    .map(({ species, weights, sum }) => {
      const total = species.reduce((a, _, i) => a + weights[i]!, 0);
      return Object.fromEntries(species.map((s, i) => [s, Number(((weights[i]! / total) * sum).toFixed(6))]));
    });

const ROUND = (x: number, digits = 4) => Number(x.toPrecision(digits));

/** Edits of a scaffold: path → value (undefined deletes). `near` widens every range beyond what is valid. */
function edits(near: boolean) {
  const sum = near ? fc.oneof(fc.constant(1), fc.double({ min: 0.9, max: 1.1, noNaN: true })) : fc.constant(1);
  return fc.record({
    kind: fc.constantFrom(...KINDS),
    temperatureOffsetK: near ? fc.double({ min: -400, max: 400, noNaN: true }) : fc.double({ min: -0.45, max: 0.45, noNaN: true }),
    fuelPressureBar: fc.double({ min: near ? -0.5 : 0.8, max: near ? 60 : 10, noNaN: true }),
    airPressureBar: fc.double({ min: near ? -0.5 : 0.8, max: near ? 60 : 10, noNaN: true }),
    fuel: fc.option(composition(near ? GASES : [...FUELS, ...DILUENTS.slice(0, 2)], sum), { nil: undefined }),
    steamToCarbon: fc.double({ min: near ? -1 : 1.5, max: 4, noNaN: true }),
    utilization: fc.double({ min: near ? -0.1 : 0.3, max: near ? 1.1 : 0.9, noNaN: true }),
    currentDensityAPerCm2: fc.double({ min: near ? -0.1 : 0.05, max: near ? 5 : 1, noNaN: true }),
    voltage: fc.oneof(
      fc.record({ kind: fc.constant('cell-voltage' as const), value: fc.double({ min: near ? 0 : 0.4, max: near ? 2.5 : 1.6, noNaN: true }) }),
      fc.record({ kind: fc.constant('area-specific-resistance' as const), value: fc.double({ min: near ? 0 : 0.05, max: near ? 5 : 0.6, noNaN: true }) }),
    ),
    size: fc.oneof(
      fc.record({ kind: fc.constant('cells' as const), value: fc.integer({ min: near ? -2 : 1, max: 5000 }) }),
      fc.record({ kind: fc.constant('target' as const), value: fc.double({ min: near ? -1 : 1, max: 2000, noNaN: true }) }),
    ),
  });
}

type Edits = ReturnType<typeof edits> extends fc.Arbitrary<infer T> ? T : never;

/** Nearly valid: a valid basis with one parameter drawn from the wide ranges. */
const nearlyValid = fc
  .tuple(edits(false), edits(true), fc.constantFrom<keyof Edits>('temperatureOffsetK', 'fuelPressureBar', 'airPressureBar', 'fuel', 'steamToCarbon', 'utilization', 'currentDensityAPerCm2', 'voltage', 'size'))
  .map(([valid, wide, field]) => ({ ...valid, kind: valid.kind, [field]: wide[field] }) as Edits);

/** The scaffold of the kind with the edits applied, as YAML text. */
function basisText(e: Edits): string {
  const { technology: techId, mode } = e.kind;
  const tech = technology(techId);
  const doc = parseDocument(renderScaffold(techId, mode, 'prop', '2026-11-30'));
  const set = (path: string, value: unknown) => doc.setIn(path.split('.'), value);
  const drop = (path: string) => doc.deleteIn(path.split('.'));
  // Within the typical range (offset as a fraction of it), or near it by kelvins.
  const span = tech.typicalToK - tech.typicalFromK;
  const t = Math.abs(e.temperatureOffsetK) < 1 ? (tech.typicalFromK + tech.typicalToK) / 2 + e.temperatureOffsetK * span : tech.typicalToK + e.temperatureOffsetK;
  set('conditions.operating-temperature', `${ROUND(t, 5)} K`);
  for (const key of ['temperature-sweep', 'fuel-inlet-temperature', 'air-inlet-temperature']) drop(`conditions.${key}`);
  set('conditions.fuel-electrode-pressure', `${ROUND(e.fuelPressureBar)} bar`);
  set('conditions.air-electrode-pressure', `${ROUND(e.airPressureBar)} bar`);
  const hasFuelFeed = mode === 'power' && doc.hasIn(['streams', 'fuel-electrode']);
  if (hasFuelFeed && e.fuel) {
    set('streams.fuel-electrode.composition', e.fuel);
    const carbon = Object.keys(e.fuel).some((s) => s !== 'CO2' && (getSpecies(s).formula.C ?? 0) > 0);
    drop('streams.fuel-electrode.steam-to-carbon');
    drop('streams.fuel-electrode.steam-per-mole-fuel');
    drop('streams.fuel-electrode.pre-reforming');
    if (carbon && tech.ion !== 'proton') set('streams.fuel-electrode.steam-to-carbon', ROUND(e.steamToCarbon, 3));
  }
  set(`operating-point.${mode === 'power' ? 'fuel-utilization' : 'steam-conversion'}`, ROUND(e.utilization, 3));
  set('operating-point.current-density', `${ROUND(e.currentDensityAPerCm2)} A/cm2`);
  drop('operating-point.cell-voltage');
  drop('operating-point.area-specific-resistance');
  set(`operating-point.${e.voltage.kind}`, e.voltage.kind === 'cell-voltage' ? `${ROUND(e.voltage.value)} V` : `${ROUND(e.voltage.value)} ohm cm2`);
  for (const key of ['cells', 'target-power', 'target-hydrogen']) drop(`operating-point.${key}`);
  if (e.size.kind === 'cells') set('operating-point.cells', e.size.value);
  else set('operating-point.target-power', `${ROUND(e.size.value)} kW`);
  return doc.toString();
}

/** Every number in the value, with its path, that is NaN or infinite. */
function nonFinite(value: unknown, path = 'results'): string[] {
  if (typeof value === 'number') return Number.isFinite(value) ? [] : [`${path} = ${value}`];
  if (Array.isArray(value)) return value.flatMap((v, i) => nonFinite(v, `${path}[${i}]`));
  if (value && typeof value === 'object') return Object.entries(value).flatMap(([k, v]) => nonFinite(v, `${path}.${k}`));
  return [];
}

const INLETS = ['fuel-inlet', 'air-inlet'];
const OUTLETS = ['fuel-outlet', 'air-outlet'];

/** Σ ṅ h over the streams of the ids, each at `temperatureK` or its own temperature, W (species data, heats of formation included). */
function enthalpyFlow(results: Results, ids: string[], temperatureK?: number): number {
  let sum = 0;
  for (const s of results.streams.filter((st) => ids.includes(st.id))) {
    for (const [label, flow] of Object.entries(s.speciesFlows_mol_per_s)) sum += flow * enthalpy(getSpecies(label), temperatureK ?? s.temperature_K);
  }
  return sum;
}

/** Moles of each element per second over the streams of the ids. */
function elementFlow(results: Results, ids: string[]): Record<string, number> {
  const out: Record<string, number> = {};
  for (const s of results.streams.filter((st) => ids.includes(st.id))) {
    for (const [label, flow] of Object.entries(s.speciesFlows_mol_per_s)) {
      for (const [element, count] of Object.entries(getSpecies(label).formula)) out[element] = (out[element] ?? 0) + flow * count;
    }
  }
  return out;
}

function expectLocated(diagnostics: Diagnostic[], text: string): void {
  expect(diagnostics.length).toBeGreaterThan(0);
  const lineCount = text.split('\n').length;
  for (const d of diagnostics) {
    expect(d.line).toBeGreaterThanOrEqual(1);
    expect(d.line).toBeLessThanOrEqual(lineCount);
    expect(d.column).toBeGreaterThanOrEqual(1);
    expect(d.message).toMatch(/\S/);
    expect(d.message).not.toMatch(/undefined|NaN|\[object Object\]/);
  }
}

/** Checks one basis; returns what it gave. */
function check(text: string): 'results' | 'invalid' | 'refused by the calculation' {
  const loaded = loadBasisText(text, 'projects/prop/basis.yaml', 'prop');
  if (!loaded.ok) {
    expectLocated(loaded.errors, text);
    return 'invalid';
  }
  let results: Results;
  try {
    results = calculate(loaded.basis);
  } catch (error) {
    if (!(error instanceof BasisError)) throw error;
    expectLocated(error.errors, text);
    return 'refused by the calculation';
  }
  expect(nonFinite(results)).toEqual([]);
  const power = results.headline.stackPower_W;
  const work = results.technology.mode === 'power' ? -power : power;
  // First law, steady flow, every stream at the stack temperature: Q = Σ_in ṅh(T) − Σ_out ṅh(T) + W_in.
  const hIn = enthalpyFlow(results, INLETS, results.conditions.temperature_K);
  const hOut = enthalpyFlow(results, OUTLETS);
  const scale = Math.max(Math.abs(hIn), Math.abs(hOut), Math.abs(power));
  expect(Math.abs(results.heat.isothermalHeat_W - (hIn - hOut + work)) / scale).toBeLessThan(1e-9);
  // The same with the inlets at their own temperatures.
  const hInFed = enthalpyFlow(results, INLETS);
  expect(Math.abs(results.heat.asFedHeat_W - (hInFed - hOut + work)) / scale).toBeLessThan(1e-9);
  // Conservation of each element through the stack.
  const elementsIn = elementFlow(results, INLETS);
  const elementsOut = elementFlow(results, OUTLETS);
  for (const element of new Set([...Object.keys(elementsIn), ...Object.keys(elementsOut)])) {
    const a = elementsIn[element] ?? 0;
    const b = elementsOut[element] ?? 0;
    expect(Math.abs(a - b) / Math.max(Math.abs(a), Math.abs(b)), `element ${element}`).toBeLessThan(1e-9);
  }
  return 'results';
}

describe('random design bases', () => {
  it.each([
    ['valid', false, 150],
    ['nearly valid', true, 300],
  ] as const)('%s bases give balanced, finite results or located errors, never another exception', (_kind, near, numRuns) => {
    const seen: Record<string, number> = {};
    fc.assert(
      fc.property(near ? nearlyValid : edits(false), (e) => {
        const text = basisText(e);
        const outcome = check(text);
        seen[outcome] = (seen[outcome] ?? 0) + 1;
      }),
      { numRuns },
    );
    // Not vacuous: a good share of the runs computed results.
    expect(seen.results ?? 0, JSON.stringify(seen)).toBeGreaterThan(numRuns * (near ? 0.1 : 0.3));
  });
});
