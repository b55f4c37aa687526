/**
 * Section 2, the summary: the headline numbers a review reads first, the conclusions that follow
 * from the numbers, in plain sentences, and the findings of the calculation and of the basis
 * check (results.findings and the loader's warnings), each with its severity in words, the basis
 * field it concerns and the assumptions that bear on it.
 */
import type { DesignBasis } from '../../basis/types.ts';
import type { Results } from '../../plant/results-schema.ts';
import type { HazardAssessment } from '../../hazards/types.ts';
import type { CheckResult } from '../../verification/checks.ts';
import { capitalised, formatInteger, formatNumber, formatPercent, formatPower, formatQuantity, formatTemperature } from '../format.ts';
import { pairsTable, quantity, recordsTable, type Pair, type Table } from '../table.ts';
import { sectionNumber } from '../outline.ts';
import { efficiencyBasisNotes } from '../efficiency-basis.ts';
import { feedNames } from '../../basis/stream-rules.ts';
import type { TechnologyId } from '../../electrochem/technologies.ts';

export interface Finding {
  /** Critical, Warning or Info: the severity in words, as the page and the print show it. */
  severity: string;
  /** For the page's style: critical, warning or info. */
  level: 'critical' | 'warning' | 'info';
  /** Where it comes from and what kind it is: "calculation: water-loop-short", or "basis check". */
  origin: string;
  /** The calculation's code of the finding ("water-loop-short"), or "" for the basis check's. */
  code: string;
  /** The basis field it concerns, e.g. "operating-point.cell-voltage". */
  field: string;
  /** Other fields it bears on, joined: "conditions.allowed-air-temperature-rise", or "". */
  related: string;
  /** The assumptions that bear on it, each with its state: "A1 (confirmed)", or "". */
  assumptions: string;
  text: string;
  source: 'calculation' | 'basis check';
}

export interface SummarySection {
  headline: Table;
  findings: Finding[];
  /** One sentence counting the findings by severity, or saying there are none. */
  findingsCount: string;
  /** The findings' data, for their CSV (the page lists them rather than show this table). */
  findingsTable: Table;
  conclusions: string[];
}

/** Beside the inlet Nernst voltage where it is not that of a gas at the inlet (fuelPath.inlet). */
function inletRemark(r: Results): string {
  if (r.fuelPath.inlet === 'limit') return ' (limit u → 0⁺: no feed on one electrode)';
  if (r.fuelPath.inlet === 'first-increment') return ` (first increment, u = ${formatPercent(r.fuelPath.inletUtilization, 2)}: unbounded at the dry inlet)`;
  return '';
}

/** The stack's conditions, voltages and currents: the rows every document's headline begins with. */
function stackPairs(r: Results): Pair[] {
  const h = r.headline;
  const c = r.conditions;
  return [
    quantity('Operating temperature', c.temperature_K, 'K', formatTemperature(c.temperature_K)),
    {
      label: 'Fuel-electrode / air-electrode pressure',
      text: `${formatNumber(c.fuelPressure_bar)} / ${formatNumber(c.airPressure_bar)} bar`,
      data: [
        { name: 'Fuel-electrode pressure', unit: 'bar', value: c.fuelPressure_bar },
        { name: 'Air-electrode pressure', unit: 'bar', value: c.airPressure_bar },
      ],
    },
    {
      label: 'Nernst voltage, inlet / outlet',
      text: `${formatQuantity(h.inletNernst_V, 'V')}${inletRemark(r)} / ${formatQuantity(h.outletNernst_V, 'V')}`,
      data: [
        { name: 'Nernst voltage, inlet', unit: 'V', value: h.inletNernst_V },
        { name: 'Nernst voltage, outlet', unit: 'V', value: h.outletNernst_V },
      ],
    },
    {
      label: 'Nernst voltage, area mean / charge mean',
      text: `${formatQuantity(r.electrochemistry.areaMeanNernst_V, 'V')} / ${formatQuantity(h.meanNernst_V, 'V')}`,
      data: [
        { name: 'Nernst voltage, area mean', unit: 'V', value: r.electrochemistry.areaMeanNernst_V },
        { name: 'Nernst voltage, charge mean', unit: 'V', value: h.meanNernst_V },
      ],
    },
    quantity('Cell voltage', h.cellVoltage_V, 'V', `${formatQuantity(h.cellVoltage_V, 'V')} (${r.electrochemistry.voltageSource === 'given' ? 'given' : 'from the area-specific resistance, one voltage over the cell'})`),
    {
      label: 'Local current density, mean / highest (hot spot)',
      text: `${formatQuantity(r.operatingPoint.currentDensity_A_per_m2 / 1e4, 'A/cm²')} / ${formatQuantity(h.maxLocalCurrentDensity_A_per_m2 / 1e4, 'A/cm²')}`,
      data: [
        { name: 'Local current density, mean', unit: 'A/m2', value: r.operatingPoint.currentDensity_A_per_m2 },
        { name: 'Local current density, highest', unit: 'A/m2', value: h.maxLocalCurrentDensity_A_per_m2 },
      ],
    },
    {
      label: 'Cells / cell current / sum of the cell currents',
      text: `${formatInteger(h.cells)} / ${formatQuantity(h.cellCurrent_A, 'A')} / ${formatQuantity(h.totalCurrent_A, 'A')}`,
      data: [
        { name: 'Cells', unit: '', value: h.cells },
        { name: 'Cell current', unit: 'A', value: h.cellCurrent_A },
        { name: 'Sum of the cell currents', unit: 'A', value: h.totalCurrent_A },
      ],
    },
  ];
}

/** A power cell's stack and net power, net electrical efficiency and thermodynamic limit. */
function powerPairs(r: Results): Pair[] {
  const h = r.headline;
  const notes = efficiencyBasisNotes(r);
  const rows: Pair[] = [];
  rows.push({
    label: 'Stack DC power / net power',
    text: `${formatPower(h.stackPower_W)} / ${formatPower(h.netPower_W)}`,
    data: [
      { name: 'Stack DC power', unit: 'W', value: h.stackPower_W },
      { name: 'Net power', unit: 'W', value: h.netPower_W },
    ],
  });
  if (h.electricalEfficiencyLhv !== null && h.electricalEfficiencyHhv !== null) {
    rows.push({
      label: 'Net electrical efficiency, LHV / HHV',
      text: `${formatPercent(h.electricalEfficiencyLhv)} / ${formatPercent(h.electricalEfficiencyHhv)}`,
      data: [
        { name: 'Net electrical efficiency, LHV', unit: '', value: h.electricalEfficiencyLhv },
        { name: 'Net electrical efficiency, HHV', unit: '', value: h.electricalEfficiencyHhv },
      ],
    });
  }
  if (h.thermodynamicLimitLhv !== null && h.thermodynamicLimitHhv !== null) {
    const why = notes.thermodynamicLimitLhv ?? notes.thermodynamicLimitHhv;
    rows.push({
      label: 'Thermodynamic limit at T, LHV / HHV',
      text: `${formatPercent(h.thermodynamicLimitLhv)} / ${formatPercent(h.thermodynamicLimitHhv)}${why ? ` (${why})` : ''}`,
      data: [
        { name: 'Thermodynamic limit at T, LHV', unit: '', value: h.thermodynamicLimitLhv },
        { name: 'Thermodynamic limit at T, HHV', unit: '', value: h.thermodynamicLimitHhv },
      ],
    });
  }
  return rows;
}

/** An electrolyser's power input, hydrogen production and efficiencies. */
function electrolysisPairs(r: Results): Pair[] {
  const h = r.headline;
  const notes = efficiencyBasisNotes(r);
  const rows: Pair[] = [];
  rows.push(quantity('Stack power input', h.stackPower_W, 'W', formatPower(h.stackPower_W)));
  if (h.hydrogenProduction_kg_per_h !== null && h.hydrogenProduction_kg_per_day !== null) {
    rows.push({
      label: 'Hydrogen production',
      text: `${formatQuantity(h.hydrogenProduction_kg_per_h, 'kg/h')} (${formatQuantity(h.hydrogenProduction_kg_per_day, 'kg/day')})`,
      data: [
        { name: 'Hydrogen production', unit: 'kg/h', value: h.hydrogenProduction_kg_per_h },
        { name: 'Hydrogen production per day', unit: 'kg/day', value: h.hydrogenProduction_kg_per_day },
      ],
    });
  }
  const e = r.efficiency;
  if (h.specificEnergy_kWh_per_kg !== null && e.electrolysisEfficiencyLhv !== null && e.electrolysisEfficiencyHhv !== null) {
    const why = notes.electrolysisEfficiencyHhv ?? notes.electrolysisEfficiencyLhv;
    rows.push({
      label: 'Specific electric energy / efficiency over electricity alone, LHV / HHV',
      text: `${formatQuantity(h.specificEnergy_kWh_per_kg, 'kWh/kg')} / ${formatPercent(e.electrolysisEfficiencyLhv)} / ${formatPercent(e.electrolysisEfficiencyHhv)}${why ? ` (HHV ${why})` : ''}`,
      data: [
        { name: 'Specific electric energy', unit: 'kWh/kg', value: h.specificEnergy_kWh_per_kg },
        { name: 'Efficiency over electricity alone, LHV', unit: '', value: e.electrolysisEfficiencyLhv },
        { name: 'Efficiency over electricity alone, HHV', unit: '', value: e.electrolysisEfficiencyHhv },
      ],
    });
  }
  if (e.heatInclusiveEfficiencyLhv !== null && e.heatInclusiveEfficiencyHhv !== null) {
    rows.push({
      label: 'Efficiency with the heat supplied counted, LHV / HHV',
      text: `${formatPercent(e.heatInclusiveEfficiencyLhv)} / ${formatPercent(e.heatInclusiveEfficiencyHhv)}`,
      data: [
        { name: 'Efficiency with the heat supplied counted, LHV', unit: '', value: e.heatInclusiveEfficiencyLhv },
        { name: 'Efficiency with the heat supplied counted, HHV', unit: '', value: e.heatInclusiveEfficiencyHhv },
      ],
    });
  }
  return rows;
}

/** The stack's heat, its air and, for a carbon-bearing fuel, the steam-to-carbon margin and carbon activity. */
function heatAndCarbonPairs(r: Results): Pair[] {
  const h = r.headline;
  const rows: Pair[] = [];
  rows.push({
    label: h.stackHeat_W >= 0 ? 'Stack heat released (isothermal)' : 'Stack heat needed (isothermal)',
    text: formatPower(Math.abs(h.stackHeat_W)),
    data: [{ name: 'Stack heat released, isothermal (negative: needed)', unit: 'W', value: h.stackHeat_W }],
  });
  if (h.airFlow_kg_per_h !== null) {
    const name = capitalised(feedNames(r.technology.id as TechnologyId, r.technology.mode).air);
    rows.push(quantity(name, h.airFlow_kg_per_h, 'kg/h', formatQuantity(h.airFlow_kg_per_h, 'kg/h')));
  }
  if (h.minimumSteamToCarbon !== null) {
    rows.push({
      label: 'Minimum steam-to-carbon ratio / margin',
      text: `${formatNumber(h.minimumSteamToCarbon)} / ${h.carbonMargin === null ? 'no steam given' : formatNumber(h.carbonMargin)}`,
      data: [
        { name: 'Minimum steam-to-carbon ratio', unit: '', value: h.minimumSteamToCarbon },
        { name: 'Steam-to-carbon margin', unit: '', value: h.carbonMargin },
      ],
    });
  }
  if (h.maxCarbonActivity !== null) rows.push(quantity('Highest carbon activity on the fuel path in the stack (stack temperature)', h.maxCarbonActivity, '', formatNumber(h.maxCarbonActivity)));
  return rows;
}

/** The plant around the stack: the electrical layout, the off-gas oxidiser and the heat delivered. */
function plantPairs(r: Results): Pair[] {
  const rows: Pair[] = [];
  const e = r.plant.electrical;
  rows.push({
    label: 'Stacks (cells each × in series × strings) / DC bus',
    text: `${formatInteger(e.stackCount)} (${formatInteger(e.cellsPerStack)} × ${formatInteger(e.stacksInSeries)} × ${formatInteger(e.stringsInParallel)}) / ${formatQuantity(e.busVoltage_V, 'V')}, ${formatQuantity(e.busCurrent_A, 'A')}`,
    data: [
      { name: 'Stacks', unit: '', value: e.stackCount },
      { name: 'Cells per stack', unit: '', value: e.cellsPerStack },
      { name: 'Stacks in series', unit: '', value: e.stacksInSeries },
      { name: 'Strings in parallel', unit: '', value: e.stringsInParallel },
      { name: 'DC bus voltage', unit: 'V', value: e.busVoltage_V },
      { name: 'DC bus current', unit: 'A', value: e.busCurrent_A },
    ],
  });
  const p = r.plant.power;
  if (p?.oxidiser) {
    rows.push({
      label: 'Off-gas oxidiser outlet (adiabatic) / material limit',
      text: `${formatTemperature(p.oxidiser.outletTemperature_K)} / ${formatTemperature(p.oxidiser.materialLimit_K)}`,
      data: [
        { name: 'Off-gas oxidiser outlet, adiabatic', unit: 'K', value: p.oxidiser.outletTemperature_K },
        { name: 'Off-gas oxidiser material limit', unit: 'K', value: p.oxidiser.materialLimit_K },
      ],
    });
  }
  if (p?.heatRecovery && p.chp) {
    rows.push({
      label: 'Heat delivered / total CHP efficiency, LHV / HHV',
      text: `${formatPower(p.heatRecovery.deliveredHeat_W)} / ${formatPercent(p.chp.totalEfficiencyLhv)} / ${formatPercent(p.chp.totalEfficiencyHhv)}`,
      data: [
        { name: 'Heat delivered', unit: 'W', value: p.heatRecovery.deliveredHeat_W },
        { name: 'Total CHP efficiency, LHV', unit: '', value: p.chp.totalEfficiencyLhv },
        { name: 'Total CHP efficiency, HHV', unit: '', value: p.chp.totalEfficiencyHhv },
      ],
    });
  }
  return rows;
}

/** The headline rows in the order a review reads them: the stack, its power or production, its heat, the plant. */
function headlinePairs(r: Results): Pair[] {
  const modePairs = r.technology.mode === 'power' ? powerPairs(r) : electrolysisPairs(r);
  return [...stackPairs(r), ...modePairs, ...heatAndCarbonPairs(r), ...plantPairs(r)];
}

/** The headline numbers a review reads first. */
export function headlineTable(r: Results): Table {
  return pairsTable('headline', 'Headline numbers', headlinePairs(r));
}

function conclusions(r: Results, basis: DesignBasis, hazards: HazardAssessment, checks: readonly CheckResult[], findings: readonly Finding[]): string[] {
  const h = r.headline;
  const out: string[] = [];
  const critical = findings.filter((f) => f.level === 'critical').length;
  if (critical) out.push(`The calculation raises ${critical} critical ${critical === 1 ? 'finding' : 'findings'} (below): the basis contradicts itself or the stack as stated would be damaged, and the design must change before it is issued.`);
  const j = formatQuantity(r.operatingPoint.currentDensity_A_per_m2 / 1e4, 'A/cm²');
  if (r.technology.mode === 'power') {
    const eff = h.electricalEfficiencyLhv === null ? '' : ` at a net electrical efficiency of ${formatPercent(h.electricalEfficiencyLhv)} (LHV)`;
    out.push(`${formatInteger(h.cells)} cells at ${formatQuantity(h.cellVoltage_V, 'V')} and ${j} deliver ${formatPower(h.netPower_W)} net${eff}.`);
    out.push(
      h.stackHeat_W >= 0
        ? `The stack releases ${formatPower(h.stackHeat_W)} of heat at the design point, to be carried away by ${r.heat.coolingAir_kg_per_h !== null ? `the air (${formatQuantity(r.heat.coolingAir_kg_per_h, 'kg/h')} closes the stack heat balance from the stated inlet temperature)` : 'the cooling circuit'}.`
        : `The stack needs ${formatPower(-h.stackHeat_W)} of heat at the design point.`,
    );
  } else {
    const production = h.hydrogenProduction_kg_per_day === null ? '' : ` produce ${formatQuantity(h.hydrogenProduction_kg_per_day, 'kg/day')} of hydrogen`;
    const energy = h.specificEnergy_kWh_per_kg === null ? '' : ` at ${formatQuantity(h.specificEnergy_kWh_per_kg, 'kWh/kg')}`;
    out.push(`${formatInteger(h.cells)} cells at ${formatQuantity(h.cellVoltage_V, 'V')} and ${j}${production}${energy}, taking ${formatPower(h.stackPower_W)}.`);
    out.push(
      h.stackHeat_W >= 0
        ? `Above the thermoneutral voltage (${formatQuantity(r.electrochemistry.effectiveThermoneutralVoltage_V, 'V')}) the stack releases ${formatPower(h.stackHeat_W)} of heat, to be removed.`
        : `Below the thermoneutral voltage (${formatQuantity(r.electrochemistry.effectiveThermoneutralVoltage_V, 'V')}) the stack absorbs ${formatPower(-h.stackHeat_W)}: this heat must be supplied to hold the stack temperature.`,
    );
  }
  const last = r.fuelPath.points[r.fuelPath.points.length - 1]!;
  out.push(
    `With one voltage over each cell the local current density follows the local Nernst voltage: it peaks at ${formatQuantity(h.maxLocalCurrentDensity_A_per_m2 / 1e4, 'A/cm²')} (${formatNumber(h.maxLocalCurrentDensity_A_per_m2 / r.operatingPoint.currentDensity_A_per_m2, 3)} times the mean) near the inlet and falls to ${formatQuantity(last.currentDensity_A_per_m2 / 1e4, 'A/cm²')} at the outlet.`,
  );
  if (h.carbonMargin !== null && h.minimumSteamToCarbon !== null) {
    out.push(
      h.carbonMargin >= 0
        ? `The steam-to-carbon ratio is ${formatNumber(h.carbonMargin)} above the carbon limit of ${formatNumber(h.minimumSteamToCarbon)}; the equilibrated fuel gas stays free of carbon${h.maxCarbonActivity !== null ? ` (highest carbon activity on the fuel path in the stack ${formatNumber(h.maxCarbonActivity)})` : ''}.`
        : `The steam-to-carbon ratio is ${formatNumber(-h.carbonMargin)} below the carbon limit of ${formatNumber(h.minimumSteamToCarbon)}: carbon can deposit, and the design must change before it is issued.`,
    );
  } else if (h.maxCarbonActivity === null && r.technology.mode === 'power') {
    out.push('The fuel contains no carbon, so carbon deposition does not arise.');
  }
  const open = basis.assumptions.filter((a) => a.open);
  const contradicted = r.findings.filter((f) => f.code === 'assumption-contradicted').flatMap((f) => f.assumptions);
  out.push(
    `${
      open.length
        ? `${open.length} of ${basis.assumptions.length} assumptions are still open (${open.map((a) => a.id).join(', ')}); the results hold only once they are confirmed.`
        : `All ${basis.assumptions.length} assumptions are marked confirmed.`
    }${contradicted.length ? ` The results contradict ${contradicted.length === 1 ? 'the confirmed assumption' : 'the confirmed assumptions'} ${contradicted.join(', ')} (findings below).` : ''}`,
  );
  const danger = hazards.cautions.filter((c) => c.severity === 'danger').length;
  out.push(`Section ${sectionNumber('hazards')} raises ${hazards.cautions.length} hazard cautions, ${danger} of them at danger level, for the hazard study of the design.`);
  const failed = checks.filter((c) => !c.pass).length;
  out.push(failed === 0 ? `All ${checks.length} checks of the calculation library against published values pass (section ${sectionNumber('verification')}).` : `${failed} of ${checks.length} checks against published values fail (section ${sectionNumber('verification')}): the results are not to be relied on until this is resolved.`);
  return out;
}

const SEVERITY: Record<Finding['level'], string> = { critical: 'Critical', warning: 'Warning', info: 'Info' };

/** The findings of the calculation (most severe first) and the warnings of the basis check, as the summary lists them. */
function findingItems(r: Results, basis: DesignBasis): Finding[] {
  const state = (id: string) => {
    const a = basis.assumptions.find((x) => x.id === id);
    return a ? `${id} (${a.open ? 'open' : 'confirmed'})` : id;
  };
  return [
    ...r.findings.map(
      (f): Finding => ({
        severity: SEVERITY[f.severity],
        level: f.severity,
        origin: `calculation: ${f.code}`,
        code: f.code,
        field: f.path,
        related: f.related.join(', '),
        assumptions: f.assumptions.map(state).join(', '),
        text: f.message,
        source: 'calculation',
      }),
    ),
    ...basis.warnings.map((w): Finding => ({ severity: SEVERITY.warning, level: 'warning', origin: 'basis check', code: '', field: w.path, related: '', assumptions: '', text: w.message, source: 'basis check' })),
  ];
}

/** "3 findings: 1 critical, 2 warnings." or that there are none. */
function countText(findings: readonly Finding[]): string {
  if (!findings.length) return 'No findings: the calculation and the check of the basis raised none.';
  const parts = (['critical', 'warning', 'info'] as const)
    .map((level) => [level, findings.filter((f) => f.level === level).length] as const)
    .filter(([, n]) => n > 0)
    .map(([level, n]) => `${n} ${level === 'critical' ? 'critical' : level === 'warning' ? (n === 1 ? 'warning' : 'warnings') : 'for information'}`);
  return `${findings.length} ${findings.length === 1 ? 'finding' : 'findings'}: ${parts.join(', ')}.`;
}

/** The findings as a table: the page lists them, and this is their data (severity, code, fields, assumptions, text) for the CSV and `calc --section findings`. */
function findingsData(findings: readonly Finding[]): Table {
  const text = (head: string, value: (f: Finding) => string, name = head) => ({ head, align: 'left' as const, text: value, data: [{ name, unit: '', value }] });
  return recordsTable({
    name: 'findings',
    title: 'Findings for the reviewer',
    columns: [
      text('Severity', (f) => f.severity),
      { head: 'Origin', align: 'left', text: (f) => f.origin, data: [{ name: 'Source', unit: '', value: (f) => f.source }, { name: 'Code', unit: '', value: (f) => f.code }] },
      text('Field', (f) => f.field),
      text('Finding', (f) => f.text),
      text('Also concerns', (f) => f.related),
      text('Assumptions', (f) => f.assumptions),
    ],
    groups: [{ items: findings }],
    flag: (f) => f.level === 'critical',
  });
}

/** The findings table of a design: what `calc --section findings` prints, as the summary's own. */
export function findingsTable(r: Results, basis: DesignBasis): Table {
  return findingsData(findingItems(r, basis));
}

export function summarySection(r: Results, basis: DesignBasis, hazards: HazardAssessment, checks: readonly CheckResult[]): SummarySection {
  const findings = findingItems(r, basis);
  return {
    headline: headlineTable(r),
    findings,
    findingsCount: countText(findings),
    findingsTable: findingsData(findings),
    conclusions: conclusions(r, basis, hazards, checks, findings),
  };
}
