// Revision names and their order, after ASME Y14.35 drawing-revision practice (letters before
// approval, skipping I, O, Q, S, X and Z; numbers after).
import { describe, expect, it } from 'vitest';
import { checkFollows, compareRevisions, isRevision, successors } from '../../lib/basis/revisions.ts';

describe('revision sequence', () => {
  it('starts at A or 0, follows letters with the next letter or 0, numbers with the next number', () => {
    expect(successors(null)).toEqual(['A', '0']);
    expect(successors('A')).toEqual(['B', '0']);
    expect(successors('H')).toEqual(['J', '0']); // I skipped
    expect(successors('N')).toEqual(['P', '0']); // O skipped
    expect(successors('R')).toEqual(['T', '0']); // S skipped
    expect(successors('Y')).toEqual(['AA', '0']); // Z skipped, then double letters
    expect(successors('3')).toEqual(['4']);
  });

  it('refuses names that are not revisions, path tricks included', () => {
    for (const bad of ['I', 'O', 'a', '../A', '/A', 'A/B', '01', '', 'AAA', 'A ']) expect(isRevision(bad), bad).toBe(false);
    expect(() => checkFollows(null, 'B')).toThrow(/does not follow the start .* the next revision is A or 0/);
    expect(() => checkFollows('A', 'C')).toThrow(/does not follow the last issued revision A: the next revision is B or 0/);
    expect(() => checkFollows('1', 'B')).toThrow(/next revision is 2/);
    expect(() => checkFollows('A', '../x')).toThrow(/not a revision name/);
    expect(() => checkFollows('A', 'B')).not.toThrow();
  });

  it('orders letters before numbers', () => {
    expect(['2', 'B', '0', 'AA', 'A'].sort(compareRevisions)).toEqual(['A', 'B', 'AA', '0', '2']);
  });
});
