/**
 * Calculation time per project (median and 95th percentile, one core), and the batch of all
 * projects as the build calculates them (lib/batch/batch.ts: this thread, and worker threads
 * for large batches), cold and from the results cache.
 */
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { writeSyntheticProjects } from './synthetic.ts';
import { loadBasisText } from '../lib/basis/load.ts';
import { calculate } from '../lib/plant/calculate.ts';
import { calculateAll, type CalculationJob } from '../lib/batch/batch.ts';
import { ResultsCache } from '../lib/batch/results-cache.ts';
import { quantile, type Row } from './measure.ts';

export function syntheticJobs(root: string, count: number): CalculationJob[] {
  return writeSyntheticProjects(root, count).map((id) => {
    const file = `projects/${id}/basis.yaml`;
    const text = readFileSync(join(root, file));
    const loaded = loadBasisText(text, file, id);
    if (!loaded.ok) throw new Error(`synthetic basis ${id} is invalid: ${loaded.errors.map((e) => e.message).join('; ')}`);
    return { basis: loaded.basis, text };
  });
}

export async function benchCalc(counts: number[]): Promise<Row[]> {
  const rows: Row[] = [];
  for (const n of counts) {
    const root = mkdtempSync(join(tmpdir(), 'cellbasis-bench-calc-'));
    try {
      const jobs = syntheticJobs(root, n);
      for (const job of jobs.slice(0, Math.min(10, n))) calculate(job.basis); // warm-up
      const times = jobs.map((job) => {
        const t0 = performance.now();
        calculate(job.basis);
        return performance.now() - t0;
      });
      times.sort((a, b) => a - b);
      const median = quantile(times, 0.5);
      rows.push({ section: `calc N=${n}`, measure: 'calculation per project, median (one core)', value: `${median.toFixed(1)} ms`, target: '≤ 20 ms', verdict: median <= 20 ? 'met' : 'MISSED' });
      rows.push({ section: `calc N=${n}`, measure: 'calculation per project, 95th percentile', value: `${quantile(times, 0.95).toFixed(1)} ms` });
      const cache = new ResultsCache(root);
      let t0 = performance.now();
      await calculateAll(jobs, { cache });
      rows.push({ section: `calc N=${n}`, measure: 'all projects, as the build calculates them, cold cache', value: `${((performance.now() - t0) / 1000).toFixed(2)} s` });
      t0 = performance.now();
      await calculateAll(jobs, { cache });
      rows.push({ section: `calc N=${n}`, measure: 'all projects, from the results cache', value: `${((performance.now() - t0) / 1000).toFixed(2)} s` });
    } finally {
      rmSync(root, { recursive: true, force: true });
    }
  }
  return rows;
}
