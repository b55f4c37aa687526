/**
 * How messages repeat what a basis says: quoted as JSON, and cut short when long, so that a
 * message never copies a whole file into the terminal (a file that is one long text, a value
 * pasted by mistake, a file that is not a basis at all), with every character a reader cannot
 * see written as an escape (lib/core/visible-text.ts), so that the quote shows what the file holds.
 */
import { visibleText } from './visible-text.ts';

/** Most characters of a written value a message repeats. */
const MAX_QUOTED_CHARACTERS = 60;

/** `"800 degrees"`; a longer text as its beginning and its length: `"root:x:0:0:…" (2,345 characters)`. */
export function quoted(text: string): string {
  if (text.length <= MAX_QUOTED_CHARACTERS) return visibleText(JSON.stringify(text));
  let head = text.slice(0, MAX_QUOTED_CHARACTERS);
  // Never split a character written as two UTF-16 code units.
  if (/[\uD800-\uDBFF]$/.test(head)) head = head.slice(0, -1);
  return `${visibleText(JSON.stringify(`${head}…`))} (${text.length.toLocaleString('en-US')} characters)`;
}
