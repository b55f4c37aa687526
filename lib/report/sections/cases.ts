/**
 * The section on the operating cases (results.cases, results.envelope): what each case is and
 * changes, with its sources; the headline numbers of every case side by side, each governing
 * value marked in words; the envelope, each sizing quantity with its governing value and the case
 * that sets it; and the worked lines of each case that is not the sizing case (the load it meets,
 * its degradation, and the lines of every value it governs). The sizing case's own lines are
 * those of the results section, with here those of its governing values that section has not
 * (the DC power at the bus, the water fed, the coolant, the mass flows of air, dry fuel, hydrogen
 * and water split, the pre-reformer and reformed-gas duties, the heat recovered, the heat to
 * supply). Every governing value of the envelope thus has a line that states its number (a test
 * checks each row of every demo).
 */
import type { DesignBasis } from '../../basis/types.ts';
import type { CaseResult, EnvelopeRow, Results } from '../../plant/results-schema.ts';
import { getSpecies } from '../../thermo/species-data.ts';
import { valueAt } from '../../plant/envelope.ts';
import { technology } from '../../electrochem/technologies.ts';
import { enthalpyFlowW, massFlowKgPerS } from '../../plant/streams.ts';
import { calcLine, withOrigins, type LineSpec } from '../calc-line.ts';
import type { EquationBook } from '../equation-book.ts';
import { formatNumber, uncapitalised } from '../format.ts';
import { resultLines, type LineGroup } from '../result-lines.ts';
import { constF, conversionEfficiency } from '../result-lines/common.ts';
import { localCurrentLine } from '../result-lines/voltage-lines.ts';
import { humidityLine } from '../result-lines/humidity-lines.ts';
import { crossTable, recordsTable, type Table } from '../table.ts';

export interface CasesSection {
  /** Whether the basis defines cases; without them the section says so and shows no tables. */
  present: boolean;
  intro: string;
  /** The tables, null without cases (a document shows, and offers as CSV, only the tables it has). */
  definitions: Table | null;
  comparison: Table | null;
  /** The words that mark a governing value in the comparison, explained once. */
  legend: string;
  envelope: Table | null;
  lines: LineGroup[];
}

/** How a number at a results path is shown: its label, the factor to the unit shown, the unit, and the digits. */
interface Shown {
  path: string;
  /** The unit of the number in the results, as the data of a table gives it ("A/m2", "" for a fraction). */
  si: string;
  label: string;
  factor: number;
  unit: string;
  digits?: number;
  /** Shown only in this mode (the net power of a fuel cell). */
  mode?: Results['technology']['mode'];
}

/** The rows of the comparison, in order; every path of lib/plant/data/envelope.yaml is among them (a test checks it). */
export const CASE_ROWS: readonly Shown[] = [
  { path: 'operatingPoint.currentDensity_A_per_m2', si: 'A/m2', label: 'Current density', factor: 1e-4, unit: 'A/cm²' },
  { path: 'headline.cellVoltage_V', si: 'V', label: 'Cell voltage', factor: 1, unit: 'V' },
  { path: 'plant.electrical.busVoltage_V', si: 'V', label: 'DC bus voltage (that of one string)', factor: 1, unit: 'V' },
  { path: 'plant.electrical.stringCurrent_A', si: 'A', label: 'String current (that of one stack and one cell)', factor: 1, unit: 'A' },
  { path: 'plant.electrical.busCurrent_A', si: 'A', label: 'DC bus current (the strings in parallel)', factor: 1, unit: 'A' },
  { path: 'plant.electrical.dcPower_W', si: 'W', label: 'DC power at the bus', factor: 1e-3, unit: 'kW' },
  { path: 'headline.netPower_W', si: 'W', label: 'Net power', factor: 1e-3, unit: 'kW', mode: 'power' },
  { path: 'headline.hydrogenProduction_kg_per_h', si: 'kg/h', label: 'Hydrogen production', factor: 1, unit: 'kg/h' },
  { path: 'headline.electricalEfficiencyLhv', si: '', label: 'Net electrical efficiency, LHV', factor: 100, unit: '%' },
  { path: 'efficiency.electrolysisEfficiencyLhv', si: '', label: 'Electrolysis efficiency, LHV', factor: 100, unit: '%' },
  { path: 'headline.stackHeat_W', si: 'W', label: 'Stack heat released', factor: 1e-3, unit: 'kW' },
  { path: 'heat.heatDemand_W', si: 'W', label: 'Heat to supply', factor: 1e-3, unit: 'kW' },
  { path: 'supply.air_kg_per_h', si: 'kg/h', label: 'Air or sweep gas supplied', factor: 1, unit: 'kg/h' },
  { path: 'heat.coolingAir_kg_per_h', si: 'kg/h', label: 'Air that closes the stack heat balance', factor: 1, unit: 'kg/h' },
  { path: 'supply.fuel_kg_per_h', si: 'kg/h', label: 'Fuel supplied', factor: 1, unit: 'kg/h' },
  { path: 'supply.water_kg_per_h', si: 'kg/h', label: 'Water or steam fed', factor: 1, unit: 'kg/h' },
  { path: 'supply.waterSplit_kg_per_h', si: 'kg/h', label: 'Water split', factor: 1, unit: 'kg/h' },
  { path: 'heat.coolingWater_kg_per_h', si: 'kg/h', label: 'Water loop to carry the stack heat', factor: 1, unit: 'kg/h' },
  { path: 'headline.maxLocalCurrentDensity_A_per_m2', si: 'A/m2', label: 'Highest local current density', factor: 1e-4, unit: 'A/cm²' },
  { path: 'headline.carbonMargin', si: '', label: 'Carbon margin (S/C above the least carbon-free)', factor: 1, unit: '' },
  { path: 'plant.power.oxidiser.outletTemperature_K', si: 'K', label: 'Off-gas oxidiser outlet temperature', factor: 1, unit: 'K' },
  { path: 'plant.power.cathodeLoop.burnerAir_mol_per_s', si: 'mol/s', label: 'Burner air of the cathode-gas loop', factor: 1, unit: 'mol/s' },
  { path: 'plant.power.cathodeLoop.recycledShare', si: '', label: 'Share of the cathode exhaust recycled', factor: 100, unit: '%' },
  { path: 'plant.power.steam.duty_W', si: 'W', label: 'Steam raising duty', factor: 1e-3, unit: 'kW' },
  { path: 'plant.power.duties[pre-reformer].duty_W', si: 'W', label: 'Pre-reformer duty', factor: 1e-3, unit: 'kW' },
  { path: 'plant.power.duties[fuel-preheat].duty_W', si: 'W', label: 'Fuel preheat duty', factor: 1e-3, unit: 'kW' },
  { path: 'plant.power.duties[reformed-gas-heating].duty_W', si: 'W', label: 'Reformed-gas heating duty', factor: 1e-3, unit: 'kW' },
  { path: 'plant.power.duties[air-preheat].duty_W', si: 'W', label: 'Air preheat duty', factor: 1e-3, unit: 'kW' },
  { path: 'plant.power.heatRecovery.heatWithCondensation_W', si: 'W', label: 'Heat recovered from the exhaust', factor: 1e-3, unit: 'kW' },
  { path: 'plant.power.heatRecovery.deliveredHeat_W', si: 'W', label: 'Heat delivered', factor: 1e-3, unit: 'kW' },
  { path: 'plant.power.blower.power_W', si: 'W', label: 'Air blower power', factor: 1e-3, unit: 'kW', mode: 'power' },
  { path: 'plant.electrolysis.heatSupplied_W', si: 'W', label: 'Heat supplied to the feeds and the stack', factor: 1e-3, unit: 'kW', mode: 'electrolysis' },
  { path: 'plant.electrolysis.coolers_W', si: 'W', label: "Heat removed by the plant's coolers", factor: 1e-3, unit: 'kW', mode: 'electrolysis' },
  { path: 'plant.electrolysis.compression.power_W', si: 'W', label: 'Hydrogen compressor power', factor: 1e-3, unit: 'kW', mode: 'electrolysis' },
  { path: 'degradation.fraction', si: '', label: 'Degradation r t', factor: 100, unit: '%' },
];

/** The number at a path of a case's results (envelope.ts), or null. */
const at = valueAt;

function shownValue(row: Shown, x: number): string {
  return `${formatNumber(x * row.factor, row.digits ?? 4)}${row.unit ? ` ${row.unit}` : ''}`;
}

const LOAD_TEXT: Record<CaseResult['load'], string> = {
  sizing: 'sizing case: fixes the hardware, and runs at its own load on the cells installed',
  'current-density': 'its current density',
  'target-power': 'its target power, met on the installed cells',
  'target-hydrogen': 'its target hydrogen, met on the installed cells',
};

function definitions(cases: readonly CaseResult[]): Table {
  const changes = (c: CaseResult) => (c.overrides.length ? c.overrides.map((o) => `${o.path} = ${o.text}${o.source ? ` (${o.source})` : ''}`).join('; ') : 'nothing: the base values');
  return recordsTable({
    name: 'cases',
    title: 'The operating cases',
    columns: [
      { head: 'Case', align: 'left', text: (c) => c.id, data: [{ name: 'Case', unit: '', value: (c) => c.id }] },
      { head: 'Title and purpose', align: 'left', text: (c) => `${c.title}. ${c.purpose}`, data: [{ name: 'Title', unit: '', value: (c) => c.title }, { name: 'Purpose', unit: '', value: (c) => c.purpose }] },
      { head: 'Load', align: 'left', text: (c) => LOAD_TEXT[c.load], data: [{ name: 'Load', unit: '', value: (c) => c.load }] },
      { head: 'What it changes (source)', align: 'left', text: changes, data: [{ name: 'What it changes (source)', unit: '', value: changes }] },
    ],
    groups: [{ items: cases }],
  });
}

/** The words that mark a governing value: what it is the extreme of, and of which quantity. */
function marks(envelope: readonly EnvelopeRow[], path: string, caseId: string): string[] {
  return envelope.filter((e) => e.path === path && e.case === caseId).map((e) => (e.governs === 'max' ? 'highest' : 'lowest'));
}

function comparison(cases: readonly CaseResult[], envelope: readonly EnvelopeRow[], mode: Results['technology']['mode']): Table {
  const shown = CASE_ROWS.filter((row) => (row.mode ?? mode) === mode && cases.some((c) => c.ran && at(c, row.path) !== null));
  return crossTable({
    name: 'case-comparison',
    title: 'Headline numbers per case',
    items: cases,
    itemName: (c) => (c.sizing ? `${c.id} (sizing)` : c.id),
    itemColumn: 'Case',
    rows: shown.map((row) => ({
      label: `${row.label}${row.unit ? `, ${row.unit}` : ''}`,
      text: (c: CaseResult) => {
        if (!c.ran) return 'did not run';
        const x = at(c, row.path);
        if (x === null) return '';
        const m = marks(envelope, row.path, c.id);
        return `${formatNumber(x * row.factor, row.digits ?? 4)}${m.length ? ` (${m.join(', ')})` : ''}`;
      },
      data: [{ name: row.label, unit: row.si, value: (c: CaseResult) => (c.ran ? at(c, row.path) : null) }],
    })),
  });
}

/** The envelope: each row a different quantity, so in the data its unit is a column of its own (the results' unit of the value). */
function envelopeTable(envelope: readonly EnvelopeRow[]): Table {
  const shownOf = (path: string): Shown => CASE_ROWS.find((r) => r.path === path) ?? { path, si: '', label: path, factor: 1, unit: '' };
  const text = (head: string, value: (e: EnvelopeRow) => string) => ({ head, align: 'left' as const, text: value, data: [{ name: head, unit: '', value }] });
  return recordsTable({
    name: 'envelope',
    title: 'Envelope of the operating cases',
    columns: [
      { head: 'Quantity', align: 'left', text: (e) => e.quantity, data: [{ name: 'Quantity', unit: '', value: (e) => e.quantity }, { name: 'Path', unit: '', value: (e) => e.path }] },
      text('Governed by its', (e) => (e.governs === 'max' ? 'highest' : 'lowest')),
      {
        head: 'Governing value',
        align: 'right',
        text: (e) => shownValue(shownOf(e.path), e.value),
        data: [
          { name: 'Governing value', unit: '', value: (e) => e.value },
          { name: 'Unit', unit: '', value: (e) => (e.unit === '1' ? '' : e.unit) },
        ],
      },
      text('Set by case', (e) => e.case),
      { head: 'Sizing case', align: 'right', text: (e) => (e.sizingValue === null ? '' : shownValue(shownOf(e.path), e.sizingValue)), data: [{ name: 'Sizing case value', unit: '', value: (e) => e.sizingValue }] },
      text('Sizes', (e) => e.sizes),
    ],
    groups: [{ items: envelope }],
  });
}

/** The results object of a case: the top level with the case's sections in place of the sizing case's. */
function asResults(r: Results, c: CaseResult): Results {
  return {
    ...r,
    conditions: c.conditions!,
    headline: c.headline!,
    electrochemistry: c.electrochemistry!,
    operatingPoint: c.operatingPoint!,
    streams: c.streams,
    efficiency: c.efficiency!,
    heat: c.heat!,
    carbon: c.carbon!,
    supply: c.supply!,
    degradation: c.degradation,
    plant: c.plant ?? r.plant,
    findings: c.findings,
  };
}

/**
 * Whether the case is the sizing case run at a current density of its own on the installed cells:
 * its target met by more cells than the sizing calculation required (cases.ts installedPoint).
 */
function installedSizing(r: Results, c: CaseResult): boolean {
  return c.sizing && c.ran && c.headline!.cells !== r.headline.cells;
}

/**
 * Where a case's current density and resistance come from, by quantity name, for the lines of
 * section 6 it reuses: there they are the design inputs of the sizing calculation; a case's
 * current density is solved for its target, and its resistance is the sizing hardware's (given,
 * or implied by the sizing case's given voltage), aged where the case degrades.
 */
function caseOrigins(r: Results, c: CaseResult): Record<string, string> {
  const origins: Record<string, string> = { ASR: caseResistanceOrigin(r, c) };
  if (solvedTarget(r, c) !== null) origins.j = "current density that meets the case's target on the installed cells (solved: the load line above)";
  return origins;
}

function caseResistanceOrigin(r: Results, c: CaseResult): string {
  const e = r.electrochemistry;
  if (c.degradation?.of === 'cell-voltage') return "implied by the case's aged cell voltage (the degradation line above)";
  const hardware = e.voltageSource === 'given' ? "the sizing case's, implied by its given cell voltage (section 6)" : "the sizing case's, design input";
  const law = e.resistanceLaw ? `, at the case's temperature by its Arrhenius law` : '';
  return `${hardware}${law}${c.degradation ? ', aged by the degradation line above' : ''}`;
}

/** What a case's load is met by solving for: a target of power or hydrogen, or none. */
function solvedTarget(r: Results, c: CaseResult): 'target-power' | 'target-hydrogen' | null {
  if (c.load === 'target-power' || c.load === 'target-hydrogen') return c.load;
  if (!installedSizing(r, c) || r.operatingPoint.cellsFrom === 'cells') return null;
  return r.operatingPoint.cellsFrom === 'hydrogen' ? 'target-hydrogen' : 'target-power';
}

/** The line of the load a target case (or the sizing case on the installed cells) meets on the installed cells. */
function loadLine(r: Results, basis: DesignBasis, c: CaseResult): LineSpec | null {
  const load = solvedTarget(r, c);
  if (load === null) return null;
  const h = c.headline!;
  const o = c.operatingPoint!;
  const common = [
    { name: 'N', value: h.cells, unit: '', origin: "cells installed: the whole stacks of the sizing case's layout" },
    { name: 'j', value: o.currentDensity_A_per_m2, unit: 'A/m2', origin: 'current density that meets the target (solved)' },
    { name: 'A', value: o.activeArea_m2, unit: 'm2', origin: 'active area of the sizing case' },
  ];
  const id = `case-${c.id}-load`;
  if (load === 'target-hydrogen' && h.hydrogenProduction_kg_per_h !== null) {
    // Every two electrons of the ionic current make one H₂ where nothing else is reduced (no co-electrolysis).
    if (c.efficiency!.carbonMonoxideProduction_mol_per_s) return null;
    const ionic = { name: 'j', value: c.electrochemistry!.ionicCurrentDensity_A_per_m2, unit: 'A/m2', origin: 'ionic current density at the solved current density (the current that splits water)' };
    return {
      id,
      title: `Case ${c.id}: hydrogen the installed cells make at the solved current density`,
      equation: 'case-load',
      relation: 'hydrogen',
      quantities: [common[0]!, ionic, common[2]!, { name: 'M', value: getSpecies('H2').molarMassKgPerMol, unit: 'kg/mol', origin: 'species data' }, constF],
      conversion: ' \\times 86\\,400\\,\\mathrm{s/day}',
      value: h.hydrogenProduction_kg_per_day!,
      unit: 'kg/day',
      note: 'equal to the target of the case: the current density is the root of this relation',
    };
  }
  const V = { name: 'V', value: h.cellVoltage_V, unit: 'V', origin: 'cell voltage of the case at j' };
  // The case's own basis: a case may state the efficiency the base leaves out.
  const eta = conversionEfficiency(basis.cases.find((k) => k.id === c.id)?.basis ?? basis, o.conversionEfficiency);
  const f = { name: 'f', value: o.parasiticFraction, unit: '', origin: 'parasitic load, design input' };
  const power = r.technology.mode === 'power';
  return {
    id,
    title: `Case ${c.id}: ${power ? 'net power' : 'power input'} of the installed cells at the solved current density`,
    equation: 'case-load',
    relation: 'power',
    quantities: [...common, V, eta, f],
    conversion: ' \\times 10^{-3}',
    // netPower_W: power mode, what the plant delivers; electrolysis, what it draws (design-point.ts plantPowerShare).
    value: h.netPower_W / 1000,
    unit: 'kW',
    note: 'equal to the target of the case: the current density is the root of this relation',
  };
}

/** The DC power at the bus of a case (the sizing layout at the case's cell voltage and current). */
function busPowerLine(c: CaseResult): LineSpec | null {
  const e = c.plant?.electrical;
  if (!e) return null;
  return {
    id: `case-${c.id}-dc-power`,
    title: `Case ${c.id}: DC power at the bus`,
    equation: 'case-bus-power',
    relation: 'power',
    quantities: [
      { name: 'Vbus', value: e.busVoltage_V, unit: 'V', origin: `bus voltage: ${e.stacksInSeries} stacks in series of ${e.cellsPerStack} cells at the case's cell voltage` },
      { name: 'Ibus', value: e.busCurrent_A, unit: 'A', origin: `bus current: ${e.stringsInParallel} strings at the case's cell current` },
    ],
    conversion: ' \\times 10^{-3}',
    value: e.dcPower_W / 1000,
    unit: 'kW',
  };
}

/** The water a case feeds: power mode, the steam added to its dry fuel; electrolysis, the water of the water electrode's inlet. */
function waterLine(r: Results, basis: DesignBasis, c: CaseResult): LineSpec | null {
  const water = c.supply?.water_kg_per_h ?? null;
  if (water === null) return null;
  const M = { name: 'M', value: getSpecies('H2O').molarMassKgPerMol, unit: 'kg/mol', origin: 'species data' };
  const line = { id: `case-${c.id}-water-flow`, title: `Case ${c.id}: ${r.technology.mode === 'power' ? 'steam added to the fuel' : 'water fed to the stack'}`, equation: 'case-water', conversion: ' \\times 3600\\,\\mathrm{s/h}', value: water, unit: 'kg/h' };
  if (r.technology.mode === 'power') {
    const feed = c.streams.find((s) => s.id === 'fuel-feed') ?? c.streams.find((s) => s.id === 'fuel-inlet');
    const dry = basis.fuelElectrode?.composition;
    if (!feed || !dry) return null;
    return {
      ...line,
      relation: 'steam',
      quantities: [
        { name: 'n', value: feed.flow_mol_per_s, unit: 'mol/s', origin: `fuel feed with its steam (${feed.name}), stream table of the case` },
        { name: 'x', value: feed.moleFractions.H2O ?? 0, unit: '', origin: 'steam mole fraction of the fuel feed, stream table of the case' },
        { name: 'xd', value: dry.H2O ?? 0, unit: '', origin: 'water mole fraction of the dry fuel, design input' },
        M,
      ],
    };
  }
  const inlet = c.streams.find((s) => s.id === (technology(basis.cell.technology).waterElectrode === 'fuel' ? 'fuel-inlet' : 'air-inlet'));
  if (!inlet) return null;
  const n = (inlet.speciesFlows_mol_per_s.H2O ?? 0) + (inlet.speciesFlows_mol_per_s['H2O(L)'] ?? 0);
  return { ...line, relation: 'water', quantities: [{ name: 'n', value: n, unit: 'mol/s', origin: `water, vapour and liquid, of the ${inlet.name}, stream table of the case` }, M] };
}

/**
 * The coolant that carries a case's stack heat: the air of an air-cooled stack, from its inlet
 * temperature, carrying the stack heat less the fuel feed's heating (the air that closes the
 * stack heat balance, lib/plant/stack-heat-balance.ts), or the water loop at the allowed rise.
 */
function coolantLine(r: Results, c: CaseResult, which: 'cooling-air' | 'cooling-water'): LineSpec | null {
  const heat = c.heat;
  const value = which === 'cooling-air' ? heat?.coolingAir_kg_per_h : heat?.coolingWater_kg_per_h;
  if (!heat || value === null || value === undefined) return null;
  const air = c.streams.find((s) => s.id === 'air-inlet');
  const composition: Record<string, number> | null = which === 'cooling-water' ? { 'H2O(L)': 1 } : air ? air.moleFractions : null;
  if (!composition || (which === 'cooling-air' && (!heat.stackBalance || !air))) return null;
  const t = c.conditions!.temperature_K;
  const from = which === 'cooling-air' ? air!.temperature_K : t - heat.allowedAirTemperatureRise_K;
  const q = which === 'cooling-air' ? heat.isothermalHeat_W - heat.stackBalance!.fuelHeating_W : heat.isothermalHeat_W;
  // Δh_c and M_c of one mole of the coolant: the enthalpy and mass of its composition (species data).
  const dh = enthalpyFlowW(composition, t) - enthalpyFlowW(composition, from);
  const coolant = which === 'cooling-air' ? 'air' : 'the water loop';
  const title = which === 'cooling-air' ? 'air that closes the stack heat balance from its inlet temperature' : `the water loop to carry the stack heat at a rise of ${formatNumber(heat.allowedAirTemperatureRise_K, 4)} K`;
  return {
    id: `case-${c.id}-${which}`,
    title: `Case ${c.id}: ${title}`,
    equation: 'case-coolant',
    relation: 'mass',
    quantities: [
      { name: 'Q', value: q / 1000, unit: 'kW', origin: which === 'cooling-air' ? 'stack heat of the case (isothermal boundary) less the heat that brings its fuel feed to the stack temperature' : 'stack heat of the case (isothermal boundary)' },
      { name: 'M', value: massFlowKgPerS(composition), unit: 'kg/mol', origin: `molar mass of ${coolant}, species data` },
      { name: 'dh', value: dh / 1000, unit: 'kJ/mol', origin: `enthalpy rise of ${coolant} from ${formatNumber(from, 5)} K to ${formatNumber(t, 5)} K, species data` },
    ],
    conversion: ' \\times 3600\\,\\mathrm{s/h}',
    value,
    unit: 'kg/h',
  };
}

/** The line of the case's degradation. */
function degradationLine(c: CaseResult): LineSpec | null {
  const d = c.degradation;
  if (!d) return null;
  const rate = { name: 'r', value: d.rate_per_h * 1000, unit: '1/kh', origin: 'degradation rate, case input' };
  const time = { name: 't', value: d.operatingTime_h / 1000, unit: 'kh', origin: 'operating time, case input' };
  const id = `case-${c.id}-degradation`;
  if (d.of === 'cell-voltage') {
    return {
      id,
      title: `Case ${c.id}: cell voltage at the end of life`,
      equation: 'degradation',
      relation: 'voltage',
      quantities: [{ name: 'V0', value: d.beginningOfLifeCellVoltage_V, unit: 'V', origin: 'new cell at the same current density' }, rate, time],
      value: c.headline!.cellVoltage_V,
      unit: 'V',
    };
  }
  return {
    id,
    title: `Case ${c.id}: area-specific resistance at the end of life`,
    equation: 'degradation',
    relation: 'resistance',
    quantities: [{ name: 'R0', value: d.beginningOfLifeAreaSpecificResistance_ohm_m2 * 1e4, unit: 'ohm cm2', origin: 'new cell, from the sizing case' }, rate, time],
    value: c.electrochemistry!.areaSpecificResistance_ohm_m2 * 1e4,
    unit: 'ohm cm2',
  };
}

/**
 * The water of a case's humid-air feed, where it is not the sizing case's: each case is read as a
 * basis of its own, so a case that changes the humidity, or the pressure it is stated at (the
 * air-electrode pressure for a dew point, the ambient pressure for a relative humidity), is fed
 * air of its own water fraction (lib/basis/read-air-stream.ts).
 */
function humidityCaseLine(r: Results, basis: DesignBasis, c: CaseResult): LineSpec | null {
  const own = c.conditions?.airHumidity ?? null;
  if (own === null || own.waterFraction === r.conditions.airHumidity?.waterFraction) return null;
  const line = humidityLine(asResults(r, c), basis);
  return line && forCase(c, line);
}

/** A case's line, named after the case: its id prefixed with the case's, its title led by the case. */
function forCase<L extends { id: string; title: string }>(c: CaseResult, line: L, what = line.id): L {
  return { ...line, id: `case-${c.id}-${what}`, title: `Case ${c.id}: ${uncapitalised(line.title)}` };
}

const HOUR = ' \\times 3600\\,\\mathrm{s/h}';

/** A mass flow of the envelope from the molar flows of the case's stream table, kg/h (the results' supply and headline). */
function massLines(r: Results, basis: DesignBasis, c: CaseResult, ids: ReadonlySet<string>): LineSpec[] {
  const lines = [airMassLine(c, ids), fuelMassLine(r, basis, c, ids), hydrogenMassLine(r, c, ids), waterSplitLine(r, c, ids)];
  return lines.filter((line): line is LineSpec => line !== null);
}

/** A case's stream by its id. */
function caseStream(c: CaseResult, id: string) {
  return c.streams.find((s) => s.id === id);
}

/** The mean molar mass of a composition, kg/mol (species data). */
function meanMolarMass(x: Readonly<Record<string, number>>): number {
  return Object.entries(x).reduce((a, [k, v]) => a + v * getSpecies(k).molarMassKgPerMol, 0);
}

function airMassLine(c: CaseResult, ids: ReadonlySet<string>): LineSpec | null {
  const air = caseStream(c, 'air-inlet');
  if (!ids.has('air-flow') || !air || c.supply?.air_kg_per_h == null) return null;
  return {
    id: `case-${c.id}-air-mass`,
    title: `Case ${c.id}: air supplied, by mass`,
    equation: 'case-mass',
    relation: 'air',
    quantities: [
      { name: 'n', value: air.flow_mol_per_s, unit: 'mol/s', origin: `${air.name}, stream table of the case` },
      { name: 'M', value: meanMolarMass(air.moleFractions), unit: 'kg/mol', origin: 'mean molar mass of that air, species data' },
    ],
    conversion: HOUR,
    value: c.supply.air_kg_per_h,
    unit: 'kg/h',
  };
}

function fuelMassLine(r: Results, basis: DesignBasis, c: CaseResult, ids: ReadonlySet<string>): LineSpec | null {
  const dry = basis.fuelElectrode?.composition;
  const feed = caseStream(c, 'fuel-feed') ?? caseStream(c, 'fuel-inlet');
  if (!(ids.has('fuel-flow') || ids.has('fuel-flow-least')) || r.technology.mode !== 'power' || !dry || !feed || c.supply?.fuel_kg_per_h == null) return null;
  return {
    id: `case-${c.id}-fuel-mass`,
    title: `Case ${c.id}: dry fuel supplied, by mass`,
    equation: 'case-mass',
    relation: 'fuel',
    quantities: [
      { name: 'n', value: feed.flow_mol_per_s, unit: 'mol/s', origin: `fuel feed with its steam (${feed.name}), stream table of the case` },
      { name: 'x', value: feed.moleFractions.H2O ?? 0, unit: '', origin: 'steam mole fraction of the fuel feed, stream table of the case' },
      { name: 'xd', value: dry.H2O ?? 0, unit: '', origin: 'water mole fraction of the dry fuel, design input' },
      { name: 'M', value: meanMolarMass(dry), unit: 'kg/mol', origin: 'mean molar mass of the dry fuel, species data' },
    ],
    conversion: HOUR,
    value: c.supply.fuel_kg_per_h,
    unit: 'kg/h',
  };
}

function hydrogenMassLine(r: Results, c: CaseResult, ids: ReadonlySet<string>): LineSpec | null {
  const h2 = c.efficiency?.hydrogenProduction_mol_per_s;
  if (!(ids.has('hydrogen-most') || ids.has('hydrogen-least')) || r.technology.mode === 'power' || h2 == null || c.efficiency?.carbonMonoxideProduction_mol_per_s || c.headline?.hydrogenProduction_kg_per_h == null) return null;
  return {
    id: `case-${c.id}-hydrogen-mass`,
    title: `Case ${c.id}: hydrogen made, by mass`,
    equation: 'case-mass',
    relation: 'hydrogen',
    quantities: [
      { name: 'n', value: h2, unit: 'mol/s', origin: "hydrogen made, I_ion/2F (Faraday's law)" },
      { name: 'M', value: getSpecies('H2').molarMassKgPerMol, unit: 'kg/mol', origin: 'species data' },
    ],
    conversion: HOUR,
    value: c.headline.hydrogenProduction_kg_per_h,
    unit: 'kg/h',
  };
}

function waterSplitLine(r: Results, c: CaseResult, ids: ReadonlySet<string>): LineSpec | null {
  if (!ids.has('water-split') || r.technology.mode === 'power' || c.supply?.waterSplit_kg_per_h == null) return null;
  const water = (streams: readonly string[]) => c.streams.filter((s) => streams.includes(s.id)).reduce((a, s) => a + (s.speciesFlows_mol_per_s.H2O ?? 0) + (s.speciesFlows_mol_per_s['H2O(L)'] ?? 0), 0);
  return {
    id: `case-${c.id}-water-split`,
    title: `Case ${c.id}: water split`,
    equation: 'case-mass',
    relation: 'split',
    quantities: [
      { name: 'nin', value: water(['fuel-inlet', 'air-inlet']), unit: 'mol/s', origin: "water, vapour and liquid, of the stack's inlets, stream table of the case" },
      { name: 'nout', value: water(['fuel-outlet', 'air-outlet']), unit: 'mol/s', origin: "water, vapour and liquid, of the stack's outlets, stream table of the case" },
      { name: 'M', value: getSpecies('H2O').molarMassKgPerMol, unit: 'kg/mol', origin: 'species data' },
    ],
    conversion: HOUR,
    value: c.supply.waterSplit_kg_per_h,
    unit: 'kg/h',
  };
}

/** The pre-reformer's duty and the reformed gas heated to the stack, from the enthalpy flows of the case's plant streams. */
function reformerLines(c: CaseResult, ids: ReadonlySet<string>): LineSpec[] {
  const p = c.plant?.power;
  if (!p) return [];
  const stream = (id: string) => c.plant!.streams.find((s) => s.id === id);
  const duty = (id: string) => p.duties.find((d) => d.id === id);
  const feed = stream('pre-reformer-feed');
  const outlet = stream('pre-reformer-outlet');
  const inlet = stream('fuel-inlet');
  const lines: LineSpec[] = [];
  const line = (what: string, title: string, d: { duty_W: number }, out: { enthalpyFlow_W: number; name: string }, into: { enthalpyFlow_W: number; name: string }): LineSpec => ({
    id: `case-${c.id}-${what}`,
    title: `Case ${c.id}: ${title}`,
    equation: 'plant-duty',
    relation: 'duty',
    quantities: [
      { name: 'Hout', value: out.enthalpyFlow_W / 1000, unit: 'kW', origin: `${out.name}, plant stream table of the case` },
      { name: 'Hin', value: into.enthalpyFlow_W / 1000, unit: 'kW', origin: `${into.name}, plant stream table of the case` },
    ],
    value: d.duty_W / 1000,
    unit: 'kW',
  });
  const pre = duty('pre-reformer');
  // An adiabatic pre-reformer has no duty: its outlet holds the feed's enthalpy, and the line would show only that balance.
  if (ids.has('pre-reformer-duty') && pre && feed && outlet && pre.duty_W !== 0) lines.push(line('pre-reformer-duty', 'pre-reformer duty (held at its temperature)', pre, outlet, feed));
  const heating = duty('reformed-gas-heating');
  if (ids.has('reformed-gas-heating') && heating && outlet && inlet) lines.push(line('reformed-gas-heating', 'reformed gas heated to the fuel-electrode inlet', heating, inlet, outlet));
  return lines;
}

/** The heat recovered from a case's exhaust (with condensation): the enthalpy in less the gas and condensate out. */
function heatRecoveredLine(c: CaseResult): LineSpec | null {
  const p = c.plant?.power;
  const hr = p?.heatRecovery;
  if (!p || !hr) return null;
  const stream = (id: string) => c.plant!.streams.find((s) => s.id === id);
  const entering = stream('exhaust-mixed') ?? stream('oxidiser-outlet');
  const exit = stream('exhaust');
  if (!entering || !exit) return null;
  const condensate = stream('condensate');
  return {
    id: `case-${c.id}-heat-recovered`,
    title: `Case ${c.id}: heat recovered from the exhaust, with condensation`,
    equation: 'case-heat-recovered',
    relation: 'heat',
    quantities: [
      { name: 'Hex', value: entering.enthalpyFlow_W / 1000, unit: 'kW', origin: `${entering.name} entering the heat recovery, plant stream table of the case` },
      { name: 'Hg', value: exit.enthalpyFlow_W / 1000, unit: 'kW', origin: `${exit.name} at the exit temperature, plant stream table of the case` },
      { name: 'Hc', value: (condensate?.enthalpyFlow_W ?? 0) / 1000, unit: 'kW', origin: condensate ? 'condensate at the exit temperature, plant stream table of the case' : 'none: no water condenses' },
    ],
    value: hr.heatWithCondensation_W / 1000,
    unit: 'kW',
  };
}

/** The heat an electrolysis case takes below the thermoneutral voltage: its enthalpy balance with the sign reversed. */
function heatDemandLine(c: CaseResult): LineSpec | null {
  const heat = c.heat;
  if (!heat || heat.heatDemand_W == null) return null;
  return {
    id: `case-${c.id}-heat-demand`,
    title: `Case ${c.id}: heat to supply to the stack (below the thermoneutral voltage)`,
    equation: 'case-heat-demand',
    relation: 'demand',
    quantities: [
      { name: 'Hout', value: heat.outletEnthalpy_W / 1000, unit: 'kW', origin: 'outlet streams (stream table of the case)' },
      { name: 'Hin', value: heat.inletEnthalpyIsothermal_W / 1000, unit: 'kW', origin: 'inlet streams at the stack temperature' },
      { name: 'W', value: heat.electricWorkIn_W / 1000, unit: 'kW', origin: 'the stack power input' },
    ],
    value: heat.heatDemand_W / 1000,
    unit: 'kW',
  };
}

/**
 * The heat an electrolysis case supplies (its feeds' heaters, the positive duties, and the stack's
 * supply below the thermoneutral voltage) and the heat its coolers remove (the negative duties:
 * the water-loop cooler and the rest), each where it governs the envelope.
 */
function plantHeatLines(c: CaseResult, ids: ReadonlySet<string>): LineSpec[] {
  const x = c.plant?.electrolysis;
  if (!x) return [];
  const lines: LineSpec[] = [];
  if (ids.has('heat-supplied')) {
    lines.push({
      id: `case-${c.id}-heat-supplied`,
      title: `Case ${c.id}: heat supplied to the feeds and the stack`,
      equation: 'case-plant-heat',
      relation: 'supplied',
      quantities: [
        { name: 'Qf', value: x.feedHeat_W / 1000, unit: 'kW', origin: "the feeds' heaters, the positive duties of the case's duty table" },
        { name: 'Qs', value: x.stackHeatSupplied_W / 1000, unit: 'kW', origin: 'the stack below the thermoneutral voltage, its losses included, plant balance of the case' },
      ],
      value: x.heatSupplied_W / 1000,
      unit: 'kW',
    });
  }
  if (ids.has('coolers')) {
    const cooled = x.duties.filter((d) => d.duty_W < 0);
    const loop = cooled.filter((d) => d.id.startsWith('loop-cooling')).reduce((a, d) => a - d.duty_W, 0);
    const rest = cooled.filter((d) => !d.id.startsWith('loop-cooling')).reduce((a, d) => a - d.duty_W, 0);
    lines.push({
      id: `case-${c.id}-coolers`,
      title: `Case ${c.id}: heat removed by the plant's coolers`,
      equation: 'case-plant-heat',
      relation: 'removed',
      quantities: [
        { name: 'Ql', value: loop / 1000, unit: 'kW', origin: "the water-loop cooler, duty table of the case" },
        { name: 'Qo', value: rest / 1000, unit: 'kW', origin: "the product cooler and the compressor's inter- and after-coolers, duty table of the case" },
      ],
      value: x.coolers_W / 1000,
      unit: 'kW',
    });
  }
  return lines;
}

/** The worked lines of section 6 that derive each envelope quantity (by envelope id). */
const GOVERNING_LINES: Readonly<Record<string, readonly string[]>> = {
  'dc-current': ['bus-current'],
  'string-current': ['cell-current'],
  'dc-voltage-highest': ['stack-voltage', 'bus-voltage'],
  'dc-voltage-lowest': ['stack-voltage', 'bus-voltage'],
  'cell-voltage-lowest': ['cell-voltage'],
  'stack-heat': ['heat-balance'],
  'air-flow': ['air-flow'],
  'fuel-flow': ['fuel-flow'],
  'fuel-flow-least': ['fuel-flow'],
  'carbon-margin': ['carbon-margin'],
  'hydrogen-most': ['hydrogen'],
  'hydrogen-least': ['hydrogen'],
  'steam-raising': ['steam-raising'],
  'heat-delivered': ['delivered-heat'],
  // Lines of the plant's duties and oxidiser (plant-lines.ts), where it writes them.
  'fuel-preheat': ['fuel-preheat'],
  'air-preheat': ['air-preheat'],
  'oxidiser-temperature': ['oxidiser-enthalpy'],
  'cathode-burner-air': ['cathode-loop-air'],
  'cathode-recycle': ['cathode-loop-recycle'],
  'cathode-recycle-least': ['cathode-loop-recycle'],
  'compressor-power': ['compressor-power'],
  'blower-power': ['blower-power'],
};

/** The groups of section 6 whose lines read only the case's own sections (not the sizing case's fuel path). */
const CASE_GROUPS = new Set(['results-size', 'results-flows', 'results-heat', 'results-carbon', 'results-plant']);
/** Lines of other groups that read only the case's own sections: the cell voltage from its resistance (area-mean form). */
const CASE_LINES = new Set(['cell-voltage']);

/** The lines this module writes for the envelope quantities section 6 has no line for, by envelope id. */
function ownGoverningLines(r: Results, basis: DesignBasis, c: CaseResult, ids: ReadonlySet<string>, book: EquationBook): LineSpec[] {
  const lines: (LineSpec | null)[] = [];
  if (ids.has('dc-power')) lines.push(busPowerLine(c));
  if (ids.has('water-flow')) lines.push(waterLine(r, basis, c));
  if (ids.has('cooling-air')) lines.push(coolantLine(r, c, 'cooling-air'));
  if (ids.has('cooling-water')) lines.push(coolantLine(r, c, 'cooling-water'));
  lines.push(...massLines(r, basis, c, ids), ...reformerLines(c, ids));
  if (ids.has('heat-recovered')) lines.push(heatRecoveredLine(c));
  if (ids.has('heat-demand')) lines.push(heatDemandLine(c));
  lines.push(...plantHeatLines(c, ids));
  // The sizing case's hot spot is a line of section 6 (its fuel path); a case's is at its inlet, whose Nernst voltage it reports.
  if (ids.has('local-current-density') && (!c.sizing || installedSizing(r, c))) lines.push(forCase(c, withOrigins(localCurrentLine(asResults(r, c), book, c.headline!.inletNernst_V, 'the inlet'), caseOrigins(r, c)), 'local-current'));
  return lines.filter((l): l is LineSpec => l !== null);
}

/**
 * The worked lines of a case: its load, its degradation and the lines of every value it governs.
 * The sizing case's section-6 lines are its own; it gets here only the lines section 6 has not.
 */
function caseLines(r: Results, basis: DesignBasis, c: CaseResult, book: EquationBook): LineGroup {
  const governs = new Set(r.envelope.filter((e) => e.case === c.id).map((e) => e.id));
  const caseBasis = basis.cases.find((k) => k.id === c.id)?.basis ?? basis;
  const ownGoverning = ownGoverningLines(r, caseBasis, c, governs, book);
  // The sizing case on the cells the sizing calculation required is the point of section 6, whose lines are its own.
  if (c.sizing && !installedSizing(r, c)) return { id: `cases-${c.id}`, title: `Case ${c.id}: ${c.title} (sizing case)`, lines: ownGoverning.map((s) => calcLine(s, book)) };
  const own = [loadLine(r, basis, c), degradationLine(c), humidityCaseLine(r, caseBasis, c), ...ownGoverning].filter((s): s is LineSpec => s !== null).map((s) => calcLine(s, book));
  const wanted = new Set([...governs].flatMap((id) => GOVERNING_LINES[id] ?? []));
  // An aged cell voltage is V₀ (1 ∓ r t), the degradation line above; the area-mean form gives V₀.
  if (c.degradation?.of === 'cell-voltage') wanted.delete('cell-voltage');
  const groups = new Set([...CASE_GROUPS].filter((g) => g !== 'results-plant' || c.plant !== null));
  const governing = wanted.size
    ? resultLines(asResults(r, c), caseBasis, book, caseOrigins(r, c))
        .flatMap((g) => g.lines.filter((l) => groups.has(g.id) || CASE_LINES.has(l.id)))
        .filter((l) => wanted.has(l.id))
        .map((l) => forCase(c, l))
    : [];
  return { id: `cases-${c.id}`, title: `Case ${c.id}: ${c.title}${c.sizing ? ' (sizing case, on the cells installed)' : ''}`, lines: [...own, ...governing] };
}

/** The tables of the cases (what `calc --section cases|case-comparison|envelope` prints), or null where the basis has none. */
export function caseTables(r: Results): { definitions: Table; comparison: Table; envelope: Table } | null {
  if (!r.cases.length) return null;
  return { definitions: definitions(r.cases), comparison: comparison(r.cases, r.envelope, r.technology.mode), envelope: envelopeTable(r.envelope) };
}

export function casesSection(r: Results, basis: DesignBasis, book: EquationBook): CasesSection {
  const cases = r.cases;
  const sizing = cases.find((c) => c.sizing);
  return {
    present: cases.length > 0,
    intro: cases.length
      ? `The basis defines ${cases.length} operating cases. Case ${sizing?.id ?? ''} is the sizing case: it finds the cells needed at its design current density (the sizing calculation, whose results are those of the sections above), and the plant installs them as whole stacks. Every case runs at its own load on the cells installed, with the sizing case's active area and cell resistance, the sizing case too: its column below, its envelope values and the DC bus of section 6 are the installed plant at its load${sizing && installedSizing(r, sizing) ? `, ${sizing.headline!.cells} cells at ${formatNumber(sizing.operatingPoint!.currentDensity_A_per_m2 / 1e4, 4)} A/cm² where the sizing calculation required ${r.headline.cells} at ${formatNumber(r.operatingPoint.currentDensity_A_per_m2 / 1e4, 4)} A/cm²` : ', which is the point of the sections above where the stacks install exactly the cells required'}. Each governing value is marked "highest" or "lowest" beside its number.`
      : 'The basis defines one operating point, its base values, which is the sizing case of the sections above.',
    ...(caseTables(r) ?? { definitions: null, comparison: null, envelope: null }),
    legend: '"highest" or "lowest" beside a number: this case sets the governing value of the quantity in the envelope below.',
    lines: cases.filter((c) => c.ran).map((c) => caseLines(r, basis, c, book)).filter((g) => g.lines.length > 0),
  };
}
