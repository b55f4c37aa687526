/**
 * The sheet a plant balance is written on: its numbered streams (numbered in the order they are
 * added, a stream without flow left out) and its duties, the stream arithmetic the blocks share,
 * and the first law over the plant boundary, Σ in − Σ out over a scale.
 *
 * Enthalpies are absolute (heats of formation included, species data, ideal gas), so one sum
 * holds reactions and sensible heat alike: H = Σ ṅ_i h°_i(T). A duty is what a heater gives a
 * stream, Q = H_out − H_in (negative: the stream gives heat up).
 */
import type { PlantDuty, PlantStream, PowerPlantBalance } from './plant-balance-types.ts';
import { totalFlow } from './streams.ts';

/** The reference temperature of the heats released, K (25 °C). */
export const REFERENCE_K = 298.15;

/** The streams and duties of a plant balance, in the order the blocks add them. */
export class PlantSheet {
  readonly streams: PlantStream[] = [];
  readonly duties: PlantDuty[] = [];

  /** A stream, numbered next; none where it carries no flow. */
  add(id: string, name: string, temperatureK: number, pressureBar: number, flows: Record<string, number>): void {
    if (totalFlow(flows) > 0) this.streams.push({ number: this.streams.length + 1, id, name, temperatureK, pressureBar, flows });
  }

  /** A heater's, cooler's or reactor's duty, W. */
  duty(id: string, name: string, dutyW: number, fromK: number, toK: number): void {
    this.duties.push({ id, name, dutyW, fromK, toK });
  }
}

/** The flows without one species. */
export function without(flows: Readonly<Record<string, number>>, label: string): Record<string, number> {
  const out = { ...flows };
  delete out[label];
  return out;
}

/** The species flows of several streams added. */
export function plus(...streams: Readonly<Record<string, number>>[]): Record<string, number> {
  const out: Record<string, number> = {};
  for (const s of streams) for (const [k, v] of Object.entries(s)) out[k] = (out[k] ?? 0) + v;
  return out;
}

/** Mole fractions x_i = ṅ_i / Σ ṅ, those below 1e-12 left out. */
export function fractions(flows: Readonly<Record<string, number>>): Record<string, number> {
  const total = totalFlow(flows);
  return Object.fromEntries(Object.entries(flows).filter(([, v]) => v / total > 1e-12).map(([k, v]) => [k, v / total]));
}

/** The first law over the plant from its terms: Σ in, Σ out and (in − out) / scale; the terms that are zero left out. */
export function firstLaw(terms: PowerPlantBalance['energy']['terms'], scaleW: number): PowerPlantBalance['energy'] {
  const sum = (side: 'in' | 'out') => terms.filter((t) => t.side === side).reduce((a, t) => a + t.valueW, 0);
  const inW = sum('in');
  const outW = sum('out');
  return { inW, outW, residual: (inW - outW) / scaleW, terms: terms.filter((t) => t.valueW !== 0) };
}
