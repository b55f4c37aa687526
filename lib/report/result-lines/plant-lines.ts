/**
 * The worked lines of the plant around the stack: the stack, bus voltage and bus current of the
 * electrical layout; in power mode the steam raising, the heat delivered and the total
 * efficiency of combined heat and power, and a carbonate cell's cathode-gas loop; in electrolysis the steam raising, the compressor power
 * and the electricity per kilogram of hydrogen of the whole plant.
 */
import type { Results } from '../../plant/results-schema.ts';
import type { LineSpec } from '../calc-line.ts';
import { formatPercent, formatQuantity, formatTemperature } from '../format.ts';

type Steam = Pick<NonNullable<NonNullable<Results['plant']['power']>['steam']>, 'water_mol_per_s' | 'liquidHeating_W' | 'evaporation_W' | 'superheating_W' | 'latentHeat_J_per_mol'>;

/** The steam raised from feed water: ṅ_w (Δh_liq + L + Δh_vap), power mode or an electrolyser's steam. */
function steamLine(steam: Steam, suffix: string, waterOrigin: string, superheatOrigin: string): LineSpec {
  const n = steam.water_mol_per_s;
  return {
    id: `steam-raising${suffix}`,
    title: suffix ? 'Steam raising from the feed water (air electrode)' : 'Steam raising from the feed water',
    equation: 'steam-raising',
    relation: 'steam',
    quantities: [
      { name: 'n', value: n, unit: 'mol/s', origin: waterOrigin },
      { name: 'hl', value: steam.liquidHeating_W / n / 1000, unit: 'kJ/mol', origin: 'liquid heated to saturation, species data' },
      { name: 'L', value: steam.latentHeat_J_per_mol / 1000, unit: 'kJ/mol', origin: 'latent heat at the saturation temperature, species data' },
      { name: 'hg', value: steam.superheating_W / n / 1000, unit: 'kJ/mol', origin: superheatOrigin },
    ],
    value: (steam.liquidHeating_W + steam.evaporation_W + steam.superheating_W) / 1000,
    unit: 'kW',
  };
}

/** A duty as the enthalpy flow out less the enthalpy flow in, kW. */
function dutyLine(id: string, title: string, outW: number, inW: number, outOrigin: string, inOrigin: string): LineSpec {
  return {
    id,
    title,
    equation: 'plant-duty',
    relation: 'duty',
    quantities: [
      { name: 'Hout', value: outW / 1000, unit: 'kW', origin: outOrigin },
      { name: 'Hin', value: inW / 1000, unit: 'kW', origin: inOrigin },
    ],
    value: (outW - inW) / 1000,
    unit: 'kW',
  };
}

/** The stacks in series of a string, and where that number comes from. */
function series(e: Results['plant']['electrical']): LineSpec['quantities'][number] {
  return { name: 'm', value: e.stacksInSeries, unit: '', origin: e.stacksInSeriesFrom === 'given' ? 'stacks in series, design input' : 'stacks in series, from the DC bus window' };
}

/**
 * The cells the layout installs and the point its bus carries: the whole stacks, and the cell
 * current of the installed cells at the load of the point (the sizing case at its load on the
 * installed cells, at the top level; the case, for a case).
 */
function installedLines(r: Results): LineSpec[] {
  const e = r.plant.electrical;
  const sizing = r.headline.cells === e.requiredCells && e.installedCells !== e.requiredCells;
  return [
    {
      id: 'installed-cells',
      title: 'Cells installed: whole stacks, strings of stacks in series',
      equation: 'plant-layout',
      relation: 'installed',
      quantities: [
        series(e),
        { name: 'k', value: e.stringsInParallel, unit: '', origin: e.stringsInParallelFrom === 'given' ? 'strings in parallel, design input' : `strings in parallel, the fewest whose stacks hold the ${e.requiredCells} cells required` },
        { name: 'n', value: e.cellsPerStack, unit: '', origin: 'cells per stack, design input (default: all cells in one stack)' },
      ],
      value: e.installedCells,
      unit: '',
      note: `the sizing calculation requires ${e.requiredCells} cells`,
    },
    {
      id: 'installed-cell-current',
      title: sizing ? "Cell current of the installed cells at the sizing case's load" : 'Cell current of the installed cells',
      equation: 'plant-layout',
      relation: 'cell',
      quantities: [
        {
          name: 'j',
          value: e.currentDensity_A_per_m2,
          unit: 'A/m2',
          origin: sizing ? `current density at which the ${e.installedCells} installed cells meet the sizing case's load (solved)` : 'current density of the installed cells, above',
        },
        { name: 'A', value: r.operatingPoint.activeArea_m2, unit: 'm2', origin: 'active area of a cell, design input' },
      ],
      value: e.cellCurrent_A,
      unit: 'A',
    },
  ];
}

/** The DC power at the bus and the AC power of the converter. */
function powerLines(r: Results): LineSpec[] {
  const e = r.plant.electrical;
  const power = r.technology.mode === 'power';
  return [
    {
      id: 'dc-power',
      title: 'DC power at the bus (every installed cell)',
      equation: 'plant-layout',
      relation: 'dc',
      quantities: [
        { name: 'Vbus', value: e.busVoltage_V, unit: 'V', origin: 'bus voltage, above' },
        { name: 'Ibus', value: e.busCurrent_A, unit: 'A', origin: 'bus current, above' },
      ],
      conversion: ' \\times 10^{-3}',
      value: e.dcPower_W / 1000,
      unit: 'kW',
    },
    {
      id: 'ac-power',
      title: power ? 'AC power delivered by the inverter' : 'AC power drawn by the rectifier',
      equation: 'plant-layout',
      relation: 'ac',
      quantities: [
        { name: 'P', value: e.dcPower_W / 1000, unit: 'kW', origin: 'DC power at the bus, above' },
        { name: 'eta', value: e.conversionEfficiency, unit: '', origin: `${power ? 'inverter' : 'rectifier'} efficiency, as in the lines above (1 where the basis counts its loss in the parasitic load)` },
      ],
      value: e.acPower_W / 1000,
      unit: 'kW',
    },
  ];
}

/** The cells installed, the stack and bus voltage, the bus current and the DC and AC power of the electrical layout. */
function layoutLines(r: Results): LineSpec[] {
  const e = r.plant.electrical;
  const [installed, cell] = installedLines(r);
  return [
    installed!,
    cell!,
    {
      id: 'stack-voltage',
      title: 'Terminal voltage of one stack',
      equation: 'plant-layout',
      relation: 'stack',
      quantities: [
        { name: 'n', value: e.cellsPerStack, unit: '', origin: 'cells per stack, design input (default: all cells in one stack)' },
        { name: 'V', value: e.cellVoltage_V, unit: 'V', origin: 'cell voltage of the installed cells at that current density' },
      ],
      value: e.stackVoltage_V,
      unit: 'V',
    },
    {
      id: 'bus-voltage',
      title: 'DC bus voltage (one string)',
      equation: 'plant-layout',
      relation: 'bus',
      quantities: [
        series(e),
        { name: 'Vs', value: e.stackVoltage_V, unit: 'V', origin: 'stack voltage, above' },
      ],
      value: e.busVoltage_V,
      unit: 'V',
    },
    {
      id: 'bus-current',
      title: 'DC bus current (the strings in parallel)',
      equation: 'plant-layout',
      relation: 'current',
      quantities: [
        { name: 'k', value: e.stringsInParallel, unit: '', origin: e.stringsInParallelFrom === 'given' ? 'strings in parallel, design input' : 'strings in parallel, enough for the cells required' },
        { name: 'Icell', value: e.cellCurrent_A, unit: 'A', origin: 'cell current of the installed cells, above' },
      ],
      value: e.busCurrent_A,
      unit: 'A',
    },
    ...powerLines(r),
  ];
}

/** The hydrogen compressor's power, ṅ w. */
function compressorLine(c: NonNullable<NonNullable<Results['plant']['electrolysis']>['compression']>): LineSpec {
  return {
    id: 'compressor-power',
    title: `Hydrogen compressor power (${c.stages} intercooled stage${c.stages === 1 ? '' : 's'})`,
    equation: 'electrolysis-plant-energy',
    relation: 'compressor',
    quantities: [
      { name: 'n', value: c.flow_mol_per_s, unit: 'mol/s', origin: 'dry product gas, stream table' },
      { name: 'w', value: c.power_W / c.flow_mol_per_s / 1000, unit: 'kJ/mol', origin: `work of the ${c.stages} stage${c.stages === 1 ? '' : 's'} of ratio ${c.pressureRatioPerStage.toPrecision(4)}, η_s ${c.isentropicEfficiency}, species data` },
    ],
    value: c.power_W / 1000,
    unit: 'kW',
  };
}

/** The electricity per kilogram of hydrogen of the whole plant. */
function systemEnergyLine(x: NonNullable<Results['plant']['electrolysis']>): LineSpec {
  const c = x.compression;
  const e = x.specificEnergy;
  return {
    id: 'system-specific-energy',
    title: 'Electricity per kilogram of hydrogen, the whole plant',
    equation: 'electrolysis-plant-energy',
    relation: 'system',
    quantities: [
      { name: 'P', value: (e.stackDc_W + e.conversionLoss_W + e.parasitic_W) / 1000, unit: 'kW', origin: 'AC input of the rectifier and the balance of plant, above' },
      { name: 'Qe', value: e.electricHeat_W / 1000, unit: 'kW', origin: x.heatSupply === 'electric' ? 'heat supplied by electric heaters, duty table' : 'none: the heat comes from outside the plant' },
      { name: 'Pc', value: e.compressor_W / 1000, unit: 'kW', origin: c ? 'compressor power, above' : 'none: no hydrogen compression' },
      { name: 'm', value: e.hydrogen_kg_per_h, unit: 'kg/h', origin: 'net hydrogen made, above' },
    ],
    value: e.system_kWh_per_kg,
    unit: 'kWh/kg',
    note: '1 kW per kg/h is 1 kWh/kg',
  };
}

type Recuperator = NonNullable<NonNullable<Results['plant']['electrolysis']>['recuperator']>;

/** How the feed water leaves the recuperator: liquid, partly evaporated or as steam (empty without feed water). */
function waterStateText(rec: Recuperator): string {
  const water = rec.feeds.filter((f) => f.vapourFraction !== null);
  if (water.length === 0) return '';
  const state = (x: number) => (x === 0 ? 'liquid' : x === 1 ? 'as steam' : `${formatPercent(x)} evaporated`);
  return `, the feed water ${[...new Set(water.map((f) => state(f.vapourFraction!)))].join(' and ')}`;
}

/** The share of a steam raising the recuperator supplies, for its worked line's note (none without a recuperator). */
function steamRecuperatedNote(rec: Recuperator | null, electrode: string): string | undefined {
  const water = rec?.feeds.find((f) => f.id === `${electrode}-steam`);
  if (!water) return undefined;
  return `the recuperator supplies ${formatQuantity(water.duty_W / 1000, 'kW')} of it, from the supply temperature to ${formatTemperature(water.to_K)}${waterStateText({ ...rec!, feeds: [water] })}; the water heater, evaporator and superheater the rest (duty table)`;
}

/**
 * The recuperator's duty from the hot outlets' enthalpy flows: as they leave the stack less as
 * they leave the recuperator (the feeds take the same, composite curves of recuperator.ts).
 */
function recuperatorLine(r: Results, rec: Recuperator): LineSpec | null {
  const ids = ['fuel-outlet', 'air-outlet'];
  const before = r.plant.streams.filter((s) => ids.includes(s.id));
  const after = r.plant.streams.filter((s) => ids.some((id) => s.id === `${id}-recuperated`));
  if (before.length === 0 || before.length !== after.length) return null;
  const sum = (list: typeof before) => list.reduce((a, s) => a + s.enthalpyFlow_W, 0);
  const numbers = (list: typeof before) => list.map((s) => s.number).join(' and ');
  return {
    id: 'recuperator-duty',
    title: "Recuperator duty: the heat the stack's hot outlets give up to the feeds",
    equation: 'recuperator-duty',
    relation: 'duty',
    quantities: [
      { name: 'Hs', value: sum(before) / 1000, unit: 'kW', origin: `the hot outlets at the stack temperature, stream${before.length > 1 ? 's' : ''} ${numbers(before)}` },
      { name: 'Hr', value: sum(after) / 1000, unit: 'kW', origin: `the same after the recuperator at ${formatTemperature(rec.hotOutlet_K)}, stream${after.length > 1 ? 's' : ''} ${numbers(after)}` },
    ],
    value: rec.duty_W / 1000,
    unit: 'kW',
    note: `the feeds take it and leave at ${formatTemperature(rec.coldOutlet_K)}${waterStateText(rec)}; the least temperature difference over the exchanger is ${formatQuantity(rec.smallestApproach_K, 'K')} (minimum approach ${formatQuantity(rec.minimumApproach_K, 'K')})`,
  };
}

/** The electrolysis plant: its steam raising, the recuperator, the compressor power and the specific energy. */
function electrolysisLines(r: Results, x: NonNullable<Results['plant']['electrolysis']>): LineSpec[] {
  const lines = x.steam.map((s) => {
    const line = steamLine(s, s.electrode === 'fuel' ? '' : '-air', 'feed water the stack is fed as steam, stream table', `steam superheated to the ${s.electrode}-electrode inlet, species data`);
    const note = steamRecuperatedNote(x.recuperator, s.electrode);
    return note ? { ...line, note } : line;
  });
  const recuperator = x.recuperator && recuperatorLine(r, x.recuperator);
  if (recuperator) lines.push(recuperator);
  if (x.compression) lines.push(compressorLine(x.compression));
  lines.push(systemEnergyLine(x));
  return lines;
}

type PowerPlant = NonNullable<Results['plant']['power']>;

/** A numbered stream of the plant by its id. */
function plantStream(r: Results, id: string) {
  return r.plant.streams.find((s) => s.id === id);
}

/** The fuel and air preheat duties as enthalpy flows out less in. */
function preheatLines(r: Results, p: PowerPlant): LineSpec[] {
  const lines: LineSpec[] = [];
  const stream = (id: string) => plantStream(r, id);
  const fuelPreheat = p.duties.find((d) => d.id === 'fuel-preheat');
  const fuelSupply = stream('fuel-supply');
  if (fuelPreheat && fuelSupply) lines.push(dutyLine('fuel-preheat', 'Fuel heated to the mixing temperature', fuelSupply.enthalpyFlow_W + fuelPreheat.duty_W, fuelSupply.enthalpyFlow_W, 'dry fuel at the mixing temperature, species data', 'fuel supply, stream table'));
  const airPreheat = p.duties.find((d) => d.id === 'air-preheat');
  const airInlet = stream('air-inlet');
  if (airPreheat && airInlet) {
    const from = p.blower ? 'after the blower' : 'at its supply temperature';
    lines.push(dutyLine('air-preheat', 'Air heated to the air-electrode inlet', airInlet.enthalpyFlow_W, airInlet.enthalpyFlow_W - airPreheat.duty_W, 'air-electrode inlet, stream table', `the stack's air ${from}, species data`));
  }
  return lines;
}

/** The air blower's power, ṅ Δh_s / η_s. */
function blowerLine(b: NonNullable<PowerPlant['blower']>): LineSpec {
  return {
    id: 'blower-power',
    title: 'Air blower power (one adiabatic stage)',
    equation: 'plant-duty',
    relation: 'blower',
    quantities: [
      { name: 'n', value: b.flow_mol_per_s, unit: 'mol/s', origin: 'air through the blower, stream table' },
      { name: 'hs', value: (b.power_W * b.isentropicEfficiency) / b.flow_mol_per_s / 1000, unit: 'kJ/mol', origin: `isentropic enthalpy rise from ${formatQuantity(b.inletPressure_bar, 'bar')} to ${formatQuantity(b.outletPressure_bar, 'bar')}, species data` },
      { name: 'eta', value: b.isentropicEfficiency, unit: '', origin: 'isentropic efficiency, design input' },
    ],
    value: b.power_W / 1000,
    unit: 'kW',
  };
}

/** The oxidiser's adiabatic balance: the products hold the reactants' enthalpy; none for a liquid-water off-gas. */
function oxidiserLine(r: Results, p: PowerPlant): LineSpec | null {
  const stream = (id: string) => plantStream(r, id);
  const o = p.oxidiser;
  const offGas = stream('fuel-outlet');
  const oxidant = o && stream(o.oxidant === 'fresh-air' ? 'oxidiser-air' : 'air-outlet');
  const products = stream('oxidiser-outlet');
  // A liquid-water off-gas is burnt without its liquid, which the stream carries: no line for it.
  if (o && offGas && oxidant && products && !offGas.speciesFlows_mol_per_s['H2O(L)'] && !oxidant.speciesFlows_mol_per_s['H2O(L)']) {
    return {
      id: 'oxidiser-enthalpy',
      title: `Off-gas oxidiser: the products hold the reactants' enthalpy at ${formatTemperature(o.outletTemperature_K)} (adiabatic)`,
      equation: 'oxidiser-balance',
      relation: 'enthalpy',
      quantities: [
        { name: 'Hog', value: offGas.enthalpyFlow_W / 1000, unit: 'kW', origin: 'fuel-electrode off-gas at the stack temperature, stream table' },
        { name: 'Hox', value: oxidant.enthalpyFlow_W / 1000, unit: 'kW', origin: `${o.oxidant === 'fresh-air' ? 'oxidiser air' : 'air-electrode exhaust'}, stream table` },
      ],
      value: products.enthalpyFlow_W / 1000,
      unit: 'kW',
      note: `the equilibrium products have this enthalpy at ${formatTemperature(o.outletTemperature_K)}, the adiabatic outlet temperature (Gibbs minimum at fixed H and p)`,
    };
  }
  return null;
}

/**
 * A carbonate cell's cathode-gas loop: the burner air from the O2 row of its mole balance, the
 * recycled share from the total, and the adiabatic mixing of the burner's products with the recycle.
 */
function cathodeLoopLines(r: Results, p: PowerPlant): LineSpec[] {
  const l = p.cathodeLoop;
  const burner = plantStream(r, 'burner-outlet');
  const recycle = plantStream(r, 'cathode-recycle');
  const mixed = plantStream(r, 'cathode-gas-mixed');
  const supply = plantStream(r, 'air-supply');
  if (!l || !burner || !recycle || !mixed || !supply) return [];
  const taken = l.oxygenTaken_mol_per_s;
  const oxygenIn = taken / l.airUtilization;
  const total = oxygenIn / l.inletOxygenFraction;
  return [
    {
      id: 'cathode-loop-air',
      title: 'Cathode-gas loop: the burner air, from the O2 balance',
      equation: 'cathode-loop',
      relation: 'air',
      quantities: [
        { name: 'Q', value: oxygenIn, unit: 'mol/s', origin: 'O2 entering the air electrode: the O2 the cells take over the air utilization' },
        { name: 'D', value: l.oxygenDemand_mol_per_s, unit: 'mol/s', origin: 'O2 complete combustion of the off-gas takes, stream table' },
        { name: 'r', value: l.recycledShare, unit: '', origin: 'recycled share, below' },
        { name: 'c', value: taken, unit: 'mol/s', origin: 'O2 the cells take, I/4F' },
        { name: 'y', value: supply.moleFractions.O2!, unit: '', origin: 'O2 fraction of the burner air, design input' },
      ],
      value: l.burnerAir_mol_per_s,
      unit: 'mol/s',
    },
    {
      id: 'cathode-loop-recycle',
      title: 'Cathode-gas loop: the recycled share of the exhaust, from the total balance',
      equation: 'cathode-loop',
      relation: 'recycle',
      quantities: [
        { name: 'N', value: total, unit: 'mol/s', origin: 'gas entering the air electrode: Q over the inlet O2 fraction, design input' },
        { name: 'NB', value: l.burntProducts_mol_per_s, unit: 'mol/s', origin: 'the off-gas burnt completely (CO2, H2O, N2), from its elements' },
        { name: 'D', value: l.oxygenDemand_mol_per_s, unit: 'mol/s', origin: 'O2 complete combustion of the off-gas takes' },
        { name: 'A', value: l.burnerAir_mol_per_s, unit: 'mol/s', origin: 'burner air, above' },
        { name: 'ct', value: l.taken_mol_per_s, unit: 'mol/s', origin: 'O2 and CO2 the cells take, I/4F + I/2F' },
      ],
      value: l.recycledShare,
      unit: '',
      percent: true,
    },
    {
      id: 'cathode-loop-mixing',
      title: `Cathode-gas loop: the burner's products and the recycle mix at ${formatTemperature(l.mixingTemperature_K)} (adiabatic)`,
      equation: 'cathode-loop',
      relation: 'mixing',
      quantities: [
        { name: 'HB', value: burner.enthalpyFlow_W / 1000, unit: 'kW', origin: `burner outlet at ${formatTemperature(l.burnerOutletTemperature_K)}, stream table` },
        { name: 'Hr', value: recycle.enthalpyFlow_W / 1000, unit: 'kW', origin: 'recycled exhaust at the exhaust temperature, stream table' },
      ],
      value: mixed.enthalpyFlow_W / 1000,
      unit: 'kW',
      note: `the mixture has this enthalpy at ${formatTemperature(l.mixingTemperature_K)}; the loop's ${l.heating_W < 0 ? 'cooler takes' : 'heater adds'} ${formatQuantity(Math.abs(l.heating_W) / 1000, 'kW')} to bring it to the air-electrode inlet at ${formatTemperature(l.inletTemperature_K)}`,
    },
  ];
}

/** The heat delivered by the heat recovery and the total CHP efficiency. */
function heatRecoveryLines(r: Results, p: PowerPlant): LineSpec[] {
  if (!p.heatRecovery || !p.chp) return [];
  return [
    {
      id: 'delivered-heat',
      title: 'Heat delivered by the heat recovery',
      equation: 'delivered-heat',
      relation: 'heat',
      quantities: [
        { name: 'R', value: p.heatRecovery.heatWithCondensation_W / 1000, unit: 'kW', origin: 'exhaust cooled to the exit temperature, with condensation' },
        { name: 'D', value: p.netDuty_W / 1000, unit: 'kW', origin: "net duty of the plant's heaters, duty table" },
        { name: 'L', value: p.heatLoss_W / 1000, unit: 'kW', origin: 'heat loss, design input × fuel LHV input' },
      ],
      value: p.heatRecovery.deliveredHeat_W / 1000,
      unit: 'kW',
    },
    {
      id: 'chp-efficiency',
      title: 'Total efficiency of combined heat and power (LHV)',
      equation: 'chp-efficiency',
      relation: 'chp',
      quantities: [
        { name: 'P', value: p.chp.netPower_W / 1000, unit: 'kW', origin: 'net AC power, above' },
        { name: 'Q', value: p.chp.deliveredHeat_W / 1000, unit: 'kW', origin: 'heat delivered, above' },
        { name: 'L', value: r.efficiency.fuelLhvInput_W! / 1000, unit: 'kW', origin: 'fuel LHV input, efficiency figures' },
      ],
      value: p.chp.totalEfficiencyLhv,
      unit: '',
    },
  ];
}

/** The worked lines of the plant: the layout's, then the electrolysis plant's or the power plant's. */
export function plantLines(r: Results): LineSpec[] {
  const lines = layoutLines(r);
  if (r.plant.electrolysis) return [...lines, ...electrolysisLines(r, r.plant.electrolysis)];
  const p = r.plant.power;
  if (!p) return lines;
  if (p.steam) lines.push(steamLine(p.steam, '', 'feed water at the steam-to-carbon ratio, stream table', 'steam superheated to the mixing temperature, species data'));
  lines.push(...preheatLines(r, p));
  if (p.blower) lines.push(blowerLine(p.blower));
  const oxidiser = oxidiserLine(r, p);
  if (oxidiser) lines.push(oxidiser);
  lines.push(...cathodeLoopLines(r, p));
  return [...lines, ...heatRecoveryLines(r, p)];
}
