// The uniform-voltage cell of lib/plant/voltage.ts against closed forms written out here: a
// Nernst voltage falling linearly along the cell, E(u) = a − b u, whose harmonic-mean integral is
// ∫₀^U du/(a − b u − V) = ln((a − V)/(a − b U − V))/b (elementary calculus); a uniform Nernst
// voltage, for which V = E − j ASR; and the mixed conductor's equivalent circuit (ionic branch
// ASR/t_ion with the Nernst source, electronic branch ASR/(1 − t_ion); e.g. M. Gödickemeier and
// L. J. Gauckler, J. Electrochem. Soc. 145 (1998) 414, from memory), whose leakage (1 − t_ion) V/ASR
// carries no ions. Then the whole calculation on bases where E is uniform along the cell, so the
// hand formulas hold exactly, and the design points that cannot be reached.
import { describe, expect, it } from 'vitest';
import { operatingVoltage, type CellVoltageRequest } from '../../lib/plant/voltage.ts';
import type { Profile } from '../../lib/equilibrium/path-integral.ts';
import { calculate } from '../../lib/plant/calculate.ts';
import { BasisError } from '../../lib/basis/diagnostics.ts';
import { CalculationError } from '../../lib/core/errors.ts';
import { hydrogenStandardVoltage } from '../../lib/electrochem/nernst.ts';
import { FARADAY_C_PER_MOL as F, GAS_CONSTANT_J_PER_MOL_K as R } from '../../lib/thermo/constants.ts';
import { waterSaturationPressurePa } from '../../lib/thermo/water-saturation.ts';

/** Water's vapour pressure by IAPWS-IF97 eq. 30, bar (1 bar = 10⁵ Pa). */
const saturationPressureBar = (temperatureK: number) => waterSaturationPressurePa(temperatureK) / 1e5;
import { basisFrom } from '../helpers/scaffold-basis.ts';

/** A profile of E(u) = a − b u on a grid (piecewise linear, so the linear interpolation is exact). */
function linearProfile(a: number, b: number, u: number, n = 7): { profile: Profile; points: { utilization: number; nernstV: number }[] } {
  const us = Array.from({ length: n }, (_, k) => (u * k) / (n - 1));
  const points = us.map((x) => ({ utilization: x, nernstV: a - b * x }));
  return {
    profile: { utilization: Float64Array.from(us), value: Float64Array.from(points, (p) => p.nernstV), logIntervals: 0, logTail: false },
    points,
  };
}

function request(over: Partial<CellVoltageRequest> & Pick<CellVoltageRequest, 'profile' | 'points' | 'model'>): CellVoltageRequest {
  return {
    mode: 'power',
    utilization: 0.8,
    currentDensityAPerM2: 5000,
    ionicTransferenceNumber: 1,
    crossoverAllowanceV: 0,
    inletNernstV: over.points[0]!.nernstV,
    ...over,
  };
}

const closedForm = (a: number, b: number, u: number, v: number) => Math.log((a - v) / (a - b * u - v)) / b;

describe('the uniform-voltage cell against the closed form of a linearly falling Nernst voltage', () => {
  // E falls from 1.00 V to 0.88 V over U = 0.8, as in a hydrogen cell (order of magnitude only).
  const a = 1.0;
  const b = 0.15;
  const u = 0.8;
  const { profile, points } = linearProfile(a, b, u);
  const asr = 0.3e-4; // 0.3 ohm cm2
  const j = 5000; // 0.5 A/cm2

  it('solves U/(j ASR) = ln((a − V)/(a − b U − V))/b for V from the resistance', () => {
    const r = operatingVoltage(request({ profile, points, model: { kind: 'area-specific-resistance', ohmM2: asr } }));
    // The equation holds to rounding (the root is found to 1e-13 V; the integral is exact for linear E).
    expect(Math.abs(u / (j * asr) - closedForm(a, b, u, r.cellVoltageV))).toBeLessThan(1e-9);
    expect(Math.abs(r.harmonicIntegralPerV - closedForm(a, b, u, r.cellVoltageV))).toBeLessThan(1e-12);
    // The charge-mean form a − bU/2 − j ASR overstates V: the outlet draws less current and needs more area.
    expect(r.cellVoltageV).toBeLessThan(a - (b * u) / 2 - j * asr);
    // V = Ē_A − j ASR with the area-mean Nernst voltage.
    expect(r.effectiveNernstV - j * asr).toBeCloseTo(r.cellVoltageV, 12);
  });

  it('gives the implied resistance of a given voltage, ASR = U b/(j ln((a − V)/(a − b U − V)))', () => {
    const v = 0.7;
    const r = operatingVoltage(request({ profile, points, model: { kind: 'given', cellVoltageV: v } }));
    expect(r.areaSpecificResistanceOhmM2 / ((u * b) / (j * Math.log((a - v) / (a - b * u - v))))).toBeCloseTo(1, 12);
  });

  it('local current density (E(u) − V)/ASR, highest at the inlet; the area fraction to u is ∫₀^u du/(E − V) over the whole integral', () => {
    const r = operatingVoltage(request({ profile, points, model: { kind: 'area-specific-resistance', ohmM2: asr } }));
    const v = r.cellVoltageV;
    for (const [k, p] of r.local.entries()) {
      const x = points[k]!.utilization;
      expect(p.currentDensityAPerM2).toBeCloseTo((a - b * x - v) / asr, 6);
      expect(p.areaFraction).toBeCloseTo(closedForm(a, b, x, v) / closedForm(a, b, u, v) || 0, 12);
    }
    expect(r.maxLocalCurrentDensityAPerM2).toBeCloseTo((a - v) / asr, 6);
    // The mean of the local current density over the area is j.
    expect(u / (asr * r.harmonicIntegralPerV)).toBeCloseTo(j, 6);
  });

  it('electrolysis: E rising as a + b u, U/(j ASR) = ∫ du/(V − a − b u) = ln((V − a)/(V − a − b U))/b', () => {
    const up = linearProfile(0.9, -0.1, 0.7);
    const r = operatingVoltage(request({ ...up, mode: 'electrolysis', utilization: 0.7, currentDensityAPerM2: 10000, model: { kind: 'area-specific-resistance', ohmM2: 0.25e-4 } }));
    const v = r.cellVoltageV;
    expect(Math.abs(0.7 / (10000 * 0.25e-4) - Math.log((v - 0.9) / (v - 0.9 - 0.1 * 0.7)) / 0.1)).toBeLessThan(1e-9);
    expect(r.effectiveNernstV + 10000 * 0.25e-4).toBeCloseTo(v, 12);
  });
});

describe('a uniform Nernst voltage: V = E − j ASR; a mixed conductor by its equivalent circuit', () => {
  const e = 1.05;
  const { profile, points } = linearProfile(e, 0, 0.8);

  it('power, t_ion = 1: V = E − ΔV_x − j ASR', () => {
    const r = operatingVoltage(request({ profile, points, crossoverAllowanceV: 0.01, model: { kind: 'area-specific-resistance', ohmM2: 0.4e-4 } }));
    expect(r.cellVoltageV).toBeCloseTo(e - 0.01 - 5000 * 0.4e-4, 12);
  });

  it('power, t_ion = 0.9: V = t E − ΔV_x − j ASR at the terminals; the ions carry j + (1 − t) V/ASR', () => {
    const t = 0.9;
    const asr = 0.4e-4;
    const r = operatingVoltage(request({ profile, points, ionicTransferenceNumber: t, crossoverAllowanceV: 0.01, model: { kind: 'area-specific-resistance', ohmM2: asr } }));
    const v = t * e - 0.01 - 5000 * asr;
    expect(r.cellVoltageV).toBeCloseTo(v, 12);
    expect(r.leakageCurrentDensityAPerM2).toBeCloseTo(((1 - t) * v) / asr, 9);
    expect(r.ionicCurrentDensityAPerM2).toBeCloseTo(5000 + ((1 - t) * v) / asr, 9);
    // The ionic branch: (E − ΔV_x/t − V)/(ASR/t), the same number.
    expect(r.ionicCurrentDensityAPerM2).toBeCloseTo((e - 0.01 / t - v) / (asr / t), 9);
    expect(r.openCircuitV).toBeCloseTo(t * e - 0.01, 12);
  });

  it('electrolysis, t_ion = 0.9: V = t E + j ASR; the ions carry j − (1 − t) V/ASR (the crossover allowance is a power-mode allowance)', () => {
    const t = 0.9;
    const asr = 0.5e-4;
    const r = operatingVoltage(request({ profile, points, mode: 'electrolysis', ionicTransferenceNumber: t, crossoverAllowanceV: 0.01, currentDensityAPerM2: 10000, model: { kind: 'area-specific-resistance', ohmM2: asr } }));
    const v = t * e + 10000 * asr;
    expect(r.cellVoltageV).toBeCloseTo(v, 12);
    expect(r.ionicCurrentDensityAPerM2).toBeCloseTo(10000 - ((1 - t) * v) / asr, 9);
    expect(r.ionicCurrentDensityAPerM2).toBeCloseTo((v - e) / (asr / t), 9);
  });
});

describe('design points that cannot be reached are refused at their field, naming the limit', () => {
  const { profile, points } = linearProfile(1.0, 0.15, 0.8);

  it('power: a given voltage at or above the lowest Nernst voltage (the outlet\'s) reverses the local current before the utilization', () => {
    expect(() => operatingVoltage(request({ profile, points, model: { kind: 'given', cellVoltageV: 0.9 } }))).toThrow(
      /cell voltage 0\.9000 V is not below the lowest Nernst voltage available along the cell, 0\.8800 V: the local current would reverse before the fuel utilization 80\.00 % is reached/,
    );
    try {
      operatingVoltage(request({ profile, points, model: { kind: 'given', cellVoltageV: 0.9 } }));
    } catch (error) {
      expect(error).toBeInstanceOf(CalculationError);
      expect((error as CalculationError).field).toBe('cell-voltage');
    }
  });

  it('electrolysis: a given voltage at or below the highest Nernst voltage', () => {
    const up = linearProfile(0.9, -0.1, 0.7);
    expect(() => operatingVoltage(request({ ...up, mode: 'electrolysis', utilization: 0.7, model: { kind: 'given', cellVoltageV: 0.95 } }))).toThrow(
      /not above the highest Nernst voltage along the cell, 0\.9700 V: the local current would reverse before the steam conversion 70\.00 % is reached/,
    );
  });

  it('a mixed conductor whose leakage leaves no net current at the given voltage: implied resistance not physical, with the highest workable voltage', () => {
    // t = 0.5, E = 1.05 uniform: the ions carry (t E − t V)/ASR, the electrons leak (1 − t) V/ASR; a net
    // current flows only while t (E − V) > (1 − t) V, i.e. V < t E = 0.525 V.
    const flat = linearProfile(1.05, 0, 0.8);
    expect(() => operatingVoltage(request({ ...flat, ionicTransferenceNumber: 0.5, model: { kind: 'given', cellVoltageV: 0.6 } }))).toThrow(/leaves no net current.*below 0\.5250 V a net current flows/);
  });

  it('electrolysis with a leakage that takes the whole current at the Nernst voltage is refused at the transference number', () => {
    // (1 − t) E/ASR = 0.5 × 1.0 V / 1 ohm cm2 = 0.5 A/cm2 of leakage at E already exceeds j = 0.1 A/cm2.
    const flat = linearProfile(1.0, 0, 0.5);
    let caught: unknown;
    try {
      operatingVoltage(request({ ...flat, mode: 'electrolysis', utilization: 0.5, ionicTransferenceNumber: 0.5, currentDensityAPerM2: 1000, model: { kind: 'area-specific-resistance', ohmM2: 1e-4 } }));
    } catch (error) {
      caught = error;
    }
    expect(caught).toBeInstanceOf(CalculationError);
    expect((caught as CalculationError).field).toBe('ionic-transference-number');
  });
});

/** A scaffold with a cell count, an area-specific resistance (ohm cm2) instead of a voltage, and a transference number. */
function withResistance(technology: 'alkaline' | 'pem', mode: 'power' | 'electrolysis', cells: number, asr: number, t: number) {
  return calculate(
    basisFrom(technology, mode, {
      'operating-point.target-power': undefined,
      'operating-point.cells': cells,
      'operating-point.cell-voltage': undefined,
      'operating-point.area-specific-resistance': `${asr} ohm cm2`,
      'cell.ionic-transference-number': t,
    }),
  );
}

describe('the calculation with a Nernst voltage uniform along the cell (pure gases saturated with vapour)', () => {
  it('alkaline cell on pure H2 and O2 with a resistance: V = E − j ASR; t_ion = 0.8 draws fuel for the ionic current j + (1 − t) V/ASR', () => {
    const t = 0.8;
    const asr = 0.3; // ohm cm2
    const r = withResistance('alkaline', 'power', 20, asr, t);
    const tk = r.conditions.temperature_K;
    // The gases stand over 30 wt % KOH: vapour a_w p_s(T), and −RT/2F ln a_w in E (Balej 1985).
    const aw = r.fuelPath.waterActivity;
    const pSat = aw * saturationPressureBar(tk);
    const pf = r.conditions.fuelPressure_bar;
    const pa = r.conditions.airPressure_bar;
    const e = hydrogenStandardVoltage(tk, 'liquid') + ((R * tk) / (2 * F)) * (Math.log((pf - pSat) * Math.sqrt(pa - pSat)) - Math.log(aw));
    const j = r.operatingPoint.currentDensity_A_per_m2 / 1e4; // A/cm2
    const v = t * e - r.electrochemistry.crossoverAllowance_V - j * asr;
    expect(r.headline.outletNernst_V).toBeCloseTo(e, 9);
    expect(r.headline.cellVoltage_V).toBeCloseTo(v, 9);
    const jIon = j + ((1 - t) * v) / asr;
    const area = r.operatingPoint.totalActiveArea_m2 * 1e4; // cm2
    expect(r.electrochemistry.ionicCurrent_A).toBeCloseTo(jIon * area, 6);
    // Faraday on the ionic current: H2 consumed I_ion/2F, O2 I_ion/4F; the stack delivers N V j A.
    const h2 = (s: string) => r.streams.find((x) => x.id === s)!.speciesFlows_mol_per_s.H2!;
    expect((h2('fuel-inlet') - h2('fuel-outlet')) / ((jIon * area) / (2 * F))).toBeCloseTo(1, 9);
    expect(r.operatingPoint.oxygenConsumed_mol_per_s! / ((jIon * area) / (4 * F))).toBeCloseTo(1, 12);
    expect(r.headline.stackPower_W).toBeCloseTo(v * j * area, 6);
    expect(r.efficiency.faradaicEfficiency).toBeCloseTo(j / jIon, 12);
  });

  it('PEM electrolyser with t_ion = 0.9 and a resistance: V = t E + j ASR, hydrogen (j − (1 − t) V/ASR) A/2F', () => {
    const t = 0.9;
    const asr = 0.15; // ohm cm2
    const r = withResistance('pem', 'electrolysis', 50, asr, t);
    const tk = r.conditions.temperature_K;
    const pSat = saturationPressureBar(tk);
    const e = hydrogenStandardVoltage(tk, 'liquid') + ((R * tk) / (2 * F)) * Math.log((r.conditions.fuelPressure_bar - pSat) * Math.sqrt(r.conditions.airPressure_bar - pSat));
    const j = r.operatingPoint.currentDensity_A_per_m2 / 1e4;
    const v = t * e + j * asr;
    expect(r.headline.inletNernst_V!).toBeCloseTo(e, 9);
    expect(r.headline.cellVoltage_V).toBeCloseTo(v, 9);
    const area = r.operatingPoint.totalActiveArea_m2 * 1e4;
    const jIon = j - ((1 - t) * v) / asr;
    expect(r.efficiency.hydrogenProduction_mol_per_s! / ((jIon * area) / (2 * F))).toBeCloseTo(1, 9);
    // The stack draws the whole current j A N at V.
    expect(r.headline.totalCurrent_A).toBeCloseTo(j * area, 6);
    expect(r.headline.stackPower_W).toBeCloseTo(v * j * area, 6);
  });
});

describe('a fuel utilization of 0.9999 at 0.3 ohm cm2 (the case that reported 71.6 % LHV)', () => {
  const edits = {
    'streams.fuel-electrode': { composition: { H2: 0.97, H2O: 0.03 }, 'pre-reforming': 'none' },
    'operating-point.fuel-utilization': 0.9999,
    'operating-point.cell-voltage': undefined,
    'operating-point.area-specific-resistance': '0.3 ohm cm2',
  };

  it('the resistance gives a voltage below the outlet Nernst voltage: every part of the cell still carries current forward', () => {
    const r = calculate(basisFrom('solid-oxide', 'power', edits));
    expect(r.headline.cellVoltage_V).toBeLessThan(r.headline.outletNernst_V);
    expect(Math.min(...r.fuelPath.points.map((p) => p.currentDensity_A_per_m2))).toBeGreaterThan(0);
    // V·U/(LHV/2F) for hydrogen: below what the charge-mean form gave.
    expect(r.headline.electricalEfficiencyLhv!).toBeLessThan(0.716);
  });

  it('an electrolyser whose leakage takes the whole current is refused at cell.ionic-transference-number', () => {
    // t = 0.5 (the lowest data/limits.yaml admits) at 1 ohm cm2: (1 − t) E/ASR ≈ 0.5 × 0.9 V / 1 ohm cm2
    // ≈ 0.45 A/cm2 of leakage at the Nernst voltage alone, above the 0.3 A/cm2 asked for.
    const basis = basisFrom('solid-oxide', 'electrolysis', {
      'cell.ionic-transference-number': 0.5,
      'operating-point.current-density': '0.3 A/cm2',
      'operating-point.cell-voltage': undefined,
      'operating-point.area-specific-resistance': '1 ohm cm2',
    });
    let caught: unknown;
    try {
      calculate(basis);
    } catch (error) {
      caught = error;
    }
    expect(caught).toBeInstanceOf(BasisError);
    const d = (caught as BasisError).errors[0]!;
    expect(d.path).toBe('cell.ionic-transference-number');
    expect(d.message).toMatch(/no current would be left to split water/);
  });

  it('a given voltage above the outlet Nernst voltage is refused at operating-point.cell-voltage', () => {
    const basis = basisFrom('solid-oxide', 'power', { ...edits, 'operating-point.area-specific-resistance': undefined, 'operating-point.cell-voltage': '0.80 V' });
    let caught: unknown;
    try {
      calculate(basis);
    } catch (error) {
      caught = error;
    }
    expect(caught).toBeInstanceOf(BasisError);
    const d = (caught as BasisError).errors[0]!;
    expect(d.path).toBe('operating-point.cell-voltage');
    expect(d.message).toMatch(/the local current would reverse before the fuel utilization 99\.99 % is reached/);
  });
});
