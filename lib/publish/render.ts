/**
 * One design-basis document as HTML, rendered with the templates and the Nunjucks environment
 * the site uses (lib/publish/nunjucks-env.ts), for callers outside the site build: issuing a
 * revision writes its document.html with it, then makes it one file with inlineAssets.
 *
 *   renderDocumentHtml(input, options): string
 *     input.basis     the validated basis (lib/basis/types.ts), as issued or as the draft
 *     input.results   its results object (lib/plant/results-schema.ts), never recomputed here
 *     input.revision  which revision the page is (lib/report/revision.ts RevisionContext)
 *     input.history   the project's revisions (lib/report/history.ts revisionHistory()), [] for none
 *     options.assetBase  URL of the assets folder relative to the page: "" to inline them
 *                        afterwards from an assets folder, "../../assets/" for a site page
 *     options.pagePath, options.indexHref, options.checks: see DocumentOptions in lib/report/document.ts
 *
 *   renderStandaloneHtml(input): string
 *     the same page with every asset inlined (assets copied to a temporary folder and read back)
 *     and the CSV of each table as a data: URI instead of a file beside it
 *
 * Example (issue): const html = renderStandaloneHtml({ basis, results, revision: { kind: 'issued', ... }, history });
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { documentView, type DocumentInput, type DocumentOptions, type DocumentView } from '../report/document.ts';
import { nunjucksEnvironment } from './nunjucks-env.ts';
import { inlineAssets } from './inline-assets.ts';
import { writeSiteAssets } from './write-assets.ts';

/** The template every document page is rendered with, in the site and on its own. */
const DOCUMENT_TEMPLATE = 'document-page.njk';

/** Renders a prepared view model: the step the site build and renderDocumentHtml share. */
export function renderView(doc: DocumentView): string {
  return nunjucksEnvironment().render(DOCUMENT_TEMPLATE, { doc });
}

export function renderDocumentHtml(input: DocumentInput, options: DocumentOptions): string {
  return renderView(documentView(input, options));
}

export function renderStandaloneHtml(input: DocumentInput, options: Omit<DocumentOptions, 'assetBase'> = {}): string {
  // Nothing stands beside a standalone document: its tables' CSV travel inside it as data: URIs.
  const html = renderDocumentHtml(input, { ...options, assetBase: '', tables: 'inline' });
  const dir = mkdtempSync(join(tmpdir(), 'cellbasis-assets-'));
  try {
    writeSiteAssets(dir);
    return inlineAssets(html, dir);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
