// Heat recoverable from an exhaust, without and with condensation, against the heating values
// of methane (the recovered heat of its combustion products cooled to 25 °C is its LHV without
// condensation and approaches its HHV with it), the dew point by IAPWS-IF97 and the first law.
import { describe, expect, it } from 'vitest';
import { exhaustHeatRecovery } from '../../lib/flowsheet/heat-recovery.ts';
import { FlowsheetInputError } from '../../lib/flowsheet/input-error.ts';
import { enthalpy } from '../../lib/thermo/properties.ts';
import { getSpecies } from '../../lib/thermo/species-data.ts';
import { completeCombustionK, enthalpyBySpecies } from '../helpers/hand-enthalpy.ts';

const h = (label: string, temperatureK: number) => enthalpy(getSpecies(label), temperatureK);

// Products of complete stoichiometric combustion of 1 mol/s of methane with dry air (O2 + 3.76 N2).
const products = { CO2: 1, H2O: 2, N2: 7.52 };
const reactants = { CH4: 1, O2: 2, N2: 7.52 };

describe('exhaust heat recovery', () => {
  const inletK = completeCombustionK(reactants, products);
  const to25 = exhaustHeatRecovery({ flowsMolPerS: products, inletTemperatureK: inletK, exitTemperatureK: 298.15, pressureBar: 1.01325 });

  it('without condensation, cooling the products to 25 °C recovers the fuel’s lower heating value', () => {
    // The products hold the reactants' enthalpy, so cooling them to 298.15 K as vapour gives back
    // −ΔH of combustion with water as vapour: the LHV of methane, 802.3 kJ/mol (NIST Chemistry
    // WebBook ΔcH°gas = −890.7 kJ/mol less 2 × 44.0 kJ/mol, from memory; Çengel and Boles Table A-27
    // give 50 050 kJ/kg = 802.9 kJ/mol). 0.2 % covers the sources' spread.
    expect(Math.abs(to25.heatWithoutCondensationW / 802.3e3 - 1)).toBeLessThan(2e-3);
  });

  it('with condensation it recovers most of the gap to the HHV: the gas leaves saturated at 25 °C', () => {
    // Hand: ṅ_dry = 8.52 mol/s; p_s(25 °C) = 3169.7 Pa (IAPWS-IF97; steam tables 3.1699 kPa), so
    // ṅ_vapour = 8.52 · 3169.7 / (101 325 − 3169.7) = 0.2751 mol/s stays, 1.7249 mol/s condenses,
    // and its latent heat, 1.7249 × 44.0 kJ/mol = 75.9 kW, adds to the LHV: 878.5 kW (an
    // independent recomputation: 878 457.97 W). All water condensed would give the HHV,
    // 890.3 kJ/mol (Çengel and Boles Table A-27, 55 530 kJ/kg, from memory); the vapour left at
    // saturation keeps 12 kW of it.
    expect(Math.abs(to25.condensedWaterMolPerS - 1.7249)).toBeLessThan(1e-4);
    expect(Math.abs(to25.heatWithCondensationW - 878457.97)).toBeLessThan(0.5);
    expect(to25.heatWithCondensationW).toBeLessThan(890.3e3);
    expect(Math.abs(to25.latentHeatW - to25.condensedWaterMolPerS * 44.0e3) / to25.latentHeatW).toBeLessThan(1e-3);
    expect(Math.abs(to25.condensedWaterKgPerS - 1.7249 * 0.01801528)).toBeLessThan(1e-5);
    const leaving = to25.exitGasMolPerS;
    expect(Math.abs(leaving.H2O! / (leaving.H2O! + 8.52) * 101325 - 3169.75)).toBeLessThan(0.05);
  });

  it('closes the first law: inlet enthalpy − exit gas − condensate = heat recovered', () => {
    for (const exitTemperatureK of [298.15, 323.15, 340]) {
      const r = exhaustHeatRecovery({ flowsMolPerS: products, inletTemperatureK: inletK, exitTemperatureK, pressureBar: 1.01325 });
      const out = enthalpyBySpecies(r.exitGasMolPerS, exitTemperatureK) + r.condensedWaterMolPerS * h('H2O(L)', exitTemperatureK);
      expect(Math.abs(enthalpyBySpecies(products, inletK) - out - r.heatWithCondensationW) / r.heatWithCondensationW).toBeLessThan(1e-12);
    }
  });

  it('gives the dew point of the products: 59.2 °C at 19.26 kPa of vapour', () => {
    // p_w = 2/10.52 · 101 325 Pa = 19 263 Pa. Çengel and Boles Table A-5 (from memory) lists 15 kPa
    // at 53.97 °C and 20 kPa at 60.06 °C; IF97 gives 59.25 °C (recomputed independently).
    expect(Math.abs(to25.waterPartialPressurePa - 19263.3)).toBeLessThan(0.1);
    const dew = to25.dewPointK! - 273.15;
    expect(dew).toBeGreaterThan(53.97);
    expect(dew).toBeLessThan(60.06);
    expect(Math.abs(dew - 59.25)).toBeLessThan(0.01);
  });

  it('condenses nothing above the dew point, and a little just below it', () => {
    const above = exhaustHeatRecovery({ flowsMolPerS: products, inletTemperatureK: inletK, exitTemperatureK: 340, pressureBar: 1.01325 });
    expect(above.condensedWaterMolPerS).toBe(0);
    expect(above.latentHeatW).toBe(0);
    expect(above.heatWithCondensationW).toBe(above.heatWithoutCondensationW);
    expect(above.exitGasMolPerS).toEqual(products);
    // 50 °C: ṅ_vapour = 8.52 · 12 351 / (101 325 − 12 351) = 1.1827 mol/s (independent: 1.182740).
    const at50 = exhaustHeatRecovery({ flowsMolPerS: products, inletTemperatureK: inletK, exitTemperatureK: 323.15, pressureBar: 1.01325 });
    expect(Math.abs(at50.condensedWaterMolPerS - (2 - 1.18274))).toBeLessThan(1e-5);
    const justBelow = exhaustHeatRecovery({ flowsMolPerS: products, inletTemperatureK: inletK, exitTemperatureK: to25.dewPointK! - 0.01, pressureBar: 1.01325 });
    expect(justBelow.condensedWaterMolPerS).toBeGreaterThan(0);
    expect(justBelow.condensedWaterMolPerS).toBeLessThan(0.01);
  });

  it('a pressurised exhaust has a higher dew point and condenses more at the same exit temperature', () => {
    const atmospheric = exhaustHeatRecovery({ flowsMolPerS: products, inletTemperatureK: 800, exitTemperatureK: 330, pressureBar: 1.01325 });
    const pressurised = exhaustHeatRecovery({ flowsMolPerS: products, inletTemperatureK: 800, exitTemperatureK: 330, pressureBar: 3 });
    expect(pressurised.dewPointK!).toBeGreaterThan(atmospheric.dewPointK!);
    expect(pressurised.condensedWaterMolPerS).toBeGreaterThan(atmospheric.condensedWaterMolPerS);
    // Sensible heat does not depend on pressure (ideal gas).
    expect(pressurised.heatWithoutCondensationW).toBe(atmospheric.heatWithoutCondensationW);
  });

  it('a dry exhaust has no dew point and nothing to condense', () => {
    const dry = exhaustHeatRecovery({ flowsMolPerS: { N2: 3.76, O2: 1 }, inletTemperatureK: 600, exitTemperatureK: 300, pressureBar: 1 });
    expect(dry.dewPointK).toBeNull();
    expect(dry.condensedWaterMolPerS).toBe(0);
    expect(dry.heatWithoutCondensationW).toBeCloseTo(enthalpyBySpecies({ N2: 3.76, O2: 1 }, 600) - enthalpyBySpecies({ N2: 3.76, O2: 1 }, 300), 6);
    // Vapour below 611.2 Pa would deposit as frost: no dew point is given.
    const frost = exhaustHeatRecovery({ flowsMolPerS: { N2: 1, H2O: 0.001 }, inletTemperatureK: 400, exitTemperatureK: 300, pressureBar: 1 });
    expect(frost.dewPointK).toBeNull();
  });
});

describe('bad input', () => {
  it('names the field', () => {
    const base = { flowsMolPerS: products, inletTemperatureK: 500, exitTemperatureK: 320, pressureBar: 1 };
    const cases: [Record<string, unknown>, string][] = [
      [{ exitTemperatureK: 600 }, 'exitTemperatureK'],
      [{ pressureBar: 0 }, 'pressureBar'],
      [{ flowsMolPerS: { N2: 1, 'H2O(L)': 1 } }, 'flowsMolPerS'],
      [{ flowsMolPerS: { N2: -1 } }, 'flowsMolPerS'],
    ];
    for (const [overrides, field] of cases) {
      let caught: unknown;
      try {
        exhaustHeatRecovery({ ...base, ...overrides });
      } catch (error) {
        caught = error;
      }
      expect(caught, field).toBeInstanceOf(FlowsheetInputError);
      expect((caught as FlowsheetInputError).field).toBe(field);
    }
  });
});
