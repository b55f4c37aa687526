/**
 * Quantities with units, parsed strictly at the edge of the program: `"800 C"`, `"1.2 bar"`,
 * `"0.5 A/cm2"`, `"250 kW"`. Every unit and its conversion to SI lives in data/units.yaml
 * (factors from NIST SP 811). A unit of another dimension is an error naming the dimension
 * expected and the units it accepts.
 */
import { z } from 'zod';
import { readDataFile } from './data-file.ts';
import { quoted } from './quote.ts';

export const DIMENSIONS = [
  'temperature',
  'temperature-difference',
  'pressure',
  'current-density',
  'area-specific-resistance',
  'area',
  'power',
  'voltage',
  'current',
  'mass-flow',
  'molar-energy',
  'time',
  'degradation-rate',
  'fraction',
] as const;

export type Dimension = (typeof DIMENSIONS)[number];

/** A unit: value_SI = value × factor + offset; `gauge` for pressures referred to one standard atmosphere. */
const UnitDef = z.strictObject({ factor: z.number().positive(), offset: z.number().optional(), gauge: z.boolean().optional() });

type UnitDef = z.infer<typeof UnitDef>;

const TABLE = readDataFile(new URL('./data/units.yaml', import.meta.url), z.record(z.enum(DIMENSIONS), z.record(z.string(), UnitDef)));

/** 0 °C in kelvin, 273.15 (definition of the Celsius scale): the offset of the unit C in data/units.yaml. */
export const ZERO_CELSIUS_K: number = TABLE.temperature.C!.offset!;

/** SI unit of each dimension, as written in results and reports. */
export const SI_UNIT: Record<Dimension, string> = {
  temperature: 'K',
  'temperature-difference': 'K',
  pressure: 'Pa',
  'current-density': 'A/m2',
  'area-specific-resistance': 'ohm m2',
  area: 'm2',
  power: 'W',
  voltage: 'V',
  current: 'A',
  'mass-flow': 'kg/s',
  'molar-energy': 'J/mol',
  time: 's',
  'degradation-rate': '1/s',
  fraction: '1',
};

/** What a value of each dimension looks like, for messages. */
const EXAMPLE: Record<Dimension, string> = {
  temperature: '"800 C" or "1073.15 K"',
  'temperature-difference': '"100 K"',
  pressure: '"1.2 bar", "120 kPa" or "0.2 barg"',
  'current-density': '"0.5 A/cm2" or "500 mA/cm2"',
  'area-specific-resistance': '"0.25 ohm cm2"',
  area: '"100 cm2"',
  power: '"250 kW"',
  voltage: '"0.80 V" or "800 mV"',
  current: '"40 A"',
  'mass-flow': '"10 kg/h"',
  'molar-energy': '"80 kJ/mol" or "0.8 eV"',
  time: '"40000 h" or "40 kh"',
  'degradation-rate': '"0.5 %/kh" (per cent per 1000 h)',
  fraction: '0.85 or "85 %"',
};

const ARTICLE: Record<Dimension, string> = {
  temperature: 'a temperature',
  'temperature-difference': 'a temperature difference',
  pressure: 'a pressure',
  'current-density': 'a current density',
  'area-specific-resistance': 'an area-specific resistance',
  area: 'an area',
  power: 'a power',
  voltage: 'a voltage',
  current: 'a current',
  'mass-flow': 'a mass flow',
  'molar-energy': 'an activation energy',
  time: 'an operating time',
  'degradation-rate': 'a degradation rate',
  fraction: 'a fraction',
};

export interface Quantity {
  /** Value in the SI unit of its dimension (K, Pa, A/m2, ohm m2, m2, W, V, A, kg/s, J/mol, s, 1/s, 1). */
  si: number;
  /** The number as written. */
  value: number;
  /** The unit as written (normalised spelling). */
  unit: string;
  dimension: Dimension;
  gauge: boolean;
  /** The text as written. */
  text: string;
}

/** What a value of the dimension looks like, as messages say it: 'a temperature such as "800 C" or "1073.15 K"'. */
export function expectedText(dimension: Dimension): string {
  return `${ARTICLE[dimension]} such as ${EXAMPLE[dimension]}`;
}

export class UnitError extends Error {
  constructor(readonly expected: string, readonly got: string) {
    super(`expected ${expected}, got ${got}`);
    this.name = 'UnitError';
  }
}

function normaliseUnit(unit: string): string {
  return unit
    .trim()
    .replace(/\^2|²/g, '2')
    .replace(/Ω/g, 'ohm')
    .replace(/Ohm/g, 'ohm')
    .replace(/\s*[·*]\s*/g, ' ')
    .replace(/°\s*([CFR])/g, '$1')
    .replace(/\s*\(\s*(a|g)\s*\)/g, '($1)')
    .replace(/\s+/g, ' ');
}

/** Which dimension a unit spelling belongs to, if any (to say "a pressure where a temperature belongs"). */
function dimensionOfUnit(unit: string): Dimension | undefined {
  for (const [dimension, units] of Object.entries(TABLE) as [Dimension, Record<string, UnitDef>][]) {
    if (unit !== '' && unit in units) return dimension;
  }
  return undefined;
}

export function unitsOf(dimension: Dimension): string[] {
  return Object.keys(TABLE[dimension]).filter((u) => u !== '');
}

const NUMBER = /^\s*([-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?)\s*(.*?)\s*$/;

/**
 * Parses `text` as a quantity of `dimension`. Plain numbers are accepted only for fractions.
 * Throws UnitError with what was expected and what was found.
 */
export function parseQuantity(input: string | number, dimension: Dimension): Quantity {
  const expected = expectedText(dimension);
  if (typeof input === 'number') {
    if (dimension === 'fraction' && Number.isFinite(input)) {
      return { si: input, value: input, unit: '', dimension, gauge: false, text: String(input) };
    }
    throw new UnitError(expected, `the bare number ${input} (write the unit)`);
  }
  const match = NUMBER.exec(input);
  if (!match) throw new UnitError(expected, quoted(input));
  const value = Number(match[1]);
  const unit = normaliseUnit(match[2]!);
  const def = TABLE[dimension][unit];
  if (!def) {
    const other = dimensionOfUnit(unit);
    if (unit === '') throw new UnitError(expected, `${quoted(input)} with no unit`);
    if (other) throw new UnitError(expected, `${quoted(input)}, which is ${ARTICLE[other]}`);
    throw new UnitError(`${expected} (units: ${unitsOf(dimension).join(', ')})`, `${quoted(input)} with unknown unit ${quoted(unit)}`);
  }
  return {
    si: value * def.factor + (def.offset ?? 0),
    value,
    unit,
    dimension,
    gauge: def.gauge === true,
    text: input,
  };
}

/** Converts an SI value to a named unit of the dimension (for display at the edge). */
export function fromSI(si: number, dimension: Dimension, unit: string): number {
  const def = TABLE[dimension][normaliseUnit(unit)];
  if (!def) throw new Error(`unit ${unit} is not a unit of ${dimension}`);
  return (si - (def.offset ?? 0)) / def.factor;
}
