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
import { pairs, type Table } from '../table.ts';
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
  conclusions: string[];
}

/** Beside the inlet Nernst voltage where it is not that of a gas at the inlet (fuelPath.inlet). */
function inletRemark(r: Results): string {
  if (r.fuelPath.inlet === 'limit') return ' (limit u → 0⁺: no feed on one electrode)';
  if (r.fuelPath.inlet === 'first-increment') return ` (first increment, u = ${formatPercent(r.fuelPath.inletUtilization, 2)}: unbounded at the dry inlet)`;
  return '';
}

function headlineRows(r: Results): [string, string][] {
  const h = r.headline;
  const power = r.technology.mode === 'power';
  const notes = efficiencyBasisNotes(r);
  const rows: [string, string][] = [
    ['Operating temperature', formatTemperature(r.conditions.temperature_K)],
    ['Fuel-electrode / air-electrode pressure', `${formatNumber(r.conditions.fuelPressure_bar)} / ${formatNumber(r.conditions.airPressure_bar)} bar`],
    ['Nernst voltage, inlet / outlet', `${formatQuantity(h.inletNernst_V, 'V')}${inletRemark(r)} / ${formatQuantity(h.outletNernst_V, 'V')}`],
    ['Nernst voltage, area mean / charge mean', `${formatQuantity(r.electrochemistry.areaMeanNernst_V, 'V')} / ${formatQuantity(h.meanNernst_V, 'V')}`],
    ['Cell voltage', `${formatQuantity(h.cellVoltage_V, 'V')} (${r.electrochemistry.voltageSource === 'given' ? 'given' : 'from the area-specific resistance, one voltage over the cell'})`],
    ['Local current density, mean / highest (hot spot)', `${formatQuantity(r.operatingPoint.currentDensity_A_per_m2 / 1e4, 'A/cm²')} / ${formatQuantity(h.maxLocalCurrentDensity_A_per_m2 / 1e4, 'A/cm²')}`],
    ['Cells / cell current / sum of the cell currents', `${formatInteger(h.cells)} / ${formatQuantity(h.cellCurrent_A, 'A')} / ${formatQuantity(h.totalCurrent_A, 'A')}`],
  ];
  if (power) {
    rows.push(['Stack DC power / net power', `${formatPower(h.stackPower_W)} / ${formatPower(h.netPower_W)}`]);
    if (h.electricalEfficiencyLhv !== null && h.electricalEfficiencyHhv !== null) {
      rows.push(['Net electrical efficiency, LHV / HHV', `${formatPercent(h.electricalEfficiencyLhv)} / ${formatPercent(h.electricalEfficiencyHhv)}`]);
    }
    if (h.thermodynamicLimitLhv !== null && h.thermodynamicLimitHhv !== null) {
      const why = notes.thermodynamicLimitLhv ?? notes.thermodynamicLimitHhv;
      rows.push(['Thermodynamic limit at T, LHV / HHV', `${formatPercent(h.thermodynamicLimitLhv)} / ${formatPercent(h.thermodynamicLimitHhv)}${why ? ` (${why})` : ''}`]);
    }
  } else {
    rows.push(['Stack power input', formatPower(h.stackPower_W)]);
    if (h.hydrogenProduction_kg_per_h !== null && h.hydrogenProduction_kg_per_day !== null) {
      rows.push(['Hydrogen production', `${formatQuantity(h.hydrogenProduction_kg_per_h, 'kg/h')} (${formatQuantity(h.hydrogenProduction_kg_per_day, 'kg/day')})`]);
    }
    const e = r.efficiency;
    if (h.specificEnergy_kWh_per_kg !== null && e.electrolysisEfficiencyLhv !== null && e.electrolysisEfficiencyHhv !== null) {
      const why = notes.electrolysisEfficiencyHhv ?? notes.electrolysisEfficiencyLhv;
      rows.push([
        'Specific electric energy / efficiency over electricity alone, LHV / HHV',
        `${formatQuantity(h.specificEnergy_kWh_per_kg, 'kWh/kg')} / ${formatPercent(e.electrolysisEfficiencyLhv)} / ${formatPercent(e.electrolysisEfficiencyHhv)}${why ? ` (HHV ${why})` : ''}`,
      ]);
    }
    if (e.heatInclusiveEfficiencyLhv !== null && e.heatInclusiveEfficiencyHhv !== null) {
      rows.push(['Efficiency with the heat supplied counted, LHV / HHV', `${formatPercent(e.heatInclusiveEfficiencyLhv)} / ${formatPercent(e.heatInclusiveEfficiencyHhv)}`]);
    }
  }
  rows.push([h.stackHeat_W >= 0 ? 'Stack heat released (isothermal)' : 'Stack heat needed (isothermal)', formatPower(Math.abs(h.stackHeat_W))]);
  if (h.airFlow_kg_per_h !== null) {
    const name = feedNames(r.technology.id as TechnologyId, r.technology.mode).air;
    rows.push([capitalised(name), formatQuantity(h.airFlow_kg_per_h, 'kg/h')]);
  }
  if (h.minimumSteamToCarbon !== null) {
    rows.push(['Minimum steam-to-carbon ratio / margin', `${formatNumber(h.minimumSteamToCarbon)} / ${h.carbonMargin === null ? 'no steam given' : formatNumber(h.carbonMargin)}`]);
  }
  if (h.maxCarbonActivity !== null) rows.push(['Highest carbon activity on the fuel path in the stack (stack temperature)', formatNumber(h.maxCarbonActivity)]);
  const e = r.plant.electrical;
  rows.push(['Stacks (cells each × in series × strings) / DC bus', `${formatInteger(e.stackCount)} (${formatInteger(e.cellsPerStack)} × ${formatInteger(e.stacksInSeries)} × ${formatInteger(e.stringsInParallel)}) / ${formatQuantity(e.busVoltage_V, 'V')}, ${formatQuantity(e.busCurrent_A, 'A')}`]);
  const p = r.plant.power;
  if (p?.oxidiser) rows.push(['Off-gas oxidiser outlet (adiabatic) / material limit', `${formatTemperature(p.oxidiser.outletTemperature_K)} / ${formatTemperature(p.oxidiser.materialLimit_K)}`]);
  if (p?.heatRecovery && p.chp) {
    rows.push(['Heat delivered / total CHP efficiency, LHV / HHV', `${formatPower(p.heatRecovery.deliveredHeat_W)} / ${formatPercent(p.chp.totalEfficiencyLhv)} / ${formatPercent(p.chp.totalEfficiencyHhv)}`]);
  }
  return rows;
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
        ? `The stack releases ${formatPower(h.stackHeat_W)} of heat at the design point, to be carried away by ${r.heat.coolingAir_kg_per_h !== null ? `the air (${formatQuantity(r.heat.coolingAir_kg_per_h, 'kg/h')} for a ${formatNumber(r.heat.allowedAirTemperatureRise_K)} K rise)` : 'the cooling circuit'}.`
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
        field: f.path,
        related: f.related.join(', '),
        assumptions: f.assumptions.map(state).join(', '),
        text: f.message,
        source: 'calculation',
      }),
    ),
    ...basis.warnings.map((w): Finding => ({ severity: SEVERITY.warning, level: 'warning', origin: 'basis check', field: w.path, related: '', assumptions: '', text: w.message, source: 'basis check' })),
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

export function summarySection(r: Results, basis: DesignBasis, hazards: HazardAssessment, checks: readonly CheckResult[]): SummarySection {
  const findings = findingItems(r, basis);
  return { headline: pairs(headlineRows(r)), findings, findingsCount: countText(findings), conclusions: conclusions(r, basis, hazards, checks, findings) };
}
