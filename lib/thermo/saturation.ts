/**
 * Saturation pressure of water from the species data alone: liquid and vapour in equilibrium
 * have equal chemical potential, so with the vapour ideal and the liquid pure,
 *   ln(p_sat / p°) = −(g°_H2O(g)(T) − g°_H2O(l)(T)) / (R T),   p° = 1 bar.
 * (e.g. Smith, Van Ness & Abbott, Introduction to Chemical Engineering Thermodynamics, ch. 10).
 * Vapour non-ideality and the Poynting factor are neglected, so against IAPWS-95 (Wagner & Pruss,
 * J. Phys. Chem. Ref. Data 31 (2002) 387) it reads 0.1 % low at 25 °C, 0.35 % at 50 °C,
 * 1 % at 80 °C and 1.6 % at 100 °C, and worse above: use it for humid-air feeds and the vapour
 * content of low-temperature cells, not for steam-system design.
 */
import { getSpecies } from './species-data.ts';
import { gOverRT } from './properties.ts';
import { STANDARD_PRESSURE_BAR } from './constants.ts';
import { ZERO_CELSIUS_K } from '../core/units.ts';

export function saturationPressureBar(temperatureK: number): number {
  const vapour = getSpecies('H2O');
  const liquid = getSpecies('H2O(L)');
  return STANDARD_PRESSURE_BAR * Math.exp(-(gOverRT(vapour, temperatureK) - gOverRT(liquid, temperatureK)));
}

/** Dew point (K) of a water partial pressure (bar): inverts saturationPressureBar by bisection on ln p. */
export function dewPointK(waterPartialPressureBar: number): number {
  let low = ZERO_CELSIUS_K;
  let high = 600;
  const target = Math.log(waterPartialPressureBar);
  for (let i = 0; i < 80; i++) {
    const mid = (low + high) / 2;
    if (Math.log(saturationPressureBar(mid)) < target) low = mid;
    else high = mid;
  }
  return (low + high) / 2;
}
