/**
 * The off-gas oxidiser of a fuel-cell plant: the off-gas (less any recycle) with the air-electrode
 * exhaust or with fresh air of ratio λ to the O2 complete combustion needs, products at chemical
 * equilibrium at the adiabatic temperature (lib/equilibrium/adiabatic.ts, Gibbs minimum at fixed H
 * and p). Heat released: H_reactants(25 °C) − H_products(25 °C) of the outlet composition. With
 * fresh air, the air-electrode exhaust joins the products ahead of the heat recovery (adiabatic
 * mixing, no reaction): H_mix(T) = H_products(T_ad) + H_exhaust(T_exh).
 */
import { ZERO_CELSIUS_K } from '../core/units.ts';
import { mixtureEnthalpyJ } from '../thermo/mixture.ts';
import { temperatureAtEnthalpyK } from '../thermo/mixture-temperature.ts';
import { adiabaticEquilibrium } from '../equilibrium/adiabatic.ts';
import type { PlantInput } from '../basis/types.ts';
import type { DesignPoint } from './design-point.ts';
import { totalFlow } from './streams.ts';
import { finding, type Finding } from './findings.ts';
import type { PowerPlantBalance } from './plant-balance-types.ts';
import { fractions, plus, REFERENCE_K, type PlantSheet } from './plant-sheet.ts';
import { oxygenDemand, type AirFeeds, type StackOutlets } from './power-feeds.ts';

const H = mixtureEnthalpyJ;

/** The gas the heat recovery takes: the oxidiser's products (with the air-electrode exhaust where fresh air burnt the off-gas). */
export interface OxidiserExhaust {
  /** What the plant's energy balance calls it, where not the oxidiser's exhaust. */
  name?: string;
  flows: Record<string, number>;
  temperatureK: number;
  pressureBar: number;
}

/** Findings of the oxidiser: too little oxygen to burn the off-gas; an outlet above its material limit. */
function oxidiserFindings(oxidiser: NonNullable<PowerPlantBalance['oxidiser']>, offGas: Record<string, number>, oxidantO2: number, findings: Finding[]): void {
  const o2Left = oxidiser.products.O2 ?? 0;
  if (!(o2Left > 0) || oxygenDemand(offGas) > oxidantO2) {
    findings.push(finding('oxidiser-short-of-oxygen', 'critical', 'plant.off-gas-oxidiser.oxidant', 'the oxidant carries less oxygen than complete combustion of the off-gas needs: fuel leaves the oxidiser unburnt'));
  }
  if (oxidiser.outletTemperatureK > oxidiser.materialLimitK) {
    findings.push(
      finding(
        'oxidiser-above-material-limit',
        'critical',
        'plant.off-gas-oxidiser.material-limit',
        `the oxidiser's adiabatic outlet temperature ${(oxidiser.outletTemperatureK - ZERO_CELSIUS_K).toFixed(0)} °C exceeds its material limit ${(oxidiser.materialLimitK - ZERO_CELSIUS_K).toFixed(0)} °C`,
        ['operating-point.fuel-utilization', 'plant.off-gas-oxidiser.oxidant'],
      ),
    );
  }
}

/** The oxidiser and its exhaust (the module comment); both null where the basis has no oxidiser. */
export function offGasOxidiser(
  point: DesignPoint,
  plant: PlantInput,
  air: AirFeeds,
  outlets: StackOutlets,
  sheet: PlantSheet,
  findings: Finding[],
): { oxidiser: PowerPlantBalance['oxidiser']; exhaust: OxidiserExhaust | null } {
  const ox = plant.offGasOxidiser;
  if (!ox) return { oxidiser: null, exhaust: null };
  const { freshAir, blownK } = air;
  const { offGas, airOutlet, airExhaustK } = outlets;
  const inputs = point.inputs;
  const oxidant = freshAir ? { amounts: freshAir, temperatureK: blownK } : { amounts: airOutlet, temperatureK: airExhaustK };
  const pOx = Math.min(inputs.fuelPressureBar, inputs.airPressureBar);
  const reactants = [{ amounts: offGas, temperatureK: inputs.temperatureK }, oxidant];
  const e = adiabaticEquilibrium({ reactants, pressureBar: pOx });
  const products = e.amounts;
  const fr = fractions(products);
  const oxidiser = {
    oxidant: ox.oxidant.kind,
    airRatio: ox.oxidant.kind === 'fresh-air' ? ox.oxidant.airRatio : null,
    freshAirMolPerS: freshAir ? totalFlow(freshAir) : null,
    outletTemperatureK: e.temperatureK,
    materialLimitK: ox.materialLimitK,
    pressureBar: pOx,
    products,
    moleFractions: fr,
    carbonMonoxidePpm: (fr.CO ?? 0) * 1e6,
    heatReleasedW: H(offGas, REFERENCE_K) + H(oxidant.amounts, REFERENCE_K) - H(products, REFERENCE_K),
    energyBalanceError: e.energyBalanceError,
  };
  oxidiserFindings(oxidiser, offGas, oxidant.amounts.O2 ?? 0, findings);
  if (freshAir) sheet.add('oxidiser-air', 'oxidiser air', blownK, inputs.airPressureBar, freshAir);
  sheet.add('oxidiser-outlet', 'oxidiser outlet', e.temperatureK, pOx, products);
  if (!freshAir) return { oxidiser, exhaust: { flows: products, temperatureK: e.temperatureK, pressureBar: pOx } };
  const mixed = plus(products, airOutlet);
  const t = temperatureAtEnthalpyK(mixed, H(products, e.temperatureK) + H(airOutlet, airExhaustK), e.temperatureK);
  sheet.add('exhaust-mixed', 'oxidiser products with the air-electrode exhaust', t, pOx, mixed);
  return { oxidiser, exhaust: { flows: mixed, temperatureK: t, pressureBar: pOx } };
}
