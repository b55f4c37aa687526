/**
 * The one-screen summary of a validated basis that `cellbasis check` prints: label and value
 * rows, from the design inputs and the headline numbers the electrochemistry gives now (the
 * standard reversible and thermoneutral voltage of the hydrogen reaction at the operating
 * temperature, liquid water for cells that run with it). To show more numbers, add a row
 * source (a pure function of the basis) to `summaryRowSources`.
 */
import { technology } from '../electrochem/technologies.ts';
import { feedNames } from './stream-rules.ts';
import { evaluateReaction } from '../electrochem/reaction.ts';
import { TemperatureRangeError } from '../core/errors.ts';
import type { AirSupply, DesignBasis, StackSize, VoltageModel } from './types.ts';
import { kelvinWithCelsius } from '../core/temperature-text.ts';

export type SummaryRow = [label: string, value: string];

/** Significant digits without exponent for ordinary magnitudes. */
function num(value: number, digits = 4): string {
  return String(Number(value.toPrecision(digits)));
}

function temperature(kelvin: number): string {
  return kelvinWithCelsius(kelvin, (k) => num(k, 6), (c) => num(c, 5));
}

function composition(fractions: Readonly<Record<string, number>>): string {
  return Object.entries(fractions)
    .filter(([, x]) => x > 0)
    .sort((a, b) => b[1] - a[1])
    .map(([species, x]) => `${species} ${num(x * 100, 3)} %`)
    .join(', ');
}

function fuelTreatment(basis: DesignBasis): SummaryRow[] {
  const fuel = basis.fuelElectrode;
  if (!fuel || basis.cell.mode !== 'power') return [];
  const steam =
    fuel.steamToCarbon !== undefined ? `steam-to-carbon ${num(fuel.steamToCarbon)}` : fuel.steamPerMoleFuel !== undefined ? `${num(fuel.steamPerMoleFuel)} mol steam per mol fuel` : 'no steam added';
  const pre = fuel.preReforming;
  const reformer =
    pre.kind === 'equilibrium' ? `equilibrium pre-reformer at ${temperature(pre.temperatureK)}` : pre.kind === 'adiabatic' ? `adiabatic pre-reformer, inlet at ${temperature(pre.inletTemperatureK)}` : 'no pre-reformer';
  return [['fuel treatment', `${steam}; ${reformer}`]];
}

function air(supply: AirSupply): string {
  switch (supply.kind) {
    case 'utilization':
      return `air utilization ${num(supply.value * 100, 3)} %`;
    case 'ratio':
      return `air ratio ${num(supply.value)}`;
    case 'sweep-ratio':
      return `sweep ratio ${num(supply.value)} mol per mol O2`;
    case 'none':
      return 'no sweep gas';
  }
}

function voltage(model: VoltageModel): string {
  return model.kind === 'given' ? `cell voltage ${num(model.cellVoltageV)} V` : `area-specific resistance ${num(model.ohmM2 * 1e4)} ohm cm2`;
}

function stack(size: StackSize, areaM2: number, statedCells: number | undefined): string {
  const area = `${num(areaM2 * 1e4)} cm2 per cell`;
  const stated = statedCells !== undefined ? `, stated ${statedCells} cells` : '';
  switch (size.kind) {
    case 'cells':
      return `${size.cells} cells of ${area} (${num(size.cells * areaM2)} m2 active)`;
    case 'power':
      return `target ${num(size.powerW / 1000)} kW, ${area}${stated}`;
    case 'hydrogen':
      return `target ${num(size.kgPerS * 86400)} kg/day H2, ${area}${stated}`;
  }
}

/** The standard voltages of H2 + ½ O2 → H2O at the operating temperature. */
function headlineVoltages(basis: DesignBasis): SummaryRow[] {
  const liquid = technology(basis.cell.technology).waterPhase === 'liquid';
  const reaction = `H2 + 0.5 O2 -> ${liquid ? 'H2O(L)' : 'H2O'}`;
  const at = `${reaction} at ${num(basis.conditions.temperatureK, 6)} K, 1 bar`;
  try {
    const r = evaluateReaction(reaction, basis.conditions.temperatureK);
    return [
      ['standard reversible voltage', `${num(r.reversibleVoltage_V, 5)} V (${at})`],
      ['standard thermoneutral voltage', `${num(r.thermoneutralVoltage_V, 5)} V`],
    ];
  } catch (error) {
    if (error instanceof TemperatureRangeError) return [['standard voltages', `not available: ${error.message}`]];
    throw error;
  }
}

/** The row sources, in the order their rows are shown. */
const summaryRowSources: readonly ((basis: DesignBasis) => SummaryRow[])[] = [
  (b) => rows(b, feedNames(b.cell.technology, b.cell.mode)),
  headlineVoltages,
];

/** The air-electrode feed as given, or the cathode-gas loop that makes it (its burner air and inlet O2). */
function airFeed(stream: NonNullable<DesignBasis['airElectrode']>): string {
  if (!stream.cathodeLoop) return composition(stream.composition);
  return `cathode-gas loop: O2 ${num(stream.cathodeLoop.inletOxygenFraction * 100, 3)} % at the inlet; burner air ${composition(stream.composition)}`;
}

function rows(b: DesignBasis, names: ReturnType<typeof feedNames>): SummaryRow[] {
  return [
    ['project', `${b.id}: ${b.document.title}`],
    ['document', b.document.number],
    ['technology', `${technology(b.cell.technology).name}, ${b.cell.mode} mode`],
    ['operating temperature', temperature(b.conditions.temperatureK)],
    ['pressures', `fuel electrode ${num(b.conditions.fuelPressureBar)} bar, air electrode ${num(b.conditions.airPressureBar)} bar (absolute)`],
    [names.fuel, b.fuelElectrode ? composition(b.fuelElectrode.feed) : 'none'],
    [names.air, b.airElectrode ? airFeed(b.airElectrode) : 'none'],
    ...fuelTreatment(b),
    [names.conversion, `${num(b.operatingPoint.utilization * 100, 3)} %`],
    ['air supply', air(b.operatingPoint.air)],
    ['current density', `${num(b.operatingPoint.currentDensityAPerM2 / 1e4)} A/cm2`],
    ['voltage model', voltage(b.operatingPoint.voltage)],
    ['stack size', stack(b.operatingPoint.size, b.operatingPoint.activeAreaM2, b.operatingPoint.statedCells)],
    ['open assumptions', `${b.assumptions.filter((a) => a.open).length} of ${b.assumptions.length}`],
  ];
}

export function basisSummaryRows(basis: DesignBasis): SummaryRow[] {
  return summaryRowSources.flatMap((source) => source(basis));
}
