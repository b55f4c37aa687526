/**
 * Building blocks of the design-basis schema (schema.ts): text, values with units, fractions,
 * numbers, compositions, dates and choices, each with the message a user sees when it does not
 * fit. Every scalar input may also be written `{ value: ..., source: R1 }` to say where it
 * comes from. These check the shape only; physics (ranges, consistency) is checked afterwards
 * in the read-*.ts modules.
 */
import { z } from 'zod';
import { expectedText, parseQuantity, UnitError, type Dimension } from '../core/units.ts';
import { quantityPattern } from './unit-pattern.ts';
import { didYouMean, quotedList } from '../core/suggest.ts';
import { quoted } from '../core/quote.ts';

/** How a YAML value reads in a message: `"hot"`, `the number 5`, `a list`, `nothing`. */
export function describeValue(value: unknown): string {
  if (value === null || value === undefined) return 'nothing (the key has no value)';
  if (typeof value === 'string') return quoted(value);
  if (typeof value === 'number') return Number.isFinite(value) ? `the number ${value}` : `the YAML value ${Number.isNaN(value) ? '.nan' : value > 0 ? '.inf' : '-.inf'}`;
  if (typeof value === 'boolean') return `${value}`;
  if (Array.isArray(value)) return 'a list';
  return 'a mapping';
}

/** The message for a string that is not a quantity of the dimension (parseQuantity's own words). */
function quantityMessage(input: unknown, dimension: Dimension): string {
  if (typeof input === 'string' || (typeof input === 'number' && Number.isFinite(input))) {
    try {
      parseQuantity(input, dimension);
    } catch (error) {
      if (error instanceof UnitError) return error.message;
      throw error;
    }
  }
  return `expected ${expectedText(dimension)}, got ${describeValue(input)}`;
}

/** The message for a key the schema does not know: did-you-mean, else the keys it accepts. */
function unknownKeyMessage(key: string, known: readonly string[]): string {
  const near = didYouMean(key, known);
  return near ? `unknown key${near}` : `unknown key; expected ${quotedList(known)}`;
}

/**
 * A mapping with a fixed set of keys. Unknown keys get one message each, joined by newlines in
 * zod's single issue; zod-findings.ts splits them back, one finding per key. `retired` names keys
 * that earlier bases had and this one no longer reads, each with what to do instead.
 */
export function strict<T extends z.core.$ZodLooseShape>(shape: T, description?: string, retired: Readonly<Record<string, string>> = {}) {
  const known = Object.keys(shape);
  const message = (key: string) => (Object.hasOwn(retired, key) ? retired[key]! : unknownKeyMessage(key, known));
  const object = z.strictObject(shape, {
    error: (issue) => (issue.code === 'unrecognized_keys' ? issue.keys.map(message).join('\n') : undefined),
  });
  return description ? object.meta({ description }) : object;
}

/** true or false. */
export function flag(description: string) {
  return z.boolean({ error: (issue) => `expected true or false, got ${describeValue(issue.input)}` }).meta({ description });
}

const SOURCE_DESCRIPTION = 'where the value comes from: a reference id of `references` (e.g. R1), an assumption id, or a short justification';

/** `{ value: ..., source: ... }`: the value with where it comes from. */
function sourced(value: z.ZodType) {
  return strict({
    value,
    source: z.string().meta({ description: SOURCE_DESCRIPTION }),
  });
}

const unitTexts = new Map<Dimension, z.ZodString>();

/**
 * The text of a quantity of the dimension, one schema per dimension so the JSON Schema defines
 * its pattern once (under definitions, named by the dimension) and refers to it.
 */
function unitText(dimension: Dimension): z.ZodString {
  let schema = unitTexts.get(dimension);
  if (!schema) {
    schema = z
      .string()
      .regex(quantityPattern(dimension), { error: (issue) => quantityMessage(issue.input, dimension) })
      .meta({ id: `${dimension}-text`, description: expectedText(dimension) });
    unitTexts.set(dimension, schema);
  }
  return schema;
}

/** A value with its unit, as text: "800 C", "1.2 bar", or { value: "800 C", source: R1 }. */
export function quantity(dimension: Dimension, description: string) {
  const text = unitText(dimension);
  return z.union([text, sourced(text)], { error: (issue) => quantityMessage(issue.input, dimension) }).meta({ description });
}

const FRACTION_TEXT = unitText('fraction');

/** A fraction: 0.8 or "80 %" (or the sourced form). */
export function fraction(description: string) {
  return z
    .union([z.number(), FRACTION_TEXT, sourced(z.union([z.number(), FRACTION_TEXT]))], { error: (issue) => quantityMessage(issue.input, 'fraction') })
    .meta({ description });
}

/** A plain number (a ratio or a count), or the sourced form. */
export function number(description: string, example: string) {
  const message = (issue: { input?: unknown }) => `expected a number such as ${example}, got ${describeValue(issue.input)}`;
  return z.union([z.number({ error: message }), sourced(z.number({ error: message }))], { error: message }).meta({ description });
}

/** Text that is not blank. */
export function text(description: string) {
  return z.string().regex(/\S/, { error: 'must not be empty' }).meta({ description });
}

/** A real calendar date, YYYY-MM-DD. */
export function isoDate(description: string) {
  return z.iso.date({ error: (issue) => `expected a real date written YYYY-MM-DD, such as 2026-11-20, got ${describeValue(issue.input)}` }).meta({ description });
}

/** One of a fixed set of words, with did-you-mean. */
export function choice<const T extends readonly [string, ...string[]]>(values: T, description: string) {
  return z
    .enum(values, {
      error: (issue) => {
        const got = issue.input;
        const near = typeof got === 'string' ? didYouMean(got, values) : '';
        return `expected ${quotedList(values)}, got ${describeValue(got)}${near}`;
      },
    })
    .meta({ description });
}

/** A mole fraction inside a composition: 0.93 or "93 %". */
const MOLE_FRACTION = z.union([z.number(), FRACTION_TEXT], { error: (issue) => `expected a mole fraction such as 0.93 or "93 %", got ${describeValue(issue.input)}` });

/** Species name → mole fraction. */
export function speciesFractions(description: string) {
  return z.record(z.string(), MOLE_FRACTION, { error: (issue) => `expected a mapping of species to mole fractions, such as { H2: 0.97, H2O: 0.03 }, got ${describeValue(issue.input)}` }).meta({ description });
}

/** A composition: a mixture or preset name, or an inline mapping of species to mole fractions. */
export function composition(description: string) {
  return z
    .union([z.string().regex(/\S/, { error: 'must not be empty' }), speciesFractions('species and mole fractions')], {
      error: (issue) => `expected a mixture or preset name (such as humid-air) or a mapping of species to mole fractions (such as { H2: 0.97, H2O: 0.03 }), got ${describeValue(issue.input)}`,
    })
    .meta({ description });
}
