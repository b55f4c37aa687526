/**
 * The `conditions:` section: temperatures (above absolute zero; the operating temperature
 * compared with the technology's typical range) and pressures (absolute, above zero; gauge
 * values referred to one standard atmosphere). A cell that runs with liquid water must run below
 * water's boiling point at the lower of its electrode pressures, T < T_s(p) by IAPWS-IF97 eq. 31
 * (lib/thermo/water-saturation.ts). The sweep range and the species-data range checks need the
 * streams, so they follow in temperature-ranges.ts.
 */
import { PA_PER_BAR, REFERENCE_TEMPERATURE_K, STANDARD_ATMOSPHERE_PA } from '../thermo/constants.ts';
import type { Mode, Technology } from '../electrochem/technologies.ts';
import { streamRules } from './stream-rules.ts';
import type { Path } from './diagnostics.ts';
import type { Read, Reader } from './reader.ts';
import { limitProblem, withinLimit } from './limits.ts';
import { kelvinWithCelsius } from '../core/temperature-text.ts';
import { saturationRange, waterSaturationTemperatureK } from '../thermo/water-saturation.ts';

/** "1073.15 K (800 °C)" for messages. */
export function kelvinText(kelvin: number): string {
  const round = (x: number) => String(Number(x.toFixed(2)));
  return kelvinWithCelsius(kelvin, round);
}

/** A temperature input, refused at or below absolute zero. */
export function readTemperature(reader: Reader, path: Path, label: string, givenSource?: string): Read | undefined {
  const read = reader.scalar(path, 'temperature', label, givenSource);
  if (!read) return undefined;
  if (read.si <= 0) {
    reader.findings.error(read.at, `${read.text} is at or below absolute zero (${String(Number(read.si.toFixed(2)))} K)`);
    return undefined;
  }
  return read;
}

/** A pressure input in bar absolute, refused at or below zero absolute (a gauge value below vacuum included) and beyond its limit. */
function readPressure(reader: Reader, path: Path, label: string, bound: 'pressure' | 'ambient-pressure' = 'pressure'): number | undefined {
  const read = reader.scalar(path, 'pressure', label);
  if (!read) return undefined;
  const bar = read.si / PA_PER_BAR;
  if (read.si <= 0) {
    const absolute = `${String(Number(bar.toFixed(5)))} bar absolute`;
    reader.findings.error(
      read.at,
      read.gauge
        ? `${read.text} is below vacuum: ${absolute} (gauge pressures are referred to 1 atm = 1.01325 bar)`
        : `an absolute pressure must be above zero, got ${read.text} (for a gauge pressure write barg or bar(g))`,
    );
    return undefined;
  }
  const beyond = limitProblem(bound, label, read);
  if (beyond) {
    reader.findings.error(read.at, beyond);
    return undefined;
  }
  return bar;
}

export interface ConditionsRead {
  temperature?: Read;
  sweep?: { from: Read; to: Read };
  fuelInlet?: Read;
  airInlet?: Read;
  /** The allowed air temperature rise as written, when written and sound. */
  rise?: Read;
  allowedAirTemperatureRiseK: number;
  fuelPressureBar?: number;
  airPressureBar?: number;
  ambientTemperatureK: number;
  /**
   * Pressure of the ambient air, bar: as written, else the standard atmosphere at sea level,
   * 1.01325 bar (ISO 2533:1975; U.S. Standard Atmosphere 1976, p0 = 101 325 Pa). A relative
   * humidity is converted at it, and a blower draws air at it unless its inlet pressure is
   * given. Undefined where written but refused.
   */
  ambientPressureBar: number | undefined;
}

const C = (key: string): Path => ['conditions', key];

/**
 * Refuses liquid-water operation at or above the boiling point T_s(p) (IF97 eq. 31) at the lower
 * electrode pressure, where the water would boil first. Below the triple-point pressure (611.2 Pa)
 * no liquid exists at any temperature of the line; above the critical pressure none boils.
 */
function checkBelowBoiling(reader: Reader, temperature: Read, pressures: readonly [string, number | undefined][]): void {
  const known = pressures.filter((p): p is [string, number] => p[1] !== undefined);
  if (!known.length) return;
  const [label, bar] = known.reduce((a, b) => (b[1] < a[1] ? b : a));
  const range = saturationRange();
  const pa = bar * PA_PER_BAR;
  if (pa > range.highPa) return;
  const boilingK = pa < range.lowPa ? range.lowK : waterSaturationTemperatureK(pa);
  if (temperature.si < boilingK) return;
  reader.findings.error(
    temperature.at,
    `water boils at ${kelvinText(boilingK)} at the ${label} pressure, ${String(Number(bar.toPrecision(6)))} bar (IAPWS-IF97), ` +
      `so a liquid-water cell cannot run at ${temperature.text}: lower the temperature or raise the pressure`,
  );
}

export function readConditions(reader: Reader, tech: Technology | undefined, mode: Mode | undefined): ConditionsRead {
  const temperature = readTemperature(reader, C('operating-temperature'), 'operating temperature');
  if (temperature && tech && (temperature.si < tech.typicalFromK || temperature.si > tech.typicalToK)) {
    reader.findings.warning(
      temperature.at,
      `${temperature.text} is outside the typical range of ${tech.id} cells, ${kelvinText(tech.typicalFromK)} to ${kelvinText(tech.typicalToK)} (common practice, no source)`,
    );
  }
  const from = readTemperature(reader, [...C('temperature-sweep'), 'from'], 'temperature sweep start');
  const to = readTemperature(reader, [...C('temperature-sweep'), 'to'], 'temperature sweep end');
  if (from && to && from.si >= to.si) reader.findings.error(to.at, `the sweep must end above where it starts (${from.text}), got ${to.text}`);
  const rawRise = reader.scalar(C('allowed-air-temperature-rise'), 'temperature-difference', 'allowed air temperature rise');
  const riseProblem = rawRise && (rawRise.si <= 0 ? `the allowed temperature rise must be above zero, got ${rawRise.text}` : limitProblem('allowed-air-temperature-rise', 'allowed air temperature rise', rawRise));
  if (rawRise && riseProblem) reader.findings.error(rawRise.at, riseProblem);
  const rise = riseProblem ? undefined : rawRise;
  const writtenAmbient = readTemperature(reader, C('ambient-temperature'), 'ambient temperature');
  const ambient = writtenAmbient && withinLimit(reader.findings, 'ambient-temperature', 'ambient temperature', writtenAmbient) ? writtenAmbient : undefined;
  // Each inlet named for what its feed is in this technology: "water inlet temperature" for a PEM electrolyser's water.
  const rules = tech && mode ? streamRules(tech, mode) : undefined;
  const fuelInlet = readTemperature(reader, C('fuel-inlet-temperature'), `${rules?.['fuel-electrode'].short ?? 'fuel'} inlet temperature`);
  const airInlet = readTemperature(reader, C('air-inlet-temperature'), `${rules?.['air-electrode'].short ?? 'air'} inlet temperature`);
  const fuelPressureBar = readPressure(reader, C('fuel-electrode-pressure'), 'fuel-electrode pressure');
  const airPressureBar = readPressure(reader, C('air-electrode-pressure'), 'air-electrode pressure');
  const ambientPressureBar = reader.has(C('ambient-pressure')) ? readPressure(reader, C('ambient-pressure'), 'ambient pressure', 'ambient-pressure') : STANDARD_ATMOSPHERE_PA / PA_PER_BAR;
  if (temperature && tech?.waterPhase === 'liquid') {
    checkBelowBoiling(reader, temperature, [['fuel-electrode', fuelPressureBar], ['air-electrode', airPressureBar]]);
  }
  return {
    ...(temperature ? { temperature } : {}),
    ...(from && to && from.si < to.si ? { sweep: { from, to } } : {}),
    ...(fuelInlet ? { fuelInlet } : {}),
    ...(airInlet ? { airInlet } : {}),
    ...(rise ? { rise } : {}),
    allowedAirTemperatureRiseK: rise?.si ?? 100,
    ...(fuelPressureBar !== undefined ? { fuelPressureBar } : {}),
    ...(airPressureBar !== undefined ? { airPressureBar } : {}),
    ambientTemperatureK: ambient?.si ?? REFERENCE_TEMPERATURE_K,
    ambientPressureBar,
  };
}
