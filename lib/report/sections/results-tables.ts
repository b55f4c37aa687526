/**
 * The tables of section 6 beside the worked lines: the remaining figures of each part of the
 * results (electrochemistry, operating point, efficiency, heat, carbon) and the stream table,
 * one column per stream with its state, flows, enthalpy flow and gas composition.
 */
import { efficiencyBasisNotes } from '../efficiency-basis.ts';
import type { Results, StreamResult } from '../../plant/results-schema.ts';
import { formatCelsius, formatInteger, formatNumber, formatPercent, formatPower, formatQuantity, formatTemperature } from '../format.ts';
import { crossTable, pairsTable, quantity, textPair, type CrossRow, type Pair, type Table } from '../table.ts';
import { speciesText } from '../species-text.ts';

export interface FigureTable {
  id: string;
  title: string;
  table: Table;
}

function present(rows: (Pair | null)[]): Pair[] {
  return rows.filter((r): r is Pair => r !== null);
}

/** A quantity that may be absent (null): no row then. */
function opt(label: string, value: number | null, unit: string, show: (v: number) => string): Pair | null {
  return value === null ? null : quantity(label, value, unit, show(value));
}

const pct = (v: number) => formatPercent(v);

function electrochemistry(r: Results): Pair[] {
  const e = r.electrochemistry;
  const power = r.technology.mode === 'power';
  return present([
    quantity('Standard voltage E° at T (Nernst equation)', e.standardVoltage_V, 'V', formatQuantity(e.standardVoltage_V, 'V', 5)),
    quantity('Thermoneutral voltage of H₂ + ½O₂ → H₂O at T', e.thermoneutralVoltage_V, 'V', formatQuantity(e.thermoneutralVoltage_V, 'V', 5)),
    quantity('Effective thermoneutral voltage of the actual gases', e.effectiveThermoneutralVoltage_V, 'V', formatQuantity(e.effectiveThermoneutralVoltage_V, 'V', 5)),
    // effectiveNernst_V is t Ē_A ∓ ΔV_x of the area-mean Nernst voltage (Eq. 16: V = it ∓ j ASR), not of the charge mean Ē.
    quantity(
      power ? 'Area-mean driving voltage (transference number × area-mean Nernst voltage Ē_A − crossover allowance)' : 'Area-mean driving voltage (transference number × area-mean Nernst voltage Ē_A)',
      e.effectiveNernst_V,
      'V',
      formatQuantity(e.effectiveNernst_V, 'V', 5),
    ),
    {
      label: 'Area-specific resistance',
      text: `${formatQuantity(e.areaSpecificResistance_ohm_m2 * 1e4, 'Ω cm²')} (${e.voltageSource === 'given' ? 'implied by the given voltage' : 'given'})`,
      data: [
        { name: 'Area-specific resistance', unit: 'ohm m2', value: e.areaSpecificResistance_ohm_m2 },
        { name: 'Area-specific resistance from', unit: '', value: e.voltageSource === 'given' ? 'the given cell voltage' : 'the basis' },
      ],
    },
    {
      label: 'Ionic transference number / crossover allowance',
      text: `${formatNumber(e.ionicTransferenceNumber)} / ${formatQuantity(e.crossoverAllowance_V * 1000, 'mV')}`,
      data: [
        { name: 'Ionic transference number', unit: '', value: e.ionicTransferenceNumber },
        { name: 'Crossover allowance', unit: 'V', value: e.crossoverAllowance_V },
      ],
    },
    ...activationRows(r),
    quantity(power ? 'Fuel utilization' : 'Conversion of the feed', e.utilization, '', pct(e.utilization)),
    quantity('Charge of complete reaction of the feed', e.chargeBasis_A, 'A', formatQuantity(e.chargeBasis_A, 'A', 6)),
    quantity('Largest element-balance error along the fuel path', e.elementBalanceError, '', formatNumber(e.elementBalanceError, 2)),
  ]);
}

/**
 * With an activation loss: its two values, and the breakdown of the design point's voltage into the
 * area-mean Nernst voltage and the losses (V = Ē_A − ΔV_x − η̄_A − j ASR in power mode, Ē_A + η̄_A +
 * j ASR in electrolysis); none without.
 */
function activationRows(r: Results): Pair[] {
  const e = r.electrochemistry;
  const a = e.activationLoss;
  if (!a) return [];
  const power = r.technology.mode === 'power';
  const mv = (v: number) => formatQuantity(v * 1000, 'mV', 4);
  return [
    {
      label: 'Activation loss: Tafel slope / exchange current density',
      text: `${formatQuantity(a.tafelSlope_V_per_decade * 1000, 'mV')} per decade / ${formatQuantity(a.exchangeCurrentDensity_A_per_m2 / 1e4, 'A/cm²')}`,
      data: [
        { name: 'Tafel slope', unit: 'V per decade', value: a.tafelSlope_V_per_decade },
        { name: 'Exchange current density', unit: 'A/m2', value: a.exchangeCurrentDensity_A_per_m2 },
      ],
    },
    {
      label: power
        ? 'Loss breakdown: area-mean Nernst voltage − crossover allowance − activation loss (area mean) − ohmic loss = cell voltage'
        : 'Loss breakdown: area-mean Nernst voltage + activation loss (area mean) + ohmic loss = cell voltage',
      text: power
        ? `${formatQuantity(e.areaMeanNernst_V, 'V', 5)} − ${mv(e.crossoverAllowance_V)} − ${mv(a.areaMean_V)} − ${mv(a.ohmic_V)} = ${formatQuantity(r.headline.cellVoltage_V, 'V', 5)}`
        : `${formatQuantity(e.areaMeanNernst_V, 'V', 5)} + ${mv(a.areaMean_V)} + ${mv(a.ohmic_V)} = ${formatQuantity(r.headline.cellVoltage_V, 'V', 5)}`,
      data: [
        { name: 'Loss breakdown: area-mean Nernst voltage', unit: 'V', value: e.areaMeanNernst_V },
        ...(power ? [{ name: 'Loss breakdown: crossover allowance', unit: 'V', value: e.crossoverAllowance_V }] : []),
        { name: 'Loss breakdown: activation loss, area mean', unit: 'V', value: a.areaMean_V },
        { name: 'Loss breakdown: activation loss at the mean current density', unit: 'V', value: a.atMeanCurrentDensity_V },
        { name: 'Loss breakdown: ohmic loss', unit: 'V', value: a.ohmic_V },
        { name: 'Loss breakdown: cell voltage', unit: 'V', value: r.headline.cellVoltage_V },
      ],
    },
  ];
}

const CELLS_FROM: Record<Results['operatingPoint']['cellsFrom'], string> = {
  cells: 'the cell count of the basis',
  power: 'the target power',
  hydrogen: 'the target hydrogen production',
};

function operatingPoint(r: Results): Pair[] {
  const o = r.operatingPoint;
  return present([
    quantity('Current density', o.currentDensity_A_per_m2, 'A/m2', `${formatQuantity(o.currentDensity_A_per_m2, 'A/m²')} (${formatQuantity(o.currentDensity_A_per_m2 / 1e4, 'A/cm²')})`),
    {
      label: 'Active area per cell / total',
      text: `${formatQuantity(o.activeArea_m2 * 1e4, 'cm²')} / ${formatQuantity(o.totalActiveArea_m2, 'm²')}`,
      data: [
        { name: 'Active area per cell', unit: 'm2', value: o.activeArea_m2 },
        { name: 'Total active area', unit: 'm2', value: o.totalActiveArea_m2 },
      ],
    },
    quantity('Cell count set by', CELLS_FROM[o.cellsFrom], '', CELLS_FROM[o.cellsFrom]),
    quantity('Cells', r.headline.cells, '', formatInteger(r.headline.cells)),
    quantity('Series voltage of all cells (N × V; not a terminal voltage: see the electrical layout)', r.headline.stackVoltage_V, 'V', formatQuantity(r.headline.stackVoltage_V, 'V')),
    r.technology.mode === 'power' ? quantity('Balance-of-plant share', o.parasiticFraction, '', pct(o.parasiticFraction)) : null,
    opt('Air utilization', o.airUtilization, '', pct),
    opt('Air ratio (O₂ fed / O₂ consumed)', o.airRatio, '', (v) => formatNumber(v)),
    opt('Oxygen consumed', o.oxygenConsumed_mol_per_s, 'mol/s', (v) => formatQuantity(v, 'mol/s')),
    quantity('Net water produced (negative: consumed)', o.netWaterProduced_mol_per_s, 'mol/s', formatQuantity(o.netWaterProduced_mol_per_s, 'mol/s')),
  ]);
}

function efficiency(r: Results): Pair[] {
  const e = r.efficiency;
  const notes = efficiencyBasisNotes(r);
  // A figure whose basis needs saying (above 100 %) carries its note beside the number; its data stays the number.
  const noted = (key: keyof typeof notes) => (v: number) => (notes[key] ? `${pct(v)} (${notes[key]})` : pct(v));
  return present([
    opt('Fuel input, LHV', e.fuelLhvInput_W, 'W', (v) => formatPower(v)),
    opt('Fuel input, HHV', e.fuelHhvInput_W, 'W', (v) => formatPower(v)),
    opt('Thermodynamic limit at T, LHV', e.thermodynamicLimitLhv, '', noted('thermodynamicLimitLhv')),
    opt('Thermodynamic limit at T, HHV', e.thermodynamicLimitHhv, '', noted('thermodynamicLimitHhv')),
    opt('Carnot limit (for comparison)', e.carnotLimit, '', pct),
    quantity('Voltage efficiency', e.voltageEfficiency, '', pct(e.voltageEfficiency)),
    opt('Electrical efficiency, gross, LHV', e.electricalEfficiencyLhvGross, '', pct),
    opt('Electrical efficiency, gross, HHV', e.electricalEfficiencyHhvGross, '', pct),
    opt('Electrical efficiency, net, LHV', e.electricalEfficiencyLhvNet, '', pct),
    opt('Electrical efficiency, net, HHV', e.electricalEfficiencyHhvNet, '', pct),
    opt('Electrolysis efficiency over electricity alone, LHV', e.electrolysisEfficiencyLhv, '', noted('electrolysisEfficiencyLhv')),
    opt('Electrolysis efficiency over electricity alone, HHV', e.electrolysisEfficiencyHhv, '', noted('electrolysisEfficiencyHhv')),
    opt('Electrolysis efficiency with the heat supplied counted, LHV (electricity and the heat the stack absorbs)', e.heatInclusiveEfficiencyLhv, '', pct),
    opt('Electrolysis efficiency with the heat supplied counted, HHV (also the latent heat of the steam consumed)', e.heatInclusiveEfficiencyHhv, '', pct),
    opt('Latent heat (25 °C) of the water consumed as steam', e.steamLatentHeat_W, 'W', (v) => formatPower(v)),
    opt('Heating value of the products, LHV (net of the feed)', e.productLhv_W, 'W', (v) => formatPower(v)),
    opt('Specific electric energy (electricity only)', e.specificEnergy_kWh_per_kg, 'kWh/kg', (v) => formatQuantity(v, 'kWh/kg')),
    opt('Hydrogen produced', e.hydrogenProduction_mol_per_s, 'mol/s', (v) => formatQuantity(v, 'mol/s')),
    opt('Oxygen produced', e.oxygenProduction_mol_per_s, 'mol/s', (v) => formatQuantity(v, 'mol/s')),
    e.carbonMonoxideProduction_mol_per_s ? quantity('Carbon monoxide produced', e.carbonMonoxideProduction_mol_per_s, 'mol/s', formatQuantity(e.carbonMonoxideProduction_mol_per_s, 'mol/s')) : null,
    e.methaneProduction_mol_per_s ? quantity('Methane formed in the equilibrated outlet', e.methaneProduction_mol_per_s, 'mol/s', formatQuantity(e.methaneProduction_mol_per_s, 'mol/s')) : null,
  ]);
}

/** An air-cooled stack's balance with its feeds as fed: what the feeds take, where the exhaust leaves, and what closes it. */
function stackBalanceRows(r: Results): (Pair | null)[] {
  const b = r.heat.stackBalance;
  if (!b) return [];
  const h = r.heat;
  return [
    several('Heat that brings the feeds to the stack temperature: fuel / air', `${formatPower(b.fuelHeating_W)} / ${formatPower(b.airHeating_W)}`, [
      ['Heat that brings the fuel-electrode feed to the stack temperature', 'W', b.fuelHeating_W],
      ['Heat that brings the air-electrode feed to the stack temperature', 'W', b.airHeating_W],
    ]),
    quantity('Air-electrode exhaust temperature (the stack temperature where the balance closes)', b.airExhaustTemperature_K, 'K', formatTemperature(b.airExhaustTemperature_K)),
    h.coolingAir_kg_per_h === null ? null : quantity('Air that closes the balance at the stated inlet temperature', h.coolingAir_kg_per_h, 'kg/h', formatQuantity(h.coolingAir_kg_per_h, 'kg/h')),
    b.closingAirInletTemperature_K === null ? null : quantity('Air-electrode inlet temperature that closes the balance with the air fed', b.closingAirInletTemperature_K, 'K', formatTemperature(b.closingAirInletTemperature_K)),
    quantity('Allowed air temperature rise', h.allowedAirTemperatureRise_K, 'K', `${formatNumber(h.allowedAirTemperatureRise_K)} K`),
  ];
}

function heat(r: Results): Pair[] {
  const h = r.heat;
  return present([
    quantity('Heat released, isothermal boundary (negative: needed)', h.isothermalHeat_W, 'W', formatPower(h.isothermalHeat_W)),
    quantity('Heat released with the feeds at their inlet temperatures', h.asFedHeat_W, 'W', formatPower(h.asFedHeat_W)),
    {
      label: 'Enthalpy flow in, at the stack temperature / as fed',
      text: `${formatPower(h.inletEnthalpyIsothermal_W)} / ${formatPower(h.inletEnthalpyAsFed_W)}`,
      data: [
        { name: 'Enthalpy flow in, at the stack temperature', unit: 'W', value: h.inletEnthalpyIsothermal_W },
        { name: 'Enthalpy flow in, as fed', unit: 'W', value: h.inletEnthalpyAsFed_W },
      ],
    },
    quantity('Enthalpy flow out', h.outletEnthalpy_W, 'W', formatPower(h.outletEnthalpy_W)),
    quantity('Electric work into the stack', h.electricWorkIn_W, 'W', formatPower(h.electricWorkIn_W)),
    {
      label: 'Heat per cell / per unit active area',
      text: `${formatQuantity(h.heatPerCell_W, 'W')} / ${formatQuantity(h.heatPerArea_W_per_m2, 'W/m²')}`,
      data: [
        { name: 'Heat per cell', unit: 'W', value: h.heatPerCell_W },
        { name: 'Heat per unit active area', unit: 'W/m2', value: h.heatPerArea_W_per_m2 },
      ],
    },
    ...stackBalanceRows(r),
    opt('Cooling air over the air the oxygen needs', h.coolingAirRatio, '', (v) => formatNumber(v)),
    opt('Cross-check for pure hydrogen, I(−ΔH(T)/2F − V)', h.hydrogenCrossCheck_W, 'W', (v) => formatPower(v)),
    opt('Heat to supply', h.heatDemand_W, 'W', (v) => formatPower(v)),
    opt('Liquid water leaving', h.liquidWaterOut_mol_per_s, 'mol/s', (v) => formatQuantity(v, 'mol/s')),
    h.outletsSaturated === null ? null : quantity('Both outlet gases saturated with water vapour', h.outletsSaturated, '', h.outletsSaturated ? 'yes' : 'no: the cell dries out'),
  ]);
}

function carbon(r: Results): Pair[] {
  const c = r.carbon;
  const n = (v: number) => formatNumber(v);
  return present([
    opt('Design steam-to-carbon ratio', c.steamToCarbon, '', n),
    opt('Least carbon-free S/C at the stack temperature', c.minimumSteamToCarbonStack, '', n),
    opt('Least carbon-free S/C at the pre-reformer temperature', c.minimumSteamToCarbonPreReformer, '', n),
    opt('Carbon activity at the pre-reformer outlet, at the pre-reformer temperature (before the stack; not on the fuel path)', c.preReformerCarbonActivity, '', n),
    opt('Carbon activity of the equilibrated gas at the stack inlet', c.inletCarbonActivity, '', n),
    opt('Highest carbon activity on the fuel path in the stack, at the stack temperature (the pre-reformer not included)', c.maxCarbonActivity, '', n),
  ]);
}

function figure(id: string, name: string, title: string, pairs: Pair[]): FigureTable {
  return { id, title, table: pairsTable(name, title, pairs) };
}

export function figureTables(r: Results): FigureTable[] {
  const list: FigureTable[] = [
    figure('figures-electrochemistry', 'electrochemistry', 'Electrochemistry', electrochemistry(r)),
    figure('figures-operating-point', 'operating-point', 'Operating point', operatingPoint(r)),
    figure('figures-efficiency', 'efficiency', 'Efficiency figures', efficiency(r)),
    figure('figures-heat', 'heat', 'Heat balance', heat(r)),
  ];
  const c = carbon(r);
  if (c.length) list.push(figure('figures-carbon', 'carbon', 'Carbon deposition', c));
  return list;
}

/** Species shown in the stream table: every one reaching 1 ppm in some stream, largest first. */
function speciesOf(streams: readonly StreamResult[]): string[] {
  const peak = new Map<string, number>();
  for (const s of streams) for (const [k, x] of Object.entries(s.moleFractions)) peak.set(k, Math.max(peak.get(k) ?? 0, x));
  return [...peak.entries()].filter(([, x]) => x >= 1e-6).sort((a, b) => b[1] - a[1]).map(([k]) => k);
}

/** A row of the stream table: shown in `label`'s units by `text`, in the data as `key` of the results in `unit`. */
function streamRow(label: string, name: string, unit: string, value: (s: StreamResult) => number, text: (s: StreamResult) => string): CrossRow<StreamResult> {
  return { label, text, data: [{ name, unit, value }] };
}

/** One column per stream with its state, flows, enthalpy flow and gas composition; in the data a row per stream. */
function streamColumns<S extends StreamResult>(name: string, title: string, streams: readonly S[], heading: (s: S) => string): Table {
  const rows: CrossRow<StreamResult>[] = [
    streamRow('Temperature, °C', 'Temperature', 'K', (s) => s.temperature_K, (s) => formatCelsius(s.temperature_K)),
    streamRow('Pressure, bar', 'Pressure', 'bar', (s) => s.pressure_bar, (s) => formatNumber(s.pressure_bar)),
    streamRow('Molar flow, mol/s', 'Molar flow', 'mol/s', (s) => s.flow_mol_per_s, (s) => formatNumber(s.flow_mol_per_s)),
    streamRow('Mass flow, kg/h', 'Mass flow', 'kg/h', (s) => s.massFlow_kg_per_h, (s) => formatNumber(s.massFlow_kg_per_h)),
    streamRow('Gas volume flow, m³(n)/h', 'Gas volume flow at 0 °C and 1 atm', 'Nm3/h', (s) => s.normalVolume_Nm3_per_h, (s) => formatNumber(s.normalVolume_Nm3_per_h)),
    streamRow('Enthalpy flow, kW', 'Enthalpy flow', 'W', (s) => s.enthalpyFlow_W, (s) => formatNumber(s.enthalpyFlow_W / 1000)),
  ];
  if (streams.some((s) => (s.speciesFlows_mol_per_s['H2O(L)'] ?? 0) > 0)) {
    const liquid = (s: StreamResult) => s.speciesFlows_mol_per_s['H2O(L)'] ?? 0;
    rows.push(streamRow('Liquid water, mol/s', 'Liquid water', 'mol/s', liquid, (s) => formatNumber(liquid(s))));
  }
  rows.push({ group: 'Gas composition, mol %' });
  for (const species of speciesOf(streams)) {
    rows.push({
      label: speciesText(species),
      text: (s) => (s.moleFractions[species] === undefined ? '' : formatNumber(s.moleFractions[species]! * 100, 4)),
      data: [{ name: `Mole fraction ${species}`, unit: 'mol/mol', value: (s) => s.moleFractions[species] ?? null }],
    });
  }
  return crossTable<StreamResult>({ name, title, items: streams, itemName: (s) => heading(s as S), itemColumn: 'Stream', rows });
}

export function streamTable(r: Results): Table {
  return streamColumns('streams', 'Streams', r.streams, (s) => s.name);
}

/** The heat-and-material balance: every numbered stream of the plant (enthalpy flows absolute, heats of formation included), in one table (`cellbasis calc`). */
export function heatAndMaterialBalance(r: Results): Table {
  return streamColumns('heat-and-material-balance', 'Heat-and-material balance', r.plant.streams, (s) => `${s.number}. ${s.name}`);
}

/**
 * The most stream columns one table of the balance holds in the document: with the label column,
 * seven fit the text column on screen (780 px) and of A4 in print (673 px) without scrolling or
 * shrinking the page; thirteen streams in one table (the solid oxide plant) were 1089 px wide.
 */
const BALANCE_STREAMS_PER_TABLE = 7;

/**
 * The heat-and-material balance as the document shows it: consecutive tables of at most
 * BALANCE_STREAMS_PER_TABLE streams each, split evenly (13 streams: 7 and 6), each listing the
 * species of its own streams and offering its own CSV (one table, as heatAndMaterialBalance, when the streams fit).
 */
export function heatAndMaterialBalanceParts(r: Results): Table[] {
  const streams = r.plant.streams;
  const count = Math.ceil(streams.length / BALANCE_STREAMS_PER_TABLE);
  if (count <= 1) return [heatAndMaterialBalance(r)];
  const size = Math.ceil(streams.length / count);
  const tables: Table[] = [];
  for (let from = 0; from < streams.length; from += size) {
    const part = streams.slice(from, from + size);
    const numbers = `${part[0]!.number} to ${part[part.length - 1]!.number}`;
    tables.push(streamColumns(`heat-and-material-balance-${tables.length + 1}`, `Heat-and-material balance, streams ${numbers}`, part, (s) => `${s.number}. ${s.name}`));
  }
  return tables;
}

const kW = (w: number) => formatQuantity(w / 1000, 'kW');

/** A row of several numbers shown as one text: `data` names each number with its unit. */
function several(label: string, text: string, data: [string, string, number | null][]): Pair {
  return { label, text, data: data.map(([name, unit, value]) => ({ name, unit, value })) };
}

function electricalLayout(r: Results): Pair[] {
  const e = r.plant.electrical;
  const power = r.technology.mode === 'power';
  const converter = power ? 'Inverter' : 'Rectifier';
  return [
    several('Cells per stack / stacks in series / strings in parallel', `${formatInteger(e.cellsPerStack)} / ${formatInteger(e.stacksInSeries)} / ${formatInteger(e.stringsInParallel)}`, [
      ['Cells per stack', '', e.cellsPerStack],
      ['Stacks in series', '', e.stacksInSeries],
      ['Strings in parallel', '', e.stringsInParallel],
    ]),
    textPair('Stacks in series set by', e.stacksInSeriesFrom === 'given' ? 'the basis' : 'the DC bus voltage window'),
    several('Stacks / cells installed (cells required)', `${formatInteger(e.stackCount)} / ${formatInteger(e.installedCells)} (${formatInteger(e.requiredCells)})`, [
      ['Stacks', '', e.stackCount],
      ['Cells installed', '', e.installedCells],
      ['Cells required', '', e.requiredCells],
    ]),
    several('Stack voltage / stack current', `${formatQuantity(e.stackVoltage_V, 'V')} / ${formatQuantity(e.stackCurrent_A, 'A')}`, [
      ['Stack voltage', 'V', e.stackVoltage_V],
      ['Stack current', 'A', e.stackCurrent_A],
    ]),
    several('String voltage / string current', `${formatQuantity(e.stringVoltage_V, 'V')} / ${formatQuantity(e.stringCurrent_A, 'A')}`, [
      ['String voltage', 'V', e.stringVoltage_V],
      ['String current', 'A', e.stringCurrent_A],
    ]),
    several('DC bus voltage / bus current', `${formatQuantity(e.busVoltage_V, 'V')} / ${formatQuantity(e.busCurrent_A, 'A')}`, [
      ['DC bus voltage', 'V', e.busVoltage_V],
      ['DC bus current', 'A', e.busCurrent_A],
    ]),
    quantity('DC power of the installed cells', e.dcPower_W, 'W', formatPower(e.dcPower_W)),
    several(power ? 'Inverter efficiency / AC power delivered' : 'Rectifier efficiency / AC power drawn', `${formatPercent(e.conversionEfficiency)} / ${formatPower(e.acPower_W)}`, [
      [`${converter} efficiency`, '', e.conversionEfficiency],
      [power ? 'AC power delivered' : 'AC power drawn', 'W', e.acPower_W],
    ]),
    quantity('Conversion loss', e.conversionLoss_W, 'W', formatPower(e.conversionLoss_W)),
  ];
}

type PlantPower = NonNullable<Results['plant']['power']>;

/** One row a duty: its name, the temperatures it takes its stream between, and the heat. */
function dutyRows(list: PlantPower['duties']): Pair[] {
  return list.map((d) =>
    several(`${d.name} (${formatTemperature(d.from_K)} → ${formatTemperature(d.to_K)})`, kW(d.duty_W), [
      [`${d.name}, duty`, 'W', d.duty_W],
      [`${d.name}, from`, 'K', d.from_K],
      [`${d.name}, to`, 'K', d.to_K],
    ]),
  );
}

function duties(p: PlantPower): Pair[] {
  const rows: Pair[] = dutyRows(p.duties);
  rows.push(quantity("Net duty of the plant's heaters", p.netDuty_W, 'W', kW(p.netDuty_W)));
  if (p.steam) {
    rows.push(several('Feed water / saturation temperature', `${formatQuantity(p.steam.water_kg_per_h, 'kg/h')} / ${formatTemperature(p.steam.saturationTemperature_K)}`, [
      ['Feed water', 'kg/h', p.steam.water_kg_per_h],
      ['Saturation temperature', 'K', p.steam.saturationTemperature_K],
    ]));
  }
  const b = p.blower;
  if (b) {
    rows.push(several('Air blower: pressure', `${formatQuantity(b.inletPressure_bar, 'bar')} → ${formatQuantity(b.outletPressure_bar, 'bar')}`, [
      ['Air blower inlet pressure', 'bar', b.inletPressure_bar],
      ['Air blower outlet pressure', 'bar', b.outletPressure_bar],
    ]));
    rows.push(several('Air blower: temperature', `${formatTemperature(b.inletTemperature_K)} → ${formatTemperature(b.outletTemperature_K)}`, [
      ['Air blower inlet temperature', 'K', b.inletTemperature_K],
      ['Air blower outlet temperature', 'K', b.outletTemperature_K],
    ]));
    rows.push(several('Air blower power (isentropic efficiency)', `${kW(b.power_W)} (${formatPercent(b.isentropicEfficiency)}); the parasitic load allows ${kW(b.parasiticAllowance_W)} in all`, [
      ['Air blower power', 'W', b.power_W],
      ['Air blower isentropic efficiency', '', b.isentropicEfficiency],
      ['Parasitic load allowed', 'W', b.parasiticAllowance_W],
    ]));
  }
  rows.push({
    label: 'Stack heat with the inlets as fed, and where it goes',
    text: `${kW(p.stackHeat_W)}, ${p.stackHeatTo}`,
    data: [
      { name: 'Stack heat with the inlets as fed', unit: 'W', value: p.stackHeat_W },
      { name: 'Where the stack heat goes', unit: '', value: p.stackHeatTo },
    ],
  });
  rows.push(quantity('Air-electrode exhaust temperature', p.airExhaustTemperature_K, 'K', formatTemperature(p.airExhaustTemperature_K)));
  return rows;
}

/** A carbonate cell's cathode-gas loop: its burner air, recycled share, burner, mixing, cooler or heater and the cathode inlet it makes. */
function cathodeLoopRows(l: NonNullable<PlantPower['cathodeLoop']>): Pair[] {
  const inlet = Object.entries(l.inletMoleFractions).sort((a, b) => b[1] - a[1]);
  return [
    several('Cathode-gas loop: burner air / share of the exhaust recycled', `${formatQuantity(l.burnerAir_mol_per_s, 'mol/s')} (${formatQuantity(l.burnerAir_kg_per_h, 'kg/h')}) / ${formatPercent(l.recycledShare)}`, [
      ['Burner air', 'mol/s', l.burnerAir_mol_per_s],
      ['Burner air', 'kg/h', l.burnerAir_kg_per_h],
      ['Share of the air-electrode exhaust recycled', '', l.recycledShare],
    ]),
    several('Air utilization / CO2 utilization of the cells', `${formatPercent(l.airUtilization)} / ${formatPercent(l.carbonDioxideUtilization)}`, [
      ['Air utilization', '', l.airUtilization],
      ['CO2 utilization', '', l.carbonDioxideUtilization],
    ]),
    several('Burner outlet (adiabatic, complete combustion) / recycle / mixture', `${formatTemperature(l.burnerOutletTemperature_K)} / ${formatTemperature(l.recycleTemperature_K)} / ${formatTemperature(l.mixingTemperature_K)}`, [
      ['Burner outlet temperature', 'K', l.burnerOutletTemperature_K],
      ['Recycle temperature', 'K', l.recycleTemperature_K],
      ['Mixing temperature', 'K', l.mixingTemperature_K],
    ]),
    quantity(`Loop ${l.heating_W < 0 ? 'cooler' : 'heater'} to the air-electrode inlet at ${formatTemperature(l.inletTemperature_K)}`, l.heating_W, 'W', kW(l.heating_W)),
    {
      label: 'Air-electrode inlet, mol %',
      text: inlet.map(([k, x]) => `${speciesText(k)} ${formatNumber(x * 100, 4)}`).join(', '),
      data: inlet.map(([k, x]) => ({ name: `Air-electrode inlet, mole fraction ${k}`, unit: 'mol/mol', value: x })),
    },
  ];
}

function oxidiserAndRecovery(p: PlantPower): Pair[] {
  const rows: Pair[] = p.cathodeLoop ? cathodeLoopRows(p.cathodeLoop) : [];
  const o = p.oxidiser;
  if (o) {
    const oxidant = o.oxidant === 'fresh-air' ? `fresh air, ${formatNumber(o.airRatio!)} times the oxygen complete combustion needs` : 'the air-electrode exhaust';
    rows.push({ label: 'Oxidant', text: oxidant, data: [{ name: 'Oxidant', unit: '', value: o.oxidant }, { name: 'Oxidiser air ratio', unit: '', value: o.airRatio ?? null }] });
    rows.push(several('Adiabatic outlet temperature (equilibrium products) / material limit', `${formatTemperature(o.outletTemperature_K)} / ${formatTemperature(o.materialLimit_K)}`, [
      ['Oxidiser outlet temperature, adiabatic', 'K', o.outletTemperature_K],
      ['Oxidiser material limit', 'K', o.materialLimit_K],
    ]));
    rows.push(quantity('Heat of the combustion (at 25 °C)', o.heatReleased_W, 'W', kW(o.heatReleased_W)));
    rows.push(quantity('CO left in the products', o.carbonMonoxide_ppm, 'ppm', formatQuantity(o.carbonMonoxide_ppm, 'ppm')));
    const shown = Object.entries(o.moleFractions).filter(([, x]) => x >= 1e-4).sort((a, b) => b[1] - a[1]);
    rows.push({
      label: 'Products, mol %',
      text: shown.map(([k, x]) => `${speciesText(k)} ${formatNumber(x * 100, 4)}`).join(', '),
      data: shown.map(([k, x]) => ({ name: `Oxidiser products, mole fraction ${k}`, unit: 'mol/mol', value: x })),
    });
  }
  const h = p.heatRecovery;
  if (h) {
    rows.push(several('Exhaust into / out of the heat recovery', `${formatTemperature(h.inletTemperature_K)} / ${formatTemperature(h.exitTemperature_K)}`, [
      ['Exhaust into the heat recovery', 'K', h.inletTemperature_K],
      ['Exhaust out of the heat recovery', 'K', h.exitTemperature_K],
    ]));
    rows.push(quantity('Dew point of the exhaust (IAPWS-IF97)', h.dewPoint_K, 'K', h.dewPoint_K === null ? 'none' : formatTemperature(h.dewPoint_K)));
    rows.push(several('Heat recovered without / with condensation', `${kW(h.heatWithoutCondensation_W)} / ${kW(h.heatWithCondensation_W)}`, [
      ['Heat recovered without condensation', 'W', h.heatWithoutCondensation_W],
      ['Heat recovered with condensation', 'W', h.heatWithCondensation_W],
    ]));
    rows.push(quantity('Condensate', h.condensate_kg_per_h, 'kg/h', formatQuantity(h.condensate_kg_per_h, 'kg/h')));
    rows.push(quantity('Heat lost to ambient', p.heatLoss_W, 'W', kW(p.heatLoss_W)));
    rows.push(quantity('Heat delivered', h.deliveredHeat_W, 'W', kW(h.deliveredHeat_W)));
  }
  const c = p.chp;
  if (c) {
    rows.push(several('Electrical / thermal efficiency (LHV)', `${formatPercent(c.electricalEfficiencyLhv)} / ${formatPercent(c.thermalEfficiencyLhv)}`, [
      ['Electrical efficiency (LHV)', '', c.electricalEfficiencyLhv],
      ['Thermal efficiency (LHV)', '', c.thermalEfficiencyLhv],
    ]));
    rows.push(several('Total CHP efficiency, LHV / HHV', `${formatPercent(c.totalEfficiencyLhv)} / ${formatPercent(c.totalEfficiencyHhv)}`, [
      ['Total CHP efficiency, LHV', '', c.totalEfficiencyLhv],
      ['Total CHP efficiency, HHV', '', c.totalEfficiencyHhv],
    ]));
    if (c.powerToHeat !== null) rows.push(quantity('Power-to-heat ratio', c.powerToHeat, '', formatNumber(c.powerToHeat)));
  }
  return rows;
}

function energyBalance(b: PlantPower['energyBalance'], over: string): Pair[] {
  return [
    ...b.terms.map((t) => quantity(`${t.side === 'in' ? 'In' : 'Out'}: ${t.name}`, t.value_W, 'W', kW(t.value_W))),
    quantity(`Residual (in − out) / ${over}`, b.residual, '', formatNumber(b.residual, 2)),
  ];
}

type PlantElectrolysis = NonNullable<Results['plant']['electrolysis']>;

/** How the stage count came about, after the count. */
const STAGES_FROM: Record<NonNullable<PlantElectrolysis['compression']>['stagesFrom'], string> = {
  given: '',
  'maximum-stage-ratio': ' (from the maximum stage ratio)',
  'maximum-discharge-temperature': ' (from the maximum discharge temperature)',
};

/** The hydrogen compression's rows: pressures, stages, stage outlet temperatures, power; none without it. */
function compressionRows(c: PlantElectrolysis['compression']): Pair[] {
  if (!c) return [];
  const rows: Pair[] = [];
  rows.push(several('Hydrogen compression: pressure', `${formatQuantity(c.inletPressure_bar, 'bar')} → ${formatQuantity(c.deliveryPressure_bar, 'bar')}`, [
    ['Compressor inlet pressure', 'bar', c.inletPressure_bar],
    ['Delivery pressure', 'bar', c.deliveryPressure_bar],
  ]));
  rows.push(several('Stages (ratio each) / isentropic efficiency', `${c.stages}${STAGES_FROM[c.stagesFrom]} (${formatNumber(c.pressureRatioPerStage, 4)}) / ${formatPercent(c.isentropicEfficiency)}`, [
    ['Compression stages', '', c.stages],
    ['Pressure ratio per stage', '', c.pressureRatioPerStage],
    ['Compressor isentropic efficiency', '', c.isentropicEfficiency],
  ]));
  rows.push(several('Stage outlet temperatures (inlet, intercooled to)', `${c.stageOutletTemperatures_K.map(formatTemperature).join(', ')} (${formatTemperature(c.inletTemperature_K)}, ${formatTemperature(c.intercoolTemperature_K)})`, [
    ...c.stageOutletTemperatures_K.map((t, i): [string, string, number] => [`Stage ${i + 1} outlet temperature`, 'K', t]),
    ['Compressor inlet temperature', 'K', c.inletTemperature_K],
    ['Intercooling temperature', 'K', c.intercoolTemperature_K],
  ]));
  const hottestK = Math.max(...c.stageOutletTemperatures_K);
  rows.push(several('Hottest stage discharge / limit (whose)', `${formatTemperature(hottestK)} / ${formatTemperature(c.dischargeLimit_K)} (${c.dischargeLimitSource})${hottestK > c.dischargeLimit_K ? ': ABOVE the limit, see the findings' : ''}`, [
    ['Hottest stage discharge temperature', 'K', hottestK],
    ['Discharge temperature limit', 'K', c.dischargeLimit_K],
  ]));
  rows.push(several('Compressor power (work per kg)', `${kW(c.power_W)} (${formatQuantity(c.work_J_per_kg / 1000, 'kJ/kg')})`, [
    ['Compressor power', 'W', c.power_W],
    ['Compressor work per kg', 'J/kg', c.work_J_per_kg],
  ]));
  return rows;
}

const RECUPERATOR_LIMIT: Record<NonNullable<PlantElectrolysis['recuperator']>['limitedBy'], string> = {
  'minimum-approach': 'the minimum approach (a pinch)',
  'feeds-at-target': 'every feed at its stack inlet temperature',
  'dew-point': "the hot outlets' dew point",
};

/** The feed water as it leaves the recuperator, where the basis feeds it: liquid, partly evaporated or steam. */
function waterLeaving(r: NonNullable<PlantElectrolysis['recuperator']>): string {
  const x = r.feeds.find((f) => f.vapourFraction !== null)?.vapourFraction;
  if (x === undefined || x === null) return '';
  return x === 0 ? ', the water liquid' : x === 1 ? ', the water as steam' : `, the water ${formatPercent(x)} evaporated`;
}

/** The feed recuperator's rows: duty and approach, the temperatures of both sides, what limits it; none without it. */
function recuperatorRows(r: PlantElectrolysis['recuperator']): Pair[] {
  if (!r) return [];
  return [
    several('Recuperator duty (minimum approach)', `${kW(r.duty_W)} (${formatQuantity(r.minimumApproach_K, 'K')})`, [
      ['Recuperator duty', 'W', r.duty_W],
      ['Recuperator minimum approach', 'K', r.minimumApproach_K],
    ]),
    several('Recuperator: hot outlets in / out', `${formatTemperature(r.hotInlet_K)} / ${formatTemperature(r.hotOutlet_K)}`, [
      ['Recuperator hot side in', 'K', r.hotInlet_K],
      ['Recuperator hot side out', 'K', r.hotOutlet_K],
    ]),
    several('Recuperator: feeds out (least approach found)', `${formatTemperature(r.coldOutlet_K)}${waterLeaving(r)} (${formatQuantity(r.smallestApproach_K, 'K')})`, [
      ['Recuperator feeds out', 'K', r.coldOutlet_K],
      ['Recuperator least approach found', 'K', r.smallestApproach_K],
    ]),
    { label: 'Recuperator duty limited by', text: RECUPERATOR_LIMIT[r.limitedBy], data: [{ name: 'Recuperator duty limited by', unit: '', value: r.limitedBy }] },
  ];
}

/** The electrolysis plant: feed preparation, heat supplied, compression and the electricity per kilogram of hydrogen. */
function electrolysisPlant(x: PlantElectrolysis): Pair[] {
  const rows: Pair[] = dutyRows(x.duties);
  rows.push(quantity('Feed water', x.feedWater_kg_per_h, 'kg/h', formatQuantity(x.feedWater_kg_per_h, 'kg/h')));
  for (const s of x.steam) rows.push(quantity(`Saturation temperature of the ${s.electrode}-electrode steam (IAPWS-IF97)`, s.saturationTemperature_K, 'K', formatTemperature(s.saturationTemperature_K)));
  rows.push(...recuperatorRows(x.recuperator));
  rows.push(quantity('Stack heat with the inlets as fed (negative: absorbed)', x.stackHeat_W, 'W', kW(x.stackHeat_W)));
  rows.push(quantity('Heat lost to ambient', x.heatLoss_W, 'W', kW(x.heatLoss_W)));
  rows.push(several('Heat supplied to the feeds / to the stack', `${kW(x.feedHeat_W)} / ${kW(x.stackHeatSupplied_W)}`, [
    ['Heat supplied to the feeds', 'W', x.feedHeat_W],
    ['Heat supplied to the stack', 'W', x.stackHeatSupplied_W],
  ]));
  rows.push({
    label: 'Heat supplied, and from where',
    text: `${kW(x.heatSupplied_W)}, ${x.heatSupply === 'electric' ? 'by electric heaters' : 'from outside the plant'}`,
    data: [
      { name: 'Heat supplied', unit: 'W', value: x.heatSupplied_W },
      { name: 'Heat supply', unit: '', value: x.heatSupply },
    ],
  });
  rows.push(several('Heat removed by the coolers / by the stack cooling', `${kW(x.coolers_W)} / ${kW(x.stackHeatRemoved_W)}`, [
    ['Heat removed by the coolers', 'W', x.coolers_W],
    ['Heat removed by the stack cooling', 'W', x.stackHeatRemoved_W],
  ]));
  rows.push(...compressionRows(x.compression));
  const e = x.specificEnergy;
  rows.push(several('Electricity per kg of hydrogen: stack DC / whole plant', `${formatQuantity(e.stack_kWh_per_kg, 'kWh/kg')} / ${formatQuantity(e.system_kWh_per_kg, 'kWh/kg')}`, [
    ['Stack DC energy per kg of hydrogen', 'kWh/kg', e.stack_kWh_per_kg],
    ['Plant electricity per kg of hydrogen', 'kWh/kg', e.system_kWh_per_kg],
  ]));
  rows.push(several('Plant efficiency, LHV / HHV (electricity and heat from outside)', `${formatPercent(e.systemEfficiencyLhv)} / ${formatPercent(e.systemEfficiencyHhv)}`, [
    ['Plant efficiency, LHV', '', e.systemEfficiencyLhv],
    ['Plant efficiency, HHV', '', e.systemEfficiencyHhv],
  ]));
  return rows;
}

/** The tables of the plant around the stack. */
export function plantTables(r: Results): FigureTable[] {
  const list: FigureTable[] = [figure('plant-electrical', 'electrical-layout', 'Electrical layout', electricalLayout(r))];
  const p = r.plant.power;
  if (p) {
    list.push(figure('plant-duties', 'plant-duties', 'Fuel and air preparation', duties(p)));
    const o = oxidiserAndRecovery(p);
    if (o.length) list.push(figure('plant-oxidiser', 'oxidiser-and-heat-recovery', 'Off-gas oxidiser, heat recovery and combined heat and power', o));
    list.push(figure('plant-energy', 'plant-energy-balance', 'Energy balance of the plant (absolute enthalpy flows, heats of formation included)', energyBalance(p.energyBalance, 'fuel LHV input')));
  }
  const x = r.plant.electrolysis;
  if (x) {
    list.push(figure('plant-electrolysis', 'electrolysis-plant', 'Feed preparation, heat supply, hydrogen compression and specific energy', electrolysisPlant(x)));
    list.push(figure('plant-electrolysis-energy', 'electrolysis-plant-energy-balance', 'Energy balance of the plant (absolute enthalpy flows, heats of formation included)', energyBalance(x.energyBalance, 'the electricity')));
  }
  return list;
}
