/**
 * Results for many bases at once: from the results cache where the basis, id and library are
 * unchanged, else calculated, in worker threads across the cores when there are enough of them
 * to repay a worker's start (about 0.3 s each), in this thread otherwise. Outcomes come back in
 * the order of the jobs; a calculation error is an outcome, not an exception.
 */
import { availableParallelism } from 'node:os';
import { Worker } from 'node:worker_threads';
import { calculate } from './calculate.ts';
import { BasisError } from '../basis/diagnostics.ts';
import type { DesignBasis, Diagnostic } from '../basis/types.ts';
import { UserError } from '../errors.ts';
import type { Results } from './results-schema.ts';
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
  /** Worker threads to use at most (default: the available cores, at least 1). */
  workers?: number;
  /** Called after each job completes. */
  onProgress?: (done: number, total: number) => void;
}

/** Fewer jobs than this are calculated in this thread: a worker costs more than it saves. */
const PER_WORKER = 6;

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

async function inWorkers(jobs: { index: number; basis: DesignBasis }[], count: number, report: (index: number, outcome: CalculationOutcome) => void): Promise<void> {
  const queue = [...jobs];
  const entry = new URL('./calc-worker-entry.mjs', import.meta.url);
  const run = (worker: Worker) =>
    new Promise<void>((resolve, reject) => {
      const next = () => {
        const job = queue.shift();
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
          reject(error);
          return;
        }
        next();
      });
      worker.on('error', reject);
      next();
    });
  const workers = Array.from({ length: count }, () => new Worker(entry));
  try {
    await Promise.all(workers.map(run));
  } finally {
    await Promise.all(workers.map((w) => w.terminate()));
  }
}

export async function calculateAll(jobs: CalculationJob[], options: BatchOptions = {}): Promise<CalculationOutcome[]> {
  const outcomes: (CalculationOutcome | undefined)[] = new Array(jobs.length);
  const keys = jobs.map((j) => resultsKey(j.text, j.basis.id, j.basis.file));
  let done = 0;
  const report = (index: number, outcome: CalculationOutcome) => {
    outcomes[index] = outcome;
    if (outcome.ok && !outcome.cached && options.cache) options.cache.put(keys[index]!, outcome.results);
    options.onProgress?.(++done, jobs.length);
  };
  const pending: { index: number; basis: DesignBasis }[] = [];
  jobs.forEach((job, index) => {
    const hit = options.cache?.get(keys[index]!);
    if (hit) report(index, { ok: true, results: hit, cached: true });
    else pending.push({ index, basis: job.basis });
  });
  const cores = Math.max(1, options.workers ?? availableParallelism());
  const count = Math.min(cores, Math.floor(pending.length / PER_WORKER));
  if (count >= 2) await inWorkers(pending, count, report);
  else for (const job of pending) report(job.index, calculateHere(job.basis));
  return outcomes as CalculationOutcome[];
}
