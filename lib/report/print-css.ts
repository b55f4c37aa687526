/**
 * The running header and footer of the printed document, as CSS string literals for the @page
 * margin boxes. They hold user text (document number, revision), so every character but letters,
 * digits and spaces is written as a CSS escape: nothing in them can end the string or the style
 * element.
 */
import { trustedHtml, type TrustedHtml } from './trusted-html.ts';

/** A CSS string literal of the text: "DB\2d 001 revision A". */
export function cssString(text: string): TrustedHtml {
  const body = [...text].map((c) => (/[A-Za-z0-9 ]/.test(c) ? c : `\\${c.codePointAt(0)!.toString(16)} `)).join('');
  return trustedHtml(`"${body}"`);
}

export interface PrintMarks {
  /** Left of the footer: number, revision and the status mark's words. */
  footer: TrustedHtml;
  /** Top of every page: the status mark's words for a working draft, else empty. */
  header: TrustedHtml;
}

export function printMarks(number: string, revision: string, mark: { kind: string; text: string }): PrintMarks {
  return {
    footer: cssString(`${number}, revision ${revision}`),
    header: cssString(mark.kind === 'draft' ? mark.text : ''),
  };
}
