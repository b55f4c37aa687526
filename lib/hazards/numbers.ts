/**
 * Numbers and lists as the hazard texts print them: three significant digits with thousands
 * separators by default (the data rarely support more), temperatures in whole degrees Celsius,
 * lists joined with "and".
 */
import { ZERO_CELSIUS_K } from '../core/units.ts';

const formatters = new Map<number, Intl.NumberFormat>();
const LIST = new Intl.ListFormat('en-GB', { style: 'long', type: 'conjunction' });

export function formatNumber(value: number, digits = 3): string {
  let f = formatters.get(digits);
  if (!f) formatters.set(digits, (f = new Intl.NumberFormat('en-GB', { maximumSignificantDigits: digits })));
  return f.format(value);
}

export function formatCelsius(temperatureK: number): string {
  return (Math.round(temperatureK - ZERO_CELSIUS_K) + 0).toString();
}

export function formatList(items: readonly string[]): string {
  return LIST.format(items);
}
