/**
 * From the bytes of a basis file to the text the YAML parser reads: refuses files over the
 * size limit, decodes strict UTF-8 (locating every bad byte by line and column; a UTF-16 file
 * is named as such), refuses the control characters YAML does not allow, drops a byte order
 * mark and turns CRLF line ends into LF. Line and column numbers are 1-based; a column
 * counts UTF-16 code units, as the YAML parser's do.
 */
import type { Diagnostic } from './types.ts';
import { characterText, reorderingCharacters } from '../core/visible-text.ts';

/**
 * Largest basis file read, bytes: a real basis is a few kilobytes, and the YAML parser takes
 * about a second per 200 kB of the most tightly packed keys, so the limit also bounds the time
 * a hostile file can take.
 */
export const MAX_BASIS_BYTES = 256 * 1024;

/** At most this many bad bytes are reported; the rest of the file is then unreadable anyway. */
const MAX_ENCODING_DIAGNOSTICS = 10;

export type DecodeResult = { ok: true; text: string } | { ok: false; errors: Diagnostic[] };

/** Length of the well-formed UTF-8 sequence starting at i, or 0 when the byte there cannot start one (RFC 3629, table 3-7 of Unicode). */
function sequenceLength(bytes: Uint8Array, i: number): number {
  const b = bytes[i]!;
  const cont = (k: number, low = 0x80, high = 0xbf) => i + k < bytes.length && bytes[i + k]! >= low && bytes[i + k]! <= high;
  if (b < 0x80) return 1;
  if (b >= 0xc2 && b <= 0xdf) return cont(1) ? 2 : 0;
  if (b === 0xe0) return cont(1, 0xa0) && cont(2) ? 3 : 0;
  if ((b >= 0xe1 && b <= 0xec) || b === 0xee || b === 0xef) return cont(1) && cont(2) ? 3 : 0;
  if (b === 0xed) return cont(1, 0x80, 0x9f) && cont(2) ? 3 : 0;
  if (b === 0xf0) return cont(1, 0x90) && cont(2) && cont(3) ? 4 : 0;
  if (b >= 0xf1 && b <= 0xf3) return cont(1) && cont(2) && cont(3) ? 4 : 0;
  if (b === 0xf4) return cont(1, 0x80, 0x8f) && cont(2) && cont(3) ? 4 : 0;
  return 0;
}

function hex(byte: number): string {
  return `0x${byte.toString(16).toUpperCase().padStart(2, '0')}`;
}

/** Every byte that does not begin or continue a well-formed UTF-8 character, with its line and column. */
function encodingErrors(bytes: Uint8Array, file: string): Diagnostic[] {
  const errors: Diagnostic[] = [];
  const lenient = new TextDecoder('utf-8');
  let line = 1;
  let lineStart = 0;
  for (let i = 0; i < bytes.length && errors.length < MAX_ENCODING_DIAGNOSTICS; ) {
    const length = sequenceLength(bytes, i);
    if (length === 0) {
      const column = lenient.decode(bytes.subarray(lineStart, i)).length + 1;
      errors.push({
        severity: 'error',
        file,
        line,
        column,
        path: '',
        message: `byte ${hex(bytes[i]!)} is not valid UTF-8 (the file may be saved in Latin-1 or Windows-1252); save it as UTF-8`,
      });
      i += 1;
      continue;
    }
    if (bytes[i] === 0x0a) {
      line += 1;
      lineStart = i + 1;
    }
    i += length;
  }
  return errors;
}

/**
 * Characters YAML 1.2 does not allow in a file (its c-printable set, section 5.1): the C0 controls
 * but tab, line feed and carriage return, DEL, the C1 controls but NEL, and U+FFFE and U+FFFF.
 */
const NOT_PRINTABLE = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F-\u0084\u0086-\u009F\uFFFE\uFFFF]/g;

/**
 * Every character YAML does not allow, and every bidirectional control that reorders the display
 * of the text around it (an editor, a terminal or a review tool would show the file in another
 * order than the one it is read in), with its line and column (at most MAX_ENCODING_DIAGNOSTICS).
 */
function controlCharacterErrors(text: string, file: string): Diagnostic[] {
  const errors: Diagnostic[] = [];
  const found = [
    ...[...text.matchAll(NOT_PRINTABLE)].map((m) => ({ index: m.index, message: `the control character U+${m[0].charCodeAt(0).toString(16).toUpperCase().padStart(4, '0')} is not allowed in a YAML file; delete it` })),
    ...reorderingCharacters(text).map(({ char, index }) => ({
      index,
      message: `the bidirectional control ${characterText(char)} changes the order in which the text around it is displayed, so the file would read differently from what it holds; delete it`,
    })),
  ].sort((a, b) => a.index - b.index);
  for (const { index, message } of found.slice(0, MAX_ENCODING_DIAGNOSTICS)) {
    const before = text.slice(0, index);
    const line = before.split('\n').length;
    const column = index - before.lastIndexOf('\n');
    errors.push({ severity: 'error', file, line, column, path: '', message });
  }
  return errors;
}

function fileError(file: string, message: string): Diagnostic {
  return { severity: 'error', file, line: 1, column: 1, path: '', message };
}

/** The size error, for callers that check the size before reading the file; `atLeast` when reading stopped at `bytes`. */
export function tooLargeError(file: string, bytes: number, atLeast = false): Diagnostic {
  return fileError(
    file,
    `the file is ${atLeast ? 'more than ' : ''}${(atLeast ? MAX_BASIS_BYTES : bytes).toLocaleString('en-US')} bytes; a design basis may be at most ${MAX_BASIS_BYTES / 1024} KiB (${MAX_BASIS_BYTES.toLocaleString('en-US')} bytes): is this the right file?`,
  );
}

/** Decodes a basis file: the text with LF line ends, or located errors. */
export function decodeBasisBytes(input: string | Uint8Array, file: string): DecodeResult {
  let text: string;
  if (typeof input === 'string') {
    if (Buffer.byteLength(input, 'utf8') > MAX_BASIS_BYTES) return { ok: false, errors: [tooLargeError(file, Buffer.byteLength(input, 'utf8'))] };
    text = input.replace(/^\uFEFF/, '');
  } else {
    if (input.length > MAX_BASIS_BYTES) return { ok: false, errors: [tooLargeError(file, input.length)] };
    const utf16 = (input[0] === 0xff && input[1] === 0xfe) || (input[0] === 0xfe && input[1] === 0xff);
    if (utf16) return { ok: false, errors: [fileError(file, `the file is saved as UTF-16 (it starts with the bytes ${hex(input[0]!)} ${hex(input[1]!)}); save it as UTF-8`)] };
    try {
      text = new TextDecoder('utf-8', { fatal: true }).decode(input);
    } catch {
      return { ok: false, errors: encodingErrors(input, file) };
    }
  }
  const controls = controlCharacterErrors(text, file);
  if (controls.length) return { ok: false, errors: controls };
  text = text.replace(/\r\n/g, '\n');
  if (text.trim() === '') return { ok: false, errors: [fileError(file, 'the file is empty; start from `cellbasis new`')] };
  return { ok: true, text };
}
