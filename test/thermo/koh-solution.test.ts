// Water activity of aqueous KOH by Balej's correlation (Int. J. Hydrogen Energy 10 (1985) 233-243;
// coefficients quoted from memory through Ulleberg, Int. J. Hydrogen Energy 28 (2003) 21-33),
// checked against the steam tables for its pure-water line, against the other published fit of
// the activity, and against an independent recomputation outside the repository.
import { describe, expect, it } from 'vitest';
import {
  balejWaterVapourPressureBar,
  kohCorrelationRange,
  KohRangeError,
  kohMolality,
  kohWaterActivity,
} from '../../lib/thermo/koh-solution.ts';
import { waterSaturationPressurePa } from '../../lib/thermo/water-saturation.ts';

/** The exponential fit of a_w(m, T) used beside Balej's in alkaline-electrolyser models (Ulleberg 2003; from memory). */
function activityExponentialFit(m: number, temperatureK: number): number {
  return Math.exp(-0.05192 * m + 0.003302 * m * m + (3.177 * m - 2.131 * m * m) / temperatureK);
}

/** The mass fraction of molality m, with M_KOH = 56.1056 g/mol (IUPAC standard atomic weights). */
const massFraction = (m: number) => (m * 0.0561056) / (1 + m * 0.0561056);

describe("KOH solution water activity (Balej 1985)", () => {
  it('30 wt % KOH is 7.6387 mol/kg (M_KOH 56.1056 g/mol): m = w / ((1 − w) M), by hand', () => {
    // 0.30 / (0.70 × 0.0561056) = 7.63866 mol/kg.
    expect(kohMolality(0.3)).toBeCloseTo(7.63866, 4);
  });

  it('the pure-water line is the steam tables: 1.0123 bar at 100 °C, within 0.2 % of IAPWS-IF97 from 25 to 150 °C', () => {
    // 1.01325 bar boils at 99.974 °C (IAPWS); Balej's line reads 0.1 % low there, which a ratio of two of its own pressures cancels.
    for (let c = 25; c <= 150; c += 5) {
      const t = 273.15 + c;
      const relative = balejWaterVapourPressureBar(t) / (waterSaturationPressurePa(t) / 1e5) - 1;
      expect(Math.abs(relative), `${c} °C`).toBeLessThan(0.002);
    }
  });

  it('matches the exponential fit of a_w within 2.1 % at 2 to 18 mol/kg and 25 to 100 °C, 3.5 % from 0 °C to 150 °C, 6 % to 200 °C', () => {
    // Two independent fits of the same measurements (both from memory): their spread is the
    // uncertainty of a_w, about 1 mV of Nernst voltage at 80 °C per 2 %.
    for (let m = 2; m <= 18; m++) {
      for (let c = 0; c <= 200; c += 5) {
        const t = 273.15 + c;
        const bound = c >= 25 && c <= 100 ? 0.021 : c <= 150 ? 0.035 : 0.06;
        const relative = kohWaterActivity(massFraction(m), t) / activityExponentialFit(m, t) - 1;
        expect(Math.abs(relative), `${m} mol/kg, ${c} °C`).toBeLessThan(bound);
      }
    }
  });

  it('30 wt % at 80 °C: a_w = 0.61721 (independent recomputation outside the repository), far below the 1 assumed before', () => {
    expect(kohWaterActivity(0.3, 353.15)).toBeCloseTo(0.61721, 4);
    // Water vapour over the lye: a_w p_s = 0.61721 × 47.4147 kPa = 29.265 kPa.
    expect((kohWaterActivity(0.3, 353.15) * waterSaturationPressurePa(353.15)) / 1e3).toBeCloseTo(29.265, 2);
  });

  it('more KOH, less water activity; warmer, more (the fits agree on both trends)', () => {
    expect(kohWaterActivity(0.35, 353.15)).toBeLessThan(kohWaterActivity(0.25, 353.15));
    expect(kohWaterActivity(0.3, 373.15)).toBeGreaterThan(kohWaterActivity(0.3, 323.15));
  });

  it('outside 2 to 18 mol/kg (10.1 to 50.2 wt %) or 0 to 200 °C the correlation refuses, naming its range', () => {
    const range = kohCorrelationRange();
    expect(range.lowMassFraction).toBeCloseTo(0.10089, 4);
    expect(range.highMassFraction).toBeCloseTo(0.50246, 4);
    expect(() => kohWaterActivity(0.05, 353.15)).toThrow(KohRangeError);
    expect(() => kohWaterActivity(0.55, 353.15)).toThrow(/10\.1 wt % to 50\.2 wt %/);
    expect(() => kohWaterActivity(0.3, 480)).toThrow(/273\.15 K to 473\.15 K/);
  });
});
