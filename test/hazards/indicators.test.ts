// Indicators of one stream: CO ppm against the NIOSH IDLH (1200 ppm, NIOSH IDLH documentation
// 1994), hydrogen partial pressure, the lowest autoignition temperature, unassessed species, and
// the checks on the stream's input. Checks repeat the arithmetic by hand (tolerance 1e-9).
import { describe, expect, it } from 'vitest';
import { streamIndicators } from '../../lib/hazards/indicators.ts';
import { UserError } from '../../lib/core/errors.ts';
import type { HazardStream } from '../../lib/hazards/types.ts';

const C = 273.15;
const stream = (moleFractions: Record<string, number>, over: Partial<HazardStream> = {}): HazardStream => ({
  id: 's',
  name: 'test stream',
  temperatureK: 298.15,
  pressureBar: 1,
  moleFractions,
  ...over,
});
const at = (s: HazardStream, operatingTemperatureK = 298.15) => streamIndicators(s, { operatingTemperatureK });

describe('carbon monoxide', () => {
  it('8 % CO is 80 000 ppm, 80 000/1200 = 66.7 times the IDLH', () => {
    const co = at(stream({ CO: 0.08, H2: 0.15, CO2: 0.2, H2O: 0.57 })).carbonMonoxide!;
    expect(co.coConcentration_ppm).toBeCloseTo(80000, 6);
    expect(co.timesIdlh).toBeCloseTo(80000 / 1200, 9);
    expect([co.idlh_ppm, co.nioshRelTwa_ppm, co.nioshRelCeiling_ppm, co.oshaPelTwa_ppm]).toEqual([1200, 35, 200, 50]);
  });
  it('is null below the presence threshold of 1 ppm', () => {
    expect(at(stream({ CO: 5e-7, N2: 1 - 5e-7 })).carbonMonoxide).toBeNull();
    expect(at(stream({ CO: 2e-6, N2: 1 - 2e-6 })).carbonMonoxide!.coConcentration_ppm).toBeCloseTo(2, 9);
  });
  it('lists every present species with an exposure limit, with its multiple of the IDLH', () => {
    const e = at(stream({ CO2: 0.2, NH3: 0.003, N2: 0.797 })).exposure;
    expect(e.map((x) => x.species)).toEqual(['CO2', 'NH3']);
    expect(e[1]!.timesIdlh).toBeCloseTo(3000 / 300, 9);
  });
});

describe('hydrogen partial pressure', () => {
  it('15 % H2 at 3 bar: 0.45 bar', () => {
    expect(at(stream({ H2: 0.15, H2O: 0.85 }, { pressureBar: 3 })).hydrogenPartialPressure_bar).toBeCloseTo(0.45, 12);
  });
});

describe('autoignition', () => {
  it('hydrogen at 450 °C is above its lowest recorded AIT of 400 °C (Zabetakis 1965, from memory)', () => {
    const a = at(stream({ H2: 0.5, H2O: 0.5 }, { temperatureK: 450 + C })).autoignition!;
    expect(a).toMatchObject({ species: 'H2', lowest_C: 400, streamAbove: true, operatingAbove: false });
    expect(a.lowest_K).toBeCloseTo(673.15, 9);
  });
  it('methane at 500 °C is below its lowest AIT of 537 °C (NFPA 325, from memory); at 550 °C above', () => {
    expect(at(stream({ CH4: 1 }, { temperatureK: 500 + C })).autoignition!.streamAbove).toBe(false);
    expect(at(stream({ CH4: 1 }, { temperatureK: 550 + C })).autoignition!.streamAbove).toBe(true);
  });
  it('takes the lowest among the combustibles present and compares the operating temperature too', () => {
    const a = at(stream({ CH4: 0.5, H2S: 0.01, N2: 0.49 }, { temperatureK: 300 }), 280 + C)!.autoignition!;
    expect(a).toMatchObject({ species: 'H2S', lowest_C: 260, streamAbove: false, operatingAbove: true });
  });
  it('is null without combustibles', () => {
    expect(at(stream({ O2: 0.21, N2: 0.79 })).autoignition).toBeNull();
  });
});

describe('composition and the stream record', () => {
  it('resolves aliases, leaves condensed species out and renormalises the gas phase', () => {
    const s = at(stream({ C4H10: 0.25, N2: 0.25, 'H2O(l)': 0.5 }));
    expect(s.composition).toEqual([
      { species: 'n-C4H10', mole_percent: 50 },
      { species: 'N2', mole_percent: 50 },
    ]);
    expect(s.condensedExcluded).toEqual(['H2O(L)']);
    expect(s.combustible_percent).toBeCloseTo(50, 12);
  });
  it('names present species without hazard data', () => {
    expect(at(stream({ SO2: 0.001, HCN: 1e-7, N2: 0.998999 + 1e-6 - 1e-7 })).unassessed.map((u) => u.species)).toEqual(['SO2']);
  });
  it('treats a stream without a role as an outlet and says it assumed so', () => {
    expect(at(stream({ N2: 1 }))).toMatchObject({ role: 'outlet', roleAssumed: true });
    expect(at(stream({ N2: 1 }, { role: 'feed' }))).toMatchObject({ role: 'feed', roleAssumed: false });
  });
  it('states temperatures in K and °C', () => {
    expect(at(stream({ N2: 1 }, { temperatureK: 1073.15 }))).toMatchObject({ temperature_K: 1073.15, temperature_C: 800 });
  });
});

describe('input mistakes are UserErrors naming the stream and field', () => {
  it('mole fractions that do not sum to 1 (percent given as fraction)', () => {
    expect(() => at(stream({ H2: 50, N2: 50 }))).toThrow(UserError);
    expect(() => at(stream({ H2: 50, N2: 50 }))).toThrow(/hazard stream "s": mole fractions sum to 100, expected 1/);
  });
  it('negative or non-finite fractions, non-positive temperature or pressure', () => {
    expect(() => at(stream({ H2: -0.1, N2: 1.1 }))).toThrow(/mole fraction of H2 must be a finite number ≥ 0/);
    expect(() => at(stream({ N2: Number.NaN }))).toThrow(UserError);
    expect(() => at(stream({ N2: 1 }, { temperatureK: 0 }))).toThrow(/temperatureK must be a positive finite number/);
    expect(() => at(stream({ N2: 1 }, { pressureBar: -1 }))).toThrow(/pressureBar/);
  });
  it('unknown species, with suggestions', () => {
    expect(() => at(stream({ H20: 1 }))).toThrow(/unknown species "H20"; did you mean "H2O"/);
  });
  it('a stream with only condensed species', () => {
    expect(() => at(stream({ 'H2O(L)': 1 }))).toThrow(/has no gas phase/);
  });
});
