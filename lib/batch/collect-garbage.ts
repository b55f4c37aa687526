/**
 * A full garbage collection of this thread's heap, on demand. V8 sets the heap it lets grow
 * before its next full collection from the live size at its last one, so a thread whose live
 * size rises for a while (an Eleventy run's pages and views, a batch of calculations) is left
 * with a heap several times what stays alive; collecting when the work of a step is done keeps
 * the heap near what is alive. The `gc` function is Node's own (--expose-gc), reached at run
 * time through V8's flags.
 */
import { getHeapStatistics, setFlagsFromString } from 'node:v8';
import { runInNewContext } from 'node:vm';

export const collectGarbage: () => void = (() => {
  setFlagsFromString('--expose-gc');
  return runInNewContext('gc') as () => void;
})();

/**
 * A check to call between steps: it collects the garbage whenever the heap in use has grown by
 * `slackBytes` since the last collection it made (reading the heap's size costs a few
 * microseconds; a full collection, tens of milliseconds), so the heap stays within that slack
 * of what is alive whatever V8 would have let it grow to.
 */
export function heapBound(slackBytes: number): () => void {
  let floor = getHeapStatistics().used_heap_size;
  return () => {
    if (getHeapStatistics().used_heap_size - floor < slackBytes) return;
    collectGarbage();
    floor = getHeapStatistics().used_heap_size;
  };
}
