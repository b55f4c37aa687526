// The unit-string patterns of the schema (lib/basis/unit-pattern.ts) against parseQuantity
// (lib/core/units.ts): they must accept exactly the same strings, so the JSON Schema an editor
// checks a basis with agrees with the loader.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { parseQuantity, unitsOf, type Dimension } from '../../lib/core/units.ts';
import { quantityPattern } from '../../lib/basis/unit-pattern.ts';

/** Whether parseQuantity reads the text as the dimension. */
function parses(text: string, dimension: Dimension): boolean {
  try {
    parseQuantity(text, dimension);
    return true;
  } catch {
    return false;
  }
}

const DIMENSIONS: Dimension[] = ['temperature', 'temperature-difference', 'pressure', 'current-density', 'area-specific-resistance', 'area', 'power', 'voltage', 'current', 'mass-flow', 'fraction'];

/** Unit spellings: the table's, with the variants the normalisation maps onto them, and near misses. */
const spellings = [...new Set(DIMENSIONS.flatMap((d) => unitsOf(d)))].flatMap((u) => [
  u,
  u.replace(/2$/, '²'),
  u.replace(/2$/, '^2'),
  u.replace('ohm', 'Ω'),
  u.replace('ohm', 'Ohm'),
  u.replace(' ', '·'),
  u.replace(' ', ' * '),
  u.replace(/^([CFR])$/, '°$1'),
  u.replace(/^([CFR])$/, '° $1'),
  u.replace('(', ' ( '),
  u.toLowerCase(),
  u.toUpperCase(),
  `${u}s`,
]);

describe('unit-string patterns', () => {
  it('accept exactly what parseQuantity accepts, for every dimension', () => {
    const number = fc.constantFrom('800', '-1.5', '+2', '.5', '3.', '1e5', '2.5E-3', '1e', 'x', '', '1.2.3');
    const space = fc.constantFrom('', ' ', '  ', '\t');
    const unit = fc.oneof(fc.constantFrom(...spellings), fc.string({ maxLength: 4 }));
    fc.assert(
      fc.property(space, number, space, unit, space, fc.constantFrom(...DIMENSIONS), (a, n, b, u, c, dimension) => {
        const text = `${a}${n}${b}${u}${c}`;
        expect(quantityPattern(dimension).test(text), `${JSON.stringify(text)} as ${dimension}`).toBe(parses(text, dimension));
      }),
      { numRuns: 20000 },
    );
  });

  it('cover every unit of the table', () => {
    for (const dimension of DIMENSIONS) for (const u of unitsOf(dimension)) expect(quantityPattern(dimension).test(`1 ${u}`), `${u}`).toBe(true);
  });
});
