// Unit conversion spot checks of lib/core/units.ts against NIST SP 811 (2008), Appendix B (the
// patterns of the schema's unit strings are checked against the same parser in
// test/basis/unit-pattern.test.ts).
import { describe, expect, it } from 'vitest';
import { parseQuantity, type Dimension } from '../../lib/core/units.ts';

const si = (text: string, dimension: Dimension) => parseQuantity(text, dimension).si;

describe('conversion factors (NIST SP 811, Appendix B)', () => {
  it('pressure: psi = 6.894 757 kPa, atm = 101.325 kPa (exact), bar = 100 kPa (exact)', () => {
    expect(si('1 psi', 'pressure')).toBeCloseTo(6894.757, 3);
    expect(si('14.6959 psia', 'pressure')).toBeCloseTo(101325, 0);
    expect(si('1 atm', 'pressure')).toBe(101325);
    expect(si('1 bar', 'pressure')).toBe(100000);
    expect(si('0 psig', 'pressure')).toBe(101325);
    expect(si('10 psig', 'pressure')).toBeCloseTo(101325 + 68947.57, 1);
  });

  it('temperature: T/K = (t/°F + 459.67)/1.8 and T/K = t/°C + 273.15', () => {
    expect(si('212 F', 'temperature')).toBeCloseTo(373.15, 10);
    expect(si('32 °F', 'temperature')).toBeCloseTo(273.15, 10);
    expect(si('-40 F', 'temperature')).toBeCloseTo(si('-40 C', 'temperature'), 10);
    expect(si('491.67 R', 'temperature')).toBeCloseTo(273.15, 10);
    expect(si('800 °C', 'temperature')).toBeCloseTo(1073.15, 10);
    expect(si('18 F', 'temperature-difference')).toBeCloseTo(10, 12);
  });

  it('current density, area-specific resistance and mass flow (SI prefixes; day = 86 400 s)', () => {
    expect(si('0.4 A/cm²', 'current-density')).toBeCloseTo(4000, 9);
    expect(si('400 mA/cm^2', 'current-density')).toBeCloseTo(4000, 9);
    expect(si('0.35 Ω·cm²', 'area-specific-resistance')).toBeCloseTo(3.5e-5, 15);
    expect(si('86.4 kg/day', 'mass-flow')).toBeCloseTo(0.001, 12);
  });
});

describe('the unit examples a design basis is written with', () => {
  it('each converts to SI by the NIST SP 811 factor (psi = 6 894.757 Pa) or an SI prefix', () => {
    const cases: [string, Dimension, number][] = [
      ['800 C', 'temperature', 1073.15],
      ['1073.15 K', 'temperature', 1073.15],
      ['1.2 bar', 'pressure', 1.2e5],
      ['120 kPa', 'pressure', 1.2e5],
      ['14.7 psi', 'pressure', 14.7 * 6894.757],
      ['0.5 A/cm2', 'current-density', 5000],
      ['500 mA/cm^2', 'current-density', 5000],
      ['0.25 ohm cm2', 'area-specific-resistance', 2.5e-5],
      ['100 cm2', 'area', 0.01],
      ['250 kW', 'power', 2.5e5],
    ];
    // 1e-12 relative: these factors are exact (SI prefixes, bar, the Celsius offset), so only
    // rounding remains; psi is compared with NIST's 6 894.757 Pa, printed to 7 digits (exactly
    // 6 894.757 293 168 Pa, 4.3e-8 relative above it), hence 1e-7 there.
    for (const [text, dimension, expected] of cases) {
      const tolerance = text.endsWith('psi') ? 1e-7 : 1e-12;
      expect(Math.abs(si(text, dimension) / expected - 1), text).toBeLessThan(tolerance);
    }
  });

  it('a value of another dimension is refused, naming the dimension it has', () => {
    expect(() => parseQuantity('120 kPa', 'temperature')).toThrow(/expected a temperature .*got "120 kPa", which is a pressure/);
    expect(() => parseQuantity('250 kW', 'area')).toThrow(/which is a power/);
  });
});
