// Humid air: the water mole fraction is the vapour pressure over the electrode pressure, with
// the saturation pressure from IAPWS-IF97 region 4 (lib/thermo/water-saturation.ts).
import { describe, expect, it } from 'vitest';
import { loadBasisText } from '../../lib/basis/load.ts';
import { waterSaturationPressurePa } from '../../lib/thermo/water-saturation.ts';
import { findPreset } from '../../lib/basis/presets.ts';
import { BASE, edit } from '../helpers/basis-text.ts';

function airFeed(text: string): Record<string, number> {
  const result = loadBasisText(text, 'projects/t/basis.yaml', 't');
  if (!result.ok) throw new Error(JSON.stringify(result.errors));
  return result.basis.airElectrode!.composition;
}

describe('humid air', () => {
  it('dew point 15 °C: p_sat = 1.7058 kPa (IAPWS-95, Wagner & Pruss 2002; from memory), x_H2O = p_sat / p', () => {
    const pSatBar = waterSaturationPressurePa(288.15) / 1e5;
    // IF97 agrees with IAPWS-95 within 0.025 % (from memory); 1.7058 kPa is printed to 5 digits:
    // |Δ| ≤ 0.00043 + 0.00005 kPa. The species-data saturation pressure (0.1 % low, 0.0017 kPa) failed this.
    expect(Math.abs(pSatBar * 100 - 1.7058)).toBeLessThan(0.0005);
    const air = airFeed(BASE);
    expect(air.H2O).toBeCloseTo(pSatBar / 1.2, 12);
    expect(Math.abs(air.H2O! - 0.017058 / 1.2)).toBeLessThan(0.000005 / 1.2);
  });

  it('the dry part keeps the dry-air ratios, scaled by 1 − x_H2O, and everything sums to 1', () => {
    const air = airFeed(BASE);
    const dry = findPreset('dry-air')!.composition;
    for (const [species, x] of Object.entries(dry)) expect(air[species], species).toBeCloseTo(x * (1 - air.H2O!), 12);
    expect(Object.values(air).reduce((a, b) => a + b, 0)).toBeCloseTo(1, 12);
  });

  it('relative humidity 60 % at 25 °C, 1.01325 bar: x = 0.6 · 3.1699 kPa / 101.325 kPa (p_sat from IAPWS-95; from memory)', () => {
    const text = edit(BASE, ['humidity: { dew-point: "15 C" }', 'humidity: { relative-humidity: "60 %", at: "25 C" }'], ['air-electrode-pressure: "1.2 bar"', 'air-electrode-pressure: "1 atm"']);
    const air = airFeed(text);
    expect(air.H2O).toBeCloseTo((0.6 * waterSaturationPressurePa(298.15)) / 1e5 / 1.01325, 12);
    // 0.025 % of 3.1699 kPa plus half the last digit: 0.0009 kPa, times 0.6 / 101.325 kPa.
    expect(Math.abs(air.H2O! - (0.6 * 3.1699) / 101.325)).toBeLessThan((0.6 * 0.0009) / 101.325);
  });

  it('a relative humidity is converted where it is stated, at the ambient pressure, not at the 1.2 bar of the air electrode', () => {
    // RH is by definition the vapour pressure of the ambient air over p_sat(T) there, so with
    // Dalton's law x = RH · p_sat(T) / p_ambient, and compressing the air keeps x. The default ambient is the
    // standard atmosphere, 101 325 Pa (ISO 2533:1975). The fixture's air electrode is at 1.2 bar,
    // so the old conversion at the electrode gave 0.6 · 3.1699 / 120 kPa, 16 % less water.
    const rh = edit(BASE, ['humidity: { dew-point: "15 C" }', 'humidity: { relative-humidity: "60 %", at: "25 C" }']);
    const pSatKPa = waterSaturationPressurePa(298.15) / 1e3;
    expect(airFeed(rh).H2O).toBeCloseTo((0.6 * pSatKPa) / 101.325, 12);
    // 0.025 % of 3.1699 kPa plus half the last digit (as above); the old 1.2 bar answer lies 2.9e-3 away.
    expect(Math.abs(airFeed(rh).H2O! - (0.6 * 3.1699) / 101.325)).toBeLessThan((0.6 * 0.0009) / 101.325);
    // A site at 0.9 bar (about 900 m in the standard atmosphere): the same RH holds more water per mole.
    const high = edit(rh, ['air-electrode-pressure: "1.2 bar"', 'air-electrode-pressure: "1.2 bar"\n  ambient-pressure: "0.9 bar"']);
    expect(airFeed(high).H2O).toBeCloseTo((0.6 * pSatKPa) / 90, 12);
  });

  it('standard dry air: O2 20.9476 %, Ar 0.934 % (U.S. Standard Atmosphere 1976; from memory), CO2 about 420 ppm, N2 the balance', () => {
    const dry = findPreset('dry-air')!.composition;
    expect(dry).toEqual({ O2: 0.209476, Ar: 0.00934, CO2: 0.00042, N2: 0.780764 });
    expect(Object.values(dry).reduce((a, b) => a + b, 0)).toBeCloseTo(1, 12);
  });

  it('keeps what each form was converted with: T, φ, p_s(T), the pressure p and which it is, and x_H2O, the water of the composition', () => {
    const load = (text: string) => {
      const result = loadBasisText(text, 'projects/t/basis.yaml', 't');
      if (!result.ok) throw new Error(JSON.stringify(result.errors));
      return result.basis.airElectrode!;
    };
    const dew = load(BASE);
    // The fixture's dew point of 15 °C, at its 1.2 bar air electrode (the pressure the dew-point form did not keep before).
    expect(dew.humidity).toEqual({ form: 'dew-point', temperatureK: 288.15, relativeHumidity: null, saturationPressurePa: waterSaturationPressurePa(288.15), pressurePa: 120000, pressureOf: 'air-electrode', waterFraction: dew.composition.H2O });
    const rh = load(edit(BASE, ['humidity: { dew-point: "15 C" }', 'humidity: { relative-humidity: "70 %", at: "15 C" }']));
    expect(rh.humidity).toMatchObject({ form: 'relative-humidity', temperatureK: 288.15, pressureOf: 'ambient', waterFraction: rh.composition.H2O });
    expect(rh.humidity!.relativeHumidity).toBeCloseTo(0.7, 12);
    expect(rh.humidity!.pressurePa).toBeCloseTo(101325, 6);
    // By hand, the relative humidity of the CHP demo (70 % at 15 °C, the standard atmosphere):
    // 0.70 × 1705.8 Pa / 101 325 Pa = 1.1784 %, p_s(15 °C) = 1.7058 kPa (IAPWS-95 steam tables;
    // from memory) to its last digit plus IF97's 0.025 % (0.48 Pa, 3.3e-6 on x).
    expect(Math.abs(rh.humidity!.waterFraction - (0.7 * 1705.8) / 101325)).toBeLessThan(3.3e-6);
  });

  it('a humidity that needs more water pressure than the electrode pressure is refused', () => {
    const text = edit(BASE, ['dew-point: "15 C"', 'dew-point: "110 C"'], ['air-electrode-pressure: "1.2 bar"', 'air-electrode-pressure: "1 bar"']);
    const result = loadBasisText(text, 'f.yaml', 't');
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.errors.map((e) => e.message)).toEqual(['this humidity needs a water partial pressure above the air-electrode pressure, 1 bar: the air would be all steam']);
  });
});
