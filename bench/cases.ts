/**
 * Calculation time per operating case: for each demo project with cases, the work of its cases
 * beyond the sizing case (lib/plant/cases.ts: each case on the installed hardware, its target's
 * current density solved, the layout found with them, its results, plant balance and curve), divided by the number of those cases; the
 * median over repeated runs (one core), in CPU time (process.cpuUsage, user and system: on a machine
 * shared with other work the wall time also counts the time the process waited) and in wall time.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { loadBasisText } from '../lib/basis/load.ts';
import { casePointResults, evaluateBasis } from '../lib/plant/calculate.ts';
import { carbonMargin, type CarbonLimits } from '../lib/plant/carbon-margin.ts';
import { plantOverRanges } from '../lib/plant/plant-balance.ts';
import { caseResults, layoutCases } from '../lib/plant/cases.ts';
import { quantile, type Row } from './measure.ts';

const RUNS = 15;
const TARGET_MS = 20;

export function benchCases(): Row[] {
  const root = new URL('../projects/', import.meta.url);
  const rows: Row[] = [];
  for (const id of readdirSync(root).sort()) {
    const file = new URL(`${id}/basis.yaml`, root);
    const loaded = loadBasisText(readFileSync(file), `projects/${id}/basis.yaml`, id);
    if (!loaded.ok) throw new Error(`demo ${id} is invalid`);
    const basis = loaded.basis;
    const others = basis.cases.filter((c) => !c.sizing).length;
    if (others === 0) continue;
    const sizing = basis.cases.find((c) => c.sizing)!.basis;
    const point = evaluateBasis(sizing);
    // As calculate.ts: the cases' points on the cells installed and the layout over their cell voltages
    // (layoutCases: a second round where the whole stacks install more cells than the sizing case needs), then each case's sections and plant.
    const sizingLimits: CarbonLimits = new Map();
    const carbon = carbonMargin(point, sizingLimits);
    const all = () => {
      const laid = layoutCases(basis.cases, point, new Map(sizingLimits), plantOverRanges(point, sizing.plant));
      return caseResults(laid.staged, point, { point: laid.installed, carbon }, casePointResults(laid.plant.electrical));
    };
    all(); // warm-up
    const times: number[] = [];
    const cpu: number[] = [];
    for (let k = 0; k < RUNS; k++) {
      const t0 = performance.now();
      const c0 = process.cpuUsage();
      all();
      const used = process.cpuUsage(c0);
      times.push((performance.now() - t0) / others);
      cpu.push((used.user + used.system) / 1000 / others);
    }
    times.sort((a, b) => a - b);
    cpu.sort((a, b) => a - b);
    const median = quantile(times, 0.5);
    const cpuMedian = quantile(cpu, 0.5);
    // CPU time (process.cpuUsage: this process's user and system time) is what a loaded machine does not inflate; the target is judged on it.
    rows.push({ section: 'cases', measure: `calculation per case, median CPU time, ${id} (${others} case${others === 1 ? '' : 's'})`, value: `${cpuMedian.toFixed(1)} ms`, target: `≤ ${TARGET_MS} ms`, verdict: cpuMedian <= TARGET_MS ? 'met' : 'MISSED' });
    rows.push({ section: 'cases', measure: `calculation per case, median wall time, ${id} (${others} case${others === 1 ? '' : 's'})`, value: `${median.toFixed(1)} ms` });
  }
  return rows;
}
