/**
 * The `cell:` section: technology (phosphoric-acid read as ht-pem) and a mode it supports
 * (lib/electrochem/data/technologies.yaml), the material notes, whether the fuel electrode
 * bears nickel (stated, else read from the fuel-electrode text, else the technology's usual
 * electrode), the ionic transference number in (0, 1], the crossover allowance and, for
 * alkaline cells (and only for them), the mass fraction of KOH in the electrolyte within the
 * range of the water-activity correlation (lib/thermo/koh-solution.ts, Balej 1985), at an
 * operating temperature within it too.
 */
import { technology, technologyIdOf, type Mode, type Technology } from '../electrochem/technologies.ts';
import { quotedList } from '../core/suggest.ts';
import { kohCorrelationRange } from '../thermo/koh-solution.ts';
import { kelvinText } from './read-conditions.ts';
import type { Read, Reader } from './reader.ts';
import type { CellInfo } from './types.ts';
import { withinLimit } from './limits.ts';

/** How the fuel-electrode text names nickel: "Ni-YSZ", "Ni cermet", "nickel". */
const NICKEL_TEXT = /\bni\b|nickel|Ni-/i;

/** Technology and mode, checked against each other; read first since every later section depends on them. */
export function readTechnology(reader: Reader): { technology: Technology; mode: Mode } | undefined {
  const name = reader.text(['cell', 'technology']);
  const mode = reader.text(['cell', 'mode']) as Mode | undefined;
  if (name === undefined || mode === undefined) return undefined;
  const id = technologyIdOf(name);
  if (id === undefined) return undefined;
  const tech = technology(id);
  if (!tech.modes.includes(mode)) {
    reader.findings.error(['cell', 'mode'], `${tech.id} cells (${tech.name}) run in ${quotedList(tech.modes)} mode only, not ${mode}`);
    return undefined;
  }
  return { technology: tech, mode };
}

function nickel(reader: Reader, tech: Technology, fuelElectrode: string | undefined): Pick<CellInfo, 'nickelBearing' | 'nickelBearingFrom'> {
  const stated = reader.flag(['cell', 'nickel-bearing']);
  if (stated !== undefined) return { nickelBearing: stated, nickelBearingFrom: 'stated' };
  if (fuelElectrode !== undefined) return { nickelBearing: NICKEL_TEXT.test(fuelElectrode), nickelBearingFrom: 'material text' };
  // Without either, the usual electrode of the technology: nickel where the fuel gas is re-equilibrated at the electrode.
  return { nickelBearing: tech.fuelGasEquilibrium, nickelBearingFrom: 'default' };
}

const KOH_PATH = ['cell', 'koh-mass-fraction'];

/** The KOH mass fraction of an alkaline cell: required there, refused elsewhere, within Balej's range (in wt % and in temperature). */
function readKohMassFraction(reader: Reader, tech: Technology, temperature: Read | undefined): number | undefined {
  if (tech.id !== 'alkaline') {
    if (reader.has(KOH_PATH)) reader.findings.error(KOH_PATH, `koh-mass-fraction applies to alkaline cells only; this cell is ${tech.id}`, 'key');
    return undefined;
  }
  const range = kohCorrelationRange();
  const percent = (w: number) => `${String(Number((w * 100).toFixed(1)))} %`;
  const read = reader.scalar(KOH_PATH, 'fraction', 'KOH mass fraction');
  if (!read) {
    if (!reader.has(KOH_PATH)) {
      reader.findings.error(KOH_PATH, `an alkaline cell needs the KOH mass fraction of its electrolyte, e.g. koh-mass-fraction: "30 %", for the water activity (Balej 1985, ${percent(range.lowMassFraction)} to ${percent(range.highMassFraction)})`, 'missing');
    }
    return undefined;
  }
  if (!(read.si >= range.lowMassFraction && read.si <= range.highMassFraction)) {
    reader.findings.error(read.at, `the KOH mass fraction must lie within the range of Balej's water-activity correlation (1985), ${percent(range.lowMassFraction)} to ${percent(range.highMassFraction)} (2 to 18 mol/kg), got ${read.text}`);
    return undefined;
  }
  if (temperature && !(temperature.si >= range.lowK && temperature.si <= range.highK)) {
    reader.findings.error(temperature.at, `an alkaline cell's water activity is known from ${kelvinText(range.lowK)} to ${kelvinText(range.highK)} (Balej 1985), got ${temperature.text}`);
  }
  return read.si;
}

export function readCell(reader: Reader, tech: Technology, mode: Mode, temperature?: Read): CellInfo | undefined {
  const fuelElectrode = reader.text(['cell', 'fuel-electrode']);
  const airElectrode = reader.text(['cell', 'air-electrode']);
  const electrolyte = reader.text(['cell', 'electrolyte']);
  const transference = reader.scalar(['cell', 'ionic-transference-number'], 'fraction', 'ionic transference number');
  let ionicTransferenceNumber = 1;
  if (transference) {
    if (!(transference.si > 0 && transference.si <= 1)) reader.findings.error(transference.at, `the ionic transference number lies in (0, 1], got ${transference.text}`);
    else if (withinLimit(reader.findings, 'ionic-transference-number', 'ionic transference number', transference)) ionicTransferenceNumber = transference.si;
  }
  const crossover = reader.scalar(['cell', 'crossover-allowance'], 'voltage', 'crossover allowance');
  if (crossover && crossover.si < 0) reader.findings.error(crossover.at, `the crossover allowance is a voltage lost, 0 or more, got ${crossover.text}`);
  else if (crossover) withinLimit(reader.findings, 'crossover-allowance', 'crossover allowance', crossover);
  const kohMassFraction = readKohMassFraction(reader, tech, temperature);
  return {
    technology: tech.id,
    mode,
    ...(fuelElectrode !== undefined ? { fuelElectrode } : {}),
    ...(airElectrode !== undefined ? { airElectrode } : {}),
    ...(electrolyte !== undefined ? { electrolyte } : {}),
    ...nickel(reader, tech, fuelElectrode),
    ionicTransferenceNumber,
    crossoverAllowanceV: crossover && crossover.si >= 0 ? crossover.si : 0,
    ...(kohMassFraction !== undefined ? { kohMassFraction } : {}),
  };
}
