/**
 * Reading back what the tests check in a PDF, with pdf-lib only (CI installs Chromium but no
 * PDF tools): the document properties, the embedded files, and the text drawn on each page.
 *
 * The text is read from each page's content stream and the forms it draws: Chromium (Skia) draws text with `Tj` and
 * `TJ` operators on two-byte glyph ids of subset fonts, and each font carries a ToUnicode CMap
 * (bfchar and bfrange entries) from glyph ids back to characters. That is all Skia writes, so
 * decoding those operators through those maps gives the text of every page, the header and
 * footer included (Chromium draws them into each page's own content stream).
 */
import { PDFArray, PDFDict, PDFDocument, PDFHexString, PDFName, PDFRawStream, PDFString, decodePDFRawStream, type PDFObject } from 'pdf-lib';

export interface PdfInfo {
  pages: number;
  title?: string;
  author?: string;
  subject?: string;
  keywords?: string;
  creator?: string;
  producer?: string;
  /** Raw PDF date strings, e.g. "D:20261130000000Z". */
  creationDate?: string;
  modDate?: string;
}

function text(value: PDFObject | undefined): string | undefined {
  if (value instanceof PDFHexString || value instanceof PDFString) return value.decodeText();
  return undefined;
}

function rawText(value: PDFObject | undefined): string | undefined {
  if (value instanceof PDFString) return value.asString();
  if (value instanceof PDFHexString) return value.decodeText();
  return undefined;
}

export async function pdfInfo(bytes: Uint8Array): Promise<PdfInfo> {
  const pdf = await PDFDocument.load(bytes, { updateMetadata: false });
  const info = pdf.context.lookup(pdf.context.trailerInfo.Info, PDFDict);
  const get = (key: string) => info.lookup(PDFName.of(key));
  return {
    pages: pdf.getPageCount(),
    title: text(get('Title')),
    author: text(get('Author')),
    subject: text(get('Subject')),
    keywords: text(get('Keywords')),
    creator: text(get('Creator')),
    producer: text(get('Producer')),
    creationDate: rawText(get('CreationDate')),
    modDate: rawText(get('ModDate')),
  };
}

function asStream(value: PDFObject | undefined): PDFRawStream | undefined {
  return value instanceof PDFRawStream ? value : undefined;
}

function streamBytes(stream: PDFRawStream): Uint8Array {
  return decodePDFRawStream(stream).decode();
}

/** The embedded files by name, with their bytes and the dates of their Params. */
export async function pdfAttachments(bytes: Uint8Array): Promise<Map<string, { bytes: Buffer; creationDate?: string; modDate?: string }>> {
  const pdf = await PDFDocument.load(bytes, { updateMetadata: false });
  const out = new Map<string, { bytes: Buffer; creationDate?: string; modDate?: string }>();
  const names = pdf.catalog.lookupMaybe(PDFName.of('Names'), PDFDict)?.lookupMaybe(PDFName.of('EmbeddedFiles'), PDFDict)?.lookupMaybe(PDFName.of('Names'), PDFArray);
  if (!names) return out;
  for (let i = 0; i + 1 < names.size(); i += 2) {
    const spec = names.lookup(i + 1, PDFDict);
    const file = asStream(spec.lookup(PDFName.of('EF'), PDFDict).lookup(PDFName.of('F')))!;
    const params = file.dict.lookupMaybe(PDFName.of('Params'), PDFDict);
    out.set(text(names.lookup(i))!, {
      bytes: Buffer.from(streamBytes(file)),
      creationDate: rawText(params?.lookup(PDFName.of('CreationDate'))),
      modDate: rawText(params?.lookup(PDFName.of('ModDate'))),
    });
  }
  return out;
}

/** Glyph id (hex, 4 digits) → characters, from a ToUnicode CMap. */
function parseCMap(cmap: string): Map<string, string> {
  const map = new Map<string, string>();
  const chars = (hex: string) => String.fromCodePoint(...(hex.match(/.{4}/g) ?? []).map((h) => parseInt(h, 16)));
  for (const block of cmap.matchAll(/beginbfchar([\s\S]*?)endbfchar/g)) {
    for (const m of block[1]!.matchAll(/<([0-9A-Fa-f]+)>\s*<([0-9A-Fa-f]+)>/g)) map.set(m[1]!.toUpperCase().padStart(4, '0'), chars(m[2]!));
  }
  for (const block of cmap.matchAll(/beginbfrange([\s\S]*?)endbfrange/g)) {
    for (const m of block[1]!.matchAll(/<([0-9A-Fa-f]+)>\s*<([0-9A-Fa-f]+)>\s*(<[0-9A-Fa-f]+>|\[[^\]]*\])/g)) {
      const low = parseInt(m[1]!, 16);
      const high = parseInt(m[2]!, 16);
      const targets = m[3]!.startsWith('[') ? [...m[3]!.matchAll(/<([0-9A-Fa-f]+)>/g)].map((t) => t[1]!) : null;
      const start = targets ? 0 : parseInt(m[3]!.slice(1, -1), 16);
      for (let code = low; code <= high; code++) {
        const key = code.toString(16).toUpperCase().padStart(4, '0');
        map.set(key, targets ? chars(targets[code - low]!) : String.fromCodePoint(start + code - low));
      }
    }
  }
  return map;
}

function decodeHex(hex: string, map: Map<string, string> | undefined): string {
  return (hex.replace(/\s+/g, '').toUpperCase().match(/.{4}/g) ?? []).map((g) => map?.get(g) ?? '').join('');
}

/** The ToUnicode map of each font of a resource dictionary, by resource name. */
function fontMaps(resources: PDFDict | undefined): Map<string, Map<string, string>> {
  const fonts = new Map<string, Map<string, string>>();
  const fontDict = resources?.lookupMaybe(PDFName.of('Font'), PDFDict);
  for (const key of fontDict?.keys() ?? []) {
    const font = fontDict!.lookup(key, PDFDict);
    const toUnicode = asStream(font.lookup(PDFName.of('ToUnicode')));
    if (toUnicode) fonts.set(key.asString(), parseCMap(Buffer.from(streamBytes(toUnicode)).toString('latin1')));
  }
  return fonts;
}

/**
 * The text a content stream draws, in drawing order, with the text of the form XObjects it
 * draws (`/Name Do`) put in where they are drawn: Chromium puts some of a page's content into
 * forms (part of a page that holds a chart, for one), each with its own fonts.
 */
function drawnText(pdf: PDFDocument, content: string, resources: PDFDict | undefined, depth = 0): string {
  const fonts = fontMaps(resources);
  const forms = resources?.lookupMaybe(PDFName.of('XObject'), PDFDict);
  let font: Map<string, string> | undefined;
  let out = '';
  for (const m of content.matchAll(/(\/[^\s/<>[\]()]+)\s+-?[\d.]+\s+Tf|<([0-9A-Fa-f\s]*)>\s*Tj|\[((?:[^\]])*)\]\s*TJ|(\/[^\s/<>[\]()]+)\s+Do\b/g)) {
    if (m[1]) font = fonts.get(m[1]);
    else if (m[2] !== undefined) out += decodeHex(m[2], font);
    else if (m[3] !== undefined) for (const piece of m[3].matchAll(/<([0-9A-Fa-f\s]*)>/g)) out += decodeHex(piece[1]!, font);
    else if (m[4] && forms && depth < 8) {
      const form = asStream(forms.lookup(PDFName.of(m[4].slice(1))));
      if (form?.dict.get(PDFName.of('Subtype'))?.toString() !== '/Form') continue;
      const own = form.dict.lookupMaybe(PDFName.of('Resources'), PDFDict) ?? resources;
      out += drawnText(pdf, Buffer.from(form.dict.has(PDFName.of('Filter')) ? streamBytes(form) : form.contents).toString('latin1'), own, depth + 1);
    }
  }
  return out;
}

/** The text drawn on each page, in drawing order (forms included). */
export async function pageTexts(bytes: Uint8Array): Promise<string[]> {
  const pdf = await PDFDocument.load(bytes, { updateMetadata: false });
  return pdf.getPages().map((page) => {
    const contents = page.node.lookup(PDFName.of('Contents'));
    const streams = (contents instanceof PDFArray ? contents.asArray().map((ref) => asStream(pdf.context.lookup(ref))) : [asStream(contents)]).filter((x) => x !== undefined);
    const content = streams.map((s) => Buffer.from(s.dict.has(PDFName.of('Filter')) ? streamBytes(s) : s.contents).toString('latin1')).join('\n');
    return drawnText(pdf, content, page.node.Resources());
  });
}

/** Text without any white space, for finding words whatever the spacing between text runs. */
export function compact(textValue: string): string {
  return textValue.replace(/\s+/g, '');
}

/** Width and height in pixels of every raster image in the PDF, wherever it is drawn (pages, forms, masks). */
export async function imageSizes(bytes: Uint8Array): Promise<{ width: number; height: number }[]> {
  const pdf = await PDFDocument.load(bytes, { updateMetadata: false });
  return pdf.context.enumerateIndirectObjects().flatMap(([, object]) => {
    const stream = asStream(object);
    if (stream?.dict.get(PDFName.of('Subtype'))?.toString() !== '/Image') return [];
    const size = (key: string) => Number(stream.dict.get(PDFName.of(key))?.toString());
    return [{ width: size('Width'), height: size('Height') }];
  });
}
