// Progress of long steps: a bar rewritten in place on a terminal, a line at each tenth otherwise,
// nothing for a few items or with --quiet.
import { describe, expect, it } from 'vitest';
import { progressReporter } from '../../lib/cli/progress.ts';
import type { Io } from '../../lib/cli/command.ts';

function io(isTTY: boolean): Io & { text: () => string } {
  let err = '';
  return { out: () => undefined, err: (t) => (err += t), isTTY, cwd: '.', text: () => err };
}

describe('progress', () => {
  it('on a terminal: one bar rewritten with \\r, done/total, elapsed and time left, a newline at the end', () => {
    const t = io(true);
    let clock = 0;
    const report = progressReporter(t, false, () => clock);
    for (let done = 1; done <= 10; done++) {
      clock = done * 1000;
      report('calculate', done, 10);
    }
    const text = t.text();
    expect(text.split('\r').filter(Boolean)).toHaveLength(10);
    expect(text).toContain('calculate [#########################'.slice(0, 20));
    expect(text).toMatch(/5\/10 {2}4\.0 s, about 4 s left/);
    expect(text.endsWith('\n')).toBe(true);
  });

  it('not a terminal: plain lines at most once per tenth', () => {
    const t = io(false);
    const report = progressReporter(t, false, () => 0);
    for (let done = 1; done <= 100; done++) report('print', done, 100);
    const lines = t.text().trim().split('\n');
    expect(lines.length).toBe(11);
    expect(lines.at(-1)).toBe('print: 100/100 (0.0 s)');
  });

  it('quiet, or fewer than six items: nothing', () => {
    const quiet = io(true);
    progressReporter(quiet, true)('calculate', 1, 100);
    const few = io(false);
    for (let d = 1; d <= 5; d++) progressReporter(few, false)('calculate', d, 5);
    expect(quiet.text() + few.text()).toBe('');
  });
});
