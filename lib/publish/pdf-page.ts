/**
 * The printed page of a document: the paper (A4 or Letter), the margins in which the running
 * header and footer stand, the viewport the page is laid out at (the paper's text column), and
 * the header (document number and title, revision and status) and footer (number, revision,
 * status, date, "page X of Y") Chromium draws on every page.
 */
import type { PdfMeta } from '../core/pdf-properties.ts';
import { escapeHtml } from '../report/trusted-html.ts';

/** Paper size and margins, mm. The header and footer stand in the top and bottom margins. */
const PAPER = {
  A4: { width: 210, height: 297 },
  Letter: { width: 215.9, height: 279.4 },
} as const;
const MARGIN_MM = { top: 20, bottom: 18, side: 16 };
const CSS_PX_PER_MM = 96 / 25.4;
export const DEVICE_SCALE = 2;

/** The viewport a page is laid out at for print: the text column of the paper, CSS px. */
export function printViewport(paper: PdfMeta['paper']): { width: number; height: number } {
  return {
    width: Math.round((PAPER[paper].width - 2 * MARGIN_MM.side) * CSS_PX_PER_MM),
    height: Math.round((PAPER[paper].height - MARGIN_MM.top - MARGIN_MM.bottom) * CSS_PX_PER_MM),
  };
}

/** The margins of page.pdf, as CSS lengths. */
export function printMargins(): { top: string; bottom: string; left: string; right: string } {
  return { top: `${MARGIN_MM.top}mm`, bottom: `${MARGIN_MM.bottom}mm`, left: `${MARGIN_MM.side}mm`, right: `${MARGIN_MM.side}mm` };
}

function isoDay(date: Date): string {
  return date.toISOString().slice(0, 10);
}

/** Inline style of both bands: Chromium renders them apart from the page, without its CSS. */
const BAND_STYLE = [
  "font-family: 'DejaVu Sans', 'Liberation Sans', Arial, sans-serif",
  'font-size: 7.5pt',
  'line-height: 1.2',
  'color: #333',
  'width: 100%',
  `margin: 0 ${MARGIN_MM.side}mm`,
  'display: flex',
  'justify-content: space-between',
  'gap: 6mm',
  '-webkit-print-color-adjust: exact',
].join('; ');
const CELL_STYLE = 'white-space: nowrap; overflow: hidden; text-overflow: ellipsis';

/** The running header: document number and title left, revision and status right. */
export function headerTemplate(meta: PdfMeta): string {
  return (
    `<div style="${BAND_STYLE}; border-bottom: 0.5pt solid #888; padding-bottom: 1.2mm">` +
    `<span style="${CELL_STYLE}">${escapeHtml(meta.documentNumber)} · ${escapeHtml(meta.title)}</span>` +
    `<span style="white-space: nowrap">Rev ${escapeHtml(meta.revision)} · ${escapeHtml(meta.status)}</span>` +
    '</div>'
  );
}

/** The running footer: number, revision, status and date left, "page X of Y" right. */
export function footerTemplate(meta: PdfMeta): string {
  return (
    `<div style="${BAND_STYLE}; border-top: 0.5pt solid #888; padding-top: 1.2mm">` +
    `<span style="${CELL_STYLE}">${escapeHtml(meta.documentNumber)} rev ${escapeHtml(meta.revision)}, ${escapeHtml(meta.status)}, ${isoDay(meta.date)}</span>` +
    '<span style="white-space: nowrap">page <span class="pageNumber"></span> of <span class="totalPages"></span></span>' +
    '</div>'
  );
}

