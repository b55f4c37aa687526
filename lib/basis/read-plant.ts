/**
 * `plant:`: the plant around the stack. Every block is optional and checked where it is
 * written: counts are positive whole numbers, temperatures above absolute zero (feed water and a
 * compressor inlet above 0 °C, where water is liquid), fractions in their ranges, a bus window
 * that ends above where it starts, a delivery pressure above the hydrogen side's. Blocks that
 * belong to the other mode, or to cells that do not reform at the fuel electrode (the anode
 * recycle), are refused at their key. What only the calculation can judge (an exit temperature
 * above the exhaust's, a window no string fits) is refused by it, at the same fields
 * (lib/plant/located-error.ts). Defaults: feeds at the ambient temperature, no recycle, no
 * oxidiser, no heat recovery, no heat loss, electric heat supply, no compression, no recuperator.
 */
import { PA_PER_BAR, STANDARD_ATMOSPHERE_PA } from '../thermo/constants.ts';

const STANDARD_ATMOSPHERE_BAR = STANDARD_ATMOSPHERE_PA / PA_PER_BAR;
import { ZERO_CELSIUS_K as ZERO_C } from '../core/units.ts';
import type { Mode, Technology } from '../electrochem/technologies.ts';
import { kelvinText, readTemperature } from './read-conditions.ts';
import { withinLimit, type LimitedInput } from './limits.ts';
import type { Path } from './diagnostics.ts';
import type { Read, Reader } from './reader.ts';
import type { CompressionInput, ElectricalInput, OffGasOxidant, PlantInput } from './types.ts';

const P = (...keys: string[]): Path => ['plant', ...keys];

/** Keys of the section that belong to one mode only, with the mode. */
const MODE_OF: Record<string, Mode> = {
  'anode-recycle': 'power',
  'off-gas-oxidiser': 'power',
  'heat-recovery': 'power',
  'air-blower': 'power',
  'heat-supply': 'electrolysis',
  'hydrogen-compression': 'electrolysis',
  recuperator: 'electrolysis',
};

/** The read when it lies within the input's limit of data/limits.yaml, else undefined with the error at its value. */
function limited(reader: Reader, read: Read | undefined, input: LimitedInput, label: string): Read | undefined {
  return read && withinLimit(reader.findings, input, label, read) ? read : undefined;
}

/** A positive whole number within the input's limits, or undefined with the error at its value. */
function count(reader: Reader, path: Path, label: string, input: LimitedInput): number | undefined {
  const read = reader.number(path, label);
  if (!read) return undefined;
  if (!Number.isInteger(read.si) || read.si < 1) {
    reader.findings.error(read.at, `the ${label} must be a whole number, 1 or more, got ${read.text}`);
    return undefined;
  }
  return limited(reader, read, input, label)?.si;
}

/** A fraction inside the range `check` allows (worded by `rule`) and the input's limits, or undefined. */
function share(reader: Reader, path: Path, label: string, check: (x: number) => boolean, rule: string, input: LimitedInput): Read | undefined {
  const read = reader.scalar(path, 'fraction', label);
  if (read && !check(read.si)) {
    reader.findings.error(read.at, `the ${label} ${rule}, got ${read.text}`);
    return undefined;
  }
  return limited(reader, read, input, label);
}

/** A temperature above absolute zero and within the input's limits, or undefined. */
function temperature(reader: Reader, path: Path, label: string, input: LimitedInput): Read | undefined {
  return limited(reader, readTemperature(reader, path, label), input, label);
}

/** A temperature at which water is liquid at 1 atm or above: from 0 °C, within the input's limits. */
function liquidWaterTemperature(reader: Reader, path: Path, label: string, input: LimitedInput): Read | undefined {
  const read = readTemperature(reader, path, label);
  if (read && read.si < ZERO_C) {
    reader.findings.error(read.at, `the ${label} must be 0 °C or above, where the water is liquid, got ${read.text}`);
    return undefined;
  }
  return limited(reader, read, input, label);
}

function electrical(reader: Reader): ElectricalInput | undefined {
  const at = (key: string) => P('electrical', key);
  const cellsPerStack = count(reader, at('cells-per-stack'), 'number of cells per stack', 'electrical-count');
  const stacksInSeries = count(reader, at('stacks-in-series'), 'number of stacks in series', 'electrical-count');
  const strings = count(reader, at('strings-in-parallel'), 'number of strings in parallel', 'electrical-count');
  let window: ElectricalInput['busVoltageWindowV'];
  if (reader.has(at('dc-bus-window'))) {
    if (reader.has(at('stacks-in-series'))) {
      reader.findings.error(at('dc-bus-window'), 'give stacks-in-series or dc-bus-window, not both', 'key');
      return undefined;
    }
    const bus = (key: 'from' | 'to', label: string) => limited(reader, reader.scalar([...at('dc-bus-window'), key], 'voltage', label), 'bus-voltage', label);
    const from = bus('from', 'lowest DC bus voltage');
    const to = bus('to', 'highest DC bus voltage');
    if (!from || !to) return undefined;
    if (!(to.si > from.si)) {
      reader.findings.error(to.at, `the DC bus window must end above where it starts (${from.text}), got ${to.text}`);
      return undefined;
    }
    window = { minV: from.si, maxV: to.si };
  }
  for (const [key, value] of [['cells-per-stack', cellsPerStack], ['stacks-in-series', stacksInSeries], ['strings-in-parallel', strings]] as const) {
    if (reader.has(at(key)) && value === undefined) return undefined;
  }
  return {
    ...(cellsPerStack !== undefined ? { cellsPerStack } : {}),
    ...(stacksInSeries !== undefined ? { stacksInSeries } : {}),
    ...(window ? { busVoltageWindowV: window } : {}),
    ...(strings !== undefined ? { stringsInParallel: strings } : {}),
  };
}

function recycle(reader: Reader, tech: Technology): PlantInput['anodeRecycle'] | undefined {
  if (!reader.has(P('anode-recycle'))) return null;
  if (!tech.fuelGasEquilibrium) {
    reader.findings.error(
      P('anode-recycle'),
      `the anode recycle applies to cells that reform at the fuel electrode (solid-oxide, proton-ceramic, molten-carbonate), not to ${tech.id}`,
      'key',
    );
    return undefined;
  }
  const ratio = share(reader, P('anode-recycle', 'ratio'), 'recycle ratio', (x) => x > 0 && x < 1, 'lies in (0, 1)', 'recycle-ratio');
  const tolerance = reader.has(P('anode-recycle', 'tolerance'))
    ? share(reader, P('anode-recycle', 'tolerance'), 'recycle tolerance', (x) => x > 0, 'must be above zero', 'recycle-tolerance')
    : undefined;
  if (!ratio || (reader.has(P('anode-recycle', 'tolerance')) && !tolerance)) return undefined;
  return { ratio: ratio.si, tolerance: tolerance?.si ?? 1e-9 };
}

/** Where a carbonate cell's cathode-gas loop stands (lib/basis/read-air-stream.ts): its burner is the plant's off-gas oxidiser. */
const LOOP = ['streams', 'air-electrode', 'cathode-loop'];

function oxidiser(reader: Reader): PlantInput['offGasOxidiser'] | undefined {
  const at = (key: string) => P('off-gas-oxidiser', key);
  if (!reader.has(P('off-gas-oxidiser'))) return null;
  if (reader.has(LOOP)) {
    reader.findings.error(P('off-gas-oxidiser'), "the cathode-gas loop's burner burns the fuel-electrode off-gas (streams.air-electrode.cathode-loop): remove plant.off-gas-oxidiser, which would burn it a second time", 'key');
    return undefined;
  }
  const kind = reader.text(at('oxidant')) as OffGasOxidant['kind'] | undefined;
  const limit = temperature(reader, at('material-limit'), 'material limit of the oxidiser', 'oxidiser-material-limit');
  let oxidant: OffGasOxidant | undefined;
  if (kind === 'fresh-air') {
    if (!reader.has(at('air-ratio'))) reader.findings.error(at('air-ratio'), 'fresh air needs air-ratio: oxygen fed per oxygen that complete combustion of the off-gas needs, e.g. 1.5', 'missing');
    const ratio = share(reader, at('air-ratio'), 'air ratio of the oxidiser', (x) => x > 1, 'must be above 1 (more oxygen than complete combustion needs)', 'oxidiser-air-ratio');
    if (ratio) oxidant = { kind, airRatio: ratio.si };
  } else if (kind === 'air-electrode-exhaust') {
    if (reader.has(at('air-ratio'))) reader.findings.error(at('air-ratio'), 'air-ratio applies to fresh air; the air-electrode exhaust is burnt with the off-gas as it comes', 'key');
    else oxidant = { kind };
  }
  if (!oxidant || !limit) return undefined;
  return { oxidant, materialLimitK: limit.si };
}

function heatRecovery(reader: Reader): PlantInput['heatRecovery'] | undefined {
  const at = (key: string) => P('heat-recovery', key);
  if (!reader.has(P('heat-recovery'))) return null;
  // A cathode-gas loop's burner takes the oxidiser's place: the heat recovery cools the exhaust the loop does not recycle.
  if (!reader.has(P('off-gas-oxidiser')) && !reader.has(LOOP)) {
    reader.findings.error(P('heat-recovery'), "the heat recovery cools the oxidiser's exhaust: give plant.off-gas-oxidiser too", 'key');
    return undefined;
  }
  const exit = liquidWaterTemperature(reader, at('exhaust-exit-temperature'), 'exhaust exit temperature', 'exhaust-exit-temperature');
  const approach = limited(reader, reader.scalar(at('minimum-approach'), 'temperature-difference', 'minimum approach temperature'), 'minimum-approach', 'minimum approach temperature');
  const stackHeat = (reader.text(at('stack-heat')) as 'recovered' | 'rejected' | undefined) ?? 'rejected';
  if (!exit || (reader.has(at('minimum-approach')) && !approach)) return undefined;
  return { exhaustExitTemperatureK: exit.si, stackHeat, minimumApproachK: approach?.si ?? 20 };
}

/** The air blower: from its inlet pressure (default the ambient pressure, itself by default the standard atmosphere, 1.01325 bar, ISO 2533) to the air-electrode pressure. */
function blower(reader: Reader, airPressureBar: number | undefined, ambientPressureBar: number | undefined): PlantInput['airBlower'] | undefined {
  const at = (key: string) => P('air-blower', key);
  if (!reader.has(P('air-blower'))) return null;
  const efficiency = share(reader, at('isentropic-efficiency'), 'isentropic efficiency of the blower', (x) => x > 0 && x <= 1, 'lies in (0, 1]', 'isentropic-efficiency');
  const inlet = reader.has(at('inlet-pressure')) ? limited(reader, reader.scalar(at('inlet-pressure'), 'pressure', 'blower inlet pressure'), 'pressure', 'blower inlet pressure') : undefined;
  if (!efficiency || (reader.has(at('inlet-pressure')) && !inlet)) return undefined;
  const inletBar = inlet ? inlet.si / PA_PER_BAR : (ambientPressureBar ?? STANDARD_ATMOSPHERE_BAR);
  if (airPressureBar !== undefined && !(airPressureBar > inletBar)) {
    reader.findings.error(
      inlet?.at ?? P('air-blower'),
      `the blower must raise the air to the air-electrode pressure (${String(Number(airPressureBar.toPrecision(6)))} bar), above its inlet pressure ${String(Number(inletBar.toPrecision(6)))} bar`,
      inlet ? 'value' : 'key',
    );
    return undefined;
  }
  return { isentropicEfficiency: efficiency.si, inletPressureBar: inletBar };
}

function compression(reader: Reader, fuelPressureBar: number | undefined): CompressionInput | null | undefined {
  const at = (key: string) => P('hydrogen-compression', key);
  if (!reader.has(P('hydrogen-compression'))) return null;
  const delivery = limited(reader, reader.scalar(at('delivery-pressure'), 'pressure', 'hydrogen delivery pressure'), 'pressure', 'hydrogen delivery pressure');
  if (delivery && fuelPressureBar !== undefined && !(delivery.si / PA_PER_BAR > fuelPressureBar)) {
    reader.findings.error(delivery.at, `the delivery pressure must be above the hydrogen side's pressure (conditions.fuel-electrode-pressure, ${String(Number(fuelPressureBar.toPrecision(6)))} bar), got ${delivery.text}`);
    return undefined;
  }
  const stages = reader.has(at('stages')) ? count(reader, at('stages'), 'number of compression stages', 'compression-stages') : undefined;
  const ratio = reader.has(at('maximum-stage-ratio')) ? limited(reader, reader.number(at('maximum-stage-ratio'), 'maximum stage pressure ratio'), 'compression-stage-ratio', 'maximum stage pressure ratio') : undefined;
  const discharge = reader.has(at('maximum-discharge-temperature')) ? limited(reader, readTemperature(reader, at('maximum-discharge-temperature'), 'maximum discharge temperature'), 'compressor-discharge-temperature', 'maximum discharge temperature') : undefined;
  if (reader.has(at('stages')) ? reader.has(at('maximum-stage-ratio')) : !reader.has(at('maximum-stage-ratio')) && !reader.has(at('maximum-discharge-temperature'))) {
    reader.findings.error(P('hydrogen-compression'), 'give the compression stages either as stages (a whole number) or by a rule they follow from: maximum-stage-ratio, maximum-discharge-temperature or both; stages and maximum-stage-ratio not together', 'key');
    return undefined;
  }
  const efficiency = share(reader, at('isentropic-efficiency'), 'isentropic efficiency', (x) => x > 0 && x <= 1, 'lies in (0, 1]', 'isentropic-efficiency');
  const inlet = reader.has(at('inlet-temperature')) ? liquidWaterTemperature(reader, at('inlet-temperature'), 'compressor inlet temperature', 'compressor-gas-temperature') : undefined;
  const intercool = reader.has(at('intercooling-temperature')) ? liquidWaterTemperature(reader, at('intercooling-temperature'), 'intercooling temperature', 'compressor-gas-temperature') : undefined;
  const unread = (key: string, read: unknown) => reader.has(at(key)) && !read;
  if (!delivery || !efficiency || ['stages', 'maximum-stage-ratio', 'maximum-discharge-temperature', 'inlet-temperature', 'intercooling-temperature'].some((key, i) => unread(key, [stages, ratio, discharge, inlet, intercool][i]))) return undefined;
  const inletK = inlet?.si ?? ZERO_C + 40;
  const intercoolK = intercool?.si ?? inletK;
  if (discharge && !(discharge.si > Math.max(inletK, intercoolK))) {
    reader.findings.error(discharge.at, `the maximum discharge temperature must lie above the temperatures the stages take the gas at (inlet ${kelvinText(inletK)}, intercooled to ${kelvinText(intercoolK)}), got ${discharge.text}`);
    return undefined;
  }
  return {
    deliveryPressureBar: delivery.si / PA_PER_BAR,
    stages: stages !== undefined ? { given: stages } : { maximumStageRatio: ratio?.si ?? null },
    maximumDischargeTemperatureK: discharge?.si ?? null,
    isentropicEfficiency: efficiency.si,
    inletTemperatureK: inletK,
    intercoolTemperatureK: intercoolK,
  };
}

/** The feed recuperator: cells fed with steam only (its cold side is gas); the least approach within its limits. */
function recuperator(reader: Reader, tech: Technology): PlantInput['recuperator'] | undefined {
  if (!reader.has(P('recuperator'))) return null;
  if (tech.waterPhase !== 'gas') {
    reader.findings.error(P('recuperator'), `the recuperator heats the steam and sweep gas of cells fed with steam (solid-oxide, proton-ceramic) with their hot outlets; ${tech.id} cells are fed liquid water`, 'key');
    return undefined;
  }
  const approach = limited(reader, reader.scalar(P('recuperator', 'minimum-approach'), 'temperature-difference', 'minimum approach temperature of the recuperator'), 'minimum-approach', 'minimum approach temperature of the recuperator');
  return approach ? { minimumApproachK: approach.si } : undefined;
}

/** The `plant:` section with its defaults; undefined when a block written in it is wrong. */
export function readPlant(reader: Reader, tech: Technology, mode: Mode, conditions: { ambientTemperatureK: number; ambientPressureBar: number | undefined; fuelPressureBar?: number; airPressureBar?: number }): PlantInput | undefined {
  for (const [key, only] of Object.entries(MODE_OF)) {
    if (only !== mode && reader.has(P(key))) {
      reader.findings.error(P(key), `${key} belongs to ${only === 'power' ? 'power mode' : 'electrolysis'}; this basis is in ${mode === 'power' ? 'power mode' : 'electrolysis'}`, 'key');
    }
  }
  const other = (key: string) => MODE_OF[key] !== undefined && MODE_OF[key] !== mode;
  const layout = electrical(reader);
  const supply = (key: 'fuel' | 'air', label: string) => temperature(reader, P('feed-temperatures', key), label, 'feed-temperature');
  const fuel = supply('fuel', 'fuel supply temperature');
  const air = supply('air', 'air supply temperature');
  const water = liquidWaterTemperature(reader, P('feed-temperatures', 'water'), 'feed-water temperature', 'feed-water-temperature');
  const loss = share(reader, P('heat-loss'), 'heat loss', (x) => x >= 0 && x < 1, 'lies in [0, 1)', 'heat-loss');
  const values = {
    anodeRecycle: other('anode-recycle') ? null : recycle(reader, tech),
    offGasOxidiser: other('off-gas-oxidiser') ? null : oxidiser(reader),
    heatRecovery: other('heat-recovery') ? null : heatRecovery(reader),
    airBlower: other('air-blower') ? null : blower(reader, conditions.airPressureBar, conditions.ambientPressureBar),
    hydrogenCompression: other('hydrogen-compression') ? null : compression(reader, conditions.fuelPressureBar),
    recuperator: other('recuperator') ? null : recuperator(reader, tech),
  };
  const failed = (key: string, read: unknown) => reader.has(P(...key.split('.'))) && read === undefined;
  if (
    !layout ||
    failed('feed-temperatures.fuel', fuel) ||
    failed('feed-temperatures.air', air) ||
    failed('feed-temperatures.water', water) ||
    failed('heat-loss', loss) ||
    Object.values(values).some((v) => v === undefined)
  ) {
    return undefined;
  }
  const ambient = conditions.ambientTemperatureK;
  return {
    electrical: layout,
    fuelSupplyTemperatureK: fuel?.si ?? ambient,
    airSupplyTemperatureK: air?.si ?? ambient,
    feedWaterTemperatureK: water?.si ?? Math.max(ambient, ZERO_C),
    anodeRecycle: values.anodeRecycle!,
    offGasOxidiser: values.offGasOxidiser!,
    heatRecovery: values.heatRecovery!,
    airBlower: values.airBlower!,
    heatLossFraction: loss?.si ?? 0,
    heatSupply: mode === 'electrolysis' ? ((reader.text(P('heat-supply')) as 'electric' | 'external' | undefined) ?? 'electric') : 'electric',
    hydrogenCompression: values.hydrogenCompression!,
    recuperator: values.recuperator!,
  };
}
