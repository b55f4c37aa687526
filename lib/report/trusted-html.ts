/**
 * HTML that the view model produced itself (KaTeX output of our own LaTeX, chart JSON escaped
 * for a script element) and that the templates may therefore insert without escaping. The
 * templates' `trusted` filter (lib/publish/nunjucks-env.ts) accepts only values made here and
 * throws on anything else, so user text can never reach the page unescaped by mistake.
 *
 * The brand is a registered symbol, checked instead of `instanceof`, so that it holds across two
 * copies of this module (the CLI's and the one Eleventy's configuration loads) in one process.
 */
const BRAND = Symbol.for('cellbasis.trusted-html');

/** A class instance, not a plain object, so that data merging (Eleventy's cascade) passes it on untouched. */
export class TrustedHtml {
  readonly [BRAND] = true as const;
  constructor(readonly html: string) {
    Object.freeze(this);
  }

  toString(): string {
    return this.html;
  }

  toJSON(): string {
    return this.html;
  }
}

/** Marks HTML the view model generated from its own input as safe to insert. Never call it on user text. */
export function trustedHtml(html: string): TrustedHtml {
  return new TrustedHtml(html);
}

export function isTrustedHtml(value: unknown): value is TrustedHtml {
  return typeof value === 'object' && value !== null && (value as Record<symbol, unknown>)[BRAND] === true && typeof (value as TrustedHtml).html === 'string';
}

/**
 * Escapes text for HTML element content and attribute values exactly as the templates'
 * autoescaping does (Nunjucks: & < > " ' and the backslash, as &#92;), so that code looking for
 * a user's text in a rendered page (the audit, for the note of an issued revision) finds it as the page has it.
 */
export function escapeHtml(text: string): string {
  return SPECIAL.test(text) ? text.replace(SPECIALS, (c) => ENTITIES[c]!) : text;
}

const ENTITIES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;', '\\': '&#92;' };
const SPECIAL = /[&<>"'\\]/;
const SPECIALS = /[&<>"'\\]/g;
