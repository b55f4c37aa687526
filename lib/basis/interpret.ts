/**
 * From the plain data of a basis (already checked against the schema) to the validated
 * `DesignBasis`: reads each section in turn (cell first, since the others depend on its
 * technology and mode), checks physics and consistency, and assembles the result in SI. Every
 * problem found goes to the reader's findings; the basis is returned only when all required
 * parts could be read (the caller still refuses it when any error was found).
 */
import { readCell, readTechnology } from './read-cell.ts';
import { readConditions } from './read-conditions.ts';
import { readDocument } from './read-document.ts';
import { readMixtures } from './composition.ts';
import { readStreams } from './read-streams.ts';
import { readOperatingPoint } from './read-operating-point.ts';
import { readSensitivity } from './read-sensitivity.ts';
import { readPlant } from './read-plant.ts';
import { checkSources, readAssumptions, readReferences } from './read-references.ts';
import { defaultSweep } from './temperature-ranges.ts';
import { conversionName, streamRules } from './stream-rules.ts';
import type { Reader } from './reader.ts';
import type { Conditions, DesignBasis } from './types.ts';

/** The basis without what the loader adds (id, file, inputs in file order, warnings, positions, cases). */
export type InterpretedBasis = Omit<DesignBasis, 'id' | 'file' | 'inputs' | 'warnings' | 'positions' | 'cases'>;

export interface InterpretOptions {
  /** Mixtures the cases give as a feed: the base need not use them. */
  mixturesUsedElsewhere?: ReadonlySet<string>;
  /** Say nothing of unused mixtures (a case's basis: the base says it once). */
  quietMixtures?: boolean;
}

export function interpret(reader: Reader, options: InterpretOptions = {}): InterpretedBasis | undefined {
  const document = readDocument(reader);
  const kind = readTechnology(reader);
  const conditionsRead = readConditions(reader, kind?.technology, kind?.mode);
  const mixtures = readMixtures(reader);
  const references = readReferences(reader);
  const assumptions = readAssumptions(reader);
  const sensitivity = readSensitivity(reader);
  if (!kind) {
    checkSources(reader);
    return undefined;
  }
  const { technology, mode } = kind;
  const cell = readCell(reader, technology, mode, conditionsRead.temperature);
  const streams = readStreams(reader, technology, mode, conditionsRead, mixtures);
  if (streams && !options.quietMixtures) {
    for (const name of mixtures.keys()) {
      if (options.mixturesUsedElsewhere?.has(name)) continue;
      if (!streams.feeds.some((f) => f.composition.origin === 'mixture' && f.composition.name === name)) {
        reader.findings.warning(['mixtures', name], `mixture ${name} is defined but no stream uses it`, 'key');
      }
    }
  }
  const rules = streamRules(technology, mode);
  const operatingPoint = readOperatingPoint(reader, mode, {
    allowed: rules['air-electrode'].role === 'sweep',
    feed: streams?.airElectrode != null,
  }, conversionName(technology, mode));
  const plant = readPlant(reader, technology, mode, conditionsRead);
  checkSources(reader);
  const { temperature, sweep, fuelPressureBar, airPressureBar } = conditionsRead;
  if (!document || !cell || !streams || !operatingPoint || !plant || !temperature || fuelPressureBar === undefined || airPressureBar === undefined) return undefined;
  const range = sweep ? { fromK: sweep.from.si, toK: sweep.to.si } : defaultSweep(temperature.si, streams.feeds, technology);
  const conditions: Conditions = {
    temperatureK: temperature.si,
    sweepFromK: range.fromK,
    sweepToK: range.toK,
    fuelInletTemperatureK: conditionsRead.fuelInlet?.si ?? temperature.si,
    airInletTemperatureK: conditionsRead.airInlet?.si ?? temperature.si,
    allowedAirTemperatureRiseK: conditionsRead.allowedAirTemperatureRiseK,
    fuelPressureBar,
    airPressureBar,
    ambientTemperatureK: conditionsRead.ambientTemperatureK,
  };
  return {
    document,
    cell,
    conditions,
    fuelElectrode: streams.fuelElectrode,
    airElectrode: streams.airElectrode,
    operatingPoint,
    plant,
    sensitivity,
    assumptions,
    references,
  };
}
