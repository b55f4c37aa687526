/**
 * The electrode reactions of each electrolyte in the form the method section derives the Nernst
 * equation from (the same half-reactions as lib/equilibrium/electrolyte-exchange.ts and the same
 * pressure quotient as lib/electrochem/nernst.ts), written in power mode: the fuel electrode (f)
 * gives up electrons, the air electrode (a) takes them. Each equilibrium is written as a balance
 * of (electro)chemical potentials, the ion's electrochemical potential being the same at both
 * interfaces.
 */
import type { Ion } from '../electrochem/technologies.ts';
import type { Electrode } from './tex.ts';

/** One factor of the Nernst pressure quotient: p^power of a species at an electrode. */
export interface QuotientTerm {
  species: string;
  electrode: Electrode;
  /** Exponent: +1 and +1/2 above the fraction bar, −1 below. */
  power: 1 | 0.5 | -1;
  /** A water term, dropped where the cell runs with liquid water (activity 1). */
  water: boolean;
}

export interface ElectrodeReactions {
  ion: Ion;
  /** The ion as words and as LaTeX. */
  ionName: string;
  ionTex: string;
  fuelReaction: string;
  airReaction: string;
  /** Potential balances at the fuel and the air electrode. */
  fuelBalance: string;
  airBalance: string;
  /** Their sum: 2(μ̃e,a − μ̃e,f) = products − reactants. */
  sum: string;
  /** The overall reaction whose Gibbs energy the sum is. */
  overall: string;
  /** Where water forms in power mode. */
  waterElectrode: Electrode;
  quotient: QuotientTerm[];
}

const E = '\\tilde{\\mu}_{e^-,\\mathrm{f}}';
const EA = '\\tilde{\\mu}_{e^-,\\mathrm{a}}';
const HYDROGEN = '\\mathrm{H_2} + \\tfrac{1}{2}\\,\\mathrm{O_2} \\rightarrow \\mathrm{H_2O}';
const ELECTRONS = `2\\left(${EA}-${E}\\right)`;

const TABLE: Record<Ion, ElectrodeReactions> = {
  oxide: {
    ion: 'oxide',
    ionName: 'oxide ion',
    ionTex: '\\mathrm{O^{2-}}',
    fuelReaction: '\\mathrm{H_2} + \\mathrm{O^{2-}} \\rightleftharpoons \\mathrm{H_2O} + 2\\,e^-',
    airReaction: '\\tfrac{1}{2}\\,\\mathrm{O_2} + 2\\,e^- \\rightleftharpoons \\mathrm{O^{2-}}',
    fuelBalance: `\\mu_{\\mathrm{H_2},\\mathrm{f}} + \\tilde{\\mu}_{\\mathrm{O^{2-}}} = \\mu_{\\mathrm{H_2O},\\mathrm{f}} + 2\\,${E}`,
    airBalance: `\\tfrac{1}{2}\\,\\mu_{\\mathrm{O_2},\\mathrm{a}} + 2\\,${EA} = \\tilde{\\mu}_{\\mathrm{O^{2-}}}`,
    sum: `${ELECTRONS} = \\mu_{\\mathrm{H_2O},\\mathrm{f}} - \\mu_{\\mathrm{H_2},\\mathrm{f}} - \\tfrac{1}{2}\\,\\mu_{\\mathrm{O_2},\\mathrm{a}}`,
    overall: HYDROGEN,
    waterElectrode: 'f',
    quotient: [
      { species: 'H2', electrode: 'f', power: 1, water: false },
      { species: 'O2', electrode: 'a', power: 0.5, water: false },
      { species: 'H2O', electrode: 'f', power: -1, water: true },
    ],
  },
  proton: {
    ion: 'proton',
    ionName: 'proton',
    ionTex: '\\mathrm{H^{+}}',
    fuelReaction: '\\mathrm{H_2} \\rightleftharpoons 2\\,\\mathrm{H^{+}} + 2\\,e^-',
    airReaction: '\\tfrac{1}{2}\\,\\mathrm{O_2} + 2\\,\\mathrm{H^{+}} + 2\\,e^- \\rightleftharpoons \\mathrm{H_2O}',
    fuelBalance: `\\mu_{\\mathrm{H_2},\\mathrm{f}} = 2\\,\\tilde{\\mu}_{\\mathrm{H^{+}}} + 2\\,${E}`,
    airBalance: `\\tfrac{1}{2}\\,\\mu_{\\mathrm{O_2},\\mathrm{a}} + 2\\,\\tilde{\\mu}_{\\mathrm{H^{+}}} + 2\\,${EA} = \\mu_{\\mathrm{H_2O},\\mathrm{a}}`,
    sum: `${ELECTRONS} = \\mu_{\\mathrm{H_2O},\\mathrm{a}} - \\mu_{\\mathrm{H_2},\\mathrm{f}} - \\tfrac{1}{2}\\,\\mu_{\\mathrm{O_2},\\mathrm{a}}`,
    overall: HYDROGEN,
    waterElectrode: 'a',
    quotient: [
      { species: 'H2', electrode: 'f', power: 1, water: false },
      { species: 'O2', electrode: 'a', power: 0.5, water: false },
      { species: 'H2O', electrode: 'a', power: -1, water: true },
    ],
  },
  carbonate: {
    ion: 'carbonate',
    ionName: 'carbonate ion',
    ionTex: '\\mathrm{CO_3^{2-}}',
    fuelReaction: '\\mathrm{H_2} + \\mathrm{CO_3^{2-}} \\rightleftharpoons \\mathrm{H_2O} + \\mathrm{CO_2} + 2\\,e^-',
    airReaction: '\\tfrac{1}{2}\\,\\mathrm{O_2} + \\mathrm{CO_2} + 2\\,e^- \\rightleftharpoons \\mathrm{CO_3^{2-}}',
    fuelBalance: `\\mu_{\\mathrm{H_2},\\mathrm{f}} + \\tilde{\\mu}_{\\mathrm{CO_3^{2-}}} = \\mu_{\\mathrm{H_2O},\\mathrm{f}} + \\mu_{\\mathrm{CO_2},\\mathrm{f}} + 2\\,${E}`,
    airBalance: `\\tfrac{1}{2}\\,\\mu_{\\mathrm{O_2},\\mathrm{a}} + \\mu_{\\mathrm{CO_2},\\mathrm{a}} + 2\\,${EA} = \\tilde{\\mu}_{\\mathrm{CO_3^{2-}}}`,
    sum: `${ELECTRONS} = \\mu_{\\mathrm{H_2O},\\mathrm{f}} + \\mu_{\\mathrm{CO_2},\\mathrm{f}} - \\mu_{\\mathrm{H_2},\\mathrm{f}} - \\tfrac{1}{2}\\,\\mu_{\\mathrm{O_2},\\mathrm{a}} - \\mu_{\\mathrm{CO_2},\\mathrm{a}}`,
    overall: '\\mathrm{H_2} + \\tfrac{1}{2}\\,\\mathrm{O_2} + \\mathrm{CO_{2}}_{,\\mathrm{a}} \\rightarrow \\mathrm{H_2O} + \\mathrm{CO_{2}}_{,\\mathrm{f}}',
    waterElectrode: 'f',
    quotient: [
      { species: 'H2', electrode: 'f', power: 1, water: false },
      { species: 'O2', electrode: 'a', power: 0.5, water: false },
      { species: 'CO2', electrode: 'a', power: 1, water: false },
      { species: 'H2O', electrode: 'f', power: -1, water: true },
      { species: 'CO2', electrode: 'f', power: -1, water: false },
    ],
  },
  hydroxide: {
    ion: 'hydroxide',
    ionName: 'hydroxide ion',
    ionTex: '\\mathrm{OH^{-}}',
    fuelReaction: '\\mathrm{H_2} + 2\\,\\mathrm{OH^{-}} \\rightleftharpoons 2\\,\\mathrm{H_2O} + 2\\,e^-',
    airReaction: '\\tfrac{1}{2}\\,\\mathrm{O_2} + \\mathrm{H_2O} + 2\\,e^- \\rightleftharpoons 2\\,\\mathrm{OH^{-}}',
    fuelBalance: `\\mu_{\\mathrm{H_2},\\mathrm{f}} + 2\\,\\tilde{\\mu}_{\\mathrm{OH^{-}}} = 2\\,\\mu_{\\mathrm{H_2O}} + 2\\,${E}`,
    airBalance: `\\tfrac{1}{2}\\,\\mu_{\\mathrm{O_2},\\mathrm{a}} + \\mu_{\\mathrm{H_2O}} + 2\\,${EA} = 2\\,\\tilde{\\mu}_{\\mathrm{OH^{-}}}`,
    sum: `${ELECTRONS} = \\mu_{\\mathrm{H_2O}} - \\mu_{\\mathrm{H_2},\\mathrm{f}} - \\tfrac{1}{2}\\,\\mu_{\\mathrm{O_2},\\mathrm{a}}`,
    overall: HYDROGEN,
    waterElectrode: 'f',
    quotient: [
      { species: 'H2', electrode: 'f', power: 1, water: false },
      { species: 'O2', electrode: 'a', power: 0.5, water: false },
    ],
  },
};

export function electrodeReactions(ion: Ion): ElectrodeReactions {
  return TABLE[ion];
}

/** The quotient's terms that count for the cell: water terms drop out with liquid water. */
export function activeQuotient(ion: Ion, waterPhase: 'gas' | 'liquid'): QuotientTerm[] {
  return TABLE[ion].quotient.filter((t) => !(t.water && waterPhase === 'liquid'));
}
