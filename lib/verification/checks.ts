/**
 * Runs the reference checks of reference-checks.yaml: each entry names an evaluator (`kind`)
 * and its arguments, a published value and a tolerance. The tests assert every check passes;
 * the report's verification section shows the same results.
 */
import { readFileSync } from 'node:fs';
import { parse as parseYaml } from 'yaml';
import { getSpecies } from '../thermo/species-data.ts';
import { cp, entropy, formationEnthalpy, formationGibbs } from '../thermo/properties.ts';
import { evaluateReaction, lnEquilibriumConstant } from '../electrochem/reaction.ts';
import { parseEquation } from '../electrochem/equation.ts';
import { saturationPressureBar } from '../thermo/saturation.ts';
import { heatingValue } from '../plant/heating-values.ts';
import { oxidationGibbsW } from '../plant/efficiency.ts';
import { FARADAY_C_PER_MOL } from '../thermo/constants.ts';

export interface ReferenceCheck {
  id: string;
  what: string;
  kind: string;
  expected: number;
  unit: string;
  tolerance: number;
  why: string;
  source: string;
  memory: boolean;
  [argument: string]: unknown;
}

export interface CheckResult {
  check: ReferenceCheck;
  /** Computed value in the check's unit. */
  computed: number;
  deviation: number;
  pass: boolean;
}

/** Factor from the SI value an evaluator returns to the unit a check is stated in. */
const UNIT_FACTOR: Record<string, number> = {
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
};

type Evaluator = (check: ReferenceCheck) => number;

const str = (c: ReferenceCheck, key: string): string => String(c[key]);
const num = (c: ReferenceCheck, key: string): number => Number(c[key]);

const evaluators = new Map<string, Evaluator>([
  ['formation-enthalpy', (c) => formationEnthalpy(getSpecies(str(c, 'species')), num(c, 'temperature_K'))],
  ['formation-gibbs', (c) => formationGibbs(getSpecies(str(c, 'species')), num(c, 'temperature_K'))],
  ['heat-capacity', (c) => cp(getSpecies(str(c, 'species')), num(c, 'temperature_K'))],
  ['entropy', (c) => entropy(getSpecies(str(c, 'species')), num(c, 'temperature_K'))],
  ['reaction-gibbs', (c) => evaluateReaction(str(c, 'reaction'), num(c, 'temperature_K')).deltaG_J_per_mol],
  ['reaction-enthalpy', (c) => evaluateReaction(str(c, 'reaction'), num(c, 'temperature_K')).deltaH_J_per_mol],
  ['reversible-voltage', (c) => evaluateReaction(str(c, 'reaction'), num(c, 'temperature_K')).reversibleVoltage_V],
  ['thermoneutral-voltage', (c) => evaluateReaction(str(c, 'reaction'), num(c, 'temperature_K')).thermoneutralVoltage_V],
  ['equilibrium-constant', (c) => Math.exp(lnEquilibriumConstant(parseEquation(str(c, 'reaction')).terms, num(c, 'temperature_K')))],
  ['saturation-pressure', (c) => saturationPressureBar(num(c, 'temperature_K')) * 1e5],
  // −ΔG(T) of the fuel's oxidation over its HHV at 25 °C (water as stated), as a fraction.
  ['efficiency-limit-hhv', (c) => {
    const fuel = getSpecies(str(c, 'species'));
    return oxidationGibbsW({ [fuel.label]: 1 }, num(c, 'temperature_K'), str(c, 'water') === 'liquid' ? 'liquid' : 'gas') / heatingValue(fuel).hhvJPerMol;
  }],
  ['heating-value-mass', (c) => {
    const fuel = getSpecies(str(c, 'species'));
    const hv = heatingValue(fuel);
    return (str(c, 'basis') === 'HHV' ? hv.hhvJPerMol : hv.lhvJPerMol) / fuel.molarMassKgPerMol;
  }],
  // mol/s of H2 per ampere: 1/(2F).
  ['faraday-hydrogen', () => 1 / (2 * FARADAY_C_PER_MOL)],
  // Electric energy per kg of H2 at 100 % efficiency on a heating-value basis, J/kg.
  ['electrolysis-energy', (c) => {
    const h2 = getSpecies('H2');
    const hv = heatingValue(h2);
    return (str(c, 'basis') === 'HHV' ? hv.hhvJPerMol : hv.lhvJPerMol) / h2.molarMassKgPerMol;
  }],
]);

/** Lets other modules add evaluators (equilibrium constants, plant quantities) without a cycle. */
export function registerEvaluator(kind: string, evaluator: Evaluator): void {
  evaluators.set(kind, evaluator);
}

let table: ReferenceCheck[] | undefined;

export function referenceChecks(): ReferenceCheck[] {
  table ??= parseYaml(readFileSync(new URL('./reference-checks.yaml', import.meta.url), 'utf8')) as ReferenceCheck[];
  return table;
}

export function runCheck(check: ReferenceCheck): CheckResult {
  const evaluator = evaluators.get(check.kind);
  const factor = UNIT_FACTOR[check.unit];
  if (!evaluator) throw new Error(`reference check ${check.id}: no evaluator for kind "${check.kind}"`);
  if (factor === undefined) throw new Error(`reference check ${check.id}: unknown unit "${check.unit}"`);
  const computed = evaluator(check) / factor;
  const deviation = computed - check.expected;
  return { check, computed, deviation, pass: Math.abs(deviation) <= check.tolerance };
}

export function runAllChecks(): CheckResult[] {
  return referenceChecks().map(runCheck);
}
