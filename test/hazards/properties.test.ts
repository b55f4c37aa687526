// Properties that hold for any valid stream, by fast-check: no throw, LFL ≤ UFL, finite
// indicators, the mixture LFL between the smallest and largest component LFL (Le Chatelier's
// rule is a weighted harmonic mean), every caution rendered, the assessment JSON-serialisable.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { assessHazards } from '../../lib/hazards/assessment.ts';
import { formatHazardsText } from '../../lib/hazards/format-text.ts';
import { findSubstance, substance } from '../../lib/hazards/substances.ts';
import { TECHNOLOGY_IDS } from '../../lib/electrochem/technologies.ts';
import type { HazardInput, StreamIndicators } from '../../lib/hazards/types.ts';

const SPECIES = ['H2', 'CO', 'CH4', 'C2H6', 'C3H8', 'n-C4H10', 'NH3', 'CH3OH', 'C2H5OH', 'H2S', 'CO2', 'H2O', 'N2', 'O2', 'Ar', 'SO2', 'H2O(L)'];

const composition = fc
  .uniqueArray(fc.constantFrom(...SPECIES), { minLength: 1, maxLength: 7 })
  .filter((labels) => labels.some((l) => l !== 'H2O(L)'))
  .chain((labels) =>
    fc.array(fc.double({ min: 1e-9, max: 1, noNaN: true }), { minLength: labels.length, maxLength: labels.length }).map((weights) => {
      const total = weights.reduce((a, b) => a + b, 0);
      return Object.fromEntries(labels.map((l, i) => [l, weights[i]! / total]));
    }),
  )
  .filter((c) => Object.entries(c).some(([l, x]) => l !== 'H2O(L)' && x > 0));

const stream = fc.record({
  id: fc.string({ minLength: 1, maxLength: 8 }),
  // Names without braces, so that an unrendered {name} of a template is detectable in the texts.
  name: fc.stringMatching(/^[a-z][a-z0-9 -]{0,19}$/),
  temperatureK: fc.double({ min: 200, max: 1400, noNaN: true }),
  pressureBar: fc.double({ min: 0.5, max: 700, noNaN: true }),
  moleFractions: composition,
  role: fc.constantFrom('feed', 'internal', 'outlet', 'product', undefined),
  side: fc.constantFrom('fuel', 'air', undefined),
});

const input: fc.Arbitrary<HazardInput> = fc.record({
  streams: fc.uniqueArray(stream, { maxLength: 4, selector: (s) => s.id }),
  technology: fc.constantFrom(...TECHNOLOGY_IDS),
  mode: fc.constantFrom('power', 'electrolysis'),
  nickelBearing: fc.boolean(),
  operatingTemperatureK: fc.double({ min: 250, max: 1300, noNaN: true }),
  fuelPressureBar: fc.double({ min: 0.5, max: 100, noNaN: true }),
  airPressureBar: fc.double({ min: 0.5, max: 100, noNaN: true }),
  ambientTemperatureK: fc.double({ min: 230, max: 330, noNaN: true }),
  dcVoltage: fc.record({ voltageV: fc.double({ min: 0, max: 6000, noNaN: true }), description: fc.constant('the stack voltage') }),
}) as fc.Arbitrary<HazardInput>;

function numbers(value: unknown): number[] {
  if (typeof value === 'number') return [value];
  if (value && typeof value === 'object') return Object.values(value).flatMap(numbers);
  return [];
}

function checkStream(s: StreamIndicators, moleFractions: Record<string, number>): void {
  for (const n of numbers(s)) expect(Number.isFinite(n)).toBe(true);
  const f = s.flammability;
  if (!f) {
    expect(s.flammableOnMixingWithAir).toBe(false);
    return;
  }
  if (f.ufl_percent !== null) expect(f.lfl_percent).toBeLessThanOrEqual(f.ufl_percent + 1e-9);
  const lfls = Object.entries(moleFractions)
    .filter(([label, x]) => x > 0 && findSubstance(label)?.combustible)
    .map(([label]) => substance(label).lfl_percent!.value);
  expect(f.lfl_percent).toBeGreaterThanOrEqual(Math.min(...lfls) * (1 - 1e-12));
  expect(f.lfl_percent).toBeLessThanOrEqual(Math.max(...lfls) * (1 + 1e-12));
  expect(s.flammableOnMixingWithAir).toBe(s.combustible_percent >= f.lfl_percent);
  if (s.insideFlammableRange) expect(s.oxygen_percent).toBeGreaterThan(0);
}

describe('hazard assessment of random valid bases', () => {
  it('never throws, keeps LFL ≤ UFL and every indicator finite, renders every caution and serialises to JSON', () => {
    fc.assert(
      fc.property(input, (i) => {
        const a = assessHazards(i);
        a.streams.forEach((s, k) => checkStream(s, i.streams[k]!.moleFractions));
        for (const c of a.cautions) expect(c.text).not.toMatch(/[{}]|\[\[/);
        expect(JSON.parse(JSON.stringify(a))).toEqual(a);
        expect(formatHazardsText(a).startsWith('HAZARDS')).toBe(true);
      }),
      { numRuns: 300 },
    );
  });
});
