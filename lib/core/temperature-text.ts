/**
 * How cellbasis writes a temperature for people: kelvin, then degrees Celsius in parentheses,
 * "1073.15 K (800 °C)". The one place that pairs the two scales (t/°C = T/K − 273.15, the
 * definition of the Celsius scale, read from the unit table as ZERO_CELSIUS_K); each caller
 * chooses how many digits its numbers show.
 */
import { ZERO_CELSIUS_K } from './units.ts';

/** `kelvin` as "<K> K (<°C> °C)", the kelvin written by `formatKelvin` and the Celsius value by `formatCelsius`. */
export function kelvinWithCelsius(kelvin: number, formatKelvin: (k: number) => string, formatCelsius: (c: number) => string = formatKelvin): string {
  return `${formatKelvin(kelvin)} K (${formatCelsius(kelvin - ZERO_CELSIUS_K)} °C)`;
}
