/**
 * The plant around a carbonate cell's cathode-gas loop (its mole balance: cathode-loop.ts, solved
 * with the unit feeds): the burner takes the fuel-electrode off-gas at the stack temperature and
 * the burner air after the blower, and burns the off-gas completely (the products of the mole
 * balance; at the burner's lean mixture the equilibrium products the off-gas oxidiser would give,
 * lib/equilibrium/adiabatic.ts, differ by traces: at the molten carbonate demo's rated point 7 ppm
 * of NO and 1e-6 ppm of CO, the outlet 0.02 K cooler). Its outlet is adiabatic:
 *
 *   H_B(T_burner) = H_off-gas(T_stack) + H_air(T_blown)
 *
 * The recycle leaves with the air-electrode exhaust at its temperature T_exh (the stack heat
 * balance's) and mixes adiabatically with the burner's products:
 *
 *   H_in(T_mix) = H_B(T_burner) + H_recycle(T_exh)
 *
 * The cathode inlet temperature stays the basis's (conditions.air-inlet-temperature, the stack
 * supplier's window); the loop's heater or cooler brings the mixture from T_mix to it,
 * Q = H_in(T_in) − H_in(T_mix) (negative: heat taken from the loop). Whatever the loop does not
 * recycle, (1 − r) of the exhaust, leaves at T_exh as the plant's exhaust.
 */
import { mixtureEnthalpyJ } from '../thermo/mixture.ts';
import { temperatureAtEnthalpyK } from '../thermo/mixture-temperature.ts';
import type { DesignPoint } from './design-point.ts';
import { massFlowKgPerS, scaled, totalFlow } from './streams.ts';
import type { PowerPlantBalance } from './plant-balance-types.ts';
import type { PlantSheet } from './plant-sheet.ts';
import type { AirFeeds } from './power-feeds.ts';
import type { OxidiserExhaust } from './off-gas-oxidiser.ts';

const H = mixtureEnthalpyJ;

/** The loop's burner, recycle and mixing on the stack scale, their streams and the loop's heater on the sheet; the vent, the plant's exhaust, is added by the caller after the stack's outlets. */
export function cathodeGasLoop(point: DesignPoint, air: AirFeeds, offGas: Readonly<Record<string, number>>, sheet: PlantSheet): { loop: NonNullable<PowerPlantBalance['cathodeLoop']>; exhaust: OxidiserExhaust } {
  const unit = point.unit.cathodeLoop!;
  const inputs = point.inputs;
  const pAir = inputs.airPressureBar;
  const tStack = inputs.temperatureK;
  const burnt = scaled(unit.burnerExhaust, point.scale);
  const recycle = scaled(unit.recycle, point.scale);
  const inlet = scaled(unit.inlet, point.scale);
  const vent = scaled(unit.vent, point.scale);
  const burnerK = temperatureAtEnthalpyK(burnt, H(offGas, tStack) + H(air.airTotal, air.blownK), tStack);
  const tExh = point.stackBalance?.exhaustTemperatureK ?? tStack;
  const mixK = temperatureAtEnthalpyK(inlet, H(burnt, burnerK) + H(recycle, tExh), tExh);
  const tIn = inputs.airInletTemperatureK;
  const heatingW = H(inlet, tIn) - H(inlet, mixK);
  sheet.add('burner-outlet', 'cathode-gas burner outlet (off-gas burnt with the burner air)', burnerK, pAir, burnt);
  sheet.add('cathode-recycle', 'recycled air-electrode exhaust', tExh, pAir, recycle);
  sheet.add('cathode-gas-mixed', 'burner outlet mixed with the recycle', mixK, pAir, inlet);
  sheet.duty('cathode-gas-heating', heatingW >= 0 ? 'cathode gas heated to the air-electrode inlet' : 'cathode gas cooled to the air-electrode inlet', heatingW, mixK, tIn);
  sheet.add('air-inlet', 'air-electrode inlet', tIn, pAir, inlet);
  const entering = point.streams.find((s) => s.id === 'air-inlet')!;
  const outlet = point.streams.find((s) => s.id === 'air-outlet')!;
  const loop = {
    burnerAirMolPerS: totalFlow(air.airTotal),
    burnerAirKgPerS: massFlowKgPerS(air.airTotal),
    recycledShare: unit.recycledShare,
    inletOxygenFraction: inputs.cathodeLoop!.inletOxygenFraction,
    airUtilization: (entering.flows.O2! - outlet.flows.O2!) / entering.flows.O2!,
    carbonDioxideUtilization: (entering.flows.CO2! - outlet.flows.CO2!) / entering.flows.CO2!,
    oxygenDemandMolPerS: unit.oxygenDemandMolPerS * point.scale,
    // N_B: the burner's products less its air, O2 added back (B's O2 is −D).
    burntProductsMolPerS: totalFlow(burnt) - totalFlow(air.airTotal) + unit.oxygenDemandMolPerS * point.scale,
    takenMolPerS: totalFlow(entering.flows) - totalFlow(outlet.flows),
    oxygenTakenMolPerS: entering.flows.O2! - outlet.flows.O2!,
    burnerOutletTemperatureK: burnerK,
    recycleTemperatureK: tExh,
    mixingTemperatureK: mixK,
    inletTemperatureK: tIn,
    heatingW,
    inletFlows: inlet,
  };
  return { loop, exhaust: { name: 'air-electrode exhaust leaving the cathode-gas loop', flows: vent, temperatureK: tExh, pressureBar: pAir } };
}
