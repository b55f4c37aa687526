/**
 * `streams:`: reads the feed of each electrode that the technology and mode call for
 * (stream-rules.ts), refuses feeds they do not take, then checks every species against the
 * temperatures it sees (temperature-ranges.ts) and against its role (fuel, oxidant, steam,
 * liquid water).
 */
import type { Mode, Technology } from '../electrochem/technologies.ts';
import { readFuelStream } from './read-fuel-stream.ts';
import { readAirStream } from './read-air-stream.ts';
import { checkFeed, streamRules, type Electrode } from './stream-rules.ts';
import { checkSpeciesRanges, type Feed, type TemperatureUse } from './temperature-ranges.ts';
import type { Composition } from './composition.ts';
import type { ConditionsRead } from './read-conditions.ts';
import type { Reader } from './reader.ts';
import type { AirStream, FuelStream } from './types.ts';

export interface StreamsRead {
  fuelElectrode: FuelStream | null;
  airElectrode: AirStream | null;
  /** Every feed read (also those not handed on, such as alkaline electrolysis water), for the sweep range. */
  feeds: Feed[];
}

const ELECTRODES: Electrode[] = ['fuel-electrode', 'air-electrode'];

function temperatureUses(conditions: ConditionsRead, preReforming: TemperatureUse['read'] | undefined, mode: Mode): TemperatureUse[] {
  const uses: TemperatureUse[] = [];
  const both = ELECTRODES;
  if (conditions.temperature) uses.push({ read: conditions.temperature, label: 'operating temperature', electrodes: both, cell: true });
  if (conditions.fuelInlet) uses.push({ read: conditions.fuelInlet, label: 'fuel inlet temperature', electrodes: ['fuel-electrode'], cell: false });
  if (conditions.airInlet) uses.push({ read: conditions.airInlet, label: 'air inlet temperature', electrodes: ['air-electrode'], cell: false });
  if (conditions.sweep) {
    uses.push({ read: conditions.sweep.from, label: 'sweep start', electrodes: both, cell: true });
    uses.push({ read: conditions.sweep.to, label: 'sweep end', electrodes: both, cell: true });
  }
  if (preReforming) uses.push({ read: preReforming, label: 'pre-reforming temperature', electrodes: ['fuel-electrode'], cell: false });
  // Cooling air (power mode) enters at the operating temperature less the allowed rise.
  const { temperature, rise } = conditions;
  if (mode === 'power' && temperature && rise) {
    const coolingInletK = temperature.si - rise.si;
    const text = `${String(Number(coolingInletK.toPrecision(6)))} K, the operating temperature less the allowed air temperature rise (${rise.text}),`;
    uses.push({ read: { ...rise, si: coolingInletK, text }, label: 'cooling-air inlet temperature', electrodes: ['air-electrode'], cell: false });
  }
  return uses;
}

export function readStreams(reader: Reader, tech: Technology, mode: Mode, conditions: ConditionsRead, mixtures: ReadonlyMap<string, Composition>): StreamsRead | undefined {
  const rules = streamRules(tech, mode);
  const needed = ELECTRODES.filter((e) => rules[e].need === 'required');
  if (!reader.has(['streams']) && needed.length) {
    reader.findings.error(['streams'], `${tech.id} ${mode} needs streams: ${needed.map((e) => `${e} (${rules[e].what})`).join(' and ')}`, 'missing');
    return undefined;
  }
  let complete = true;
  const feeds: Feed[] = [];
  const result: StreamsRead = { fuelElectrode: null, airElectrode: null, feeds };
  let preReforming: TemperatureUse['read'] | undefined;
  for (const electrode of ELECTRODES) {
    const rule = rules[electrode];
    const path = ['streams', electrode];
    if (!reader.has(path)) {
      if (rule.need === 'required') {
        reader.findings.error(path, `${tech.id} ${mode} needs a ${electrode} feed: ${rule.what}`, 'missing');
        complete = false;
      }
      continue;
    }
    if (rule.need === 'absent') {
      reader.findings.error(path, `${tech.id} ${mode} takes no feed at the ${electrode} (${rule.what}); remove streams.${electrode}`, 'key');
      complete = false;
      continue;
    }
    if (electrode === 'fuel-electrode') {
      const read = readFuelStream(reader, path, rule, mixtures);
      if (!read) complete = false;
      else {
        feeds.push({ electrode, composition: read.feed });
        if (rule.kept) result.fuelElectrode = read.stream;
        preReforming = read.preReformingTemperature;
      }
    } else {
      const inletK = conditions.airInlet?.si ?? conditions.temperature?.si;
      const read = readAirStream(reader, path, mixtures, { airElectrodeBar: conditions.airPressureBar, ambientBar: conditions.ambientPressureBar }, inletK, tech.id === 'molten-carbonate' && mode === 'power');
      if (!read) complete = false;
      else {
        feeds.push({ electrode, composition: read.feed });
        if (rule.kept) result.airElectrode = read.stream;
      }
    }
  }
  const reported = checkSpeciesRanges(reader, feeds, temperatureUses(conditions, preReforming, mode), tech);
  for (const feed of feeds) {
    const skip = new Set([...reported].filter((k) => k.startsWith(`${feed.electrode}:`)).map((k) => k.slice(feed.electrode.length + 1)));
    checkFeed(reader, feed.electrode, rules[feed.electrode], feed.composition, tech, skip);
  }
  return complete ? result : undefined;
}
