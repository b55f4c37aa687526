// Intercooled gas compression on the species data's c_p(T), against a textbook worked example
// and the constant-γ and isothermal textbook formulas.
import { describe, expect, it } from 'vitest';
import { compressGas, type CompressionRequest } from '../../lib/flowsheet/compression.ts';
import { FlowsheetInputError } from '../../lib/flowsheet/input-error.ts';
import { cp, enthalpy, entropy } from '../../lib/thermo/properties.ts';
import { getSpecies } from '../../lib/thermo/species-data.ts';
import { GAS_CONSTANT_J_PER_MOL_K as R } from '../../lib/thermo/constants.ts';

const hydrogen = (overrides: Partial<CompressionRequest> = {}): CompressionRequest => ({
  composition: { H2: 1 },
  molarFlowMolPerS: 10,
  inletTemperatureK: 298.15,
  inletPressureBar: 30,
  deliveryPressureBar: 350,
  stages: 3,
  isentropicEfficiency: 0.75,
  intercoolTemperatureK: 313.15,
  ...overrides,
});

/** The textbook's constant-γ stage work, J/mol: γ/(γ−1) R T (r^((γ−1)/γ) − 1) / η. */
const constantGammaWork = (gamma: number, temperatureK: number, ratio: number, efficiency: number) =>
  ((gamma / (gamma - 1)) * R * temperatureK * (ratio ** ((gamma - 1) / gamma) - 1)) / efficiency;

describe('compression work', () => {
  it('air from 100 kPa and 300 K to 900 kPa, isentropic: 263.2 kJ/kg in the textbook example', () => {
    // Y. A. Çengel and M. A. Boles, Thermodynamics: An Engineering Approach, ch. 7, example
    // "work input for various compression processes" (from memory): air, reversible adiabatic,
    // constant k = 1.4, w = k R T1/(k − 1) [(P2/P1)^((k−1)/k) − 1] = 263.2 kJ/kg. Here air's c_p
    // rises by 3.5 % between 300 and 560 K, which lowers the exact isentropic outlet (557.6 K
    // against the constant-k 562.0 K) and the work by 0.24 % (an independent recomputation on
    // the NASA polynomials gave 262.59 kJ/kg); 0.5 % covers that.
    const air = { N2: 0.78084, O2: 0.20946, Ar: 0.00934, CO2: 0.00036 };
    const result = compressGas({ composition: air, molarFlowMolPerS: 1, inletTemperatureK: 300, inletPressureBar: 1, deliveryPressureBar: 9, stages: 1, isentropicEfficiency: 1, intercoolTemperatureK: 300 });
    expect(Math.abs(result.workJPerKg / 1000 - 263.2) / 263.2).toBeLessThan(0.005);
    expect(Math.abs(result.workJPerKg / 1000 - 262.59)).toBeLessThan(0.01);
    expect(Math.abs(result.stages[0]!.isentropicOutletTemperatureK - 557.61)).toBeLessThan(0.01);
    // The constant-k formula of the example, evaluated here with its R = 0.287 kJ/(kg K):
    expect((1.4 * 0.287 * 300) / 0.4 * (9 ** (0.4 / 1.4) - 1)).toBeCloseTo(263.2, 1);
  });

  it('hydrogen in 3 stages: the constant-γ formula with γ from c_p at each stage inlet, within 0.3 %', () => {
    // γ = c_p/(c_p − R) from the species data at the stage inlet; hydrogen's c_p changes by under
    // 1.5 % between 300 and 550 K, so the two methods differ by 0.07 % here (recomputed
    // independently: 9458.90 against 9465.67 J/mol) and by 0.22 % for one stage of ratio 5.5
    // from 298 K; 0.3 % bounds both.
    const request = hydrogen();
    const result = compressGas(request);
    expect(result.stages).toHaveLength(3);
    const ratio = (350 / 30) ** (1 / 3);
    expect(Math.abs(result.pressureRatioPerStage - ratio)).toBeLessThan(1e-12);
    let handWork = 0;
    for (const s of result.stages) {
      const c = cp(getSpecies('H2'), s.inletTemperatureK);
      handWork += constantGammaWork(c / (c - R), s.inletTemperatureK, ratio, 0.75);
    }
    expect(Math.abs(result.workJPerMol / handWork - 1)).toBeLessThan(3e-3);
    expect(Math.abs(result.workJPerMol - 9458.9)).toBeLessThan(0.5);
    const single = compressGas(hydrogen({ inletPressureBar: 1, deliveryPressureBar: 30, stages: 2, isentropicEfficiency: 0.78 }));
    expect(Math.abs(single.workJPerMol - 14269.88)).toBeLessThan(0.5);
    // Stages 2 and 3 start from the intercooler's temperature at the same ratio, so do the same work.
    expect(result.stages[1]!.inletTemperatureK).toBe(313.15);
    expect(Math.abs(result.stages[2]!.workJPerMol - result.stages[1]!.workJPerMol)).toBeLessThan(1e-6);
  });

  it('tends to the isothermal work R T ln(p2/p1) as the ideal stages multiply', () => {
    // Çengel and Boles, ch. 7: isothermal compression w = R T ln(P2/P1) is the limit of ideal
    // intercooled stages. With N stages of c_p ≈ constant the excess is (R/c_p) ln(P2/P1)/(2N)
    // to first order, 0.066 % for hydrogen, 100:1 and N = 1000; the tolerance is that bound with
    // 10 % margin.
    const n = 1000;
    const result = compressGas(hydrogen({ inletTemperatureK: 300, intercoolTemperatureK: 300, inletPressureBar: 1, deliveryPressureBar: 100, stages: n, isentropicEfficiency: 1 }));
    const isothermal = R * 300 * Math.log(100);
    const excess = result.workJPerMol / isothermal - 1;
    const bound = ((R / cp(getSpecies('H2'), 300)) * Math.log(100)) / (2 * n);
    expect(excess).toBeGreaterThan(0);
    expect(excess).toBeLessThan(1.1 * bound);
  });

  it('the isentropic outlet has the inlet entropy, s°(T_s) − s°(T_1) = R ln r, and η_s sets the actual outlet', () => {
    const result = compressGas(hydrogen({ stages: 1 }));
    const stage = result.stages[0]!;
    const h2 = getSpecies('H2');
    const ds = entropy(h2, stage.isentropicOutletTemperatureK) - entropy(h2, stage.inletTemperatureK);
    expect(Math.abs(ds - R * Math.log(350 / 30))).toBeLessThan(1e-9);
    const dhIsentropic = enthalpy(h2, stage.isentropicOutletTemperatureK) - enthalpy(h2, stage.inletTemperatureK);
    expect(Math.abs(stage.isentropicWorkJPerMol - dhIsentropic)).toBeLessThan(1e-6);
    expect(Math.abs(enthalpy(h2, stage.outletTemperatureK) - enthalpy(h2, stage.inletTemperatureK) - dhIsentropic / 0.75)).toBeLessThan(1e-6);
    expect(stage.outletTemperatureK).toBeGreaterThan(stage.isentropicOutletTemperatureK);
    expect(Math.abs(stage.powerW - 10 * stage.workJPerMol)).toBeLessThan(1e-9);
  });
});

describe('coolers', () => {
  it('close the energy balance: power in = heat removed + enthalpy rise of the gas', () => {
    // First law for the compressor train as one open system (steady flow, coolers included).
    for (const deliveryTemperatureK of [undefined, 308.15]) {
      const result = compressGas(hydrogen(deliveryTemperatureK === undefined ? {} : { deliveryTemperatureK }));
      const h2 = getSpecies('H2');
      const rise = 10 * (enthalpy(h2, result.deliveryTemperatureK) - enthalpy(h2, 298.15));
      const removed = result.intercoolerDutyW + result.aftercoolerDutyW;
      expect(Math.abs(result.powerW - removed - rise) / result.powerW).toBeLessThan(1e-12);
    }
  });

  it('remove each stage outlet down to the intercooler temperature, and after the last only with a delivery temperature', () => {
    const without = compressGas(hydrogen());
    const h2 = getSpecies('H2');
    for (const s of without.stages.slice(0, -1)) {
      expect(s.cooledToK).toBe(313.15);
      expect(Math.abs(s.coolerDutyW - 10 * (enthalpy(h2, s.outletTemperatureK) - enthalpy(h2, 313.15)))).toBeLessThan(1e-9);
    }
    expect(without.aftercoolerDutyW).toBe(0);
    expect(without.stages[2]!.cooledToK).toBeNull();
    expect(without.deliveryTemperatureK).toBe(without.stages[2]!.outletTemperatureK);
    const withAfter = compressGas(hydrogen({ deliveryTemperatureK: 308.15 }));
    expect(withAfter.deliveryTemperatureK).toBe(308.15);
    expect(withAfter.aftercoolerDutyW).toBeGreaterThan(0);
    expect(withAfter.intercoolerDutyW).toBe(without.intercoolerDutyW);
  });

  it('more stages need less work (intercooling saves work, Çengel and Boles ch. 7)', () => {
    const work = [1, 2, 3, 4].map((stages) => compressGas(hydrogen({ stages, intercoolTemperatureK: 298.15 })).workJPerMol);
    for (let k = 1; k < work.length; k++) expect(work[k]!).toBeLessThan(work[k - 1]!);
  });
});

describe('bad input', () => {
  it('names the field', () => {
    const cases: [Partial<CompressionRequest>, RegExp][] = [
      [{ stages: 0 }, /^stages must be a whole number of at least 1, got 0/],
      [{ stages: 2.5 }, /^stages /],
      [{ isentropicEfficiency: 1.2 }, /^isentropicEfficiency must lie in \(0, 1\]/],
      [{ deliveryPressureBar: 20 }, /^deliveryPressureBar must be above the inlet pressure \(30 bar\)/],
      [{ inletTemperatureK: -1 }, /^inletTemperatureK must be a positive number of K/],
      [{ molarFlowMolPerS: Number.NaN }, /^molarFlowMolPerS /],
      [{ composition: {} }, /^composition /],
    ];
    for (const [overrides, message] of cases) {
      expect(() => compressGas(hydrogen(overrides))).toThrow(FlowsheetInputError);
      expect(() => compressGas(hydrogen(overrides))).toThrow(message);
    }
  });
});
