/**
 * The sections of the design document, in order, with their anchors and titles. Numbers are
 * taken from here wherever a text refers to another section, so they cannot drift apart.
 */
export const OUTLINE = [
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
