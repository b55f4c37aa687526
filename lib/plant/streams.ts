/**
 * Process streams of the stack: species flows (mol/s) at a temperature and pressure, with the
 * quantities a design review reads off a stream table: mass flow, normal volume flow, mole
 * fractions and enthalpy flow.
 *
 *   ṁ = Σ ṅ_i M_i;   V̇_n = ṅ_gas · R T_n / p_n with T_n = 273.15 K, p_n = 101 325 Pa (0 °C, 1 atm)
 *   Ḣ = Σ ṅ_i h_i(T)  (h with heat of formation, NASA convention; H2O(L) for liquid water)
 */
import { NORMAL_MOLAR_VOLUME_M3_PER_MOL } from '../thermo/constants.ts';
import { mixtureEnthalpyJ, mixtureMassKg } from '../thermo/mixture.ts';
import { getSpecies } from '../thermo/species-data.ts';

export interface Stream {
  id: string;
  name: string;
  temperatureK: number;
  pressureBar: number;
  /** Species label → mol/s; liquid water, where present, as "H2O(L)". */
  flows: Record<string, number>;
}

export function totalFlow(flows: Readonly<Record<string, number>>): number {
  let s = 0;
  for (const v of Object.values(flows)) s += v;
  return s;
}

/** Gas flows only (liquid water excluded), mol/s. */
export function gasFlow(flows: Readonly<Record<string, number>>): number {
  let s = 0;
  for (const [k, v] of Object.entries(flows)) if (getSpecies(k).phase === 'gas') s += v;
  return s;
}

/** Mass flow Σ ṅ_i M_i, kg/s (the mixture's mass on the flows' scale). */
export function massFlowKgPerS(flows: Readonly<Record<string, number>>): number {
  return mixtureMassKg(flows);
}

/** Normal volume flow of the gas, m³(n)/s at 0 °C and 1 atm. */
export function normalVolumeM3PerS(flows: Readonly<Record<string, number>>): number {
  return gasFlow(flows) * NORMAL_MOLAR_VOLUME_M3_PER_MOL;
}

/** Enthalpy flow Σ ṅ_i h_i(T), W. */
export function enthalpyFlowW(flows: Readonly<Record<string, number>>, temperatureK: number): number {
  return mixtureEnthalpyJ(flows, temperatureK);
}

/** Mole fractions of the gas phase. */
export function gasMoleFractions(flows: Readonly<Record<string, number>>): Record<string, number> {
  const total = gasFlow(flows);
  const out: Record<string, number> = {};
  for (const [k, v] of Object.entries(flows)) if (getSpecies(k).phase === 'gas' && v > 0) out[k] = v / total;
  return out;
}

export function scaled(flows: Readonly<Record<string, number>>, factor: number): Record<string, number> {
  const out: Record<string, number> = {};
  for (const [k, v] of Object.entries(flows)) out[k] = v * factor;
  return out;
}
