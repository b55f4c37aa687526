/**
 * Results for many bases at once: from the results cache where the basis, id and library are
 * unchanged, else calculated, in this thread and, when there are enough jobs to repay a
 * worker's start, in worker threads on the other cores, all taking jobs from one queue.
 * Outcomes come back in the order of the jobs; a calculation error is an outcome, not an
 * exception.
 */
import { availableParallelism } from 'node:os';
import { Worker } from 'node:worker_threads';
import { calculate } from '../plant/calculate.ts';
import { BasisError } from '../basis/diagnostics.ts';
import type { DesignBasis, Diagnostic } from '../basis/types.ts';
import { UserError } from '../core/errors.ts';
import type { Results } from '../plant/results-schema.ts';
import { resultsKey, type ResultsCache } from './results-cache.ts';

export interface CalculationJob {
  basis: DesignBasis;
  /** The bytes of the basis file (the cache key covers them). */
  text: string | Uint8Array;
}

export type CalculationOutcome =
  | { ok: true; results: Results; cached: boolean }
  | { ok: false; diagnostics: Diagnostic[]; message: string };

export type WorkerReply =
  | { job: number; kind: 'results'; results: Results }
  | { job: number; kind: 'basis-error'; diagnostics: Diagnostic[] }
  | { job: number; kind: 'user-error'; message: string }
  | { job: number; kind: 'crash'; message: string };

export interface BatchOptions {
  cache?: ResultsCache;
  /** Threads to calculate in at most, this one included (default: the available cores, at least 1). */
  workers?: number;
  /** Jobs per worker started (default PER_WORKER); tests lower it to run small batches in workers. */
  jobsPerWorker?: number;
  /** Whether this thread takes jobs too when workers run (default true); tests turn it off to give every job to the workers. */
  alsoHere?: boolean;
  /** Called after each job completes. */
  onProgress?: (done: number, total: number) => void;
}

/**
 * Jobs per worker thread started. A worker takes about 0.75 s to start (tsx loads the library
 * into it), the time of some 150 calculations at about 5 ms each (measured on 2 cores, 2
 * December 2026: 500 projects took 2.1 s in this thread alone and 2.7-2.9 s in two workers with
 * this thread idle, 100 projects 0.6 s against 1.3 s).
 */
const PER_WORKER = 150;

function outcomeOf(reply: WorkerReply): CalculationOutcome {
  switch (reply.kind) {
    case 'results':
      return { ok: true, results: reply.results, cached: false };
    case 'basis-error':
      return { ok: false, diagnostics: reply.diagnostics, message: reply.diagnostics.map((d) => d.message).join('; ') };
    case 'user-error':
      return { ok: false, diagnostics: [], message: reply.message };
    case 'crash':
      throw new Error(`internal error in a calculation worker: ${reply.message}`);
  }
}

function calculateHere(basis: DesignBasis): CalculationOutcome {
  try {
    return { ok: true, results: calculate(basis), cached: false };
  } catch (error) {
    if (error instanceof BasisError) return { ok: false, diagnostics: error.errors, message: error.message };
    if (error instanceof UserError) return { ok: false, diagnostics: [], message: error.message };
    throw error;
  }
}

/**
 * Runs the jobs from one queue: `count` workers, and this thread between their messages (one
 * job at a time, yielding after each so that the workers' replies are taken as they come).
 */
async function inThreads(jobs: { index: number; basis: DesignBasis }[], count: number, alsoHere: boolean, report: (index: number, outcome: CalculationOutcome) => void): Promise<void> {
  const queue = [...jobs];
  const entry = new URL('./calc-worker-entry.mjs', import.meta.url);
  let failure: unknown;
  const run = (worker: Worker) =>
    new Promise<void>((resolve, reject) => {
      const next = () => {
        const job = failure === undefined ? queue.shift() : undefined;
        if (!job) {
          resolve();
          return;
        }
        worker.postMessage({ job: job.index, basis: job.basis });
      };
      worker.on('message', (reply: WorkerReply) => {
        try {
          report(reply.job, outcomeOf(reply));
        } catch (error) {
          failure ??= error;
          reject(error);
          return;
        }
        next();
      });
      worker.on('error', (error) => {
        failure ??= error;
        reject(error);
      });
      next();
    });
  const here = async () => {
    for (let job = queue.shift(); job && failure === undefined; job = queue.shift()) {
      report(job.index, calculateHere(job.basis));
      await new Promise((resolve) => setImmediate(resolve));
    }
  };
  const workers = Array.from({ length: count }, () => new Worker(entry));
  try {
    await Promise.all([...(alsoHere ? [here()] : []), ...workers.map(run)]);
  } finally {
    await Promise.all(workers.map((w) => w.terminate()));
  }
}

export async function calculateAll(jobs: CalculationJob[], options: BatchOptions = {}): Promise<CalculationOutcome[]> {
  return (await runBatch(jobs, options, true)) as CalculationOutcome[];
}

/** A job that did not give results: its diagnostics or message. */
export type CalculationFailure = Extract<CalculationOutcome, { ok: false }>;

/**
 * Every job's results put into the cache, none kept in memory: for a build of many projects,
 * whose pages read each project's results from the cache when they are rendered, so that the
 * results of all the projects are never held at once (a cached entry is not even read here).
 * Returns each job's failure, or null where its results are in the cache (or could not be
 * written there: the reader then calculates them again).
 */
export async function calculateIntoCache(jobs: CalculationJob[], cache: ResultsCache, options: Omit<BatchOptions, 'cache'> = {}): Promise<(CalculationFailure | null)[]> {
  // Array.from, not map: the entries found in the cache were never set, and map skips such holes.
  return Array.from(await runBatch(jobs, { ...options, cache }, false), (o) => (o && !o.ok ? o : null));
}

/** The jobs' outcomes; with `keep` false, results that went into the cache are not kept (undefined). */
async function runBatch(jobs: CalculationJob[], options: BatchOptions, keep: boolean): Promise<(CalculationOutcome | undefined)[]> {
  const outcomes: (CalculationOutcome | undefined)[] = new Array(jobs.length);
  const keys = jobs.map((j) => resultsKey(j.text, j.basis.id, j.basis.file));
  let done = 0;
  const report = (index: number, outcome: CalculationOutcome) => {
    if (outcome.ok && !outcome.cached && options.cache) options.cache.put(keys[index]!, outcome.results);
    outcomes[index] = keep || !outcome.ok || !options.cache ? outcome : undefined;
    options.onProgress?.(++done, jobs.length);
  };
  const pending: { index: number; basis: DesignBasis }[] = [];
  jobs.forEach((job, index) => {
    if (!keep && options.cache?.has(keys[index]!)) {
      options.onProgress?.(++done, jobs.length);
      return;
    }
    const hit = keep ? options.cache?.get(keys[index]!) : undefined;
    if (hit) report(index, { ok: true, results: hit, cached: true });
    else pending.push({ index, basis: job.basis });
  });
  // This thread takes a core; workers go on the others.
  const cores = Math.max(1, options.workers ?? availableParallelism());
  const alsoHere = options.alsoHere ?? true;
  const count = Math.min(alsoHere ? cores - 1 : cores, Math.floor(pending.length / (options.jobsPerWorker ?? PER_WORKER)));
  if (count >= 1) await inThreads(pending, count, alsoHere, report);
  else for (const job of pending) report(job.index, calculateHere(job.basis));
  return outcomes;
}
