/**
 * Humid air: dry air plus water vapour. The water mole fraction is the vapour partial pressure
 * over the total pressure (ideal gas, Dalton's law):
 *   at a dew point T_d:                 x_H2O = p_sat(T_d) / p
 *   at relative humidity φ at T:        x_H2O = φ · p_sat(T) / p
 * with p_sat from the IAPWS-IF97 saturation line (region 4, eq. 30; lib/thermo/water-saturation.ts)
 * and p the pressure at which the humidity is stated (read-air-stream.ts says which): the mole
 * fraction, unlike the relative humidity, is kept when the air is compressed to the electrode.
 * The dry-air fractions are scaled by (1 − x_H2O). Each form keeps what it was converted with
 * (types.ts AirHumidity), which the results carry and the report's worked line substitutes.
 */
import { PA_PER_BAR } from '../thermo/constants.ts';
import { waterSaturationPressurePa } from '../thermo/water-saturation.ts';
import type { AirHumidity } from './types.ts';

/** A dew point T_d: the air saturated there (φ = 1), x_H2O = p_sat(T_d) / p at the air-electrode pressure p. */
export function humidityAtDewPoint(dewPointK: number, airElectrodeBar: number): AirHumidity {
  const saturationPressurePa = waterSaturationPressurePa(dewPointK);
  return {
    form: 'dew-point',
    temperatureK: dewPointK,
    relativeHumidity: null,
    saturationPressurePa,
    pressurePa: airElectrodeBar * PA_PER_BAR,
    pressureOf: 'air-electrode',
    waterFraction: saturationPressurePa / PA_PER_BAR / airElectrodeBar,
  };
}

/** A relative humidity φ at T of the ambient air: x_H2O = φ · p_sat(T) / p at the ambient pressure p. */
export function humidityAtRelativeHumidity(relativeHumidity: number, atK: number, ambientBar: number): AirHumidity {
  const saturationPressurePa = waterSaturationPressurePa(atK);
  return {
    form: 'relative-humidity',
    temperatureK: atK,
    relativeHumidity,
    saturationPressurePa,
    pressurePa: ambientBar * PA_PER_BAR,
    pressureOf: 'ambient',
    waterFraction: (relativeHumidity * saturationPressurePa) / PA_PER_BAR / ambientBar,
  };
}

/** Dry-air fractions scaled by (1 − x) with water vapour x added. */
export function humidAir(dryAir: Readonly<Record<string, number>>, waterFraction: number): Record<string, number> {
  const out: Record<string, number> = {};
  for (const [species, x] of Object.entries(dryAir)) out[species] = x * (1 - waterFraction);
  out.H2O = (out.H2O ?? 0) + waterFraction;
  return out;
}
