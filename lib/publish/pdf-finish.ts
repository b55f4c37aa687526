/**
 * The bytes of a printed PDF made final with pdf-lib: its structure elements named by position
 * (so the bytes depend on the page alone), its properties, dates and attachments set
 * (lib/core/pdf-properties.ts). The output has no /ID and no XMP metadata, so the same HTML and
 * meta give the same bytes on the same Chromium.
 */
import { PDFArray, PDFDict, PDFDocument, PDFHexString, PDFName, PDFRef, PDFStreamWriter, PDFString } from 'pdf-lib';
import { posix, sep } from 'node:path';
import { fileURLToPath } from 'node:url';
import { PDF_LIB_WHOLE, setPdfProperties, type PdfMeta } from '../core/pdf-properties.ts';

/**
 * Chromium names each element of a tagged PDF's structure tree after the DOM node it came from
 * (/ID (node00038561), ISO 32000-1 §14.7.2), lists them in the StructTreeRoot's /IDTree, and
 * refers to header cells by those names in table attributes (/Headers, §14.8.5.7). The node
 * numbers count up within a renderer process, so the same page printed on a fresh tab and on a
 * tab that printed another document first gave PDFs differing in nothing but these names (seen:
 * a reprinted draft unlike the first print). They are renamed node00000001, node00000002, ... in
 * the order the structure tree lists its elements, /Headers follow, and the /IDTree is rebuilt
 * as one sorted /Names array (§7.9.6) in place of the old one, so the bytes depend on the page
 * alone. Returns how many were renamed.
 */
function renumberStructureIds(pdf: PDFDocument): number {
  const root = pdf.catalog.lookupMaybe(PDFName.of('StructTreeRoot'), PDFDict);
  if (!root) return 0;
  const { elements, renamed, seen } = renameStructureElements(pdf, root);
  if (elements.length === 0) return 0;
  for (const dict of seen) renameHeaders(pdf, dict.get(PDFName.of('A')), renamed);
  rebuildIdTree(pdf, root, elements);
  return elements.length;
}

interface StructureElement {
  ref: PDFRef;
  dict: PDFDict;
}

/** The object a reference points to, or the value itself. */
const resolved = (pdf: PDFDocument, value: unknown) => (value instanceof PDFRef ? pdf.context.lookup(value) : value);

/** Renames each element with an /ID, in the order the tree lists them; returns them, the old name to the new, and every dictionary of the tree. */
function renameStructureElements(pdf: PDFDocument, root: PDFDict): { elements: StructureElement[]; renamed: Map<string, string>; seen: Set<PDFDict> } {
  const [ID, K] = [PDFName.of('ID'), PDFName.of('K')];
  const elements: StructureElement[] = [];
  const renamed = new Map<string, string>();
  const seen = new Set<PDFDict>();
  const walk = (kid: unknown): void => {
    const value = resolved(pdf, kid);
    if (value instanceof PDFArray) {
      for (let i = 0; i < value.size(); i++) walk(value.get(i));
      return;
    }
    if (!(value instanceof PDFDict) || seen.has(value)) return;
    seen.add(value);
    const id = value.get(ID);
    if (kid instanceof PDFRef && (id instanceof PDFString || id instanceof PDFHexString)) {
      const name = `node${String(elements.length + 1).padStart(8, '0')}`;
      renamed.set(id.decodeText(), name);
      value.set(ID, PDFString.of(name));
      elements.push({ ref: kid, dict: value });
    }
    walk(value.get(K));
  };
  walk(root.get(K));
  return { elements, renamed, seen };
}

/** Points the /Headers of an element's attributes (a dictionary, or an array of them) to the new names. */
function renameHeaders(pdf: PDFDocument, attributes: unknown, renamed: ReadonlyMap<string, string>): void {
  const value = resolved(pdf, attributes);
  if (value instanceof PDFArray) {
    for (let i = 0; i < value.size(); i++) renameHeaders(pdf, value.get(i), renamed);
    return;
  }
  if (!(value instanceof PDFDict)) return;
  const headers = resolved(pdf, value.get(PDFName.of('Headers')));
  if (!(headers instanceof PDFArray)) return;
  for (let i = 0; i < headers.size(); i++) {
    const header = headers.get(i);
    const name = header instanceof PDFString || header instanceof PDFHexString ? renamed.get(header.decodeText()) : undefined;
    if (name) headers.set(i, PDFString.of(name));
  }
}

/** Deletes the old /IDTree with its kids and sets one sorted /Names array of the renamed elements in its place. */
function rebuildIdTree(pdf: PDFDocument, root: PDFDict, elements: readonly StructureElement[]): void {
  const deleteTree = (node: unknown): void => {
    const value = resolved(pdf, node);
    if (node instanceof PDFRef) pdf.context.delete(node);
    if (!(value instanceof PDFDict)) return;
    const kids = resolved(pdf, value.get(PDFName.of('Kids')));
    if (kids instanceof PDFArray) for (let i = 0; i < kids.size(); i++) deleteTree(kids.get(i));
  };
  deleteTree(root.get(PDFName.of('IDTree')));
  const names = pdf.context.obj([]);
  for (const { ref, dict } of elements) {
    names.push(dict.get(PDFName.of('ID'))!);
    names.push(ref);
  }
  root.set(PDFName.of('IDTree'), pdf.context.register(pdf.context.obj({ Names: names })));
}

/**
 * Chromium writes a page's relative links as absolute URIs (ISO 32000-1 §12.6.4.7, /S /URI):
 * printed from file:///tmp/x/site.123.build/projects/p/index.html, a link to rev-A/index.html
 * becomes file:///tmp/x/site.123.build/projects/p/rev-A/index.html, a folder that is renamed or
 * deleted once the build ends, so the PDF's links were dead and its bytes depended on where it
 * was built. Every file: URI is written back relative to the printed page's folder (the PDF
 * sits beside its page, so a viewer resolving it against the PDF's own location reaches the
 * same file); other URIs are left as they are. Returns how many were rewritten.
 */
function relativiseFileLinks(pdf: PDFDocument, pageUrl: string): number {
  if (!/^file:/i.test(pageUrl)) return 0;
  const pageDir = posix.dirname(fileURLToPath(pageUrl).split(sep).join('/'));
  const [ANNOTS, A, S, URI] = ['Annots', 'A', 'S', 'URI'].map((n) => PDFName.of(n)) as [PDFName, PDFName, PDFName, PDFName];
  let rewritten = 0;
  for (const page of pdf.getPages()) {
    const annots = page.node.lookupMaybe(ANNOTS, PDFArray);
    for (let i = 0; i < (annots?.size() ?? 0); i++) {
      const action = annots!.lookupMaybe(i, PDFDict)?.lookupMaybe(A, PDFDict);
      const uri = action?.get(URI);
      if (!action || action.get(S) !== URI || !(uri instanceof PDFString || uri instanceof PDFHexString)) continue;
      const text = uri.decodeText();
      if (!/^file:/i.test(text)) continue;
      const target = new URL(text);
      const path = fileURLToPath(target).split(sep).join('/');
      const relative = posix.relative(pageDir, path) || posix.basename(path);
      action.set(URI, PDFString.of(relative.split('/').map(encodeURIComponent).join('/') + target.search + target.hash));
      rewritten++;
    }
  }
  return rewritten;
}

/**
 * Sets the document properties, dates and attachments of a printed PDF, names its structure
 * elements by position and writes its links to local files relative to `pageUrl`, the page
 * it was printed from.
 */
export async function finishPdf(printed: Uint8Array, meta: PdfMeta, chromiumVersion: string, pageUrl: string): Promise<Uint8Array> {
  const pdf = await PDFDocument.load(printed, { updateMetadata: false, ...PDF_LIB_WHOLE });
  renumberStructureIds(pdf);
  relativiseFileLinks(pdf, pageUrl);
  await setPdfProperties(pdf, meta, chromiumVersion);
  return savePdf(pdf);
}

/**
 * Objects a stream of the saved PDF holds. pdf-lib's save() puts 50 in each and deflates every
 * stream on its own (pako, in JavaScript, each stream allocating and clearing its window anew),
 * so a 50-page draft of some 6 300 objects made 120 streams. With 200 a stream, saving such a
 * draft takes 125–130 ms of processor time instead of 150–160 and the file is 3.5 % smaller
 * (530 against 549 KiB; six synthetic drafts, warm, December 2026); larger streams gained no
 * more. ISO 32000-1 §7.5.7 sets no limit on the objects a stream holds.
 */
export const OBJECTS_PER_STREAM = 200;

/**
 * The PDF's bytes, as pdf-lib's save() writes them (no default page, no form: a print has pages
 * and none) but with OBJECTS_PER_STREAM objects a stream. Object streams (ISO 32000-1 §7.5.7)
 * compress the many small objects of the tagged structure tree, which were written
 * uncompressed: a document's PDF is 58 % smaller (1.82 MB against 0.75 MB for a demo with
 * operating cases), and the demo archive fits its size limit again.
 */
async function savePdf(pdf: PDFDocument): Promise<Uint8Array> {
  await pdf.flush();
  return PDFStreamWriter.forContext(pdf.context, Infinity, true, OBJECTS_PER_STREAM).serializeToBuffer();
}

