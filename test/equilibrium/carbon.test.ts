// Carbon activity and the minimum steam-to-carbon ratio. Sources: the Boudouard and cracking
// equilibria (J. R. Rostrup-Nielsen, Catalytic Steam Reforming, 1984, §5); the thermodynamic
// carbon-free limit of methane steam reforming near S/C = 1 at 800 °C and 1 bar (equilibrium
// theory, the same reference's carbon-limit diagrams; from memory); S/C 2-3 in practice
// (common practice, no source).
import { describe, expect, it } from 'vitest';
import { addSteam, boudouardCarbonActivity, combustibleCarbon, crackingCarbonActivity, minimumSteamToCarbon } from '../../lib/equilibrium/carbon.ts';
import { equilibrate } from '../../lib/equilibrium/equilibrate.ts';

describe('carbon activity', () => {
  it('on an equilibrated gas, Boudouard, methane cracking and the element potential agree (1e-9)', () => {
    for (const [t, feed] of [[1073.15, { CH4: 1, H2O: 0.8 }], [900, { CH4: 1, H2O: 2, CO2: 0.5 }], [1200, { CO: 1, H2: 2 }]] as const) {
      const e = equilibrate({ temperatureK: t, pressureBar: 1, feed });
      expect(boudouardCarbonActivity(e.moleFractions, t, 1) / e.carbonActivity).toBeCloseTo(1, 9);
      expect(crackingCarbonActivity(e.moleFractions, t, 1) / e.carbonActivity).toBeCloseTo(1, 9);
    }
  });

  it('is 0 without CO (no carbon), unbounded with CO and no CO2', () => {
    expect(boudouardCarbonActivity({ H2: 1 }, 1000, 1)).toBe(0);
    expect(boudouardCarbonActivity({ CO: 1 }, 1000, 1)).toBe(Infinity);
  });
});

describe('minimum steam-to-carbon ratio', () => {
  it('methane at 800 °C and 1 bar: near 1 (equilibrium theory), below the S/C 2-3 of practice', () => {
    const limit = minimumSteamToCarbon({ CH4: 1 }, 1073.15, 1);
    expect(limit.minimumSteamToCarbon).toBeGreaterThan(0.8);
    expect(limit.minimumSteamToCarbon).toBeLessThan(1.3);
    expect(limit.minimumSteamToCarbon).toBeLessThan(2);
  });

  it('the equilibrated gas at the limit has carbon activity 1 (the root is a root)', () => {
    const fuel = { CH4: 0.93, C2H6: 0.04, C3H8: 0.01, CO2: 0.01, N2: 0.01 };
    const t = 973.15;
    const limit = minimumSteamToCarbon(fuel, t, 3);
    const e = equilibrate({ temperatureK: t, pressureBar: 3, feed: addSteam(fuel, limit.minimumSteamToCarbon * combustibleCarbon(fuel)) });
    expect(e.carbonActivity).toBeCloseTo(1, 6);
    const safer = equilibrate({ temperatureK: t, pressureBar: 3, feed: addSteam(fuel, (limit.minimumSteamToCarbon + 0.1) * combustibleCarbon(fuel)) });
    expect(safer.carbonActivity).toBeLessThan(1);
  });

  it('is zero for a fuel that is carbon-free without steam, and undefined without carbon', () => {
    expect(minimumSteamToCarbon({ CO: 0.1, CO2: 0.9 }, 1073.15, 1).minimumSteamToCarbon).toBe(0);
    expect(() => minimumSteamToCarbon({ H2: 1 }, 1073.15, 1)).toThrow(/no combustible carbon/);
  });

  it('combustible carbon excludes CO2', () => {
    expect(combustibleCarbon({ CH4: 0.6, CO2: 0.4 })).toBeCloseTo(0.6, 12);
    expect(combustibleCarbon({ C2H6: 1, CO: 1 })).toBeCloseTo(3, 12);
  });
});
