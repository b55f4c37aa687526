// Terminal tables (lib/core/plain-text.ts): a long cell wraps within its row instead of widening
// the whole table, and short cells keep their alignment. Checked against layouts written out by
// hand below, not against the code's own output.
import { describe, expect, it } from 'vitest';
import { textTable } from '../../lib/core/plain-text.ts';

describe('textTable', () => {
  it('pads short cells to the widest one, numbers to the right', () => {
    const text = textTable(['Quantity', 'Value'], ['left', 'right'], [{ cells: ['a', '1.5'] }, { cells: ['longer', '22.25'] }]);
    expect(text).toBe(['Quantity  Value', '--------  -----', 'a           1.5', 'longer    22.25', ''].join('\n'));
  });

  it('wraps a cell longer than 64 characters at spaces onto further lines, read from the left', () => {
    const note = '100.3 % (above 100 % because this fuel gains entropy when it is oxidised at the stack temperature)';
    const lines = textTable(['Quantity', 'Value'], ['left', 'right'], [{ cells: ['limit', note] }, { cells: ['cells', '6421'] }]).split('\n');
    // 64 characters at most in the value column: the header and rule are as wide as its longest line.
    const first = '100.3 % (above 100 % because this fuel gains entropy when it is';
    const second = 'oxidised at the stack temperature)';
    expect(first.length).toBeLessThanOrEqual(64);
    expect(lines).toEqual([
      `Quantity  ${' '.repeat(first.length - 5)}Value`,
      `--------  ${'-'.repeat(first.length)}`,
      `limit     ${first}`,
      `          ${second}`,
      `cells     ${' '.repeat(first.length - 4)}6421`,
      '',
    ]);
  });

  it('keeps a group row on a line of its own', () => {
    const text = textTable(['x', 'y'], ['left', 'left'], [{ group: 'Gas composition', cells: [] }, { cells: ['N₂', '79'] }]);
    expect(text.split('\n')).toEqual(['x   y', '--  --', 'Gas composition', 'N₂  79', '']);
  });
});
