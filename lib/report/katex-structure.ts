/**
 * KaTeX output of an expression's structure, filled with its numbers. A worked line of one
 * project and the same line of another differ only in their numbers, and KaTeX's output does not
 * otherwise depend on them: every digit of a font has the same height and depth (Computer
 * Modern's digits are tabular), KaTeX writes no widths for a row of ordinary symbols, and it
 * joins a number's digits and decimal point into one text node (HTML <span class="mord">, MathML
 * <mn>, the TeX annotation verbatim). A structure is therefore rendered once, and each expression
 * of it is made by placing its numbers in the structure's output.
 *
 *   splitNumbers(tex)            the source with every number made 0 or 00 (the structure's key)
 *                                and the numbers: "E = 1.25\,3" → "E = 00\,0", ["1.25", "3"]
 *   learnStructure(key, render)  the structure's output and where each number lands in it,
 *                                or null where the output does not follow that rule
 *   fillStructure(s, numbers)    the output of the expression with these numbers
 *
 * Where each number lands is learnt, not assumed: KaTeX writes a fraction's denominator before its
 * numerator in the HTML and a subscript before a superscript, and every number appears several
 * times (HTML, MathML, the annotation). learnStructure renders the key, then P probes of it
 * (1 ≤ P, 9^P ≥ number of numbers): in probe q the k-th number of the source becomes the digit
 * 1 + ⌊k / 9^q⌋ mod 9, so every number changes in every probe and the probes together spell k at
 * each place it lands. A probe of a different length, one that changes any character other than a
 * 0 of the key's output into a digit, or one that changes other places than the first probe, means
 * the output depends on the numbers in some other way, and the structure is not used (null: the
 * caller renders its expressions with KaTeX itself). A last render with numbers of several lengths,
 * decimal points and digits must then equal the filled structure, or it is not used either.
 *
 * A number is a run of digits with at most one decimal point inside it; a script without braces
 * takes its first digit alone (x_12 is x₁ then 2). Sources where a digit is not a number shown
 * are never structured: a size or colour (\kern, \rule, \color, #...), or a digit right after a
 * command that would take it as its argument (\frac12).
 */

/** Commands whose numeric arguments are sizes or colours, not numbers shown: such sources are not structured. */
const SIZED = /\\(?:kern|mkern|hskip|mskip|hspace|vspace|rule|raisebox|scalebox|color|textcolor|colorbox|fcolorbox|includegraphics|htmlStyle)|\\\\\[|#/;

/** A digit right after a command, which TeX would take alone as its argument unless the command is one of these, which take none. */
const BARE_ARGUMENT = /\\([a-zA-Z]+)\s*\d/g;
const NO_ARGUMENT = new Set(['times', 'cdot', 'pm', 'mp', 'approx', 'le', 'ge', 'leq', 'geq', 'quad', 'qquad', 'to', 'ne', 'equiv', 'sim', 'div', 'minus']);

/** A number of the source: digits, with at most one decimal point between digits. */
const NUMBER = /\d+(?:\.\d+)?/g;

export interface KatexStructure {
  /** The output cut at each place a number lands: pieces.length === slots.length + 1. */
  pieces: string[];
  /** Which number of the source (0-based, in source order) lands at each cut. */
  slots: number[];
}

/** An expression as its structure's key, its numbers in source order and the width each has in the key. */
export interface KatexNumbers {
  key: string;
  numbers: string[];
  /** 1 for a one-digit number ("0" in the key), 2 for a longer one ("00"). */
  widths: number[];
}

const SCRIPT = /\s*[_^]/y;

/**
 * The source with every number made 0 (one digit) or 00 (longer: KaTeX sets a lone character
 * under a script or accent differently from a group), and the numbers, or null when the source
 * has no number or must not be structured. A script binds to the last digit alone (37^{2} is 3
 * then 7²), so a number followed by _ or ^ is two: its head and its last digit (a head ending in
 * a decimal point is left to KaTeX).
 */
export function splitNumbers(tex: string): KatexNumbers | null {
  if (!/\d/.test(tex) || SIZED.test(tex)) return null;
  // Plain exec loops and no closure (tsx names each closure made): some 210 expressions a page come through here.
  BARE_ARGUMENT.lastIndex = 0;
  for (let m = BARE_ARGUMENT.exec(tex); m !== null; m = BARE_ARGUMENT.exec(tex)) if (!NO_ARGUMENT.has(m[1]!)) return null;
  const numbers: string[] = [];
  const widths: number[] = [];
  let key = '';
  let from = 0;
  NUMBER.lastIndex = 0;
  for (let m = NUMBER.exec(tex); m !== null; m = NUMBER.exec(tex)) {
    let text = m[0];
    key += tex.slice(from, m.index);
    from = m.index + text.length;
    if (scriptBefore(tex, m.index)) {
      // x_12 is x₁ then 2: a script without braces takes one digit.
      key += addNumber(text[0]!, numbers, widths);
      text = text.slice(1);
      if (text === '') continue;
      if (text.startsWith('.')) return null;
    }
    SCRIPT.lastIndex = from;
    if (text.length > 1 && SCRIPT.test(tex)) {
      const head = text.slice(0, -1);
      if (head.endsWith('.')) return null;
      key += addNumber(head, numbers, widths) + addNumber(text.slice(-1), numbers, widths);
    } else key += addNumber(text, numbers, widths);
  }
  return { key: key + tex.slice(from), numbers, widths };
}

/** Records a number of the source and its width; returns what stands for it in the key (0 or 00). */
function addNumber(text: string, numbers: string[], widths: number[]): string {
  numbers.push(text);
  widths.push(text.length > 1 ? 2 : 1);
  return text.length > 1 ? '00' : '0';
}

/** Whether a _ or ^ stands right before `at` (spaces apart). */
function scriptBefore(tex: string, at: number): boolean {
  let i = at - 1;
  while (i >= 0 && tex[i] === ' ') i--;
  return tex[i] === '_' || tex[i] === '^';
}

/** The key with its k-th number made number(k); `widths` says how many zeros of the key each number is. */
function withNumbers(key: string, widths: readonly number[], number: (k: number) => string): string {
  let k = 0;
  return key.replace(/0+/g, (run) => {
    // A run of zeros is one number, or a head and its last digit.
    let text = '';
    for (let used = 0; used < run.length; used += widths[k - 1]!) text += number(k++);
    return text;
  });
}

/** Learns where each number of the key lands in its output (see above); null where that rule does not hold. */
export function learnStructure(split: Pick<KatexNumbers, 'key' | 'widths'>, render: (tex: string) => string): KatexStructure | null {
  const { key, widths } = split;
  const count = widths.length;
  const base = render(key);
  let probes = 1;
  while (9 ** probes < count) probes++;
  const code = new Map<number, number>();
  for (let q = 0; q < probes; q++) {
    const scale = 9 ** q;
    const out = render(withNumbers(key, widths, (k) => String(1 + (Math.floor(k / scale) % 9)).repeat(widths[k]!)));
    if (out.length !== base.length) return null;
    let changed = 0;
    for (let i = 0; i < out.length; i++) {
      const c = out.charCodeAt(i);
      if (c === base.charCodeAt(i)) continue;
      // Only a 0 of the key's output may change, and only into a digit 1-9.
      if (base.charCodeAt(i) !== 48 || c < 49 || c > 57) return null;
      const previous = code.get(i);
      if (q === 0) code.set(i, c - 49);
      else if (previous === undefined) return null;
      else code.set(i, previous + (c - 49) * scale);
      changed++;
    }
    if (changed !== code.size) return null;
  }
  // Each place a number lands is a run of as many changed characters as its width.
  const places = [...code.keys()].sort((x, y) => x - y);
  const pieces: string[] = [];
  const slots: number[] = [];
  let from = 0;
  for (let j = 0; j < places.length; ) {
    const at = places[j]!;
    const k = code.get(at)!;
    const width = widths[k];
    if (width === undefined) return null;
    for (let w = 1; w < width; w++) if (places[j + w] !== at + w || code.get(at + w) !== k) return null;
    pieces.push(base.slice(from, at));
    slots.push(k);
    from = at + width;
    j += width;
  }
  pieces.push(base.slice(from));
  if (new Set(slots).size !== count) return null;
  const structure = { pieces, slots };
  // A last check with numbers unlike the probes' (longer ones of several lengths, with decimal
  // points): the filled structure must be KaTeX's own output.
  const checkNumbers = widths.map((w, k) => (w === 1 ? String((k * 7 + 3) % 10) : CHECK_NUMBERS[k % CHECK_NUMBERS.length]!));
  return fillStructure(structure, checkNumbers) === render(withNumbers(key, widths, (k) => checkNumbers[k]!)) ? structure : null;
}

/** Numbers of several lengths, with and without a decimal point, for the last check of a structure. */
const CHECK_NUMBERS = ['37', '0.5', '1234.068', '90', '6.25', '12.5'];

/** The output of an expression of the structure (splitNumbers gives its numbers): the numbers placed in the structure's output. */
export function fillStructure(structure: KatexStructure, numbers: readonly string[]): string {
  const { pieces, slots } = structure;
  let html = pieces[0]!;
  for (let j = 0; j < slots.length; j++) html += numbers[slots[j]!]! + pieces[j + 1]!;
  return html;
}
