/**
 * Chemical equations as text: `CH4 + 2 O2 -> CO2 + 2 H2O`, `H2 + 1/2 O2 -> H2O(L)`.
 * Coefficients may be integers, decimals or fractions; arrows `->`, `→`, `=`, `<=>`, `⇌`.
 * The parsed equation is checked for element balance.
 */
import { getSpecies, type Species } from '../thermo/species-data.ts';
import { UserError } from '../core/errors.ts';

export interface Term {
  species: Species;
  /** Stoichiometric coefficient, positive for products, negative for reactants. */
  nu: number;
}

export interface Equation {
  terms: Term[];
  /** Normalised text, e.g. "CH4 + 2 O2 -> CO2 + 2 H2O". */
  text: string;
}

const ARROW = /\s*(?:<=>|<->|⇌|->|→|=)\s*/;

function parseCoefficient(raw: string, equation: string): number {
  const [num, den] = raw.split('/');
  const value = den === undefined ? Number(num) : Number(num) / Number(den);
  if (!Number.isFinite(value) || value <= 0) {
    throw new UserError(`equation "${equation}": coefficient "${raw}" is not a positive number`);
  }
  return value;
}

function parseSide(side: string, sign: 1 | -1, equation: string): Term[] {
  if (side.trim() === '') throw new UserError(`equation "${equation}": one side of the arrow is empty`);
  return side.split(/\s+\+\s+|^\+\s*|\s*\+$/).filter((t) => t.trim() !== '').map((termText) => {
    const match = /^\s*(\d+(?:\.\d+)?(?:\s*\/\s*\d+(?:\.\d+)?)?)?\s*(\S+)\s*$/.exec(termText);
    if (!match) throw new UserError(`equation "${equation}": cannot read the term "${termText.trim()}"`);
    const coefficient = match[1] === undefined ? 1 : parseCoefficient(match[1].replace(/\s+/g, ''), equation);
    return { species: getSpecies(match[2]!), nu: sign * coefficient };
  });
}

function formatCoefficient(value: number): string {
  return Math.abs(value - 1) < 1e-12 ? '' : `${Number(value.toPrecision(12))} `;
}

/** Element totals Σ ν_i a_ij of the equation (zero for a balanced one). */
function elementImbalance(terms: readonly Term[]): Map<string, number> {
  const totals = new Map<string, number>();
  for (const { species, nu } of terms) {
    for (const [element, count] of Object.entries(species.formula)) {
      totals.set(element, (totals.get(element) ?? 0) + nu * count);
    }
  }
  return totals;
}

export function parseEquation(text: string): Equation {
  const sides = text.split(ARROW);
  if (sides.length !== 2) {
    throw new UserError(`equation "${text}": expected one arrow between reactants and products, such as "H2 + 0.5 O2 -> H2O"`);
  }
  const terms = [...parseSide(sides[0]!, -1, text), ...parseSide(sides[1]!, 1, text)];
  // Merge repeated species so each appears once with its net coefficient.
  const merged = new Map<string, Term>();
  for (const term of terms) {
    const seen = merged.get(term.species.label);
    if (seen) seen.nu += term.nu;
    else merged.set(term.species.label, { ...term });
  }
  const net = [...merged.values()].filter((t) => Math.abs(t.nu) > 1e-12);
  for (const [element, total] of elementImbalance(net)) {
    if (Math.abs(total) > 1e-9) {
      const products = net.filter((t) => t.nu > 0).reduce((s, t) => s + t.nu * (t.species.formula[element] ?? 0), 0);
      const reactants = products - total;
      throw new UserError(
        `equation "${text}" is not balanced: ${element} has ${Number(reactants.toPrecision(10))} atoms on the left and ${Number(products.toPrecision(10))} on the right (imbalance ${total > 0 ? '+' : ''}${Number(total.toPrecision(10))})`,
      );
    }
  }
  const side = (sign: number) =>
    net.filter((t) => Math.sign(t.nu) === sign).map((t) => `${formatCoefficient(Math.abs(t.nu))}${t.species.label}`).join(' + ');
  return { terms: net, text: `${side(-1)} -> ${side(1)}` };
}
