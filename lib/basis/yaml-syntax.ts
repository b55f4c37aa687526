/**
 * YAML text to a document tree and plain data, with every syntax problem as a located
 * diagnostic in plain words: tabs in indentation, duplicate keys (with the line of the first),
 * unclosed quotes (at the opening quote), bad indentation, several documents in one file, and
 * alias bombs (refused past a small alias count). Parsing follows YAML 1.2 core schema, so
 * `2026-11-20` stays text and `yes` is not a boolean.
 */
import { isScalar, LineCounter, parseDocument, visit, type Document, type YAMLError } from 'yaml';
import type { Diagnostic } from './types.ts';

/** Aliases (*name) a basis may expand; a handful is all a basis needs, and it stops alias bombs. */
export const MAX_ALIASES = 50;

export interface ParsedYaml {
  doc: Document.Parsed;
  lines: LineCounter;
  /** The plain data, when the syntax allowed it to be read. */
  data?: unknown;
  errors: Diagnostic[];
  warnings: Diagnostic[];
}

function at(lines: LineCounter, file: string, offset: number, message: string, severity: 'error' | 'warning' = 'error'): Diagnostic {
  const { line, col } = lines.linePos(offset);
  return { severity, file, line, column: col, path: '', message };
}

/** The key at `offset` and where the same key first stands in its mapping. */
function duplicateKey(doc: Document.Parsed, lines: LineCounter, offset: number): string {
  let message = 'duplicate key; each key may appear once in a mapping';
  visit(doc, {
    Map(_, map) {
      const pair = map.items.find((p) => isScalar(p.key) && p.key.range?.[0] === offset);
      if (!pair || !isScalar(pair.key)) return undefined;
      const name = String(pair.key.value);
      const first = map.items.find((p) => isScalar(p.key) && String(p.key.value) === name);
      const firstLine = first && isScalar(first.key) && first.key.range ? lines.linePos(first.key.range[0]).line : undefined;
      message = `duplicate key "${name}"${firstLine ? ` (first given at line ${firstLine})` : ''}; each key may appear once in a mapping`;
      return visit.BREAK;
    },
  });
  return message;
}

/** Start of the last quoted scalar that opens before `offset` (where an unclosed quote began). */
function openingQuote(doc: Document.Parsed, offset: number): number {
  let start = offset;
  let best = -1;
  visit(doc, {
    Scalar(_, node) {
      const begin = node.range?.[0];
      if ((node.type === 'QUOTE_DOUBLE' || node.type === 'QUOTE_SINGLE') && begin !== undefined && begin < offset && begin > best) best = begin;
    },
  });
  if (best >= 0) start = best;
  return start;
}

/** The parser's own message, for the rarer codes. */
function plain(error: YAMLError): string {
  return `${error.message.charAt(0).toLowerCase()}${error.message.slice(1)} (YAML ${error.code})`;
}

function describe(doc: Document.Parsed, text: string, lines: LineCounter, file: string, error: YAMLError): Diagnostic {
  const offset = error.pos[0];
  switch (error.code) {
    case 'TAB_AS_INDENT':
      return at(lines, file, offset, 'a tab is used for indentation; YAML indents with spaces only');
    case 'DUPLICATE_KEY':
      return at(lines, file, offset, duplicateKey(doc, lines, offset));
    case 'MISSING_CHAR': {
      const quote = /closing (["'])/.exec(error.message)?.[1];
      if (quote) return at(lines, file, openingQuote(doc, offset), `this quoted text has no closing ${quote}`);
      return at(lines, file, offset, plain(error));
    }
    case 'BAD_INDENT':
      if (/^Flow (map|sequence)/.test(error.message)) {
        return at(lines, file, offset, `a flow ${error.message.startsWith('Flow map') ? 'mapping { … } is not closed with }' : 'list [ … ] is not closed with ]'} before the indentation ends`);
      }
      return at(lines, file, offset + (/^ */.exec(text.slice(offset))?.[0].length ?? 0), 'the indentation here does not line up: keys of one mapping (and items of one list) must start at the same column');
    case 'BLOCK_AS_IMPLICIT_KEY':
    case 'MULTILINE_IMPLICIT_KEY': {
      // The parser flags the value above; the mistake is the first line that continues it.
      const next = /\n[ \t]*(?=\S)/.exec(text.slice(offset, Math.max(error.pos[1], offset + 1)));
      const where = next ? offset + next.index + next[0].length : offset;
      return at(
        lines,
        file,
        where,
        next
          ? 'this line is indented under a key that already has a value on its own line; align it with the keys above it'
          : 'cannot read this as "key: value": check that every key ends with ": " and sits on one line',
      );
    }
    case 'MULTIPLE_DOCS':
      return at(lines, file, offset, 'the file holds more than one YAML document (a line "---" starts another); a design basis is one document');
    default:
      return at(lines, file, offset, plain(error));
  }
}

/**
 * The errors worth showing: every duplicate key, and the first other error only, since the
 * parser's recovery after a syntax error reports follow-on errors that are not mistakes. A
 * compact-mapping error is dropped in favour of the multi-line one at the same place, which
 * knows the line that caused it.
 */
function worthShowing(errors: readonly YAMLError[]): YAMLError[] {
  const multiline = new Set(errors.filter((e) => e.code === 'MULTILINE_IMPLICIT_KEY').map((e) => e.pos[0]));
  const kept = errors.filter((e) => !(e.code === 'BLOCK_AS_IMPLICIT_KEY' && multiline.has(e.pos[0])));
  const first = kept.find((e) => e.code !== 'DUPLICATE_KEY');
  return kept.filter((e) => e.code === 'DUPLICATE_KEY' || e === first);
}

/** The first alias of the document, for locating an alias-count error. */
function firstAliasOffset(doc: Document.Parsed): number {
  let offset = 0;
  visit(doc, {
    Alias(_, node) {
      offset = node.range?.[0] ?? 0;
      return visit.BREAK;
    },
  });
  return offset;
}

/**
 * Parses the text. Any syntax error stops the check there: the tree after it is unreliable,
 * and checking it would report mistakes that are not there.
 */
export function parseBasisYaml(text: string, file: string): ParsedYaml {
  const lines = new LineCounter();
  const doc = parseDocument(text, { lineCounter: lines, prettyErrors: false, uniqueKeys: true });
  const errors = worthShowing(doc.errors).map((e) => describe(doc, text, lines, file, e));
  const warnings = doc.warnings.map((w) => ({ ...describe(doc, text, lines, file, w), severity: 'warning' as const }));
  const result: ParsedYaml = { doc, lines, errors, warnings };
  if (errors.length) return result;
  if (doc.contents === null || (isScalar(doc.contents) && doc.contents.value === null)) {
    errors.push(at(lines, file, 0, 'the file holds only comments; start from `cellbasis new`'));
    return result;
  }
  try {
    result.data = doc.toJS({ maxAliasCount: MAX_ALIASES });
  } catch (error) {
    if (!/alias/i.test((error as Error).message)) throw error;
    errors.push(
      at(lines, file, firstAliasOffset(doc), `the aliases (*name) here expand to too much data; a design basis may expand at most ${MAX_ALIASES} aliases`),
    );
  }
  return result;
}
