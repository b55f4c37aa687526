/**
 * The chemical system of an equilibrium: every gas species of the species data made only of the
 * elements present in the feed (plus graphite as a possible pure condensed phase), with the
 * element-by-species formula matrix a_ij. Systems are cached by their element set.
 */
import { allSpecies, getSpecies, type Species } from '../thermo/species-data.ts';
import { gOverRT } from '../thermo/properties.ts';
import { UserError } from '../core/errors.ts';

export interface ChemicalSystem {
  elements: readonly string[];
  /** Gas species, in species-data order. */
  gas: readonly Species[];
  /** Formula matrix, row-major by species: a[j * elements.length + i] atoms of element i in gas species j. */
  a: Float64Array;
  /** Graphite, when carbon is among the elements. */
  graphite?: Species;
  /** Index of carbon in `elements`, or -1. */
  carbonIndex: number;
  /** Index of each gas species by label. */
  index: ReadonlyMap<string, number>;
}

const cache = new Map<string, ChemicalSystem>();

/**
 * The system for a set of element symbols (e.g. ["C", "H", "O", "N"]): every gas species of those
 * elements, or only the labels in `only` when given.
 */
export function systemFor(elements: Iterable<string>, only?: readonly string[]): ChemicalSystem {
  const sorted = [...new Set(elements)].sort();
  const restrict = only ? new Set(only.map((name) => getSpecies(name).label)) : undefined;
  const key = `${sorted.join(',')}|${restrict ? [...restrict].sort().join(',') : '*'}`;
  const cached = cache.get(key);
  if (cached) return cached;
  if (sorted.length === 0) throw new UserError('the feed contains no elements to balance');
  const present = new Set(sorted);
  const gas = allSpecies().filter(
    (s) => s.phase === 'gas' && s.elements.length > 0 && s.elements.every((e) => present.has(e)) && (!restrict || restrict.has(s.label)),
  );
  for (const element of sorted) {
    if (!gas.some((s) => s.elements.includes(element))) {
      throw new UserError(`no gas species in the species data contains the element ${element}`);
    }
  }
  const ne = sorted.length;
  const a = new Float64Array(gas.length * ne);
  gas.forEach((s, j) => sorted.forEach((e, i) => (a[j * ne + i] = s.formula[e] ?? 0)));
  const system: ChemicalSystem = {
    elements: sorted,
    gas,
    a,
    carbonIndex: sorted.indexOf('C'),
    index: new Map(gas.map((s, j) => [s.label, j])),
    ...(present.has('C') ? { graphite: getSpecies('C(gr)') } : {}),
  };
  cache.set(key, system);
  return system;
}

/** The element of its own that an inert species is given: "[N2]". */
function inertElement(label: string): string {
  return `[${label}]`;
}

/**
 * The system of a feed of which some species are inert: they take no part in any reaction but
 * count in the gas total, so they dilute the others. Each inert species holds an element of its
 * own, "[N2]", that no other species holds, and nothing else: the element balance then keeps its
 * amount at the feed's, and the minimiser treats it as it treats argon. The reacting species are
 * those of `systemFor` over `elements` (the elements of the feed's reacting part), the inert
 * labels left out of them. Not cached: the set of inert species is the caller's choice.
 */
export function systemWithInerts(elements: Iterable<string>, inert: readonly string[], only?: readonly string[]): ChemicalSystem {
  const labels = [...new Set(inert.map((name) => getSpecies(name).label))];
  const reacting = systemFor(elements, only);
  const gasReacting = reacting.gas.filter((s) => !labels.includes(s.label));
  const inertSpecies = labels.map((l) => getSpecies(l));
  const names = [...reacting.elements, ...labels.map(inertElement)];
  const gas = [...gasReacting, ...inertSpecies];
  const ne = names.length;
  const a = new Float64Array(gas.length * ne);
  gasReacting.forEach((s, j) => reacting.elements.forEach((e, i) => (a[j * ne + i] = s.formula[e] ?? 0)));
  inertSpecies.forEach((s, k) => (a[(gasReacting.length + k) * ne + reacting.elements.length + k] = 1));
  for (const element of reacting.elements) {
    if (!gasReacting.some((s) => (s.formula[element] ?? 0) > 0)) throw new UserError(`with ${labels.join(', ')} inert, no reacting gas species contains the element ${element}`);
  }
  return {
    elements: names,
    gas,
    a,
    carbonIndex: names.indexOf('C'),
    index: new Map(gas.map((s, j) => [s.label, j])),
    ...(reacting.graphite ? { graphite: reacting.graphite } : {}),
  };
}

/** The elements of a feed given as species label → amount. */
export function elementsOfFeed(feed: Readonly<Record<string, number>>): string[] {
  const elements = new Set<string>();
  for (const [name, amount] of Object.entries(feed)) {
    if (amount > 0) for (const e of getSpecies(name).elements) elements.add(e);
  }
  return [...elements];
}

/** Element amounts b_i (mol) of a feed in the system's element order. */
export function elementAmounts(system: ChemicalSystem, feed: Readonly<Record<string, number>>): Float64Array {
  const b = new Float64Array(system.elements.length);
  for (const [name, amount] of Object.entries(feed)) {
    if (amount === 0) continue;
    const species = getSpecies(name);
    const inert = system.elements.indexOf(inertElement(species.label));
    if (inert >= 0) {
      b[inert] = b[inert]! + amount;
      continue;
    }
    for (const [element, count] of Object.entries(species.formula)) {
      const i = system.elements.indexOf(element);
      if (i < 0) throw new Error(`element ${element} of ${species.label} is not in the system`);
      b[i] = b[i]! + count * amount;
    }
  }
  return b;
}

const lastGibbs = new WeakMap<ChemicalSystem, { temperatureK: number; g: Float64Array }>();

/**
 * Standard chemical potentials g°_j/RT of the system's gas species at T (the last temperature
 * of each system is remembered: a fuel path or a sweep at one temperature reuses it).
 * The array returned must not be modified.
 */
export function gasGibbsOverRT(system: ChemicalSystem, temperatureK: number): Float64Array {
  const last = lastGibbs.get(system);
  if (last && last.temperatureK === temperatureK) return last.g;
  const g = new Float64Array(system.gas.length);
  system.gas.forEach((s, j) => (g[j] = gOverRT(s, temperatureK)));
  lastGibbs.set(system, { temperatureK, g });
  return g;
}
