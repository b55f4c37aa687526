/** The headline numbers of a results object as label / value rows for the terminal. */
import type { Results } from '../plant/results-schema.ts';
import { sig } from '../core/plain-text.ts';
import { feedNames } from '../basis/stream-rules.ts';
import type { TechnologyId } from '../electrochem/technologies.ts';

const pct = (x: number | null) => (x === null ? '' : `${sig(x * 100, 4)} %`);
const kw = (w: number) => `${sig(w / 1000, 5)} kW`;
/** What the inlet value is where it is not that of a gas at the inlet (fuelPath.inlet). */
const inlet: Record<Results['fuelPath']['inlet'], string> = { feed: '', limit: ' (limit u -> 0+)', 'first-increment': ' (first increment: unbounded at the dry inlet)' };

/** Stacks, strings and the DC bus (the stack's own voltage and current, never the sum over all cells). */
function layoutRows(r: Results): [string, string][] {
  const e = r.plant.electrical;
  return [
    ['stacks: cells each, in series, strings', `${e.stackCount}: ${e.cellsPerStack}, ${e.stacksInSeries}, ${e.stringsInParallel}`],
    ['stack voltage / current', `${sig(e.stackVoltage_V, 5)} V / ${sig(e.stackCurrent_A, 5)} A`],
    ['DC bus voltage / current', `${sig(e.busVoltage_V, 5)} V / ${sig(e.busCurrent_A, 5)} A`],
  ];
}

/** The power plant's blower, oxidiser and heat recovery, where the basis has them. */
function plantRows(r: Results): [string, string][] {
  const p = r.plant.power;
  if (!p) return [];
  const celsius = (k: number) => `${sig(k - 273.15, 4)} °C`;
  const rows: [string, string][] = [["plant heaters' net duty", kw(p.netDuty_W)]];
  if (p.blower) rows.push(['air blower power', kw(p.blower.power_W)]);
  if (p.oxidiser) rows.push(['oxidiser outlet (adiabatic) / limit', `${celsius(p.oxidiser.outletTemperature_K)} / ${celsius(p.oxidiser.materialLimit_K)}`]);
  if (p.heatRecovery) rows.push(['heat recovered / delivered', `${kw(p.heatRecovery.heatWithCondensation_W)} / ${kw(p.heatRecovery.deliveredHeat_W)}`]);
  if (p.chp) rows.push(['CHP efficiency (LHV / HHV)', `${pct(p.chp.totalEfficiencyLhv)} / ${pct(p.chp.totalEfficiencyHhv)}`]);
  return rows;
}

export function headlineRows(r: Results): [string, string][] {
  const h = r.headline;
  const power = r.technology.mode === 'power';
  const rows: [string, string][] = [
    ['Nernst voltage, inlet / outlet', `${sig(h.inletNernst_V, 5)} V${inlet[r.fuelPath.inlet]} / ${sig(h.outletNernst_V, 5)} V`],
    ['Nernst voltage, area mean / charge mean', `${sig(r.electrochemistry.areaMeanNernst_V, 5)} V / ${sig(h.meanNernst_V, 5)} V`],
    ['cell voltage', `${sig(h.cellVoltage_V, 4)} V (${r.electrochemistry.voltageSource === 'given' ? 'given' : 'from area-specific resistance'})`],
    ['local current density, mean / highest', `${sig(r.operatingPoint.currentDensity_A_per_m2 / 1e4, 4)} / ${sig(h.maxLocalCurrentDensity_A_per_m2 / 1e4, 4)} A/cm2`],
    ['cells, cell current, Σ cell currents', `${h.cells}, ${sig(h.cellCurrent_A, 5)} A, ${sig(h.totalCurrent_A, 5)} A`],
    ...layoutRows(r),
    [power ? 'stack DC power / net power' : 'stack power input', power ? `${kw(h.stackPower_W)} / ${kw(h.netPower_W)}` : kw(h.stackPower_W)],
  ];
  if (power) {
    rows.push(['electrical efficiency, net (LHV / HHV)', `${pct(h.electricalEfficiencyLhv)} / ${pct(h.electricalEfficiencyHhv)}`]);
    rows.push(['thermodynamic limit at T (LHV / HHV)', `${pct(h.thermodynamicLimitLhv)} / ${pct(h.thermodynamicLimitHhv)}`]);
  } else {
    rows.push(['hydrogen production', `${sig(h.hydrogenProduction_kg_per_h!, 5)} kg/h (${sig(h.hydrogenProduction_kg_per_day!, 5)} kg/day)`]);
    rows.push(['specific energy', `${sig(h.specificEnergy_kWh_per_kg!, 4)} kWh/kg (electricity only; over electricity alone: LHV efficiency ${pct(r.efficiency.electrolysisEfficiencyLhv)}, HHV ${pct(r.efficiency.electrolysisEfficiencyHhv)})`]);
    rows.push(['heat-counted efficiency (LHV / HHV)', `${pct(r.efficiency.heatInclusiveEfficiencyLhv)} / ${pct(r.efficiency.heatInclusiveEfficiencyHhv)}`]);
  }
  rows.push([h.stackHeat_W >= 0 ? 'stack heat released (isothermal)' : 'stack heat needed (isothermal)', kw(Math.abs(h.stackHeat_W))]);
  if (h.airFlow_kg_per_h !== null) rows.push([feedNames(r.technology.id as TechnologyId, r.technology.mode).air, `${sig(h.airFlow_kg_per_h, 5)} kg/h`]);
  if (h.minimumSteamToCarbon !== null) {
    rows.push(['minimum steam-to-carbon / margin', `${sig(h.minimumSteamToCarbon, 4)} / ${h.carbonMargin === null ? 'no steam given' : sig(h.carbonMargin, 4)}`]);
  }
  if (h.maxCarbonActivity !== null) rows.push(['highest carbon activity, stack fuel path', sig(h.maxCarbonActivity, 4)]);
  rows.push(...plantRows(r));
  return rows;
}

/** The envelope of the operating cases as label / value rows: each quantity's governing value and the case that sets it; [] without cases. */
export function envelopeRows(r: Results): [string, string][] {
  return (r.envelope ?? []).map((e) => [`${e.quantity}${/\((highest|lowest|least|most)\)$/.test(e.quantity) ? '' : e.governs === 'max' ? ' (highest)' : ' (lowest)'}`, `${sig(e.value, 4)}${e.unit === '1' ? '' : ` ${e.unit}`}, case ${e.case}`]);
}
