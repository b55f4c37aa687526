/**
 * CSV as RFC 4180 writes it, for spreadsheets: UTF-8 text (no byte-order mark), one record a
 * line, each line ended by CRLF (the last one too), fields separated by commas, and a field
 * enclosed in double quotes, its own quotes doubled, when it holds a comma, a quote, CR or LF.
 *
 * Values: a number in plain decimal or exponent notation with as many digits as it takes to be
 * read back exactly (JavaScript's shortest round-trip form: 0.1, 1073.15, 3.2e-7, 1.5e+21), never
 * rounded for display, never with a digit grouping or a unicode minus; true and false; text as
 * it is; nothing (null) as an empty field. A number that is not finite has no CSV form and is
 * refused, as JSON refuses it.
 */

export type CsvValue = number | string | boolean | null;

/** The text of one field, quoted where RFC 4180 requires it. */
function csvField(value: CsvValue): string {
  if (value === null) return '';
  if (typeof value === 'boolean') return value ? 'true' : 'false';
  if (typeof value === 'number') {
    if (!Number.isFinite(value)) throw new Error(`a CSV field cannot hold ${value}`);
    // String(-0) is "0": a negative zero is zero.
    return String(value);
  }
  return /[",\r\n]/.test(value) ? `"${value.replace(/"/g, '""')}"` : value;
}

/** One record and its line end. */
function csvLine(values: readonly CsvValue[]): string {
  let line = '';
  for (let i = 0; i < values.length; i++) line += i === 0 ? csvField(values[i]!) : `,${csvField(values[i]!)}`;
  return `${line}\r\n`;
}

/** A whole CSV file: the header row, then every row, each of the header's length. Written by plain loops: the site writes some 30 files a document. */
export function csvText(header: readonly string[], rows: readonly (readonly CsvValue[])[]): string {
  let text = csvLine(header);
  for (let i = 0; i < rows.length; i++) {
    const row = rows[i]!;
    if (row.length !== header.length) throw new Error(`CSV row ${i + 1} has ${row.length} fields for ${header.length} columns`);
    text += csvLine(row);
  }
  return text;
}
