/**
 * The balance of an electrolysis plant (the stack's inlets and outlets as the design point gives them):
 *  - Water fed as vapour is raised from the feed water at T_w (steam-raising.ts: liquid heating,
 *    L(T_s) at T_s = T_sat(p) of its electrode, superheating to the electrode's inlet temperature).
 *    Water fed as liquid circulates in a loop: the liquid leaving the stack returns to its inlet
 *    (cooled by the loop cooler), and the make-up ṅ_mu = ṅ_L,in − ṅ_L,out (the water split and the
 *    vapour the gases carry off) is heated from T_w to the inlet temperature. Other gases of an
 *    inlet (hydrogen fed with the steam, sweep air) are fed from outside at the fuel or air supply
 *    temperature and heated to the inlet temperature.
 *  - Recuperator (optional, recuperator.ts): the stack's gas outlets heat the feeds in counter-flow
 *    (the feed water from T_w through its evaporation at T_s, the gases from their supply
 *    temperature); each feed's heaters then supply only H_i(T_in) − H_i(T*, x*), the rest from
 *    where the recuperator leaves it (the feed water's water heater, evaporator and superheater by
 *    steam-raising.ts's second set), and the products leave at the hot outlet T_ho.
 *    Without it no heat is recovered from the products to the feeds.
 *  - Stack: Q_stack = H_in(fed) − H_out(T_stack) + P_DC (heat.ts, "as fed"); the heat lost to ambient
 *    from the stacks, separators and piping Q_loss = f_loss · P_DC, a share of the stack's DC input,
 *    is taken from it: Q_net = Q_stack − Q_loss. The DC input, not the AC input: the rectifier's and
 *    transformer's loss, P_DC (1/η_conv − 1), is dissipated in the rectifier's own room and cooling,
 *    and the balance of plant's draw where its pumps and controls stand; neither passes through the
 *    hot water circuit whose losses f_loss counts. Where Q_net < 0 a water loop's
 *    cooler first removes up to Q_loss less: the loop's water gave that heat to ambient on its way
 *    from the stacks (it reaches the cooler at T_c, H_back(T_c) = H_back(T_in) − Q_cooler, below the
 *    stack temperature, and the duty says so), and the cooler still returns it at the inlet
 *    temperature, the one the stack was computed with and the stack inlet states. Heat the stack
 *    itself lacks to warm a loop fed more water than its heat warms by the allowed rise can only
 *    come back with the water: the cooler removes that much less again and returns it warmer,
 *    H_back(T_r) = H_back(T_in) + the lack (a basis that over-feeds its loop). The rest, −Q_net,
 *    is supplied to the stack (below thermoneutral). Where Q_net > 0 the stack's cooling removes it.
 *  - Heat supplied Q_sup = Σ (positive duties) + stack supply: by electric heaters (counted in the
 *    electricity) or from outside the plant, as plant.heat-supply says.
 *  - Hydrogen compression (optional): hydrogen-compression.ts.
 *  - Specific energy: e = (P_AC + P_heat,el + P_comp) / ṁ_H2 (kWh/kg), P_AC = P_DC (1/η_conv + f_BOP)
 *    (design-point.ts), ṁ_H2 the net hydrogen made; the system efficiency is the products' LHV (HHV)
 *    over the electricity and any heat from outside.
 *  - First law over the plant: H_water + H_gases + P_DC + Q_sup + W_comp = H_H2 + H_O2 + H_condensate
 *    + H_dryer + Q_coolers + Q_stack,removed + Q_loss, its residual over the electricity below 1e-9.
 */
import { getSpecies } from '../thermo/species-data.ts';
import { temperatureAtEnthalpyK } from '../thermo/mixture-temperature.ts';
import { mixtureEnthalpyJ } from '../thermo/mixture.ts';
import type { PlantInput } from '../basis/types.ts';
import type { DesignPoint } from './design-point.ts';
import { totalFlow, type Stream } from './streams.ts';
import type { ElectrodeSteam, ElectrolysisPlantBalance, PlantDuty, PlantStream, PowerPlantBalance } from './plant-balance-types.ts';
import { firstLaw, PlantSheet, without } from './plant-sheet.ts';
import { raiseSteam, steamHeatersAfter } from './steam-raising.ts';
import { hydrogenDelivery, type HydrogenDelivery } from './hydrogen-compression.ts';
import type { Finding } from './findings.ts';
import { recuperate, type ColdFeed, type HotOutlet, type RecuperatedFeed } from './recuperator.ts';

const H = mixtureEnthalpyJ;

type Electrode = 'fuel' | 'air';

/** A gas other than water fed to an inlet from outside (hydrogen with the steam, sweep air). */
interface GasFeed {
  electrode: Electrode;
  flows: Record<string, number>;
  temperatureK: number;
}

/** A feed a recuperator could heat, with the ids of the duties that heat it without one, in order from its inlet. */
type HeatedFeed = ColdFeed & { heaterIds: string[] };

/** The feeds of the stack's inlets: the feed water, the steam raised, the water loop and the gases fed from outside. */
interface ElectrolysisFeeds {
  inlets: { electrode: Electrode; stream: Stream }[];
  feedWaterMol: number;
  steam: ElectrodeSteam[];
  gasFeeds: GasFeed[];
  /** The feeds a recuperator could heat: the feed water from its supply (to steam), the gases from theirs. */
  coldFeeds: HeatedFeed[];
  liquidIn: number;
  makeUp: number;
  returned: number;
  drain: number;
}

/** The water split between the loop's return, its make-up and the drain, mol/s (the module comment). */
function waterLoop(inlets: ElectrolysisFeeds['inlets'], outlets: Stream[]) {
  const liquidOut = outlets.reduce((a, x) => a + (x.flows['H2O(L)'] ?? 0), 0);
  const liquidIn = inlets.reduce((a, x) => a + (x.stream.flows['H2O(L)'] ?? 0), 0);
  const returned = Math.min(liquidIn, liquidOut);
  return { liquidIn, returned, makeUp: liquidIn - returned, drain: liquidOut - returned };
}

/** One inlet's feed preparation: its steam raised, its share of the loop's make-up and return, its gases preheated. */
function electrodeFeed(point: DesignPoint, plant: PlantInput, inlet: ElectrolysisFeeds['inlets'][number], loop: ReturnType<typeof waterLoop>, sheet: PlantSheet, steam: ElectrodeSteam[], gasFeeds: GasFeed[], coldFeeds: HeatedFeed[]): void {
  const { electrode, stream } = inlet;
  const tWater = plant.feedWaterTemperatureK;
  const tStack = point.inputs.temperatureK;
  const side = electrode === 'fuel' ? 'fuel-electrode' : 'air-electrode';
  const suffix = electrode === 'fuel' ? '' : '-air';
  const vapourMol = stream.flows.H2O ?? 0;
  const liquidMol = stream.flows['H2O(L)'] ?? 0;
  const gases = without(without(stream.flows, 'H2O'), 'H2O(L)');
  const tIn = stream.temperatureK;
  if (vapourMol > 0) {
    const s = { electrode, toK: tIn, ...raiseSteam(vapourMol, tWater, stream.pressureBar, tIn) };
    steam.push(s);
    sheet.duty(`feed-water-heating${suffix}`, `feed water heated to saturation (${side} steam)`, s.liquidHeatingW, tWater, s.saturationTemperatureK);
    sheet.duty(`evaporation${suffix}`, `feed water evaporated (${side} steam)`, s.evaporationW, s.saturationTemperatureK, s.saturationTemperatureK);
    sheet.duty(`superheating${suffix}`, `steam superheated to the ${side} inlet`, s.superheatingW, s.saturationTemperatureK, tIn);
    const heaterIds = [`feed-water-heating${suffix}`, `evaporation${suffix}`, `superheating${suffix}`];
    coldFeeds.push({ heaterIds, id: `${electrode}-steam`, name: `feed water for the ${side} steam`, flows: { H2O: vapourMol }, fromK: tWater, targetK: tIn, saturationK: s.saturationTemperatureK, pressureBar: stream.pressureBar });
  }
  if (liquidMol > 0) {
    const own = liquidMol === loop.liquidIn ? loop.makeUp : (loop.makeUp * liquidMol) / loop.liquidIn;
    const back = liquidMol - own;
    sheet.duty(`make-up-heating${suffix}`, `make-up water heated to the ${side} inlet`, H({ 'H2O(L)': own }, tIn) - H({ 'H2O(L)': own }, tWater), tWater, tIn);
    if (back > 0) sheet.duty(`loop-cooling${suffix}`, `water loop cooler (the returned water brought back to the ${side} inlet)`, H({ 'H2O(L)': back }, tIn) - H({ 'H2O(L)': back }, tStack), tStack, tIn);
  }
  if (totalFlow(gases) > 0) {
    const tSupply = electrode === 'fuel' ? plant.fuelSupplyTemperatureK : plant.airSupplyTemperatureK;
    gasFeeds.push({ electrode, flows: gases, temperatureK: tSupply });
    coldFeeds.push({ heaterIds: [`${electrode}-gas-preheat`], id: `${electrode}-gas`, name: electrode === 'fuel' ? 'gas fed with the steam' : 'sweep gas', flows: gases, fromK: tSupply, targetK: tIn, saturationK: null, pressureBar: stream.pressureBar });
    sheet.add(`${electrode}-gas-supply`, electrode === 'fuel' ? 'gas fed with the steam (fuel electrode)' : 'sweep gas supply', tSupply, stream.pressureBar, gases);
    sheet.duty(`${electrode}-gas-preheat`, `${electrode === 'fuel' ? 'gas fed with the steam' : 'sweep gas'} heated to the ${side} inlet`, H(gases, tIn) - H(gases, tSupply), tSupply, tIn);
  }
}

/** The feeds of every inlet, and the inlets' own streams (the module comment). */
function electrolysisFeeds(point: DesignPoint, plant: PlantInput, sheet: PlantSheet): ElectrolysisFeeds {
  const inlets = (['fuel', 'air'] as const)
    .map((electrode) => ({ electrode, stream: point.streams.find((x) => x.id === `${electrode}-inlet`) }))
    .filter((x): x is { electrode: Electrode; stream: NonNullable<typeof x.stream> } => x.stream !== undefined);
  const outlets = point.streams.filter((x) => x.id === 'fuel-outlet' || x.id === 'air-outlet');
  const loop = waterLoop(inlets, outlets);
  const feedWaterMol = inlets.reduce((a, x) => a + (x.stream.flows.H2O ?? 0), 0) + loop.makeUp;
  sheet.add('feed-water', 'feed water', plant.feedWaterTemperatureK, Math.max(...inlets.map((x) => x.stream.pressureBar)), feedWaterMol > 0 ? { 'H2O(L)': feedWaterMol } : {});
  const steam: ElectrodeSteam[] = [];
  const gasFeeds: GasFeed[] = [];
  const coldFeeds: HeatedFeed[] = [];
  for (const inlet of inlets) electrodeFeed(point, plant, inlet, loop, sheet, steam, gasFeeds, coldFeeds);
  for (const { stream } of inlets) sheet.add(stream.id, stream.name, stream.temperatureK, stream.pressureBar, { ...stream.flows });
  return { inlets, feedWaterMol, steam, gasFeeds, coldFeeds, ...loop };
}

/** The stack's gas outlets (its liquid water apart), with the loop's return and drain streams. */
function electrolysisOutlets(point: DesignPoint, feeds: ElectrolysisFeeds, sheet: PlantSheet): { product: Record<string, number>; oxygen: Record<string, number> } {
  const inputs = point.inputs;
  const tStack = inputs.temperatureK;
  const gasOf = (id: string) => without(point.streams.find((x) => x.id === id)?.flows ?? {}, 'H2O(L)');
  const product = gasOf('fuel-outlet');
  const oxygen = gasOf('air-outlet');
  sheet.add('fuel-outlet', 'fuel-electrode outlet (hydrogen product)', tStack, inputs.fuelPressureBar, product);
  sheet.add('air-outlet', 'air-electrode outlet (oxygen product)', tStack, inputs.airPressureBar, oxygen);
  if (feeds.returned > 0) sheet.add('loop-return', 'water returned from the stack to its inlet', tStack, Math.max(...feeds.inlets.map((x) => x.stream.pressureBar)), { 'H2O(L)': feeds.returned });
  if (feeds.drain > 0) sheet.add('stack-drain', 'liquid water drained from the stack', tStack, inputs.fuelPressureBar, { 'H2O(L)': feeds.drain });
  return { product, oxygen };
}

/**
 * A feed's heaters after the recuperator (their duties and start temperatures changed in place):
 * a gas's preheater from T* to the inlet, H(T_in) − H(T*); the feed water's water heater,
 * evaporator and superheater from where the recuperator leaves it (steam-raising.ts).
 */
function heatersAfter(sheet: PlantSheet, feed: HeatedFeed, out: RecuperatedFeed): void {
  const heater = (i: number) => sheet.duties.find((d) => d.id === feed.heaterIds[i])!;
  if (out.saturationK === null) {
    heater(0).dutyW = H(out.flows, out.targetK) - H(out.flows, out.toK);
    heater(0).fromK = out.toK;
    return;
  }
  const rest = steamHeatersAfter(feed.flows.H2O ?? 0, out.saturationK, out.toK, out.flows.H2O ?? 0, out.targetK);
  Object.assign(heater(0), { dutyW: rest.liquidHeatingW, fromK: rest.liquidFromK });
  heater(1).dutyW = rest.evaporationW;
  Object.assign(heater(2), { dutyW: rest.superheatingW, fromK: rest.vapourFromK });
}

/**
 * The recuperator (recuperator.ts), where the basis has one: the stack's gas outlets heat the
 * feeds (the feed water from its supply temperature, the gases from theirs); each feed's heaters
 * then take it only from where the recuperator leaves it to the stack inlet, and the products
 * leave at the recuperator's hot outlet.
 */
function feedRecuperator(point: DesignPoint, plant: PlantInput, feeds: ElectrolysisFeeds, gas: { product: Record<string, number>; oxygen: Record<string, number> }, sheet: PlantSheet): ElectrolysisPlantBalance['recuperator'] {
  const r = plant.recuperator;
  if (!r || feeds.coldFeeds.length === 0) return null;
  const inputs = point.inputs;
  const outlets: HotOutlet[] = [
    { id: 'fuel-outlet', name: 'hydrogen product', flows: gas.product, pressureBar: inputs.fuelPressureBar },
    { id: 'air-outlet', name: 'oxygen side', flows: gas.oxygen, pressureBar: inputs.airPressureBar },
  ].filter((o) => totalFlow(o.flows) > 0);
  const rec = recuperate(outlets, inputs.temperatureK, feeds.coldFeeds, r.minimumApproachK);
  rec.feeds.forEach((f, i) => {
    heatersAfter(sheet, feeds.coldFeeds[i]!, f);
    sheet.add(`${f.id}-recuperated`, `${f.name} after the recuperator`, f.toK, f.pressureBar, f.flows);
  });
  for (const o of rec.outlets) sheet.add(`${o.id}-recuperated`, `${o.name} after the recuperator`, rec.hotOutletK, o.pressureBar, o.flows);
  return rec;
}

/**
 * The stack heat: what the losses leave of it is removed by the stack's cooling, or, below zero,
 * supplied. Where the losses take more than the stack's heat, a water loop's cooler removes up to
 * the losses less, its water having given them up on its way, and returns the water at the inlet
 * temperature; heat the stack itself lacks to warm its loop, up to the cooler's duty, comes back
 * with warmer water: that loop duty, its temperatures and its name are changed in place (the
 * module comment). The rest is supplied.
 */
function stackHeatBalance(point: DesignPoint, plant: PlantInput, duties: PlantDuty[]) {
  const heatLossW = plant.heatLossFraction * point.stackPowerW;
  const stackHeatW = point.heat.asFedHeatW;
  let stackNet = stackHeatW - heatLossW;
  const loop = duties.find((d) => d.id.startsWith('loop-cooling'));
  if (loop && stackNet < 0) {
    const lostW = Math.min(-stackNet, heatLossW, -loop.dutyW);
    const lackingW = Math.min(-stackNet - lostW, -loop.dutyW - lostW);
    if (lostW > 0 || lackingW > 0) coolLess(loop, lostW, lackingW);
    stackNet += lostW + lackingW;
  }
  return { heatLossW, stackHeatW, stackHeatSuppliedW: Math.max(0, -stackNet), stackHeatRemovedW: Math.max(0, stackNet) };
}

/**
 * The loop cooler removing `lostW` + `lackingW` less, from the returned water's enthalpy: the
 * losses its water gave up on its way lower the temperature it reaches the cooler at; heat the
 * stack itself lacks (a loop fed more water than the stack heat warms by the allowed rise) can
 * only come back with the water, returned warmer than the inlet. Its name says which.
 */
function coolLess(loop: PlantDuty, lostW: number, lackingW: number): void {
  const back = { 'H2O(L)': loop.dutyW / (H({ 'H2O(L)': 1 }, loop.toK) - H({ 'H2O(L)': 1 }, loop.fromK)) };
  const kW = (w: number) => (w / 1000).toPrecision(4);
  const why: string[] = [];
  if (lostW > 0) {
    loop.fromK = temperatureAtEnthalpyK(back, H(back, loop.fromK) - lostW, loop.fromK);
    why.push(`the water reaches it cooler than the stack, having given ${kW(lostW)} kW to ambient on its way (the losses the stack's heat does not cover)`);
  }
  if (lackingW > 0) {
    loop.toK = temperatureAtEnthalpyK(back, H(back, loop.toK) + lackingW, loop.toK);
    why.push(`it returns the water warmer than the inlet, bringing the stack the ${kW(lackingW)} kW it lacks to warm more water than its heat can by the allowed rise`);
  }
  loop.dutyW += lostW + lackingW;
  loop.name = `${loop.name}, cooling ${kW(lostW + lackingW)} kW less: ${why.join('; ')}`;
}

/** The electricity per kilogram of hydrogen and the system efficiencies (the module comment). */
function specificEnergyOf(point: DesignPoint, plant: PlantInput, heatSuppliedW: number, compressorW: number): ElectrolysisPlantBalance['specificEnergy'] {
  const inputs = point.inputs;
  const acInW = point.netPowerW;
  const electricHeatW = plant.heatSupply === 'electric' ? heatSuppliedW : 0;
  const externalHeatW = plant.heatSupply === 'external' ? heatSuppliedW : 0;
  const e = point.electrolysis!;
  const hydrogenKgPerS = e.hydrogenMolPerS * getSpecies('H2').molarMassKgPerMol;
  const parasiticW = inputs.parasiticFraction * point.stackPowerW;
  const totalElectricW = acInW + electricHeatW + compressorW;
  const perKg = (w: number) => w / hydrogenKgPerS / 3.6e6;
  return {
    hydrogenKgPerS,
    stackDcW: point.stackPowerW,
    conversionLossW: acInW - point.stackPowerW - parasiticW,
    parasiticW,
    electricHeatW,
    compressorW,
    totalElectricW,
    stackKWhPerKg: perKg(point.stackPowerW),
    systemKWhPerKg: perKg(totalElectricW),
    systemEfficiencyLhv: e.productLhvW / (totalElectricW + externalHeatW),
    systemEfficiencyHhv: e.productHhvW / (totalElectricW + externalHeatW),
  };
}

/** The first law over the electrolysis plant (the module comment), scaled by the electricity. */
function electrolysisEnergyBalance(
  point: DesignPoint,
  plant: PlantInput,
  feeds: ElectrolysisFeeds,
  oxygen: { flows: Record<string, number>; temperatureK: number },
  h2: HydrogenDelivery,
  heat: { heatSuppliedW: number; coolersW: number; stackHeatRemovedW: number; heatLossW: number },
  totalElectricW: number,
): PowerPlantBalance['energy'] {
  const tStack = point.inputs.temperatureK;
  const compressorK = plant.hydrogenCompression?.inletTemperatureK ?? tStack;
  const { feedWaterMol, drain } = feeds;
  const terms: PowerPlantBalance['energy']['terms'] = [
    { name: 'feed water', valueW: feedWaterMol > 0 ? H({ 'H2O(L)': feedWaterMol }, plant.feedWaterTemperatureK) : 0, side: 'in' },
    ...feeds.gasFeeds.map((g) => ({ name: g.electrode === 'fuel' ? 'gas fed with the steam' : 'sweep gas', valueW: H(g.flows, g.temperatureK), side: 'in' as const })),
    { name: 'stack DC power', valueW: point.stackPowerW, side: 'in' },
    { name: plant.heatSupply === 'electric' ? 'heat supplied electrically' : 'heat supplied from outside', valueW: heat.heatSuppliedW, side: 'in' },
    { name: 'compressor work', valueW: h2.compression?.powerW ?? 0, side: 'in' },
    { name: h2.compression ? 'hydrogen delivered' : 'hydrogen product', valueW: H(h2.delivered.flows, h2.delivered.temperatureK), side: 'out' },
    { name: 'oxygen product', valueW: H(oxygen.flows, oxygen.temperatureK), side: 'out' },
    { name: 'condensate', valueW: h2.condensateMolPerS > 0 ? H({ 'H2O(L)': h2.condensateMolPerS }, compressorK) : 0, side: 'out' },
    { name: 'water removed by the dryer', valueW: h2.driedMolPerS > 0 ? H({ H2O: h2.driedMolPerS }, compressorK) : 0, side: 'out' },
    { name: 'liquid water drained', valueW: drain > 0 ? H({ 'H2O(L)': drain }, tStack) : 0, side: 'out' },
    { name: 'heat removed by the coolers', valueW: heat.coolersW, side: 'out' },
    { name: "heat removed by the stack's cooling", valueW: heat.stackHeatRemovedW, side: 'out' },
    { name: 'heat lost to ambient', valueW: heat.heatLossW, side: 'out' },
  ];
  return firstLaw(terms, totalElectricW);
}

/** The balance of an electrolysis plant (the module comment's blocks, feeds to products). */
export function electrolysisBalance(point: DesignPoint, plant: PlantInput, findings: Finding[]): { balance: ElectrolysisPlantBalance; streams: PlantStream[] } {
  const sheet = new PlantSheet();
  const feeds = electrolysisFeeds(point, plant, sheet);
  const { product, oxygen } = electrolysisOutlets(point, feeds, sheet);
  const recuperator = feedRecuperator(point, plant, feeds, { product, oxygen }, sheet);
  const productsK = recuperator?.hotOutletK ?? point.inputs.temperatureK;
  const stack = stackHeatBalance(point, plant, sheet.duties);
  const h2 = hydrogenDelivery(point, plant, product, productsK, sheet, findings);
  const duties = sheet.duties;
  const feedHeatW = duties.reduce((a, d) => a + Math.max(0, d.dutyW), 0);
  const coolersW = duties.reduce((a, d) => a + Math.max(0, -d.dutyW), 0);
  const heatSuppliedW = feedHeatW + stack.stackHeatSuppliedW;
  const specificEnergy = specificEnergyOf(point, plant, heatSuppliedW, h2.compression?.powerW ?? 0);
  const energy = electrolysisEnergyBalance(point, plant, feeds, { flows: oxygen, temperatureK: productsK }, h2, { heatSuppliedW, coolersW, stackHeatRemovedW: stack.stackHeatRemovedW, heatLossW: stack.heatLossW }, specificEnergy.totalElectricW);
  return {
    streams: sheet.streams,
    balance: {
      feedWaterMolPerS: feeds.feedWaterMol,
      steam: feeds.steam,
      waterLoop: feeds.liquidIn > 0 ? { makeUpMolPerS: feeds.makeUp, returnMolPerS: feeds.returned, drainMolPerS: feeds.drain } : null,
      duties,
      feedHeatW,
      coolersW,
      stackHeatW: stack.stackHeatW,
      heatLossW: stack.heatLossW,
      stackHeatSuppliedW: stack.stackHeatSuppliedW,
      stackHeatRemovedW: stack.stackHeatRemovedW,
      heatSupply: plant.heatSupply,
      heatSuppliedW,
      recuperator,
      productCooling: h2.productCooling,
      compression: h2.compression,
      specificEnergy,
      energy,
    },
  };
}
