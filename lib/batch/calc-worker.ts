/**
 * The loop of a calculation worker thread (lib/batch/batch.ts): receives validated bases,
 * answers with their results or with the located error the calculation raised.
 */
import { parentPort } from 'node:worker_threads';
import { calculate } from '../plant/calculate.ts';
import { BasisError } from '../basis/diagnostics.ts';
import { UserError } from '../core/errors.ts';
import type { DesignBasis } from '../basis/types.ts';
import type { WorkerReply } from './batch.ts';
import { heapBound } from './collect-garbage.ts';

/**
 * How far the worker's heap may grow past what was alive at its last full collection (heapBound,
 * checked after each reply). Left to V8, a worker's heap grew towards its old-space limit before
 * a full collection, and the worker's memory is the step a cold build's peak takes when it starts
 * one (lib/batch/batch.ts: WORKER_LIMITS and SHARED_HEAP_SLACK_BYTES give the measurements).
 */
const WORKER_HEAP_SLACK_BYTES = 16 * 1024 * 1024;
const bound = heapBound(WORKER_HEAP_SLACK_BYTES);

parentPort!.on('message', (message: { job: number; basis: DesignBasis }) => {
  let reply: WorkerReply;
  try {
    reply = { job: message.job, kind: 'results', results: calculate(message.basis) };
  } catch (error) {
    if (error instanceof BasisError) reply = { job: message.job, kind: 'basis-error', diagnostics: error.errors };
    else if (error instanceof UserError) reply = { job: message.job, kind: 'user-error', message: error.message };
    else reply = { job: message.job, kind: 'crash', message: error instanceof Error ? `${error.message}\n${error.stack ?? ''}` : String(error) };
  }
  parentPort!.postMessage(reply);
  bound();
});
