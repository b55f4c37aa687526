/**
 * The view model of an issued revision's page in the site: the register entry of the revision,
 * not the document. The document itself is the file issued (document.html and document.pdf
 * beside the page, copied byte for byte from projects/<id>/issued/<rev>/), never rendered again,
 * so nothing a later library, species data or template changes can alter what was issued. The
 * page says what the document cannot say of itself: whether a later revision supersedes it.
 * Its status, date, note, sign-off, signatures and change summary are those of the manifest and
 * of the comparison with the revision before (lib/archive/compare.ts), never a recalculation.
 */
import type { IssueStatus } from '../basis/revisions.ts';
import { ASSETS, assetLinks, type AssetLinks } from './assets.ts';
import { relativeHref, rootPrefix } from './links.ts';
import { pairsTable, textPair, type Table } from './table.ts';
import { shortFingerprint, statusWords, type SignatureFacts } from './revision.ts';
import type { IssuedFacts } from './history.ts';
import type { SignOffRow } from './sections/title-block.ts';

export interface RevisionPageInput {
  projectId: string;
  number: string;
  title: string;
  client: string;
  site: string;
  revision: string;
  manifest: IssuedFacts & { toolVersion: string; chromium: string | null };
  manifestSha256: string;
  /** The revision before it and what changed from it; null for the first. */
  previous: { revision: string; changes: string[] } | null;
  /** The revision that supersedes it, or null for the current one. */
  supersededBy: { revision: string; issuedOn: string; path: string } | null;
  /** Site paths. */
  pagePath: string;
  draftPath: string;
  /** The revision will show its document and PDF beside the page, where it has them. */
  hasDocument: boolean;
  hasPdf: boolean;
  /** Site path of the index. */
  indexPath: string;
  /** The revision the working draft becomes when next issued. */
  draftRevision: string;
}

export interface RevisionPageView {
  pagePath: string;
  pageTitle: string;
  assets: AssetLinks;
  indexHref: string;
  heading: string;
  statusMark: { kind: 'issued' | 'approved' | 'superseded'; text: string; detail: string };
  facts: Table;
  signOff: SignOffRow[];
  documentHref: string | null;
  pdfHref: string | null;
  /** The current revision's page, where this one is superseded. */
  currentHref: string | null;
  currentLabel: string;
  draftHref: string;
  draftLabel: string;
  changes: { from: string; lines: string[] } | null;
  auditCommand: string;
}

const ROLES = [
  ['prepared', 'Prepared'],
  ['checked', 'Checked'],
  ['approved', 'Approved'],
] as const;

function mark(status: IssueStatus, revision: string, issuedOn: string, supersededBy: RevisionPageInput['supersededBy']): RevisionPageView['statusMark'] {
  if (supersededBy) {
    return { kind: 'superseded', text: 'Superseded', detail: `Revision ${revision}, ${status} on ${issuedOn}; superseded by revision ${supersededBy.revision} on ${supersededBy.issuedOn}` };
  }
  return { kind: status === 'approved' ? 'approved' : 'issued', text: statusWords(status), detail: `Revision ${revision}, issued ${issuedOn}; the current revision` };
}

export function revisionPageView(input: RevisionPageInput): RevisionPageView {
  const m = input.manifest;
  const link = (path: string) => relativeHref(input.pagePath, path);
  const facts: [string, string][] = [
    ['Document number', input.number],
    ['Revision', input.revision],
    ['Status', input.supersededBy ? `${m.status}, superseded by revision ${input.supersededBy.revision}` : m.status],
    ['Issued', m.issuedOn],
    ['Note', m.note || 'none'],
    ['Client', input.client],
    ['Site', input.site],
    ['Calculated by', `cellbasis ${m.toolVersion}${m.chromium ? `, printed by Chromium ${m.chromium}` : ''}`],
    ['Manifest SHA-256', input.manifestSha256],
  ];
  return {
    pagePath: input.pagePath,
    pageTitle: `${input.number} revision ${input.revision}: ${input.title}`,
    // The register page has no charts: the style sheets and our script, which marks the page ready for printing.
    assets: { stylesheets: assetLinks(`${rootPrefix(input.pagePath)}assets/`).stylesheets, scripts: [`${rootPrefix(input.pagePath)}assets/${ASSETS.chartsScript}`] },
    indexHref: link(input.indexPath),
    heading: input.title,
    statusMark: mark(m.status, input.revision, m.issuedOn, input.supersededBy),
    facts: pairsTable('revision-facts', 'The revision as issued', facts.map(([label, text]) => textPair(label, text)), ['Field', 'As issued'], 'left'),
    signOff: ROLES.map(([role, label]) => {
      const s = m.signOff.find((x) => x.role === role);
      const signed = m.signatures.find((x: SignatureFacts) => x.role === role);
      return {
        role: label,
        name: s?.name ?? '',
        date: s?.date ?? '',
        signature: signed ? `Ed25519 signature of the manifest, key ${signed.key} (fingerprint ${shortFingerprint(signed.fingerprint)})` : s ? 'not signed digitally' : '',
      };
    }),
    documentHref: input.hasDocument ? 'document.html' : null,
    pdfHref: input.hasPdf ? 'document.pdf' : null,
    currentHref: input.supersededBy ? link(input.supersededBy.path) : null,
    currentLabel: input.supersededBy ? `Revision ${input.supersededBy.revision}, which supersedes this one` : '',
    draftHref: link(input.draftPath),
    draftLabel: `The working draft of revision ${input.draftRevision} (not issued)`,
    changes: input.previous ? { from: input.previous.revision, lines: input.previous.changes } : null,
    auditCommand: `cellbasis audit ${input.projectId}`,
  };
}
