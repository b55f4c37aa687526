/**
 * `sensitivity:`: the steps of the sensitivity study. Defaults: temperature 25 K, pressure
 * 10 %, utilization 0.05, steam-to-carbon 0.5, current density 10 % (common practice, no
 * source). Every step must be above zero; relative steps must stay below 100 %; and each lies
 * within its limits of data/limits.yaml (a step too small to show in the results, or too large
 * to be a small change, is refused).
 */
import type { Dimension } from '../core/units.ts';
import type { Reader } from './reader.ts';
import type { Sensitivity } from './types.ts';
import { withinLimit, type LimitedInput } from './limits.ts';

export const DEFAULT_SENSITIVITY: Sensitivity = {
  temperatureK: 25,
  pressureFraction: 0.1,
  utilization: 0.05,
  steamToCarbon: 0.5,
  currentDensityFraction: 0.1,
};

const STEPS: { key: string; field: keyof Sensitivity; dimension: Dimension; label: string; belowOne: boolean; limit: LimitedInput }[] = [
  { key: 'temperature', field: 'temperatureK', dimension: 'temperature-difference', label: 'temperature step', belowOne: false, limit: 'sensitivity-temperature' },
  { key: 'pressure', field: 'pressureFraction', dimension: 'fraction', label: 'pressure step', belowOne: true, limit: 'sensitivity-pressure' },
  { key: 'utilization', field: 'utilization', dimension: 'fraction', label: 'utilization step', belowOne: true, limit: 'sensitivity-utilization' },
  { key: 'steam-to-carbon', field: 'steamToCarbon', dimension: 'fraction', label: 'steam-to-carbon step', belowOne: false, limit: 'sensitivity-steam-to-carbon' },
  { key: 'current-density', field: 'currentDensityFraction', dimension: 'fraction', label: 'current-density step', belowOne: true, limit: 'sensitivity-current-density' },
];

export function readSensitivity(reader: Reader): Sensitivity {
  const result = { ...DEFAULT_SENSITIVITY };
  for (const step of STEPS) {
    const read = reader.scalar(['sensitivity', step.key], step.dimension, step.label);
    if (!read) continue;
    if (read.si <= 0 || (step.belowOne && read.si >= 1)) {
      reader.findings.error(read.at, `the ${step.label} must be above zero${step.belowOne ? ' and below 1 (100 %)' : ''}, got ${read.text}`);
      continue;
    }
    if (withinLimit(reader.findings, step.limit, step.label, read)) result[step.field] = read.si;
  }
  return result;
}
