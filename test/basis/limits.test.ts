// Every number of a design basis is bounded, by a limit of lib/basis/data/limits.yaml or by a rule
// of physics (lib/basis/limits.ts, FIELDS), and a value at the edge or far beyond is a located
// error, never an internal error nor a result computed from lost digits:
//   - every number of the schema (walked from the JSON Schema the loader's schema generates) has
//     its entry in FIELDS, and FIELDS names nothing else;
//   - for each limit of each field, a value just beyond it (one part in a million) is refused at
//     that field with the limit's message, and the limit itself is not refused;
//   - for every field, the extremes of a double (the smallest denormal, the largest finite number,
//     its negative, 1e20) give exit 1 and a located error, never exit 0 or 3.
// The runs go through the real command (`cellbasis check`), which loads and calculates.
import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseDocument } from 'yaml';
import { designBasisJsonSchema } from '../../lib/basis/json-schema.ts';
import { FIELDS, limit, type LimitedInput } from '../../lib/basis/limits.ts';
import { SI_UNIT, type Dimension } from '../../lib/core/units.ts';
import { run } from '../helpers/run-cli.ts';
import { scaffoldText } from '../helpers/scaffold-basis.ts';

type JsonSchema = { type?: string; $ref?: string; anyOf?: JsonSchema[]; properties?: Record<string, JsonSchema>; additionalProperties?: JsonSchema | boolean; items?: JsonSchema };

/** Whether a schema node is a number: a JSON number, or the text of a quantity with its unit. */
function numeric(node: JsonSchema): boolean {
  return node.type === 'number' || (node.$ref?.endsWith('-text') ?? false) || (node.anyOf?.some(numeric) ?? false);
}

/** The dotted paths of every number of the schema, `*` for names of the user's (mixtures, species). */
function numberPaths(node: JsonSchema, path: string[] = []): string[] {
  if (path.length && numeric(node)) return [path.join('.')];
  const below: string[] = [];
  for (const [key, child] of Object.entries(node.properties ?? {})) below.push(...numberPaths(child, [...path, key]));
  if (typeof node.additionalProperties === 'object') below.push(...numberPaths(node.additionalProperties, [...path, '*']));
  for (const branch of node.anyOf ?? []) below.push(...numberPaths(branch, path));
  if (node.items) below.push(...numberPaths(node.items, [...path, '0']));
  return [...new Set(below)];
}

/** A case's override of a field of the base: `cases.*.overrides.<field>`. */
const CASE = 'cases.*.overrides.';

/** The dimension each field is written in (its SI unit is how the test writes values). */
function dimensionOf(field: string): Dimension {
  if (field.startsWith(CASE)) return dimensionOf(field.slice(CASE.length));
  if (/temperature|dew-point|\.at$|sweep\.(from|to)/.test(field) && !/rise|sensitivity/.test(field)) return 'temperature';
  if (/rise|sensitivity\.temperature/.test(field)) return 'temperature-difference';
  if (/pressure$/.test(field) && /^(conditions|plant)\./.test(field)) return 'pressure';
  if (/minimum-approach$/.test(field)) return 'temperature-difference';
  if (/material-limit$/.test(field)) return 'temperature';
  if (/dc-bus-window/.test(field)) return 'voltage';
  const byKey: Record<string, Dimension> = {
    'cell.crossover-allowance': 'voltage',
    'operating-point.current-density': 'current-density',
    'operating-point.cell-voltage': 'voltage',
    'operating-point.area-specific-resistance': 'area-specific-resistance',
    'operating-point.active-area': 'area',
    'operating-point.target-power': 'power',
    'operating-point.target-hydrogen': 'mass-flow',
    'operating-point.resistance-temperature-law.activation-energy': 'molar-energy',
    'operating-point.degradation.rate': 'degradation-rate',
    'operating-point.degradation.operating-time': 'time',
  };
  return byKey[field] ?? 'fraction';
}

const LOOP = 'streams.air-electrode.cathode-loop.';

/** A carbonate cell's cathode-gas loop in place of the scaffold's cathode gas, for the loop's fields (its burner air humid where a humidity is under test). */
function loopEdits(field: string): Record<string, unknown> {
  if (!field.includes(LOOP)) return {};
  const humid = field.includes('.humidity.');
  const rh = humid && !field.endsWith('dew-point');
  return {
    'streams.air-electrode.composition': undefined,
    [`${LOOP}burner-air.composition`]: humid ? 'humid-air' : 'dry-air',
    ...(humid ? (rh ? { [`${LOOP}burner-air.humidity.relative-humidity`]: '60 %', [`${LOOP}burner-air.humidity.at`]: '25 C' } : { [`${LOOP}burner-air.humidity.dew-point`]: '15 C' }) : {}),
    [`${LOOP}inlet-oxygen`]: '9.4 %',
  };
}

/** The scaffold's technology for a field: the KOH mass fraction belongs to alkaline cells, the cathode-gas loop to carbonate ones. */
function technologyFor(field: string): 'alkaline' | 'molten-carbonate' | 'solid-oxide' {
  return field === 'cell.koh-mass-fraction' ? 'alkaline' : field.includes(LOOP) ? 'molten-carbonate' : 'solid-oxide';
}

/**
 * A valid basis for a case's field: the scaffold with one sizing case (which may change the
 * hardware too) whose override of the key holding the field is that key as the base's test
 * writes it, whole (a case's key replaces the base value whole); the path is the override's.
 */
function caseBaseFor(field: string): { text: (value: string | number) => string; path: string } {
  const base = baseFor(field);
  const keyLength = field.startsWith('streams.') ? 3 : 2;
  const key = base.path.split('.').slice(0, keyLength);
  const electrolysis = /steam-conversion|sweep-ratio|target-hydrogen/.test(field);
  return {
    path: `cases.c.overrides.${base.path}`,
    text: (value) => {
      let held: unknown = parseDocument(base.text(value)).toJS();
      for (const k of key) held = (held as Record<string, unknown>)[k];
      const overrides = {};
      let at: Record<string, unknown> = overrides;
      for (const k of key.slice(0, -1)) at = (at[k] = {}) as Record<string, unknown>;
      at[key[key.length - 1]!] = held;
      return scaffoldText(technologyFor(field), electrolysis ? 'electrolysis' : 'power', 'x', {
        ...loopEdits(field),
        cases: { c: { title: 'Case under test', purpose: 'carries the value under test', sizing: true, overrides } },
      });
    },
  };
}

/** A valid basis for the field, and the path at which to write its value. */
function baseFor(field: string): { text: (value: string | number) => string; path: string } {
  if (field.startsWith(CASE)) return caseBaseFor(field.slice(CASE.length));
  const electrolysis = /steam-conversion|sweep-ratio|target-hydrogen|koh-mass-fraction|hydrogen-compression|recuperator/.test(field);
  const edits: Record<string, unknown> = loopEdits(field);
  let path = field;
  if (field === 'operating-point.air-ratio') edits['operating-point.air-utilization'] = undefined;
  if (field === 'operating-point.area-specific-resistance') edits['operating-point.cell-voltage'] = undefined;
  if (field === 'operating-point.cells') edits['operating-point.target-power'] = undefined;
  if (field === 'streams.fuel-electrode.steam-per-mole-fuel') edits['streams.fuel-electrode.steam-to-carbon'] = undefined;
  if (field.startsWith('operating-point.resistance-temperature-law.')) {
    edits['operating-point.cell-voltage'] = undefined;
    edits['operating-point.area-specific-resistance'] = '0.5 ohm cm2';
    edits['operating-point.resistance-temperature-law.activation-energy'] = '0.8 eV';
    edits['operating-point.resistance-temperature-law.reference-temperature'] = '750 C';
    edits['operating-point.resistance-temperature-law.source'] = 'the value under test';
  }
  if (field.startsWith('operating-point.degradation.')) {
    edits['operating-point.degradation.rate'] = '0.5 %/kh';
    edits['operating-point.degradation.of'] = 'area-specific-resistance';
    edits['operating-point.degradation.operating-time'] = '40000 h';
  }
  if (field.startsWith('streams.air-electrode.humidity.') && !field.endsWith('dew-point')) {
    edits['streams.air-electrode.humidity.dew-point'] = undefined;
    edits['streams.air-electrode.humidity.relative-humidity'] = '60 %';
    edits['streams.air-electrode.humidity.at'] = '25 C';
  }
  /**
   * A block written key by key (the document model sets a mapping given whole as one value, which
   * a later key cannot enter); `replace` removes the scaffold's block first (the scaffold has no plant section).
   */
  const block = (at: string, keys: Record<string, unknown>, replace = false) => {
    if (replace) edits[at] = undefined;
    for (const [key, value] of Object.entries(keys)) edits[`${at}.${key}`] = value;
  };
  if (field === 'streams.fuel-electrode.pre-reforming.inlet-temperature') block('streams.fuel-electrode.pre-reforming', { kind: 'adiabatic', 'inlet-temperature': '520 C' }, true);
  // The plant's blocks with what each requires besides the value under test.
  if (field.startsWith('plant.electrical.dc-bus-window.')) block('plant.electrical.dc-bus-window', { from: '600 V', to: '800 V' });
  if (field.startsWith('plant.anode-recycle.')) block('plant.anode-recycle', { ratio: 0.6 });
  if (field.startsWith('plant.off-gas-oxidiser.') || field.startsWith('plant.heat-recovery.')) {
    const fresh = field.endsWith('air-ratio');
    block('plant.off-gas-oxidiser', { oxidant: fresh ? 'fresh-air' : 'air-electrode-exhaust', ...(fresh ? { 'air-ratio': 1.5 } : {}), 'material-limit': '950 C' });
  }
  if (field.startsWith('plant.heat-recovery.')) block('plant.heat-recovery', { 'exhaust-exit-temperature': '90 C' });
  if (field.startsWith('plant.air-blower.')) {
    edits['conditions.air-electrode-pressure'] = '3 bar';
    block('plant.air-blower', { 'isentropic-efficiency': 0.7 });
  }
  if (field.startsWith('plant.hydrogen-compression.')) block('plant.hydrogen-compression', { 'delivery-pressure': '30 bar', stages: 2, 'isentropic-efficiency': 0.75 });
  if (field === 'mixtures.*.composition.*') path = 'mixtures.site-natural-gas.composition.N2';
  // An inline composition is written whole, the value in it (the YAML document model sets a mapping as one value).
  const inline: Record<string, [composition: string, fixed: Record<string, number>, species: string]> = {
    'streams.fuel-electrode.composition.*': ['streams.fuel-electrode.composition', { CH4: 0.99 }, 'N2'],
    'streams.air-electrode.composition.*': ['streams.air-electrode.composition', { O2: 0.21, N2: 0.78 }, 'Ar'],
    [`${LOOP}burner-air.composition.*`]: [`${LOOP}burner-air.composition`, { O2: 0.21, N2: 0.78 }, 'Ar'],
  };
  if (field === 'streams.fuel-electrode.composition.*') edits['mixtures'] = undefined;
  if (field === 'streams.air-electrode.composition.*') edits['streams.air-electrode.humidity'] = undefined;
  const dimension = dimensionOf(field);
  const unit = dimension === 'fraction' ? '' : SI_UNIT[dimension];
  const written = (value: string | number) => (unit ? `${value} ${unit}` : Number(value));
  const composition = inline[field];
  if (composition) {
    const [at, fixed, species] = composition;
    return { path: `${at}.${species}`, text: (value) => scaffoldText(technologyFor(field), 'power', 'x', { ...edits, [at]: { ...fixed, [species]: written(value) } }) };
  }
  return {
    path,
    text: (value) => scaffoldText(technologyFor(field), electrolysis ? 'electrolysis' : 'power', 'x', { ...edits, [path]: written(value) }),
  };
}

async function check(text: string): Promise<{ code: number; err: string }> {
  const root = mkdtempSync(join(tmpdir(), 'cellbasis-limits-'));
  mkdirSync(join(root, 'projects', 'x'), { recursive: true });
  writeFileSync(join(root, 'projects', 'x', 'basis.yaml'), text);
  const r = await run(['check', 'x'], root);
  return { code: r.code, err: r.err };
}

const LIMITED = Object.entries(FIELDS).filter((entry): entry is [string, LimitedInput] => !['species-data', 'liquid-water-data', 'unit-interval', 'inverse-of-air-ratio', 'koh-correlation'].includes(entry[1]));

describe('limits on every number of a basis', () => {
  it('every number of the schema has a limit or a rule of physics in FIELDS, and FIELDS names only numbers of the schema', () => {
    const numbers = numberPaths(designBasisJsonSchema() as JsonSchema).sort();
    expect(numbers.length).toBeGreaterThan(30);
    expect(Object.keys(FIELDS).sort()).toEqual(numbers);
  });

  const edges = LIMITED.flatMap(([field, input]) => {
    const { fromSI, toSI } = limit(input);
    return [
      ...(fromSI !== undefined ? [[field, 'below', fromSI, input] as const] : []),
      ...(toSI !== undefined ? [[field, 'above', toSI, input] as const] : []),
    ];
  });

  it.each(edges)('%s: a value just %s its limit %s is refused there, the limit itself is not', async (field, side, edge) => {
    const { text, path } = baseFor(field);
    // One part in a million beyond the limit: well clear of the rounding of its conversion to SI
    // (a limit of zero, one millionth of the SI unit below it).
    const beyond = edge === 0 ? (side === 'below' ? -1e-6 : 1e-6) : side === 'below' ? edge * (1 - 1e-6) : edge * (1 + 1e-6);
    const refused = await check(text(beyond));
    expect(refused.code, refused.err).toBe(1);
    // Refused at the field: by the limit, or by a rule of physics that holds there first (a cell count below 1 is no whole number).
    expect(refused.err).toMatch(new RegExp(`^projects/x/basis\\.yaml:\\d+:\\d+: ${path.replace(/\./g, '\\.')}(\\.value)?: `, 'm'));
    const atLimit = await check(text(edge));
    expect(atLimit.err, 'the limit itself is accepted').not.toMatch(new RegExp(`: ${path.replace(/\./g, '\\.')}(\\.value)?: the [^:]* is (below|above) `));
    expect(atLimit.code).not.toBe(3);
  });

  /** Fields checked as a pair, where an error may stand at the other one. */
  const PARTNERS: Record<string, string> = { 'conditions.temperature-sweep.from': 'conditions.temperature-sweep.to', 'conditions.temperature-sweep.to': 'conditions.temperature-sweep.from' };
  const EXTREMES = [5e-324, 1e20, 1.7976931348623157e308, -1.7976931348623157e308];

  it.each(Object.keys(FIELDS))('%s: the extremes of a double give a located error, never exit 0 or 3', async (field) => {
    const { text, path } = baseFor(field);
    for (const value of EXTREMES) {
      const r = await check(text(value));
      const shown = `${field} = ${value}: ${r.err}`;
      expect(r.err, shown).not.toMatch(/internal error/);
      // The smallest denormal is zero in all but name: where zero is a valid value (no crossover, no steam, no parasitic load) it is accepted as such.
      if (value === 5e-324 && r.code === 0) continue;
      expect(r.code, shown).toBe(1);
      expect(r.err, shown).toMatch(/^projects\/x\/basis\.yaml:\d+:\d+: /m);
      // The error stands at the field (or at the other end of the pair it belongs to), unless the denormal is harmless there and another input refuses the basis.
      const own = field.startsWith(CASE) ? field.slice(CASE.length) : field;
      const partner = PARTNERS[own];
      const at = [path, ...(partner ? [path.slice(0, path.length - own.length) + partner] : [])];
      if (!at.some((p) => r.err.includes(`: ${p}`))) expect(value, shown).toBe(5e-324);
    }
  });
});
