/**
 * Compositions of a basis: inline `{ species: mole fraction }` mappings, named mixtures of the
 * basis and presets. Species names resolve through the species data (aliases included) with
 * did-you-mean for unknown ones; each fraction must lie in [0, 1]; a sum within 0.5 % of 1 is
 * normalised with a warning, a sum further off is an error stating it.
 */
import { findSpecies, suggestSpecies, UnknownSpeciesError } from '../thermo/species-data.ts';
import { findPreset, presetNames } from './presets.ts';
import { didYouMean } from '../core/suggest.ts';
import type { Path } from './diagnostics.ts';
import type { Reader } from './reader.ts';
import { quoted } from '../core/quote.ts';

/** Largest departure of the sum of mole fractions from 1 that is normalised rather than refused. */
export const SUM_TOLERANCE = 0.005;

export interface Composition {
  /** Mixture or preset name, when the composition was named. */
  name?: string;
  origin: 'inline' | 'mixture' | 'preset';
  /** Species label → mole fraction, summing to 1 (empty for humid-air before its humidity). */
  fractions: Record<string, number>;
  /** Where the composition is given (the name, or the inline mapping). */
  at: Path;
  /** Where each species is written (inline), else the name. */
  speciesAt: Record<string, Path>;
  /** humid-air: needs a humidity. */
  humid: boolean;
}

/** Rounds a sum for messages: 0.9, 1.003. */
function shown(sum: number): string {
  return String(Number(sum.toPrecision(6)));
}

/**
 * Reads a mapping of species to mole fractions. `label` names the composition in the inputs
 * table, e.g. "fuel-electrode feed"; `source` is the source written with it.
 */
function readFractions(reader: Reader, path: Path, label: string, source?: string): Omit<Composition, 'origin'> | undefined {
  const keys = reader.keys(path);
  if (keys.length === 0) {
    reader.findings.error(path, 'the composition is empty; give species and mole fractions, such as { H2: 0.97, H2O: 0.03 }');
    return undefined;
  }
  const fractions: Record<string, number> = {};
  const speciesAt: Record<string, Path> = {};
  /** The key each species was first written as (H2O(g) and H2O are one species). */
  const givenAs = new Map<string, string>();
  let complete = true;
  for (const { key, usable } of keys) {
    const at = [...path, key];
    const species = findSpecies(key);
    if (!species) {
      reader.findings.error(at, new UnknownSpeciesError(key, suggestSpecies(key)).message, 'key');
      complete = false;
      continue;
    }
    if (givenAs.has(species.label)) {
      reader.findings.error(at, `${key} is the same species as ${givenAs.get(species.label)}, already given in this composition`, 'key');
      complete = false;
      continue;
    }
    givenAs.set(species.label, key);
    const read = usable ? reader.scalar(at, 'fraction', `${label}: ${species.label} mole fraction`, source) : undefined;
    if (!read) {
      complete = false;
      continue;
    }
    if (read.si < 0 || read.si > 1) {
      reader.findings.error(at, `a mole fraction lies between 0 and 1, got ${read.text}`);
      complete = false;
      continue;
    }
    fractions[species.label] = read.si;
    speciesAt[species.label] = at;
  }
  if (!complete) return undefined;
  const sum = Object.values(fractions).reduce((a, b) => a + b, 0);
  if (Math.abs(sum - 1) > SUM_TOLERANCE) {
    reader.findings.error(path, `the mole fractions sum to ${shown(sum)}; they must sum to 1 (within ${SUM_TOLERANCE * 100} %)`);
    return undefined;
  }
  if (Math.abs(sum - 1) > 1e-9) {
    reader.findings.warning(path, `the mole fractions sum to ${shown(sum)}; normalised to 1`);
    for (const species of Object.keys(fractions)) fractions[species] = fractions[species]! / sum;
  }
  return { fractions, at: path, speciesAt, humid: false };
}

/** The named mixtures of the basis (`mixtures:`), each checked. */
export function readMixtures(reader: Reader): Map<string, Composition> {
  const mixtures = new Map<string, Composition>();
  for (const { key } of reader.keys(['mixtures'])) {
    const path = ['mixtures', key];
    if (findPreset(key)) {
      reader.findings.error(path, `"${key}" is the name of a preset; give this mixture its own name (e.g. site-${key})`, 'key');
      continue;
    }
    const source = reader.source([...path, 'source']);
    const read = readFractions(reader, [...path, 'composition'], `mixture ${key}`, source);
    if (read) mixtures.set(key, { ...read, name: key, origin: 'mixture' });
  }
  return mixtures;
}

/** A stream's composition: a mixture name, a preset name or an inline mapping; undefined after an error. */
export function resolveComposition(reader: Reader, path: Path, label: string, mixtures: ReadonlyMap<string, Composition>, source?: string): Composition | undefined {
  const written = reader.get(path);
  if (written === undefined) return undefined;
  if (typeof written !== 'string') {
    const read = readFractions(reader, path, label, source);
    return read && { ...read, origin: 'inline' };
  }
  const name = written.trim();
  const mixture = mixtures.get(name);
  if (mixture) return { ...mixture, at: path, speciesAt: Object.fromEntries(Object.keys(mixture.fractions).map((s) => [s, path])) };
  if (reader.has(['mixtures', name])) return undefined;
  const preset = findPreset(name);
  if (preset) {
    return { name, origin: 'preset', fractions: { ...preset.composition }, at: path, speciesAt: Object.fromEntries(Object.keys(preset.composition).map((s) => [s, path])), humid: preset.humid };
  }
  const known = [...reader.keys(['mixtures']).map((k) => k.key), ...presetNames()];
  reader.findings.error(
    path,
    `unknown mixture or preset ${quoted(name)}${didYouMean(name, known)} (presets: ${presetNames().join(', ')}; define your own under mixtures:)`,
  );
  return undefined;
}
