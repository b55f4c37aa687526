// Property-based checks (fast-check) of the Gibbs minimiser over random feeds, temperatures and
// pressures: element conservation, non-negativity, Gibbs energy at a minimum along balanced
// reactions, invariance to scaling the feed.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { equilibrate, mixtureGibbsOverRT } from '../../lib/equilibrium/equilibrate.ts';
import { parseEquation } from '../../lib/electrochem/equation.ts';

const SPECIES = ['H2', 'H2O', 'CO', 'CO2', 'CH4', 'N2', 'NH3', 'C2H6', 'Ar', 'O2'] as const;
const amount = fc.oneof(fc.constant(0), fc.double({ min: 1e-8, max: 10, noNaN: true }), fc.double({ min: 1e-30, max: 1e-10, noNaN: true }));
const feedArb = fc
  .record(Object.fromEntries(SPECIES.map((s) => [s, amount])) as Record<(typeof SPECIES)[number], fc.Arbitrary<number>>)
  .filter((f) => Object.values(f).some((v) => v > 1e-3));
const temperature = fc.double({ min: 500, max: 1600, noNaN: true });
const pressure = fc.double({ min: 0.1, max: 50, noNaN: true });

const REACTIONS = ['CO + H2O -> CO2 + H2', 'CH4 + H2O -> CO + 3 H2', 'N2 + 3 H2 -> 2 NH3', '2 H2O -> 2 H2 + O2', 'C2H6 + H2 -> 2 CH4'];

describe('equilibrium properties over random feeds', () => {
  it('conserves elements to 1e-12, never negative, fractions sum to 1', () => {
    fc.assert(
      fc.property(feedArb, temperature, pressure, (feed, t, p) => {
        const e = equilibrate({ temperatureK: t, pressureBar: p, feed });
        expect(e.elementBalanceError).toBeLessThan(1e-12);
        const x = Object.values(e.moleFractions);
        expect(x.every((v) => v >= 0 && Number.isFinite(v))).toBe(true);
        expect(Math.abs(x.reduce((s, v) => s + v, 0) - 1)).toBeLessThan(1e-12);
      }),
      { numRuns: 300 },
    );
  });

  it('no balanced reaction step lowers the Gibbs energy', () => {
    fc.assert(
      fc.property(feedArb, temperature, pressure, (feed, t, p) => {
        const e = equilibrate({ temperatureK: t, pressureBar: p, feed });
        const labels = e.system.gas.map((s) => s.label);
        const n = labels.map((l) => e.amounts[l]!);
        const g0 = mixtureGibbsOverRT(e.system, t, p, n);
        for (const reaction of REACTIONS) {
          const terms = parseEquation(reaction).terms;
          if (!terms.every((term) => labels.includes(term.species.label))) continue;
          const involved = Math.min(...terms.map((term) => n[labels.indexOf(term.species.label)]!));
          if (!(involved > 1e-200)) continue;
          for (const sign of [1, -1]) {
            const m = [...n];
            for (const term of terms) m[labels.indexOf(term.species.label)]! += 1e-3 * involved * sign * term.nu;
            expect(mixtureGibbsOverRT(e.system, t, p, m)).toBeGreaterThanOrEqual(g0 - 1e-11 * Math.abs(g0));
          }
        }
      }),
      { numRuns: 150 },
    );
  });

  it('mole fractions do not depend on the scale of the feed', () => {
    fc.assert(
      fc.property(feedArb, temperature, pressure, fc.double({ min: 1e-3, max: 1e6, noNaN: true }), (feed, t, p, scale) => {
        const a = equilibrate({ temperatureK: t, pressureBar: p, feed });
        const scaled = Object.fromEntries(Object.entries(feed).map(([k, v]) => [k, v * scale]));
        const b = equilibrate({ temperatureK: t, pressureBar: p, feed: scaled });
        // Every species to 1e-12 in mole fraction, and to 1e-7 relative where that is the looser
        // bound (species above 1e-5). A minor species can hang on a difference of element
        // amounts that the balance resolves only to ~1e-13 (lib/equilibrium/gibbs-minimiser.ts,
        // ELEMENT_TOLERANCE): in CO2 with 1e-8 of H2 and 4e-13 of CO, CO (1.3e-6) is H2O plus
        // the carbon excess, and came out 1.06e-7 apart relative, 1.4e-13 absolute, on rescaling.
        // (Where a feed fixes an element ratio more finely than double precision, e.g. water with
        // 1e-30 of extra hydrogen, the iteration stops at the rounding floor, weighted corrections < 1e-9.)
        for (const [k, v] of Object.entries(a.moleFractions)) {
          if (v > 1e-6) expect(Math.abs(b.moleFractions[k]! / v - 1)).toBeLessThan(Math.max(1e-7, 1e-12 / v));
          expect(Math.abs(b.moleFractions[k]! - v)).toBeLessThan(1e-12);
        }
      }),
      {
        numRuns: 150,
        // The case found at random (seed -56761692) that sets the relative bound above, kept.
        examples: [[{ H2: 1.0000000000000004e-8, H2O: 0, CO: 3.9217023725668376e-13, CO2: 0.007565969619989505, CH4: 0, N2: 0, NH3: 1e-30, C2H6: 1e-30, Ar: 0, O2: 1e-30 }, 534.3880472496329, 3.033588172396111, 0.001]],
      },
    );
  });
});
