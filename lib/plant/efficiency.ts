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
 * Electrolysis:
 *   specific energy      w = P / ṁ_H2 (kWh/kg); η_LHV = ṁ_H2 LHV_H2 / P, η_HHV = ṁ_H2 HHV_H2 / P
 *                        (39.4 kWh/kg at 100 % HHV, 33.3 kWh/kg at 100 % LHV)
 *   voltage efficiency   Ē / V
 */
import { gibbs } from '../thermo/properties.ts';
import { getSpecies } from '../thermo/species-data.ts';
import { heatingValue, streamHeatingValueW } from './heating-values.ts';

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
  specificEnergyKWhPerKg: number;
  efficiencyLhv: number;
  efficiencyHhv: number;
  voltageEfficiency: number;
}

export function electrolysisEfficiency(hydrogenMolPerS: number, powerInW: number, meanNernstV: number, cellVoltageV: number): ElectrolysisEfficiency {
  const h2 = getSpecies('H2');
  const kgPerS = hydrogenMolPerS * h2.molarMassKgPerMol;
  const hv = heatingValue(h2);
  return {
    specificEnergyKWhPerKg: powerInW / kgPerS / 3.6e6,
    efficiencyLhv: (hydrogenMolPerS * hv.lhvJPerMol) / powerInW,
    efficiencyHhv: (hydrogenMolPerS * hv.hhvJPerMol) / powerInW,
    voltageEfficiency: meanNernstV / cellVoltageV,
  };
}
