// The batch calculator and the results cache: worker threads give exactly the results of this
// thread; a cached result is served only for the same basis bytes, id and library.
import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { writeSyntheticProjects } from '../../bench/synthetic.ts';
import { loadBasisText } from '../../lib/basis/load.ts';
import { calculateAll, calculateIntoCache, type CalculationJob } from '../../lib/batch/batch.ts';
import { calculate } from '../../lib/plant/calculate.ts';
import { ResultsCache, resultsKey } from '../../lib/batch/results-cache.ts';

function jobs(count: number): { root: string; list: CalculationJob[] } {
  const root = mkdtempSync(join(tmpdir(), 'cellbasis-batch-'));
  const list = writeSyntheticProjects(root, count).map((id) => {
    const file = `projects/${id}/basis.yaml`;
    const text = readFileSync(join(root, file));
    const loaded = loadBasisText(text, file, id);
    if (!loaded.ok) throw new Error(`${id}: ${loaded.errors.map((e) => e.message).join('; ')}`);
    return { basis: loaded.basis, text };
  });
  return { root, list };
}

describe('batch calculation', () => {
  it('worker threads return exactly what this thread computes, in job order', async () => {
    const { list } = jobs(14);
    // Every job in the two workers, none here.
    const outcomes = await calculateAll(list, { workers: 2, jobsPerWorker: 1, alsoHere: false });
    expect(outcomes).toHaveLength(14);
    outcomes.forEach((o, i) => {
      expect(o.ok).toBe(true);
      if (o.ok) expect(JSON.stringify(o.results)).toBe(JSON.stringify(calculate(list[i]!.basis)));
    });
    // Workers and this thread sharing the queue: the same, in job order.
    const shared = await calculateAll(list, { workers: 2, jobsPerWorker: 1 });
    expect(JSON.stringify(shared)).toBe(JSON.stringify(outcomes));
  }, 120_000);

  it('a worker that runs out of heap loses no project: its job and the rest are calculated here, the same results in job order', async () => {
    const { list } = jobs(4);
    // A heap of 8 MB is too small for the library itself (a worker needs some 22 MB to calculate
    // the largest demo, measured 5 December 2026): each worker dies of ERR_WORKER_OUT_OF_MEMORY
    // holding the job it was given, and this thread, which was given none, calculates every job.
    const progress: number[] = [];
    const notices: string[] = [];
    const outcomes = await calculateAll(list, { workers: 2, jobsPerWorker: 1, alsoHere: false, workerLimits: { maxOldGenerationSizeMb: 8 }, onProgress: (done) => progress.push(done), onNotice: (line) => notices.push(line) });
    expect(outcomes).toHaveLength(4);
    // Over the jobs, not the outcomes: forEach would skip the hole a lost job leaves.
    list.forEach((job, i) => {
      const o = outcomes[i];
      expect(o?.ok).toBe(true);
      if (o?.ok) expect(JSON.stringify(o.results)).toBe(JSON.stringify(calculate(job.basis)));
    });
    expect(progress).toEqual([1, 2, 3, 4]);
    // Each worker's death is told, naming its heap and the project it held, which is one of the jobs.
    expect(notices).toHaveLength(2);
    for (const line of notices) {
      expect(line).toMatch(/^a calculation worker ran out of its 8 MB heap calculating (\S+); that project and the projects left were calculated in the main thread instead/);
      expect(list.map((j) => j.basis.file)).toContain(/calculating (\S+);/.exec(line)![1]);
    }
  }, 120_000);

  it('into the cache: a deferred job is loaded when taken, and one whose basis does not load is left out (neither calculated nor a failure)', async () => {
    const { root, list } = jobs(2);
    const cache = new ResultsCache(root);
    const loads: string[] = [];
    const deferred = list.map(({ basis, text }) => {
      const key = resultsKey(text, basis.id, basis.file);
      return { id: basis.id, file: basis.file, key, load: () => (loads.push(basis.id), { basis, key }) };
    });
    const broken = { id: 'broken', file: 'projects/broken/basis.yaml', key: resultsKey('x', 'broken', 'projects/broken/basis.yaml'), load: () => (loads.push('broken'), undefined) };
    const failures = await calculateIntoCache([deferred[0]!, broken, deferred[1]!], cache, { workers: 1 });
    expect(failures).toEqual([null, null, null]);
    expect(loads).toEqual([list[0]!.basis.id, 'broken', list[1]!.basis.id]);
    for (const job of list) expect(JSON.stringify(cache.get(resultsKey(job.text, job.basis.id, job.basis.file)))).toBe(JSON.stringify(calculate(job.basis)));
    expect(cache.has(resultsKey('x', 'broken', broken.file))).toBe(false);
  }, 120_000);

  it('into the cache: every result stored as a calculation here gives it, failures returned, nothing kept; a second run reads no entry', async () => {
    const { root, list } = jobs(3);
    // The third job fails: a cell voltage above its Nernst voltage (a located calculation error).
    const bad = loadBasisText(readFileSync(join(root, 'projects/p0003/basis.yaml'), 'utf8').replace(/area-specific-resistance: .*/, 'cell-voltage: 1.6 V'), 'projects/p0003/basis.yaml', 'p0003');
    if (!bad.ok) throw new Error(bad.errors.map((e) => e.message).join('; '));
    const failing = { basis: bad.basis, text: 'changed' };
    const cache = new ResultsCache(root);
    const failures = await calculateIntoCache([list[0]!, list[1]!, failing], cache, { workers: 1 });
    expect(failures.slice(0, 2)).toEqual([null, null]);
    expect(failures[2]?.ok).toBe(false);
    for (const job of list.slice(0, 2)) {
      expect(JSON.stringify(cache.get(resultsKey(job.text, job.basis.id, job.basis.file)))).toBe(JSON.stringify(calculate(job.basis)));
    }
    // A second run finds the entries by name and reads none of them: an entry emptied is not noticed here (get() verifies it where the results are read).
    let progress = 0;
    const again = await calculateIntoCache(list.slice(0, 2), cache, { workers: 1, onProgress: () => progress++ });
    expect(again).toEqual([null, null]);
    expect(progress).toBe(2);
  }, 120_000);

  it('a second run is served from the cache; another basis text is a miss', async () => {
    const { root, list } = jobs(3);
    const cache = new ResultsCache(root);
    const first = await calculateAll(list, { cache, workers: 1 });
    expect(first.every((o) => o.ok && !o.cached)).toBe(true);
    const second = await calculateAll(list, { cache, workers: 1 });
    expect(second.every((o) => o.ok && o.cached)).toBe(true);
    expect(JSON.stringify(second.map((o) => o.ok && o.results))).toBe(JSON.stringify(first.map((o) => o.ok && o.results)));
    const job = list[0]!;
    expect(resultsKey(`${job.text.toString()}\n# edited`, job.basis.id, job.basis.file)).not.toBe(resultsKey(job.text, job.basis.id, job.basis.file));
    expect(resultsKey(job.text, 'other-id', job.basis.file)).not.toBe(resultsKey(job.text, job.basis.id, job.basis.file));
  });

  it('reports progress once per job', async () => {
    const { list } = jobs(3);
    const seen: number[] = [];
    await calculateAll(list, { workers: 1, onProgress: (done, total) => seen.push(done * 10 + total) });
    expect(seen).toEqual([13, 23, 33]);
  });
});
