/**
 * Regular expressions that accept exactly the quantity strings `parseQuantity` (units.ts)
 * accepts for a dimension, built from the same unit table (lib/core/data/units.yaml). The zod schema
 * checks unit strings with them and the JSON Schema carries them as `pattern`, so an editor
 * flags "800 degrees" as you type. Each unit spelling is widened by the same normalisation
 * parseQuantity applies: "²" or "^2" for "2", "Ω" or "Ohm" for "ohm", "·", "*" or spaces between
 * unit factors, "°" before C, F and R, and spaces inside "(a)" and "(g)".
 */
import { unitsOf, type Dimension } from '../core/units.ts';

/** The number parseQuantity reads (units.ts NUMBER), without its capture group. */
const NUMBER_SOURCE = String.raw`[-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?`;

/** Escapes the characters that are syntax in a regular expression (valid with the `u` flag too). */
function escapeSyntax(char: string): string {
  return /[\^$\\.*+?()[\]{}|/]/.test(char) ? `\\${char}` : char;
}

/** The pattern of one unit spelling of the table, with every variant normaliseUnit maps onto it. */
function unitSource(unit: string): string {
  let out = '';
  for (let i = 0; i < unit.length; ) {
    const rest = unit.slice(i);
    const qualifier = /^\((a|g)\)/.exec(rest);
    if (rest.startsWith('ohm')) {
      out += '(?:ohm|Ohm|Ω)';
      i += 3;
    } else if (qualifier) {
      out += String.raw`\s*\(\s*${qualifier[1]}\s*\)`;
      i += 3;
    } else {
      const char = unit[i]!;
      if (char === ' ') out += String.raw`[\s·*]+`;
      else if (char === '2') out += '(?:2|\\^2|²)';
      else if (char === 'C' || char === 'F' || char === 'R') out += String.raw`(?:°\s*)?${char}`;
      else out += escapeSyntax(char);
      i += 1;
    }
  }
  return out;
}

const cache = new Map<Dimension, RegExp>();

/**
 * The pattern of a quantity string of the dimension: a number, optional spaces, one of the
 * dimension's units (for fractions also none), optional spaces.
 */
export function quantityPattern(dimension: Dimension): RegExp {
  const cached = cache.get(dimension);
  if (cached) return cached;
  const units = unitsOf(dimension).sort((a, b) => b.length - a.length).map(unitSource);
  const unitPart = dimension === 'fraction' ? `(?:${units.join('|')})?` : `(?:${units.join('|')})`;
  const pattern = new RegExp(String.raw`^\s*${NUMBER_SOURCE}\s*${unitPart}\s*$`);
  cache.set(dimension, pattern);
  return pattern;
}
