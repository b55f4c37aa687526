// Parsing chemical equations and checking their element balance.
import { describe, expect, it } from 'vitest';
import { parseEquation } from '../../lib/electrochem/equation.ts';

describe('chemical equations', () => {
  it('reads integer, decimal and fractional coefficients and several arrow forms', () => {
    const a = parseEquation('CH4 + 2 O2 -> CO2 + 2 H2O');
    expect(a.terms.map((t) => [t.species.label, t.nu])).toEqual([['CH4', -1], ['O2', -2], ['CO2', 1], ['H2O', 2]]);
    expect(parseEquation('H2 + 1/2 O2 → H2O').terms[1]!.nu).toBe(-0.5);
    expect(parseEquation('H2 + 0.5 O2 = H2O').terms[1]!.nu).toBe(-0.5);
    expect(parseEquation('2CO <=> C(gr) + CO2').terms[0]!.nu).toBe(-2);
    expect(parseEquation('H2 + 1/2 O2 -> H2O').text).toBe('H2 + 0.5 O2 -> H2O');
  });

  it('nets out a species that appears on both sides', () => {
    const e = parseEquation('CH4 + 3 H2O -> CO2 + 4 H2 + H2O');
    expect(e.terms.find((t) => t.species.label === 'H2O')!.nu).toBe(-2);
  });

  it('names the element and the imbalance of an unbalanced equation', () => {
    expect(() => parseEquation('CH4 + O2 -> CO2 + 2 H2O')).toThrow(/not balanced: O has 2 atoms on the left and 4 on the right \(imbalance \+2\)/);
    expect(() => parseEquation('C2H6 + 3 O2 -> 2 CO2 + 3 H2O')).toThrow(/O has 6 atoms on the left and 7 on the right/);
  });

  it('rejects malformed equations with a clear message', () => {
    expect(() => parseEquation('H2 + O2')).toThrow(/expected one arrow/);
    expect(() => parseEquation(' -> H2O')).toThrow(/empty/);
    expect(() => parseEquation('0 H2 -> H2')).toThrow(/not a positive number/);
    expect(() => parseEquation('H2 + 1/2 Oxygen -> H2O')).toThrow(/unknown species "Oxygen"/);
  });
});
