/**
 * The tables of section 6 beside the worked lines: the remaining figures of each part of the
 * results (electrochemistry, operating point, efficiency, heat, carbon) and the stream table,
 * one column per stream with its state, flows, enthalpy flow and gas composition.
 */
import { efficiencyBasisNotes } from '../efficiency-basis.ts';
import type { Results, StreamResult } from '../../plant/results-schema.ts';
import { formatFixed, formatInteger, formatNumber, formatPercent, formatPower, formatQuantity, formatTemperature } from '../format.ts';
import { pairs, table, type Table, type TableRow } from '../table.ts';
import { speciesText } from '../species-text.ts';
import { ZERO_CELSIUS_K } from '../../core/units.ts';

export interface FigureTable {
  id: string;
  title: string;
  table: Table;
}

type Row = [string, string];

function present(rows: (Row | null)[]): Row[] {
  return rows.filter((r): r is Row => r !== null);
}

function opt(label: string, value: number | null, show: (v: number) => string): Row | null {
  return value === null ? null : [label, show(value)];
}

function electrochemistry(r: Results): Row[] {
  const e = r.electrochemistry;
  return present([
    ['Standard voltage E° at T (Nernst equation)', formatQuantity(e.standardVoltage_V, 'V', 5)],
    ['Thermoneutral voltage of H₂ + ½O₂ → H₂O at T', formatQuantity(e.thermoneutralVoltage_V, 'V', 5)],
    ['Effective thermoneutral voltage of the actual gases', formatQuantity(e.effectiveThermoneutralVoltage_V, 'V', 5)],
    [r.technology.mode === 'power' ? 'Effective mean Nernst voltage (transference number × Ē − crossover allowance)' : 'Mean Nernst voltage Ē', formatQuantity(e.effectiveNernst_V, 'V', 5)],
    ['Area-specific resistance', `${formatQuantity(e.areaSpecificResistance_ohm_m2 * 1e4, 'Ω cm²')} (${e.voltageSource === 'given' ? 'implied by the given voltage' : 'given'})`],
    ['Ionic transference number / crossover allowance', `${formatNumber(e.ionicTransferenceNumber)} / ${formatQuantity(e.crossoverAllowance_V * 1000, 'mV')}`],
    [r.technology.mode === 'power' ? 'Fuel utilization' : 'Conversion of the feed', formatPercent(e.utilization)],
    ['Charge of complete reaction of the feed', formatQuantity(e.chargeBasis_A, 'A', 6)],
    ['Largest element-balance error along the fuel path', formatNumber(e.elementBalanceError, 2)],
  ]);
}

function operatingPoint(r: Results): Row[] {
  const o = r.operatingPoint;
  return present([
    ['Current density', `${formatQuantity(o.currentDensity_A_per_m2, 'A/m²')} (${formatQuantity(o.currentDensity_A_per_m2 / 1e4, 'A/cm²')})`],
    ['Active area per cell / total', `${formatQuantity(o.activeArea_m2 * 1e4, 'cm²')} / ${formatQuantity(o.totalActiveArea_m2, 'm²')}`],
    ['Cell count set by', o.cellsFrom === 'cells' ? 'the cell count of the basis' : o.cellsFrom === 'power' ? 'the target power' : 'the target hydrogen production'],
    ['Cells', formatInteger(r.headline.cells)],
    ['Series voltage of all cells (N × V; not a terminal voltage: see the electrical layout)', formatQuantity(r.headline.stackVoltage_V, 'V')],
    r.technology.mode === 'power' ? ['Balance-of-plant share', formatPercent(o.parasiticFraction)] : null,
    opt('Air utilization', o.airUtilization, (v) => formatPercent(v)),
    opt('Air ratio (O₂ fed / O₂ consumed)', o.airRatio, (v) => formatNumber(v)),
    opt('Oxygen consumed', o.oxygenConsumed_mol_per_s, (v) => formatQuantity(v, 'mol/s')),
    ['Net water produced (negative: consumed)', formatQuantity(o.netWaterProduced_mol_per_s, 'mol/s')],
  ]);
}

function efficiency(r: Results): Row[] {
  const e = r.efficiency;
  const pct = (v: number) => formatPercent(v);
  const notes = efficiencyBasisNotes(r);
  // A figure whose basis needs saying (above 100 %) carries its note beside the number.
  const noted = (key: keyof typeof notes) => (v: number) => (notes[key] ? `${pct(v)} (${notes[key]})` : pct(v));
  return present([
    opt('Fuel input, LHV', e.fuelLhvInput_W, (v) => formatPower(v)),
    opt('Fuel input, HHV', e.fuelHhvInput_W, (v) => formatPower(v)),
    opt('Thermodynamic limit at T, LHV', e.thermodynamicLimitLhv, noted('thermodynamicLimitLhv')),
    opt('Thermodynamic limit at T, HHV', e.thermodynamicLimitHhv, noted('thermodynamicLimitHhv')),
    opt('Carnot limit (for comparison)', e.carnotLimit, pct),
    ['Voltage efficiency', pct(e.voltageEfficiency)],
    opt('Electrical efficiency, gross, LHV', e.electricalEfficiencyLhvGross, pct),
    opt('Electrical efficiency, gross, HHV', e.electricalEfficiencyHhvGross, pct),
    opt('Electrical efficiency, net, LHV', e.electricalEfficiencyLhvNet, pct),
    opt('Electrical efficiency, net, HHV', e.electricalEfficiencyHhvNet, pct),
    opt('Electrolysis efficiency over electricity alone, LHV', e.electrolysisEfficiencyLhv, noted('electrolysisEfficiencyLhv')),
    opt('Electrolysis efficiency over electricity alone, HHV', e.electrolysisEfficiencyHhv, noted('electrolysisEfficiencyHhv')),
    opt('Electrolysis efficiency with the heat supplied counted, LHV (electricity and the heat the stack absorbs)', e.heatInclusiveEfficiencyLhv, pct),
    opt('Electrolysis efficiency with the heat supplied counted, HHV (also the latent heat of the steam consumed)', e.heatInclusiveEfficiencyHhv, pct),
    opt('Latent heat (25 °C) of the water consumed as steam', e.steamLatentHeat_W, (v) => formatPower(v)),
    opt('Heating value of the products, LHV (net of the feed)', e.productLhv_W, (v) => formatPower(v)),
    opt('Specific electric energy (electricity only)', e.specificEnergy_kWh_per_kg, (v) => formatQuantity(v, 'kWh/kg')),
    opt('Hydrogen produced', e.hydrogenProduction_mol_per_s, (v) => formatQuantity(v, 'mol/s')),
    opt('Oxygen produced', e.oxygenProduction_mol_per_s, (v) => formatQuantity(v, 'mol/s')),
    e.carbonMonoxideProduction_mol_per_s ? ['Carbon monoxide produced', formatQuantity(e.carbonMonoxideProduction_mol_per_s, 'mol/s')] : null,
    e.methaneProduction_mol_per_s ? ['Methane formed in the equilibrated outlet', formatQuantity(e.methaneProduction_mol_per_s, 'mol/s')] : null,
  ]);
}

function heat(r: Results): Row[] {
  const h = r.heat;
  return present([
    ['Heat released, isothermal boundary (negative: needed)', formatPower(h.isothermalHeat_W)],
    ['Heat released with the feeds at their inlet temperatures', formatPower(h.asFedHeat_W)],
    ['Enthalpy flow in, at the stack temperature / as fed', `${formatPower(h.inletEnthalpyIsothermal_W)} / ${formatPower(h.inletEnthalpyAsFed_W)}`],
    ['Enthalpy flow out', formatPower(h.outletEnthalpy_W)],
    ['Electric work into the stack', formatPower(h.electricWorkIn_W)],
    ['Heat per cell / per unit active area', `${formatQuantity(h.heatPerCell_W, 'W')} / ${formatQuantity(h.heatPerArea_W_per_m2, 'W/m²')}`],
    opt('Cooling air for the allowed rise', h.coolingAir_kg_per_h, (v) => `${formatQuantity(v, 'kg/h')} (${formatNumber(h.allowedAirTemperatureRise_K)} K rise)`),
    opt('Cooling air over the air the oxygen needs', h.coolingAirRatio, (v) => formatNumber(v)),
    opt('Cross-check for pure hydrogen, I(−ΔH(T)/2F − V)', h.hydrogenCrossCheck_W, (v) => formatPower(v)),
    opt('Heat to supply', h.heatDemand_W, (v) => formatPower(v)),
    opt('Liquid water leaving', h.liquidWaterOut_mol_per_s, (v) => formatQuantity(v, 'mol/s')),
    h.outletsSaturated === null ? null : ['Both outlet gases saturated with water vapour', h.outletsSaturated ? 'yes' : 'no: the cell dries out'],
  ]);
}

function carbon(r: Results): Row[] {
  const c = r.carbon;
  return present([
    opt('Design steam-to-carbon ratio', c.steamToCarbon, (v) => formatNumber(v)),
    opt('Least carbon-free S/C at the stack temperature', c.minimumSteamToCarbonStack, (v) => formatNumber(v)),
    opt('Least carbon-free S/C at the pre-reformer temperature', c.minimumSteamToCarbonPreReformer, (v) => formatNumber(v)),
    opt('Carbon activity at the pre-reformer outlet, at the pre-reformer temperature (before the stack; not on the fuel path)', c.preReformerCarbonActivity, (v) => formatNumber(v)),
    opt('Carbon activity of the equilibrated gas at the stack inlet', c.inletCarbonActivity, (v) => formatNumber(v)),
    opt('Highest carbon activity on the fuel path in the stack, at the stack temperature (the pre-reformer not included)', c.maxCarbonActivity, (v) => formatNumber(v)),
  ]);
}

export function figureTables(r: Results): FigureTable[] {
  const list: FigureTable[] = [
    { id: 'figures-electrochemistry', title: 'Electrochemistry', table: pairs(electrochemistry(r)) },
    { id: 'figures-operating-point', title: 'Operating point', table: pairs(operatingPoint(r)) },
    { id: 'figures-efficiency', title: 'Efficiency figures', table: pairs(efficiency(r)) },
    { id: 'figures-heat', title: 'Heat balance', table: pairs(heat(r)) },
  ];
  const c = carbon(r);
  if (c.length) list.push({ id: 'figures-carbon', title: 'Carbon deposition', table: pairs(c) });
  return list;
}

/** Species shown in the stream table: every one reaching 1 ppm in some stream, largest first. */
function speciesOf(streams: readonly StreamResult[]): string[] {
  const peak = new Map<string, number>();
  for (const s of streams) for (const [k, x] of Object.entries(s.moleFractions)) peak.set(k, Math.max(peak.get(k) ?? 0, x));
  return [...peak.entries()].filter(([, x]) => x >= 1e-6).sort((a, b) => b[1] - a[1]).map(([k]) => k);
}

/** One column per stream with its state, flows, enthalpy flow and gas composition. */
function streamColumns<S extends StreamResult>(streams: readonly S[], heading: (s: S) => string): Table {
  const row = (label: string, cell: (s: S) => string): TableRow => ({ cells: [label, ...streams.map(cell)] });
  const rows: TableRow[] = [
    row('Temperature, °C', (s) => formatFixed(s.temperature_K - ZERO_CELSIUS_K, 1)),
    row('Pressure, bar', (s) => formatNumber(s.pressure_bar)),
    row('Molar flow, mol/s', (s) => formatNumber(s.flow_mol_per_s)),
    row('Mass flow, kg/h', (s) => formatNumber(s.massFlow_kg_per_h)),
    row('Gas volume flow, m³(n)/h', (s) => formatNumber(s.normalVolume_Nm3_per_h)),
    row('Enthalpy flow, kW', (s) => formatNumber(s.enthalpyFlow_W / 1000)),
  ];
  if (streams.some((s) => (s.speciesFlows_mol_per_s['H2O(L)'] ?? 0) > 0)) {
    rows.push(row('Liquid water, mol/s', (s) => formatNumber(s.speciesFlows_mol_per_s['H2O(L)'] ?? 0)));
  }
  rows.push({ group: 'Gas composition, mol %', cells: [] });
  for (const species of speciesOf(streams)) {
    rows.push(row(speciesText(species), (s) => (s.moleFractions[species] === undefined ? '' : formatNumber(s.moleFractions[species]! * 100, 4))));
  }
  return table(['', ...streams.map(heading)], ['left', ...streams.map(() => 'right' as const)], rows);
}

export function streamTable(r: Results): Table {
  return streamColumns(r.streams, (s) => s.name);
}

/** The heat-and-material balance: every numbered stream of the plant (enthalpy flows absolute, heats of formation included). */
export function heatAndMaterialBalance(r: Results): Table {
  return streamColumns(r.plant.streams, (s) => `${s.number}. ${s.name}`);
}

const kW = (w: number) => formatQuantity(w / 1000, 'kW');

function electricalLayout(r: Results): Row[] {
  const e = r.plant.electrical;
  const power = r.technology.mode === 'power';
  return [
    ['Cells per stack / stacks in series / strings in parallel', `${formatInteger(e.cellsPerStack)} / ${formatInteger(e.stacksInSeries)} / ${formatInteger(e.stringsInParallel)}`],
    ['Stacks in series set by', e.stacksInSeriesFrom === 'given' ? 'the basis' : 'the DC bus voltage window'],
    ['Stacks / cells installed (cells required)', `${formatInteger(e.stackCount)} / ${formatInteger(e.installedCells)} (${formatInteger(e.requiredCells)})`],
    ['Stack voltage / stack current', `${formatQuantity(e.stackVoltage_V, 'V')} / ${formatQuantity(e.stackCurrent_A, 'A')}`],
    ['String voltage / string current', `${formatQuantity(e.stringVoltage_V, 'V')} / ${formatQuantity(e.stringCurrent_A, 'A')}`],
    ['DC bus voltage / bus current', `${formatQuantity(e.busVoltage_V, 'V')} / ${formatQuantity(e.busCurrent_A, 'A')}`],
    ['DC power of the installed cells', formatPower(e.dcPower_W)],
    [power ? 'Inverter efficiency / AC power delivered' : 'Rectifier efficiency / AC power drawn', `${formatPercent(e.conversionEfficiency)} / ${formatPower(e.acPower_W)}`],
    ['Conversion loss', formatPower(e.conversionLoss_W)],
  ];
}

function duties(p: NonNullable<Results['plant']['power']>): Row[] {
  const rows: Row[] = p.duties.map((d) => [`${d.name} (${formatTemperature(d.from_K)} → ${formatTemperature(d.to_K)})`, kW(d.duty_W)]);
  rows.push(["Net duty of the plant's heaters", kW(p.netDuty_W)]);
  if (p.steam) rows.push(['Feed water / saturation temperature', `${formatQuantity(p.steam.water_kg_per_h, 'kg/h')} / ${formatTemperature(p.steam.saturationTemperature_K)}`]);
  if (p.blower) {
    rows.push(['Air blower: pressure', `${formatQuantity(p.blower.inletPressure_bar, 'bar')} → ${formatQuantity(p.blower.outletPressure_bar, 'bar')}`]);
    rows.push(['Air blower: temperature', `${formatTemperature(p.blower.inletTemperature_K)} → ${formatTemperature(p.blower.outletTemperature_K)}`]);
    rows.push(['Air blower power (isentropic efficiency)', `${kW(p.blower.power_W)} (${formatPercent(p.blower.isentropicEfficiency)}); the parasitic load allows ${kW(p.blower.parasiticAllowance_W)} in all`]);
  }
  rows.push(['Stack heat with the inlets as fed, and where it goes', `${kW(p.stackHeat_W)}, ${p.stackHeatTo}`]);
  rows.push(['Air-electrode exhaust temperature', formatTemperature(p.airExhaustTemperature_K)]);
  return rows;
}

function oxidiserAndRecovery(p: NonNullable<Results['plant']['power']>): Row[] {
  const rows: Row[] = [];
  const o = p.oxidiser;
  if (o) {
    rows.push(['Oxidant', o.oxidant === 'fresh-air' ? `fresh air, ${formatNumber(o.airRatio!)} times the oxygen complete combustion needs` : 'the air-electrode exhaust']);
    rows.push(['Adiabatic outlet temperature (equilibrium products) / material limit', `${formatTemperature(o.outletTemperature_K)} / ${formatTemperature(o.materialLimit_K)}`]);
    rows.push(['Heat of the combustion (at 25 °C)', kW(o.heatReleased_W)]);
    rows.push(['CO left in the products', formatQuantity(o.carbonMonoxide_ppm, 'ppm')]);
    rows.push(['Products, mol %', Object.entries(o.moleFractions).filter(([, x]) => x >= 1e-4).sort((a, b) => b[1] - a[1]).map(([k, x]) => `${speciesText(k)} ${formatNumber(x * 100, 4)}`).join(', ')]);
  }
  const h = p.heatRecovery;
  if (h) {
    rows.push(['Exhaust into / out of the heat recovery', `${formatTemperature(h.inletTemperature_K)} / ${formatTemperature(h.exitTemperature_K)}`]);
    rows.push(['Dew point of the exhaust (IAPWS-IF97)', h.dewPoint_K === null ? 'none' : formatTemperature(h.dewPoint_K)]);
    rows.push(['Heat recovered without / with condensation', `${kW(h.heatWithoutCondensation_W)} / ${kW(h.heatWithCondensation_W)}`]);
    rows.push(['Condensate', formatQuantity(h.condensate_kg_per_h, 'kg/h')]);
    rows.push(['Heat lost to ambient', kW(p.heatLoss_W)]);
    rows.push(['Heat delivered', kW(h.deliveredHeat_W)]);
  }
  const c = p.chp;
  if (c) {
    rows.push(['Electrical / thermal efficiency (LHV)', `${formatPercent(c.electricalEfficiencyLhv)} / ${formatPercent(c.thermalEfficiencyLhv)}`]);
    rows.push(['Total CHP efficiency, LHV / HHV', `${formatPercent(c.totalEfficiencyLhv)} / ${formatPercent(c.totalEfficiencyHhv)}`]);
    if (c.powerToHeat !== null) rows.push(['Power-to-heat ratio', formatNumber(c.powerToHeat)]);
  }
  return rows;
}

function energyBalance(p: NonNullable<Results['plant']['power']>): Row[] {
  const b = p.energyBalance;
  return [
    ...b.terms.map((t): Row => [`${t.side === 'in' ? 'In' : 'Out'}: ${t.name}`, kW(t.value_W)]),
    ['Residual (in − out) / fuel LHV input', formatNumber(b.residual, 2)],
  ];
}

/** The tables of the plant around the stack. */
export function plantTables(r: Results): FigureTable[] {
  const list: FigureTable[] = [{ id: 'plant-electrical', title: 'Electrical layout', table: pairs(electricalLayout(r)) }];
  const p = r.plant.power;
  if (p) {
    list.push({ id: 'plant-duties', title: 'Fuel and air preparation', table: pairs(duties(p)) });
    const o = oxidiserAndRecovery(p);
    if (o.length) list.push({ id: 'plant-oxidiser', title: 'Off-gas oxidiser, heat recovery and combined heat and power', table: pairs(o) });
    list.push({ id: 'plant-energy', title: 'Energy balance of the plant (absolute enthalpy flows, heats of formation included)', table: pairs(energyBalance(p)) });
  }
  return list;
}
