/**
 * What the document of a revision being sealed shows: the report's DocumentInput
 * (lib/report/document.ts) with the revision as sealed (its status, seal date and note, the PDF
 * beside it) and the revision history of every revision sealed so far and this one, each with
 * its change summary against the one before it (compare.ts, over the sealed basis texts). The
 * history holds no draft and no links: a sealed document stands alone.
 */
import type { DocumentInput } from '../report/document.ts';
import { revisionHistory, type SealedRevisionRecord } from '../report/history.ts';
import type { RevisionContext } from '../report/revision.ts';
import { SEALED_FILES } from './layout.ts';
import { compareRevisions } from './compare.ts';
import type { SealDocumentInput } from './seal.ts';

export function sealedDocumentInput(input: SealDocumentInput): DocumentInput {
  const { basis, results, manifest } = input;
  const sources = new Map<string, string>(input.previous.map((p) => [p.revision, p.basisText]));
  sources.set(manifest.revision, input.basisText);
  const sealed: SealedRevisionRecord[] = [
    ...input.previous.map((p) => ({ revision: p.revision, basis: p.basis, results: p.results, manifest: p.manifest, path: null })),
    { revision: manifest.revision, basis, results, manifest, path: null },
  ];
  const history = revisionHistory({
    sealed,
    draft: null,
    changeSummary: (before, after) =>
      compareRevisions({ ...before, source: sources.get(before.revision) }, { ...after, source: sources.get(after.revision) }).summary,
  });
  const revision: RevisionContext = {
    kind: 'sealed',
    revision: manifest.revision,
    status: manifest.status,
    sealedOn: manifest.sealedOn,
    note: manifest.note,
    supersededBy: null,
    pdfHref: SEALED_FILES.pdf,
  };
  return { basis, results, revision, history };
}
