/**
 * YAML text to a document tree and plain data, with every syntax problem as a located
 * diagnostic in plain words: tabs in indentation, duplicate keys (with the line of the first),
 * unclosed quotes (at the opening quote), bad indentation, several documents in one file,
 * alias bombs (refused past a small alias count), and what yaml-limits.ts refuses before the
 * tree is built (deep nesting, tags). Parsing follows YAML 1.2 core schema, so
 * `2026-11-20` stays text and `yes` is not a boolean.
 */
import { Composer, isAlias, isMap, isScalar, LineCounter, Parser, visit, YAMLParseError, type Document, type Node, type YAMLError } from 'yaml';
import { flowDepthProblem, tokenProblems } from './yaml-limits.ts';
import type { Diagnostic } from './types.ts';
import { characterText, invisibleCharacters, reorderingCharacters } from '../core/visible-text.ts';
import { quoted } from '../core/quote.ts';

/** Aliases (*name) a basis may expand; a handful is all a basis needs, and it stops alias bombs. */
const MAX_ALIASES = 50;

/** Longest key accepted: keys are names (sections, species, mixtures), and messages repeat them. */
const MAX_KEY_CHARACTERS = 200;

/** The document tree and its plain data, or the syntax errors that stopped the reading. */
export type ParsedYaml =
  | { ok: true; doc: Document.Parsed; lines: LineCounter; data: unknown; warnings: Diagnostic[] }
  | { ok: false; errors: Diagnostic[]; warnings: Diagnostic[] };

function at(lines: LineCounter, file: string, offset: number, message: string, severity: 'error' | 'warning' = 'error'): Diagnostic {
  const { line, col } = lines.linePos(offset);
  return { severity, file, line, column: col, path: '', message };
}

/**
 * Why a key is no name: empty, blank, or holding a character a reader cannot see (a zero-width
 * space in a mixture's name makes it another name than the one the streams use, though both
 * read alike); undefined for a plain key.
 */
function keyNameProblem(name: string): string | undefined {
  if (name === '') return 'this key is empty; a key is a name, such as cells or CH4';
  if (name.trim() === '') return `this key is only spaces (${quoted(name)}); a key is a name, such as cells or CH4`;
  const hidden = invisibleCharacters(name);
  if (hidden.length) return `the key ${quoted(name)} holds the invisible character ${characterText(hidden[0]!.char)}; delete it`;
  return undefined;
}

/**
 * Keys that are not plain text (a mapping, list or alias as a key, which the data cannot hold),
 * are too long to be a name or are no name (keyNameProblem), and every key given a second time in its mapping, at the repeat, naming the line of the first: one
 * pass with a set per mapping (the parser's own check compares every pair of keys, which takes
 * minutes on a file of many keys). Keys are compared as the data will hold them, as text.
 */
function keyProblems(doc: Document.Parsed, lines: LineCounter, file: string): Diagnostic[] {
  const found: Diagnostic[] = [];
  visit(doc, {
    Map(_, map) {
      const first = new Map<string, number>();
      for (const pair of map.items) {
        const key = pair.key as Node | null;
        const start = key?.range?.[0];
        if (start === undefined) continue;
        if (!isScalar(key)) {
          found.push(at(lines, file, start, `a key must be plain text, but this key is ${isAlias(key) ? 'an alias (*name)' : isMap(key) ? 'a mapping' : 'a list'}`));
          continue;
        }
        const name = String(key.value);
        if (name.length > MAX_KEY_CHARACTERS) {
          found.push(at(lines, file, start, `this key is ${name.length.toLocaleString('en-US')} characters long; the keys of a design basis are names of at most ${MAX_KEY_CHARACTERS} characters`));
          continue;
        }
        const unnamed = keyNameProblem(name);
        if (unnamed) {
          found.push(at(lines, file, start, unnamed));
          continue;
        }
        const earlier = first.get(name);
        if (earlier === undefined) first.set(name, start);
        else found.push(at(lines, file, start, `duplicate key "${name}" (first given at line ${lines.linePos(earlier).line}); each key may appear once in a mapping`));
      }
    },
  });
  return found;
}

/**
 * Text that an escape (`"\u202E"`) gives a bidirectional control which reorders the display of
 * the text around it: the file reads plainly, but the document, the messages and any tool
 * showing the value would show it in another order. (Such a character written as itself is
 * refused before parsing, lib/basis/source-text.ts.)
 */
function reorderedTexts(doc: Document.Parsed, lines: LineCounter, file: string): Diagnostic[] {
  const found: Diagnostic[] = [];
  visit(doc, {
    Scalar(_, node) {
      const start = node.range?.[0];
      if (typeof node.value !== 'string' || start === undefined) return;
      const reordering = reorderingCharacters(node.value)[0];
      if (reordering) {
        found.push(at(lines, file, start, `this text holds the bidirectional control ${characterText(reordering.char)}, which changes the order in which the text around it is displayed; delete it`));
      }
    },
  });
  return found;
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
    case 'MISSING_CHAR': {
      const quote = /closing (["'])/.exec(error.message)?.[1];
      if (quote) return at(lines, file, openingQuote(doc, offset), `this quoted text has no closing ${quote}`);
      if (/^Implicit map keys need to be followed by map values/.test(error.message)) {
        return at(lines, file, offset, 'cannot read this line as "key: value": a key ends with a colon and a space, as in "cells: 1200"');
      }
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
 * The parser error worth showing: the first only, since the parser's recovery after a syntax
 * error reports follow-on errors that are not mistakes. A compact-mapping error is dropped in
 * favour of the multi-line one at the same place, which knows the line that caused it.
 */
function worthShowing(errors: readonly YAMLError[]): YAMLError[] {
  const multiline = new Set(errors.filter((e) => e.code === 'MULTILINE_IMPLICIT_KEY').map((e) => e.pos[0]));
  const first = errors.find((e) => !(e.code === 'BLOCK_AS_IMPLICIT_KEY' && multiline.has(e.pos[0])));
  return first ? [first] : [];
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

/** Text to tokens to one document, as the yaml package's parseDocument does, refusing what yaml-limits.ts refuses before the tree is built. */
function compose(text: string, lines: LineCounter, file: string): { doc: Document.Parsed } | { problems: Diagnostic[] } {
  const deep = flowDepthProblem(text);
  if (deep) {
    // The parser, which counts lines, has not run.
    lines.addNewLine(0);
    for (let i = text.indexOf('\n'); i >= 0; i = text.indexOf('\n', i + 1)) lines.addNewLine(i + 1);
    return { problems: [at(lines, file, deep.offset, deep.message)] };
  }
  const tokens = [...new Parser(lines.addNewLine).parse(text)];
  const problems = tokenProblems(tokens);
  if (problems.length) return { problems: problems.map((p) => at(lines, file, p.offset, p.message)) };
  let doc: Document.Parsed | undefined;
  for (const next of new Composer({ uniqueKeys: false }).compose(tokens, true, text.length)) {
    if (!doc) doc = next;
    else {
      doc.errors.push(new YAMLParseError([next.range[0], next.range[1]], 'MULTIPLE_DOCS', 'the file holds more than one document'));
      break;
    }
  }
  return { doc: doc! };
}

/**
 * Parses the text. Any syntax error stops the check there: the tree after it is unreliable,
 * and checking it would report mistakes that are not there.
 */
export function parseBasisYaml(text: string, file: string): ParsedYaml {
  const lines = new LineCounter();
  const composed = compose(text, lines, file);
  if ('problems' in composed) return { ok: false, errors: composed.problems, warnings: [] };
  const { doc } = composed;
  const warnings = doc.warnings.map((w) => ({ ...describe(doc, text, lines, file, w), severity: 'warning' as const }));
  const errors = [...worthShowing(doc.errors).map((e) => describe(doc, text, lines, file, e)), ...keyProblems(doc, lines, file), ...reorderedTexts(doc, lines, file)];
  if (errors.length) return { ok: false, errors, warnings };
  if (doc.contents === null || (isScalar(doc.contents) && doc.contents.value === null)) {
    return { ok: false, errors: [at(lines, file, 0, 'the file holds only comments; start from `cellbasis new`')], warnings };
  }
  try {
    return { ok: true, doc, lines, data: doc.toJS({ maxAliasCount: MAX_ALIASES }), warnings };
  } catch (error) {
    if (!/alias/i.test((error as Error).message)) throw error;
    const message = `the aliases (*name) here expand to too much data; a design basis may expand at most ${MAX_ALIASES} aliases`;
    return { ok: false, errors: [at(lines, file, firstAliasOffset(doc), message)], warnings };
  }
}
