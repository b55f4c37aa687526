// The job of a project's basis file (lib/batch/basis-file-job.ts): keyed when listed, its bytes
// let go, and read again when its turn comes; a file saved in between is calculated as it then
// reads and stored under the key of those bytes only; one that no longer reads is left out.
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { writeSyntheticProjects } from '../../bench/synthetic.ts';
import { loadBasisText } from '../../lib/basis/load.ts';
import { basisFileJob } from '../../lib/batch/basis-file-job.ts';
import { calculateIntoCache } from '../../lib/batch/batch.ts';
import { ResultsCache, resultsKey } from '../../lib/batch/results-cache.ts';
import { calculate } from '../../lib/plant/calculate.ts';

let root: string;
afterEach(() => rmSync(root, { recursive: true, force: true }));

const fileOf = (id: string) => `projects/${id}/basis.yaml`;

/** The results of a basis text as this thread calculates them. */
function resultsOf(bytes: Buffer, id: string): string {
  const loaded = loadBasisText(bytes, fileOf(id), id);
  if (!loaded.ok) throw new Error(loaded.errors.map((e) => e.message).join('; '));
  return JSON.stringify(calculate(loaded.basis));
}

describe('the job of a basis file', () => {
  it('is keyed when listed and reads its basis when its turn comes: a basis saved in between is calculated as saved, under the key of the saved bytes only', async () => {
    root = mkdtempSync(join(tmpdir(), 'cellbasis-test-basis-job-'));
    const [first, second] = writeSyntheticProjects(root, 2) as [string, string];
    const listed = readFileSync(join(root, fileOf(second)));
    const jobs = [basisFileJob(root, first), basisFileJob(root, second)];
    expect(jobs[1]!.key).toBe(resultsKey(listed, second, fileOf(second)));
    // Saved once the first job is done, before the second is taken (one thread: in job order).
    const saved = Buffer.from(listed.toString('utf8').replace(/current-density: "([\d.]+) A\/cm2" # current density at the design point/, 'current-density: "0.500 A/cm2" # current density at the design point'));
    expect(saved.equals(listed)).toBe(false);
    // The saved text gives other results than the listed one, or the test could not tell them apart.
    expect(resultsOf(saved, second)).not.toBe(resultsOf(listed, second));
    const cache = new ResultsCache(root);
    const failures = await calculateIntoCache(jobs, cache, { workers: 1, onProgress: (done) => done === 1 && writeFileSync(join(root, fileOf(second)), saved) });
    expect(failures).toEqual([null, null]);
    expect(JSON.stringify(cache.get(resultsKey(saved, second, fileOf(second))))).toBe(resultsOf(saved, second));
    expect(cache.has(jobs[1]!.key)).toBe(false);
    // The first, unchanged, under the key it was listed with.
    expect(JSON.stringify(cache.get(jobs[0]!.key))).toBe(resultsOf(readFileSync(join(root, fileOf(first))), first));
  }, 120_000);

  it('a basis removed or broken before its turn leaves its job out: neither calculated nor a failure', async () => {
    root = mkdtempSync(join(tmpdir(), 'cellbasis-test-basis-job-'));
    const ids = writeSyntheticProjects(root, 3);
    const jobs = ids.map((id) => basisFileJob(root, id));
    rmSync(join(root, fileOf(ids[0]!)));
    writeFileSync(join(root, fileOf(ids[1]!)), 'document: [unclosed\n');
    expect(jobs[0]!.load()).toBeUndefined();
    expect(jobs[1]!.load()).toBeUndefined();
    const cache = new ResultsCache(root);
    expect(await calculateIntoCache(jobs, cache, { workers: 1 })).toEqual([null, null, null]);
    expect(cache.has(jobs[0]!.key)).toBe(false);
    expect(cache.has(jobs[1]!.key)).toBe(false);
    expect(cache.has(jobs[2]!.key)).toBe(true);
  }, 120_000);

  it('a basis that cannot be read when listed is refused with its file named', () => {
    root = mkdtempSync(join(tmpdir(), 'cellbasis-test-basis-job-'));
    expect(() => basisFileJob(root, 'missing')).toThrow(/^projects\/missing\/basis\.yaml: cannot read the design basis/);
  });
});
