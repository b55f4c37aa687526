// The equilibrium heat capacity (RP-1311's temperature derivatives) against a central difference
// of the equilibrium enthalpy computed at two temperatures: the identity c_p,eq = dH_eq/dT.
import { describe, expect, it } from 'vitest';
import { equilibrate } from '../../lib/equilibrium/equilibrate.ts';
import { equilibriumEnthalpy } from '../../lib/equilibrium/equilibrium-heat-capacity.ts';
import { cp, enthalpy } from '../../lib/thermo/properties.ts';
import { getSpecies } from '../../lib/thermo/species-data.ts';

const at = (feed: Record<string, number>, temperatureK: number, pressureBar: number, allowGraphite = false) => {
  const e = equilibrate({ feed, temperatureK, pressureBar, allowGraphite });
  return { e, heat: equilibriumEnthalpy(e.system, temperatureK, e.raw) };
};

describe('equilibrium heat capacity', () => {
  const cases: [string, Record<string, number>, number, number, boolean][] = [
    ['H2 + ½ O2 at 3000 K (strongly dissociated)', { H2: 2, O2: 1 }, 3000, 1.01325, false],
    ['CH4–air products at 2200 K', { CH4: 1, O2: 2, N2: 7.52 }, 2200, 1.01325, false],
    ['steam reforming of methane at 900 K', { CH4: 1, H2O: 2 }, 900, 3, false],
    ['methane cracking with graphite present at 1000 K', { CH4: 1, H2O: 0.1 }, 1000, 1, true],
  ];

  it.each(cases)('equals dH_eq/dT by central difference: %s', (_name, feed, temperatureK, pressureBar, graphite) => {
    // Step 0.05 K: the truncation error of the central difference, (δ²/6) d³H/dT³, is below 1e-8
    // relative here, and the minimiser resolves H to ~1e-13 of its terms, so the difference is good
    // to about 1e-7; 1e-5 leaves room.
    const step = 0.05;
    const { e, heat } = at(feed, temperatureK, pressureBar, graphite);
    if (graphite) expect(e.graphite).toBeGreaterThan(0);
    const up = at(feed, temperatureK + step, pressureBar, graphite).heat.enthalpyJ;
    const down = at(feed, temperatureK - step, pressureBar, graphite).heat.enthalpyJ;
    const numeric = (up - down) / (2 * step);
    expect(Math.abs(heat.equilibriumHeatCapacityJPerK / numeric - 1)).toBeLessThan(1e-5);
  });

  it('frozen part is Σ n_j c_p,j, and dissociation raises the equilibrium value above it', () => {
    const { e, heat } = at({ H2: 2, O2: 1 }, 3000, 1.01325);
    const frozen = Object.entries(e.amounts).reduce((s, [k, n]) => s + n * cp(getSpecies(k), 3000), 0);
    expect(Math.abs(heat.frozenHeatCapacityJPerK / frozen - 1)).toBeLessThan(1e-13);
    const h = Object.entries(e.amounts).reduce((s, [k, n]) => s + n * enthalpy(getSpecies(k), 3000), 0);
    expect(Math.abs(heat.enthalpyJ - h)).toBeLessThan(1e-9 * heat.enthalpyMagnitudeJ);
    // At 3000 K a third of the water is dissociated; shifting that with T dominates: c_p,eq is
    // several times the frozen value (RP-1311's "equilibrium" vs "frozen" heat capacity).
    expect(heat.equilibriumHeatCapacityJPerK / heat.frozenHeatCapacityJPerK).toBeGreaterThan(3);
  });

  it('equals the frozen value where nothing reacts (nitrogen and argon)', () => {
    const { heat } = at({ N2: 0.78, Ar: 0.01 }, 800, 1);
    expect(Math.abs(heat.equilibriumHeatCapacityJPerK / heat.frozenHeatCapacityJPerK - 1)).toBeLessThan(1e-6);
  });
});
