/** Shared by the report tests: scaffold bases of several technologies, calculated once each. */
import { scaffoldText } from './scaffold-basis.ts';
import { loadBasisText } from '../../lib/basis/load.ts';
import type { DesignBasis } from '../../lib/basis/types.ts';
import type { Mode, TechnologyId } from '../../lib/electrochem/technologies.ts';
import { calculate } from '../../lib/plant/calculate.ts';
import type { Results } from '../../lib/plant/results-schema.ts';
import { documentView } from '../../lib/report/document.ts';

export interface Case {
  name: string;
  basis: DesignBasis;
  results: Results;
}

export const CASES: [TechnologyId, Mode][] = [
  ['solid-oxide', 'power'],
  ['solid-oxide', 'electrolysis'],
  ['molten-carbonate', 'power'],
  ['pem', 'power'],
  ['pem', 'electrolysis'],
  ['alkaline', 'electrolysis'],
  ['proton-ceramic', 'power'],
];

const cache = new Map<string, Case>();

/** A scaffold basis, its YAML edited by `edit`, loaded and calculated. */
export function scaffoldCase(technology: TechnologyId, mode: Mode, edit: (yaml: string) => string = (y) => y): Case {
  const key = `${technology}/${mode}/${edit.toString()}`;
  const cached = cache.get(key);
  if (cached) return cached;
  const text = edit(scaffoldText(technology, mode, 'demo'));
  const loaded = loadBasisText(text, 'projects/demo/basis.yaml', 'demo');
  if (!loaded.ok) throw new Error(loaded.errors.map((e) => `${e.path}: ${e.message}`).join('\n'));
  const one = { name: `${technology} ${mode}`, basis: loaded.basis, results: calculate(loaded.basis) };
  cache.set(key, one);
  return one;
}

/** Every string the document's view model hands the templates for a scaffold case, as one JSON text (for wording checks). */
export function documentText(technology: TechnologyId, mode: Mode, edit?: (yaml: string) => string): string {
  const c = scaffoldCase(technology, mode, edit);
  return JSON.stringify(documentView({ basis: c.basis, results: c.results, revision: { kind: 'draft', revision: 'A', lastIssued: null, date: null }, history: [] }, { assetBase: '' }));
}
