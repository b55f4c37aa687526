/**
 * Flammability of a gas stream from its composition:
 *
 * - Mixture limits of the combustibles by Le Chatelier's rule (le-chatelier.ts) on the
 *   combustible-only normalised mixture, with the component limits in air of substances.yaml.
 * - Inerts by a stated simplification: the combustible portion's limits are applied to the
 *   stream's combustible fraction x_c, so the lower limit of the stream as a whole in air is
 *   LFL_stream = LFL_mix / x_c (vol % of the stream in air). The diluent-specific narrowing of the
 *   range shown by Zabetakis's inert-addition diagrams (US Bureau of Mines Bulletin 627, 1965)
 *   is not modelled; for inert-rich streams this errs towards "flammable".
 * - Flammable on mixing with air: a stream with x_c ≥ LFL_mix passes through the flammable range
 *   as air dilutes it (its combustible concentration falls continuously from x_c to 0).
 * - Inside the flammable range (a screen, meaningful only with oxygen present): x_c ≥ LFL_mix,
 *   x_O2 ≥ LOC (the lowest limiting oxygen concentration of the combustibles: NFPA 69 values
 *   where recorded, else the estimate LOC ≈ z · LFL of D. A. Crowl and J. F. Louvar, Chemical
 *   Process Safety, 3rd ed., 2011, ch. 6, with z the mol O2 to burn one mol completely), and,
 *   where the non-combustible part holds no more oxygen than air, x_c ≤ UFL_mix. Where it holds
 *   more, the upper limit is not applied: oxygen enrichment widens the range.
 *
 * All limits are for air at about 25 °C and 1 atm; hot streams have a wider range than stated.
 */
import { getSpecies } from '../thermo/species-data.ts';
import { leChatelier } from './le-chatelier.ts';
import { findSubstance, substance } from './substances.ts';
import type { InsideRangeFinding } from './types.ts';

export interface Combustible {
  label: string;
  /** Mole fraction in the stream. */
  fraction: number;
}

export interface MixtureLimits {
  combustibles: Combustible[];
  combustibleFraction: number;
  lfl_percent: number;
  ufl_percent: number | null;
  streamLfl_percent: number;
}

export interface LimitingOxygen {
  percent: number;
  species: string;
  estimated: boolean;
}

type Composition = ReadonlyMap<string, number> | Readonly<Record<string, number>>;

function entries(composition: Composition): [string, number][] {
  return composition instanceof Map ? [...composition.entries()] : Object.entries(composition);
}

/** The combustibles of a composition (species with a lower flammable limit in the hazard data). */
function combustiblesOf(composition: Composition): Combustible[] {
  return entries(composition)
    .filter(([label, x]) => x > 0 && findSubstance(label)?.combustible === true)
    .map(([label, fraction]) => ({ label, fraction }));
}

/**
 * Mixture limits of a composition (labels as in lib/thermo; species without hazard data count as
 * inert); null where nothing in it burns.
 */
export function mixtureLimits(composition: Composition): MixtureLimits | null {
  const combustibles = combustiblesOf(composition);
  if (combustibles.length === 0) return null;
  const combustibleFraction = combustibles.reduce((sum, c) => sum + c.fraction, 0);
  const lfl_percent = leChatelier(combustibles.map((c) => ({ amount: c.fraction, limit_percent: substance(c.label).lfl_percent!.value })));
  const upper = combustibles.map((c) => ({ amount: c.fraction, limit_percent: substance(c.label).ufl_percent?.value ?? NaN }));
  const ufl_percent = upper.every((u) => u.limit_percent > 0) ? leChatelier(upper) : null;
  return { combustibles, combustibleFraction, lfl_percent, ufl_percent, streamLfl_percent: lfl_percent / combustibleFraction };
}

/**
 * Effective lower flammable limit of a stream as a whole, inerts included: vol % of the stream
 * in air at which the mixture reaches the combustibles' Le Chatelier LFL (LFL_mix / x_c). Above
 * 100 % the stream cannot form a flammable mixture with air. Null where nothing in it burns.
 */
export function effectiveLfl(composition: Composition): number | null {
  return mixtureLimits(composition)?.streamLfl_percent ?? null;
}

/** Whether diluting the stream with air passes through its flammable range: x_c ≥ LFL_mix. */
export function flammableOnMixingWithAir(limits: MixtureLimits | null): boolean {
  return limits !== null && limits.combustibleFraction * 100 >= limits.lfl_percent;
}

/** Mol O2 to burn one mol of a species completely to CO2, H2O, SO2 and N2: z = C + H/4 + S − O/2. */
export function stoichiometricOxygen(label: string): number {
  const f = getSpecies(label).formula;
  for (const element of Object.keys(f)) {
    if (!['C', 'H', 'O', 'N', 'S'].includes(element)) throw new Error(`stoichiometric oxygen: ${label} contains ${element}`);
  }
  return (f.C ?? 0) + (f.H ?? 0) / 4 + (f.S ?? 0) - (f.O ?? 0) / 2;
}

/** Limiting oxygen concentration of one combustible: recorded value, or the z · LFL estimate. */
export function limitingOxygenOf(label: string): LimitingOxygen {
  const s = substance(label);
  if (s.limitingOxygen_percent) return { percent: s.limitingOxygen_percent.value, species: label, estimated: false };
  return { percent: stoichiometricOxygen(label) * s.lfl_percent!.value, species: label, estimated: true };
}

/** Lowest limiting oxygen concentration among the combustibles (no mixing rule is established). */
export function limitingOxygen(combustibles: readonly Combustible[]): LimitingOxygen {
  if (combustibles.length === 0) throw new Error('limiting oxygen: no combustibles');
  return combustibles.map((c) => limitingOxygenOf(c.label)).reduce((low, l) => (l.percent < low.percent ? l : low));
}

/** Oxygen mole fraction of air (substances.yaml, O2 entry). */
function airOxygenFraction(): number {
  return substance('O2').inAir_percent!.value / 100;
}

/** The inside-the-flammable-range screen of the module comment. */
export function insideRangeScreen(limits: MixtureLimits | null, oxygenFraction: number): InsideRangeFinding {
  if (limits === null) return 'no combustibles';
  if (!(oxygenFraction > 0)) return 'no oxidant';
  const x = limits.combustibleFraction * 100;
  if (x < limits.lfl_percent) return 'too lean';
  if (oxygenFraction * 100 < limitingOxygen(limits.combustibles).percent) return 'below limiting oxygen';
  const remainder = 1 - limits.combustibleFraction;
  const enriched = oxygenFraction / remainder > airOxygenFraction();
  if (enriched) return 'inside (oxygen-enriched: upper limit not applied)';
  if (limits.ufl_percent === null) return 'inside (no upper limit recorded)';
  return x <= limits.ufl_percent ? 'inside' : 'too rich';
}

export function isInside(finding: InsideRangeFinding): boolean {
  return finding.startsWith('inside');
}
