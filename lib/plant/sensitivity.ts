/**
 * One-at-a-time sensitivities of the headline results (charge-mean Nernst voltage, cell voltage,
 * electrical efficiency, stack heat) to the main inputs, for the tornado chart: each input is
 * moved down and up by the step the basis states (defaults: ±25 K, ±10 % pressure, ±0.05
 * utilization, ±0.5 S/C, ±10 % current density; common practice, no source) with everything else
 * held: the cell count and the cell's area-specific resistance (the one given, or the one a given
 * voltage implies), so the cell voltage of each case is solved again (the sensitivity of the
 * stack as designed). The resistance follows its Arrhenius law where the basis gives one, and is
 * held constant where it does not. The cases use a coarser fuel path (20 intervals, no
 * refinement) than the reported one; the base case is evaluated on the same grid, so the
 * differences carry no grid error of their own.
 */
import { conversionName } from '../basis/stream-rules.ts';
import type { Sensitivity } from '../basis/types.ts';
import { UserError } from '../core/errors.ts';
import { withSteamToCarbon, type DesignInputs } from './design-inputs.ts';
import { evaluateDesignPoint, type DesignPoint } from './design-point.ts';
import type { Results } from './results-schema.ts';
import { ZERO_CELSIUS_K } from '../core/units.ts';

type Entry = Results['sensitivities'][number];

interface Perturbation {
  input: string;
  path: string;
  step: string;
  apply: (inputs: DesignInputs, sign: 1 | -1) => DesignInputs;
  show: (inputs: DesignInputs) => string;
}

const fmt = (x: number, digits = 4) => String(Number(x.toPrecision(digits)));

/**
 * A utilization or conversion moved by `delta`, kept inside (0.01, 0.99) without crossing to the
 * other side of `base`: a step larger than the room left (a conversion of 0.007 stepped by 0.02)
 * goes half way to the bound instead, so the low case stays below the base and the high above it.
 */
function steppedFraction(base: number, delta: number): number {
  const moved = base + delta;
  if (delta < 0) return Math.max(moved, Math.min(0.01, base / 2));
  return Math.min(moved, Math.max(0.99, (1 + base) / 2));
}

function perturbations(step: Sensitivity, inputs: DesignInputs): Perturbation[] {
  const list: Perturbation[] = [
    {
      input: 'operating temperature',
      path: 'conditions.operating-temperature',
      step: `±${fmt(step.temperatureK)} K`,
      apply: (i, s) => ({ ...i, temperatureK: i.temperatureK + s * step.temperatureK }),
      show: (i) => `${fmt(i.temperatureK - ZERO_CELSIUS_K)} °C`,
    },
    {
      input: 'electrode pressures',
      path: 'conditions.fuel-electrode-pressure',
      step: `±${fmt(step.pressureFraction * 100)} %`,
      apply: (i, s) => ({ ...i, fuelPressureBar: i.fuelPressureBar * (1 + s * step.pressureFraction), airPressureBar: i.airPressureBar * (1 + s * step.pressureFraction) }),
      show: (i) => `${fmt(i.fuelPressureBar)} / ${fmt(i.airPressureBar)} bar`,
    },
    {
      input: conversionName(inputs.technology, inputs.mode),
      path: inputs.mode === 'power' ? 'operating-point.fuel-utilization' : 'operating-point.steam-conversion',
      step: `±${fmt(step.utilization)}`,
      apply: (i, s) => ({ ...i, utilization: steppedFraction(i.utilization, s * step.utilization) }),
      show: (i) => fmt(i.utilization, 3),
    },
    {
      input: 'current density',
      path: 'operating-point.current-density',
      step: `±${fmt(step.currentDensityFraction * 100)} %`,
      apply: (i, s) => ({ ...i, currentDensityAPerM2: i.currentDensityAPerM2 * (1 + s * step.currentDensityFraction) }),
      show: (i) => `${fmt(i.currentDensityAPerM2 / 1e4)} A/cm2`,
    },
  ];
  if (inputs.steamToCarbon !== undefined && inputs.dryFuel) {
    list.push({
      input: 'steam-to-carbon ratio',
      path: 'streams.fuel-electrode.steam-to-carbon',
      step: `±${fmt(step.steamToCarbon)}`,
      apply: (i, s) => withSteamToCarbon(i, Math.max(0, i.steamToCarbon! + s * step.steamToCarbon)),
      show: (i) => fmt(i.steamToCarbon!, 3),
    });
  }
  return list;
}

function efficiencyOf(point: DesignPoint): number {
  return point.power ? point.power.electricalLhvNet : point.electrolysis!.efficiencyLhv;
}

/**
 * The stack as designed, for evaluations away from the design point: its cell count and its
 * resistance at the design temperature (with the law, if any, referred to that temperature), on
 * the coarse grid, with the base case on the same grid; the cases start their equilibria from the
 * base case's. A degradation of the design is in that resistance (the design point's own).
 */
export function heldDesign(design: DesignPoint): { inputs: DesignInputs; base: DesignPoint } {
  const law = design.inputs.resistanceLaw;
  const inputs: DesignInputs = {
    ...design.inputs,
    size: { kind: 'cells', cells: design.sizing.cells },
    voltage: { kind: 'area-specific-resistance', ohmM2: design.voltage.areaSpecificResistanceOhmM2 },
    ...(law ? { resistanceLaw: { ...law, referenceTemperatureK: design.inputs.temperatureK } } : {}),
    intervals: 20,
    refineV: Infinity,
  };
  delete inputs.statedCells;
  // The resistance held is the one at the design point, a degradation already in it.
  delete inputs.degradation;
  const base = evaluateDesignPoint(inputs);
  inputs.seeds = base.path.solutions;
  return { inputs, base };
}

export function sensitivities(design: DesignPoint, step: Sensitivity): Entry[] {
  const { inputs: fixed, base } = heldDesign(design);
  return perturbations(step, fixed).map((p) => {
    const notes: string[] = [];
    const run = (sign: 1 | -1): DesignPoint | null => {
      try {
        return evaluateDesignPoint(p.apply(fixed, sign));
      } catch (error) {
        if (!(error instanceof UserError)) throw error;
        notes.push(`${sign < 0 ? 'low' : 'high'} case: ${error.message}`);
        return null;
      }
    };
    const low = run(-1);
    const high = run(1);
    const pick = (f: (d: DesignPoint) => number) => ({ base: f(base), low: low ? f(low) : null, high: high ? f(high) : null });
    return {
      input: p.input,
      path: p.path,
      step: p.step,
      low: p.show(p.apply(fixed, -1)),
      high: p.show(p.apply(fixed, 1)),
      meanNernst_V: pick((d) => d.path.meanNernstV),
      cellVoltage_V: pick((d) => d.voltage.cellVoltageV),
      efficiency: pick(efficiencyOf),
      stackHeat_W: pick((d) => d.heat.isothermalHeatW),
      note: notes.length ? notes.join('; ') : null,
    };
  });
}
