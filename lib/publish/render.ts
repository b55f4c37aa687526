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
 *   renderViewBytes(doc, use): void
 *     the page of a prepared view model as its UTF-8 bytes, handed to `use` (to write them; they
 *     are valid only during the call): the bytes of renderView's string, made without that string
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
import { nunjucksEnvironment, renderParts } from './nunjucks-env.ts';
import { inlineAssets } from './inline-assets.ts';
import { writeSiteAssets } from './write-assets.ts';

/** The template every document page is rendered with, in the site and on its own. */
const DOCUMENT_TEMPLATE = 'document-page.njk';

/** Renders a prepared view model: the step the site build and renderDocumentHtml share. */
export function renderView(doc: DocumentView): string {
  return nunjucksEnvironment().render(DOCUMENT_TEMPLATE, { doc });
}

/** The buffer the pages are encoded into, kept between pages: fresh memory costs a page fault a 4 KiB page. */
let scratch = Buffer.alloc(0);

/**
 * The page of a prepared view as UTF-8 bytes, byte for byte renderView's string encoded, handed
 * to `use` and valid only while it runs. The page is rendered in parts (renderParts) and each
 * part encoded in turn into a buffer kept from page to page: renderView's one string of the whole
 * page is copied into some 1.9 MB of fresh memory when first read, which with its page faults
 * cost more than rendering it.
 */
export function renderViewBytes(doc: DocumentView, use: (bytes: Uint8Array) => void): void {
  const parts = renderParts(nunjucksEnvironment(), DOCUMENT_TEMPLATE, { doc });
  let units = 0;
  for (const part of parts) units += part.length;
  // A UTF-16 code unit takes at most 3 bytes of UTF-8 (a surrogate pair, two units, takes 4).
  if (scratch.length < 3 * units) scratch = Buffer.allocUnsafe(3 * units);
  let length = 0;
  for (const part of parts) length += scratch.write(part, length);
  use(scratch.subarray(0, length));
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
