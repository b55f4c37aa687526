import { kelvinWithCelsius } from '../core/temperature-text.ts';
import { ZERO_CELSIUS_K } from '../core/units.ts';
/**
 * Number formatting for the design document: a fixed number of significant digits, the true
 * minus sign (U+2212), whole numbers in full, digits grouped in threes by a narrow no-break space from 10 000 up, and a
 * power of ten written out (× 10⁻⁵) outside 0.001 to 10⁹. The same rounding gives the plain text
 * of tables (`formatNumber`) and the LaTeX of substituted equations (`texNumber`), so a value reads
 * the same in both.
 */

const MINUS = '\u2212';
const GROUP = '\u202f';
const SUPERSCRIPT: Record<string, string> = { '-': '⁻', '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹' };

interface Parts {
  negative: boolean;
  /** Digits with a decimal point, no sign: "0.9893", "328960". */
  digits: string;
  /** Power of ten, or null when written in full. */
  exponent: number | null;
}

/** Rounds to `digits` significant digits and splits into sign, digits and exponent. */
function parts(value: number, digits: number): Parts {
  if (!Number.isFinite(value)) throw new Error(`cannot format ${value} as a number of the document`);
  const magnitude = Math.abs(value);
  if (magnitude === 0) return { negative: false, digits: '0', exponent: null };
  // Rounded once, for the sign (a value that rounds to zero has none) and the fixed notation.
  const precise = magnitude.toPrecision(digits);
  const negative = value < 0 && Number(precise) !== 0;
  // A whole number (a cell count, a current of 40 A) is written in full.
  if (Number.isInteger(magnitude) && magnitude < 1e9) return { negative, digits: String(magnitude), exponent: null };
  if (magnitude >= 1e-3 && magnitude < 1e9) {
    // toPrecision's fixed notation is already `digits` significant digits, exactly what toFixed
    // of the rounded value gives (most numbers of a document: formatted in a third less time).
    if (!precise.includes('e')) return { negative, digits: precise, exponent: null };
    const rounded = Number(precise);
    const places = Math.max(0, digits - 1 - Math.floor(Math.log10(rounded)));
    return { negative, digits: rounded.toFixed(places), exponent: null };
  }
  const [mantissa, exp] = magnitude.toExponential(digits - 1).split('e');
  return { negative, digits: mantissa!, exponent: Number(exp) };
}

function grouped(digits: string, separator: string): string {
  const point = digits.indexOf('.');
  const whole = point < 0 ? digits : digits.slice(0, point);
  // Most numbers of a document have four digits or fewer before the point: nothing to group.
  if (whole.length <= 4) return digits;
  const body = whole.replace(/\B(?=(\d{3})+(?!\d))/g, separator);
  return point < 0 ? body : `${body}${digits.slice(point)}`;
}

function plainText(p: Parts): string {
  const body = grouped(p.digits, GROUP);
  const power = p.exponent === null ? '' : ` × 10${String(p.exponent).replace(/./g, (c) => SUPERSCRIPT[c]!)}`;
  return `${p.negative ? MINUS : ''}${body}${power}`;
}

/** Plain text: "0.9893", "328 960", "−19.54", "3.223 × 10⁻⁵". */
export function formatNumber(value: number, digits = 4): string {
  return plainText(parts(value, digits));
}

function texText(p: Parts): string {
  const body = grouped(p.digits, '\\,');
  const power = p.exponent === null ? '' : `\\times10^{${p.exponent}}`;
  return `${p.negative ? '-' : ''}${body}${power}`;
}

/** LaTeX: "0.9893", "328\,960", "-19.54", "3.223\times10^{-5}". */
export function texNumber(value: number, digits = 4): string {
  return texText(parts(value, digits));
}

/** Up to `digits` significant digits with trailing zeros dropped, for exact values: 0.01, 1073.15, 120 000. */
export function formatTrimmed(value: number, digits = 6): string {
  return plainText(trimmed(parts(value, digits)));
}

/** The LaTeX of formatTrimmed. */
export function texTrimmed(value: number, digits = 6): string {
  return texText(trimmed(parts(value, digits)));
}

function trimmed(p: Parts): Parts {
  return p.digits.includes('.') ? { ...p, digits: p.digits.replace(/0+$/, '').replace(/\.$/, '') } : p;
}

/** A fixed number of decimals: formatFixed(1073.149, 2) → "1073.15". */
export function formatFixed(value: number, decimals: number): string {
  if (!Number.isFinite(value)) throw new Error(`cannot format ${value} as a number of the document`);
  const text = Math.abs(value).toFixed(decimals);
  const negative = value < 0 && Number(text) !== 0;
  return `${negative ? MINUS : ''}${grouped(text, GROUP)}`;
}

/** An integer with grouping: "8 224". */
export function formatInteger(value: number): string {
  if (!Number.isInteger(value)) throw new Error(`expected a whole number, got ${value}`);
  return `${value < 0 ? MINUS : ''}${grouped(String(Math.abs(value)), GROUP)}`;
}

/** A value and its unit: "0.9893 V"; "" unit gives the bare number. */
export function formatQuantity(value: number, unit: string, digits = 4): string {
  return unit ? `${formatNumber(value, digits)} ${unit}` : formatNumber(value, digits);
}

/** A fraction as a percentage: 0.58381 → "58.38 %". */
export function formatPercent(fraction: number, digits = 4): string {
  return `${formatNumber(fraction * 100, digits)} %`;
}

/** A temperature in kelvin and degrees Celsius: "1073.15 K (800.0 °C)". */
export function formatTemperature(kelvin: number): string {
  return kelvinWithCelsius(kelvin, (k) => formatFixed(k, 2), (c) => formatFixed(c, 1));
}

/** A temperature in degrees Celsius to 0.1, without its unit, as the stream tables and the flow diagram write it: "111.3". */
export function formatCelsius(kelvin: number): string {
  return formatFixed(kelvin - ZERO_CELSIUS_K, 1);
}

/** Power or heat flow in kW (W below 1 kW): "250.0 kW", "−19.54 kW", "640.0 W". */
export function formatPower(watts: number, digits = 4): string {
  return Math.abs(watts) >= 1000 ? formatQuantity(watts / 1000, 'kW', digits) : formatQuantity(watts, 'W', digits);
}

/**
 * The text with its first letter small, for a title continued after a lead ("Case rated: net
 * power"); an acronym stays as it is ("DC bus voltage", "LHV efficiency").
 */
export function uncapitalised(text: string): string {
  const second = text.charAt(1);
  return second !== '' && second === second.toUpperCase() && second !== second.toLowerCase() ? text : text.charAt(0).toLowerCase() + text.slice(1);
}

/** The text with its first letter a capital, for a name that starts a table row ("Water feed (oxygen electrode)"). */
export function capitalised(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}
