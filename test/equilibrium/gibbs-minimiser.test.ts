// Gas equilibrium by Gibbs minimisation (element potentials, NASA RP-1311 method), checked
// against closed-form solutions with equilibrium constants from the same species data
// (whose constants are in turn checked against NIST-JANAF in lib/verification, EQ-01..EQ-07),
// and for robustness: trace amounts, element conservation (sulphur included), graphite,
// convergence failure.
import { describe, expect, it } from 'vitest';
import { equilibrate, mixtureGibbsOverRT } from '../../lib/equilibrium/equilibrate.ts';
import { lnEquilibriumConstant } from '../../lib/electrochem/reaction.ts';
import { parseEquation } from '../../lib/electrochem/equation.ts';
import { minimiseGibbs } from '../../lib/equilibrium/gibbs-minimiser.ts';
import { elementAmounts, gasGibbsOverRT, systemFor } from '../../lib/equilibrium/species-set.ts';
import { ConvergenceError, UserError } from '../../lib/core/errors.ts';

const K = (reaction: string, t: number) => Math.exp(lnEquilibriumConstant(parseEquation(reaction).terms, t));

/** Root of a monotonic function on [lo, hi] by bisection (test-local, independent of the library). */
function bisect(f: (x: number) => number, lo: number, hi: number): number {
  let flo = f(lo);
  for (let i = 0; i < 200; i++) {
    const mid = (lo + hi) / 2;
    const fm = f(mid);
    if (Math.sign(fm) === Math.sign(flo)) {
      lo = mid;
      flo = fm;
    } else hi = mid;
  }
  return (lo + hi) / 2;
}

describe('equilibrium composition', () => {
  it('water-gas shift alone matches the closed-form quadratic: x = √K/(1+√K) for CO:H2O = 1:1', () => {
    for (const t of [600, 800, 1000, 1200]) {
      const e = equilibrate({ temperatureK: t, pressureBar: 1, feed: { CO: 1, H2O: 1 }, species: ['CO', 'H2O', 'CO2', 'H2'] });
      const rootK = Math.sqrt(K('CO + H2O -> CO2 + H2', t));
      const extent = rootK / (1 + rootK);
      expect(e.moleFractions.CO2! * 2).toBeCloseTo(extent, 10);
      expect(e.moleFractions.CO! * 2).toBeCloseTo(1 - extent, 10);
    }
  });

  it('CH4:H2O = 1:2 at 800 °C, 1 bar: H2 0.640, CO 0.157, CH4 0.0015 (the acceptance values), and equal to an independent two-reaction solution', () => {
    const t = 1073.15;
    const e = equilibrate({ temperatureK: t, pressureBar: 1, feed: { CH4: 1, H2O: 2 } });
    expect(e.moleFractions.H2!).toBeCloseTo(0.64, 2);
    expect(e.moleFractions.CO!).toBeCloseTo(0.157, 3);
    expect(e.moleFractions.CH4!).toBeCloseTo(0.0015, 4);
    // Two reactions, SMR extent a and WGS extent b, solved by nested bisection with K from the data.
    const k1 = K('CH4 + H2O -> CO + 3 H2', t);
    const k2 = K('CO + H2O -> CO2 + H2', t);
    const wgsExtent = (a: number) => bisect((b) => (b * (3 * a + b)) / ((a - b) * (2 - a - b)) - k2, 0, a);
    const a = bisect((x) => {
      const b = wgsExtent(x);
      const n = 3 + 2 * x;
      return ((x - b) * (3 * x + b) ** 3) / ((1 - x) * (2 - x - b) * n * n) - k1;
    }, 1e-9, 1 - 1e-12);
    const b = wgsExtent(a);
    const n = 3 + 2 * a;
    expect(e.moleFractions.H2!).toBeCloseTo((3 * a + b) / n, 6);
    expect(e.moleFractions.CO!).toBeCloseTo((a - b) / n, 6);
    expect(e.moleFractions.CH4!).toBeCloseTo((1 - a) / n, 6);
  });

  it('every mole fraction is reported, none negative, and they sum to 1', () => {
    const e = equilibrate({ temperatureK: 900, pressureBar: 3, feed: { CH4: 1, H2O: 1.5, N2: 0.1 } });
    const values = Object.values(e.moleFractions);
    expect(values.length).toBe(e.system.gas.length);
    expect(values.every((v) => v >= 0 && Number.isFinite(v))).toBe(true);
    expect(values.reduce((s, v) => s + v, 0)).toBeCloseTo(1, 12);
  });

  it('conserves every element to 1e-12 relative, trace elements at 1e-30 included', () => {
    const feeds: Record<string, number>[] = [
      { H2: 1, O2: 1e-30 },
      { CH4: 1, H2O: 2, N2: 1e-30, Ar: 1e-30 },
      { H2: 1, CO: 1e-25, H2O: 1e-20 },
      { N2: 1, O2: 1e-30 },
      { He: 1, H2: 1e-28 },
    ];
    for (const feed of feeds) {
      const e = equilibrate({ temperatureK: 1000, pressureBar: 1, feed });
      expect(e.elementBalanceError, JSON.stringify(feed)).toBeLessThan(1e-12);
      for (const v of Object.values(e.moleFractions)) expect(v).toBeGreaterThanOrEqual(0);
    }
    // H2 with a trace of O2: all oxygen ends as H2O at twice the O2 amount.
    const trace = equilibrate({ temperatureK: 1000, pressureBar: 1, feed: { H2: 1, O2: 1e-30 } });
    expect(trace.moleFractions.H2O! / 2e-30).toBeCloseTo(1, 6);
  });

  it('takes sulphur in when the feed has it: 10 ppm H2S in a steam-methane feed, every S species considered, S conserved to 1e-12, COS/H2S by mass action', () => {
    const t = 1073.15;
    const e = equilibrate({ temperatureK: t, pressureBar: 1, feed: { CH4: 1, H2O: 2.5, H2S: 1e-5 } });
    expect(e.system.elements).toEqual(['C', 'H', 'O', 'S']);
    for (const s of ['H2S', 'SH', 'COS', 'CS2', 'SO2', 'SO3', 'S2']) expect(e.moleFractions, s).toHaveProperty(s);
    expect(e.elementBalanceError).toBeLessThan(1e-12);
    const x = e.moleFractions;
    for (const v of Object.values(x)) expect(v).toBeGreaterThanOrEqual(0);
    // The sulphur of the feed, 1e-5 mol per 3.5 mol fed, is all in the gas: Σ n_S over the S species.
    const sulphur = e.system.gas.reduce((sum, s) => sum + (s.formula.S ?? 0) * e.amounts[s.label]!, 0);
    expect(sulphur / 1e-5).toBeCloseTo(1, 12);
    // H2S + CO2 ⇌ COS + H2O at equilibrium: x_COS x_H2O / (x_H2S x_CO2) = K(T) of the same data, to 1e-9
    // (a closed form independent of the minimiser; the reaction quotient of a converged solution).
    expect(((x.COS! * x.H2O!) / (x.H2S! * x.CO2!)) / K('H2S + CO2 -> COS + H2O', t)).toBeCloseTo(1, 9);
    // In a reducing fuel gas H2S holds nearly all of it (COS about 1 %), which is why fuel-cell
    // desulphurisers are specified for H2S (common practice, no source).
    expect(x.H2S! / (sulphur / e.totalGas)).toBeGreaterThan(0.98);
  });

  it('is not above the Gibbs energy of feasible perturbations along balanced reactions', () => {
    const e = equilibrate({ temperatureK: 950, pressureBar: 2, feed: { CH4: 1, H2O: 2.5, N2: 0.2, CO2: 0.1 } });
    const labels = e.system.gas.map((s) => s.label);
    const n = e.system.gas.map((s) => e.amounts[s.label]!);
    const g0 = mixtureGibbsOverRT(e.system, 950, 2, n);
    for (const reaction of ['CO + H2O -> CO2 + H2', 'CH4 + H2O -> CO + 3 H2', 'N2 + 3 H2 -> 2 NH3', 'CH4 + CO2 -> 2 CO + 2 H2', '2 H2O -> 2 H2 + O2']) {
      const terms = parseEquation(reaction).terms;
      const involved = Math.min(...terms.map((t) => n[labels.indexOf(t.species.label)]!));
      for (const sign of [1, -1]) {
        const eps = 1e-3 * involved * sign;
        const m = [...n];
        for (const t of terms) m[labels.indexOf(t.species.label)]! += eps * t.nu;
        expect(mixtureGibbsOverRT(e.system, 950, 2, m), reaction).toBeGreaterThanOrEqual(g0 - 1e-12 * Math.abs(g0));
      }
    }
  });

  it('scaling the feed scales the amounts and leaves the mole fractions unchanged', () => {
    const a = equilibrate({ temperatureK: 1100, pressureBar: 1, feed: { CH4: 1, H2O: 2 } });
    const b = equilibrate({ temperatureK: 1100, pressureBar: 1, feed: { CH4: 1000, H2O: 2000 } });
    for (const [k, v] of Object.entries(a.moleFractions)) {
      if (v > 1e-20) expect(b.moleFractions[k]! / v, k).toBeCloseTo(1, 9);
    }
    expect(b.totalGas / a.totalGas).toBeCloseTo(1000, 6);
  });

  it('higher pressure pushes reforming back (Le Chatelier): less H2, more CH4', () => {
    const low = equilibrate({ temperatureK: 1073.15, pressureBar: 1, feed: { CH4: 1, H2O: 2 } });
    const high = equilibrate({ temperatureK: 1073.15, pressureBar: 20, feed: { CH4: 1, H2O: 2 } });
    expect(high.moleFractions.CH4!).toBeGreaterThan(low.moleFractions.CH4! * 10);
    expect(high.moleFractions.H2!).toBeLessThan(low.moleFractions.H2!);
  });
});

describe('graphite as a condensed phase', () => {
  it('forms where the gas-only carbon activity exceeds 1, and then the activity is exactly 1', () => {
    const gasOnly = equilibrate({ temperatureK: 900, pressureBar: 1, feed: { CH4: 1, H2O: 0.5 } });
    expect(gasOnly.carbonActivity).toBeGreaterThan(1);
    const withC = equilibrate({ temperatureK: 900, pressureBar: 1, feed: { CH4: 1, H2O: 0.5 }, allowGraphite: true });
    expect(withC.graphite).toBeGreaterThan(0);
    expect(withC.carbonActivity).toBe(1);
    expect(withC.elementBalanceError).toBeLessThan(1e-12);
    // Graphite lowers the Gibbs energy (it forms only because it does).
  });

  it('does not form where the gas is carbon-free', () => {
    const e = equilibrate({ temperatureK: 1073.15, pressureBar: 1, feed: { CH4: 1, H2O: 3 }, allowGraphite: true });
    expect(e.graphite).toBe(0);
    expect(e.carbonActivity).toBeLessThan(1);
  });
});

describe('failures', () => {
  it('throws a ConvergenceError naming the iterations and the residual when it cannot converge', () => {
    const system = systemFor(['C', 'H', 'O']);
    const b = elementAmounts(system, { CH4: 1, H2O: 2 });
    try {
      minimiseGibbs(system, gasGibbsOverRT(system, 1000), 0, b, 0, { maxIterations: 2 });
      throw new Error('expected a ConvergenceError');
    } catch (error) {
      expect(error).toBeInstanceOf(ConvergenceError);
      expect((error as Error).message).toMatch(/did not converge after 2 iterations \(residual \d\.\d\de[+-]\d+\)/);
    }
  });

  it('refuses feeds that are empty, negative or of unknown species', () => {
    expect(() => equilibrate({ temperatureK: 1000, pressureBar: 1, feed: {} })).toThrow(UserError);
    expect(() => equilibrate({ temperatureK: 1000, pressureBar: 1, feed: { H2: -1 } })).toThrow(/non-negative/);
    expect(() => equilibrate({ temperatureK: 1000, pressureBar: 1, feed: { H2: 0 } })).toThrow(/total amount must be positive/);
    expect(() => equilibrate({ temperatureK: 1000, pressureBar: 1, feed: { Kr: 1 } })).toThrow(/unknown species "Kr"/);
    expect(() => equilibrate({ temperatureK: 1000, pressureBar: 0, feed: { H2: 1 } })).toThrow(/pressure must be positive/);
  });
});
