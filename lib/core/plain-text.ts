/** Plain-text tables and number formatting for terminal output. */

/** Formats with a fixed number of significant digits, without exponent for ordinary magnitudes. */
export function sig(value: number, digits = 6): string {
  if (!Number.isFinite(value)) return String(value);
  if (value === 0) return '0';
  const magnitude = Math.abs(value);
  if (magnitude >= 1e-4 && magnitude < 1e9) return Number(value.toPrecision(digits)).toString();
  return value.toExponential(digits - 1);
}

/** Left column labels, right column values, aligned. */
export function table(rows: [string, string][]): string {
  const width = Math.max(...rows.map(([k]) => k.length));
  return rows.map(([k, v]) => `${k.padEnd(width)}  ${v}`).join('\n') + '\n';
}

/** A grid with a header row; numbers right-aligned. */
export function grid(header: string[], rows: string[][]): string {
  const widths = header.map((h, i) => Math.max(h.length, ...rows.map((r) => (r[i] ?? '').length)));
  const line = (cells: string[]) => cells.map((c, i) => (i === 0 ? c.padEnd(widths[i]!) : c.padStart(widths[i]!))).join('  ');
  return [line(header), widths.map((w) => '-'.repeat(w)).join('  '), ...rows.map(line)].join('\n') + '\n';
}

/** A row of a text table: cells, or one line heading the rows under it. */
export interface TextRow {
  group?: string;
  cells: string[];
}

/** The widest a text-table column grows before its longer cells wrap onto further lines. */
const WRAP_WIDTH = 64;

/** A cell's text in lines of at most `width` characters, broken at spaces (a longer word stands alone). */
function wrapCell(text: string, width: number): string[] {
  if (text.length <= width) return [text];
  const lines: string[] = [];
  let line = '';
  for (const word of text.split(' ')) {
    if (line !== '' && line.length + 1 + word.length > width) {
      lines.push(line);
      line = word;
    } else line = line === '' ? word : `${line} ${word}`;
  }
  lines.push(line);
  return lines;
}

/**
 * A table for the terminal: the header, a rule, the rows with each column padded to its widest
 * cell (left- or right-aligned as `align` says), and a group row as its own line, indented
 * under nothing. A cell longer than WRAP_WIDTH (a value with its explanation) wraps onto further
 * lines of its row, so one long note does not widen the whole table past the terminal. Widths
 * count UTF-16 code units, which is one column for every character the documents print (Δ, °,
 * subscripts, the narrow no-break space of digit groups).
 */
export function textTable(head: readonly string[], align: readonly ('left' | 'right')[], rows: readonly TextRow[]): string {
  const cellRows = rows.filter((r) => r.group === undefined);
  const wrapped = new Map(cellRows.map((r) => [r, r.cells.map((c) => wrapCell(c, WRAP_WIDTH))]));
  const widths = head.map((h, i) => Math.max(h.length, ...cellRows.map((r) => Math.max(0, ...(wrapped.get(r)![i] ?? ['']).map((l) => l.length)))));
  // A wrapped cell is prose: its lines read from the left edge of the column whatever its alignment.
  const line = (cells: readonly string[], prose: readonly boolean[] = []) =>
    cells
      .map((c, i) => (align[i] === 'right' && !prose[i] ? c.padStart(widths[i]!) : c.padEnd(widths[i]!)))
      .join('  ')
      .trimEnd();
  const out = [line(head), widths.map((w) => '-'.repeat(w)).join('  ')];
  for (const r of rows) {
    if (r.group !== undefined) {
      out.push(r.group);
      continue;
    }
    const cells = wrapped.get(r)!;
    const prose = cells.map((c) => c.length > 1);
    const height = Math.max(1, ...cells.map((c) => c.length));
    for (let k = 0; k < height; k++) out.push(line(cells.map((c) => c[k] ?? ''), prose));
  }
  return out.join('\n') + '\n';
}

/** JSON for machines: two-space indent, trailing newline. */
export function json(value: unknown): string {
  return JSON.stringify(value, null, 2) + '\n';
}
