/**
 * Section 10, references: the project's own references (with what in the basis cites each), the
 * sources of the data and methods the calculation rests on, and the standards the hazard
 * cautions cite.
 */
import type { DesignBasis } from '../../basis/types.ts';
import type { HazardAssessment } from '../../hazards/types.ts';

export interface ReferenceItem {
  id: string;
  citation: string;
  citedBy: string;
}

export interface ReferencesSection {
  project: ReferenceItem[];
  method: ReferenceItem[];
  standards: ReferenceItem[];
}

/** The sources of the data and methods of cellbasis itself (named in the doc comments of lib/thermo, lib/electrochem, lib/equilibrium). */
const METHOD_SOURCES: ReferenceItem[] = [
  { id: 'M1', citation: 'B. J. McBride, M. J. Zehe and S. Gordon, NASA Glenn Coefficients for Calculating Thermodynamic Properties of Individual Species, NASA/TP-2002-211556 (2002)', citedBy: 'species data: enthalpy, entropy and Gibbs energy of every species' },
  { id: 'M2', citation: 'E. Tiesinga et al., CODATA recommended values of the fundamental physical constants: 2018, Rev. Mod. Phys. 93, 025010 (2021)', citedBy: 'F and R' },
  { id: 'M3', citation: 'J. Larminie and A. Dicks, Fuel Cell Systems Explained, 2nd ed., Wiley (2003)', citedBy: 'electrode reactions, efficiency and heat definitions' },
  { id: 'M4', citation: "R. O'Hayre, S.-W. Cha, W. G. Colella and F. B. Prinz, Fuel Cell Fundamentals, 3rd ed., Wiley (2016)", citedBy: 'Nernst equation, voltage model' },
  { id: 'M5', citation: 'J. R. Rostrup-Nielsen, Catalytic Steam Reforming, in Catalysis Science and Technology vol. 5, Springer (1984)', citedBy: 'carbon limits' },
  { id: 'M6', citation: 'ASME Y14.35, Revision of Engineering Drawings and Associated Documents', citedBy: 'revision identifiers' },
];

/**
 * Whether a source text cites a reference: its id as a whole token, at the start ("R3") or
 * inside a sentence ("R3, reciprocating compressor"; "set by the 7 K rise of R3"). A token
 * ends where no letter, digit or underscore follows, nor a "." or "-" joined to one, so R1
 * does not cite inside R10 or R1.2.
 */
function cites(text: string | undefined, id: string): boolean {
  if (text === undefined) return false;
  const escaped = id.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
  return new RegExp(`(?<![\\p{L}\\p{N}_.-])${escaped}(?![\\p{L}\\p{N}_]|[.-][\\p{L}\\p{N}])`, 'u').test(text);
}

function citers(basis: DesignBasis, id: string): string {
  const inputs = basis.inputs.filter((i) => cites(i.source, id)).map((i) => i.label);
  const assumptions = basis.assumptions.filter((a) => cites(a.reference, id)).map((a) => `assumption ${a.id}`);
  const list = [...assumptions, ...inputs];
  return list.length ? list.join('; ') : 'listed in the basis';
}

export function referencesSection(basis: DesignBasis, hazards: HazardAssessment): ReferencesSection {
  const standards = new Map<string, ReferenceItem>();
  for (const caution of hazards.cautions) {
    for (const s of caution.standards) {
      const item = standards.get(s.id) ?? { id: s.number, citation: `${s.title}, ${s.edition}`, citedBy: '' };
      item.citedBy = item.citedBy ? `${item.citedBy}; ${caution.title}` : caution.title;
      standards.set(s.id, item);
    }
  }
  return {
    project: basis.references.map((r) => ({ id: r.id, citation: r.citation, citedBy: citers(basis, r.id) })),
    method: METHOD_SOURCES,
    standards: [...standards.values()].sort((a, b) => a.id.localeCompare(b.id, 'en')),
  };
}
