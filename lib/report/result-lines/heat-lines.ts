/**
 * The worked lines of the stack's heat: from the voltages (the reactions at the rate of the ionic
 * current, the electric work at the terminals) and from the enthalpy balance. V_tn,eff is the
 * enthalpy the reactions release per charge in power mode, (H_in − H_out)/I, and the enthalpy
 * they absorb in electrolysis, (H_out − H_in)/I (equations.ts 'heat-voltage').
 */
import type { Results } from '../../plant/results-schema.ts';
import type { LineSpec, QuantitySpec } from '../calc-line.ts';

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
  ];
}
