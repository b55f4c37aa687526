/**
 * The sections of the design document, in order, with their anchors and titles, and the
 * appendices after them (lettered: the long tables a reviewer consults rather than reads, whose
 * summary stands in the body). Numbers and letters are taken from here wherever a text refers to
 * another section, so they cannot drift apart.
 */
const OUTLINE = [
  { id: 'purpose', title: 'Purpose and scope' },
  { id: 'summary', title: 'Summary of results and conclusions' },
  { id: 'inputs', title: 'Design inputs' },
  { id: 'assumptions', title: 'Assumptions' },
  { id: 'method', title: 'Method of calculation' },
  { id: 'results', title: 'Results' },
  { id: 'cases', title: 'Operating cases and envelope' },
  { id: 'charts', title: 'Curves and sensitivity' },
  { id: 'hazards', title: 'Hazards and cautions' },
  { id: 'verification', title: 'Verification against published values' },
  { id: 'references', title: 'References' },
  { id: 'history', title: 'Revision history' },
] as const;

export type SectionId = (typeof OUTLINE)[number]['id'];

export function sectionNumber(id: SectionId): number {
  return OUTLINE.findIndex((s) => s.id === id) + 1;
}

export interface OutlineEntry {
  id: SectionId;
  number: number;
  title: string;
}

export function outline(): OutlineEntry[] {
  return OUTLINE.map((s, i) => ({ id: s.id, number: i + 1, title: s.title }));
}

const APPENDICES = [{ id: 'checks', title: 'Checks of the calculation library against published values' }] as const;

export type AppendixId = (typeof APPENDICES)[number]['id'];

export interface AppendixEntry {
  id: AppendixId;
  /** "A", "B", ... */
  letter: string;
  title: string;
}

export function appendices(): AppendixEntry[] {
  return APPENDICES.map((a, i) => ({ id: a.id, letter: String.fromCharCode(65 + i), title: a.title }));
}

/** The letter of an appendix, for texts that refer to it. */
export function appendixLetter(id: AppendixId): string {
  return String.fromCharCode(65 + APPENDICES.findIndex((a) => a.id === id));
}
