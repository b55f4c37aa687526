/**
 * The worked line of the water in an air-electrode feed of humid air (lib/basis/humid-air.ts):
 * by Dalton's law for an ideal gas x_H2O = φ p_s(T)/p for a relative humidity φ stated at T, and
 * p_s(T_d)/p at a dew point T_d, p_s the saturation pressure of water on the IAPWS-IF97
 * saturation line (region 4, eq. 30; IAPWS R7-97) and p the pressure the humidity is stated at:
 * the ambient pressure for a relative humidity, the air-electrode pressure for a dew point. The
 * numbers are those the results carry (conditions.airHumidity), the result the water fraction
 * the feed was made with. With a carbonate cell's cathode-gas loop the humid air is the loop's
 * burner air (streams.air-electrode.cathode-loop.burner-air), not the air-electrode feed.
 */
import type { DesignBasis } from '../../basis/types.ts';
import type { Results } from '../../plant/results-schema.ts';
import type { LineSpec, QuantitySpec } from '../calc-line.ts';
import { HUMIDITY_RELATION } from '../equations.ts';
import { formatTemperature } from '../format.ts';

type Humidity = NonNullable<Results['conditions']['airHumidity']>;

/** Where p comes from: the air-electrode pressure, or the ambient pressure as given or by default. */
function pressureOrigin(h: Humidity, basis: DesignBasis): string {
  if (h.pressureOf === 'air-electrode') return 'air-electrode pressure (conditions.air-electrode-pressure), design input: a dew point is that of the air fed to the electrode';
  const given = basis.inputs.some((i) => i.path === 'conditions.ambient-pressure');
  return given
    ? 'ambient pressure (conditions.ambient-pressure), design input: a relative humidity is that of the ambient air'
    : 'ambient pressure: conditions.ambient-pressure not given, the standard atmosphere (ISO 2533); a relative humidity is that of the ambient air';
}

/** The water fraction of the humid air fed to the air electrode (or to a cathode-gas loop's burner), or null where that air is not humid air. */
export function humidityLine(r: Results, basis: DesignBasis): LineSpec | null {
  const h = r.conditions.airHumidity;
  if (!h) return null;
  const loop = basis.airElectrode?.cathodeLoop !== undefined;
  const stated = loop ? 'streams.air-electrode.cathode-loop.burner-air.humidity' : 'streams.air-electrode.humidity';
  const at = h.form === 'dew-point' ? `the dew point, ${formatTemperature(h.temperature_K)}` : `the temperature the relative humidity is stated at, ${formatTemperature(h.temperature_K)}`;
  const phi: QuantitySpec[] = h.relativeHumidity === null ? [] : [{ name: 'phi', value: h.relativeHumidity, unit: '', origin: `relative humidity of the ambient air (${stated}), design input` }];
  return {
    id: 'air-humidity',
    title: loop ? "Water in the cathode-gas loop's burner air" : 'Water in the air-electrode feed',
    equation: 'air-humidity',
    relation: HUMIDITY_RELATION[h.form],
    quantities: [
      ...phi,
      { name: 'ps', value: h.saturationPressure_Pa, unit: 'Pa', origin: `saturation pressure of water at ${at}: IAPWS-IF97 region 4 (IAPWS R7-97, eq. 30)` },
      { name: 'p', value: h.pressure_Pa, unit: 'Pa', origin: pressureOrigin(h, basis) },
    ],
    value: h.waterFraction,
    unit: '',
    percent: true,
  };
}
