// No function of lib/ is longer than 60 lines unless its doc comment says why (DEVELOPERS.md,
// "Function length"): a long function hides the steps a reviewer has to follow, and the steps named
// as functions of their own are what the next change reuses. Each function, method and arrow
// function is found by a real parser (@babel/parser with its TypeScript plugin), so one written in
// a string, a comment or a template is never counted and none is missed.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { isNode, parseSource, ROOT, sourceFiles, walk, type Node } from './sources.ts';

/** The longest function, in lines from its first to its last (both counted), that needs no reason. */
const MAX_LINES = 60;
/** The marker of a reason: a line of the doc comment starting with it, followed by the reason. */
const MARKER = 'Long because:';
/** The fewest characters a reason after the marker takes (a word or two is no reason). */
const MIN_REASON = 20;

interface LongFunction {
  /** Path from the repository's root, with / between folders. */
  file: string;
  line: number;
  name: string;
  lines: number;
  /** The reason after the marker in its doc comment, or null where there is none. */
  reason: string | null;
}

const FUNCTION_TYPES = new Set(['FunctionDeclaration', 'FunctionExpression', 'ArrowFunctionExpression', 'ObjectMethod', 'ClassMethod', 'ClassPrivateMethod']);
/** Nodes that carry the doc comment of a function they hold (`export function`, `const f = () =>`, `{ f: () => }`, a class field). */
const COMMENT_HOLDERS = new Set(['ExportNamedDeclaration', 'ExportDefaultDeclaration', 'VariableDeclaration', 'VariableDeclarator', 'ObjectProperty', 'ClassProperty', 'ClassPrivateProperty', 'TSExportAssignment']);

/** The name of an identifier, private name or literal key, or null for a computed one. */
function keyName(key: unknown): string | null {
  if (!isNode(key)) return null;
  if (key.type === 'Identifier' || key.type === 'PrivateName') return key.type === 'PrivateName' ? `#${(key.id as Node).name as string}` : (key.name as string);
  if (key.type === 'StringLiteral' || key.type === 'NumericLiteral') return String(key.value);
  return null;
}

/** The name a reader knows a function by: its own, the variable, property or method it is assigned to, or where it is passed. */
function functionName(node: Node, parents: readonly Node[]): string {
  const own = keyName(node.id) ?? (node.type === 'ObjectMethod' || node.type.startsWith('Class') ? keyName(node.key) : null);
  if (own) return own;
  const parent = parents[parents.length - 1];
  if (parent?.type === 'VariableDeclarator') return keyName(parent.id) ?? '(anonymous)';
  if (parent?.type === 'ObjectProperty' || parent?.type === 'ClassProperty' || parent?.type === 'ClassPrivateProperty') return keyName(parent.key) ?? '(anonymous)';
  if (parent?.type === 'AssignmentExpression' && isNode(parent.left) && parent.left.type === 'MemberExpression') return keyName(parent.left.property) ?? '(anonymous)';
  if (parent?.type === 'CallExpression') {
    const callee = parent.callee as Node;
    const called = callee.type === 'MemberExpression' ? keyName(callee.property) : keyName(callee);
    return `(callback of ${called ?? 'a call'})`;
  }
  if (parent?.type === 'ExportDefaultDeclaration') return 'default';
  return '(anonymous)';
}

/** The doc comment (`/** ... *\/`) written just before the function or the declaration that holds it, or null. */
function docComment(node: Node, parents: readonly Node[]): string | null {
  const holders = [node];
  for (let k = parents.length - 1; k >= 0 && COMMENT_HOLDERS.has(parents[k]!.type); k--) holders.push(parents[k]!);
  for (const holder of holders) {
    const docs = (holder.leadingComments ?? []).filter((c) => c.type === 'CommentBlock' && c.value.startsWith('*'));
    if (docs.length > 0) return docs[docs.length - 1]!.value;
  }
  return null;
}

/** The reason given after the marker at the start of a line of the doc comment, or null. */
function reasonOf(doc: string | null): string | null {
  if (doc === null) return null;
  for (const raw of doc.split('\n')) {
    const line = raw.replace(/^\s*\*+\s?/, '').trim();
    if (line.startsWith(MARKER)) return line.slice(MARKER.length).trim();
  }
  return null;
}

/** Every function of a source longer than `MAX_LINES`, with its name and the reason its doc comment gives. */
function longFunctions(source: string, file: string): LongFunction[] {
  const found: LongFunction[] = [];
  walk(parseSource(source, file), (node, parents) => {
    if (!FUNCTION_TYPES.has(node.type) || !node.loc) return;
    const lines = node.loc.end.line - node.loc.start.line + 1;
    if (lines > MAX_LINES) found.push({ file, line: node.loc.start.line, name: functionName(node, parents), lines, reason: reasonOf(docComment(node, parents)) });
  });
  return found;
}

describe('function length in lib/', () => {
  const all = sourceFiles('lib').flatMap((file) => longFunctions(readFileSync(join(ROOT, file), 'utf8'), file));

  it(`has no function over ${MAX_LINES} lines whose doc comment does not say why ("${MARKER} ...")`, () => {
    const offenders = all.filter((f) => f.reason === null).map((f) => `${f.file}:${f.line} ${f.name} (${f.lines} lines)`);
    if (offenders.length > 0) console.log(`functions over ${MAX_LINES} lines with no "${MARKER}" in their doc comment:\n${offenders.join('\n')}`);
    expect(offenders).toEqual([]);
  });

  it(`gives a reason of at least ${MIN_REASON} characters after each "${MARKER}"`, () => {
    const short = all.filter((f) => f.reason !== null && f.reason.length < MIN_REASON).map((f) => `${f.file}:${f.line} ${f.name}: "${f.reason}"`);
    expect(short).toEqual([]);
  });
});

describe('the function-length reader', () => {
  const body = (n: number) => Array.from({ length: n }, (_, k) => `  const v${k} = ${k};`).join('\n');

  it('counts a function from its first line to its last and names declarations, methods, arrows and callbacks', () => {
    const source = [
      `export function declared() {\n${body(59)}\n}`,
      `export const arrow = () => {\n${body(60)}\n};`,
      `class Holder {\n  method() {\n${body(61)}\n  }\n}`,
      `const table = { entry: function () {\n${body(62)}\n} };`,
      `[1].map((x) => {\n${body(63)}\n});`,
      `function short() {\n${body(3)}\n}`,
    ].join('\n');
    expect(longFunctions(source, 'x.ts').map((f) => [f.name, f.lines])).toEqual([
      ['declared', 61],
      ['arrow', 62],
      ['method', 63],
      ['entry', 64],
      ['(callback of map)', 65],
    ]);
  });

  it('reads the reason from the doc comment of the function or of the declaration that holds it, and nothing else', () => {
    const reasoned = `/**\n * Does one thing.\n * Long because: the table reads best as one piece.\n */\nexport const f = (): number => {\n${body(61)}\n  return 1;\n};`;
    const plain = `// Long because: a line comment is no doc comment\nfunction g() {\n${body(61)}\n}`;
    const inString = `/** Does g. */\nfunction h() {\n  const s = 'Long because: not in a string';\n${body(61)}\n}`;
    expect(longFunctions(reasoned, 'x.ts').map((f) => f.reason)).toEqual(['the table reads best as one piece.']);
    expect(longFunctions(plain, 'x.ts').map((f) => f.reason)).toEqual([null]);
    expect(longFunctions(inString, 'x.ts').map((f) => f.reason)).toEqual([null]);
  });

  it('refuses a source it cannot parse', () => {
    expect(() => longFunctions('function (', 'x.ts')).toThrow();
  });
});
