/**
 * The basis text of a sealed revision: the working text with `document.revision` and
 * `document.status` set to the sealed values and nothing else touched. The yaml Document API
 * finds the two scalars and their source ranges, and only those characters are replaced, so
 * comments, quoting, key order, blank lines and flow mappings stay exactly as the engineer wrote
 * them. A value that would read as something else unquoted (a number revision such as 0 or 1)
 * is written in double quotes; otherwise the original quoting style is kept.
 */
import { isScalar, parseDocument, Scalar } from 'yaml';

type Field = 'revision' | 'status';

function quoted(value: string, style: Scalar['type']): string {
  if (style === 'QUOTE_SINGLE') return `'${value.replaceAll("'", "''")}'`;
  if (style === 'QUOTE_DOUBLE' || !/^[A-Za-z][A-Za-z .-]*[A-Za-z]$|^[A-Za-z]$/.test(value)) return JSON.stringify(value);
  return value;
}

/**
 * The text with document.revision and document.status replaced. Throws when either field is not
 * a plain value under `document:` (a basis that passed validation always has both).
 */
export function sealedBasisText(text: string, revision: string, status: string): string {
  const doc = parseDocument(text, { keepSourceTokens: false });
  const edits: { start: number; end: number; value: string }[] = [];
  const values: Record<Field, string> = { revision, status };
  for (const field of ['revision', 'status'] as const) {
    const node = doc.getIn(['document', field], true);
    if (!isScalar(node) || !node.range) throw new Error(`document.${field} is not a plain value in the basis text`);
    edits.push({ start: node.range[0], end: node.range[1], value: quoted(values[field], node.type) });
  }
  edits.sort((a, b) => b.start - a.start);
  let out = text;
  for (const e of edits) out = out.slice(0, e.start) + e.value + out.slice(e.end);
  const check = parseDocument(out);
  if (check.getIn(['document', 'revision']) !== revision || check.getIn(['document', 'status']) !== status) {
    throw new Error('rewriting document.revision and document.status did not give the sealed values');
  }
  return out;
}
