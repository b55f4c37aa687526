/**
 * The electrode reactions of each electrolyte in the form the method section derives the Nernst
 * equation from, written as LaTeX from the one per-ion table (lib/electrochem/electrolytes.ts,
 * which the Nernst quotient and the fuel path's exchange read too), in power mode: the fuel
 * electrode (f) gives up electrons, the air electrode (a) takes them. Each equilibrium is written
 * as a balance of (electro)chemical potentials, the ion's electrochemical potential being the
 * same at both interfaces; their sum is the Gibbs energy change of the overall reaction.
 */
import { ELECTRONS, electrolyte, isElectrodeGas, potentialCouple, type Electrode, type Electrolyte, type ReactionTerm } from '../electrochem/electrolytes.ts';
import type { Ion } from '../electrochem/technologies.ts';
import { texSpecies } from './tex.ts';

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
  /**
   * For an ion the air electrode forms from its gases alone (its couple, electrolytes.ts): that
   * reaction's balance written at the fuel electrode, and the difference of the two balances,
   * which gives E from the couple's chemical potentials; null for other ions.
   */
  couple: { fuelBalance: string; difference: string } | null;
}

/** Electrochemical potential of the electrons at each electrode. */
const ELECTRON_POTENTIAL: Record<Electrode, string> = { f: '\\tilde{\\mu}_{e^-,\\mathrm{f}}', a: '\\tilde{\\mu}_{e^-,\\mathrm{a}}' };
const ELECTRONS_TEX = `${ELECTRONS}\\,e^-`;

/** A formula of the reactions, one-digit subscripts written bare: H2O → \mathrm{H_2O}. */
const formula = (label: string) => `\\mathrm{${label.replace(/(\d)/g, '_$1')}}`;

/** A coefficient before a species: none for 1, ½ as \tfrac{1}{2}, others as numbers. */
const coefficient = (c: number) => (c === 1 ? '' : c === 0.5 ? '\\tfrac{1}{2}\\,' : `${c}\\,`);

/** A species of the ion's reactions as a formula: the ion itself, or a gas or water. */
const speciesTex = (e: Electrolyte, species: string) => (species === 'ion' ? `\\mathrm{${e.tex}}` : formula(species));

/** The chemical potential of a species at an electrode (the ion's electrochemical one; electrolyte water's without an electrode). */
function potential(e: Electrolyte, species: string, electrode: Electrode): string {
  if (species === 'ion') return `\\tilde{\\mu}_{${speciesTex(e, species)}}`;
  return isElectrodeGas(e, species) ? `\\mu_{${formula(species)},\\mathrm{${electrode}}}` : `\\mu_{${formula(species)}}`;
}

const side = (terms: ReactionTerm[], show: (species: string) => string, electrons: string | null) =>
  [...terms.map((t) => `${coefficient(t.coefficient)}${show(t.species)}`), ...(electrons ? [electrons] : [])].join(' + ');

/** One net term of the overall reaction: a species where it is (an electrode, or the electrolyte), and its net amount (+ formed, − consumed). */
interface Net {
  species: string;
  electrode: Electrode | null;
  amount: number;
}

/** The overall reaction, the ion cancelled and what one electrode forms and the other takes netted. */
function overallTerms(e: Electrolyte): Net[] {
  const net: Net[] = [];
  const add = (terms: ReactionTerm[], electrode: Electrode, sign: 1 | -1) => {
    for (const t of terms) {
      if (t.species === 'ion') continue;
      const where = isElectrodeGas(e, t.species) ? electrode : null;
      const found = net.find((n) => n.species === t.species && n.electrode === where);
      if (found) found.amount += sign * t.coefficient;
      else net.push({ species: t.species, electrode: where, amount: sign * t.coefficient });
    }
  };
  add(e.fuel.forms, 'f', 1);
  add(e.air.forms, 'a', 1);
  add(e.fuel.consumes, 'f', -1);
  add(e.air.consumes, 'a', -1);
  return net.filter((n) => n.amount !== 0);
}

/** 2(μ̃e,a − μ̃e,f) = Σ formed − Σ consumed, in chemical potentials. */
function sumTex(e: Electrolyte, net: Net[]): string {
  const mu = (n: Net) => `${coefficient(Math.abs(n.amount))}${n.electrode ? potential(e, n.species, n.electrode) : potential(e, n.species, 'f')}`;
  const formed = net.filter((n) => n.amount > 0).map(mu).join(' + ');
  const consumed = net.filter((n) => n.amount < 0).map((n) => ` - ${mu(n)}`).join('');
  return `${ELECTRONS}\\left(${ELECTRON_POTENTIAL.a}-${ELECTRON_POTENTIAL.f}\\right) = ${formed}${consumed}`;
}

/** The overall reaction; a gas that stands at both electrodes (CO2 of the carbonate ion) is marked with its electrode. */
function overallTex(net: Net[]): string {
  const twice = (n: Net) => net.filter((m) => m.species === n.species).length > 1;
  const show = (n: Net) => `${coefficient(Math.abs(n.amount))}${twice(n) ? `${texSpecies(n.species)}_{,\\mathrm{${n.electrode}}}` : formula(n.species)}`;
  return `${net.filter((n) => n.amount < 0).map(show).join(' + ')} \\rightarrow ${net.filter((n) => n.amount > 0).map(show).join(' + ')}`;
}

/** The couple's balances (ElectrodeReactions.couple): the air-electrode reaction at the fuel electrode, and 2(μ̃e,a − μ̃e,f) = Σ ν (μ_i,f − μ_i,a). */
function coupleTex(e: Electrolyte): ElectrodeReactions['couple'] {
  const gases = potentialCouple(e.ion);
  if (!gases) return null;
  const fuelBalance = `${side(e.air.consumes, (s) => potential(e, s, 'f'), `${ELECTRONS}\\,${ELECTRON_POTENTIAL.f}`)} = ${side(e.air.forms, (s) => potential(e, s, 'f'), null)}`;
  const terms = gases.map((t) => `${coefficient(t.coefficient)}\\left(${potential(e, t.species, 'f')} - ${potential(e, t.species, 'a')}\\right)`).join(' + ');
  return { fuelBalance, difference: `${ELECTRONS}\\left(${ELECTRON_POTENTIAL.a}-${ELECTRON_POTENTIAL.f}\\right) = ${terms}` };
}

const cache = new Map<Ion, ElectrodeReactions>();

export function electrodeReactions(ion: Ion): ElectrodeReactions {
  const cached = cache.get(ion);
  if (cached) return cached;
  const e = electrolyte(ion);
  const net = overallTerms(e);
  const show = (s: string) => speciesTex(e, s);
  const reactions: ElectrodeReactions = {
    ion,
    ionName: e.name,
    ionTex: `\\mathrm{${e.tex}}`,
    fuelReaction: `${side(e.fuel.consumes, show, null)} \\rightleftharpoons ${side(e.fuel.forms, show, ELECTRONS_TEX)}`,
    airReaction: `${side(e.air.consumes, show, ELECTRONS_TEX)} \\rightleftharpoons ${side(e.air.forms, show, null)}`,
    fuelBalance: `${side(e.fuel.consumes, (s) => potential(e, s, 'f'), null)} = ${side(e.fuel.forms, (s) => potential(e, s, 'f'), `${ELECTRONS}\\,${ELECTRON_POTENTIAL.f}`)}`,
    airBalance: `${side(e.air.consumes, (s) => potential(e, s, 'a'), `${ELECTRONS}\\,${ELECTRON_POTENTIAL.a}`)} = ${side(e.air.forms, (s) => potential(e, s, 'a'), null)}`,
    sum: sumTex(e, net),
    overall: overallTex(net),
    waterElectrode: e.fuel.forms.some((t) => t.species === 'H2O') ? 'f' : 'a',
    couple: coupleTex(e),
  };
  cache.set(ion, reactions);
  return reactions;
}
