/**
 * The worked lines of the stack's heat: from the voltages (the reactions at the rate of the ionic
 * current, the electric work at the terminals) and from the enthalpy balance. V_tn,eff is the
 * enthalpy the reactions release per charge in power mode, (H_in − H_out)/I, and the enthalpy
 * they absorb in electrolysis, (H_out − H_in)/I (equations.ts 'heat-voltage'). An air-cooled
 * stack adds its balance with the feeds at their inlet temperatures and the air that closes it
 * (lib/plant/stack-heat-balance.ts).
 */
import type { Results } from '../../plant/results-schema.ts';
import type { LineSpec, QuantitySpec } from '../calc-line.ts';
import { formatNumber, formatTemperature } from '../format.ts';

/** An air-cooled stack: Q_fed = Q − ΔH_fuel − ΔH_air, and the air of the feed's composition that makes it zero. */
function stackBalanceLines(r: Results): LineSpec[] {
  const b = r.heat.stackBalance;
  if (!b) return [];
  const t = r.conditions.temperature_K;
  const stream = (id: string) => r.streams.find((s) => s.id === id);
  const fuel = stream('fuel-inlet');
  const air = stream('air-inlet')!;
  const Q: QuantitySpec = { name: 'Q', value: r.heat.isothermalHeat_W / 1000, unit: 'kW', origin: 'stack heat, isothermal boundary, above' };
  const dHf: QuantitySpec = { name: 'dHf', value: b.fuelHeating_W / 1000, unit: 'kW', origin: fuel ? `fuel-electrode inlet from ${formatTemperature(fuel.temperature_K)} to ${formatTemperature(t)}, species data` : 'no fuel-electrode feed' };
  const lines: LineSpec[] = [
    {
      id: 'heat-as-fed',
      title: 'Stack heat balance with the feeds at their inlet temperatures (zero: the stack holds its temperature)',
      equation: 'heat-as-fed',
      relation: 'fed',
      quantities: [Q, dHf, { name: 'dHa', value: b.airHeating_W / 1000, unit: 'kW', origin: `air-electrode inlet from ${formatTemperature(air.temperature_K)} to ${formatTemperature(t)}, species data` }],
      value: r.heat.asFedHeat_W / 1000,
      unit: 'kW',
      note: `The air-electrode exhaust carries the rest: it leaves at ${formatTemperature(b.airExhaustTemperature_K)}.`,
    },
  ];
  if (r.heat.coolingAir_mol_per_s !== null) {
    lines.push({
      id: 'cooling-air',
      title: 'Air that closes the stack heat balance at the stated inlet temperature',
      equation: 'cooling-air',
      relation: 'air',
      quantities: [Q, dHf, { name: 'dha', value: b.airHeating_W / air.flow_mol_per_s / 1000, unit: 'kJ/mol', origin: `one mole of the air-electrode feed from ${formatTemperature(air.temperature_K)} to ${formatTemperature(t)}, species data` }],
      value: r.heat.coolingAir_mol_per_s,
      unit: 'mol/s',
      note: `The air fed is ${formatNumber(air.flow_mol_per_s, 5)} mol/s (stream table).`,
    });
  }
  return lines;
}

export function heatLines(r: Results): LineSpec[] {
  const power = r.technology.mode === 'power';
  const mixed = r.electrochemistry.ionicTransferenceNumber < 1;
  const h = r.headline;
  const heat = r.heat;
  const I: QuantitySpec = { name: 'I', value: h.totalCurrent_A, unit: 'A', origin: 'sum of the cell currents, above' };
  const Iion: QuantitySpec = { name: 'Iion', value: r.electrochemistry.ionicCurrent_A, unit: 'A', origin: 'ionic current, above' };
  const Vtn: QuantitySpec = { name: 'Vtn', value: r.electrochemistry.effectiveThermoneutralVoltage_V, unit: 'V', origin: `enthalpy ${power ? 'released' : 'absorbed'} by the reactions over the ${mixed ? 'ionic ' : ''}current` };
  const V: QuantitySpec = { name: 'V', value: h.cellVoltage_V, unit: 'V', origin: 'cell voltage, above' };
  return [
    {
      id: 'heat-voltage',
      title: power ? 'Stack heat from the voltages' : 'Stack heat from the voltages (negative: heat to supply)',
      equation: 'heat-voltage',
      relation: 'heat',
      quantities: mixed
        ? power
          ? [Iion, Vtn, I, V]
          : [I, V, Iion, Vtn]
        : power
          ? [I, Vtn, V]
          : [I, V, Vtn],
      value: heat.isothermalHeat_W / 1000,
      unit: 'kW',
    },
    {
      id: 'heat-balance',
      title: 'Stack heat from the enthalpy balance (isothermal boundary)',
      equation: 'heat-balance',
      relation: 'balance',
      quantities: [
        { name: 'Hin', value: heat.inletEnthalpyIsothermal_W / 1000, unit: 'kW', origin: 'inlet streams at the stack temperature' },
        { name: 'Hout', value: heat.outletEnthalpy_W / 1000, unit: 'kW', origin: 'outlet streams (stream table)' },
        { name: 'W', value: heat.electricWorkIn_W / 1000, unit: 'kW', origin: power ? 'minus the stack DC power' : 'the stack power input' },
      ],
      value: heat.isothermalHeat_W / 1000,
      unit: 'kW',
    },
    ...stackBalanceLines(r),
  ];
}
