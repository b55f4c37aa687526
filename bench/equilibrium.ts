/** Equilibrium rates on one core, and the time of a complete fuel path. */
import { minimiseGibbs } from '../lib/equilibrium/gibbs-minimiser.ts';
import { elementAmounts, gasGibbsOverRT, systemFor } from '../lib/equilibrium/species-set.ts';
import { fuelPath } from '../lib/equilibrium/fuel-path.ts';
import { technology } from '../lib/electrochem/technologies.ts';
import { formatRate, quantile, ratePerSecond, type Row } from './measure.ts';

export function benchEquilibrium(): Row[] {
  const eight = systemFor(['C', 'H', 'O', 'N'], ['H2', 'H2O', 'CO', 'CO2', 'CH4', 'N2', 'NH3', 'O2']);
  const full = systemFor(['C', 'H', 'O', 'N']);
  let k = 0;
  const feeds = [0.5, 1, 1.5, 2, 2.5, 3].map((s) => ({ CH4: 1, H2O: s, CO2: 0.05, N2: 0.02 }));
  const rateOf = (system: typeof eight, warm: boolean) => {
    const g = gasGibbsOverRT(system, 1073.15);
    let previous: Float64Array | undefined;
    return ratePerSecond(() => {
      const b = elementAmounts(system, feeds[k++ % feeds.length]!);
      const r = minimiseGibbs(system, g, 0, b, 0, warm && previous ? { warmStart: previous } : {});
      previous = r.lnScaled;
    }, 700);
  };
  const sofc = technology('solid-oxide');
  const times: number[] = [];
  for (let i = 0; i < 30; i++) {
    const t0 = performance.now();
    fuelPath({ technology: sofc, mode: 'power', temperatureK: 1073.15, fuelPressureBar: 1, airPressureBar: 1, fuelFeed: { CH4: 1, H2O: 2.5 }, airFeed: { O2: 6.8, N2: 25.6 }, utilization: 0.85 });
    times.push(performance.now() - t0);
  }
  times.sort((a, b) => a - b);
  const eightCold = rateOf(eight, false);
  return [
    { section: 'equilibrium', measure: 'equilibria per second, 8-species C-H-O-N gas, cold start', value: formatRate(eightCold), target: '≥ 20,000 /s', verdict: eightCold >= 20000 ? 'met' : 'MISSED' },
    { section: 'equilibrium', measure: 'equilibria per second, 8-species gas, warm start (fuel path)', value: formatRate(rateOf(eight, true)) },
    { section: 'equilibrium', measure: `equilibria per second, all ${full.gas.length} C-H-O-N species, cold start`, value: formatRate(rateOf(full, false)) },
    { section: 'equilibrium', measure: 'fuel path, CH4 SOFC to 85 % (≥100 steps + refinement), median', value: `${quantile(times, 0.5).toFixed(2)} ms` },
  ];
}
