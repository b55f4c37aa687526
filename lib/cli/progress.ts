/**
 * Progress of long steps for the terminal: a bar rewritten in place on a terminal
 * ("calculate [#########.........] 120/500  3.2 s, about 9 s left"), plain lines at each tenth
 * when stderr is not a terminal (logs, CI), nothing with --quiet or for a few items.
 */
import type { Io } from './command.ts';

/** Steps of fewer items than this report nothing: they end before a bar would help. */
const FEW = 6;

export function progressReporter(io: Io, quiet: boolean, now: () => number = () => performance.now()): (step: string, done: number, total: number) => void {
  const started = new Map<string, number>();
  const lastTenth = new Map<string, number>();
  return (step, done, total) => {
    if (quiet || total < FEW) return;
    if (!started.has(step)) started.set(step, now());
    const elapsed = (now() - started.get(step)!) / 1000;
    const left = done > 0 ? (elapsed / done) * (total - done) : 0;
    const timing = `${elapsed.toFixed(1)} s${done < total ? `, about ${Math.ceil(left)} s left` : ''}`;
    if (io.isTTY) {
      const width = 24;
      const filled = Math.round((done / total) * width);
      io.err(`\r${step.padEnd(9)} [${'#'.repeat(filled)}${'.'.repeat(width - filled)}] ${done}/${total}  ${timing}   ${done === total ? '\n' : ''}`);
      return;
    }
    const tenth = Math.floor((done / total) * 10);
    if (tenth === lastTenth.get(step) && done !== total) return;
    lastTenth.set(step, tenth);
    io.err(`${step}: ${done}/${total} (${timing})\n`);
  };
}
