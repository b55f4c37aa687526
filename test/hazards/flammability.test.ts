// Le Chatelier's rule, the effective stream LFL, the mixing-with-air test and the inside-range
// screen. Limits are the data file's (Zabetakis 1965 and ISO/TR 15916, from memory); hand
// calculations are written out beside each check. Tolerances: 1e-9 where the check repeats the
// same arithmetic by hand, otherwise as stated.
import { describe, expect, it } from 'vitest';
import { leChatelier } from '../../lib/hazards/le-chatelier.ts';
import {
  effectiveLfl,
  flammableOnMixingWithAir,
  insideRangeScreen,
  limitingOxygen,
  limitingOxygenOf,
  mixtureLimits,
  stoichiometricOxygen,
} from '../../lib/hazards/flammability.ts';

const air = (fuel: Record<string, number>): Record<string, number> => {
  const rest = 1 - Object.values(fuel).reduce((a, b) => a + b, 0);
  return { ...fuel, O2: rest * 0.2095, N2: rest * 0.7905 };
};

describe("Le Chatelier's rule", () => {
  it('50 % H2 / 50 % CH4: LFL = 1/(0.5/4 + 0.5/5) = 4.444 %, UFL = 1/(0.5/75 + 0.5/15) = 25 % (hand calculation)', () => {
    const m = mixtureLimits({ H2: 0.5, CH4: 0.5 })!;
    expect(m.lfl_percent).toBeCloseTo(1 / (0.5 / 4 + 0.5 / 5), 9);
    expect(m.lfl_percent).toBeCloseTo(4.4444, 4);
    expect(m.ufl_percent).toBeCloseTo(25, 9);
  });

  it('natural gas 80 % CH4, 15 % C2H6, 4 % C3H8, 1 % n-C4H10: LFL = 1/(0.8/5 + 0.15/3 + 0.04/2.1 + 0.01/1.6) = 4.250 % (hand calculation)', () => {
    expect(mixtureLimits({ CH4: 0.8, C2H6: 0.15, C3H8: 0.04, 'n-C4H10': 0.01 })!.lfl_percent).toBeCloseTo(1 / (0.16 + 0.05 + 0.04 / 2.1 + 0.01 / 1.6), 9);
  });

  it('reproduces the textbook mixture of Crowl and Louvar, Chemical Process Safety (hexane 0.8, methane 2.0, ethylene 0.5 vol %): LFL 2.75 %, UFL 12.9 % (from memory)', () => {
    // Their component limits: hexane 1.2-7.5, methane 5.3-15, ethylene 3.1-32.0 vol %. The
    // tolerance (0.02 and 0.05 vol %) covers the book's rounding of the fractions to 3 digits.
    const shares = (limits: number[]) => [0.8, 2.0, 0.5].map((amount, i) => ({ amount, limit_percent: limits[i]! }));
    expect(Math.abs(leChatelier(shares([1.2, 5.3, 3.1])) - 2.75)).toBeLessThan(0.02);
    expect(Math.abs(leChatelier(shares([7.5, 15, 32.0])) - 12.9)).toBeLessThan(0.05);
  });

  it('normalises over the combustibles only: inerts do not change the mixture limits', () => {
    const dry = mixtureLimits({ H2: 0.6, CO: 0.4 })!;
    const wet = mixtureLimits({ H2: 0.15, CO: 0.1, CO2: 0.25, H2O: 0.5 })!;
    expect(wet.lfl_percent).toBeCloseTo(dry.lfl_percent, 12);
    expect(wet.combustibleFraction).toBeCloseTo(0.25, 12);
  });

  it('gives a pure gas its own limits and refuses a mixture with no combustible', () => {
    expect(mixtureLimits({ CO: 1 })).toMatchObject({ lfl_percent: 12.5, ufl_percent: 74 });
    expect(mixtureLimits({ N2: 0.79, O2: 0.21 })).toBeNull();
    expect(() => leChatelier([])).toThrow(/no combustible/);
  });
});

describe('effective LFL of a stream with inerts', () => {
  it('50 % H2 in N2: the stream is flammable in air from 4/0.5 = 8 % of the stream (hand calculation)', () => {
    expect(effectiveLfl({ H2: 0.5, N2: 0.5 })).toBeCloseTo(8, 12);
  });
  it('anode gas 15 % H2, 8 % CO, rest CO2/H2O: LFL_mix = 1/((15/23)/4 + (8/23)/12.5) = 5.239 %, stream LFL = 5.239/0.23 = 22.78 % (hand calculation)', () => {
    const lfl = 1 / (15 / 23 / 4 + 8 / 23 / 12.5);
    expect(effectiveLfl({ H2: 0.15, CO: 0.08, CO2: 0.2, H2O: 0.57 })).toBeCloseTo(lfl / 0.23, 9);
  });
  it('is null without combustibles and above 100 % where the stream cannot burn in air at all', () => {
    expect(effectiveLfl({ CO2: 1 })).toBeNull();
    expect(effectiveLfl({ H2: 0.02, N2: 0.98 })).toBeCloseTo(200, 9);
  });
});

describe('flammable on mixing with air: combustible fraction at or above the mixture LFL', () => {
  it('3 % H2 in N2 never reaches 4 %; 5 % H2 does, as does any fuel-rich stream', () => {
    expect(flammableOnMixingWithAir(mixtureLimits({ H2: 0.03, N2: 0.97 }))).toBe(false);
    expect(flammableOnMixingWithAir(mixtureLimits({ H2: 0.05, N2: 0.95 }))).toBe(true);
    expect(flammableOnMixingWithAir(mixtureLimits({ CH4: 1 }))).toBe(true);
    expect(flammableOnMixingWithAir(null)).toBe(false);
  });
});

describe('inside-the-flammable-range screen', () => {
  const screen = (c: Record<string, number>) => insideRangeScreen(mixtureLimits(c), c.O2 ?? 0);
  it('10 % H2 in air is inside (4 ≤ 10 ≤ 75, O2 18.9 % above the LOC of 5 %)', () => {
    expect(screen(air({ H2: 0.1 }))).toBe('inside');
  });
  it('2 % H2 in air is too lean; 20 % CH4 in air is too rich (UFL 15 %)', () => {
    expect(screen(air({ H2: 0.02 }))).toBe('too lean');
    expect(screen(air({ CH4: 0.2 }))).toBe('too rich');
  });
  it('a fuel stream without oxygen has no oxidant; with 2 % O2 it is below the H2 LOC of 5 % (NFPA 69, from memory)', () => {
    expect(screen({ H2: 1 })).toBe('no oxidant');
    expect(screen({ H2: 0.9, O2: 0.02, N2: 0.08 })).toBe('below limiting oxygen');
    expect(screen({ N2: 0.79, O2: 0.21 })).toBe('no combustibles');
  });
  it('5 % H2 in oxygen is inside with the upper limit not applied (enrichment widens the range)', () => {
    expect(screen({ H2: 0.05, O2: 0.95 })).toBe('inside (oxygen-enriched: upper limit not applied)');
    expect(screen({ H2: 0.8, O2: 0.2 })).toBe('inside (oxygen-enriched: upper limit not applied)');
  });
});

describe('limiting oxygen concentration', () => {
  it('stoichiometric oxygen z = C + H/4 + S − O/2 from the species formula', () => {
    expect([stoichiometricOxygen('H2'), stoichiometricOxygen('CO'), stoichiometricOxygen('CH4')]).toEqual([0.5, 0.5, 2]);
    expect([stoichiometricOxygen('CH3OH'), stoichiometricOxygen('NH3'), stoichiometricOxygen('H2S'), stoichiometricOxygen('n-C4H10')]).toEqual([1.5, 0.75, 1.5, 6.5]);
  });
  it('uses the recorded NFPA 69 value (H2 5.0 %, from memory) and estimates z × LFL where none is recorded (NH3 0.75 × 15 = 11.25 %)', () => {
    expect(limitingOxygenOf('H2')).toEqual({ percent: 5.0, species: 'H2', estimated: false });
    expect(limitingOxygenOf('NH3')).toEqual({ percent: 11.25, species: 'NH3', estimated: true });
  });
  it('the estimate is below the recorded value for propane (5 × 2.1 = 10.5 % against 11.5 %), i.e. on the safe side there', () => {
    expect(stoichiometricOxygen('C3H8') * 2.1).toBeLessThan(limitingOxygenOf('C3H8').percent);
  });
  it('takes the lowest LOC of a mixture (no mixing rule is established)', () => {
    expect(limitingOxygen(mixtureLimits({ CH4: 0.5, CO: 0.5 })!.combustibles)).toMatchObject({ percent: 5.5, species: 'CO' });
  });
});
