// Carbon activity and the minimum steam-to-carbon ratio. Sources: the Boudouard and cracking
// equilibria (J. R. Rostrup-Nielsen, Catalytic Steam Reforming, 1984, §5); the thermodynamic
// carbon-free limit of methane steam reforming near S/C = 1 at 800 °C and 1 bar (equilibrium
// theory, the same reference's carbon-limit diagrams; from memory); S/C 2-3 in practice
// (common practice, no source).
import { describe, expect, it } from 'vitest';
import { addSteam, boudouardCarbonActivity, combustibleCarbon, crackingCarbonActivity, minimumSteamToCarbon, SteamLimitNotReached, STEAM_TO_CARBON_SEARCH_LIMIT } from '../../lib/equilibrium/carbon.ts';
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

  // A fuel short of oxygen for its carbon, at a PEM stack's temperature: H2 0.041407, CO2 0.93789,
  // CH3OH 0.020702 (a random basis of test/plant/properties.test.ts, CI run of 4 Dec 2026). Steam
  // adds only fully oxidised H2O, so the oxygen deficit D (O short of CO2 + H2O) stays as CH4 ≈ D/4
  // whatever the steam, and a_C from CH4 + CO2 ⇌ 2 C + 2 H2O falls only by dilution:
  // a_C = √(K p_CH4 p_CO2) / p_H2O. By hand at S/C = 64 and 0.8 bar: D = 0.103513 mol, CH4 0.02588,
  // CO2 0.93271, H2O 1.35598 of 2.31457 mol, so a_C = √(K · 0.0028837)/0.46868; K from the 298.15 K
  // ΔfG° and S° of CH4, CO2, H2O(g), graphite (NIST-JANAF; ΔG° −12.06 kJ, ΔS° −10.88 J/K, ΔH° held
  // constant) is 71.4 at 330 K (a_C 0.968) and 49.6 at 353.15 K (a_C 0.807). The constant-ΔH° hand
  // value is good to a few per cent in a_C (it also neglects H2 and CO), hence the 6 % band.
  const shortOfOxygen = { H2: 0.041407, CO2: 0.93789, CH3OH: 0.020702 };

  it('a fuel short of oxygen at 330 K: no S/C up to 64 is carbon-free, said as such with the activity (hand value 0.968)', () => {
    let thrown: unknown;
    try {
      minimumSteamToCarbon(shortOfOxygen, 330, 0.8);
    } catch (error) {
      thrown = error;
    }
    expect(thrown).toBeInstanceOf(SteamLimitNotReached);
    const e = thrown as SteamLimitNotReached;
    expect(e.temperatureK).toBe(330);
    expect(e.carbonActivity).toBeGreaterThan(1);
    expect(e.carbonActivity / 0.968).toBeGreaterThan(0.94);
    expect(e.carbonActivity / 0.968).toBeLessThan(1.06);
    expect(e.message).toMatch(/steam-to-carbon ratio of 64: no practical steam-to-carbon ratio keeps it free of carbon/);
    expect(e.exitCode).toBe(1);
  });

  it('the same fuel at 353.15 K has a limit below 64 (hand a_C at S/C 64 is 0.807 < 1)', () => {
    const limit = minimumSteamToCarbon(shortOfOxygen, 353.15, 0.8);
    expect(limit.minimumSteamToCarbon).toBeGreaterThan(STEAM_TO_CARBON_SEARCH_LIMIT / 2);
    expect(limit.minimumSteamToCarbon).toBeLessThan(STEAM_TO_CARBON_SEARCH_LIMIT);
    const e = equilibrate({ temperatureK: 353.15, pressureBar: 0.8, feed: addSteam(shortOfOxygen, 64 * combustibleCarbon(shortOfOxygen)) });
    expect(e.carbonActivity / 0.807).toBeGreaterThan(0.94);
    expect(e.carbonActivity / 0.807).toBeLessThan(1.06);
  });
});
