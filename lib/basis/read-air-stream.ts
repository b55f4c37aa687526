/**
 * `streams.air-electrode`: its composition, and for humid-air the humidity that completes it,
 * { dew-point } or { relative-humidity, at }, turned into a water mole fraction at the pressure
 * where it is stated (humid-air.ts): a dew point is that of the air fed to the electrode (a
 * humidifier's outlet), at the air-electrode pressure; a relative humidity is that of the
 * ambient air, at the ambient pressure (conditions.ambient-pressure, default the standard
 * atmosphere). Compressing the air keeps its water mole fraction. The humidity temperatures must
 * lie within the liquid-water data, where the saturation pressure is defined.
 */
import { getSpecies } from '../thermo/species-data.ts';
import { inRange } from '../thermo/properties.ts';
import { PA_PER_BAR } from '../thermo/constants.ts';
import { saturationRange, waterSaturationPressurePa } from '../thermo/water-saturation.ts';
import { findPreset } from './presets.ts';
import { humidAir, humidityAtDewPoint, humidityAtRelativeHumidity } from './humid-air.ts';
import { kelvinText, readTemperature } from './read-conditions.ts';
import { resolveComposition, type Composition } from './composition.ts';
import type { Path } from './diagnostics.ts';
import type { Read, Reader } from './reader.ts';
import type { AirHumidity, AirStream } from './types.ts';

export interface AirStreamRead {
  stream: AirStream;
  feed: Composition;
}

const HUMIDITY_FORMS = '{ dew-point: "15 C" } or { relative-humidity: "60 %", at: "25 C" }';

/** A humidity temperature, which needs the liquid-water data for its saturation pressure. */
function saturationTemperature(reader: Reader, path: Path, label: string): Read | undefined {
  const read = readTemperature(reader, path, label);
  const water = getSpecies('H2O(L)');
  if (read && !inRange(water, read.si)) {
    reader.findings.error(read.at, `the ${label} must lie within the liquid-water data, ${kelvinText(water.lowK)} to ${kelvinText(water.highK)}, got ${read.text}`);
    return undefined;
  }
  return read;
}

/** The pressures, bar, at which each form of the humidity is stated. */
interface StatedAt {
  airElectrodeBar: number | undefined;
  ambientBar: number | undefined;
}

function readHumidity(reader: Reader, path: Path, pressures: StatedAt): { humidity: AirHumidity; at: Path; pressureBar: number } | undefined {
  const has = (key: string) => reader.has([...path, key]);
  if (has('dew-point') && (has('relative-humidity') || has('at'))) {
    reader.findings.error([...path, has('relative-humidity') ? 'relative-humidity' : 'at'], `give the humidity as ${HUMIDITY_FORMS}, not both`, 'key');
    return undefined;
  }
  if (!has('dew-point') && !(has('relative-humidity') && has('at'))) {
    const missing = has('relative-humidity') ? 'at' : has('at') ? 'relative-humidity' : 'dew-point';
    reader.findings.error([...path, missing], `the humidity needs ${HUMIDITY_FORMS}`, 'missing');
    return undefined;
  }
  if (has('dew-point')) {
    const dew = saturationTemperature(reader, [...path, 'dew-point'], 'dew point');
    const pressureBar = pressures.airElectrodeBar;
    if (!dew || pressureBar === undefined) return undefined;
    return { humidity: humidityAtDewPoint(dew.si, pressureBar), at: dew.at, pressureBar };
  }
  const rh = reader.scalar([...path, 'relative-humidity'], 'fraction', 'relative humidity');
  const at = saturationTemperature(reader, [...path, 'at'], 'relative-humidity temperature');
  if (rh && (rh.si < 0 || rh.si > 1)) {
    reader.findings.error(rh.at, `a relative humidity lies between 0 and 100 %, got ${rh.text}`);
    return undefined;
  }
  const pressureBar = pressures.ambientBar;
  if (!rh || !at || pressureBar === undefined) return undefined;
  return { humidity: humidityAtRelativeHumidity(rh.si, at.si, pressureBar), at: rh.at, pressureBar };
}

/** A composition at `path` (composition, source, humidity beside it), as the air-electrode feed or as a cathode loop's burner air. */
function readAirComposition(reader: Reader, path: Path, mixtures: ReadonlyMap<string, Composition>, pressures: StatedAt, inletK: number | undefined): AirStreamRead | undefined {
  const source = reader.source([...path, 'source']);
  const composition = resolveComposition(reader, [...path, 'composition'], path.includes('burner-air') ? 'burner air' : 'air-electrode feed', mixtures, source);
  const humidityPath = [...path, 'humidity'];
  const hasHumidity = reader.has(humidityPath);
  if (!composition) return undefined;
  if (!composition.humid) {
    if (hasHumidity) reader.findings.error(humidityPath, `humidity applies to composition humid-air only; this stream's composition is ${composition.name ?? 'given inline'}`, 'key');
    const stream: AirStream = { ...(composition.name ? { compositionName: composition.name } : {}), composition: composition.fractions };
    return { stream, feed: composition };
  }
  if (!hasHumidity) {
    reader.findings.error(composition.at, `humid-air needs a humidity beside it: humidity: ${HUMIDITY_FORMS}`);
    return undefined;
  }
  const humidity = readHumidity(reader, humidityPath, pressures);
  const pressureBar = pressures.airElectrodeBar;
  if (!humidity || pressureBar === undefined) return undefined;
  const water = humidity.humidity.waterFraction;
  if (water >= 1) {
    reader.findings.error(humidity.at, `this humidity needs a water partial pressure above the ${humidity.humidity.pressureOf} pressure, ${humidity.pressureBar} bar: the air would be all steam`);
    return undefined;
  }
  const line = saturationRange();
  if (inletK !== undefined && inletK >= line.lowK && inletK <= line.highK && water * pressureBar * PA_PER_BAR > waterSaturationPressurePa(inletK)) {
    reader.findings.warning(humidity.at, `this much water vapour would condense at the air-electrode feed temperature, ${kelvinText(inletK)}`);
  }
  const dry = findPreset(findPreset(composition.name ?? '')?.base ?? 'dry-air')!;
  const fractions = humidAir(dry.composition, water);
  const speciesAt = Object.fromEntries(Object.keys(fractions).map((s) => [s, composition.at]));
  return {
    stream: { compositionName: composition.name ?? 'humid-air', composition: fractions, humidity: humidity.humidity },
    feed: { ...composition, fractions, speciesAt },
  };
}

const LOOP_KEYS = ['composition', 'humidity', 'source'] as const;

/**
 * `cathode-loop`: the burner air (a composition as above) and the O2 mole fraction at the
 * air-electrode inlet, which must lie above 0 and below the burner air's (no mixing of burnt gas
 * and exhaust is richer in O2 than the air). Whether the rest of the loop closes (a recycled
 * share in [0, 1)) depends on the off-gas and the air utilization: the calculation checks it
 * (lib/plant/cathode-loop.ts).
 */
function readCathodeLoop(reader: Reader, path: Path, mixtures: ReadonlyMap<string, Composition>, pressures: StatedAt, inletK: number | undefined): AirStreamRead | undefined {
  for (const key of LOOP_KEYS) {
    if (reader.has([...path, key])) reader.findings.error([...path, key], `the cathode-gas loop makes the air-electrode feed: give the burner air's ${key} under cathode-loop.burner-air, not beside the loop`, 'key');
  }
  const loopPath = [...path, 'cathode-loop'];
  const burner = readAirComposition(reader, [...loopPath, 'burner-air'], mixtures, pressures, inletK);
  const oxygen = reader.scalar([...loopPath, 'inlet-oxygen'], 'fraction', 'O2 fraction at the air-electrode inlet');
  if (!burner || !oxygen) return undefined;
  const air = burner.stream.composition.O2 ?? 0;
  if (!(oxygen.si > 0 && oxygen.si < air)) {
    reader.findings.error(oxygen.at, `the O2 fraction at the air-electrode inlet must lie above 0 and below the burner air's, ${(100 * air).toPrecision(4)} %, got ${oxygen.text}`);
    return undefined;
  }
  return { stream: { ...burner.stream, cathodeLoop: { inletOxygenFraction: oxygen.si } }, feed: burner.feed };
}

/** `streams.air-electrode`: a composition, or (a carbonate cell, power mode: `loopAllowed`) the cathode-gas loop that makes it. */
export function readAirStream(
  reader: Reader,
  path: Path,
  mixtures: ReadonlyMap<string, Composition>,
  pressures: StatedAt,
  inletK: number | undefined,
  loopAllowed: boolean,
): AirStreamRead | undefined {
  if (!reader.has([...path, 'cathode-loop'])) {
    if (!reader.has([...path, 'composition'])) {
      reader.findings.error([...path, 'composition'], `the air-electrode feed needs a composition${loopAllowed ? ', or a cathode-loop that makes it' : ''}`, 'missing');
      return undefined;
    }
    return readAirComposition(reader, path, mixtures, pressures, inletK);
  }
  if (!loopAllowed) {
    reader.findings.error([...path, 'cathode-loop'], 'a cathode-gas loop belongs to a molten carbonate cell in power mode, whose air electrode takes CO2; give a composition', 'key');
    return undefined;
  }
  return readCathodeLoop(reader, path, mixtures, pressures, inletK);
}
