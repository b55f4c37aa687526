/**
 * Section 4, the assumptions: each with its id, text and reference (resolved to its citation),
 * open items flagged as still to be verified and counted, so that a reviewer sees at once what
 * the results still depend on; an open item accepted for approval shows who accepted it, when
 * and why.
 */
import type { DesignBasis } from '../../basis/types.ts';

export interface AssumptionItem {
  id: string;
  text: string;
  open: boolean;
  status: string;
  /** For an open assumption accepted for approval: "Accepted open by K. Varga on 2026-05-18: <reason>"; else "". */
  acceptance: string;
  reference: string;
}

export interface AssumptionsSection {
  items: AssumptionItem[];
  openCount: number;
  /** How many of the open ones are accepted for approval. */
  acceptedCount: number;
  total: number;
}

export function assumptionsSection(basis: DesignBasis): AssumptionsSection {
  const items = basis.assumptions.map((a) => {
    const ref = a.reference === undefined ? undefined : basis.references.find((r) => r.id === a.reference);
    return {
      id: a.id,
      text: a.text,
      open: a.open,
      status: a.open ? (a.accepted ? 'open, accepted for approval' : 'open: to be verified') : 'confirmed',
      acceptance: a.open && a.accepted ? `Accepted open by ${a.accepted.by} on ${a.accepted.date}: ${a.accepted.reason}` : '',
      reference: ref ? `${ref.id}: ${ref.citation}` : (a.reference ?? ''),
    };
  });
  return { items, openCount: items.filter((a) => a.open).length, acceptedCount: items.filter((a) => a.acceptance !== '').length, total: items.length };
}
