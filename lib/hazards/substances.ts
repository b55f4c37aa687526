/**
 * Hazard data of substances (data/substances.yaml), parsed and checked at first use: each value
 * with the full citation of its source and whether it is quoted from memory. The one derived
 * quantities are the lowest recorded autoignition temperature, which the indicators use (the spread
 * between sources reflects the test apparatus; the lowest is the safer screen), and the
 * temperature class that follows from it (temperature-class.ts).
 */
import { readDataFile } from '../core/data-file.ts';
import { z } from 'zod';
import { temperatureClassBelow } from './temperature-class.ts';
import { EXPOSURE_LIMITS, type ExposureLimit, type LimitPair, type SourcedValue, type SubstanceData, type SubstanceRow } from './types.ts';

const Sourced = z.strictObject({ value: z.number(), source: z.string(), memory: z.boolean() });
const SourcedText = z.strictObject({ value: z.string(), source: z.string(), memory: z.boolean() });
const Note = z.strictObject({ text: z.string(), source: z.string(), memory: z.boolean() });
const RawLimitPair = z.strictObject({
  lfl_percent: z.number(),
  ufl_percent: z.number().optional(),
  source: z.string(),
  memory: z.boolean(),
});

const RawSubstance = z.strictObject({
  key: z.string().regex(/^[a-z0-9]+$/),
  name: z.string(),
  cas: z.string(),
  formsOnly: z.boolean().optional(),
  oxidant: z.boolean().optional(),
  lfl_percent: Sourced.optional(),
  ufl_percent: Sourced.optional(),
  alsoPublished: z.array(RawLimitPair).optional(),
  inOxygen: RawLimitPair.optional(),
  autoignition_C: z.array(Sourced).optional(),
  minimumIgnitionEnergy_mJ: z.array(Sourced).optional(),
  limitingOxygen_percent: Sourced.optional(),
  gasGroup: SourcedText.optional(),
  exposure_ppm: z.partialRecord(z.enum(EXPOSURE_LIMITS), Sourced).optional(),
  carcinogen: SourcedText.optional(),
  inAir_percent: Sourced.optional(),
  enrichedAbove_percent: Sourced.optional(),
  notes: z.array(Note),
});

const Source = z.strictObject({ short: z.string(), citation: z.string() });

type Source = z.infer<typeof Source>;

const RawFile = z.strictObject({
  sources: z.record(z.string(), Source),
  nonHazardous: z.array(z.string()),
  substances: z.record(z.string(), RawSubstance),
});

type Raw = z.infer<typeof RawSubstance>;

/** One substance of the hazard data, sources resolved to short names and full citations. */
export type Substance = SubstanceData;

interface HazardData {
  substances: Map<string, Substance>;
  nonHazardous: Set<string>;
  sources: Map<string, Source>;
}

let cache: HazardData | undefined;

function sourceOf(sources: Map<string, Source>, id: string, where: string): { source: string; citation: string } {
  const found = sources.get(id);
  if (found === undefined) throw new Error(`lib/hazards/data/substances.yaml: ${where} cites unknown source "${id}"`);
  return { source: found.short, citation: found.citation };
}

function build(label: string, raw: Raw, sources: Map<string, Source>): SubstanceData {
  const cite = <T>(v: { value: T; source: string; memory: boolean }, field: string): SourcedValue<T> => ({
    value: v.value,
    ...sourceOf(sources, v.source, `${label}.${field}`),
    memory: v.memory,
  });
  const pair = (p: z.infer<typeof RawLimitPair>, field: string): LimitPair => ({
    lfl_percent: p.lfl_percent,
    ufl_percent: p.ufl_percent ?? null,
    ...sourceOf(sources, p.source, `${label}.${field}`),
    memory: p.memory,
  });
  const autoignition = (raw.autoignition_C ?? []).map((v) => cite(v, 'autoignition_C'));
  const lowest = autoignition.reduce<SourcedValue | null>((low, v) => (low === null || v.value < low.value ? v : low), null);
  const exposure: Partial<Record<ExposureLimit, SourcedValue>> = {};
  for (const limit of EXPOSURE_LIMITS) {
    const v = raw.exposure_ppm?.[limit];
    if (v) exposure[limit] = cite(v, `exposure_ppm.${limit}`);
  }
  const optional = <T>(v: { value: T; source: string; memory: boolean } | undefined, field: string) => (v ? cite(v, field) : null);
  if (raw.ufl_percent && raw.lfl_percent && raw.ufl_percent.value < raw.lfl_percent.value) {
    throw new Error(`lib/hazards/data/substances.yaml: ${label} has UFL below LFL`);
  }
  return {
    species: label,
    key: raw.key,
    name: raw.name,
    cas: raw.cas,
    formsOnly: raw.formsOnly ?? false,
    oxidant: raw.oxidant ?? false,
    combustible: raw.lfl_percent !== undefined,
    lfl_percent: optional(raw.lfl_percent, 'lfl_percent'),
    ufl_percent: optional(raw.ufl_percent, 'ufl_percent'),
    alsoPublished: (raw.alsoPublished ?? []).map((p) => pair(p, 'alsoPublished')),
    inOxygen: raw.inOxygen ? pair(raw.inOxygen, 'inOxygen') : null,
    autoignition_C: autoignition,
    lowestAutoignition_C: lowest,
    minimumIgnitionEnergy_mJ: (raw.minimumIgnitionEnergy_mJ ?? []).map((v) => cite(v, 'minimumIgnitionEnergy_mJ')),
    limitingOxygen_percent: optional(raw.limitingOxygen_percent, 'limitingOxygen_percent'),
    gasGroup: optional(raw.gasGroup, 'gasGroup'),
    temperatureClass: lowest ? temperatureClassBelow(lowest.value) : null,
    exposure_ppm: exposure,
    carcinogen: optional(raw.carcinogen, 'carcinogen'),
    inAir_percent: optional(raw.inAir_percent, 'inAir_percent'),
    enrichedAbove_percent: optional(raw.enrichedAbove_percent, 'enrichedAbove_percent'),
    notes: raw.notes.map((n) => cite({ value: n.text, source: n.source, memory: n.memory }, 'notes')),
  };
}

function load(): HazardData {
  const raw = readDataFile(new URL('./data/substances.yaml', import.meta.url), RawFile);
  const sources = new Map(Object.entries(raw.sources));
  const substances = new Map(Object.entries(raw.substances).map(([label, s]) => [label, build(label, s, sources)]));
  const keys = new Set<string>();
  for (const s of substances.values()) {
    if (keys.has(s.key)) throw new Error(`lib/hazards/data/substances.yaml: key "${s.key}" is used twice`);
    keys.add(s.key);
  }
  return { substances, nonHazardous: new Set(raw.nonHazardous), sources };
}

function data(): HazardData {
  cache ??= load();
  return cache;
}

/** Every substance of the hazard data, in file order. */
export function allSubstances(): Substance[] {
  return [...data().substances.values()];
}

/** The hazard entry of a species label, or undefined where there is none. */
export function findSubstance(label: string): Substance | undefined {
  return data().substances.get(label);
}

export function substance(label: string): Substance {
  const s = findSubstance(label);
  if (!s) throw new Error(`no hazard data for "${label}"`);
  return s;
}

export function substanceByKey(key: string): Substance | undefined {
  return allSubstances().find((s) => s.key === key);
}

/** Species that need no hazard entry (they neither burn nor have a limit of concern here). */
export function isNonHazardous(label: string): boolean {
  return data().nonHazardous.has(label);
}

/** The substance as a row of the assessment's substance table. */
export function substanceRow(s: Substance, presence: SubstanceRow['presence']): SubstanceRow {
  return { ...s, presence };
}
