/**
 * What the document of a revision being issued shows: the report's DocumentInput
 * (lib/report/document.ts) with the revision as issued (its status, issue date, note, the keys
 * that sign its manifest, the PDF beside it) and the revision history of every revision issued
 * so far and this one, each with its change summary against the one before it (compare.ts, over
 * the issued basis texts). The history holds no draft and no links: an issued document stands
 * alone. It is rendered once, here, and never again.
 */
import type { DocumentInput } from '../report/document.ts';
import { revisionHistory, type IssuedRevisionRecord } from '../report/history.ts';
import type { RevisionContext } from '../report/revision.ts';
import { ISSUED_FILES } from './layout.ts';
import { compareRevisions } from './compare.ts';
import type { IssueDocumentInput } from './issue.ts';

export function issuedDocumentInput(input: IssueDocumentInput): DocumentInput {
  const { basis, results, manifest } = input;
  const issued: IssuedRevisionRecord[] = [
    ...input.previous.map((p) => ({
      revision: p.revision,
      basis: p.basis,
      ...(p.basisProblem ? { basisProblem: p.basisProblem } : {}),
      source: p.basisText,
      results: p.results,
      manifest: p.manifest,
      path: null,
    })),
    { revision: manifest.revision, basis, source: input.basisText, results, manifest, path: null },
  ];
  const history = revisionHistory({ issued, draft: null, changeSummary: (before, after) => compareRevisions(before, after).summary });
  const revision: RevisionContext = {
    kind: 'issued',
    revision: manifest.revision,
    status: manifest.status,
    issuedOn: manifest.issuedOn,
    note: manifest.note,
    signatures: manifest.signatures,
    pdfHref: ISSUED_FILES.pdf,
  };
  return { basis, results, revision, history };
}
