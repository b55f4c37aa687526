/**
 * Water's saturation line by IAPWS-IF97 region 4 (IAPWS, Revised Release on the IAPWS Industrial
 * Formulation 1997 for the Thermodynamic Properties of Water and Steam, 2007, section 8), with
 * the coefficients n1 ... n10 of its Table 34 in data/iapws-if97-saturation.yaml.
 *
 * Both equations come from one implicit quadratic in β = (p_s/p*)^¼ and ϑ = T_s/T* + n9/(T_s/T* − n10)
 * (eq. 29):  β² ϑ² + n1 β² ϑ + n2 β² + n3 β ϑ² + n4 β ϑ + n5 β + n6 ϑ² + n7 ϑ + n8 = 0,
 * solved for β (the saturation pressure, eq. 30) or for ϑ (the saturation temperature, eq. 31),
 * so each is the other's exact inverse up to rounding (the tests check it to 1e-9 K).
 * Valid from 273.15 K to the critical temperature 647.096 K; outside it an error says so.
 */
import { z } from 'zod';
import { readDataFile } from '../core/data-file.ts';
import { UserError } from '../core/errors.ts';

const Region4 = z.strictObject({
  coefficients: z.strictObject({
    n1: z.number(), n2: z.number(), n3: z.number(), n4: z.number(), n5: z.number(),
    n6: z.number(), n7: z.number(), n8: z.number(), n9: z.number(), n10: z.number(),
  }),
  reducingPressure_Pa: z.number().positive(),
  reducingTemperature_K: z.number().positive(),
  lowestTemperature_K: z.number().positive(),
  criticalTemperature_K: z.number().positive(),
});

type Region4 = z.infer<typeof Region4>;

let data: Region4 | undefined;

function region4(): Region4 {
  data ??= readDataFile(new URL('./data/iapws-if97-saturation.yaml', import.meta.url), Region4);
  return data;
}

/** A temperature or pressure outside the saturation line's range (273.15 K to the critical point). */
export class SaturationRangeError extends UserError {
  constructor(
    readonly quantity: 'temperature' | 'pressure',
    readonly value: number,
    readonly low: number,
    readonly high: number,
  ) {
    const text = (v: number) => (quantity === 'temperature' ? `${v.toFixed(2)} K` : `${v.toPrecision(6)} Pa`);
    super(
      `water saturation ${quantity} ${text(value)} is outside the range of the IAPWS-IF97 saturation line, ` +
        `${text(low)} (0 °C) to ${text(high)} (the critical point)`,
    );
    this.name = 'SaturationRangeError';
  }
}

/** Eq. 30 without the range check: p_s = p* · [2C / (−B + (B² − 4AC)^½)]⁴. */
function pressureOnLine(temperatureK: number): number {
  const { coefficients: n, reducingPressure_Pa, reducingTemperature_K } = region4();
  const t = temperatureK / reducingTemperature_K;
  const theta = t + n.n9 / (t - n.n10);
  const a = theta * theta + n.n1 * theta + n.n2;
  const b = n.n3 * theta * theta + n.n4 * theta + n.n5;
  const c = n.n6 * theta * theta + n.n7 * theta + n.n8;
  return reducingPressure_Pa * ((2 * c) / (-b + Math.sqrt(b * b - 4 * a * c))) ** 4;
}

/** The range of the saturation line: temperatures from the data, pressures from eq. 30 at both ends. */
export function saturationRange(): { lowK: number; highK: number; lowPa: number; highPa: number } {
  const { lowestTemperature_K: lowK, criticalTemperature_K: highK } = region4();
  return { lowK, highK, lowPa: pressureOnLine(lowK), highPa: pressureOnLine(highK) };
}

/**
 * Saturation pressure of water, Pa, at temperature T (IF97 eq. 30, the basic equation):
 *   ϑ = T/T* + n9/(T/T* − n10);  A = ϑ² + n1 ϑ + n2;  B = n3 ϑ² + n4 ϑ + n5;  C = n6 ϑ² + n7 ϑ + n8
 *   p_s = p* · [2C / (−B + (B² − 4AC)^½)]⁴,  p* = 1 MPa, T* = 1 K.
 */
export function waterSaturationPressurePa(temperatureK: number): number {
  const range = saturationRange();
  if (!(temperatureK >= range.lowK && temperatureK <= range.highK)) {
    throw new SaturationRangeError('temperature', temperatureK, range.lowK, range.highK);
  }
  return pressureOnLine(temperatureK);
}

/**
 * Saturation temperature of water, K, at pressure p (IF97 eq. 31, the backward equation):
 *   β = (p/p*)^¼;  E = β² + n3 β + n6;  F = n1 β² + n4 β + n7;  G = n2 β² + n5 β + n8
 *   D = 2G / (−F − (F² − 4EG)^½)
 *   T_s = T* · [n10 + D − ((n10 + D)² − 4(n9 + n10 D))^½] / 2.
 */
export function waterSaturationTemperatureK(pressurePa: number): number {
  const range = saturationRange();
  if (!(pressurePa >= range.lowPa && pressurePa <= range.highPa)) {
    throw new SaturationRangeError('pressure', pressurePa, range.lowPa, range.highPa);
  }
  const { coefficients: n, reducingPressure_Pa, reducingTemperature_K } = region4();
  const beta = (pressurePa / reducingPressure_Pa) ** 0.25;
  const e = beta * beta + n.n3 * beta + n.n6;
  const f = n.n1 * beta * beta + n.n4 * beta + n.n7;
  const g = n.n2 * beta * beta + n.n5 * beta + n.n8;
  const d = (2 * g) / (-f - Math.sqrt(f * f - 4 * e * g));
  const sum = n.n10 + d;
  // Rounding can put the result a few ulps past a range end; keep it inside.
  const t = (reducingTemperature_K * (sum - Math.sqrt(sum * sum - 4 * (n.n9 + n.n10 * d)))) / 2;
  return Math.min(range.highK, Math.max(range.lowK, t));
}

/**
 * Dew point of a gas, K: the temperature at which its water vapour partial pressure p_w
 * saturates, T_dp = T_s(p_w) (IF97 eq. 31). For a mixture p_w = y_H2O · p (ideal gas, Dalton).
 * Partial pressures below 611.2 Pa saturate below 0 °C, over ice, outside IF97 region 4:
 * those are a SaturationRangeError.
 */
export function waterDewPointK(waterPartialPressurePa: number): number {
  return waterSaturationTemperatureK(waterPartialPressurePa);
}
