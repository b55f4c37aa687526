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
      {
        numRuns: 300,
        // Feeds found at random that once failed to converge, kept. Most are traces in an inert
        // gas, with element ratios fixed more finely than the major amounts resolve:
        // - carbon and oxygen equal to twelve digits, the excess carried by a trace hydrocarbon
        //   (CI run of 2 Dec 2026, seed -575866674): refined by balancing all elements together;
        // - carbon traces at 1e-25 in nitrogen (seed 7): a trace species overshot its element
        //   by twenty orders before the element ceiling in the step control;
        // - water and CO2 traces in argon at 500 K (seed 11), and carbon, nitrogen and hydrogen
        //   traces at 1028 K (seed 13, which a narrower ceiling made oscillate);
        // - CO2 with 1e-8 of CO at 500 K and 23 bar (seed 21): cycles from the first start and
        //   converges from the second (RP-1311's uniform start);
        // - hydrogen, carbon and oxygen all at 1e-30 in argon (seed 24): the trace refinement
        //   needs its damped step, the undamped one ran off along a direction the balances hardly feel.
        examples: [
          [{ H2: 0, H2O: 0, CO: 1e-8, CO2: 1e-30, CH4: 1e-30, N2: 0, NH3: 0, C2H6: 1.2989250355909555e-21, Ar: 0.0010046244421148198, O2: 0 }, 1498.760415254249, 0.1],
          [{ H2: 0, H2O: 0, CO: 5.609246859930102e-28, CO2: 1e-30, CH4: 0, N2: 0.0010139123423996512, NH3: 0, C2H6: 0, Ar: 0, O2: 0 }, 500, 0.1],
          [{ H2: 1e-30, H2O: 1.015928367677704e-7, CO: 4.218621124020441e-23, CO2: 1e-8, CH4: 0, N2: 0, NH3: 1e-30, C2H6: 0, Ar: 3.6990189313435, O2: 1e-30 }, 500, 0.32166866588560533],
          [{ H2: 0, H2O: 1e-30, CO: 9.726337524417853e-7, CO2: 0, CH4: 1e-30, N2: 0.00003617464425184126, NH3: 1.2610144567474954e-30, C2H6: 3.1811145417606368e-27, Ar: 9.313902478678036, O2: 0 }, 1027.9065680358658, 1.2849851949821054],
          [{ H2: 0, H2O: 1e-30, CO: 1e-8, CO2: 8.998535786855733, CH4: 1e-30, N2: 0, NH3: 0, C2H6: 0, Ar: 0.492186996320558, O2: 0 }, 500, 23.32660830693965],
          [{ H2: 1e-30, H2O: 1e-30, CO: 0, CO2: 1e-30, CH4: 0, N2: 0, NH3: 0, C2H6: 0, Ar: 0.0010000000000000002, O2: 0 }, 1184.7535361202947, 0.1],
        ],
      },
    );
  });

  it('converges on fuel-path feeds as plants have them (fuel gas, steam, air, CO2; 400-1400 K, 1-30 bar)', () => {
    // Before the re-seeding in the minimiser, about 4 such feeds in 10 000 stalled (measured over
    // 100 000), most near 400 K where a species that should carry an element ratio fell to 1e-20.
    const some = (max: number) => fc.oneof(fc.constant(0), fc.double({ min: 1e-4, max, noNaN: true }));
    const plantFeed = fc
      .record({ CH4: some(1), C2H6: some(0.1), H2: some(1), CO: some(0.5), CO2: some(0.6), H2O: some(4), N2: some(0.5), O2: some(0.1) })
      .filter((f) => f.CH4 + f.H2 + f.CO + f.C2H6 > 0.05);
    fc.assert(
      fc.property(plantFeed, fc.double({ min: 400, max: 1400, noNaN: true }), fc.double({ min: 1, max: 30, noNaN: true }), fc.boolean(), (feed, t, p, graphite) => {
        const e = equilibrate({ temperatureK: t, pressureBar: p, feed, allowGraphite: graphite });
        expect(e.elementBalanceError).toBeLessThan(1e-12);
      }),
      { numRuns: 400 },
    );
  });

  it('leaves humidified hydrogen at 400 K as fed (a feed that once stalled at a wrong composition)', () => {
    // Water does not dissociate measurably at 400 K (the equilibrium constant of H2O = H2 + 1/2 O2
    // is of order 1e-30 there, from memory; NIST-JANAF gives log Kf(H2O, g) = 29.2 at 400 K, from
    // memory), so the equilibrium is the feed itself. Tolerance 1e-9: the mole fractions are
    // fixed by the element balances, converged to 1e-13.
    const feed = { H2: 0.3182001031007778, H2O: 3.9999999999999942 };
    const e = equilibrate({ temperatureK: 400.00000000000057, pressureBar: 1.091841980155156, feed });
    const total = feed.H2 + feed.H2O;
    expect(e.moleFractions.H2!).toBeCloseTo(feed.H2 / total, 9);
    expect(e.moleFractions.H2O!).toBeCloseTo(feed.H2O / total, 9);
    expect(e.moleFractions.O2!).toBeLessThan(1e-40);
  });

  it('with graphite allowed too: conserves elements (graphite included) to 1e-12, never negative', () => {
    fc.assert(
      fc.property(feedArb, temperature, pressure, (feed, t, p) => {
        const e = equilibrate({ temperatureK: t, pressureBar: p, feed, allowGraphite: true });
        expect(e.elementBalanceError).toBeLessThan(1e-12);
        expect(e.graphite).toBeGreaterThanOrEqual(0);
        expect(Object.values(e.moleFractions).every((v) => v >= 0 && Number.isFinite(v))).toBe(true);
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
