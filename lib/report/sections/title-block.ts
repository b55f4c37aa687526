/**
 * The title block: what the document is, its number and revision, the status stamp, who it is
 * for and where, and the sign-off table (prepared, checked, approved, each with a date or left
 * blank to be signed).
 */
import type { DesignBasis } from '../../basis/types.ts';
import type { Results } from '../../plant/results-schema.ts';
import { revisionDate, revisionLabel, stampFor, type RevisionContext, type Stamp } from '../revision.ts';

export interface SignOffRow {
  role: string;
  name: string;
  date: string;
}

export interface TitleBlock {
  title: string;
  number: string;
  revision: string;
  stamp: Stamp;
  client: string;
  site: string;
  subject: string;
  date: string;
  signOff: SignOffRow[];
  pdfHref: string | null;
  /** The words of the PDF link. */
  pdfLabel: string;
  toolLine: string;
}

const ROLES = [
  ['prepared', 'Prepared'],
  ['checked', 'Checked'],
  ['approved', 'Approved'],
] as const;

export function titleBlock(basis: DesignBasis, results: Results, revision: RevisionContext): TitleBlock {
  const doc = basis.document;
  return {
    title: doc.title,
    number: doc.number,
    revision: revisionLabel(revision, doc.revision),
    stamp: stampFor(revision, doc.status, doc.revision),
    client: doc.client,
    site: doc.site,
    subject: `${results.technology.name} cells, ${results.technology.mode === 'power' ? 'power generation' : 'electrolysis'}`,
    date: revisionDate(revision) ?? 'undated',
    signOff: ROLES.map(([key, role]) => {
      const s = doc.signOff[key];
      return { role, name: s?.name ?? '', date: s?.date ?? '' };
    }),
    pdfHref: revision.pdfHref ?? null,
    pdfLabel: revision.kind === 'sealed' ? 'The sealed PDF of this revision' : 'This draft as PDF (not issued)',
    toolLine: `Calculated by ${results.tool.name} ${results.tool.version}; species data SHA-256 ${results.speciesData_sha256.slice(0, 16)}…`,
  };
}
