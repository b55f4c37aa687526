/**
 * Runs the reference checks of reference-checks.yaml: each entry names an evaluator (`kind`)
 * and its arguments (checked at load: each kind takes exactly its own), a published value and a
 * tolerance. The tests assert every check passes; the report's verification section shows the
 * same results.
 */
import { z } from 'zod';
import { readDataFile } from '../core/data-file.ts';
import { getSpecies } from '../thermo/species-data.ts';
import { cp, entropy, formationEnthalpy, formationGibbs } from '../thermo/properties.ts';
import { evaluateReaction, lnEquilibriumConstant } from '../electrochem/reaction.ts';
import { parseEquation } from '../electrochem/equation.ts';
import { waterSaturationPressurePa } from '../thermo/water-saturation.ts';
import { heatingValue } from '../plant/heating-values.ts';
import { oxidationGibbsW } from '../plant/efficiency.ts';
import { FARADAY_C_PER_MOL } from '../thermo/constants.ts';

/** Factor from the SI value an evaluator returns to the unit a check is stated in. */
const UNIT_FACTOR = {
  'kJ/mol': 1000,
  'J/mol': 1,
  'J/(mol K)': 1,
  V: 1,
  '1': 1,
  'bar^2': 1,
  'bar^-2': 1,
  'mol/(s A)': 1,
  'MJ/kg': 1e6,
  'kWh/kg': 3.6e6,
  '%': 0.01,
  kPa: 1000,
} as const;

const UNITS = Object.keys(UNIT_FACTOR) as [keyof typeof UNIT_FACTOR, ...(keyof typeof UNIT_FACTOR)[]];

/** What every check states: the quantity, the published value in its unit, the tolerance and why, the source. */
const common = {
  id: z.string().regex(/^[A-Z]+-\d+$/),
  what: z.string(),
  expected: z.number(),
  unit: z.enum(UNITS),
  tolerance: z.number().positive(),
  why: z.string(),
  source: z.string(),
  memory: z.boolean(),
};
const species = z.string();
const reaction = z.string();
const temperature_K = z.number().positive();
const heating = z.enum(['LHV', 'HHV']);

/** One check: its evaluator (`kind`) with exactly that evaluator's arguments. */
const ReferenceCheck = z.discriminatedUnion('kind', [
  z.strictObject({ ...common, kind: z.enum(['formation-enthalpy', 'formation-gibbs', 'heat-capacity', 'entropy']), species, temperature_K }),
  z.strictObject({ ...common, kind: z.enum(['reaction-gibbs', 'reaction-enthalpy', 'reversible-voltage', 'thermoneutral-voltage', 'equilibrium-constant']), reaction, temperature_K }),
  z.strictObject({ ...common, kind: z.literal('saturation-pressure'), temperature_K }),
  z.strictObject({ ...common, kind: z.literal('efficiency-limit-hhv'), species, temperature_K, water: z.enum(['gas', 'liquid']) }),
  z.strictObject({ ...common, kind: z.literal('heating-value-mass'), species, basis: heating }),
  z.strictObject({ ...common, kind: z.literal('faraday-hydrogen') }),
  z.strictObject({ ...common, kind: z.literal('electrolysis-energy'), basis: heating }),
]);

export type ReferenceCheck = z.infer<typeof ReferenceCheck>;

export interface CheckResult {
  check: ReferenceCheck;
  /** Computed value in the check's unit. */
  computed: number;
  deviation: number;
  pass: boolean;
}

/** The SI value a check's evaluator computes. */
function evaluate(c: ReferenceCheck): number {
  switch (c.kind) {
    case 'formation-enthalpy':
      return formationEnthalpy(getSpecies(c.species), c.temperature_K);
    case 'formation-gibbs':
      return formationGibbs(getSpecies(c.species), c.temperature_K);
    case 'heat-capacity':
      return cp(getSpecies(c.species), c.temperature_K);
    case 'entropy':
      return entropy(getSpecies(c.species), c.temperature_K);
    case 'reaction-gibbs':
      return evaluateReaction(c.reaction, c.temperature_K).deltaG_J_per_mol;
    case 'reaction-enthalpy':
      return evaluateReaction(c.reaction, c.temperature_K).deltaH_J_per_mol;
    case 'reversible-voltage':
      return evaluateReaction(c.reaction, c.temperature_K).reversibleVoltage_V;
    case 'thermoneutral-voltage':
      return evaluateReaction(c.reaction, c.temperature_K).thermoneutralVoltage_V;
    case 'equilibrium-constant':
      return Math.exp(lnEquilibriumConstant(parseEquation(c.reaction).terms, c.temperature_K));
    case 'saturation-pressure':
      return waterSaturationPressurePa(c.temperature_K);
    case 'efficiency-limit-hhv': {
      // −ΔG(T) of the fuel's oxidation over its HHV at 25 °C (water as stated), as a fraction.
      const fuel = getSpecies(c.species);
      return oxidationGibbsW({ [fuel.label]: 1 }, c.temperature_K, c.water) / heatingValue(fuel).hhvJPerMol;
    }
    case 'heating-value-mass': {
      const fuel = getSpecies(c.species);
      const hv = heatingValue(fuel);
      return (c.basis === 'HHV' ? hv.hhvJPerMol : hv.lhvJPerMol) / fuel.molarMassKgPerMol;
    }
    case 'faraday-hydrogen':
      // mol/s of H2 per ampere: 1/(2F).
      return 1 / (2 * FARADAY_C_PER_MOL);
    case 'electrolysis-energy': {
      // Electric energy per kg of H2 at 100 % efficiency on a heating-value basis, J/kg.
      const h2 = getSpecies('H2');
      const hv = heatingValue(h2);
      return (c.basis === 'HHV' ? hv.hhvJPerMol : hv.lhvJPerMol) / h2.molarMassKgPerMol;
    }
  }
}

let table: ReferenceCheck[] | undefined;

export function referenceChecks(): ReferenceCheck[] {
  table ??= readDataFile(new URL('./reference-checks.yaml', import.meta.url), z.array(ReferenceCheck));
  return table;
}

export function runCheck(check: ReferenceCheck): CheckResult {
  const computed = evaluate(check) / UNIT_FACTOR[check.unit];
  const deviation = computed - check.expected;
  return { check, computed, deviation, pass: Math.abs(deviation) <= check.tolerance };
}

export function runAllChecks(): CheckResult[] {
  return referenceChecks().map(runCheck);
}
