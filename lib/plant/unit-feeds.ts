/**
 * The feeds of both electrodes on a unit scale (1 mol/s of the water-electrode feed in
 * electrolysis, 1 mol/s of fuel feed in power mode), from Faraday's law:
 *
 *   power:        O2 consumed = U Q / 4F with Q = F Σ ṅ_i z_i;  O2 supplied = consumed / U_air
 *                 (or × air ratio);  air = O2 supplied / x_O2 of the air
 *   electrolysis: Q = 2F (ṅ_H2O + ṅ_CO2) of the water-electrode feed; the other electrode's sweep
 *                 gas flows at the sweep ratio × the gas it produces (O2 at the air electrode of an
 *                 oxide-ion cell, H2 at the fuel electrode of a proton conductor); none without one
 *
 * (e.g. Larminie & Dicks, Fuel Cell Systems Explained, 2nd ed., App. 2.) The fuel path and the
 * stack are linear in scale, so the design point scales these by the current.
 *
 * Pre-reformer: at equilibrium at its stated temperature, or adiabatic (lib/equilibrium/
 * adiabatic.ts: the outlet at equilibrium at the temperature where it carries the enthalpy of
 * the feed entering at the stated inlet temperature).
 *
 * Anode off-gas recycle (cells that reform at the fuel electrode): a share r of the off-gas
 * returns to the fuel inlet, ahead of the pre-reformer. The off-gas leaves at equilibrium at the
 * stack temperature with the elements of the stack inlet plus what the electrolyte carried in,
 * which is linear in the elements (b) of the inlet; with the charge basis z(b) = 4 b_C + b_H − 2 b_O
 * (lib/electrochem/charge.ts), the exchange d per electron (electrolyte-exchange.ts) and the
 * per-pass utilization U:
 *   b_out = b_S + U z(b_S) d,   b_S = b_F + b_R,   b_R = r b_out
 *   ⇒ [(1 − r) I − r U d zᵀ] b_R = r (b_F + U z(b_F) d)
 * solved exactly by the Sherman–Morrison formula (Press et al., Numerical Recipes, 3rd ed., §2.7.1):
 *   b_R = r/(1 − r) · [c + r U d (zᵀc) / ((1 − r) − r U zᵀd)],   c = b_F + U z(b_F) d
 * The recycled gas is the off-gas equilibrium of b_out at the stack temperature and fuel pressure,
 * scaled by r. The fuel utilization of the basis is then per pass; the design point checks the
 * off-gas of its own fuel path against this recycle to the basis's tolerance.
 */
import { FARADAY_C_PER_MOL as F } from '../thermo/constants.ts';
import { getSpecies } from '../thermo/species-data.ts';
import { electronsOfElements, electronsOfStream } from '../electrochem/charge.ts';
import { equilibrate, equilibrateElements } from '../equilibrium/equilibrate.ts';
import { adiabaticEquilibrium } from '../equilibrium/adiabatic.ts';
import { exchangeFor } from '../equilibrium/electrolyte-exchange.ts';
import type { DesignInputs } from './design-inputs.ts';
import { CalculationError } from '../core/errors.ts';
import { cathodeLoop, type CathodeLoop } from './cathode-loop.ts';

export interface UnitFeeds {
  /** Fuel-electrode feed as it enters the stack (after any pre-reformer), mol/s. */
  fuelStackInlet: Record<string, number> | null;
  /** Fresh fuel-electrode feed (fuel and steam), before the recycle joins it and before the pre-reformer, mol/s. */
  fuelRaw: Record<string, number> | null;
  /** The recycled off-gas joining the fresh feed ahead of the pre-reformer, mol/s; null without a recycle. */
  recycle: Record<string, number> | null;
  /** The pre-reformer's feed (fresh feed and recycle) and its outlet temperature, K; null without a pre-reformer. */
  preReformer: { feed: Record<string, number>; inletTemperatureK: number; outletTemperatureK: number; energyBalanceError: number } | null;
  /** Air-electrode feed, mol/s. */
  air: Record<string, number> | null;
  /** The cathode-gas loop that makes the air-electrode feed (cathode-loop.ts) on this scale; null where the basis gives the feed. */
  cathodeLoop: CathodeLoop | null;
  /** Charge for U = 1 on this scale, A. */
  chargeA: number;
  /** Where the unit feed is: which electrode's feed is 1 mol/s. */
  basis: 'fuel' | 'air';
}

function times(composition: Readonly<Record<string, number>>, flow: number): Record<string, number> {
  return Object.fromEntries(Object.entries(composition).map(([k, v]) => [k, v * flow]));
}

/** The pre-reformer's outlet (the feed itself without one) and its temperatures. */
function preReform(inputs: DesignInputs, feed: Record<string, number>): { outlet: Record<string, number>; preReformer: UnitFeeds['preReformer'] } {
  const kind = inputs.preReforming;
  if (kind.kind === 'none') return { outlet: feed, preReformer: null };
  if (kind.kind === 'equilibrium') {
    const e = equilibrate({ temperatureK: kind.temperatureK, pressureBar: inputs.fuelPressureBar, feed });
    return { outlet: e.amounts, preReformer: { feed, inletTemperatureK: kind.temperatureK, outletTemperatureK: kind.temperatureK, energyBalanceError: 0 } };
  }
  const e = adiabaticEquilibrium({ reactants: [{ amounts: feed, temperatureK: kind.inletTemperatureK }], pressureBar: inputs.fuelPressureBar });
  return { outlet: e.amounts, preReformer: { feed, inletTemperatureK: kind.inletTemperatureK, outletTemperatureK: e.temperatureK, energyBalanceError: e.energyBalanceError } };
}

function elementsOf(stream: Readonly<Record<string, number>>): Record<string, number> {
  const out: Record<string, number> = {};
  for (const [label, amount] of Object.entries(stream)) {
    if (amount === 0) continue;
    for (const [element, count] of Object.entries(getSpecies(label).formula)) out[element] = (out[element] ?? 0) + amount * count;
  }
  return out;
}

function combined(a: Readonly<Record<string, number>>, b: Readonly<Record<string, number>>, times = 1): Record<string, number> {
  const out = { ...a };
  for (const [k, v] of Object.entries(b)) out[k] = (out[k] ?? 0) + v * times;
  return out;
}

/** The recycled off-gas for a fresh feed, by the element balance of the loop (module comment), mol/s. */
function recycledOffGas(inputs: DesignInputs, fresh: Readonly<Record<string, number>>): Record<string, number> {
  const r = inputs.anodeRecycle!.ratio;
  const U = inputs.utilization;
  const d = exchangeFor(inputs.technology.ion).fuelElements;
  const bF = elementsOf(fresh);
  const c = combined(bF, d, U * electronsOfElements(bF));
  const bR = combined(c, d, (r * U * electronsOfElements(c)) / (1 - r - r * U * electronsOfElements(d)));
  for (const e of Object.keys(bR)) bR[e]! *= r / (1 - r);
  const inlet = combined(bF, bR);
  const outlet = combined(inlet, d, U * electronsOfElements(inlet));
  const offGas = equilibrateElements({ temperatureK: inputs.temperatureK, pressureBar: inputs.fuelPressureBar, elements: outlet });
  return Object.fromEntries(Object.entries(offGas.amounts).map(([k, v]) => [k, v * r]));
}

/**
 * A carbonate cell's cathode-gas loop on this scale (cathode-loop.ts): the burner takes the
 * fuel-electrode off-gas less any anode recycle, whose elements are those of the stack inlet plus
 * what the electrolyte carried in, b_out = b_in + U z(b_in) d (module comment); the cells take the
 * air-electrode exchange per electron times U·Q/F. The off-gas depends on the fuel side alone, the
 * current being fixed by the fuel utilization: no iteration with the cathode gas.
 */
function unitCathodeLoop(inputs: DesignInputs, stackInlet: Readonly<Record<string, number>>, chargeA: number, o2Consumed: number, o2Supplied: number): CathodeLoop {
  const exchange = exchangeFor(inputs.technology.ion);
  const bIn = elementsOf(stackInlet);
  const bOut = combined(bIn, exchange.fuelElements, inputs.utilization * electronsOfElements(bIn));
  const toBurner = 1 - (inputs.anodeRecycle?.ratio ?? 0);
  const offGasElements = Object.fromEntries(Object.entries(bOut).map(([e, v]) => [e, v * toBurner]));
  const electrons = (inputs.utilization * chargeA) / F;
  const take = Object.fromEntries(Object.entries(exchange.airSpecies).map(([s, v]) => [s, -v * electrons]));
  return cathodeLoop({ offGasElements, burnerAir: inputs.airFeed!, take, airUtilization: o2Consumed / o2Supplied, inletOxygenFraction: inputs.cathodeLoop!.inletOxygenFraction });
}

const WATER = (feed: Readonly<Record<string, number>>) => (feed.H2O ?? 0) + (feed['H2O(L)'] ?? 0);

export function unitFeeds(inputs: DesignInputs): UnitFeeds {
  const { technology: tech, mode, utilization: u } = inputs;
  if (mode === 'power') {
    if (!inputs.fuelFeed) throw new CalculationError('power mode needs a fuel-electrode feed', 'fuel-electrode-feed');
    if (!inputs.airFeed) throw new CalculationError('power mode needs an air-electrode feed', 'air-electrode-feed');
    const raw = { ...inputs.fuelFeed };
    const recycle = inputs.anodeRecycle ? recycledOffGas(inputs, raw) : null;
    const mixed = recycle ? combined(raw, recycle) : raw;
    const chargeA = F * electronsOfStream(mixed);
    const o2Consumed = (u * chargeA) / (4 * F);
    const o2Supplied = inputs.air.kind === 'ratio' ? o2Consumed * inputs.air.value : inputs.air.kind === 'utilization' ? o2Consumed / inputs.air.value : o2Consumed;
    const xO2 = inputs.airFeed.O2 ?? 0;
    if (!(xO2 > 0)) throw new CalculationError('the air-electrode feed contains no O2', 'air-electrode-feed');
    const reformed = preReform(inputs, mixed);
    const loop = inputs.cathodeLoop ? unitCathodeLoop(inputs, reformed.outlet, chargeA, o2Consumed, o2Supplied) : null;
    const air = loop ? loop.inlet : times(inputs.airFeed, o2Supplied / xO2);
    return { fuelStackInlet: reformed.outlet, fuelRaw: raw, recycle, preReformer: reformed.preReformer, air, cathodeLoop: loop, chargeA, basis: 'fuel' };
  }
  const waterSide = tech.waterElectrode;
  // Alkaline cells hold their water in the electrolyte: a liquid-water feed stands for the make-up.
  const liquidDefault: Record<string, number> | null = tech.waterPhase === 'liquid' ? { 'H2O(L)': 1 } : null;
  const waterFeed: Record<string, number> | null = (waterSide === 'fuel' ? inputs.fuelFeed : inputs.airFeed) ?? liquidDefault;
  if (!waterFeed) throw new CalculationError(`electrolysis in a ${tech.name} cell needs a feed with water at the ${waterSide} electrode`, `${waterSide}-electrode-feed`);
  const reactant = WATER(waterFeed) + (tech.ion === 'oxide' ? (waterFeed.CO2 ?? 0) : 0);
  if (!(reactant > 0)) throw new CalculationError(`the ${waterSide}-electrode feed contains no water to split`, `${waterSide}-electrode-feed`);
  const chargeA = 2 * F * reactant;
  const sweepSide = waterSide === 'fuel' ? inputs.airFeed : inputs.fuelFeed;
  // Sweep gas at the other electrode: ratio × what that electrode produces (O2: I/4F, H2: I/2F).
  const produced = waterSide === 'fuel' ? (u * chargeA) / (4 * F) : (u * chargeA) / (2 * F);
  const sweep = sweepSide && inputs.air.kind === 'sweep-ratio' ? times(sweepSide, inputs.air.value * produced) : null;
  return waterSide === 'fuel'
    ? { fuelStackInlet: { ...waterFeed }, fuelRaw: { ...waterFeed }, recycle: null, preReformer: null, air: sweep, cathodeLoop: null, chargeA, basis: 'fuel' }
    : { fuelStackInlet: sweep, fuelRaw: sweep, recycle: null, preReformer: null, air: { ...waterFeed }, cathodeLoop: null, chargeA, basis: 'air' };
}
