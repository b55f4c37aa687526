/**
 * Latent heat of water from the species data: the enthalpy of evaporating liquid water into
 * the ideal-gas standard state at the same temperature,
 *   L(T) = h°_H2O(g)(T) − h°_H2O(L)(T),   J/mol
 * with both enthalpies from the NASA Glenn records H2O and H2O(L) (McBride, Zehe and Gordon,
 * NASA/TP-2002-211556; the liquid from Cox 1989 and Haar 1984). Valid where H2O(L) has data,
 * 273.15 K to 600 K.
 *
 * The vapour here is an ideal gas; real steam at its saturation pressure has a lower enthalpy
 * (its departure, h_ideal − h_real ≈ −p_s (B − T dB/dT) with B the second virial coefficient),
 * so L(T) exceeds the steam-table latent heat by that departure: 27 J/mol (0.06 %) at 25 °C,
 * 236 J/mol (0.58 %) at 100 °C by IAPWS-95 (test/thermo/latent-heat.test.ts). Within one
 * balance on the species data this is the consistent value: it is the difference of the two
 * enthalpies every stream carries, so an energy balance that uses it closes exactly.
 */
import { enthalpy } from './properties.ts';
import { getSpecies } from './species-data.ts';

/** L(T) = h°_H2O(g)(T) − h°_H2O(L)(T), J/mol (ideal-gas vapour, see the module comment). */
export function waterLatentHeatJPerMol(temperatureK: number): number {
  return enthalpy(getSpecies('H2O'), temperatureK) - enthalpy(getSpecies('H2O(L)'), temperatureK);
}

/** L(T) per kilogram of water, J/kg: L(T) / M_H2O with M from the species data (18.01528 g/mol). */
export function waterLatentHeatJPerKg(temperatureK: number): number {
  return waterLatentHeatJPerMol(temperatureK) / getSpecies('H2O').molarMassKgPerMol;
}
