/**
 * Section 4, the assumptions: each with its id, text and reference (resolved to its citation),
 * open items flagged as still to be verified and counted, so that a reviewer sees at once what
 * the results still depend on.
 */
import type { DesignBasis } from '../../basis/types.ts';

export interface AssumptionItem {
  id: string;
  text: string;
  open: boolean;
  status: string;
  reference: string;
}

export interface AssumptionsSection {
  items: AssumptionItem[];
  openCount: number;
  total: number;
}

export function assumptionsSection(basis: DesignBasis): AssumptionsSection {
  const items = basis.assumptions.map((a) => {
    const ref = a.reference === undefined ? undefined : basis.references.find((r) => r.id === a.reference);
    return {
      id: a.id,
      text: a.text,
      open: a.open,
      status: a.open ? 'open: to be verified' : 'confirmed',
      reference: ref ? `${ref.id}: ${ref.citation}` : (a.reference ?? ''),
    };
  });
  return { items, openCount: items.filter((a) => a.open).length, total: items.length };
}
