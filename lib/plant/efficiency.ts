/**
 * Efficiency figures of the design point.
 *
 * Power mode (Larminie & Dicks, Fuel Cell Systems Explained, 2nd ed., §2.3-2.4):
 *   thermodynamic limit  η_max = −ΔG(T) / LHV  and  −ΔG(T) / HHV, ΔG of the complete oxidation of
 *                        the actual fuel at the cell temperature (water as the cell forms it),
 *                        heating values at 25 °C (83 % HHV at 25 °C to 62 % at 1000 °C for H2)
 *   Carnot limit         1 − T_cold / T_hot (for comparison; a fuel cell is not a heat engine)
 *   voltage efficiency   V / Ē
 *   electrical           η_el = P / (ṅ_fuel · LHV) and / (ṅ_fuel · HHV), gross (stack DC) and net
 * Electrolysis (the products are the combustibles the stack makes, net of its feed: hydrogen, and
 * in co-electrolysis carbon monoxide and any methane the equilibrated outlet holds, each by its
 * heating value, so a syngas is charged with all of its energy):
 *   specific energy      w = P / ṁ_H2 (kWh/kg), electricity only
 *   electricity only     η_el = Σ Δṅ_i HV_i / P, on LHV and HHV (39.4 kWh/kg of H2 at 100 % HHV,
 *                        33.3 kWh/kg at 100 % LHV); heat supplied from outside is not counted, so
 *                        a steam-fed stack exceeds 100 % on HHV: the latent heat of its water is
 *                        brought by the steam
 *   heat counted         η_Q,LHV = Σ Δṅ_i LHV_i / (P + Q_in),  η_Q,HHV = Σ Δṅ_i HHV_i / (P + Q_in + ṅ_steam L(25 °C))
 *                        Q_in the heat the stack absorbs below the thermoneutral voltage (isothermal,
 *                        lib/plant/heat.ts), ṅ_steam the water it consumes as vapour and L(25 °C)
 *                        its latent heat (lib/thermo/latent-heat.ts), which the HHV counts as
 *                        supplied (e.g. the energy-efficiency definitions of the electrolysis
 *                        literature; the boundary is the stack with its feed at stack temperature)
 *   voltage efficiency   Ē / V
 */
import { gibbs } from '../thermo/properties.ts';
import { getSpecies } from '../thermo/species-data.ts';
import { heatingValue, streamHeatingValueW } from './heating-values.ts';
import { waterLatentHeatJPerMol } from '../thermo/latent-heat.ts';
import { REFERENCE_TEMPERATURE_K } from '../thermo/constants.ts';

/** −ΔG(T) of complete oxidation of a stream's combustibles (to CO2, H2O, N2, SO2), W on a flow basis. */
export function oxidationGibbsW(stream: Readonly<Record<string, number>>, temperatureK: number, waterPhase: 'gas' | 'liquid'): number {
  const g = (name: string) => gibbs(getSpecies(name), temperatureK);
  const water = waterPhase === 'gas' ? 'H2O' : 'H2O(L)';
  let total = 0;
  for (const [name, amount] of Object.entries(stream)) {
    const s = getSpecies(name);
    if (heatingValue(s).lhvJPerMol <= 0 || amount === 0) continue;
    const f = s.formula;
    const c = f.C ?? 0;
    const h = f.H ?? 0;
    const n = f.N ?? 0;
    const sulphur = f.S ?? 0;
    const o2 = c + h / 4 + sulphur - (f.O ?? 0) / 2;
    const dG = c * g('CO2') + (h / 2) * g(water) + (n / 2) * g('N2') + sulphur * g('SO2') - g(s.label) - o2 * g('O2');
    total += -amount * dG;
  }
  return total;
}

export interface PowerEfficiency {
  fuelLhvW: number;
  fuelHhvW: number;
  limitLhv: number;
  limitHhv: number;
  carnot: number;
  voltageEfficiency: number;
  electricalLhvGross: number;
  electricalHhvGross: number;
  electricalLhvNet: number;
  electricalHhvNet: number;
}

export function powerEfficiency(
  fuelFlows: Readonly<Record<string, number>>,
  temperatureK: number,
  ambientK: number,
  waterPhase: 'gas' | 'liquid',
  cellVoltageV: number,
  meanNernstV: number,
  grossW: number,
  netW: number,
): PowerEfficiency {
  const hv = streamHeatingValueW(fuelFlows);
  const dG = oxidationGibbsW(fuelFlows, temperatureK, waterPhase);
  return {
    fuelLhvW: hv.lhvJPerMol,
    fuelHhvW: hv.hhvJPerMol,
    limitLhv: dG / hv.lhvJPerMol,
    limitHhv: dG / hv.hhvJPerMol,
    carnot: 1 - ambientK / temperatureK,
    voltageEfficiency: cellVoltageV / meanNernstV,
    electricalLhvGross: grossW / hv.lhvJPerMol,
    electricalHhvGross: grossW / hv.hhvJPerMol,
    electricalLhvNet: netW / hv.lhvJPerMol,
    electricalHhvNet: netW / hv.hhvJPerMol,
  };
}

export interface ElectrolysisEfficiency {
  /** Electricity per kg of hydrogen made, kWh/kg (electricity only). */
  specificEnergyKWhPerKg: number;
  /** Heating value of the products over the electricity (electricity only), LHV and HHV. */
  efficiencyLhv: number;
  efficiencyHhv: number;
  /** Heating value of the combustibles made, net of the feed (H2, and CO and CH4 in co-electrolysis), W. */
  productLhvW: number;
  productHhvW: number;
  /** Heat the stack absorbs below the thermoneutral voltage (isothermal), W, 0 or more. */
  heatDemandW: number;
  /** Latent heat (25 °C) of the water the stack consumes as vapour, W. */
  steamLatentHeatW: number;
  /** Heating value of the products over the electricity plus the heat supplied (see the module comment). */
  heatInclusiveEfficiencyLhv: number;
  heatInclusiveEfficiencyHhv: number;
  voltageEfficiency: number;
}

export interface ElectrolysisFlows {
  /** Net change of each species over the stack, out − in, mol/s (products positive). */
  producedMolPerS: Readonly<Record<string, number>>;
  /** Electric power into the stack, W. */
  powerInW: number;
  /** Isothermal stack heat, W (negative: heat the stack absorbs). */
  isothermalHeatW: number;
  meanNernstV: number;
  cellVoltageV: number;
}

export function electrolysisEfficiency(flows: ElectrolysisFlows): ElectrolysisEfficiency {
  const { producedMolPerS, powerInW, isothermalHeatW, meanNernstV, cellVoltageV } = flows;
  const h2 = getSpecies('H2');
  const hydrogenKgPerS = (producedMolPerS.H2 ?? 0) * h2.molarMassKgPerMol;
  const combustibles = Object.fromEntries(Object.entries(producedMolPerS).filter(([name]) => heatingValue(getSpecies(name)).lhvJPerMol > 0));
  const product = streamHeatingValueW(combustibles);
  const heatDemandW = Math.max(0, -isothermalHeatW);
  const steamLatentHeatW = Math.max(0, -(producedMolPerS.H2O ?? 0)) * waterLatentHeatJPerMol(REFERENCE_TEMPERATURE_K);
  return {
    specificEnergyKWhPerKg: powerInW / hydrogenKgPerS / 3.6e6,
    efficiencyLhv: product.lhvJPerMol / powerInW,
    efficiencyHhv: product.hhvJPerMol / powerInW,
    productLhvW: product.lhvJPerMol,
    productHhvW: product.hhvJPerMol,
    heatDemandW,
    steamLatentHeatW,
    heatInclusiveEfficiencyLhv: product.lhvJPerMol / (powerInW + heatDemandW),
    heatInclusiveEfficiencyHhv: product.hhvJPerMol / (powerInW + heatDemandW + steamLatentHeatW),
    voltageEfficiency: meanNernstV / cellVoltageV,
  };
}
