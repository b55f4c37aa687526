/**
 * The input limits of data/limits.yaml: for each input, the lowest and highest value a basis may
 * give, in SI, with the limit as written there for messages; and FIELDS, which names for every
 * number of the basis schema the limit that bounds it, or the rule of physics that does (a test
 * walks the schema and fails for a number that has neither).
 */
import { z } from 'zod';
import { readDataFile } from '../core/data-file.ts';
import { parseQuantity, type Dimension } from '../core/units.ts';
import type { Findings } from './diagnostics.ts';
import type { Read } from './reader.ts';

const DIMENSIONS = {
  pressure: 'pressure',
  'current-density': 'current-density',
  'active-area': 'area',
  'cell-voltage': 'voltage',
  'area-specific-resistance': 'area-specific-resistance',
  'target-power': 'power',
  'target-hydrogen': 'mass-flow',
  cells: 'fraction',
  utilization: 'fraction',
  'air-ratio': 'fraction',
  'sweep-ratio': 'fraction',
  'steam-added': 'fraction',
  'parasitic-load': 'fraction',
  'power-conversion-efficiency': 'fraction',
  'electrical-count': 'fraction',
  'bus-voltage': 'voltage',
  'feed-temperature': 'temperature',
  'feed-water-temperature': 'temperature',
  'recycle-ratio': 'fraction',
  'recycle-tolerance': 'fraction',
  'oxidiser-air-ratio': 'fraction',
  'oxidiser-material-limit': 'temperature',
  'exhaust-exit-temperature': 'temperature',
  'minimum-approach': 'temperature-difference',
  'isentropic-efficiency': 'fraction',
  'heat-loss': 'fraction',
  'compression-stages': 'fraction',
  'compression-stage-ratio': 'fraction',
  'compressor-gas-temperature': 'temperature',
  'compressor-discharge-temperature': 'temperature',
  'ionic-transference-number': 'fraction',
  'crossover-allowance': 'voltage',
  'allowed-air-temperature-rise': 'temperature-difference',
  'ambient-temperature': 'temperature',
  'ambient-pressure': 'pressure',
  'sensitivity-temperature': 'temperature-difference',
  'sensitivity-pressure': 'fraction',
  'sensitivity-utilization': 'fraction',
  'sensitivity-steam-to-carbon': 'fraction',
  'sensitivity-current-density': 'fraction',
  'activation-energy': 'molar-energy',
  'resistance-reference-temperature': 'temperature',
  'tafel-slope': 'voltage',
  'exchange-current-density': 'current-density',
  'degradation-rate': 'degradation-rate',
  'operating-time': 'time',
} as const satisfies Record<string, Dimension>;

export type LimitedInput = keyof typeof DIMENSIONS;

const LIMITED_INPUTS = Object.keys(DIMENSIONS) as [LimitedInput, ...LimitedInput[]];

/**
 * The rules of physics that bound a number without a limit of data/limits.yaml: every
 * temperature lies within the data of the species it concerns (lib/basis/temperature-ranges.ts,
 * the NASA Glenn ranges, 200 K to 6000 K and more for gases, 273.15 K to 600 K for liquid
 * water), a mole fraction and a relative humidity within [0, 1], the air utilization is the
 * inverse of the air ratio, the KOH mass fraction of an alkaline cell within the range of the
 * water-activity correlation (lib/thermo/koh-solution.ts, Balej 1985).
 */
export type PhysicsRule = 'species-data' | 'liquid-water-data' | 'unit-interval' | 'inverse-of-air-ratio' | 'koh-correlation';

/** The numbers of the basis outside its cases and what bounds each; FIELDS adds the cases'. */
const BASE_FIELDS: Readonly<Record<string, LimitedInput | PhysicsRule>> = {
  'cell.ionic-transference-number': 'ionic-transference-number',
  'cell.crossover-allowance': 'crossover-allowance',
  'cell.koh-mass-fraction': 'koh-correlation',
  'conditions.operating-temperature': 'species-data',
  'conditions.temperature-sweep.from': 'species-data',
  'conditions.temperature-sweep.to': 'species-data',
  'conditions.fuel-inlet-temperature': 'species-data',
  'conditions.air-inlet-temperature': 'species-data',
  'conditions.allowed-air-temperature-rise': 'allowed-air-temperature-rise',
  'conditions.fuel-electrode-pressure': 'pressure',
  'conditions.air-electrode-pressure': 'pressure',
  'conditions.ambient-temperature': 'ambient-temperature',
  'conditions.ambient-pressure': 'ambient-pressure',
  'mixtures.*.composition.*': 'unit-interval',
  'streams.fuel-electrode.composition.*': 'unit-interval',
  'streams.fuel-electrode.steam-to-carbon': 'steam-added',
  'streams.fuel-electrode.steam-per-mole-fuel': 'steam-added',
  'streams.fuel-electrode.pre-reforming.temperature': 'species-data',
  'streams.fuel-electrode.pre-reforming.inlet-temperature': 'species-data',
  'streams.air-electrode.composition.*': 'unit-interval',
  'streams.air-electrode.humidity.dew-point': 'liquid-water-data',
  'streams.air-electrode.humidity.relative-humidity': 'unit-interval',
  'streams.air-electrode.humidity.at': 'liquid-water-data',
  'streams.air-electrode.cathode-loop.burner-air.composition.*': 'unit-interval',
  'streams.air-electrode.cathode-loop.burner-air.humidity.dew-point': 'liquid-water-data',
  'streams.air-electrode.cathode-loop.burner-air.humidity.relative-humidity': 'unit-interval',
  'streams.air-electrode.cathode-loop.burner-air.humidity.at': 'liquid-water-data',
  'streams.air-electrode.cathode-loop.inlet-oxygen': 'unit-interval',
  'operating-point.fuel-utilization': 'utilization',
  'operating-point.steam-conversion': 'utilization',
  'operating-point.air-utilization': 'inverse-of-air-ratio',
  'operating-point.air-ratio': 'air-ratio',
  'operating-point.sweep-ratio': 'sweep-ratio',
  'operating-point.current-density': 'current-density',
  'operating-point.cell-voltage': 'cell-voltage',
  'operating-point.area-specific-resistance': 'area-specific-resistance',
  'operating-point.resistance-temperature-law.activation-energy': 'activation-energy',
  'operating-point.resistance-temperature-law.reference-temperature': 'resistance-reference-temperature',
  'operating-point.activation-loss.tafel-slope': 'tafel-slope',
  'operating-point.activation-loss.exchange-current-density': 'exchange-current-density',
  'operating-point.degradation.rate': 'degradation-rate',
  'operating-point.degradation.operating-time': 'operating-time',
  'operating-point.active-area': 'active-area',
  'operating-point.cells': 'cells',
  'operating-point.target-power': 'target-power',
  'operating-point.target-hydrogen': 'target-hydrogen',
  'operating-point.parasitic-load': 'parasitic-load',
  'operating-point.power-conversion-efficiency': 'power-conversion-efficiency',
  'plant.electrical.cells-per-stack': 'electrical-count',
  'plant.electrical.stacks-in-series': 'electrical-count',
  'plant.electrical.strings-in-parallel': 'electrical-count',
  'plant.electrical.dc-bus-window.from': 'bus-voltage',
  'plant.electrical.dc-bus-window.to': 'bus-voltage',
  'plant.feed-temperatures.fuel': 'feed-temperature',
  'plant.feed-temperatures.air': 'feed-temperature',
  'plant.feed-temperatures.water': 'feed-water-temperature',
  'plant.anode-recycle.ratio': 'recycle-ratio',
  'plant.anode-recycle.tolerance': 'recycle-tolerance',
  'plant.off-gas-oxidiser.air-ratio': 'oxidiser-air-ratio',
  'plant.off-gas-oxidiser.material-limit': 'oxidiser-material-limit',
  'plant.heat-recovery.exhaust-exit-temperature': 'exhaust-exit-temperature',
  'plant.heat-recovery.minimum-approach': 'minimum-approach',
  'plant.air-blower.isentropic-efficiency': 'isentropic-efficiency',
  'plant.air-blower.inlet-pressure': 'pressure',
  'plant.heat-loss': 'heat-loss',
  'plant.hydrogen-compression.delivery-pressure': 'pressure',
  'plant.hydrogen-compression.stages': 'compression-stages',
  'plant.hydrogen-compression.maximum-stage-ratio': 'compression-stage-ratio',
  'plant.hydrogen-compression.maximum-discharge-temperature': 'compressor-discharge-temperature',
  'plant.hydrogen-compression.isentropic-efficiency': 'isentropic-efficiency',
  'plant.hydrogen-compression.inlet-temperature': 'compressor-gas-temperature',
  'plant.hydrogen-compression.intercooling-temperature': 'compressor-gas-temperature',
  'plant.recuperator.minimum-approach': 'minimum-approach',
  'sensitivity.temperature': 'sensitivity-temperature',
  'sensitivity.pressure': 'sensitivity-pressure',
  'sensitivity.utilization': 'sensitivity-utilization',
  'sensitivity.steam-to-carbon': 'sensitivity-steam-to-carbon',
  'sensitivity.current-density': 'sensitivity-current-density',
};

/**
 * Every number of the basis schema (`*` for a name of the user's: a mixture, a species, a case)
 * and what bounds it. A case's overrides of conditions, streams and operating-point are read as
 * the base values they replace (lib/basis/read-cases.ts), so each bears the limit of that value.
 * Keep in step with lib/basis/schema.ts: test/basis/limits.test.ts walks the schema, and puts each
 * value beyond each limit into a basis to see it refused at its field.
 */
export const FIELDS: Readonly<Record<string, LimitedInput | PhysicsRule>> = {
  ...BASE_FIELDS,
  ...Object.fromEntries(
    Object.entries(BASE_FIELDS)
      .filter(([field]) => /^(conditions|streams|operating-point)\./.test(field))
      .map(([field, bound]) => [`cases.*.overrides.${field}`, bound]),
  ),
};

export interface Limit {
  fromSI?: number;
  toSI?: number;
  /** The limits as written in data/limits.yaml, for messages. */
  from?: string;
  to?: string;
}

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

const BEYOND = 'beyond any fuel-cell or electrolyser plant';

/** Why a value beyond a limit is refused, below and above, where it is not that no plant is so. */
const REASONS: Partial<Record<LimitedInput, [below: string, above: string]>> = {
  'ambient-temperature': ['colder than any site on Earth', 'hotter than any site on Earth'],
  'ambient-pressure': ['lower than the air pressure at any site on Earth', 'higher than the air pressure at any site on Earth'],
  ...Object.fromEntries(
    (['sensitivity-temperature', 'sensitivity-pressure', 'sensitivity-utilization', 'sensitivity-steam-to-carbon', 'sensitivity-current-density'] as const).map((input) => [
      input,
      ['too small a step: the change would be lost in the rounding of the results', 'too large a step for a sensitivity, which is the change for a small step'],
    ]),
  ),
};

/**
 * Undefined when the SI value lies within the input's limits, else the message:
 * `the cell voltage 1e30 V is above 10 V, beyond any fuel-cell or electrolyser plant`.
 */
export function limitProblem(input: LimitedInput, label: string, read: { si: number; text: string }): string | undefined {
  const { fromSI, toSI, from, to } = limit(input);
  const [below, above] = REASONS[input] ?? [BEYOND, BEYOND];
  const shown = (written: string | undefined, si: number) => limitAsWritten(input, read.text, written, si);
  if (fromSI !== undefined && read.si < fromSI) return `the ${label} ${read.text} is below ${shown(from, fromSI)}, ${below}`;
  if (toSI !== undefined && read.si > toSI) return `the ${label} ${read.text} is above ${shown(to, toSI)}, ${above}`;
  return undefined;
}

/**
 * The limit as data/limits.yaml writes it, followed by the same limit in percent where the
 * value was written in percent and the limit is a plain fraction, so that a message never sets
 * "10 %" against "0.3" alone: `is below 0.3 (30 %)`.
 */
function limitAsWritten(input: LimitedInput, valueText: string, written: string | undefined, si: number): string {
  if (DIMENSIONS[input] !== 'fraction' || !/%\s*$/.test(valueText) || written === undefined || /%/.test(written)) return String(written);
  return `${written} (${Number((si * 100).toPrecision(12))} %)`;
}

/** The air utilization's limit, the inverse of the air ratio's: `the air utilization 1e-6 is below 0.001 (an air ratio of 1000), ...`. */
export function airUtilizationProblem(read: { si: number; text: string }): string | undefined {
  const { toSI, to } = limit('air-ratio');
  if (toSI === undefined || read.si * toSI >= 1) return undefined;
  return `the air utilization ${read.text} is below ${String(1 / toSI)} (an air ratio of ${to}), ${BEYOND}`;
}

/** Reports a value beyond the input's limits at the value; whether it lies within them. */
export function withinLimit(findings: Findings, input: LimitedInput, label: string, read: Read): boolean {
  const beyond = limitProblem(input, label, read);
  if (beyond) findings.error(read.at, beyond);
  return beyond === undefined;
}
