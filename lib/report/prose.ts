/**
 * Paragraphs of our own wording with inline mathematics: `prose('the potential $\mu_i$ of ...')`
 * splits the text at $...$ into plain segments, which the templates escape, and KaTeX segments
 * rendered here. Only for text written in this code base, never for user text (which is shown
 * as plain strings and escaped by the templates).
 */
import { renderTex } from './katex-render.ts';
import { escapeHtml, trustedHtml, type TrustedHtml } from './trusted-html.ts';

export type Segment = { text: string; math?: undefined } | { math: TrustedHtml; text?: undefined };

export type Paragraph = Segment[];

export function prose(source: string): Paragraph {
  const pieces = source.split('$');
  if (pieces.length % 2 === 0) throw new Error(`unbalanced $ in the method text: ${source}`);
  return pieces.flatMap((piece, i): Segment[] => {
    if (i % 2 === 1) return [{ math: renderTex(piece) }];
    return piece === '' ? [] : [{ text: piece }];
  });
}

/**
 * A paragraph's content as HTML (without the <p> element): the mathematics as KaTeX wrote it and
 * the text escaped as the templates' autoescaping does. The method's paragraphs reach the page so,
 * not through a Nunjucks loop over their segments (a scope and seven loop variables each).
 */
export function paragraphHtml(paragraph: Paragraph): TrustedHtml {
  let html = '';
  for (const s of paragraph) {
    if (s.math) html += s.math.html;
    else if (typeof s.text === 'string') html += escapeHtml(s.text);
    else throw new Error('a paragraph segment holds neither text nor mathematics');
  }
  return trustedHtml(html);
}
