/**
 * What the PDF of a design-basis document states about itself (lib/core/pdf-properties.ts): its
 * title, number, revision and status for the running header and footer, the properties and, for
 * an issued revision, the basis and results it carries. The revision and status are those of the
 * page (lib/report/revision.ts): an issued revision's, or the working draft's "B, draft, not
 * issued", never anything the basis says.
 */
import type { DesignBasis } from '../basis/types.ts';
import type { Results } from '../plant/results-schema.ts';
import type { PdfAttachment, PdfMeta } from '../core/pdf-properties.ts';
import { DRAFT_STATUS, statusLabel, type RevisionContext } from './revision.ts';

/** What a working draft's PDF states as its status, in the running header and footer and the keywords. */
export const DRAFT_PDF_STATUS = DRAFT_STATUS;

/** The properties of the PDF of a design-basis document, from its basis, results and revision. */
export function documentPdfMeta(
  { basis, results, revision }: { basis: DesignBasis; results: Results; revision: RevisionContext },
  options: { date: Date; basisYaml?: Uint8Array; resultsJson?: Uint8Array },
): PdfMeta {
  const d = basis.document;
  const status = statusLabel(revision);
  const rev = revision.revision;
  const attachments: PdfAttachment[] = [];
  if (options.basisYaml) {
    attachments.push({ name: 'basis.yaml', bytes: options.basisYaml, mimeType: 'application/yaml', description: `design basis ${d.number} rev ${rev} as issued`, relationship: 'Source' });
  }
  if (options.resultsJson) {
    attachments.push({ name: 'results.json', bytes: options.resultsJson, mimeType: 'application/json', description: `calculated results of ${d.number} rev ${rev}`, relationship: 'Data' });
  }
  const technology = results.technology;
  return {
    title: d.title,
    documentNumber: d.number,
    revision: rev,
    status,
    author: d.signOff.prepared?.name ?? '',
    subject: `Design-basis calculation: ${technology.name}, ${technology.mode} mode; ${d.client}, ${d.site}`,
    keywords: ['design basis', d.number, `revision ${rev}`, status, technology.name, `${technology.mode} mode`, d.client, d.site],
    paper: d.paper,
    date: options.date,
    attachments,
  };
}
