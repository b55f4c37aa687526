/**
 * The gas phase of a hazard stream: labels resolved through the species registry (aliases
 * accepted, unknown names rejected with suggestions), condensed species left out and the rest
 * renormalised, and the checks on the stream's numbers. Input mistakes are UserErrors naming
 * the stream and the field.
 */
import { UserError } from '../core/errors.ts';
import { getSpecies } from '../thermo/species-data.ts';
import type { HazardStream } from './types.ts';

/** Allowed deviation of a stream's mole fractions from a sum of 1 (catches percent-for-fraction slips). */
const SUM_TOLERANCE = 1e-3;

export interface GasPhase {
  /** Mole fraction of the gas phase by species label, summing to 1. */
  fractions: Map<string, number>;
  condensedExcluded: string[];
}

function positiveFinite(value: number, stream: HazardStream, field: string): void {
  if (!Number.isFinite(value) || value <= 0) {
    throw new UserError(`hazard stream "${stream.id}": ${field} must be a positive finite number, got ${value}`);
  }
}

export function gasPhase(stream: HazardStream): GasPhase {
  positiveFinite(stream.temperatureK, stream, 'temperatureK');
  positiveFinite(stream.pressureBar, stream, 'pressureBar');
  const gas = new Map<string, number>();
  const condensedExcluded: string[] = [];
  let sum = 0;
  for (const [name, x] of Object.entries(stream.moleFractions)) {
    if (!Number.isFinite(x) || x < 0) {
      throw new UserError(`hazard stream "${stream.id}": mole fraction of ${name} must be a finite number ≥ 0, got ${x}`);
    }
    sum += x;
    const species = getSpecies(name);
    if (species.phase === 'condensed') {
      if (x > 0) condensedExcluded.push(species.label);
      continue;
    }
    gas.set(species.label, (gas.get(species.label) ?? 0) + x);
  }
  if (Math.abs(sum - 1) > SUM_TOLERANCE) {
    throw new UserError(`hazard stream "${stream.id}": mole fractions sum to ${sum}, expected 1`);
  }
  const gasTotal = [...gas.values()].reduce((a, b) => a + b, 0);
  if (!(gasTotal > 0)) throw new UserError(`hazard stream "${stream.id}": the stream has no gas phase`);
  for (const [label, x] of gas) gas.set(label, x / gasTotal);
  return { fractions: gas, condensedExcluded };
}
