/**
 * Text as a reader sees it. Some characters show nothing (a zero-width space, a soft hyphen),
 * and some change the order in which the characters around them are displayed (the explicit
 * bidirectional formatting characters of Unicode's bidirectional algorithm, UAX #9, sections
 * 2.1 to 2.4), so that text can read differently from what it says: the "Trojan Source" attack on
 * program text (Boucher and Anderson, 2021, CVE-2021-42574). cellbasis refuses the reordering
 * characters in a design basis (lib/basis/source-text.ts), refuses the invisible ones where a
 * name or an id is expected, and shows every one of them escaped, as `\u200B`, whenever a message
 * repeats text it was given, so that what a message shows is what the file holds.
 *
 *   invisibleCharacters(text)  each character a reader cannot see, with where it stands
 *   reorderingCharacters(text) each character that reorders the display of the text around it
 *   visibleText(text)          the text with each of them written as \uXXXX (or \u{XXXXX})
 *   characterText(char)        "U+200B ZERO WIDTH SPACE", for messages
 */
import { createRequire } from 'node:module';

/**
 * The characters a reader cannot see or that reorder what is displayed: Unicode's
 * default-ignorable code points (zero-width characters, soft hyphen, variation selectors, tags,
 * fillers), the bidirectional controls (marks, embeddings, overrides, isolates), controls,
 * private-use and unassigned code points, lone surrogates, and every white space but the plain
 * space (tab, no-break and other spaces, line and paragraph separators).
 */
const INVISIBLE = /[\p{Default_Ignorable_Code_Point}\p{Bidi_Control}\p{Cc}\p{Co}\p{Cn}\p{Cs}\p{Zl}\p{Zp}]|(?! )\s/gu;

/** The explicit directional formatting characters of UAX #9 (embeddings, overrides, isolates and their ends), which reorder the display of the text around them. */
const REORDERING = /[\u202A-\u202E\u2066-\u2069]/g;

/** Each character of `text` that reorders the display of the text around it, with its index. */
export function reorderingCharacters(text: string): { char: string; index: number }[] {
  return [...text.matchAll(REORDERING)].map((m) => ({ char: m[0], index: m.index }));
}

/** `\u200B`, or `\u{E0041}` beyond the Basic Multilingual Plane. */
function escape(char: string): string {
  const code = char.codePointAt(0)!;
  const hex = code.toString(16).toUpperCase();
  return code > 0xffff ? `\\u{${hex}}` : `\\u${hex.padStart(4, '0')}`;
}

/** Each character of `text` that a reader cannot see, with its index (UTF-16 code units). */
export function invisibleCharacters(text: string): { char: string; index: number }[] {
  return [...text.matchAll(INVISIBLE)].map((m) => ({ char: m[0], index: m.index }));
}

/** The text with every character a reader cannot see written as an escape: `R1\u200B`. A plain text is returned as it is. */
export function visibleText(text: string): string {
  return text.replace(INVISIBLE, escape);
}

const require = createRequire(import.meta.url);
let names: ((char: string) => string | undefined) | undefined;

/** The character's Unicode name, from the unicode-name package (loaded on first use: it is large). */
function unicodeName(char: string): string | undefined {
  names ??= (require('unicode-name') as { unicodeName(char: string): string | undefined }).unicodeName;
  return names(char);
}

/** `U+200B ZERO WIDTH SPACE`: the code point and its Unicode name, for messages. */
export function characterText(char: string): string {
  const code = `U+${char.codePointAt(0)!.toString(16).toUpperCase().padStart(4, '0')}`;
  const name = unicodeName(char);
  return name ? `${code} ${name}` : code;
}
