/**
 * The title block: what the document is, its number and revision, the status mark, who it is
 * for and where, and the sign-off table (prepared, checked, approved, each with a date or left
 * blank to be signed, and, for an issued revision, the key that signed its manifest for that
 * role). Nothing here is, or looks like, a licensed engineer's seal: where local law requires
 * one, it is applied under that engineer's own procedures.
 */
import type { DesignBasis } from '../../basis/types.ts';
import type { Results } from '../../plant/results-schema.ts';
import { draftSignOffDate, revisionDate, revisionLabel, shortFingerprint, statusMarkFor, type RevisionContext, type StatusMark } from '../revision.ts';

export interface SignOffRow {
  role: string;
  name: string;
  date: string;
  /** For an issued revision signed for this role: the key and its fingerprint; else "". */
  signature: string;
}

export interface TitleBlock {
  title: string;
  number: string;
  revision: string;
  statusMark: StatusMark;
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
    revision: revisionLabel(revision),
    statusMark: statusMarkFor(revision),
    client: doc.client,
    site: doc.site,
    subject: `${results.technology.name} cells, ${results.technology.mode === 'power' ? 'power generation' : 'electrolysis'}`,
    date: revisionDate(revision) ?? 'undated',
    signOff: ROLES.map(([key, role]) => {
      const s = doc.signOff[key];
      const signed = revision.kind === 'issued' ? revision.signatures.find((x) => x.role === key) : undefined;
      const signature = signed ? `Ed25519 signature of the manifest, key ${signed.key} (fingerprint ${shortFingerprint(signed.fingerprint)})` : '';
      const date = s?.date ?? '';
      return { role, name: s?.name ?? '', date: revision.kind === 'draft' ? draftSignOffDate(date, revision.lastIssued) : date, signature };
    }),
    pdfHref: revision.pdfHref ?? null,
    pdfLabel: revision.kind === 'issued' ? 'The issued PDF of this revision' : 'This draft as PDF (not issued)',
    toolLine: `Calculated by ${results.tool.name} ${results.tool.version}; species data SHA-256 ${results.speciesData_sha256.slice(0, 16)}…`,
  };
}
