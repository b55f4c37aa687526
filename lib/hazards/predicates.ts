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
import { parseQuantity, ZERO_CELSIUS_K } from '../core/units.ts';
import { formatCelsius, formatList, formatNumber as fmt } from './numbers.ts';
import { findSubstance, substance } from './substances.ts';
import { temperatureClassBelow } from './temperature-class.ts';
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
  /**
   * Only where a feed carries the substance: what an equilibrium calculation forms from feed
   * species the basis treats as inert (ammonia from the N2 of natural gas or air) is not counted.
   */
  onlyWhereFed?: boolean;
}

export interface Match {
  triggeredBy: string[];
  values: Values;
  each: Values[];
  escalate: boolean;
}

export type Predicate = (ctx: RuleContext, params: RuleParams) => Match | null;

const GAS_GROUPS = ['IIA', 'IIB', 'IIC'];

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

/** Whether the rule counts the substance only where a feed carries it, and no feed does. */
function notFed(ctx: RuleContext, params: RuleParams): boolean {
  return params.onlyWhereFed === true && !ctx.streams.some((s) => s.role === 'feed' && shareOf(s, params.substance!));
}

/** The substance in streams (of the rule's roles), at any concentration at or above the presence threshold. */
function presentIn(ctx: RuleContext, params: RuleParams): Match | null {
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
}

const substancePresent: Predicate = (ctx, params) => (notFed(ctx, params) ? null : presentIn(ctx, params));

/** The lowest time-weighted exposure limit recorded for a substance (NIOSH REL, OSHA PEL, ACGIH TLV), ppm. */
function lowestTwa_ppm(label: string): number | undefined {
  const e = substance(label).exposure_ppm;
  const limits = [e.nioshRelTwa, e.oshaPelTwa, e.acgihTlvTwa].filter((l) => l !== undefined).map((l) => l.value);
  return limits.length ? Math.min(...limits) : undefined;
}

/**
 * The substance in streams at or above its lowest time-weighted exposure limit: a stream below
 * the limit cannot, by leaking, bring a room above it. For a gas that ambient air carries itself
 * (CO2), presence alone would raise the caution for every air stream; for one an equilibrium
 * forms as ppm traces (ammonia from nitrogen), presence alone would raise it for every fuel gas
 * with N2 in it.
 */
const substanceAtExposureLimit: Predicate = (ctx, params) => {
  const label = params.substance!;
  const limit = lowestTwa_ppm(label);
  if (limit === undefined || notFed(ctx, params)) return null;
  const streams = ctx.streams.filter((s) => (shareOf(s, label)?.mole_percent ?? 0) * 1e4 >= limit);
  const m = presentIn({ ...ctx, streams }, params);
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

/**
 * Equipment classification for the combustibles of the given streams: the most demanding gas
 * group recorded for them (IIA < IIB < IIC), and the temperature class whose maximum surface
 * temperature is below the lowest autoignition temperature recorded for any of them
 * (temperature-class.ts), with the species and source that set it.
 */
function classification(streams: StreamIndicators[]): Values {
  const labels = [...new Set(streams.flatMap((s) => s.combustibles.map((c) => c.species)))];
  const nameOf = (l: string) => findSubstance(l)!.name;
  const grouped = labels.filter((l) => findSubstance(l)?.gasGroup);
  const ungrouped = labels.filter((l) => !grouped.includes(l));
  const withAit = labels.filter((l) => findSubstance(l)?.lowestAutoignition_C);
  const noAit = labels.filter((l) => !withAit.includes(l));
  const gasGroup = grouped.map((l) => findSubstance(l)!.gasGroup!.value).reduce<string | undefined>((a, b) => (a === undefined || GAS_GROUPS.indexOf(b) > GAS_GROUPS.indexOf(a) ? b : a), undefined);
  const lowest = withAit.reduce<string | undefined>((a, b) => (a === undefined || findSubstance(b)!.lowestAutoignition_C!.value < findSubstance(a)!.lowestAutoignition_C!.value ? b : a), undefined);
  const ait = lowest === undefined ? undefined : findSubstance(lowest)!.lowestAutoignition_C!;
  const temperatureClass = ait === undefined ? null : temperatureClassBelow(ait.value);
  return {
    gasGroup,
    groupedBy: grouped.length ? formatList(grouped.map(nameOf)) : undefined,
    ungrouped: ungrouped.length ? formatList(ungrouped.map(nameOf)) : undefined,
    temperatureClass: temperatureClass?.id,
    maxSurface: temperatureClass ? fmt(temperatureClass.maxSurface_C) : undefined,
    ait: ait ? fmt(ait.value) : undefined,
    aitSpecies: lowest === undefined ? undefined : nameOf(lowest),
    aitSource: ait?.source,
    belowEveryClass: ait && !temperatureClass ? fmt(ait.value) : undefined,
    noAit: noAit.length ? formatList(noAit.map(nameOf)) : undefined,
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

/**
 * The highest pressure of the basis (either electrode side or any stream) above the lower of the
 * thresholds of the pressure-equipment rules the caution paraphrases: gauge pressure
 * p − p_atm (p_atm the standard atmosphere) > min(p_EU, p_ASME), with p_EU = 0.5 bar (Directive
 * 2014/68/EU, Article 1(1)) and p_ASME = 15 psi (ASME BPVC Section VIII, Division 1, 2021, 1.2(i)),
 * from thresholds.yaml.
 */
const pressureEquipmentScope: Predicate = (ctx) => {
  const atmosphere = STANDARD_ATMOSPHERE_PA / PA_PER_BAR;
  const candidates: [string, number][] = [
    ['on the fuel-electrode side', ctx.input.fuelPressureBar],
    ['on the air-electrode side', ctx.input.airPressureBar],
    ...ctx.streams.map((s): [string, number] => [`in ${s.name}`, s.pressure_bar]),
  ];
  const [where, max] = candidates.reduce((a, b) => (b[1] > a[1] ? b : a));
  const gauge = max - atmosphere;
  const eu = threshold('pressureEquipmentEu_barGauge');
  const asmePsi = threshold('pressureVesselAsme_psiGauge');
  const asme = parseQuantity(`${asmePsi} psi`, 'pressure').si / PA_PER_BAR;
  if (!(gauge > Math.min(eu, asme))) return null;
  return basisMatch({
    where,
    maxPressure_bar: fmt(max),
    maxGauge_bar: fmt(gauge),
    atmosphere_bar: fmt(atmosphere, 6),
    eu_barGauge: fmt(eu),
    euRelation: gauge > eu ? 'above' : 'not above',
    asme_psiGauge: fmt(asmePsi),
    asme_barGauge: fmt(asme),
    asmeRelation: gauge > asme ? 'above' : 'not above',
  });
};

/**
 * A DC voltage above the extra-low-voltage band (U > 120 V ripple-free d.c., IEC 61140:2016), read
 * from the one input `dcVoltage` of the basis; above 1 500 V d.c. (the end of the low-voltage band)
 * the text says the system is high voltage.
 */
const dcAboveExtraLowVoltage: Predicate = (ctx) => {
  const { voltageV, description } = ctx.input.dcVoltage;
  const elv = threshold('extraLowVoltageDc_V');
  if (!(voltageV > elv)) return null;
  const lv = threshold('lowVoltageDc_V');
  return basisMatch({
    dcVoltage: fmt(voltageV),
    dcVoltageDescription: description,
    elv: fmt(elv),
    aboveLowVoltage: voltageV > lv ? fmt(lv) : undefined,
  });
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

/** The off-gas oxidiser's outlet, where the plant has one: its temperature, the hottest gas of the plant. */
const oxidiserOutlet: Predicate = (ctx) =>
  matchOf(
    ctx.streams.filter((s) => s.id === 'oxidiser-outlet'),
    (s) => ({ stream: s.name, temperature_C: formatCelsius(s.temperature_K) }),
  );

/** Hydrogen compressed to its delivery pressure, where the plant has a compressor: the pressure and the hydrogen partial pressure. */
const hydrogenCompressed: Predicate = (ctx) =>
  matchOf(
    ctx.streams.filter((s) => s.id === 'hydrogen-delivered' && shareOf(s, 'H2')),
    (s) => ({ stream: s.name, pressure_bar: fmt(s.pressure_bar), partialPressure_bar: fmt(s.hydrogenPartialPressure_bar) }),
  );

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
  'pressure-equipment-scope': pressureEquipmentScope,
  'dc-above-extra-low-voltage': dcAboveExtraLowVoltage,
  'stream-above-autoignition': streamAboveAutoignition,
  'operating-above-autoignition': operatingAboveAutoignition,
  'oxygen-enriched': oxygenEnriched,
  electrolysis,
  'technology-is': technologyIs,
  'unassessed-species': unassessedSpecies,
  'oxidiser-outlet': oxidiserOutlet,
  'hydrogen-compressed': hydrogenCompressed,
};
