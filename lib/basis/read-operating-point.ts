/**
 * `operating-point:`: utilization (fuel-utilization in power mode, steam-conversion in
 * electrolysis), the air supply (air-utilization or air-ratio in power mode; sweep-ratio or
 * nothing in electrolysis), current density, the voltage model (cell-voltage or
 * area-specific-resistance, with its temperature law and degradation), the activation loss, active area, and the stack size: cells and/or a target. When both
 * a cell count and a target are given, both are kept (statedCells) and the calculation checks
 * that they agree within 2 %, since only it knows the power per cell.
 */
import type { Mode } from '../electrochem/technologies.ts';
import type { Path } from './diagnostics.ts';
import type { Read, Reader } from './reader.ts';
import type { ActivationLoss, AirSupply, Degradation, DegradedQuantity, OperatingPoint, ResistanceLaw, StackSize, VoltageModel } from './types.ts';
import { readTemperature } from './read-conditions.ts';
import type { Dimension } from '../core/units.ts';
import { airUtilizationProblem, limitProblem, withinLimit, type LimitedInput } from './limits.ts';

const OP = (key: string): Path => ['operating-point', key];

type Check = (si: number) => boolean;

const positive: Check = (x) => x > 0;
const openUnit: Check = (x) => x > 0 && x < 1;

/**
 * Reads a scalar and checks its range (`rule` words it for the message), then its limits of
 * data/limits.yaml (or a limit derived from them, given as a function).
 */
function bounded(reader: Reader, key: string, dimension: Dimension, label: string, check: Check, rule: string, limited: LimitedInput | ((read: Read) => string | undefined)): Read | undefined {
  const read = reader.scalar(OP(key), dimension, label);
  if (read && !check(read.si)) {
    reader.findings.error(read.at, `the ${label} ${rule}, got ${read.text}`);
    return undefined;
  }
  const beyond = read && (typeof limited === 'function' ? limited(read) : limitProblem(limited, label, read));
  if (beyond) {
    reader.findings.error(read!.at, beyond);
    return undefined;
  }
  return read;
}

/**
 * Which one of `keys` is written: an error when several are, and when none is but one is
 * required. Keys not allowed in this mode are refused with `refusal`.
 */
function oneOf(reader: Reader, keys: string[], required: string | undefined, refused: Record<string, string>): string | undefined {
  for (const [key, why] of Object.entries(refused)) if (reader.has(OP(key))) reader.findings.error(OP(key), why, 'key');
  const given = keys.filter((k) => reader.has(OP(k)));
  if (given.length > 1) {
    reader.findings.error(OP(given[1]!), `give ${keys.join(' or ')}, not both`, 'key');
    return undefined;
  }
  if (given.length === 0 && required) reader.findings.error(OP(keys[0]!), required, 'missing');
  return given[0];
}

function utilization(reader: Reader, mode: Mode, label: string): number | undefined {
  const [key, other] = mode === 'power' ? ['fuel-utilization', 'steam-conversion'] : ['steam-conversion', 'fuel-utilization'];
  const required = reader.has(OP(other)) ? undefined : `${mode} mode needs ${key}, a fraction such as 0.8 or "80 %"`;
  const given = oneOf(reader, [key], required, {
    [other]: `${other} belongs to ${mode === 'power' ? 'electrolysis' : 'power mode'}; in ${mode} mode give ${key}`,
  });
  return given ? bounded(reader, key, 'fraction', label, openUnit, 'lies strictly between 0 and 1', 'utilization')?.si : undefined;
}

function airSupply(reader: Reader, mode: Mode, sweep: { allowed: boolean; feed: boolean }): AirSupply | undefined {
  if (mode === 'power') {
    const given = oneOf(reader, ['air-utilization', 'air-ratio'], 'power mode needs air-utilization (e.g. 0.25) or air-ratio (e.g. 4)', {
      'sweep-ratio': 'sweep-ratio belongs to electrolysis; in power mode give air-utilization or air-ratio',
    });
    if (given === 'air-utilization') {
      const read = bounded(reader, given, 'fraction', 'air utilization', openUnit, 'lies strictly between 0 and 1', airUtilizationProblem);
      return read && { kind: 'utilization', value: read.si };
    }
    if (given === 'air-ratio') {
      const read = bounded(reader, given, 'fraction', 'air ratio', (x) => x > 1, 'must be above 1 (more oxygen fed than consumed)', 'air-ratio');
      return read && { kind: 'ratio', value: read.si };
    }
    return undefined;
  }
  const refused = Object.fromEntries(['air-utilization', 'air-ratio'].map((k) => [k, `${k} belongs to power mode; in electrolysis give sweep-ratio for a sweep gas, or nothing`]));
  if (!sweep.allowed) refused['sweep-ratio'] = 'sweep-ratio applies to a sweep gas at the air electrode, which this technology does not take in electrolysis';
  const given = oneOf(reader, sweep.allowed ? ['sweep-ratio'] : [], undefined, refused);
  if (!sweep.allowed) return { kind: 'none' };
  if (given && !sweep.feed) {
    reader.findings.error(OP('sweep-ratio'), 'sweep-ratio needs the sweep gas under streams.air-electrode', 'key');
    return undefined;
  }
  if (!given && sweep.feed) {
    reader.findings.error(OP('sweep-ratio'), 'the sweep gas of streams.air-electrode needs sweep-ratio (sweep-gas moles per mole of O2 produced)', 'missing');
    return undefined;
  }
  if (!given) return { kind: 'none' };
  const read = bounded(reader, 'sweep-ratio', 'fraction', 'sweep ratio', positive, 'must be above zero', 'sweep-ratio');
  return read && { kind: 'sweep-ratio', value: read.si };
}

function voltage(reader: Reader): VoltageModel | undefined {
  const given = oneOf(reader, ['cell-voltage', 'area-specific-resistance'], 'give cell-voltage (e.g. "0.80 V") or area-specific-resistance (e.g. "0.35 ohm cm2")', {});
  if (given === 'cell-voltage') {
    const read = bounded(reader, given, 'voltage', 'cell voltage', positive, 'must be above zero', 'cell-voltage');
    return read && { kind: 'given', cellVoltageV: read.si };
  }
  if (given === 'area-specific-resistance') {
    const read = bounded(reader, given, 'area-specific-resistance', 'area-specific resistance', positive, 'must be above zero', 'area-specific-resistance');
    return read && { kind: 'area-specific-resistance', ohmM2: read.si };
  }
  return undefined;
}

/** `resistance-temperature-law`: activation energy and reference temperature within their limits, a reference temperature only where the basis gives the resistance, and a source. */
function resistanceLaw(reader: Reader, voltage: VoltageModel | undefined): ResistanceLaw | null | undefined {
  const at = OP('resistance-temperature-law');
  if (!reader.has(at)) return null;
  // The law's one source stands for both of its values in the inputs table.
  const source = reader.source([...at, 'source']);
  const energy = reader.scalar([...at, 'activation-energy'], 'molar-energy', 'activation energy of the resistance', source);
  if (energy) {
    const beyond = energy.si < 0 ? `the activation energy is 0 or more (a resistance that rises with temperature is not modelled), got ${energy.text}` : limitProblem('activation-energy', 'activation energy', energy);
    if (beyond) {
      reader.findings.error(energy.at, beyond);
      return undefined;
    }
  }
  let reference: number | undefined;
  if (reader.has([...at, 'reference-temperature'])) {
    if (voltage?.kind === 'given') {
      reader.findings.error(
        [...at, 'reference-temperature'],
        'with cell-voltage given the law scales the resistance implied at the operating temperature: omit reference-temperature (it applies to area-specific-resistance)',
        'key',
      );
      return undefined;
    }
    const read = readTemperature(reader, [...at, 'reference-temperature'], 'reference temperature of the resistance', source);
    if (!read || !withinLimit(reader.findings, 'resistance-reference-temperature', 'reference temperature of the resistance', read)) return undefined;
    reference = read.si;
  }
  if (!energy || source === undefined) return undefined;
  return { activationEnergyJPerMol: energy.si, ...(reference !== undefined ? { referenceTemperatureK: reference } : {}), source };
}

/** `activation-loss`: a positive Tafel slope and exchange current density within their limits, and a source for both. */
function activationLoss(reader: Reader): ActivationLoss | null | undefined {
  const at = OP('activation-loss');
  if (!reader.has(at)) return null;
  // The one source stands for both values in the inputs table.
  const source = reader.source([...at, 'source']);
  const within = (key: 'tafel-slope' | 'exchange-current-density', dimension: Dimension, label: string) => {
    const read = reader.scalar([...at, key], dimension, label, source);
    const problem = read && (read.si > 0 ? limitProblem(key, label, read) : `the ${label} must be above zero, got ${read.text}`);
    if (problem) reader.findings.error(read!.at, problem);
    return problem ? undefined : read;
  };
  const slope = within('tafel-slope', 'voltage', 'Tafel slope');
  const exchange = within('exchange-current-density', 'current-density', 'exchange current density');
  if (!slope || !exchange || source === undefined) return undefined;
  return { tafelSlopeVPerDecade: slope.si, exchangeCurrentDensityAPerM2: exchange.si, source };
}

/**
 * `degradation`: a rate and an operating time within their limits, and, for the cell voltage in
 * power mode, a loss r t below the whole voltage.
 */
function degradation(reader: Reader, mode: Mode): Degradation | null | undefined {
  const at = OP('degradation');
  if (!reader.has(at)) return null;
  const of = reader.text([...at, 'of']) as DegradedQuantity | undefined;
  const rate = reader.scalar([...at, 'rate'], 'degradation-rate', 'degradation rate');
  const time = reader.scalar([...at, 'operating-time'], 'time', 'operating time');
  const beyond = (read: Read | undefined, input: 'degradation-rate' | 'operating-time', label: string) => {
    const problem = read && (read.si < 0 ? `the ${label} is 0 or more, got ${read.text}` : limitProblem(input, label, read));
    if (problem) reader.findings.error(read!.at, problem);
    return problem ? undefined : read;
  };
  const r = beyond(rate, 'degradation-rate', 'degradation rate');
  const t = beyond(time, 'operating-time', 'operating time');
  if (!of || !r || !t) return undefined;
  if (of === 'cell-voltage' && mode === 'power' && r.si * t.si >= 1) {
    reader.findings.error(
      t.at,
      `a cell voltage falling by ${r.text} for ${t.text} loses ${String(Number((r.si * t.si * 100).toPrecision(4)))} % of it: nothing would be left (the linear law holds only for a loss well below the whole voltage)`,
    );
    return undefined;
  }
  return { of, ratePerS: r.si, operatingTimeS: t.si };
}

function size(reader: Reader, mode: Mode): { size: StackSize; statedCells?: number } | undefined {
  const refused: Record<string, string> = mode === 'power' ? { 'target-hydrogen': 'target-hydrogen belongs to electrolysis; in power mode give target-power or cells' } : {};
  const target = oneOf(reader, mode === 'power' ? ['target-power'] : ['target-power', 'target-hydrogen'], undefined, refused);
  const hasCells = reader.has(OP('cells'));
  if (!target && !hasCells && !reader.has(OP('target-hydrogen'))) {
    reader.findings.error(OP('cells'), `give cells, target-power${mode === 'electrolysis' ? ' or target-hydrogen' : ''} (or cells and a target)`, 'missing');
    return undefined;
  }
  const cells = bounded(reader, 'cells', 'fraction', 'number of cells', (x) => Number.isInteger(x) && x > 0, 'must be a positive whole number', 'cells');
  if (hasCells && !cells) return undefined;
  if (!target) return cells && { size: { kind: 'cells', cells: cells.si } };
  const power = target === 'target-power';
  const read = bounded(reader, target, power ? 'power' : 'mass-flow', power ? 'target power' : 'target hydrogen production', positive, 'must be above zero', power ? 'target-power' : 'target-hydrogen');
  if (!read) return undefined;
  const sized: StackSize = target === 'target-power' ? { kind: 'power', powerW: read.si } : { kind: 'hydrogen', kgPerS: read.si };
  return { size: sized, ...(cells ? { statedCells: cells.si } : {}) };
}

/** The balance-of-plant share of the stack DC power, in [0, 1) (default 0). */
function parasitic(reader: Reader): number | undefined {
  if (!reader.has(OP('parasitic-load'))) return 0;
  return bounded(reader, 'parasitic-load', 'fraction', 'parasitic load', (x) => x >= 0 && x < 1, 'lies in [0, 1)', 'parasitic-load')?.si;
}

/** The inverter or rectifier efficiency, in (0, 1] (default 1); in power mode it must exceed the parasitic share, or nothing would be left. */
function conversion(reader: Reader, mode: Mode, parasiticFraction: number | undefined): number | undefined {
  if (!reader.has(OP('power-conversion-efficiency'))) return 1;
  const read = bounded(reader, 'power-conversion-efficiency', 'fraction', 'power-conversion efficiency', (x) => x > 0 && x <= 1, 'lies in (0, 1]', 'power-conversion-efficiency');
  if (read && mode === 'power' && parasiticFraction !== undefined && read.si <= parasiticFraction) {
    reader.findings.error(read.at, `the power-conversion efficiency must exceed the parasitic load (${parasiticFraction}), or the plant would deliver no power, got ${read.text}`);
    return undefined;
  }
  return read?.si;
}

export function readOperatingPoint(reader: Reader, mode: Mode, sweep: { allowed: boolean; feed: boolean }, conversionLabel: string): OperatingPoint | undefined {
  const values = {
    utilization: utilization(reader, mode, conversionLabel),
    air: airSupply(reader, mode, sweep),
    currentDensity: bounded(reader, 'current-density', 'current-density', 'current density', positive, 'must be above zero', 'current-density'),
    voltage: voltage(reader),
    activeArea: bounded(reader, 'active-area', 'area', 'active area', positive, 'must be above zero', 'active-area'),
    size: size(reader, mode),
    parasiticFraction: parasitic(reader),
  };
  const { utilization: u, air, currentDensity, voltage: v, activeArea, size: s, parasiticFraction } = values;
  const law = resistanceLaw(reader, v);
  const aged = degradation(reader, mode);
  const kinetic = activationLoss(reader);
  const conversionEfficiency = conversion(reader, mode, parasiticFraction);
  if (u === undefined || !air || !currentDensity || !v || law === undefined || aged === undefined || kinetic === undefined || !activeArea || !s || parasiticFraction === undefined || conversionEfficiency === undefined) return undefined;
  return {
    utilization: u,
    air,
    currentDensityAPerM2: currentDensity.si,
    voltage: v,
    ...(law ? { resistanceLaw: law } : {}),
    ...(kinetic ? { activationLoss: kinetic } : {}),
    ...(aged ? { degradation: aged } : {}),
    activeAreaM2: activeArea.si,
    size: s.size,
    ...(s.statedCells !== undefined ? { statedCells: s.statedCells } : {}),
    parasiticFraction,
    conversionEfficiency,
  };
}
