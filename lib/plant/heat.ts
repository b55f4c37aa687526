/**
 * Heat balance of the stack, with the enthalpies of the species data (heats of formation
 * included, so internal reforming and shift are in it):
 *
 *   Q = Σ_in ṅ h(T_in) − Σ_out ṅ h(T_out) + W_in,   W_in = −P (power) or +P (electrolysis)
 *
 * Q > 0: heat the stack releases and must reject; Q < 0: heat it needs. Two boundaries:
 * "isothermal" with every stream at the stack temperature (the heat the stack itself produces,
 * the number a coolant loop is sized on) and "as fed" with the inlets at their own temperatures
 * (what is left after the feeds are heated in the stack: zero where an air-cooled stack holds
 * its temperature, stack-heat-balance.ts). The effective thermoneutral voltage of the
 * actual gases is V_tn = (H_in − H_out)(T)/I_ion in power mode, (H_out − H_in)(T)/I_ion in
 * electrolysis, per unit of the ionic current I_ion that moves the species, so Q_iso = I_ion V_tn − I V
 * or I V − I_ion V_tn (I the current at the terminals; the two are equal but for a mixed
 * conductor's leakage); for pure hydrogen V_tn = −ΔH(T)/2F (methods note of this project;
 * Larminie & Dicks, §2.4).
 * A coolant loop (the water loop of a liquid-fed electrolyser) for an allowed temperature rise ΔT,
 * leaving at the stack temperature:
 *   ṅ_c = Q_iso / (h_c(T) − h_c(T − ΔT))   per mol of the coolant's composition.
 * An air-cooled stack's air enters at its stated inlet temperature and shares the heat with the
 * fuel feed: its balance is stack-heat-balance.ts.
 */
import { enthalpyFlowW, type Stream } from './streams.ts';
import type { Mode } from '../electrochem/technologies.ts';

export interface HeatBalance {
  /** Σ ṅ h of the inlets at the stack temperature and at their own temperatures, and of the outlets, W. */
  inletEnthalpyIsothermalW: number;
  inletEnthalpyAsFedW: number;
  outletEnthalpyW: number;
  /** Electric work into the stack: −P in power mode, +P in electrolysis, W. */
  workInW: number;
  /** Heat released by the stack, all streams at the stack temperature, W. */
  isothermalHeatW: number;
  /** Heat released with the inlets at their own temperatures, W. */
  asFedHeatW: number;
  /** Effective thermoneutral voltage of the actual gases, per unit of ionic charge, V. */
  thermoneutralVoltageV: number;
}

export function heatBalance(mode: Mode, inlets: Stream[], outlets: Stream[], stackTemperatureK: number, powerW: number, ionicCurrentA: number): HeatBalance {
  const inletIso = inlets.reduce((s, st) => s + enthalpyFlowW(st.flows, stackTemperatureK), 0);
  const inletFed = inlets.reduce((s, st) => s + enthalpyFlowW(st.flows, st.temperatureK), 0);
  const outlet = outlets.reduce((s, st) => s + enthalpyFlowW(st.flows, st.temperatureK), 0);
  const workInW = mode === 'power' ? -powerW : powerW;
  const isothermalHeatW = inletIso - outlet + workInW;
  const asFedHeatW = inletFed - outlet + workInW;
  const released = mode === 'power' ? inletIso - outlet : outlet - inletIso;
  return {
    inletEnthalpyIsothermalW: inletIso,
    inletEnthalpyAsFedW: inletFed,
    outletEnthalpyW: outlet,
    workInW,
    isothermalHeatW,
    asFedHeatW,
    thermoneutralVoltageV: released / ionicCurrentA,
  };
}

/** A coolant (liquid water {"H2O(L)": 1}) of the given composition needed to take up `heatW` warming by ΔT to the stack temperature, mol/s. */
export function coolantMolPerS(heatW: number, air: Readonly<Record<string, number>>, stackTemperatureK: number, riseK: number): number {
  const perMol = enthalpyFlowW(air, stackTemperatureK) - enthalpyFlowW(air, stackTemperatureK - riseK);
  return heatW > 0 ? heatW / perMol : 0;
}
