/**
 * The balance of a fuel-cell (power) plant: the feeds and the stack's outlets (power-feeds.ts),
 * the off-gas oxidiser (off-gas-oxidiser.ts) or a carbonate cell's cathode-gas loop, whose burner
 * takes its place (power-cathode-loop.ts), the heat recovery and CHP figures
 * (power-heat-recovery.ts), and the first law over the plant boundary (feeds in, exhaust,
 * condensate, electricity and heat out):
 *   H_fuel + H_water + H_air + W_blower = P_DC + Q_delivered + Q_loss + Q_rejected + H_exhaust + H_condensate
 * evaluated from the streams independently of how the duties were chained; its residual over the
 * LHV input is reported and must be below 1e-9. Without heat recovery the heaters are supplied
 * from outside the balance: their net duty is an input.
 */
import { mixtureEnthalpyJ } from '../thermo/mixture.ts';
import type { PlantInput } from '../basis/types.ts';
import type { DesignPoint } from './design-point.ts';
import type { Finding } from './findings.ts';
import type { PlantStream, PowerPlantBalance } from './plant-balance-types.ts';
import { firstLaw, PlantSheet } from './plant-sheet.ts';
import { airSupply, fuelPreparation, offGasOf, stackOutlets, type AirFeeds, type FuelFeeds, type StackOutlets } from './power-feeds.ts';
import { offGasOxidiser, type OxidiserExhaust } from './off-gas-oxidiser.ts';
import { chpOf, exhaustRecovery, type RecoveredExhaust } from './power-heat-recovery.ts';
import { cathodeGasLoop } from './power-cathode-loop.ts';

const H = mixtureEnthalpyJ;

/** The first law's terms over the plant boundary (the module comment), scaled by the fuel's LHV. */
function powerEnergyBalance(
  point: DesignPoint,
  feeds: FuelFeeds,
  air: AirFeeds,
  outlets: StackOutlets,
  exhaust: OxidiserExhaust | null,
  recovered: RecoveredExhaust | null,
  netDutyW: number,
  heatLossW: number,
  rejectedW: number,
): PowerPlantBalance['energy'] {
  const tStack = point.inputs.temperatureK;
  const { offGas, airOutlet, airExhaustK, liquidOffGas, liquidAir } = outlets;
  const terms: PowerPlantBalance['energy']['terms'] = [
    { name: 'fuel', valueW: H(feeds.fuel, feeds.fuelSupplyK), side: 'in' },
    { name: 'feed water', valueW: feeds.waterMol > 0 ? H({ 'H2O(L)': feeds.waterMol }, feeds.feedWaterK) : 0, side: 'in' },
    { name: 'air', valueW: H(air.airTotal, air.supplyK), side: 'in' },
    { name: 'blower work', valueW: air.blower?.powerW ?? 0, side: 'in' },
    { name: 'stack DC power', valueW: point.stackPowerW, side: 'out' },
  ];
  if (recovered) {
    const { heatRecovery, exitGas, exitK, condensate } = recovered;
    terms.push({ name: 'heat delivered', valueW: heatRecovery.deliveredHeatW, side: 'out' });
    terms.push({ name: 'heat lost to ambient', valueW: heatLossW, side: 'out' });
    terms.push({ name: 'exhaust', valueW: H(exitGas, exitK), side: 'out' });
    terms.push({ name: 'condensate', valueW: condensate > 0 ? H({ 'H2O(L)': condensate }, exitK) : 0, side: 'out' });
  } else {
    // Without heat recovery the heaters are supplied from outside the balance: their net duty is an input.
    terms.push({ name: "heaters' net duty", valueW: netDutyW, side: 'in' });
    if (exhaust) terms.push({ name: exhaust.name ?? 'oxidiser exhaust', valueW: H(exhaust.flows, exhaust.temperatureK), side: 'out' });
    else {
      terms.push({ name: 'fuel-electrode off-gas', valueW: H(offGas, tStack), side: 'out' });
      terms.push({ name: 'air-electrode exhaust', valueW: H(airOutlet, airExhaustK), side: 'out' });
    }
  }
  if (rejectedW !== 0) terms.push({ name: 'stack heat rejected', valueW: rejectedW, side: 'out' });
  if (liquidOffGas + liquidAir > 0) terms.push({ name: 'liquid water from the stack', valueW: H({ 'H2O(L)': liquidOffGas + liquidAir }, tStack), side: 'out' });
  return firstLaw(terms, point.power!.fuelLhvW);
}

/** The balance of a power plant (the module comment's blocks, in the order the gas passes them). */
export function powerBalance(point: DesignPoint, plant: PlantInput, findings: Finding[]): { balance: PowerPlantBalance; streams: PlantStream[] } {
  const inputs = point.inputs;
  const sheet = new PlantSheet();
  const feeds = fuelPreparation(point, plant, sheet);
  const offGas = offGasOf(point, plant);
  const air = airSupply(point, plant, offGas.offGas, sheet, findings);
  const loop = point.unit.cathodeLoop ? cathodeGasLoop(point, air, offGas.offGas, sheet) : null;
  const outlets = stackOutlets(point, plant, offGas, feeds.recycle !== null, sheet);
  if (loop) sheet.add('cathode-vent', 'air-electrode exhaust leaving the cathode-gas loop', loop.exhaust.temperatureK, loop.exhaust.pressureBar, loop.exhaust.flows);
  const { oxidiser, exhaust } = loop ? { oxidiser: null, exhaust: loop.exhaust } : offGasOxidiser(point, plant, air, outlets, sheet, findings);

  const netDutyW = sheet.duties.reduce((a, d) => a + d.dutyW, 0);
  // Heat lost to ambient is counted against the recovered heat, so only where there is heat recovery.
  const heatLossW = plant.heatRecovery ? plant.heatLossFraction * point.power!.fuelLhvW : 0;
  const { airCooled, stackHeatTo, stackHeatW } = outlets;
  const stackCoolantW = !airCooled && stackHeatTo === 'recovered' ? stackHeatW : 0;
  const rejectedW = !airCooled && stackHeatTo === 'rejected' ? stackHeatW : 0;
  const hottestFeedK = Math.max(inputs.fuelInletTemperatureK, inputs.airInletTemperatureK, feeds.mixingTemperatureK);
  const recovered = plant.heatRecovery && exhaust ? exhaustRecovery(point, plant, exhaust, { netDutyW, heatLossW, stackCoolantW, hottestFeedK }, sheet, findings) : null;
  if (outlets.liquidOffGas > 0) sheet.add('fuel-electrode-water', 'liquid water from the fuel electrode', inputs.temperatureK, inputs.fuelPressureBar, { 'H2O(L)': outlets.liquidOffGas });
  if (outlets.liquidAir > 0) sheet.add('air-electrode-water', 'liquid water from the air electrode', inputs.temperatureK, inputs.airPressureBar, { 'H2O(L)': outlets.liquidAir });

  const heatRecovery = recovered?.heatRecovery ?? null;
  return {
    streams: sheet.streams,
    balance: {
      steam: feeds.steam,
      mixingTemperatureK: feeds.mixingTemperatureK,
      duties: sheet.duties,
      netDutyW,
      blower: air.blower,
      stackHeatW,
      stackHeatTo,
      airExhaustTemperatureK: outlets.airExhaustK,
      oxidiser,
      cathodeLoop: loop?.loop ?? null,
      heatRecovery,
      heatLossW,
      chp: chpOf(point, heatRecovery),
      energy: powerEnergyBalance(point, feeds, air, outlets, exhaust, recovered, netDutyW, heatLossW, rejectedW),
    },
  };
}
