// Inert species in the equilibrium: a species of the feed that takes part in no reaction but
// counts in the gas total. Checked by what it must do physically (its amount stays that of the
// feed, and it acts on the rest only by dilution: the reacting gas equilibrates as it would alone
// at its own share of the pressure, the law of partial pressures for ideal gases) and against a
// recomputation outside the project (Python, K of reforming and shift from the full NASA Glenn
// database at 1073.15 K, K1 = 166.87 bar², K2 = 1.0815, solved for the two extents):
// CH4=1, H2O=2, N2=3 at 1 bar with N2 inert gives y(H2) 0.400479, y(N2) 0.375286,
// y(CO) 0.098375, y(H2O) 0.099139, y(CO2) 0.026338, y(CH4) 0.000382.
import { describe, expect, it } from 'vitest';
import { equilibrate } from '../../lib/equilibrium/equilibrate.ts';

const T = 1073.15;

describe('inert species', () => {
  const withN2 = equilibrate({ temperatureK: T, pressureBar: 1, feed: { CH4: 1, H2O: 2, N2: 3 }, inert: ['N2'] });

  it('reforming diluted by 3 mol of inert N2: the mole fractions of the two-reaction recomputation (1e-6: its six printed digits)', () => {
    const expected = { H2: 0.400479, N2: 0.375286, CO: 0.098375, H2O: 0.099139, CO2: 0.026338, CH4: 0.000382 };
    // The recomputation leaves out the minor species (C2H6, OH, ...), each below 1e-6 here.
    for (const [s, y] of Object.entries(expected)) expect(Math.abs(withN2.moleFractions[s]! - y), s).toBeLessThan(1.5e-6);
  });

  it('the inert amount is the feed amount exactly, and no nitrogen compound forms', () => {
    expect(withN2.amounts.N2).toBeCloseTo(3, 12);
    expect(Object.keys(withN2.moleFractions).filter((s) => s !== 'N2' && /N/.test(s))).toEqual([]);
    // Left reacting, N2 forms traces of NH3 and HCN.
    const reacting = equilibrate({ temperatureK: T, pressureBar: 1, feed: { CH4: 1, H2O: 2, N2: 3 } });
    expect(reacting.moleFractions.NH3).toBeGreaterThan(0);
  });

  it('dilution only: the reacting gas equals the undiluted equilibrium at its partial pressure P(1 − y_inert)', () => {
    const yN2 = withN2.moleFractions.N2!;
    const alone = equilibrate({ temperatureK: T, pressureBar: 1 - yN2, feed: { CH4: 1, H2O: 2 } });
    for (const s of ['H2', 'CO', 'CO2', 'H2O', 'CH4']) {
      // 1e-9 relative: both are converged to the minimiser's balance (1e-12), far below this.
      expect(withN2.moleFractions[s]! / (1 - yN2) / alone.moleFractions[s]!, s).toBeCloseTo(1, 9);
    }
  });

  it('a species that would react is held: CH4 inert in a shift mixture keeps its feed amount', () => {
    const e = equilibrate({ temperatureK: 1000, pressureBar: 1, feed: { CO: 1, H2O: 1, CH4: 0.5 }, inert: ['CH4'] });
    expect(e.amounts.CH4).toBeCloseTo(0.5, 12);
    // The shift alone: K = 1.4339 at 1000 K (test/electrochem/chemical-reaction.test.ts); with CO = H2O = 1
    // and no H2 or CO2 fed, x²/(1 − x)² = K gives x = √K/(1 + √K) = 0.54494.
    const x = Math.sqrt(1.4339) / (1 + Math.sqrt(1.4339));
    expect(e.amounts.CO2! / 1).toBeCloseTo(x, 3);
  });

  it('refuses an inert species not in the feed, and a feed with nothing left to react', () => {
    expect(() => equilibrate({ temperatureK: T, pressureBar: 1, feed: { CH4: 1, H2O: 2 }, inert: ['N2'] })).toThrow(/N2 is not in the feed/);
    expect(() => equilibrate({ temperatureK: T, pressureBar: 1, feed: { N2: 1 }, inert: ['N2'] })).toThrow(/nothing in the feed reacts/);
  });
});
