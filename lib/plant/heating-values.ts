/**
 * Heating values from the species data: the enthalpy of complete combustion at 298.15 K and
 * 1 bar, products CO2, H2O, N2 and SO2 (carbon, hydrogen, nitrogen and sulphur), with the water
 * as vapour (lower heating value, LHV) or liquid (higher heating value, HHV):
 *   LHV_i = −[Σ_products ν h(298.15) − h_i(298.15) − ν_O2 h_O2(298.15)]   (water as H2O(g))
 *   HHV_i = LHV_i + (n_H/2) · [h_H2O(g) − h_H2O(l)](298.15)
 * (the definitions of e.g. ISO 6976 and of fuel-cell texts such as Larminie & Dicks, App. 2;
 * here evaluated with the NASA Glenn data). Hydrogen: 241.8 and 285.8 kJ/mol, 120.0 and 141.8 MJ/kg.
 */
import { enthalpy } from '../thermo/properties.ts';
import { getSpecies, type Species } from '../thermo/species-data.ts';
import { REFERENCE_TEMPERATURE_K as T0 } from '../thermo/constants.ts';
import { waterLatentHeatJPerMol } from '../thermo/latent-heat.ts';

export interface HeatingValue {
  lhvJPerMol: number;
  hhvJPerMol: number;
}

const cache = new Map<string, HeatingValue>();

/** Heating values of one species (0 for non-combustibles such as H2O, CO2, N2, Ar). */
export function heatingValue(species: Species): HeatingValue {
  const cached = cache.get(species.label);
  if (cached) return cached;
  const f = species.formula;
  const c = f.C ?? 0;
  const h = f.H ?? 0;
  const s = f.S ?? 0;
  const o = f.O ?? 0;
  const o2 = c + h / 4 + s - o / 2;
  const h0 = (name: string) => enthalpy(getSpecies(name), T0);
  let value: HeatingValue;
  if (o2 <= 0) {
    value = { lhvJPerMol: 0, hhvJPerMol: 0 };
  } else {
    const products = c * h0('CO2') + (h / 2) * h0('H2O') + s * h0('SO2');
    const lhv = -(products - enthalpy(species, T0) - o2 * h0('O2'));
    value = { lhvJPerMol: lhv, hhvJPerMol: lhv + (h / 2) * waterLatentHeatJPerMol(T0) };
  }
  cache.set(species.label, value);
  return value;
}

/** Heating values of a stream per second (species label → mol/s), W. */
export function streamHeatingValueW(stream: Readonly<Record<string, number>>): HeatingValue {
  let lhv = 0;
  let hhv = 0;
  for (const [name, amount] of Object.entries(stream)) {
    const v = heatingValue(getSpecies(name));
    lhv += amount * v.lhvJPerMol;
    hhv += amount * v.hhvJPerMol;
  }
  return { lhvJPerMol: lhv, hhvJPerMol: hhv };
}
