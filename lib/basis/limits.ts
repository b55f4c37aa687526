/**
 * The input limits of data/limits.yaml: for each input, the lowest and highest value a basis may
 * give, in SI, with the limit as written there for messages. Inputs without limits there have
 * only the checks of their read-*.ts module.
 */
import { z } from 'zod';
import { readDataFile } from '../core/data-file.ts';
import { parseQuantity, type Dimension } from '../core/units.ts';

const LIMITED_INPUTS = ['pressure', 'current-density', 'active-area', 'cell-voltage', 'target-power', 'target-hydrogen', 'utilization', 'allowed-air-temperature-rise', 'activation-energy', 'degradation-rate', 'operating-time'] as const;

export type LimitedInput = (typeof LIMITED_INPUTS)[number];

export interface Limit {
  fromSI?: number;
  toSI?: number;
  /** The limits as written in data/limits.yaml, for messages. */
  from?: string;
  to?: string;
}

const DIMENSIONS: Record<LimitedInput, Dimension> = {
  pressure: 'pressure',
  'current-density': 'current-density',
  'active-area': 'area',
  'cell-voltage': 'voltage',
  'target-power': 'power',
  'target-hydrogen': 'mass-flow',
  utilization: 'fraction',
  'allowed-air-temperature-rise': 'temperature-difference',
  'activation-energy': 'molar-energy',
  'degradation-rate': 'degradation-rate',
  'operating-time': 'time',
};

let cache: Map<LimitedInput, Limit> | undefined;

function limits(): Map<LimitedInput, Limit> {
  if (cache) return cache;
  const bound = z.union([z.string(), z.number()]).optional();
  const raw = readDataFile(new URL('./data/limits.yaml', import.meta.url), z.record(z.enum(LIMITED_INPUTS), z.strictObject({ from: bound, to: bound })));
  cache = new Map();
  for (const [input, { from, to }] of Object.entries(raw) as [LimitedInput, { from?: string | number; to?: string | number }][]) {
    const si = (v: string | number | undefined) => (v === undefined ? undefined : parseQuantity(v, DIMENSIONS[input]).si);
    cache.set(input, {
      ...(from !== undefined ? { fromSI: si(from), from: String(from) } : {}),
      ...(to !== undefined ? { toSI: si(to), to: String(to) } : {}),
    });
  }
  return cache;
}

/** The limit of an input. */
export function limit(input: LimitedInput): Limit {
  const found = limits().get(input);
  if (!found) throw new Error(`data/limits.yaml has no limit for ${input}`);
  return found;
}

/**
 * Undefined when the SI value lies within the input's limits, else the message:
 * `the cell voltage 1e30 V is above 10 V, beyond any fuel-cell or electrolyser plant`.
 */
export function limitProblem(input: LimitedInput, label: string, read: { si: number; text: string }): string | undefined {
  const { fromSI, toSI, from, to } = limit(input);
  const beyond = 'beyond any fuel-cell or electrolyser plant';
  if (fromSI !== undefined && read.si < fromSI) return `the ${label} ${read.text} is below ${from}, ${beyond}`;
  if (toSI !== undefined && read.si > toSI) return `the ${label} ${read.text} is above ${to}, ${beyond}`;
  return undefined;
}
