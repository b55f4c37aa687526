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

/**
 * A table for the terminal: the header, a rule, the rows with each column padded to its widest
 * cell (left- or right-aligned as `align` says), and a group row as its own line, indented
 * under nothing. Widths count UTF-16 code units, which is one column for every character the
 * documents print (Δ, °, subscripts, the narrow no-break space of digit groups).
 */
export function textTable(head: readonly string[], align: readonly ('left' | 'right')[], rows: readonly TextRow[]): string {
  const cellRows = rows.filter((r) => r.group === undefined);
  const widths = head.map((h, i) => Math.max(h.length, ...cellRows.map((r) => (r.cells[i] ?? '').length)));
  const line = (cells: readonly string[]) =>
    cells
      .map((c, i) => (align[i] === 'right' ? c.padStart(widths[i]!) : c.padEnd(widths[i]!)))
      .join('  ')
      .trimEnd();
  const out = [line(head), widths.map((w) => '-'.repeat(w)).join('  ')];
  for (const r of rows) out.push(r.group === undefined ? line(r.cells) : r.group);
  return out.join('\n') + '\n';
}

/** JSON for machines: two-space indent, trailing newline. */
export function json(value: unknown): string {
  return JSON.stringify(value, null, 2) + '\n';
}
