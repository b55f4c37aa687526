// The number formats of the document: significant digits, the true minus sign, grouping from
// 10 000, whole numbers in full, powers of ten outside 0.001 to 1e9, and LaTeX that reads the same.
import { describe, expect, it } from 'vitest';
import { formatFixed, formatNumber, formatPercent, formatPower, formatTemperature, formatTrimmed, texNumber, texTrimmed } from '../../lib/report/format.ts';
import { prettyUnit, unitTex, unitText } from '../../lib/report/units.ts';
import { cssString } from '../../lib/report/print-css.ts';

describe('formatNumber', () => {
  it('rounds to significant digits and keeps the trailing zeros that carry them', () => {
    expect(formatNumber(0.98931666)).toBe('0.9893');
    expect(formatNumber(1.2)).toBe('1.200');
    expect(formatNumber(0.9893, 6)).toBe('0.989300');
  });
  it('writes negative numbers with the minus sign U+2212 and never "−0"', () => {
    expect(formatNumber(-19.538)).toBe('\u221219.54');
    expect(formatNumber(-0.000001, 2)).toBe('\u22121.0 × 10⁻⁶');
    expect(formatFixed(-0.0001, 2)).toBe('0.00');
  });
  it('groups digits by a narrow no-break space from five digits up, and writes whole numbers in full', () => {
    expect(formatNumber(328960)).toBe('328\u202f960');
    expect(formatNumber(8224)).toBe('8224');
    expect(formatNumber(120000.5, 4)).toBe('120\u202f000');
  });
  it('uses a power of ten outside 0.001 to 1e9', () => {
    expect(formatNumber(3.2231e-5)).toBe('3.223 × 10⁻⁵');
    expect(formatNumber(2.5e10)).toBe('2.500 × 10¹⁰');
  });
  it('refuses a number that is not finite', () => {
    expect(() => formatNumber(Number.NaN)).toThrow(/cannot format/);
    expect(() => formatNumber(Number.POSITIVE_INFINITY)).toThrow(/cannot format/);
  });
});

describe('the other formats', () => {
  it('trims trailing zeros of exact values', () => {
    expect(formatTrimmed(0.01)).toBe('0.01');
    expect(formatTrimmed(1073.15)).toBe('1073.15');
    expect(formatTrimmed(0.8)).toBe('0.8');
    expect(texTrimmed(0.05)).toBe('0.05');
  });
  it('writes temperatures in K and °C, percentages and powers', () => {
    expect(formatTemperature(1073.15)).toBe('1073.15 K (800.0 °C)');
    expect(formatPercent(0.58381)).toBe('58.38 %');
    expect(formatPower(88494.05)).toBe('88.49 kW');
    expect(formatPower(640)).toBe('640 W');
    expect(formatPower(-19538)).toBe('\u221219.54 kW');
  });
  it('gives LaTeX that rounds the same way', () => {
    expect(texNumber(-19538.7)).toBe('-19\\,540');
    expect(texNumber(3.2231e-5)).toBe('3.223\\times10^{-5}');
    expect(texNumber(0.98931666, 5)).toBe('0.98932');
  });
  it('knows its units and refuses others', () => {
    expect(unitText('ohm cm2')).toBe('Ω cm²');
    expect(unitTex('A/cm2')).toBe('\\,\\mathrm{A/cm^2}');
    expect(() => unitTex('}\\href{x}')).toThrow(/not a unit/);
    expect(prettyUnit('ohm m2')).toBe('Ω m²');
    expect([prettyUnit('bar^2'), prettyUnit('kg/m3'), prettyUnit('J/(mol K)')]).toEqual(['bar²', 'kg/m³', 'J/(mol K)']);
  });
  it('escapes every character but letters, digits and spaces in CSS strings', () => {
    expect(cssString('DB-1 rev A').html).toBe('"DB\\2d 1 rev A"');
    const inner = (text: string) => cssString(text).html.slice(1, -1);
    expect(inner('x"; } body { color: red')).not.toMatch(/["';{}]/);
    expect(inner('</style>')).not.toMatch(/[<>/]/);
  });
});
