/**
 * Results for many bases at once: from the results cache where the basis, id and library are
 * unchanged, else calculated, in this thread and, when there are enough jobs to repay a
 * worker's start, in worker threads on the other cores, all taking jobs from one queue.
 * Outcomes come back in the order of the jobs; a calculation error is an outcome, not an
 * exception.
 */
import { availableParallelism } from 'node:os';
import { Worker, type ResourceLimits } from 'node:worker_threads';
import { calculate } from '../plant/calculate.ts';
import { BasisError } from '../basis/diagnostics.ts';
import type { DesignBasis, Diagnostic } from '../basis/types.ts';
import { UserError } from '../core/errors.ts';
import type { Results } from '../plant/results-schema.ts';
import { resultsKey, type ResultsCache } from './results-cache.ts';
import { heapBound } from './collect-garbage.ts';

export interface CalculationJob {
  basis: DesignBasis;
  /** The bytes of the basis file (the cache key covers them). */
  text: string | Uint8Array;
}

/**
 * A job whose basis is read and validated only when its turn comes (`load`; undefined when the
 * basis does not load: the job is then left out, neither calculated nor a failure, its problems
 * being named by whoever loads it again). A batch of them holds only each waiting basis's key and
 * names. Holding all of them validated at once was about 45 kB of heap each, 88 MiB for 2 000
 * projects, which V8 then multiplied by letting the heap grow to some 2.5 times what was alive;
 * holding their bytes (about 6.3 kB each) kept 12 MiB through the calculation of 2 000
 * (lib/batch/basis-file-job.ts gives the figures).
 */
export interface DeferredJob {
  id: string;
  /** The basis file as shown, relative to the root (the cache key covers it). */
  file: string;
  /** The results key of the basis as listed (resultsKey). */
  key: string;
  /**
   * The basis and the results key of the very bytes it was loaded from: the listed key, or
   * another where the file changed since it was listed (its results are then stored under the
   * key of what was calculated, never under the listed one).
   */
  load: () => { basis: DesignBasis; key: string } | undefined;
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
  /** The heap limits of each worker thread (default WORKER_LIMITS); tests set tiny ones to make a worker run out of memory. */
  workerLimits?: ResourceLimits;
  /** Told, in a line naming the project, when a worker runs out of heap and its work goes to this thread (a build shows it as a warning). */
  onNotice?: (line: string) => void;
}

/**
 * Jobs per worker thread started. A worker takes about 0.75 s to start (tsx loads the library
 * into it), the time of some 150 calculations at about 5 ms each (measured on 2 cores, 2
 * December 2026: 500 projects took 2.1 s in this thread alone and 2.7-2.9 s in two workers with
 * this thread idle, 100 projects 0.6 s against 1.3 s).
 */
const PER_WORKER = 150;

/**
 * The heap limits of a calculation worker. Left to itself V8 sizes a worker's heap as it would a
 * whole program's and collects late. Measured 5 December 2026 (one worker calculating the four
 * demos and 100 bench/synthetic.ts projects, this thread idle, the process's peak RSS by
 * `resourceUsage().maxRSS`, load average about 10): no limits 280 MiB; old space 128 MB 237 MiB;
 * these limits 219 MiB; old space 64 MB with a young generation of 8 MB 210 MiB; processor time
 * 5.6-7.6 s in all of them (the spread of the runs). What a worker needs: with the old space
 * capped at 22 MB it still calculated the largest demo (the solid oxide CHP with its operating
 * cases), at 16-20 MB it died loading the library, at 24 MB it calculated the 500 synthetic
 * projects and the demos but nearly twice as slowly (collecting all the time), and at 48 MB the
 * 104 projects took twice the processor time of 64 MB or more. 96 MB with a young generation of
 * 16 MB was used until 5 December 2026; now 64 MB and 8 MB, with the worker collecting its own
 * heap whenever it grew 16 MiB (calc-worker.ts): a cold build of 500 synthetic projects peaked at
 * 379-384 MiB against 382-393 MiB, in the same processor time (76.8 s against 77.0 s, run one after
 * the other, load average 8-10). A worker that runs out all the same loses nothing: its job is
 * calculated in this thread (inThreads).
 */
const WORKER_LIMITS: ResourceLimits = { maxOldGenerationSizeMb: 64, maxYoungGenerationSizeMb: 8 };

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
 * How far this thread's heap may grow past what was alive at its last full collection before
 * the batch collects again (heapBound), checked after each job. Every job passes through this
 * thread (a worker's results are written to the cache here, else the job is calculated here),
 * and left to itself V8 let the heap grow to about 2.5 times what was alive: in a cold build of
 * 2 000 projects the heap in use swung between 150 and 470 MiB (5 December 2026, peak RSS 883
 * MiB). Measured the same day on the calculation alone of 500 bench/synthetic.ts projects (one
 * worker and this thread, load average 5-7): a slack of 64 MiB peaked at 286-297 MiB of RSS for
 * 27-34 s of processor time, 48 MiB at 272-274 MiB for 31 s, 32 MiB at 247-254 MiB for 40 s
 * (a full collection every few jobs): 48 MiB is where the memory still fell for little time.
 */
const HEAP_SLACK_BYTES = 48 * 1024 * 1024;

/**
 * The same slack while calculation workers run beside this thread. A worker is a second copy of
 * the library and its loader in the process (55-65 MiB of RSS with the library loaded and no job
 * run, measured 5 December 2026 by starting idle workers), so a cold build's peak stepped up when
 * the batch was large enough to start one (N = 150 and more): 329-337 MiB at 100 bench/synthetic.ts
 * projects (this thread alone), 382-393 MiB at 500 (+15-17 %, against the target of +15 % at most:
 * memory must not depend on the number of projects). With this slack at 24 MiB, the worker's own
 * heap bounded (calc-worker.ts) and its limits lowered (WORKER_LIMITS): 359 and 363 MiB at 500
 * (+7-10 %), for some 10 % more processor time in the build (81-88 s against 73-77 s for the cold
 * build of 500; runs beside other work, load average 5-10, so the figure is rough). The worker's
 * changes alone gave 379-384 MiB; this slack alone 374 MiB.
 */
const SHARED_HEAP_SLACK_BYTES = 24 * 1024 * 1024;

/** A job whose basis is loaded, ready to calculate. */
interface Ready {
  index: number;
  basis: DesignBasis;
}

/**
 * Runs the jobs from one queue (`take` gives the next, loaded, or undefined when none is left):
 * `count` workers, and this thread between their messages (one job at a time, yielding after
 * each so that the workers' replies are taken as they come). A worker that runs out of heap
 * (ERR_WORKER_OUT_OF_MEMORY, past `options.workerLimits`) is not started again, and `options.onNotice` told: the job it held is
 * calculated in this thread once the others are done, with whatever the queue still holds, so
 * no project is lost and the outcome is the one this thread gives (the same calculation). Any
 * other death of a worker stops the batch with an internal error naming the project.
 */
async function inThreads(take: () => Ready | undefined, count: number, options: BatchOptions, report: (index: number, outcome: CalculationOutcome) => void): Promise<void> {
  const limits = options.workerLimits ?? WORKER_LIMITS;
  const entry = new URL('./calc-worker-entry.mjs', import.meta.url);
  const orphans: Ready[] = [];
  let failure: unknown;
  const run = (worker: Worker) =>
    new Promise<void>((resolve, reject) => {
      let held: Ready | undefined;
      const fail = (error: unknown) => {
        failure ??= error;
        reject(error);
      };
      const next = () => {
        held = failure === undefined ? take() : undefined;
        if (held) worker.postMessage({ job: held.index, basis: held.basis });
        else resolve();
      };
      worker.on('message', (reply: WorkerReply) => {
        held = undefined;
        try {
          report(reply.job, outcomeOf(reply));
        } catch (error) {
          fail(error);
          return;
        }
        next();
      });
      worker.on('error', (error: NodeJS.ErrnoException) => {
        if (error.code !== 'ERR_WORKER_OUT_OF_MEMORY') fail(error);
        else {
          if (held) orphans.push(held);
          options.onNotice?.(`a calculation worker ran out of its ${limits.maxOldGenerationSizeMb ?? '(default)'} MB heap${held ? ` calculating ${held.basis.file}` : ''}; ${held ? 'that project and ' : ''}the projects left were calculated in the main thread instead (the same results, more slowly)`);
          held = undefined;
          resolve();
        }
      });
      worker.on('exit', (code) => {
        if (held) fail(new Error(`internal error: a calculation worker stopped (exit code ${code}) while calculating ${held.basis.file}`));
      });
      next();
    });
  const here = async () => {
    for (let job = take(); job && failure === undefined; job = take()) {
      report(job.index, calculateHere(job.basis));
      await new Promise((resolve) => setImmediate(resolve));
    }
  };
  const workers = Array.from({ length: count }, () => new Worker(entry, { resourceLimits: limits }));
  try {
    await Promise.all([...(options.alsoHere ?? true ? [here()] : []), ...workers.map(run)]);
  } finally {
    await Promise.all(workers.map((w) => w.terminate()));
  }
  for (let job = orphans.shift() ?? take(); job; job = orphans.shift() ?? take()) report(job.index, calculateHere(job.basis));
}

export async function calculateAll(jobs: CalculationJob[], options: BatchOptions = {}): Promise<CalculationOutcome[]> {
  return (await runBatch(jobs.map(deferred), options, true)) as CalculationOutcome[];
}

/** A job that did not give results: its diagnostics or message. */
export type CalculationFailure = Extract<CalculationOutcome, { ok: false }>;

/**
 * Every job's results put into the cache, none kept in memory: for a build of many projects,
 * whose pages read each project's results from the cache when they are rendered, so that the
 * results of all the projects are never held at once (a cached entry is not even read here).
 * Returns each job's failure, or null where its results are in the cache (or could not be
 * written there: the reader then calculates them again) or its basis did not load.
 */
export async function calculateIntoCache(jobs: (CalculationJob | DeferredJob)[], cache: ResultsCache, options: Omit<BatchOptions, 'cache'> = {}): Promise<(CalculationFailure | null)[]> {
  // Array.from, not map: the entries found in the cache were never set, and map skips such holes.
  return Array.from(await runBatch(jobs.map(deferred), { ...options, cache }, false), (o) => (o && !o.ok ? o : null));
}

function deferred(job: CalculationJob | DeferredJob): DeferredJob {
  if ('load' in job) return job;
  const { basis } = job;
  const key = resultsKey(job.text, basis.id, basis.file);
  return { id: basis.id, file: basis.file, key, load: () => ({ basis, key }) };
}

/** The jobs' outcomes; with `keep` false, results that went into the cache are not kept (undefined). */
async function runBatch(jobs: DeferredJob[], options: BatchOptions, keep: boolean): Promise<(CalculationOutcome | undefined)[]> {
  const outcomes: (CalculationOutcome | undefined)[] = new Array(jobs.length);
  // Each job's key as listed, replaced by the key of the bytes its basis was loaded from when it is taken.
  const keys = jobs.map((j) => j.key);
  let done = 0;
  let bound = heapBound(HEAP_SLACK_BYTES);
  const report = (index: number, outcome: CalculationOutcome | undefined) => {
    if (outcome?.ok && !outcome.cached && options.cache) options.cache.put(keys[index]!, outcome.results);
    outcomes[index] = keep || !outcome?.ok || !options.cache ? outcome : undefined;
    options.onProgress?.(++done, jobs.length);
    bound();
  };
  const pending: number[] = [];
  jobs.forEach((job, index) => {
    if (!keep && options.cache?.has(keys[index]!)) {
      options.onProgress?.(++done, jobs.length);
      return;
    }
    const hit = keep ? options.cache?.get(keys[index]!) : undefined;
    if (hit) report(index, { ok: true, results: hit, cached: true });
    else pending.push(index);
  });
  // The next job, its basis loaded when it is taken; one that does not load counts as done.
  let taken = 0;
  const take = (): Ready | undefined => {
    while (taken < pending.length) {
      const index = pending[taken++]!;
      const loaded = jobs[index]!.load();
      if (loaded) {
        keys[index] = loaded.key;
        return { index, basis: loaded.basis };
      }
      report(index, undefined);
    }
    return undefined;
  };
  // This thread takes a core; workers go on the others.
  const cores = Math.max(1, options.workers ?? availableParallelism());
  const alsoHere = options.alsoHere ?? true;
  const count = Math.min(alsoHere ? cores - 1 : cores, Math.floor(pending.length / (options.jobsPerWorker ?? PER_WORKER)));
  if (count >= 1) {
    bound = heapBound(SHARED_HEAP_SLACK_BYTES);
    await inThreads(take, count, options, report);
  } else {
    for (let job = take(); job; job = take()) report(job.index, calculateHere(job.basis));
  }
  return outcomes;
}
