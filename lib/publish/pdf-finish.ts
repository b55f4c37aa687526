/**
 * The bytes of a printed PDF made final with pdf-lib: its structure elements named by position
 * (so the bytes depend on the page alone), its properties, dates and attachments set
 * (lib/core/pdf-properties.ts). The output has no /ID and no XMP metadata, so the same HTML and
 * meta give the same bytes on the same Chromium.
 */
import { PDFArray, PDFDict, PDFDocument, PDFHexString, PDFName, PDFRef, PDFString } from 'pdf-lib';
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
export function renumberStructureIds(pdf: PDFDocument): number {
  const root = pdf.catalog.lookupMaybe(PDFName.of('StructTreeRoot'), PDFDict);
  if (!root) return 0;
  const [ID, K, A, HEADERS] = ['ID', 'K', 'A', 'Headers'].map((n) => PDFName.of(n)) as [PDFName, PDFName, PDFName, PDFName];
  const elements: { ref: PDFRef; dict: PDFDict }[] = [];
  const renamed = new Map<string, string>();
  const seen = new Set<PDFDict>();
  const lookup = (value: unknown) => (value instanceof PDFRef ? pdf.context.lookup(value) : value);
  const walk = (kid: unknown): void => {
    const value = lookup(kid);
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
  if (elements.length === 0) return 0;

  const renameHeaders = (attributes: unknown): void => {
    const value = lookup(attributes);
    if (value instanceof PDFArray) {
      for (let i = 0; i < value.size(); i++) renameHeaders(value.get(i));
      return;
    }
    if (!(value instanceof PDFDict)) return;
    const headers = lookup(value.get(HEADERS));
    if (!(headers instanceof PDFArray)) return;
    for (let i = 0; i < headers.size(); i++) {
      const header = headers.get(i);
      const name = header instanceof PDFString || header instanceof PDFHexString ? renamed.get(header.decodeText()) : undefined;
      if (name) headers.set(i, PDFString.of(name));
    }
  };
  for (const dict of seen) renameHeaders(dict.get(A));

  const deleteTree = (node: unknown): void => {
    const value = lookup(node);
    if (node instanceof PDFRef) pdf.context.delete(node);
    if (!(value instanceof PDFDict)) return;
    const kids = lookup(value.get(PDFName.of('Kids')));
    if (kids instanceof PDFArray) for (let i = 0; i < kids.size(); i++) deleteTree(kids.get(i));
  };
  deleteTree(root.get(PDFName.of('IDTree')));
  const names = pdf.context.obj([]);
  for (const { ref, dict } of elements) {
    names.push(dict.get(ID)!);
    names.push(ref);
  }
  root.set(PDFName.of('IDTree'), pdf.context.register(pdf.context.obj({ Names: names })));
  return elements.length;
}

/** Sets the document properties, dates and attachments of a printed PDF, and names its structure elements by position. */
export async function finishPdf(printed: Uint8Array, meta: PdfMeta, chromiumVersion: string): Promise<Uint8Array> {
  const pdf = await PDFDocument.load(printed, { updateMetadata: false, ...PDF_LIB_WHOLE });
  renumberStructureIds(pdf);
  await setPdfProperties(pdf, meta, chromiumVersion);
  return pdf.save({ useObjectStreams: false, objectsPerTick: Infinity });
}

