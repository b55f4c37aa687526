/**
 * Typed access to the plain data of a basis for the checks that follow the schema. A value the
 * schema already found wrong reads as absent, so no problem is reported twice. Reading a scalar
 * input (a value with its unit, a fraction, a number) converts it to SI and records it for the
 * design-inputs table, with the source written beside it.
 */
import { parseQuantity, SI_UNIT, UnitError, type Dimension } from '../core/units.ts';
import { pathText, type Findings, type Path } from './diagnostics.ts';
import type { InputRecord } from './types.ts';
import { quoted } from '../core/quote.ts';

/** A scalar input as read: SI value, the text and unit as written, where it stands. */
export interface Read {
  si: number;
  text: string;
  unit: string;
  gauge: boolean;
  /** Path of the value itself (inside `{ value, source }` when written so). */
  at: Path;
}

/** An input record with the path of its value, to sort the records into file order. */
export interface PlacedInput {
  record: InputRecord;
  at: Path;
}

/** A source or reference written in the basis, to check against the reference ids. */
export interface SourceText {
  text: string;
  at: Path;
}

function startsWith(path: Path, prefix: Path): boolean {
  return prefix.length <= path.length && prefix.every((s, i) => String(s) === String(path[i]));
}

export class Reader {
  readonly inputs: PlacedInput[] = [];
  readonly sources: SourceText[] = [];

  constructor(
    private readonly data: unknown,
    private readonly flagged: readonly Path[],
    readonly findings: Findings,
  ) {}

  /**
   * The value at the path as written, whether or not the schema accepted it. Only keys written
   * in the file count: a name such as `constructor` or `toString` is not found on every mapping.
   */
  raw(path: Path): unknown {
    let current: unknown = this.data;
    for (const segment of path) {
      if (current === null || typeof current !== 'object' || !Object.hasOwn(current, String(segment))) return undefined;
      current = (current as Record<string, unknown>)[String(segment)];
    }
    return current;
  }

  /** Whether the key is written (even with a wrong value). */
  has(path: Path): boolean {
    return this.raw(path) !== undefined;
  }

  /** Whether the schema found a problem at, inside or above the path. */
  flaggedAt(path: Path): boolean {
    return this.flagged.some((f) => startsWith(f, path) || startsWith(path, f));
  }

  /** The value, if written and accepted by the schema. */
  get(path: Path): unknown {
    return this.flaggedAt(path) ? undefined : this.raw(path);
  }

  text(path: Path): string | undefined {
    const value = this.get(path);
    return typeof value === 'string' ? value : undefined;
  }

  flag(path: Path): boolean | undefined {
    const value = this.get(path);
    return typeof value === 'boolean' ? value : undefined;
  }

  /** The keys of a mapping, each with whether its value was accepted by the schema. */
  keys(path: Path): { key: string; usable: boolean }[] {
    const value = this.raw(path);
    if (value === null || typeof value !== 'object' || Array.isArray(value)) return [];
    return Object.keys(value).map((key) => ({ key, usable: !this.flaggedAt([...path, key]) }));
  }

  /** The length of a list (0 when absent or not a list). */
  length(path: Path): number {
    const value = this.get(path);
    return Array.isArray(value) ? value.length : 0;
  }

  /** A source or reference text, remembered for the reference-id check. */
  source(path: Path): string | undefined {
    const text = this.text(path);
    if (text !== undefined) this.sources.push({ text, at: path });
    return text;
  }

  /**
   * A scalar input of the dimension, recorded in the inputs table; undefined when absent or
   * wrong. `givenSource` is the source of the enclosing item (a mixture's), used unless the value
   * is written `{ value, source }`.
   */
  scalar(path: Path, dimension: Dimension, label: string, givenSource?: string): Read | undefined {
    const written = this.get(path);
    if (written === undefined) return undefined;
    const sourced = typeof written === 'object' && written !== null;
    const at = sourced ? [...path, 'value'] : path;
    const value = sourced ? (written as { value: string | number }).value : (written as string | number);
    const source = sourced ? this.source([...path, 'source']) : givenSource;
    let quantity;
    try {
      quantity = parseQuantity(value, dimension);
    } catch (error) {
      if (!(error instanceof UnitError)) throw error;
      this.findings.error(at, error.message);
      return undefined;
    }
    if (!Number.isFinite(quantity.si)) {
      this.findings.error(at, `${quoted(String(value))} is not a finite number`);
      return undefined;
    }
    const text = String(value);
    this.inputs.push({
      at,
      record: { path: pathText(path), label, text, unit: quantity.unit, si: quantity.si, siUnit: SI_UNIT[dimension], ...(source !== undefined ? { source } : {}) },
    });
    return { si: quantity.si, text, unit: quantity.unit, gauge: quantity.gauge, at };
  }

  /** A plain number (ratio, count), recorded in the inputs table. */
  number(path: Path, label: string): Read | undefined {
    return this.scalar(path, 'fraction', label);
  }
}

/** The object when none of its values is undefined (every required input was read), else undefined. */
export function allDefined<T extends Record<string, unknown>>(values: T): { [K in keyof T]: Exclude<T[K], undefined> } | undefined {
  return Object.values(values).every((v) => v !== undefined) ? (values as { [K in keyof T]: Exclude<T[K], undefined> }) : undefined;
}
