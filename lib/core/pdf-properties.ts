/**
 * The document properties of a cellbasis PDF (ISO 32000-1 §14.3.3, the document information
 * dictionary, and §7.11.4, embedded files): what a print is given to carry (`PdfMeta`), setting
 * them on a printed PDF with pdf-lib, and reading them back, as the audit compares them with a
 * manifest of the issued revision. Title (shown in the viewer's title bar), author, subject, keywords, language,
 * creator ("cellbasis <version>") and producer (the same and the Chromium version, "cellbasis
 * 0.1.0 (Chromium 156.0.8078.114)"), CreationDate and ModDate = `meta.date` (the issue date, never
 * the clock), and the attachments (an issued document carries its basis YAML and results JSON).
 * Shared by the report (which says what a document's PDF states), the archive (which audits it)
 * and the printer of lib/publish (which sets it).
 */
import { AFRelationship, PDFArray, PDFDict, PDFDocument, PDFHexString, PDFName, PDFRawStream, PDFString, ParseSpeeds, decodePDFRawStream } from 'pdf-lib';
import { toolVersion } from './version.ts';

export interface PdfAttachment {
  name: string;
  bytes: Uint8Array;
  mimeType: string;
  description: string;
  /** How the file relates to the document (PDF/A-3 AFRelationship): Source for the basis, Data for the results. */
  relationship: 'Source' | 'Data' | 'Supplement';
}

export interface PdfMeta {
  title: string;
  documentNumber: string;
  revision: string;
  status: string;
  /** The preparer (document.sign-off.prepared). */
  author: string;
  subject: string;
  keywords: string[];
  paper: 'A4' | 'Letter';
  /** CreationDate and ModDate of the PDF, and the date in the footer (UTC day). */
  date: Date;
  /** BCP 47 language of the document; default "en". */
  language?: string;
  attachments?: PdfAttachment[];
}

/** The producer a PDF names: the cellbasis version, and the Chromium that printed it. */
function producerName(chromiumVersion: string): string {
  return `cellbasis ${toolVersion()} (Chromium ${chromiumVersion})`;
}

/**
 * pdf-lib parses and writes a few dozen objects at a time and yields to the event loop between
 * batches (ParseSpeeds.Slow, 50 objects per tick). A tagged 30-page document has tens of
 * thousands of objects, so those yields took most of finishPdf's 0.45 s (measured); the work is
 * done in one go instead. The bytes written are the same.
 */
export const PDF_LIB_WHOLE = { parseSpeed: ParseSpeeds.Fastest } as const;

/** Sets the document properties, dates and attachments of `meta` on a printed PDF. */
export async function setPdfProperties(pdf: PDFDocument, meta: PdfMeta, chromiumVersion: string): Promise<void> {
  pdf.setTitle(meta.title, { showInWindowTitleBar: true });
  pdf.setAuthor(meta.author);
  pdf.setSubject(meta.subject);
  pdf.setKeywords(meta.keywords);
  pdf.setCreator(`cellbasis ${toolVersion()}`);
  pdf.setProducer(producerName(chromiumVersion));
  pdf.setLanguage(meta.language ?? 'en');
  pdf.setCreationDate(meta.date);
  pdf.setModificationDate(meta.date);
  for (const file of meta.attachments ?? []) {
    await pdf.attach(file.bytes, file.name, {
      mimeType: file.mimeType,
      description: file.description,
      creationDate: meta.date,
      modificationDate: meta.date,
      afRelationship: AFRelationship[file.relationship],
    });
  }
}

/** What a finished PDF says about itself, as the audit compares it with the manifest. */
export interface PdfProperties {
  creationDate: Date | undefined;
  modificationDate: Date | undefined;
  producer: string | undefined;
  /** Embedded files by name. */
  attachments: Map<string, Uint8Array>;
}

export async function readPdfProperties(bytes: Uint8Array): Promise<PdfProperties> {
  const pdf = await PDFDocument.load(bytes, { updateMetadata: false, ...PDF_LIB_WHOLE });
  const attachments = new Map<string, Uint8Array>();
  const list = pdf.catalog.lookupMaybe(PDFName.of('Names'), PDFDict)?.lookupMaybe(PDFName.of('EmbeddedFiles'), PDFDict)?.lookupMaybe(PDFName.of('Names'), PDFArray);
  for (let i = 0; list && i + 1 < list.size(); i += 2) {
    const name = list.lookup(i);
    const stream = list.lookup(i + 1, PDFDict).lookupMaybe(PDFName.of('EF'), PDFDict)?.lookup(PDFName.of('F'));
    if ((name instanceof PDFHexString || name instanceof PDFString) && stream instanceof PDFRawStream) attachments.set(name.decodeText(), decodePDFRawStream(stream).decode());
  }
  return { creationDate: pdf.getCreationDate(), modificationDate: pdf.getModificationDate(), producer: pdf.getProducer(), attachments };
}
