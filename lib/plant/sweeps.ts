/**
 * The curves of the design document's charts:
 * - temperature: E_rev = −ΔG°/2F and V_tn = −ΔH°/2F of H2 + ½O2 → H2O, the actual fuel's
 *   −ΔG°/zF, the thermodynamic efficiency limits −ΔG(T)/LHV and −ΔG(T)/HHV of the fuel and of
 *   hydrogen, and the Carnot limit 1 − T_cold/T (Larminie & Dicks, §2.3-2.4); in electrolysis the
 *   bound runs the other way: no cell splits water with less electric work than ΔG(T) of the
 *   splitting, so the efficiency over electricity alone of a reversible electrolyser is
 *   LHV/ΔG(T) and HHV/ΔG(T) of hydrogen (heat TΔS taken from the surroundings; Larminie & Dicks,
 *   §2.3, the same ΔG read backwards);
 * - current density: V(j) of the uniform-voltage cell (voltage.ts) at the design utilization and
 *   resistance (E(u) does not depend on j at fixed utilization), P = N A j V,
 *   Q = N A (j_ion V_tn − j V) (power) or N A (j V − j_ion V_tn) (electrolysis), with the design
 *   point's effective V_tn per ionic charge;
 * - stack temperature: the design point evaluated at 7 temperatures across the sweep range
 *   with the cell count, current density, utilization and resistance held (the resistance
 *   following its Arrhenius law where the basis gives one: sensitivity.ts heldDesign), the cell
 *   voltage solved again; a temperature at which it cannot be evaluated is left out;
 * - steam-to-carbon: carbon activity of the equilibrated fuel gas against S/C, at the stack and
 *   pre-reformer temperatures.
 */
import { FARADAY_C_PER_MOL as F } from '../thermo/constants.ts';
import { evaluateReaction } from '../electrochem/reaction.ts';
import { electronsOfStream } from '../electrochem/charge.ts';
import { addSteam, combustibleCarbon, equilibriumCarbonActivity } from '../equilibrium/carbon.ts';
import { getSpecies } from '../thermo/species-data.ts';
import { inRange } from '../thermo/properties.ts';
import { heatingValue, streamHeatingValueW } from './heating-values.ts';
import { oxidationGibbsW } from './efficiency.ts';
import { cellRequest, evaluateDesignPoint, type DesignPoint } from './design-point.ts';
import { heldDesign } from './sensitivity.ts';
import { operatingVoltage } from './voltage.ts';
import { UserError } from '../core/errors.ts';
import type { Results } from './results-schema.ts';

type Sweeps = Results['sweeps'];

function linspace(from: number, to: number, n: number): number[] {
  return Array.from({ length: n }, (_, k) => from + ((to - from) * k) / (n - 1));
}

export function temperatureSweep(point: DesignPoint, fromK: number, toK: number, count = 31): Sweeps['temperature'] {
  const inputs = point.inputs;
  const phase = inputs.technology.waterPhase;
  const water = getSpecies(phase === 'gas' ? 'H2O' : 'H2O(L)');
  const low = Math.max(fromK, water.lowK);
  const high = Math.min(toK, water.highK);
  const dryFuel = inputs.mode === 'power' ? inputs.dryFuel : null;
  const fuelElectrons = dryFuel ? electronsOfStream(dryFuel) : 0;
  const hv = dryFuel ? streamHeatingValueW(dryFuel) : null;
  const h2 = heatingValue(getSpecies('H2'));
  const electrolysis = inputs.mode !== 'power';
  const fuelOk = (t: number) => !!dryFuel && Object.keys(dryFuel).every((k) => inRange(getSpecies(k), t));
  return linspace(low, high, count).map((t) => {
    const hydrogen = evaluateReaction(`H2 + 1/2 O2 -> ${water.label}`, t);
    const dG = fuelOk(t) ? oxidationGibbsW(dryFuel!, t, phase) : null;
    return {
      temperature_K: t,
      reversibleVoltage_V: hydrogen.reversibleVoltage_V,
      thermoneutralVoltage_V: hydrogen.thermoneutralVoltage_V,
      fuelReversibleVoltage_V: dG !== null && fuelElectrons > 0 ? dG / (fuelElectrons * F) : null,
      limitLhv: dG !== null && hv ? dG / hv.lhvJPerMol : null,
      limitHhv: dG !== null && hv ? dG / hv.hhvJPerMol : null,
      hydrogenLimitHhv: -hydrogen.deltaG_J_per_mol / h2.hhvJPerMol,
      electrolysisLimitLhv: electrolysis ? h2.lhvJPerMol / -hydrogen.deltaG_J_per_mol : null,
      electrolysisLimitHhv: electrolysis ? h2.hhvJPerMol / -hydrogen.deltaG_J_per_mol : null,
      carnot: 1 - inputs.ambientTemperatureK / t,
    };
  });
}

export function currentDensitySweep(point: DesignPoint, count = 25): Sweeps['currentDensity'] {
  const { inputs, voltage, heat, sizing } = point;
  const power = inputs.mode === 'power';
  const model = { kind: 'area-specific-resistance', ohmM2: voltage.areaSpecificResistanceOhmM2 } as const;
  const area = sizing.cells * inputs.activeAreaM2;
  const jMax = 1.6 * inputs.currentDensityAPerM2;
  const out: Sweeps['currentDensity'] = [];
  for (const j of linspace(jMax / count, jMax, count)) {
    let cell;
    try {
      cell = operatingVoltage({ ...cellRequest(point), model, currentDensityAPerM2: j });
    } catch (error) {
      if (!(error instanceof UserError)) throw error;
      // Below the current density the electronic leakage alone carries (a mixed conductor in
      // electrolysis) no water is split: the sweep starts where the cell is reachable. Past the
      // current density at which the voltage reaches zero (power) it ends.
      if (out.length === 0) continue;
      break;
    }
    const v = cell.cellVoltageV;
    const current = area * j;
    const ionic = area * cell.ionicCurrentDensityAPerM2;
    out.push({
      currentDensity_A_per_m2: j,
      cellVoltage_V: v,
      stackPower_W: current * v,
      stackHeat_W: power ? ionic * heat.thermoneutralVoltageV - current * v : current * v - ionic * heat.thermoneutralVoltageV,
    });
  }
  return out;
}

export function stackTemperatureSweep(point: DesignPoint, fromK: number, toK: number, count = 7): Sweeps['stackTemperature'] {
  const { inputs, base } = heldDesign(point);
  const temperatures = linspace(fromK, toK, count);
  const found = new Map<number, Sweeps['stackTemperature'][number]>();
  // Outward from the design temperature, each point's equilibria started from its neighbour's.
  const design = inputs.temperatureK;
  for (const side of [temperatures.filter((t) => t >= design), temperatures.filter((t) => t < design).reverse()]) {
    let seeds = base.path.solutions;
    for (const t of side) {
      let at: DesignPoint;
      try {
        at = evaluateDesignPoint({ ...inputs, temperatureK: t, seeds });
      } catch (error) {
        if (error instanceof UserError) continue;
        throw error;
      }
      seeds = at.path.solutions;
      found.set(t, {
        temperature_K: t,
        areaSpecificResistance_ohm_m2: at.voltage.areaSpecificResistanceOhmM2,
        cellVoltage_V: at.voltage.cellVoltageV,
        efficiency: at.power ? at.power.electricalLhvNet : at.electrolysis!.efficiencyLhv,
        stackHeat_W: at.heat.isothermalHeatW,
      });
    }
  }
  return temperatures.flatMap((t) => found.get(t) ?? []);
}

export function steamToCarbonSweep(point: DesignPoint, count = 25): Sweeps['steamToCarbon'] {
  const inputs = point.inputs;
  if (inputs.mode !== 'power' || !inputs.dryFuel || inputs.steamToCarbon === undefined) return [];
  const top = Math.max(3, 1.5 * inputs.steamToCarbon);
  const pre = point.unit.preReformer?.outletTemperatureK ?? null;
  const stackChain = {};
  const preChain = {};
  return linspace(top / count, top, count).map((s) => {
    const feed = addSteam(inputs.dryFuel!, s * combustibleCarbon(inputs.dryFuel!));
    return {
      steamToCarbon: s,
      carbonActivityStack: equilibriumCarbonActivity(feed, inputs.temperatureK, inputs.fuelPressureBar, stackChain),
      carbonActivityPreReformer: pre === null ? null : equilibriumCarbonActivity(feed, pre, inputs.fuelPressureBar, preChain),
    };
  });
}
