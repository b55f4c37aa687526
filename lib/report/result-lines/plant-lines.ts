/**
 * The worked lines of the plant around the stack: the stack, bus voltage and bus current of the
 * electrical layout, and in power mode the steam raising, the heat delivered and the total
 * efficiency of combined heat and power.
 */
import type { Results } from '../../plant/results-schema.ts';
import type { LineSpec } from '../calc-line.ts';

export function plantLines(r: Results): LineSpec[] {
  const e = r.plant.electrical;
  const lines: LineSpec[] = [
    {
      id: 'stack-voltage',
      title: 'Terminal voltage of one stack',
      equation: 'plant-layout',
      relation: 'stack',
      quantities: [
        { name: 'n', value: e.cellsPerStack, unit: '', origin: 'cells per stack, design input (default: all cells in one stack)' },
        { name: 'V', value: r.headline.cellVoltage_V, unit: 'V', origin: 'cell voltage, above' },
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
        { name: 'm', value: e.stacksInSeries, unit: '', origin: e.stacksInSeriesFrom === 'given' ? 'stacks in series, design input' : 'stacks in series, from the DC bus window' },
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
        { name: 'Icell', value: r.headline.cellCurrent_A, unit: 'A', origin: 'cell current, above' },
      ],
      value: e.busCurrent_A,
      unit: 'A',
    },
  ];
  const p = r.plant.power;
  if (!p) return lines;
  if (p.steam) {
    const n = p.steam.water_mol_per_s;
    lines.push({
      id: 'steam-raising',
      title: 'Steam raising from the feed water',
      equation: 'steam-raising',
      relation: 'steam',
      quantities: [
        { name: 'n', value: n, unit: 'mol/s', origin: 'feed water at the steam-to-carbon ratio, stream table' },
        { name: 'hl', value: p.steam.liquidHeating_W / n / 1000, unit: 'kJ/mol', origin: 'liquid heated to saturation, species data' },
        { name: 'L', value: p.steam.latentHeat_J_per_mol / 1000, unit: 'kJ/mol', origin: 'latent heat at the saturation temperature, species data' },
        { name: 'hg', value: p.steam.superheating_W / n / 1000, unit: 'kJ/mol', origin: 'steam superheated to the mixing temperature, species data' },
      ],
      value: (p.steam.liquidHeating_W + p.steam.evaporation_W + p.steam.superheating_W) / 1000,
      unit: 'kW',
    });
  }
  if (p.heatRecovery && p.chp) {
    lines.push(
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
    );
  }
  return lines;
}
