// The killed-build test compares reprinted drafts with pdfLayoutDigest (test/helpers/site.ts),
// which must ignore a glyph placed a fraction of a unit apart and nothing else.
import { expect, it } from 'vitest';
import { PDFDocument, StandardFonts } from 'pdf-lib';
import { pdfLayoutDigest } from '../helpers/site.ts';

async function onePage(y: number, text = 'design basis'): Promise<Buffer> {
  const pdf = await PDFDocument.create({ updateMetadata: false });
  const font = await pdf.embedFont(StandardFonts.Helvetica);
  pdf.addPage([200, 200]).drawText(text, { x: 20, y, size: 12, font });
  pdf.addPage([200, 200]).drawText('another page', { x: 20, y: 50, size: 12, font });
  return Buffer.from(await pdf.save({ useObjectStreams: false }));
}

it('gives the same digest for a glyph placed 1/8 unit apart, and another for anything else', async () => {
  const base = await onePage(100);
  const eighth = await onePage(100.125);
  expect(eighth.equals(base), 'the bytes differ').toBe(false);
  expect(pdfLayoutDigest(eighth)).toBe(pdfLayoutDigest(base));
  expect(pdfLayoutDigest(await onePage(110))).not.toBe(pdfLayoutDigest(base));
  expect(pdfLayoutDigest(await onePage(100, 'design bases'))).not.toBe(pdfLayoutDigest(base));
  expect(pdfLayoutDigest(base.subarray(0, base.length - 200)), 'a torn file').not.toBe(pdfLayoutDigest(base));
});
