// Water's saturation line by IAPWS-IF97 region 4, checked against the release's own
// verification tables and against steam tables built on IAPWS-95.
import { describe, expect, it } from 'vitest';
import {
  SaturationRangeError,
  saturationRange,
  waterDewPointK,
  waterSaturationPressurePa,
  waterSaturationTemperatureK,
} from '../../lib/thermo/water-saturation.ts';

describe('IAPWS-IF97 region 4', () => {
  it('reproduces Table 35 of the release (saturation pressure, eq. 30) to every printed digit', () => {
    // IAPWS, Revised Release on IF97 (2007), Table 35, quoted from memory; the values are printed
    // to nine significant digits, and the tolerance is half a unit in the last one.
    const table35: [number, number, number][] = [
      // [K, MPa, half a unit in the last printed digit, MPa]
      [300, 0.353658941e-2, 0.5e-11],
      [500, 0.263889776e1, 0.5e-8],
      [600, 0.123443146e2, 0.5e-7],
    ];
    for (const [temperatureK, pressureMPa, half] of table35) {
      expect(Math.abs(waterSaturationPressurePa(temperatureK) / 1e6 - pressureMPa), `${temperatureK} K`).toBeLessThan(half);
    }
  });

  it('reproduces Table 36 of the release (saturation temperature, eq. 31) to every printed digit', () => {
    // IAPWS, Revised Release on IF97 (2007), Table 36, quoted from memory; printed to 1e-6 K, and
    // the tolerance is half a unit in that digit.
    const table36: [number, number][] = [
      [0.1, 0.372755919e3],
      [1, 0.453035632e3],
      [10, 0.584149488e3],
    ];
    for (const [pressureMPa, temperatureK] of table36) {
      expect(Math.abs(waterSaturationTemperatureK(pressureMPa * 1e6) - temperatureK), `${pressureMPa} MPa`).toBeLessThan(0.5e-6);
    }
  });

  it('agrees with IAPWS-95 steam tables at the points a plant uses', () => {
    // Saturation pressures of the IAPWS-95 formulation (W. Wagner and A. Pruss, J. Phys. Chem.
    // Ref. Data 31 (2002) 387, saturation table), quoted from memory. IF97 is a fit to IAPWS-95;
    // at these four temperatures the two differ by at most 0.006 % (25 °C, computed with an
    // independent IAPWS-95 implementation), so the tolerance is half a unit in the last printed
    // digit plus 0.01 %.
    const iapws95: [number, number, number][] = [
      // [°C, kPa, half a unit in the last printed digit, kPa]
      [25, 3.1699, 0.00005],
      [50, 12.352, 0.0005],
      [80, 47.414, 0.0005],
      [100, 101.418, 0.0005],
    ];
    for (const [celsius, kPa, printed] of iapws95) {
      const computed = waterSaturationPressurePa(celsius + 273.15) / 1000;
      expect(Math.abs(computed - kPa), `${celsius} °C`).toBeLessThan(printed + 1e-4 * kPa);
    }
    // The normal boiling point: 99.974 °C at 101.325 kPa on ITS-90 (IAPWS-95; Wagner and Pruss
    // 2002), from memory; 1 mK covers IF97's consistency with IAPWS-95 there.
    expect(Math.abs(waterSaturationTemperatureK(101325) - 273.15 - 99.974)).toBeLessThan(0.001);
    // Çengel and Boles, Table A-5 (saturated water, pressure table), from memory: 10 kPa 45.81 °C,
    // 15 kPa 53.97 °C, 1 MPa 179.88 °C; printed to 0.01 K.
    expect(Math.abs(waterSaturationTemperatureK(10e3) - 273.15 - 45.81)).toBeLessThan(0.005 + 0.002);
    expect(Math.abs(waterSaturationTemperatureK(15e3) - 273.15 - 53.97)).toBeLessThan(0.005 + 0.002);
    expect(Math.abs(waterSaturationTemperatureK(1e6) - 273.15 - 179.88)).toBeLessThan(0.005 + 0.002);
  });

  it('eqs. 30 and 31 invert each other along the whole line', () => {
    // Both solve the same quadratic (eq. 29), so they agree to rounding (a few 1e-13 K); 1e-9 K
    // leaves room for the square roots' rounding near the critical point.
    const { lowK, highK } = saturationRange();
    for (let k = 0; k <= 40; k++) {
      const t = lowK + ((highK - lowK) * k) / 40;
      expect(Math.abs(waterSaturationTemperatureK(waterSaturationPressurePa(t)) - t), `${t} K`).toBeLessThan(1e-9);
    }
  });

  it('gives the range ends as the release states them: 611.213 Pa at 273.15 K, 22.064 MPa at 647.096 K', () => {
    // Release, section 8.1: p_s(273.15 K) = 611.213 Pa (printed to 1 mPa) and the critical
    // pressure 22.064 MPa (IAPWS, the critical point of water).
    const range = saturationRange();
    expect(Math.abs(range.lowPa - 611.213)).toBeLessThan(0.0005);
    expect(Math.abs(range.highPa - 22.064e6)).toBeLessThan(1);
  });

  it('refuses temperatures and pressures off the line, naming the range', () => {
    expect(() => waterSaturationPressurePa(270)).toThrow(SaturationRangeError);
    expect(() => waterSaturationPressurePa(650)).toThrow(/outside the range of the IAPWS-IF97 saturation line, 273\.15 K \(0 °C\) to 647\.10 K/);
    expect(() => waterSaturationTemperatureK(500)).toThrow(SaturationRangeError);
    expect(() => waterSaturationTemperatureK(23e6)).toThrow(/pressure 2\.30000e\+7 Pa is outside/);
    expect(() => waterSaturationPressurePa(Number.NaN)).toThrow(SaturationRangeError);
  });
});

describe('dew point', () => {
  it('of the products of ethane burnt with 20 % excess air (a textbook example)', () => {
    // Y. A. Çengel and M. A. Boles, Thermodynamics: An Engineering Approach, ch. 15, example
    // "dew-point temperature of combustion products", from memory: C2H6 + 4.2 (O2 + 3.76 N2) →
    // 2 CO2 + 3 H2O + 0.7 O2 + 15.79 N2 at 100 kPa, so p_v = 3/21.49 · 100 kPa = 13.96 kPa and
    // T_dp = 52.3 °C. The book interpolates linearly in its Table A-5 between 10 kPa (45.81 °C)
    // and 15 kPa (53.97 °C), which reads 0.2 K low against the curved line here (52.49 °C), so
    // the tolerance is 0.3 K.
    const total = 2 + 3 + 0.7 + 15.79;
    const pv = (3 / total) * 100e3;
    expect(pv / 1000).toBeCloseTo(13.96, 2);
    expect(Math.abs(waterDewPointK(pv) - 273.15 - 52.3)).toBeLessThan(0.3);
    // The book's own interpolation, reproduced from the two table rows above, within 0.01 K:
    const interpolated = 45.81 + ((pv / 1000 - 10) / 5) * (53.97 - 45.81);
    expect(Math.abs(interpolated - 52.3)).toBeLessThan(0.05);
  });

  it('of air saturated at 25 °C is 25 °C, and a drier gas has a lower one', () => {
    const pSat = waterSaturationPressurePa(298.15);
    expect(Math.abs(waterDewPointK(pSat) - 298.15)).toBeLessThan(1e-9);
    expect(waterDewPointK(0.5 * pSat)).toBeLessThan(298.15);
    // Half the vapour pressure at 25 °C (1.585 kPa) saturates at 13.9 °C (Table A-5 of Çengel
    // and Boles lists 1.5 kPa at 13.02 °C and 2.0 kPa at 17.50 °C, from memory).
    const dew = waterDewPointK(0.5 * pSat) - 273.15;
    expect(dew).toBeGreaterThan(13.02);
    expect(dew).toBeLessThan(17.5);
  });

  it('refuses a vapour pressure below the triple point (frost, not dew)', () => {
    expect(() => waterDewPointK(500)).toThrow(SaturationRangeError);
  });
});
