// Finishing a printed PDF (lib/publish/pdf-finish.ts) without Chromium: a PDF made here with
// pdf-lib stands for a tagged print, with a structure tree of elements named as Chromium names
// them (/ID (node<DOM node number>), ISO 32000-1 §14.7.2) in no particular order. Finished, its
// elements are named by position and listed in a sorted /IDTree (§7.9.6), every object survives,
// packed in object streams (§7.5.7) of at most OBJECTS_PER_STREAM objects, and the same printed
// bytes always finish to the same bytes.
import { expect, it } from 'vitest';
import { PDFArray, PDFDict, PDFDocument, PDFName, PDFRef, PDFString } from 'pdf-lib';
import { OBJECTS_PER_STREAM, finishPdf } from '../../lib/publish/pdf-finish.ts';
import type { PdfMeta } from '../../lib/core/pdf-properties.ts';

const meta: PdfMeta = {
  title: 'Finishing test',
  documentNumber: 'DB-F-001',
  revision: 'A',
  status: 'draft',
  author: 'A. Engineer',
  subject: 'Design-basis calculation: finishing',
  keywords: ['design basis'],
  paper: 'A4',
  date: new Date('2026-11-30T00:00:00Z'),
};

/** Elements in the structure tree, enough to fill several object streams. */
const ELEMENTS = 3 * OBJECTS_PER_STREAM + 17;

/** A one-page PDF whose structure tree has ELEMENTS paragraphs named node<n> with n counting down, as a used tab numbers them. */
async function printed(): Promise<Uint8Array> {
  const pdf = await PDFDocument.create();
  pdf.addPage([595, 842]);
  const kids = pdf.context.obj([]);
  const names = pdf.context.obj([]);
  for (let i = 0; i < ELEMENTS; i++) {
    const id = `node${String(90000 - i * 7).padStart(8, '0')}`;
    const ref = pdf.context.register(pdf.context.obj({ Type: 'StructElem', S: 'P', ID: PDFString.of(id) }));
    kids.push(ref);
    names.push(PDFString.of(id));
    names.push(ref);
  }
  const idTree = pdf.context.register(pdf.context.obj({ Names: names }));
  pdf.catalog.set(PDFName.of('StructTreeRoot'), pdf.context.register(pdf.context.obj({ Type: 'StructTreeRoot', K: kids, IDTree: idTree })));
  return pdf.save({ useObjectStreams: false });
}

/** /N (objects held) of every object stream of a PDF, read from its bytes (pdf-lib unpacks the streams on load and keeps no trace of them). */
function objectStreamSizes(bytes: Uint8Array): number[] {
  const dicts = Buffer.from(bytes).toString('latin1').match(/<<[^<>]*\/Type \/ObjStm[^<>]*>>/g) ?? [];
  return dicts.map((dict) => Number(/\/N (\d+)/.exec(dict)![1]));
}

it('names the structure elements by position, keeps every element, packs objects in streams of at most OBJECTS_PER_STREAM, and finishes the same bytes alike', async () => {
  const bytes = await printed();
  const finished = await finishPdf(bytes, meta, '1.0', 'file:///tmp/x/index.html');
  expect(Buffer.from(await finishPdf(bytes, meta, '1.0', 'file:///tmp/x/index.html')).equals(Buffer.from(finished)), 'the same print finishes to the same bytes').toBe(true);

  // Read back the way a viewer does: the object streams parsed (pdf-lib unpacks them on load).
  const doc = await PDFDocument.load(finished, { updateMetadata: false });
  const root = doc.catalog.lookup(PDFName.of('StructTreeRoot'), PDFDict);
  const kids = root.lookup(PDFName.of('K'), PDFArray);
  expect(kids.size()).toBe(ELEMENTS);
  const ids = Array.from({ length: kids.size() }, (_, i) => (kids.lookup(i, PDFDict).get(PDFName.of('ID')) as PDFString).decodeText());
  expect(ids).toEqual(ids.map((_, i) => `node${String(i + 1).padStart(8, '0')}`));
  const idTree = root.lookup(PDFName.of('IDTree'), PDFDict).lookup(PDFName.of('Names'), PDFArray);
  expect(idTree.size()).toBe(2 * ELEMENTS);
  for (let i = 0; i < ELEMENTS; i++) expect(idTree.get(2 * i + 1)).toBe(kids.get(i) as PDFRef);

  // ELEMENTS elements, the tree root and its /IDTree, catalog, pages, page and info dictionary
  // are small objects, all packed; each stream holds at most OBJECTS_PER_STREAM of them, and
  // each of the full streams holds exactly that many (pdf-lib's save() put 50 in each).
  const sizes = objectStreamSizes(finished);
  expect(sizes.reduce((a, b) => a + b, 0)).toBeGreaterThanOrEqual(ELEMENTS + 2);
  expect(Math.max(...sizes)).toBe(OBJECTS_PER_STREAM);
  expect(sizes.filter((n) => n < OBJECTS_PER_STREAM)).toHaveLength(1);
});
