/**
 * The conditions of the caution rules (data/rules.yaml names them by id): small named predicates
 * on the basis and the stream indicators. Each returns null when its condition does not hold, or
 * the streams that triggered it and the formatted values its rule's text can name: `values` for
 * the whole caution and `each`, one set per triggering stream, for the rule's per-stream line.
 * `escalate` is true where the rule's higher severity applies (a concentration at or above the
 * IDLH).
 */
import type { TechnologyId } from '../electrochem/technologies.ts';
import { STANDARD_ATMOSPHERE_PA, PA_PER_BAR } from '../thermo/constants.ts';
import { ZERO_CELSIUS_K } from '../core/units.ts';
import { formatCelsius, formatList, formatNumber as fmt } from './numbers.ts';
import { findSubstance, substance } from './substances.ts';
import { threshold } from './thresholds.ts';
import type { HazardInput, SpeciesShare, StreamIndicators, StreamRole } from './types.ts';

export type Values = Record<string, string | undefined>;

export interface RuleContext {
  input: HazardInput;
  technologyName: string;
  streams: StreamIndicators[];
}

export interface RuleParams {
  substance?: string;
  technology?: TechnologyId;
  /** Only streams of these roles count (e.g. feed: a substance the plant is fed, not a trace an equilibrium forms). */
  roles?: readonly StreamRole[];
}

export interface Match {
  triggeredBy: string[];
  values: Values;
  each: Values[];
  escalate: boolean;
}

export type Predicate = (ctx: RuleContext, params: RuleParams) => Match | null;

const GAS_GROUPS = ['IIA', 'IIB', 'IIC'];
const TEMPERATURE_CLASSES = ['T1', 'T2', 'T3', 'T4', 'T5', 'T6'];

const names = (streams: StreamIndicators[]): string => formatList(streams.map((s) => s.name));

function shareOf(s: StreamIndicators, label: string): SpeciesShare | undefined {
  return s.composition.find((c) => c.species === label);
}

/** A match of the given streams, with the stream names as `streams`. */
function matchOf(streams: StreamIndicators[], each: (s: StreamIndicators) => Values, values: Values = {}, escalate = false): Match | null {
  if (streams.length === 0) return null;
  return { triggeredBy: streams.map((s) => s.id), values: { streams: names(streams), ...values }, each: streams.map(each), escalate };
}

function basisMatch(values: Values): Match {
  return { triggeredBy: [], values, each: [], escalate: false };
}

const substancePresent: Predicate = (ctx, params) => {
  const label = params.substance!;
  const idlh = substance(label).exposure_ppm.idlh?.value;
  const streams = ctx.streams.filter((s) => shareOf(s, label) && (!params.roles || params.roles.includes(s.role)));
  if (streams.length === 0) return null;
  const percent = (s: StreamIndicators) => shareOf(s, label)!.mole_percent;
  const maxPercent = Math.max(...streams.map(percent));
  const maxTimesIdlh = idlh === undefined ? undefined : (maxPercent * 1e4) / idlh;
  const maxPartialPressure = Math.max(...streams.map((s) => (percent(s) / 100) * s.pressure_bar));
  return matchOf(
    streams,
    (s) => ({
      stream: s.name,
      percent: fmt(percent(s)),
      ppm: fmt(percent(s) * 1e4),
      timesIdlh: idlh === undefined ? undefined : fmt((percent(s) * 1e4) / idlh),
      partialPressure_bar: fmt((percent(s) / 100) * s.pressure_bar),
      temperature_C: formatCelsius(s.temperature_K),
    }),
    {
      maxPercent: fmt(maxPercent),
      maxPpm: fmt(maxPercent * 1e4),
      idlhDilution: maxTimesIdlh !== undefined && maxTimesIdlh >= 1 ? fmt(maxTimesIdlh) : undefined,
      maxPartialPressure_bar: fmt(maxPartialPressure),
    },
    maxTimesIdlh !== undefined && maxTimesIdlh >= 1,
  );
};

/** The lowest time-weighted exposure limit recorded for a substance (NIOSH REL, OSHA PEL, ACGIH TLV), ppm. */
function lowestTwa_ppm(label: string): number | undefined {
  const e = substance(label).exposure_ppm;
  const limits = [e.nioshRelTwa, e.oshaPelTwa, e.acgihTlvTwa].filter((l) => l !== undefined).map((l) => l.value);
  return limits.length ? Math.min(...limits) : undefined;
}

/**
 * The substance in streams at or above its lowest time-weighted exposure limit. For a gas that
 * ambient air carries itself (CO2), presence alone would raise the caution for every air stream:
 * a stream below the limit cannot by leaking bring a room above it, so such streams do not count.
 */
const substanceAtExposureLimit: Predicate = (ctx, params) => {
  const label = params.substance!;
  const limit = lowestTwa_ppm(label);
  if (limit === undefined) return null;
  const streams = ctx.streams.filter((s) => (shareOf(s, label)?.mole_percent ?? 0) * 1e4 >= limit);
  const m = substancePresent({ ...ctx, streams }, params);
  return m && { ...m, values: { ...m.values, limit_ppm: fmt(limit) } };
};

/** Nickel-bearing basis with CO in a fuel-side stream (or one whose side is not given). */
const nickelAndCarbonMonoxide: Predicate = (ctx) => {
  if (!ctx.input.nickelBearing) return null;
  const co = substancePresent({ ...ctx, streams: ctx.streams.filter((s) => s.side !== 'air') }, { substance: 'CO' });
  if (!co) return null;
  const values = { ...co.values, technology: ctx.technologyName, ambient_C: formatCelsius(ctx.input.ambientTemperatureK) };
  return { ...co, values, escalate: false };
};

const nickelAndCarbonMonoxideInOperation: Predicate = (ctx, params) => {
  if (ctx.input.operatingTemperatureK >= threshold('nickelCarbonyl_C') + ZERO_CELSIUS_K) return null;
  const m = nickelAndCarbonMonoxide(ctx, params);
  return m && { ...m, values: { ...m.values, operating_C: formatCelsius(ctx.input.operatingTemperatureK) } };
};

function flammabilityValues(s: StreamIndicators): Values {
  const f = s.flammability!;
  return {
    stream: s.name,
    combustible_percent: fmt(s.combustible_percent),
    combustibles: s.combustibles.map((c) => `${c.species} ${fmt(c.mole_percent)} %`).join(', '),
    oxygen_percent: fmt(s.oxygen_percent),
    lfl: fmt(f.lfl_percent),
    streamLfl: fmt(f.streamLfl_percent),
    loc: fmt(f.limitingOxygen_percent),
    alarm: fmt(f.detectorAlarm_percent),
    alarmStream: fmt(f.detectorAlarmStream_percent),
  };
}

const outletFlammableOnMixing: Predicate = (ctx) =>
  matchOf(
    ctx.streams.filter((s) => s.role === 'outlet' && s.flammableOnMixingWithAir),
    flammabilityValues,
  );

const streamInsideFlammableRange: Predicate = (ctx) => matchOf(ctx.streams.filter((s) => s.insideFlammableRange), flammabilityValues);

/** Most demanding gas group and temperature class among the combustibles of the given streams. */
function classification(streams: StreamIndicators[]): Values {
  const labels = [...new Set(streams.flatMap((s) => s.combustibles.map((c) => c.species)))];
  const classified = labels.filter((l) => findSubstance(l)?.gasGroup && findSubstance(l)?.temperatureClass);
  const unrecorded = labels.filter((l) => !classified.includes(l));
  const worst = (order: string[], pick: (l: string) => string) =>
    classified.map(pick).reduce((a, b) => (order.indexOf(b) > order.indexOf(a) ? b : a), order[0]!);
  return {
    gasGroup: classified.length ? worst(GAS_GROUPS, (l) => findSubstance(l)!.gasGroup!.value) : undefined,
    temperatureClass: classified.length ? worst(TEMPERATURE_CLASSES, (l) => findSubstance(l)!.temperatureClass!.value) : undefined,
    classifiedBy: classified.length ? formatList(classified.map((l) => findSubstance(l)!.name)) : undefined,
    unrecorded: unrecorded.length ? formatList(unrecorded.map((l) => findSubstance(l)!.name)) : undefined,
  };
}

const flammableOnMixing: Predicate = (ctx) => {
  const streams = ctx.streams.filter((s) => s.flammableOnMixingWithAir);
  return matchOf(streams, flammabilityValues, classification(streams));
};

const hotHydrogen: Predicate = (ctx) => {
  const limitK = threshold('hydrogenAttack_C') + ZERO_CELSIUS_K;
  return matchOf(
    ctx.streams.filter((s) => shareOf(s, 'H2') && s.temperature_K > limitK),
    (s) => ({ stream: s.name, temperature_C: formatCelsius(s.temperature_K), partialPressure_bar: fmt(s.hydrogenPartialPressure_bar) }),
  );
};

const aboveAtmospheric: Predicate = (ctx) => {
  const atmosphere = STANDARD_ATMOSPHERE_PA / PA_PER_BAR;
  const candidates: [string, number][] = [
    ['on the fuel-electrode side', ctx.input.fuelPressureBar],
    ['on the air-electrode side', ctx.input.airPressureBar],
    ...ctx.streams.map((s): [string, number] => [`in ${s.name}`, s.pressure_bar]),
  ];
  const [where, max] = candidates.reduce((a, b) => (b[1] > a[1] ? b : a));
  if (!(max > atmosphere)) return null;
  return basisMatch({ where, maxPressure_bar: fmt(max), maxGauge_bar: fmt(max - atmosphere), atmosphere_bar: fmt(atmosphere, 6) });
};

function autoignitionValues(s: StreamIndicators): Values {
  const a = s.autoignition!;
  return {
    stream: s.name,
    temperature_C: formatCelsius(s.temperature_K),
    ait: fmt(a.lowest_C),
    aitSpecies: substance(a.species).name,
    aitSource: a.source,
  };
}

const streamAboveAutoignition: Predicate = (ctx) =>
  matchOf(
    ctx.streams.filter((s) => s.flammableOnMixingWithAir && s.autoignition?.streamAbove),
    autoignitionValues,
  );

const operatingAboveAutoignition: Predicate = (ctx) => {
  const streams = ctx.streams.filter((s) => s.flammableOnMixingWithAir && s.autoignition?.operatingAbove);
  if (streams.length === 0) return null;
  const lowest = streams.reduce((a, b) => (b.autoignition!.lowest_K < a.autoignition!.lowest_K ? b : a));
  const { ait, aitSpecies } = autoignitionValues(lowest);
  return matchOf(streams, autoignitionValues, { ait, aitSpecies, operating_C: formatCelsius(ctx.input.operatingTemperatureK) });
};

const oxygenEnriched: Predicate = (ctx) => {
  const limit = substance('O2').enrichedAbove_percent!.value;
  return matchOf(
    ctx.streams.filter((s) => s.oxygen_percent > limit),
    (s) => ({ stream: s.name, oxygen_percent: fmt(s.oxygen_percent), pressure_bar: fmt(s.pressure_bar) }),
  );
};

const electrolysis: Predicate = (ctx) => {
  if (ctx.input.mode !== 'electrolysis') return null;
  const mixed = ctx.streams.filter((s) => shareOf(s, 'H2') && shareOf(s, 'O2'));
  const each = mixed.map((s) => ({ stream: s.name, h2_percent: fmt(shareOf(s, 'H2')!.mole_percent), o2_percent: fmt(s.oxygen_percent) }));
  return { triggeredBy: mixed.map((s) => s.id), values: { technology: ctx.technologyName }, each, escalate: false };
};

const technologyIs: Predicate = (ctx, params) =>
  ctx.input.technology === params.technology ? basisMatch({ technology: ctx.technologyName }) : null;

const unassessedSpecies: Predicate = (ctx) =>
  matchOf(
    ctx.streams.filter((s) => s.unassessed.length > 0),
    (s) => ({ stream: s.name, species: s.unassessed.map((u) => `${u.species} ${fmt(u.mole_percent)} %`).join(', ') }),
  );

export const PREDICATES: Readonly<Record<string, Predicate>> = {
  'substance-present': substancePresent,
  'substance-at-exposure-limit': substanceAtExposureLimit,
  'nickel-and-carbon-monoxide': nickelAndCarbonMonoxide,
  'nickel-and-carbon-monoxide-in-operation': nickelAndCarbonMonoxideInOperation,
  'outlet-flammable-on-mixing': outletFlammableOnMixing,
  'stream-inside-flammable-range': streamInsideFlammableRange,
  'flammable-on-mixing': flammableOnMixing,
  'hot-hydrogen': hotHydrogen,
  'above-atmospheric': aboveAtmospheric,
  'stream-above-autoignition': streamAboveAutoignition,
  'operating-above-autoignition': operatingAboveAutoignition,
  'oxygen-enriched': oxygenEnriched,
  electrolysis,
  'technology-is': technologyIs,
  'unassessed-species': unassessedSpecies,
};
