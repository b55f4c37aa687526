/**
 * The electrode reactions of each ion an electrolyte carries (data/electrolytes.yaml), written
 * once, in the power direction for two electrons: the fuel electrode (f) gives them up, the air
 * electrode (a) takes them. Checked at load: each reaction balances every element and the charge,
 * and passes two electrons. From them follow
 *   - the Nernst pressure quotient (nernst.ts): with equal electrochemical potentials across both
 *     electrode reactions and the ion's the same at both interfaces, the sum of the reactions is
 *     the overall cell reaction, and E = E° + RT/2F · ln Q with Q = Π p_i^ν_i over the gases it
 *     consumes (ν > 0) and forms (ν < 0), each at its electrode (e.g. R. O'Hayre et al., Fuel Cell
 *     Fundamentals, 3rd ed., ch. 2);
 *   - what the electrolyte moves between the electrode gases per mole of electrons (the fuel path,
 *     lib/equilibrium/electrolyte-exchange.ts);
 *   - the couple of an ion the air electrode forms from its gases alone (oxide: ½O2; carbonate:
 *     ½O2 + CO2): that reaction at equilibrium at both electrodes gives E from the potentials of
 *     those gases across the electrolyte, for any fuel gas at equilibrium (nernst.ts);
 *   - the derivation the method section writes out (lib/report/electrode-reactions.ts).
 */
import { z } from 'zod';
import { readDataFile } from '../core/data-file.ts';
import { getSpecies } from '../thermo/species-data.ts';
import { IONS, type Ion } from './technologies.ts';

/** The electrode marks of subscripts: f for the fuel electrode, a for the air electrode. */
export type Electrode = 'f' | 'a';

/** One species of a reaction with its coefficient; `ion` is the ion the electrolyte carries. */
export interface ReactionTerm {
  species: string;
  coefficient: number;
}

export interface ElectrodeReaction {
  consumes: ReactionTerm[];
  forms: ReactionTerm[];
}

export interface Electrolyte {
  ion: Ion;
  /** The ion in running text: "oxide ion". */
  name: string;
  /** Its formula as LaTeX, inside \mathrm{}: "O^{2-}". */
  tex: string;
  /** The ion's elements and charge, for the balances. */
  formula: Readonly<Record<string, number>>;
  charge: number;
  /** The water of the reactions is the aqueous electrolyte's (activity 1), not a gas at an electrode. */
  electrolyteWater: boolean;
  fuel: ElectrodeReaction;
  air: ElectrodeReaction;
}

/** One factor of the Nernst pressure quotient: p^power of a gas at an electrode. */
export interface QuotientTerm {
  species: string;
  electrode: Electrode;
  /** Exponent: the coefficient of the two-electron reaction, positive for what it consumes, negative for what it forms. */
  power: number;
  /** A water term, dropped where the cell runs with liquid water (activity 1). */
  water: boolean;
}

/** The electrons each electrode reaction passes (the reactions are written for two). */
export const ELECTRONS = 2;

const Terms = z.record(z.string(), z.number().positive());
const RawElectrolyte = z.strictObject({
  name: z.string(),
  tex: z.string(),
  formula: z.record(z.string(), z.number().int().positive()),
  charge: z.number().int().negative().or(z.number().int().positive()),
  'electrolyte-water': z.boolean().optional(),
  'fuel-electrode': z.strictObject({ consumes: Terms, forms: Terms }),
  'air-electrode': z.strictObject({ consumes: Terms, forms: Terms }),
});

const terms = (raw: Record<string, number>): ReactionTerm[] => Object.entries(raw).map(([species, coefficient]) => ({ species, coefficient }));

/** Elements and charge of one side of a reaction, electrons included. */
function tally(side: ReactionTerm[], electrons: number, electrolyte: Pick<Electrolyte, 'formula' | 'charge'>): Map<string, number> {
  const out = new Map<string, number>([['charge', -electrons]]);
  for (const { species, coefficient } of side) {
    const formula = species === 'ion' ? electrolyte.formula : getSpecies(species).formula;
    for (const [element, count] of Object.entries(formula)) out.set(element, (out.get(element) ?? 0) + coefficient * count);
    if (species === 'ion') out.set('charge', out.get('charge')! + coefficient * electrolyte.charge);
  }
  return out;
}

/** Throws unless the reaction balances every element and the charge with ELECTRONS given up (fuel) or taken (air). */
function checkBalance(ion: string, where: string, reaction: ElectrodeReaction, electrolyte: Pick<Electrolyte, 'formula' | 'charge'>): void {
  const left = tally(reaction.consumes, where === 'air' ? ELECTRONS : 0, electrolyte);
  const right = tally(reaction.forms, where === 'fuel' ? ELECTRONS : 0, electrolyte);
  for (const key of new Set([...left.keys(), ...right.keys()])) {
    if (Math.abs((left.get(key) ?? 0) - (right.get(key) ?? 0)) > 1e-12) {
      throw new Error(`lib/electrochem/data/electrolytes.yaml: the ${where}-electrode reaction of ${ion} does not balance ${key === 'charge' ? 'the charge' : key}`);
    }
  }
}

let table: Map<Ion, Electrolyte> | undefined;

function electrolytes(): Map<Ion, Electrolyte> {
  if (table) return table;
  const raw = readDataFile(new URL('./data/electrolytes.yaml', import.meta.url), z.record(z.enum(IONS), RawElectrolyte));
  table = new Map(
    IONS.map((ion) => {
      const r = raw[ion];
      const e: Electrolyte = {
        ion,
        name: r.name,
        tex: r.tex,
        formula: r.formula,
        charge: r.charge,
        electrolyteWater: r['electrolyte-water'] === true,
        fuel: { consumes: terms(r['fuel-electrode'].consumes), forms: terms(r['fuel-electrode'].forms) },
        air: { consumes: terms(r['air-electrode'].consumes), forms: terms(r['air-electrode'].forms) },
      };
      checkBalance(ion, 'fuel', e.fuel, e);
      checkBalance(ion, 'air', e.air, e);
      return [ion, e];
    }),
  );
  return table;
}

export function electrolyte(ion: Ion): Electrolyte {
  return electrolytes().get(ion)!;
}

/** Whether a species of the reactions is a gas at its electrode (not the ion, not electrolyte water). */
export function isElectrodeGas(e: Electrolyte, species: string): boolean {
  return species !== 'ion' && !(e.electrolyteWater && species === 'H2O');
}

/**
 * Every factor of the Nernst quotient of the ion, in the order the method writes it: what the
 * fuel and then the air electrode consume (above the fraction bar), then what they form (below).
 */
export function nernstQuotient(ion: Ion): QuotientTerm[] {
  const e = electrolyte(ion);
  const factors = (side: 'consumes' | 'forms', sign: 1 | -1): QuotientTerm[] =>
    (['f', 'a'] as const).flatMap((electrode) =>
      e[electrode === 'f' ? 'fuel' : 'air'][side]
        .filter((t) => isElectrodeGas(e, t.species))
        .map((t) => ({ species: t.species, electrode, power: sign * t.coefficient, water: t.species === 'H2O' })),
    );
  return [...factors('consumes', 1), ...factors('forms', -1)];
}

/**
 * The gases of the air-electrode reaction where it forms the ion from electrode gases alone
 * (oxide: ½O2; carbonate: ½O2 and CO2), with their coefficients for two electrons; null where the
 * air electrode consumes the ion (proton, hydroxide). Written at both electrodes, with the ion's
 * electrochemical potential the same at both interfaces, this reaction gives
 * 2FE = Σ ν_i (μ_i,a − μ_i,f) over these gases: the ion's own couple fixes E for any fuel gas
 * whose potentials of these gases are defined (an equilibrated one).
 */
export function potentialCouple(ion: Ion): ReactionTerm[] | null {
  const e = electrolyte(ion);
  const formsIonAlone = e.air.forms.length === 1 && e.air.forms[0]!.species === 'ion';
  const fromGases = e.air.consumes.every((t) => isElectrodeGas(e, t.species));
  return formsIonAlone && fromGases ? e.air.consumes : null;
}

/** The quotient's factors that count for the cell: water terms drop out with liquid water. */
export function activeQuotient(ion: Ion, waterPhase: 'gas' | 'liquid'): QuotientTerm[] {
  return nernstQuotient(ion).filter((t) => !(t.water && waterPhase === 'liquid'));
}
