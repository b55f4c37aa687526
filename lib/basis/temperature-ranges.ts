/**
 * Temperatures against the range of the species data (lib/thermo): every species a feed
 * contains must have data at every temperature that feed sees (operating, inlet, pre-reformer,
 * sweep). A gas out of range means the temperature is wrong (the gas data span 200 K to
 * 6000 K or more), so the error stands at the temperature; a condensed species out of range
 * (liquid water above 600 K) means the composition is wrong, so it stands at the species. Also
 * the default sweep: 150 K either side of the operating temperature, within the data.
 */
import { getSpecies } from '../thermo/species-data.ts';
import { inRange } from '../thermo/properties.ts';
import { kelvinText } from './read-conditions.ts';
import type { Composition } from './composition.ts';
import type { Read, Reader } from './reader.ts';
import type { Electrode } from './stream-rules.ts';
import type { Technology } from '../electrochem/technologies.ts';

/** Half-width of the default temperature sweep, K (common practice, no source). */
const DEFAULT_SWEEP_HALF_WIDTH_K = 150;

export interface Feed {
  electrode: Electrode;
  composition: Composition;
}

export interface TemperatureUse {
  read: Read;
  label: string;
  /** The feeds that see this temperature. */
  electrodes: readonly Electrode[];
  /** Whether the cell reaction runs at it (operating temperature, sweep), so its species need data there too. */
  cell: boolean;
}

function rangeText(label: string): string {
  const s = getSpecies(label);
  return `${label} ${s.lowK} K to ${s.highK} K`;
}

/**
 * Reports species without data at a temperature they see; returns the condensed species
 * reported, `electrode:species`, so the feed checks do not report them again.
 */
export function checkSpeciesRanges(reader: Reader, feeds: readonly Feed[], uses: readonly TemperatureUse[], tech: Technology): Set<string> {
  const reported = new Set<string>();
  for (const use of uses) {
    const gases = new Set<string>();
    for (const feed of feeds.filter((f) => use.electrodes.includes(f.electrode))) {
      for (const label of Object.keys(feed.composition.fractions)) {
        const species = getSpecies(label);
        if (inRange(species, use.read.si)) continue;
        if (species.phase === 'gas') {
          gases.add(label);
          continue;
        }
        const key = `${feed.electrode}:${label}`;
        if (reported.has(key)) continue;
        reported.add(key);
        reader.findings.error(
          feed.composition.speciesAt[label]!,
          `${label} has data only from ${species.lowK} K to ${species.highK} K, but the ${feed.electrode} feed sees the ${use.label} ${kelvinText(use.read.si)}${label === 'H2O(L)' ? ' (for steam write H2O)' : ''}`,
          feed.composition.origin === 'inline' ? 'key' : 'value',
        );
      }
    }
    if (use.cell) for (const label of reactionSpecies(tech)) if (!inRange(getSpecies(label), use.read.si)) gases.add(label);
    if (gases.size) {
      reader.findings.error(use.read.at, `${use.read.text} is outside the range of the species data (of the feeds${use.cell ? ' and the cell reaction' : ''}): ${[...gases].map(rangeText).join('; ')}`);
    }
  }
  return reported;
}

/** The species of the cell reaction H2 + ½ O2 → H2O, with liquid water for the cells that run with it. */
function reactionSpecies(tech: Technology): string[] {
  return ['H2', 'O2', tech.waterPhase === 'liquid' ? 'H2O(L)' : 'H2O'];
}

/**
 * Sweep range by default: 150 K either side of the operating temperature, within the data of
 * every species fed and of the cell reaction's species.
 */
export function defaultSweep(operatingK: number, feeds: readonly Feed[], tech: Technology): { fromK: number; toK: number } {
  const labels = [...feeds.flatMap((f) => Object.keys(f.composition.fractions)), ...reactionSpecies(tech)];
  const low = Math.max(...labels.map((l) => getSpecies(l).lowK));
  const high = Math.min(...labels.map((l) => getSpecies(l).highK));
  return { fromK: Math.max(low, operatingK - DEFAULT_SWEEP_HALF_WIDTH_K), toK: Math.min(high, operatingK + DEFAULT_SWEEP_HALF_WIDTH_K) };
}
