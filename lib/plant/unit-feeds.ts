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
 */
import { FARADAY_C_PER_MOL as F } from '../thermo/constants.ts';
import { electronsOfStream } from '../electrochem/charge.ts';
import { equilibrate } from '../equilibrium/equilibrate.ts';
import type { DesignInputs } from './design-inputs.ts';
import { CalculationError } from '../core/errors.ts';

export interface UnitFeeds {
  /** Fuel-electrode feed as it enters the stack (after any pre-reformer), mol/s. */
  fuelStackInlet: Record<string, number> | null;
  /** Fuel-electrode feed before the pre-reformer (the same when there is none), mol/s. */
  fuelRaw: Record<string, number> | null;
  /** Air-electrode feed, mol/s. */
  air: Record<string, number> | null;
  /** Charge for U = 1 on this scale, A. */
  chargeA: number;
  /** Where the unit feed is: which electrode's feed is 1 mol/s. */
  basis: 'fuel' | 'air';
}

function times(composition: Readonly<Record<string, number>>, flow: number): Record<string, number> {
  return Object.fromEntries(Object.entries(composition).map(([k, v]) => [k, v * flow]));
}

function preReform(inputs: DesignInputs, feed: Record<string, number>): Record<string, number> {
  if (inputs.preReforming.kind === 'none') return feed;
  const e = equilibrate({ temperatureK: inputs.preReforming.temperatureK, pressureBar: inputs.fuelPressureBar, feed });
  return e.amounts;
}

const WATER = (feed: Readonly<Record<string, number>>) => (feed.H2O ?? 0) + (feed['H2O(L)'] ?? 0);

export function unitFeeds(inputs: DesignInputs): UnitFeeds {
  const { technology: tech, mode, utilization: u } = inputs;
  if (mode === 'power') {
    if (!inputs.fuelFeed) throw new CalculationError('power mode needs a fuel-electrode feed', 'fuel-electrode-feed');
    if (!inputs.airFeed) throw new CalculationError('power mode needs an air-electrode feed', 'air-electrode-feed');
    const raw = { ...inputs.fuelFeed };
    const chargeA = F * electronsOfStream(raw);
    const o2Consumed = (u * chargeA) / (4 * F);
    const o2Supplied = inputs.air.kind === 'ratio' ? o2Consumed * inputs.air.value : inputs.air.kind === 'utilization' ? o2Consumed / inputs.air.value : o2Consumed;
    const xO2 = inputs.airFeed.O2 ?? 0;
    if (!(xO2 > 0)) throw new CalculationError('the air-electrode feed contains no O2', 'air-electrode-feed');
    return { fuelStackInlet: preReform(inputs, raw), fuelRaw: raw, air: times(inputs.airFeed, o2Supplied / xO2), chargeA, basis: 'fuel' };
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
    ? { fuelStackInlet: { ...waterFeed }, fuelRaw: { ...waterFeed }, air: sweep, chargeA, basis: 'fuel' }
    : { fuelStackInlet: sweep, fuelRaw: sweep, air: { ...waterFeed }, chargeA, basis: 'air' };
}
