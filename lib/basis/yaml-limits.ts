/**
 * What a design basis may not hold, checked on the YAML tokens before the document tree is
 * built, each without recursion so that a hostile file cannot exhaust the stack or take long:
 * lists and mappings nested deeper than MAX_DEPTH (the tree builder recurses once per level,
 * and the parser slows with every open flow level), YAML tags (`!!js/function`, `!custom`,
 * `!!str`): a basis holds only text, numbers, true/false, lists and mappings, so no tag can
 * ask a loader to construct anything, and directives that would read the file as another
 * YAML version.
 */
import { CST, Lexer } from 'yaml';

/** Deepest nesting of lists and mappings accepted; a basis needs five (a sourced value in a sign-off). */
const MAX_DEPTH = 32;

export interface TokenProblem {
  offset: number;
  message: string;
}

function depthProblem(offset: number): TokenProblem {
  return { offset, message: `the lists and mappings here nest more than ${MAX_DEPTH} levels deep; a design basis needs only a few levels` };
}

/** Lexer tokens that mark a place but stand for no text of the source. */
const ZERO_WIDTH = new Set([CST.DOCUMENT, CST.FLOW_END, CST.SCALAR]);

/**
 * Where flow collections ([ … ], { … }) first nest deeper than MAX_DEPTH, from the lexer's
 * tokens alone (quotes and comments are the lexer's business), before the parser sees them.
 */
export function flowDepthProblem(text: string): TokenProblem | undefined {
  // Each level opens with a [ or a { of the text: with no more of them than MAX_DEPTH, the text
  // cannot nest deeper, and lexing it (a third of the parser's work) is spared.
  let opening = 0;
  for (let i = text.indexOf('['); i >= 0 && opening <= MAX_DEPTH; i = text.indexOf('[', i + 1)) opening++;
  for (let i = text.indexOf('{'); i >= 0 && opening <= MAX_DEPTH; i = text.indexOf('{', i + 1)) opening++;
  if (opening <= MAX_DEPTH) return undefined;
  let offset = 0;
  let depth = 0;
  for (const token of new Lexer().lex(text)) {
    if (ZERO_WIDTH.has(token)) continue;
    const type = CST.tokenType(token);
    if (type === 'flow-map-start' || type === 'flow-seq-start') {
      depth += 1;
      if (depth > MAX_DEPTH) return depthProblem(offset);
    } else if (type === 'flow-map-end' || type === 'flow-seq-end') {
      depth = Math.max(0, depth - 1);
    }
    offset += token.length;
  }
  return undefined;
}

function tagProblem(token: CST.SourceToken): TokenProblem {
  return {
    offset: token.offset,
    message: `the YAML tag ${token.source} is not allowed: a design basis holds only text, numbers, true/false, lists and mappings, so it takes no tags; remove it (quote a value to keep it as text)`,
  };
}

function directiveProblem(token: CST.Directive): TokenProblem {
  return {
    offset: token.offset,
    message: `the directive ${token.source} is not allowed: a design basis is read as YAML 1.2 (2026-11-20 stays text, yes is not true); remove the line`,
  };
}

/**
 * Every directive other than `%YAML 1.2` (a `%YAML 1.1` line would turn dates into timestamps
 * and yes into true), every tag of the parsed tokens, and the first place (in the file) where lists and mappings,
 * block or flow, nest deeper than MAX_DEPTH; walks the tokens with a stack of its own.
 */
export function tokenProblems(tokens: readonly CST.Token[]): TokenProblem[] {
  const problems: TokenProblem[] = [];
  let deepest: TokenProblem | undefined;
  const props = (list: readonly CST.Token[] | undefined) => {
    for (const t of list ?? []) if (t.type === 'tag') problems.push(tagProblem(t));
  };
  const stack: { token: CST.Token; depth: number }[] = tokens.map((token) => ({ token, depth: 0 }));
  while (stack.length > 0) {
    const { token, depth } = stack.pop()!;
    if (token.type === 'directive' && !/^%YAML\s+1\.2\s*$/.test(token.source)) {
      problems.push(directiveProblem(token));
    } else if (token.type === 'document') {
      props(token.start);
      if (token.value) stack.push({ token: token.value, depth });
      props(token.end);
    } else if (token.type === 'block-scalar') {
      props(token.props);
    } else if (token.type === 'block-map' || token.type === 'block-seq' || token.type === 'flow-collection') {
      if (depth + 1 > MAX_DEPTH) {
        if (!deepest || token.offset < deepest.offset) deepest = depthProblem(token.offset);
        continue;
      }
      for (const item of token.items) {
        props(item.start);
        props(item.sep);
        if (item.key) stack.push({ token: item.key, depth: depth + 1 });
        if (item.value) stack.push({ token: item.value, depth: depth + 1 });
      }
    }
  }
  return deepest ? [...problems, deepest] : problems;
}
