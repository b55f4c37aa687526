/**
 * `streams.fuel-electrode`: its composition and, for a power-mode fuel, the steam added
 * (steam-to-carbon or steam-per-mole-fuel, not both) and the pre-reformer. A steam-to-carbon
 * ratio on a fuel without combustible carbon is an error: it would add no steam at all, which
 * is surely not what was meant (steam-per-mole-fuel humidifies a carbon-free fuel).
 */
import { addSteam, combustibleCarbon } from '../equilibrium/carbon.ts';
import { readTemperature } from './read-conditions.ts';
import { resolveComposition, type Composition } from './composition.ts';
import type { Path } from './diagnostics.ts';
import type { Read, Reader } from './reader.ts';
import type { ElectrodeRule } from './stream-rules.ts';
import type { FuelStream, PreReforming } from './types.ts';
import { withinLimit } from './limits.ts';

export interface FuelStreamRead {
  stream: FuelStream;
  /** The feed after steam addition, with where each species is written, for the later checks. */
  feed: Composition;
  preReformingTemperature?: Read;
}

const FUEL_ONLY = ['steam-to-carbon', 'steam-per-mole-fuel', 'pre-reforming'] as const;

function steamPerMole(reader: Reader, path: Path, dry: Composition): { added: number; at?: Path; steamToCarbon?: number; steamPerMoleFuel?: number } | undefined {
  const sc = reader.number([...path, 'steam-to-carbon'], 'steam-to-carbon ratio');
  const spf = reader.number([...path, 'steam-per-mole-fuel'], 'steam per mole of dry fuel');
  if (reader.has([...path, 'steam-to-carbon']) && reader.has([...path, 'steam-per-mole-fuel'])) {
    reader.findings.error([...path, 'steam-per-mole-fuel'], 'give steam-to-carbon or steam-per-mole-fuel, not both', 'key');
    return undefined;
  }
  for (const [read, label] of [[sc, 'steam-to-carbon ratio'], [spf, 'steam per mole of dry fuel']] as const) {
    if (read && read.si < 0) {
      reader.findings.error(read.at, `steam added cannot be negative, got ${read.text}`);
      return undefined;
    }
    if (read && !withinLimit(reader.findings, 'steam-added', label, read)) return undefined;
  }
  if (sc) {
    const carbon = combustibleCarbon(dry.fractions);
    if (carbon === 0) {
      reader.findings.error(
        sc.at,
        `steam-to-carbon counts steam per mol of combustible carbon, and ${dry.name ?? 'this fuel'} has none, so no steam would be added; to humidify a carbon-free fuel give steam-per-mole-fuel`,
      );
      return undefined;
    }
    return { added: sc.si * carbon, at: sc.at, steamToCarbon: sc.si };
  }
  if (spf) return { added: spf.si, at: spf.at, steamPerMoleFuel: spf.si };
  return { added: 0 };
}

/** Mole fractions of a feed from its amounts per mole of dry fuel, `total` mol in all. */
function perMoleOfFeed(amounts: Readonly<Record<string, number>>, total: number): Record<string, number> {
  return Object.fromEntries(Object.entries(amounts).map(([label, n]) => [label, n / total]));
}

function preReforming(reader: Reader, path: Path): { value: PreReforming; temperature?: Read } | undefined {
  const written = reader.get([...path, 'pre-reforming']);
  if (written === undefined || written === 'none') return reader.flaggedAt([...path, 'pre-reforming']) ? undefined : { value: { kind: 'none' } };
  if (reader.text([...path, 'pre-reforming', 'kind']) === 'adiabatic') {
    const inlet = readTemperature(reader, [...path, 'pre-reforming', 'inlet-temperature'], 'pre-reformer inlet temperature');
    return inlet && { value: { kind: 'adiabatic', inletTemperatureK: inlet.si }, temperature: inlet };
  }
  const temperature = readTemperature(reader, [...path, 'pre-reforming', 'temperature'], 'pre-reforming temperature');
  return temperature && { value: { kind: 'equilibrium', temperatureK: temperature.si }, temperature };
}

export function readFuelStream(reader: Reader, path: Path, rule: ElectrodeRule, mixtures: ReadonlyMap<string, Composition>): FuelStreamRead | undefined {
  const source = reader.source([...path, 'source']);
  const dry = resolveComposition(reader, [...path, 'composition'], 'fuel-electrode feed', mixtures, source);
  if (rule.role !== 'fuel') {
    for (const key of FUEL_ONLY) {
      if (reader.has([...path, key])) {
        reader.findings.error([...path, key], `${key} applies to the fuel of power mode; in electrolysis write the feed's steam into its composition`, 'key');
      }
    }
  }
  if (!dry) return undefined;
  if (dry.humid) {
    reader.findings.error(dry.at, 'humid-air is a feed of the air electrode, not of the fuel electrode');
    return undefined;
  }
  const steam = rule.role === 'fuel' ? steamPerMole(reader, path, dry) : { added: 0 };
  const reforming = rule.role === 'fuel' ? preReforming(reader, path) : { value: { kind: 'none' } as PreReforming };
  if (!steam || !reforming) return undefined;
  const fractions = steam.added > 0 ? perMoleOfFeed(addSteam(dry.fractions, steam.added), 1 + steam.added) : { ...dry.fractions };
  const speciesAt = { ...dry.speciesAt };
  if (!('H2O' in speciesAt) && steam.at) speciesAt.H2O = steam.at;
  return {
    stream: {
      ...(dry.name ? { compositionName: dry.name } : {}),
      composition: dry.fractions,
      ...(steam.steamToCarbon !== undefined ? { steamToCarbon: steam.steamToCarbon } : {}),
      ...(steam.steamPerMoleFuel !== undefined ? { steamPerMoleFuel: steam.steamPerMoleFuel } : {}),
      preReforming: reforming.value,
      feed: fractions,
    },
    feed: { ...dry, fractions, speciesAt },
    ...(reforming.temperature ? { preReformingTemperature: reforming.temperature } : {}),
  };
}
