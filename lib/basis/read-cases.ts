/**
 * `cases:`: operating cases, each the base basis with its overrides. A case's overrides are
 * written exactly as the base values they replace (the schema of `overrides` is that of
 * conditions, streams and operating-point with every key optional), so each case is read as a
 * basis of its own: the base data with the case's keys put in (a key replaces the base value
 * whole, and the base value it excludes: cell-voltage or area-specific-resistance, and so on),
 * checked by the same schema and the same physics checks. Its problems are reported at the
 * override that causes them; a problem at a value the case does not override is reported at the
 * case, naming that value; a problem the base basis has too is reported once, at the base.
 *
 * The rules of cases themselves:
 *   - at most one case is marked `sizing: true`; it fixes the hardware and may change anything,
 *     its cell count and active area included; without one, the base values are the sizing case
 *     (listed first, with the id "base", which no case may then take);
 *   - every other case runs on that hardware: it may not change the cell count or the active
 *     area, nor the temperature sweep (the charts show the sizing case), and it states its load
 *     by one of current-density, target-power or target-hydrogen (none: the base current density);
 *   - no two cases stand for the same operating point (the same values and load), and a case
 *     that is not the sizing case changes something when the base values are the sizing case.
 */
import { Findings, pathText, type Finding, type Path } from './diagnostics.ts';
import { Reader, type PlacedInput } from './reader.ts';
import { schemaFindings } from './zod-findings.ts';
import { interpret, type InterpretedBasis } from './interpret.ts';
import type { CaseLoad, CaseOverride, DesignBasis, Diagnostic, InputRecord, OperatingCase } from './types.ts';

/** The id of the base values when they are the sizing case (no case is marked sizing). */
const BASE_CASE_ID = 'base';

/** The sections a case overrides, and how deep a key lies in each (streams: electrode, then key). */
const SECTIONS = ['conditions', 'streams', 'operating-point'] as const;

/** Keys that exclude each other in a basis: a case giving one replaces the base's other. */
const EXCLUSIVE: readonly (readonly string[])[] = [
  ['operating-point.cell-voltage', 'operating-point.area-specific-resistance'],
  ['operating-point.air-utilization', 'operating-point.air-ratio'],
  ['operating-point.target-power', 'operating-point.target-hydrogen'],
  ['streams.fuel-electrode.steam-to-carbon', 'streams.fuel-electrode.steam-per-mole-fuel'],
];

/** The hardware the sizing case fixes, which no other case may change, with what the message calls it. */
const HARDWARE: Record<string, string> = {
  'operating-point.cells': 'the cell count',
  'operating-point.active-area': 'the active area of a cell',
};

const LOADS = ['operating-point.current-density', 'operating-point.target-power', 'operating-point.target-hydrogen'] as const;

type Data = Record<string, unknown>;

function isMapping(value: unknown): value is Data {
  return value !== null && typeof value === 'object' && !Array.isArray(value);
}

/** A case as read, before the loader places its inputs in the file. */
export interface CaseDraft {
  id: string;
  title: string;
  purpose: string;
  sizing: boolean;
  load: CaseLoad;
  overridden: string[];
  /** The overrides as written (plain data). */
  written: Data;
  interpreted: InterpretedBasis;
  /** Every input of the case's basis, its `at` the path in the file (the override, or the base value). */
  inputs: PlacedInput[];
  /** The case's own findings (warnings), at their paths in the file. */
  warnings: Finding[];
}

/** The keys a case's overrides give, as base paths: [['conditions', 'operating-temperature'], ['streams', 'fuel-electrode', 'steam-to-carbon'], ...]. */
function overriddenKeys(overrides: Data): string[][] {
  const out: string[][] = [];
  for (const section of SECTIONS) {
    const part = overrides[section];
    if (!isMapping(part)) continue;
    if (section === 'streams') {
      for (const [electrode, stream] of Object.entries(part)) if (isMapping(stream)) for (const key of Object.keys(stream)) out.push([section, electrode, key]);
    } else {
      for (const key of Object.keys(part)) out.push([section, key]);
    }
  }
  return out;
}

/** The base data with the case's keys put in, each replacing the base value whole (and its excluded partner). */
function merged(base: Data, overrides: Data, keys: string[][]): Data {
  const out = structuredClone(base);
  delete out.cases;
  for (const key of keys) {
    let target = out;
    let source: unknown = overrides;
    for (const segment of key.slice(0, -1)) {
      if (!isMapping(target[segment])) target[segment] = {};
      target = target[segment] as Data;
      source = (source as Data)[segment];
    }
    const last = key[key.length - 1]!;
    const dotted = key.join('.');
    for (const group of EXCLUSIVE) {
      if (!group.includes(dotted)) continue;
      for (const other of group) if (other !== dotted) delete target[other.split('.').pop()!];
    }
    target[last] = structuredClone((source as Data)[last]);
  }
  return out;
}

function startsWith(path: Path, prefix: readonly (string | number)[]): boolean {
  return prefix.length <= path.length && prefix.every((s, i) => String(s) === String(path[i]));
}

/** Where a finding of the case's basis stands in the file: under the override that causes it, else at the case. */
function placed(finding: Finding, id: string, keys: string[][]): Finding {
  const at = ['cases', id, 'overrides'];
  if (keys.some((k) => startsWith(finding.at, k) || startsWith(k, finding.at))) return { ...finding, at: [...at, ...finding.at] };
  return { ...finding, at: keys.length ? at : ['cases', id], target: 'key', message: `in this case, ${pathText(finding.at)}: ${finding.message}` };
}

/** Mixture names that the cases' overrides give as a feed composition (the base need not use them). */
export function mixturesNamedByCases(data: unknown): Set<string> {
  const names = new Set<string>();
  const cases = isMapping(data) ? data.cases : undefined;
  if (!isMapping(cases)) return names;
  for (const item of Object.values(cases)) {
    const streams = isMapping(item) && isMapping(item.overrides) ? item.overrides.streams : undefined;
    if (!isMapping(streams)) continue;
    for (const stream of Object.values(streams)) if (isMapping(stream) && typeof stream.composition === 'string') names.add(stream.composition);
  }
  return names;
}

/** The rules of a case that is not the sizing case: no hardware, no sweep, one load. */
function checkRunningCase(findings: Findings, id: string, keys: string[][], sizingId: string): void {
  const at = (key: string[]) => ['cases', id, 'overrides', ...key];
  const sizing = sizingId === BASE_CASE_ID ? 'the base values (the sizing case, as no case is marked sizing: true)' : `the sizing case ${sizingId}`;
  for (const key of keys) {
    const dotted = key.join('.');
    if (HARDWARE[dotted]) {
      findings.error(at(key), `${HARDWARE[dotted]} is hardware, fixed by ${sizing}: this case runs on it; state its load by current-density, target-power or target-hydrogen, or mark it sizing: true`, 'key');
    }
    if (dotted === 'conditions.temperature-sweep') {
      findings.error(at(key), `the temperature sweep sets the charts, which show ${sizing}; a case has no charts of its own`, 'key');
    }
  }
  const loads = keys.filter((k) => (LOADS as readonly string[]).includes(k.join('.')));
  if (loads.length > 1) {
    findings.error(
      at(loads[1]!),
      `a case runs at one load on the cells of ${sizing}: give ${loads.map((k) => k[k.length - 1]).join(' or ')}, not both`,
      'key',
    );
  }
}

function loadOf(sizing: boolean, keys: string[][]): CaseLoad {
  if (sizing) return 'sizing';
  const given = keys.map((k) => k.join('.'));
  if (given.includes('operating-point.target-power')) return 'target-power';
  if (given.includes('operating-point.target-hydrogen')) return 'target-hydrogen';
  return 'current-density';
}

/**
 * What makes two cases the same operating point: their values in SI and how they state their
 * load (the sizing case runs at its current density; the size of the stack is not part of a
 * point, a target is).
 */
function signature(interpreted: InterpretedBasis, load: CaseLoad): string {
  const { conditions, fuelElectrode, airElectrode } = interpreted;
  const { size, statedCells: _cells, ...point } = interpreted.operatingPoint;
  const target = load === 'target-power' || load === 'target-hydrogen' ? size : null;
  return JSON.stringify({ conditions, fuelElectrode, airElectrode, point, load: load === 'sizing' ? 'current-density' : load, target });
}

/**
 * Reads the cases of the basis data, adding their problems to `findings` (at their place in the
 * file). `flagged` are the paths the schema found wrong: a case with one is not read further.
 * `base` is the base basis as interpreted, undefined when it could not be read.
 */
export function readCases(data: unknown, flagged: readonly Path[], findings: Findings, base: InterpretedBasis | undefined): CaseDraft[] {
  const cases = isMapping(data) ? data.cases : undefined;
  if (!isMapping(cases)) return [];
  const entries = Object.entries(cases).filter(([, item]) => isMapping(item)) as [string, Data][];
  const marked = entries.filter(([, item]) => item.sizing === true).map(([id]) => id);
  for (const id of marked.slice(1)) {
    findings.error(['cases', id, 'sizing'], `case ${id} is marked sizing, but case ${marked[0]} already is: one case fixes the hardware`);
  }
  const sizingId = marked[0] ?? BASE_CASE_ID;
  if (!marked.length && Object.hasOwn(cases, BASE_CASE_ID)) {
    findings.error(['cases', BASE_CASE_ID], `the id ${BASE_CASE_ID} names the base values, which are the sizing case when no case is marked sizing: true; rename this case or mark one sizing`, 'key');
  }
  const own = new Set(findings.list.map((f) => `${f.severity} ${pathText(f.at)} ${f.message}`));
  const drafts: CaseDraft[] = [];
  for (const [id, item] of entries) {
    const sizing = id === sizingId;
    const overrides = isMapping(item.overrides) ? item.overrides : {};
    const keys = overriddenKeys(overrides);
    const before = findings.list.length;
    if (!sizing) checkRunningCase(findings, id, keys, sizingId);
    // A case refused for its hardware or its loads is not compared with the others: it would be the same point as the one it was refused for.
    if (findings.list.length > before || flagged.some((f) => startsWith(f, ['cases', id]))) continue;
    const caseFindings = new Findings();
    const mergedData = merged(data as Data, overrides, keys);
    const reader = new Reader(mergedData, schemaFindings(mergedData, caseFindings), caseFindings);
    const interpreted = interpret(reader, { quietMixtures: true });
    const placedFindings = caseFindings.list.filter((f) => !own.has(`${f.severity} ${pathText(f.at)} ${f.message}`)).map((f) => placed(f, id, keys));
    for (const f of placedFindings) findings.list.push(f);
    if (!interpreted || placedFindings.some((f) => f.severity === 'error')) continue;
    const inputs = reader.inputs.map((input) => (keys.some((k) => startsWith(input.at, k)) ? { ...input, at: ['cases', id, 'overrides', ...input.at] } : input));
    const title = typeof item.title === 'string' ? item.title : id;
    const purpose = typeof item.purpose === 'string' ? item.purpose : '';
    drafts.push({ id, title, purpose, sizing, load: loadOf(sizing, keys), overridden: keys.map((k) => k.join('.')), written: overrides, interpreted, inputs, warnings: placedFindings });
  }
  sameOperatingPoints(findings, drafts, marked.length ? undefined : base);
  return drafts;
}

/** Two cases that stand for the same operating point, and a running case that repeats the base values when they are the sizing case. */
function sameOperatingPoints(findings: Findings, drafts: CaseDraft[], baseSizing: InterpretedBasis | undefined): void {
  const seen = new Map<string, string>();
  if (baseSizing) seen.set(signature(baseSizing, 'sizing'), BASE_CASE_ID);
  for (const draft of drafts) {
    const key = signature(draft.interpreted, draft.load);
    const first = seen.get(key);
    if (first === undefined) {
      seen.set(key, draft.id);
      continue;
    }
    findings.error(
      ['cases', draft.id],
      first === BASE_CASE_ID
        ? `case ${draft.id} ${draft.overridden.length ? 'changes nothing that matters' : 'overrides nothing'}: it is the base values, which are the sizing case (no case is marked sizing: true); mark it sizing: true, or give what differs`
        : `case ${draft.id} stands for the same operating point as case ${first} (the same values and load): give what differs, or keep one of them`,
      'key',
    );
  }
}

/**
 * Every value a case's overrides write, in the order written: a value with its unit by its
 * inputs-table record; text (a composition name, what degrades) as written, with the source
 * beside it in its mapping.
 */
function writtenValues(draft: CaseDraft, inputs: readonly InputRecord[], positions: DesignBasis['positions']): CaseOverride[] {
  const out: CaseOverride[] = [];
  const records = new Map(inputs.map((r) => [r.path, r]));
  const leaf = (path: string[], text: string, source: string | undefined, sourced: boolean) => {
    const dotted = path.join('.');
    const at = positions[`cases.${draft.id}.overrides.${dotted}${sourced ? '.value' : ''}`] ?? { line: 1, column: 1 };
    const input = records.get(dotted);
    const words = path.slice(-2).join(' ').replace(/-/g, ' ');
    out.push({ path: dotted, label: input?.label ?? words, text, ...(source !== undefined ? { source } : {}), line: at.line, column: at.column, ...(input ? { input } : {}) });
  };
  const walk = (value: unknown, path: string[], source: string | undefined) => {
    if (isMapping(value) && 'value' in value && typeof value.source === 'string' && Object.keys(value).length === 2) {
      leaf(path, String(value.value), value.source, true);
    } else if (isMapping(value)) {
      const shared = typeof value.source === 'string' ? value.source : source;
      for (const [key, item] of Object.entries(value)) if (key !== 'source') walk(item, [...path, key], shared);
    } else if (value !== null && value !== undefined) {
      leaf(path, String(value), source, false);
    }
  };
  for (const key of draft.overridden) {
    const parts = key.split('.');
    walk(parts.reduce<unknown>((v, k) => (isMapping(v) ? v[k] : undefined), draft.written), parts, undefined);
  }
  return out.sort((a, b) => a.line - b.line || a.column - b.column);
}

/**
 * The cases of a loaded basis: each draft's basis completed as the loader completes the base
 * (inputs placed in the file, warnings, positions of its values), and the base values listed
 * first as the case "base" when they are the sizing case.
 */
export function completeCases(
  drafts: readonly CaseDraft[],
  base: Omit<DesignBasis, 'cases'>,
  place: (input: PlacedInput) => Pick<Diagnostic, 'line' | 'column'>,
  locateWarning: (finding: Finding) => Diagnostic,
): OperatingCase[] {
  if (!drafts.length) return [];
  const cases = drafts.map((draft): OperatingCase => {
    const prefix = `cases.${draft.id}.overrides.`;
    const positions = { ...base.positions };
    for (const [path, at] of Object.entries(base.positions)) if (path.startsWith(prefix)) positions[path.slice(prefix.length)] = at;
    const inputs = draft.inputs
      .map((input) => ({ input, where: place(input) }))
      .sort((a, b) => a.where.line - b.where.line || a.where.column - b.where.column)
      .map(({ input, where }) => ({ ...input.record, line: where.line, column: where.column }));
    return {
      id: draft.id,
      title: draft.title,
      purpose: draft.purpose,
      sizing: draft.sizing,
      load: draft.load,
      overrides: writtenValues(draft, inputs, base.positions),
      overridden: draft.overridden,
      basis: { id: base.id, file: base.file, ...draft.interpreted, inputs, warnings: draft.warnings.map(locateWarning), positions, cases: [] },
    };
  });
  if (cases.some((c) => c.sizing)) return cases;
  const baseCase: OperatingCase = {
    id: BASE_CASE_ID,
    title: 'Base values',
    purpose: 'The values of the basis as written; no case is marked sizing, so they fix the hardware.',
    sizing: true,
    load: 'sizing',
    overrides: [],
    overridden: [],
    basis: { ...base, cases: [] },
  };
  return [baseCase, ...cases];
}
