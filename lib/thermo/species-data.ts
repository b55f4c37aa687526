/**
 * The species registry: the NASA Glenn excerpt in lib/thermo/data, parsed once at load time,
 * with cellbasis's labels and aliases (species-names.yaml). No coefficient is retyped in code.
 */
import { readFileSync } from 'node:fs';
import { createHash } from 'node:crypto';
import { fileURLToPath } from 'node:url';
import { z } from 'zod';
import { parseNasaGlenn, type NasaRecord } from './nasa-glenn.ts';
import { readDataFile } from '../core/data-file.ts';
import { UserError } from '../core/errors.ts';
import { editDistance } from '../core/suggest.ts';

export interface Species {
  /** Name cellbasis shows and keys results by (the NASA name unless species-names.yaml gives a label). */
  label: string;
  /** Name of the record in the NASA Glenn database. */
  nasaName: string;
  phase: 'gas' | 'condensed';
  /** Element symbol to atom count. */
  formula: Readonly<Record<string, number>>;
  elements: readonly string[];
  molarMassKgPerMol: number;
  lowK: number;
  highK: number;
  record: NasaRecord;
}

const DATA_URL = new URL('./data/nasa-glenn-excerpt.inp', import.meta.url);
const NAMES_URL = new URL('./data/species-names.yaml', import.meta.url);

interface Registry {
  byLabel: Map<string, Species>;
  aliases: Map<string, string>;
  elementReference: Map<string, { species: string; atoms: number }>;
  hash: string;
  path: string;
}

let registry: Registry | undefined;

/** species-names.yaml: labels of NASA records, further spellings accepted, and each element's reference state. */
const SpeciesNames = z.strictObject({
  label: z.record(z.string(), z.string()),
  aliases: z.record(z.string(), z.string()),
  'element-reference': z.record(z.string(), z.strictObject({ species: z.string(), atoms: z.number().int().positive() })),
});

function load(): Registry {
  const bytes = readFileSync(DATA_URL);
  const path = fileURLToPath(DATA_URL);
  const records = parseNasaGlenn(bytes.toString('latin1'), 'lib/thermo/data/nasa-glenn-excerpt.inp');
  const names = readDataFile(NAMES_URL, SpeciesNames);
  const byLabel = new Map<string, Species>();
  for (const record of records) {
    const label = names.label[record.name] ?? record.name;
    const first = record.intervals[0]!;
    const last = record.intervals[record.intervals.length - 1]!;
    byLabel.set(label, {
      label,
      nasaName: record.name,
      phase: record.condensed ? 'condensed' : 'gas',
      formula: record.formula,
      elements: Object.keys(record.formula),
      molarMassKgPerMol: record.molarMassGPerMol / 1000,
      lowK: first.lowK,
      highK: last.highK,
      record,
    });
  }
  const aliases = new Map<string, string>();
  for (const [nasa, label] of Object.entries(names.label)) aliases.set(nasa, label);
  for (const [alias, target] of Object.entries(names.aliases)) aliases.set(alias, names.label[target] ?? target);
  const elementReference = new Map(Object.entries(names['element-reference']));
  return { byLabel, aliases, elementReference, hash: createHash('sha256').update(bytes).digest('hex'), path };
}

function reg(): Registry {
  registry ??= load();
  return registry;
}

/** Every species in the data, in file order (gas first, then condensed). */
export function allSpecies(): Species[] {
  return [...reg().byLabel.values()];
}

/**
 * The reference state of an element (e.g. H → H2, 2 atoms; C → C(gr)), for formation
 * properties; undefined for elements without one in the data (S).
 */
export function elementReference(element: string): { species: Species; atoms: number } | undefined {
  const ref = reg().elementReference.get(element);
  if (!ref) return undefined;
  return { species: getSpecies(ref.species), atoms: ref.atoms };
}

/** SHA-256 of the species data file, for manifests and result caches. */
export function speciesDataHash(): string {
  return reg().hash;
}

export function speciesDataPath(): string {
  return reg().path;
}

/** Finds a species by label, NASA name or alias; undefined when there is none. */
export function findSpecies(name: string): Species | undefined {
  const r = reg();
  const trimmed = name.trim();
  return r.byLabel.get(trimmed) ?? r.byLabel.get(r.aliases.get(trimmed) ?? '');
}

/** Up to three known names closest to `name`. */
export function suggestSpecies(name: string): string[] {
  const r = reg();
  const candidates = [...r.byLabel.keys(), ...r.aliases.keys()];
  return candidates
    .map((c) => ({ c: r.byLabel.has(c) ? c : r.aliases.get(c)!, d: editDistance(name, c) }))
    .filter((x) => x.d <= Math.max(2, Math.floor(name.length / 2)))
    .sort((x, y) => x.d - y.d || x.c.localeCompare(y.c))
    .map((x) => x.c)
    .filter((c, i, all) => all.indexOf(c) === i)
    .slice(0, 3);
}

export class UnknownSpeciesError extends UserError {
  constructor(readonly species: string, readonly suggestions: string[]) {
    super(
      `unknown species "${species}"${suggestions.length ? `; did you mean ${suggestions.map((s) => `"${s}"`).join(', ')}?` : ''} (cellbasis species --list shows every species)`,
    );
    this.name = 'UnknownSpeciesError';
  }
}

/** Like findSpecies, but throws UnknownSpeciesError with suggestions. */
export function getSpecies(name: string): Species {
  const found = findSpecies(name);
  if (!found) throw new UnknownSpeciesError(name, suggestSpecies(name));
  return found;
}
