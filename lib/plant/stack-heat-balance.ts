/**
 * The heat balance of an air-cooled stack (the high-temperature cells: solid oxide, proton
 * ceramic, molten carbonate, whose air-electrode gas carries their heat) with its feeds at their
 * stated inlet temperatures. With every stream at the stack temperature T the stack releases
 * Q_iso (heat.ts); of it, the feeds take what brings them to T:
 *
 *   ΔH_fuel = H_fuel,in(T) − H_fuel,in(T_f)         the fuel-electrode feed from its inlet T_f
 *   ΔH_air  = ṅ_air [h_air(T) − h_air(T_a)]          the air-electrode feed from its inlet T_a
 *   Q_fed   = Q_iso − ΔH_fuel − ΔH_air                (heat.ts's "as fed" heat, the same number)
 *
 * An isothermal stack at T (every outlet at T) holds only where Q_fed = 0: the heat it releases
 * is exactly what brings its feeds to its temperature. Otherwise its air-electrode exhaust takes
 * the rest, leaving at T_exh with H_exh(T_exh) = H_exh(T) + Q_fed: hotter than the stack where the
 * air cannot carry the heat (Q_fed > 0), colder where the stack cannot heat its feeds (Q_fed < 0).
 * What closes the balance:
 *
 *   ṅ_air,close = (Q_iso − ΔH_fuel) / (h_air(T) − h_air(T_a))     per mol of the air feed's composition,
 *                 where it is positive (else no air flow does: the air enters on the wrong side of T)
 *   T_a,close:    H_air,fed(T_a,close) = H_air,fed(T) − (Q_iso − ΔH_fuel)   with the air fed
 *
 * The allowed air temperature rise bounds the rise this isothermal model gives the air, T − T_a.
 */
import { mixtureEnthalpyJ } from '../thermo/mixture.ts';
import { temperatureAtEnthalpyInRangeK, temperatureAtEnthalpyK } from '../thermo/mixture-temperature.ts';
import { ZERO_CELSIUS_K } from '../core/units.ts';
import type { AirSupply } from '../basis/types.ts';
import type { HeatBalance } from './heat.ts';
import { finding, type Finding } from './findings.ts';
import { totalFlow, type Stream } from './streams.ts';

/**
 * How far the air-electrode exhaust may leave from the stack temperature before the basis is
 * said not to hold its isothermal stack, K: a screening threshold of this project (common
 * practice, no source), about the control band of a stack's temperature; the demos' bases close
 * well within it.
 */
export const EXHAUST_TOLERANCE_K = 5;

export interface StackHeatBalance {
  /** Heat that brings the fuel-electrode feed from its inlet temperature to the stack's, ΔH_fuel, W. */
  fuelHeatingW: number;
  /** Heat that brings the air-electrode feed from its inlet temperature to the stack's, ΔH_air, W. */
  airHeatingW: number;
  /** Q_fed = Q_iso − ΔH_fuel − ΔH_air, W (heat.ts asFedHeatW). */
  surplusW: number;
  /** Temperature at which the air-electrode exhaust leaves carrying Q_fed, K. */
  exhaustTemperatureK: number;
  /** The air flow of the feed's composition that closes the balance at the stated inlet temperature, mol/s; null where none does. */
  closingAirMolPerS: number | null;
  /** The air-electrode inlet temperature that closes the balance with the air fed, K; null where none in the species data's range does. */
  closingAirInletK: number | null;
}

/** What the balance is evaluated from: the heat balance of heat.ts, the two inlets and the air-electrode outlet (gas) on the stack scale, the stack temperature. */
export interface StackBalanceRequest {
  heat: HeatBalance;
  fuelInlet: Stream | null;
  airInlet: Stream;
  airOutletGas: Readonly<Record<string, number>>;
  stackTemperatureK: number;
}

/** The balance of the module comment. */
export function stackHeatBalance({ heat, fuelInlet, airInlet, airOutletGas, stackTemperatureK: t }: StackBalanceRequest): StackHeatBalance {
  const air = airInlet.flows;
  const airHeatingW = mixtureEnthalpyJ(air, t) - mixtureEnthalpyJ(air, airInlet.temperatureK);
  // ΔH_fuel + ΔH_air is H_in(T) − H_in(T_in) of heat.ts: the fuel's share is the rest, so Q_fed is heat.ts's own number.
  const fuelHeatingW = fuelInlet ? heat.inletEnthalpyIsothermalW - heat.inletEnthalpyAsFedW - airHeatingW : 0;
  const surplusW = heat.asFedHeatW;
  const exhaustTemperatureK = temperatureAtEnthalpyK(airOutletGas, mixtureEnthalpyJ(airOutletGas, t) + surplusW, t);
  const toCarry = heat.isothermalHeatW - fuelHeatingW;
  const airMol = totalFlow(air);
  const perMol = airHeatingW / airMol;
  // Positive where the air warms to T carrying heat off (T_a < T, Q_iso > ΔH_fuel), or cools to it bringing heat in (T_a > T, Q_iso < ΔH_fuel).
  const closing = toCarry / perMol;
  const closingAirMolPerS = Number.isFinite(closing) && closing > 0 ? closing : null;
  const closingAirInletK = temperatureAtEnthalpyInRangeK(air, mixtureEnthalpyJ(air, t) - toCarry, airInlet.temperatureK);
  return { fuelHeatingW, airHeatingW, surplusW, exhaustTemperatureK, closingAirMolPerS, closingAirInletK };
}

/** The basis fields a finding of the balance names: the air flow's field, the inlet temperatures. */
export interface StackBalanceFields {
  /** operating-point.air-utilization or operating-point.air-ratio. */
  airField: string;
  /** The air utilization or ratio as stated (power mode has one of the two). */
  air: AirSupply;
  allowedRiseK: number;
  stackTemperatureK: number;
}

const celsius = (k: number) => `${(k - ZERO_CELSIUS_K).toFixed(1)} °C`;
const kW = (w: number) => `${(w / 1000).toPrecision(4)} kW`;
/** A temperature difference as written in a basis, without the digits of a unit conversion. */
const kelvins = (k: number) => `${Number(k.toPrecision(6))}`;

/** " (a rise of N K, above the allowed M K)" where an inlet at `inletK` would let the air rise more than allowed, else "". */
function riseBeyond(inletK: number, fields: StackBalanceFields): string {
  const rise = fields.stackTemperatureK - inletK;
  return rise > fields.allowedRiseK * (1 + 1e-9) ? ` (a rise of ${rise.toFixed(1)} K, above the allowed ${kelvins(fields.allowedRiseK)} K)` : '';
}

/** What closes the balance, in the basis's own terms: the air flow (as its utilization or ratio) and the inlet temperature. */
function closingText(b: StackHeatBalance, airFedMol: number, fields: StackBalanceFields): string {
  const inlet = b.closingAirInletK === null ? null : `an air-electrode inlet temperature of ${celsius(b.closingAirInletK)} with the air fed${riseBeyond(b.closingAirInletK, fields)}`;
  if (b.closingAirMolPerS === null || !('value' in fields.air)) return `no air flow from the stated inlet closes the balance; ${inlet ? `${inlet} does` : 'nor does any inlet temperature with the air fed'}`;
  // Utilization ∝ 1/ṅ_air, ratio ∝ ṅ_air (the O2 consumed is fixed by the current).
  const scale = b.closingAirMolPerS / airFedMol;
  const stated = fields.air.kind === 'utilization' ? `air utilization ${(fields.air.value / scale).toFixed(3)}` : `air ratio ${(fields.air.value * scale).toFixed(3)}`;
  return `${b.closingAirMolPerS.toPrecision(4)} mol/s of air (${stated}) closes the balance${inlet ? `, or ${inlet}` : ''}`;
}

/**
 * The findings of the balance: the exhaust more than EXHAUST_TOLERANCE_K above the stack
 * (cooling-air-short: the air cannot carry the heat) or below it (stack-heat-short: the stack
 * cannot heat its feeds), and an inlet colder than the allowed rise lets the air be
 * (air-rise-above-allowed).
 */
export function stackBalanceFindings(b: StackHeatBalance, airInlet: Stream, fuelInlet: Stream | null, t: number, fields: StackBalanceFields): Finding[] {
  const out: Finding[] = [];
  const off = b.exhaustTemperatureK - t;
  const related = ['conditions.air-inlet-temperature', 'conditions.fuel-inlet-temperature'];
  const feeds = [`the air fed (${totalFlow(airInlet.flows).toPrecision(4)} mol/s) from ${celsius(airInlet.temperatureK)} (${kW(b.airHeatingW)})`];
  if (fuelInlet && fuelInlet.temperatureK !== t) feeds.unshift(`the fuel from ${celsius(fuelInlet.temperatureK)} (${kW(b.fuelHeatingW)})`);
  const balance = `its heat at ${celsius(t)} (${kW(b.surplusW + b.fuelHeatingW + b.airHeatingW)}), less what brings ${feeds.join(' and ')} to it, leaves ${kW(b.surplusW)}`;
  const exhaust = `the air-electrode exhaust leaves at ${celsius(b.exhaustTemperatureK)}, ${Math.abs(off).toFixed(1)} K ${off > 0 ? 'above' : 'below'} the stack (tolerance ${EXHAUST_TOLERANCE_K} K)`;
  const close = closingText(b, totalFlow(airInlet.flows), fields);
  if (off > EXHAUST_TOLERANCE_K) {
    out.push(finding('cooling-air-short', 'warning', fields.airField, `the air cannot carry the stack heat with the feeds at their inlet temperatures: ${balance}: ${exhaust}; ${close}, or another heat sink`, related));
  } else if (off < -EXHAUST_TOLERANCE_K) {
    out.push(finding('stack-heat-short', 'warning', fields.airField, `the stack cannot heat its feeds to its temperature: ${balance}: ${exhaust}; ${close}, or heat supplied`, related));
  }
  const rise = t - airInlet.temperatureK;
  // A rise equal to the allowed one, written as two temperatures, may differ from it in the last bit.
  if (rise > fields.allowedRiseK * (1 + 1e-9)) {
    out.push(
      finding(
        'air-rise-above-allowed',
        'warning',
        'conditions.air-inlet-temperature',
        `the air enters at ${celsius(airInlet.temperatureK)} and leaves the isothermal stack at ${celsius(t)}: a rise of ${rise.toFixed(1)} K, above the allowed ${kelvins(fields.allowedRiseK)} K`,
        ['conditions.allowed-air-temperature-rise'],
      ),
    );
  }
  return out;
}
