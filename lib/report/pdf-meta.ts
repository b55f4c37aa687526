/**
 * What the PDF of a design-basis document states about itself (lib/core/pdf-properties.ts): its
 * title, number, revision and status for the running header and footer, the properties and, for
 * a sealed revision, the basis and results it carries.
 */
import type { DesignBasis } from '../basis/types.ts';
import type { Results } from '../plant/results-schema.ts';
import type { PdfAttachment, PdfMeta } from '../core/pdf-properties.ts';

/** What a working draft's PDF states as its status, in the running header and footer and the keywords. */
export const DRAFT_PDF_STATUS = 'draft, not issued';

/**
 * The properties of the PDF of a design-basis document, from its basis and results. A working
 * draft (`draft: true`) is never issued, whatever status its basis states, so its header, footer
 * and keywords say "draft, not issued", as its page's stamp does.
 */
export function documentPdfMeta(
  { basis, results }: { basis: DesignBasis; results: Results },
  options: { date: Date; basisYaml?: Uint8Array; resultsJson?: Uint8Array; draft?: boolean },
): PdfMeta {
  const d = basis.document;
  const status = options.draft ? DRAFT_PDF_STATUS : d.status;
  const attachments: PdfAttachment[] = [];
  if (options.basisYaml) {
    attachments.push({ name: 'basis.yaml', bytes: options.basisYaml, mimeType: 'application/yaml', description: `design basis ${d.number} rev ${d.revision} as sealed`, relationship: 'Source' });
  }
  if (options.resultsJson) {
    attachments.push({ name: 'results.json', bytes: options.resultsJson, mimeType: 'application/json', description: `calculated results of ${d.number} rev ${d.revision}`, relationship: 'Data' });
  }
  const technology = results.technology;
  return {
    title: d.title,
    documentNumber: d.number,
    revision: d.revision,
    status,
    author: d.signOff.prepared?.name ?? '',
    subject: `Design-basis calculation: ${technology.name}, ${technology.mode} mode; ${d.client}, ${d.site}`,
    keywords: ['design basis', d.number, `revision ${d.revision}`, status, technology.name, `${technology.mode} mode`, d.client, d.site],
    paper: d.paper,
    date: options.date,
    attachments,
  };
}
