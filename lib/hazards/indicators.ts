/**
 * Hazard indicators of one stream, pure functions of the stream and the basis:
 *
 * - combustible fraction, mixture LFL/UFL, effective stream LFL, flammable on mixing with air,
 *   inside-the-range screen (flammability.ts);
 * - concentration of each present species with an exposure limit, c = x · 10^6 ppm, and its
 *   multiple of the NIOSH IDLH (the dilution a leak needs before a room is no longer
 *   immediately dangerous), with the carbon monoxide limits set out on their own;
 * - hydrogen partial pressure p_H2 = x_H2 · p (ideal gas), for the embrittlement caution;
 * - the lowest recorded autoignition temperature of the combustibles present, against the stream
 *   and the operating temperature (a leak above it ignites in air without an ignition source),
 *   and the temperature class whose maximum surface temperature is below it (temperature-class.ts);
 * - present species with no hazard entry.
 */
import { ZERO_CELSIUS_K } from '../core/units.ts';
import { gasPhase } from './composition.ts';
import { flammableOnMixingWithAir, insideRangeScreen, isInside, limitingOxygen, mixtureLimits, type MixtureLimits } from './flammability.ts';
import { findSubstance, isNonHazardous, substance } from './substances.ts';
import { temperatureClassBelow } from './temperature-class.ts';
import { presenceFraction, threshold } from './thresholds.ts';
import type {
  AutoignitionIndicator,
  CarbonMonoxideIndicator,
  ExposureIndicator,
  HazardInput,
  HazardStream,
  SpeciesShare,
  StreamFlammability,
  StreamIndicators,
} from './types.ts';

const share = ([species, x]: [string, number]): SpeciesShare => ({ species, mole_percent: x * 100 });

function flammability(limits: MixtureLimits | null): StreamFlammability | null {
  if (limits === null) return null;
  const loc = limitingOxygen(limits.combustibles);
  const alarm = threshold('detectorAlarm_percentOfLfl') / 100;
  return {
    lfl_percent: limits.lfl_percent,
    ufl_percent: limits.ufl_percent,
    streamLfl_percent: limits.streamLfl_percent,
    limitingOxygen_percent: loc.percent,
    limitingOxygenSpecies: loc.species,
    limitingOxygenEstimated: loc.estimated,
    detectorAlarm_percent: alarm * limits.lfl_percent,
    detectorAlarmStream_percent: alarm * limits.streamLfl_percent,
  };
}

function exposure(present: [string, number][]): ExposureIndicator[] {
  return present.flatMap(([label, x]) => {
    const s = findSubstance(label);
    if (!s || Object.keys(s.exposure_ppm).length === 0) return [];
    const concentration_ppm = x * 1e6;
    const idlh = s.exposure_ppm.idlh?.value ?? null;
    return [{ species: label, concentration_ppm, idlh_ppm: idlh, timesIdlh: idlh === null ? null : concentration_ppm / idlh }];
  });
}

function carbonMonoxide(fractions: ReadonlyMap<string, number>): CarbonMonoxideIndicator | null {
  const x = fractions.get('CO') ?? 0;
  if (x < presenceFraction()) return null;
  const limit = (id: 'idlh' | 'nioshRelTwa' | 'nioshRelCeiling' | 'oshaPelTwa'): number => substance('CO').exposure_ppm[id]!.value;
  return {
    coConcentration_ppm: x * 1e6,
    idlh_ppm: limit('idlh'),
    timesIdlh: (x * 1e6) / limit('idlh'),
    nioshRelTwa_ppm: limit('nioshRelTwa'),
    nioshRelCeiling_ppm: limit('nioshRelCeiling'),
    oshaPelTwa_ppm: limit('oshaPelTwa'),
  };
}

function autoignition(present: [string, number][], temperatureK: number, operatingTemperatureK: number): AutoignitionIndicator | null {
  let lowest: AutoignitionIndicator | null = null;
  for (const [label] of present) {
    const s = findSubstance(label);
    const ait = s?.combustible ? s.lowestAutoignition_C : null;
    if (!ait) continue;
    const lowest_K = ait.value + ZERO_CELSIUS_K;
    if (lowest === null || lowest_K < lowest.lowest_K) {
      const temperatureClass = temperatureClassBelow(ait.value);
      lowest = {
        lowest_K,
        lowest_C: ait.value,
        species: label,
        source: ait.source,
        citation: ait.citation,
        streamAbove: temperatureK >= lowest_K,
        operatingAbove: operatingTemperatureK >= lowest_K,
        temperatureClass: temperatureClass?.id ?? null,
        maxSurface_C: temperatureClass?.maxSurface_C ?? null,
      };
    }
  }
  return lowest;
}

/** The indicators of one stream of the basis. */
export function streamIndicators(stream: HazardStream, input: Pick<HazardInput, 'operatingTemperatureK'>): StreamIndicators {
  const { fractions, condensedExcluded } = gasPhase(stream);
  const present = [...fractions.entries()].filter(([, x]) => x >= presenceFraction()).sort((a, b) => b[1] - a[1]);
  const limits = mixtureLimits(fractions);
  const oxygen = fractions.get('O2') ?? 0;
  const finding = insideRangeScreen(limits, oxygen);
  return {
    id: stream.id,
    name: stream.name,
    role: stream.role ?? 'outlet',
    roleAssumed: stream.role === undefined,
    side: stream.side ?? 'not given',
    temperature_K: stream.temperatureK,
    temperature_C: Math.round((stream.temperatureK - ZERO_CELSIUS_K) * 1e6) / 1e6,
    pressure_bar: stream.pressureBar,
    composition: present.map(share),
    condensedExcluded,
    combustibles: present.filter(([label]) => findSubstance(label)?.combustible).map(share),
    combustible_percent: (limits?.combustibleFraction ?? 0) * 100,
    oxygen_percent: oxygen * 100,
    flammability: flammability(limits),
    flammableOnMixingWithAir: flammableOnMixingWithAir(limits),
    insideFlammableRange: isInside(finding),
    insideFlammableRangeFinding: finding,
    carbonMonoxide: carbonMonoxide(fractions),
    exposure: exposure(present),
    hydrogenPartialPressure_bar: (fractions.get('H2') ?? 0) * stream.pressureBar,
    autoignition: autoignition(present, stream.temperatureK, input.operatingTemperatureK),
    unassessed: present.filter(([label]) => !findSubstance(label) && !isNonHazardous(label)).map(share),
  };
}
