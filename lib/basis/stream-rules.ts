/**
 * Which feed each electrode takes, by technology and mode, and what it must contain.
 *
 * Power mode: a fuel at the fuel electrode and an oxidant (air or oxygen) at the air electrode.
 * Electrolysis consumes water at the technology's water electrode (technologies.yaml):
 * - solid oxide (water at the fuel electrode, steam): steam (+ some H2; CO2 for
 *   co-electrolysis) at the fuel electrode; a sweep gas at the air electrode, or none (pure O2);
 * - proton-conducting ceramic (water at the air electrode, steam): steam or humid air at the air
 *   electrode; an H2 sweep at the fuel electrode, or none;
 * - PEM (water at the air electrode, liquid): liquid water at the air electrode; no fuel feed;
 * - alkaline (water in the electrolyte): no feeds, or liquid water, which means the same.
 * Cells whose fuel electrode does not reform or shift (pem, ht-pem, alkaline) react only H2;
 * other fuel species pass through, which is worth a warning.
 */
import { findSpecies } from '../thermo/species-data.ts';
import { technology, type Mode, type Technology, type TechnologyId } from '../electrochem/technologies.ts';
import type { Composition } from './composition.ts';
import type { Reader } from './reader.ts';

export type Electrode = 'fuel-electrode' | 'air-electrode';

export type Role = 'fuel' | 'oxidant' | 'steam-feed' | 'liquid-water' | 'sweep';

export interface ElectrodeRule {
  role: Role;
  need: 'required' | 'optional' | 'absent';
  /** Whether the feed is handed to the calculation (alkaline electrolysis keeps its water in the electrolyte). */
  kept: boolean;
  /** What the feed is, for messages (for an electrode without feed: why). */
  what: string;
  /** The stream's name in documents and summaries: what it is in this technology and mode ("water feed (oxygen electrode)", not "air-electrode feed"). */
  name: string;
  /** Its short name before "inlet temperature": "air", "water", "steam", "sweep gas". */
  short: string;
}

/** No feed at this electrode; `what` says why. */
const absent: ElectrodeRule = { role: 'sweep', need: 'absent', kept: false, what: 'it takes no feed', name: 'feed', short: 'feed' };

export function streamRules(tech: Technology, mode: Mode): Record<Electrode, ElectrodeRule> {
  if (mode === 'power') {
    return {
      'fuel-electrode': { role: 'fuel', need: 'required', kept: true, what: 'a fuel, e.g. hydrogen or a mixture of your gas', name: 'fuel-electrode feed', short: 'fuel' },
      'air-electrode': { role: 'oxidant', need: 'required', kept: true, what: 'air or oxygen, e.g. humid-air or dry-air', name: 'air-electrode feed', short: 'air' },
    };
  }
  if (tech.waterPhase === 'liquid' && tech.waterElectrode === 'air') {
    return {
      'fuel-electrode': { ...absent, what: 'hydrogen forms there from the protons', name: 'hydrogen-electrode feed', short: 'hydrogen-electrode feed' },
      'air-electrode': { role: 'liquid-water', need: 'required', kept: true, what: 'liquid water, composition liquid-water', name: 'water feed (oxygen electrode)', short: 'water' },
    };
  }
  if (tech.waterPhase === 'liquid') {
    const water: ElectrodeRule = { role: 'liquid-water', need: 'optional', kept: false, what: 'no feed (the water is in the electrolyte), or liquid water', name: 'water feed (to the electrolyte)', short: 'water' };
    return { 'fuel-electrode': water, 'air-electrode': water };
  }
  if (tech.waterElectrode === 'fuel') {
    return {
      'fuel-electrode': { role: 'steam-feed', need: 'required', kept: true, what: 'steam with some H2, e.g. { H2O: 0.9, H2: 0.1 } (CO2 too for co-electrolysis)', name: 'steam feed (fuel electrode)', short: 'steam' },
      'air-electrode': { role: 'sweep', need: 'optional', kept: true, what: 'a sweep gas (with sweep-ratio), or none for pure oxygen', name: 'sweep gas (oxygen electrode)', short: 'sweep gas' },
    };
  }
  return {
    'fuel-electrode': { role: 'sweep', need: 'optional', kept: true, what: 'an H2 sweep gas, or none', name: 'hydrogen sweep (fuel electrode)', short: 'hydrogen sweep' },
    'air-electrode': { role: 'steam-feed', need: 'required', kept: true, what: 'steam or humid air, e.g. steam', name: 'steam feed (oxygen electrode)', short: 'steam' },
  };
}

/**
 * What operating-point.fuel-utilization or steam-conversion measures, named for the technology:
 * the fuel utilization (power), the water converted per pass of a liquid-water electrolyser (whose
 * water is liquid, not steam), or the steam conversion.
 */
export function conversionName(tech: Technology, mode: Mode): string {
  if (mode === 'power') return 'fuel utilization';
  return tech.waterPhase === 'liquid' ? 'water conversion per pass' : 'steam conversion';
}

/** The names of a technology's two feeds and of its conversion, for documents, summaries and the command line. */
export function feedNames(id: TechnologyId, mode: Mode): { fuel: string; air: string; conversion: string } {
  const tech = technology(id);
  const rules = streamRules(tech, mode);
  return { fuel: rules['fuel-electrode'].name, air: rules['air-electrode'].name, conversion: conversionName(tech, mode) };
}

/** Species that do not react at a fuel electrode (oxidised or inert). */
const NOT_FUEL = new Set(['H2O', 'CO2', 'N2', 'Ar', 'He', 'O2']);

/** Inert to a cell that reacts only H2 (CO2 is not, for alkaline cells: it carbonates the electrolyte). */
function passesThrough(species: string, tech: Technology): boolean {
  return species === 'H2' || ['N2', 'Ar', 'He', 'H2O'].includes(species) || (species === 'CO2' && tech.ion !== 'hydroxide');
}

function speciesList(names: string[]): string {
  return names.length <= 1 ? names.join('') : `${names.slice(0, -1).join(', ')} and ${names[names.length - 1]}`;
}

/**
 * Checks what a feed contains against its role. `skip` holds species whose problem was already
 * reported (a liquid outside its data range).
 */
export function checkFeed(reader: Reader, electrode: Electrode, rule: ElectrodeRule, feed: Composition, tech: Technology, skip: ReadonlySet<string>): void {
  const species = Object.keys(feed.fractions).filter((s) => feed.fractions[s]! > 0);
  const at = feed.at;
  const named = feed.name ? `${feed.name} (${species.join(', ')})` : 'the composition';
  if (rule.role === 'liquid-water') {
    if (species.length !== 1 || species[0] !== 'H2O(L)') {
      reader.findings.error(at, `${tech.id} electrolysis takes liquid water at the ${electrode}, { "H2O(L)": 1 } (preset liquid-water), got ${named}`);
    }
    return;
  }
  for (const s of species) {
    if (findSpecies(s)?.phase === 'condensed' && !skip.has(s)) {
      reader.findings.error(
        feed.speciesAt[s]!,
        `${s} is a condensed phase, but this feed is a gas (liquid water is the feed of PEM and alkaline electrolysis only; for steam write H2O)`,
        feed.origin === 'inline' ? 'key' : 'value',
      );
    }
  }
  if (rule.role === 'fuel') {
    if (!species.some((s) => !NOT_FUEL.has(s))) reader.findings.error(at, `${named} holds nothing that reacts at the fuel electrode (only ${speciesList(species)})`);
    if (!tech.fuelGasEquilibrium) {
      const through = species.filter((s) => !passesThrough(s, tech));
      if (through.length) {
        const notes = [
          through.includes('CO') ? 'CO poisons the catalyst, see the hazards section' : '',
          through.includes('CO2') ? 'CO2 carbonates the alkaline electrolyte' : '',
        ].filter(Boolean);
        reader.findings.warning(at, `${tech.id} cells react only H2: ${speciesList(through)} pass${through.length === 1 ? 'es' : ''} through unreacted${notes.length ? ` (${notes.join('; ')})` : ''}`);
      }
    }
  }
  if (rule.role === 'oxidant' && !species.includes('O2')) reader.findings.error(at, `the air-electrode feed must contain O2; ${named} has none`);
  if (rule.role === 'oxidant' && tech.ion === 'hydroxide' && species.includes('CO2')) {
    reader.findings.warning(at, 'CO2 in the oxidant carbonates the alkaline electrolyte; alkaline cells take oxygen or CO2-free air');
  }
  if (rule.role === 'steam-feed' && !species.includes('H2O')) reader.findings.error(at, `${tech.id} electrolysis splits steam fed here, but ${named} holds no H2O`);
}
