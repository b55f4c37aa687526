/**
 * Every module reference of a JavaScript or TypeScript source, read by a small lexer (comments,
 * strings, template literals and regular-expression literals are skipped as such, so an import
 * written in a comment or a string is never counted, and one after a regular expression is never
 * missed):
 *   import ... from 'x'    import type ... from 'x'    import 'x'    import('x')
 *   export ... from 'x'    export type ... from 'x'    new URL('x', import.meta.url)
 * with the names an import clause takes (for the side-effect rule of the layer test).
 */

export interface ModuleReference {
  kind: 'import' | 'export-from' | 'dynamic-import' | 'url';
  specifier: string;
  /** Names the import clause takes from the module, as it exports them (`readFileSync`; `x as y` gives x); [] for others. */
  names: string[];
  /** 1-based line of the reference. */
  line: number;
}

interface Token {
  type: 'word' | 'string' | 'punct' | 'template' | 'regex';
  value: string;
  line: number;
}

/** Words after which a `/` starts a regular expression rather than a division. */
const BEFORE_REGEX = new Set(['return', 'typeof', 'case', 'do', 'else', 'in', 'of', 'new', 'delete', 'void', 'throw', 'await', 'yield', 'instanceof']);

export class LexError extends Error {}

/** The tokens of a source (comments dropped); throws a LexError on an unterminated string, template, comment or regular expression. */
export function tokenize(source: string): Token[] {
  const tokens: Token[] = [];
  let i = 0;
  let line = 1;
  /** One entry per open `{`: true where it opened a template's `${`. */
  const braces: boolean[] = [];
  const push = (type: Token['type'], value: string, at: number) => tokens.push({ type, value, line: at });
  const advance = (to: number) => {
    for (let k = i; k < to; k++) if (source[k] === '\n') line++;
    i = to;
  };
  /** Reads a template from just after its opening backquote or a closing `}` of `${`; returns true when it stopped at `${`. */
  const template = (): boolean => {
    const start = line;
    let k = i;
    for (; k < source.length; k++) {
      const c = source[k];
      if (c === '\\') k++;
      else if (c === '`') {
        advance(k + 1);
        push('template', '', start);
        return false;
      } else if (c === '$' && source[k + 1] === '{') {
        advance(k + 2);
        push('template', '', start);
        braces.push(true);
        return true;
      }
    }
    throw new LexError(`unterminated template literal from line ${start}`);
  };
  const regexAllowed = () => {
    const last = tokens[tokens.length - 1];
    if (!last) return true;
    if (last.type === 'word') return BEFORE_REGEX.has(last.value);
    if (last.type !== 'punct') return false;
    // TypeScript's non-null assertion (`a[i]! / b`) ends an operand, as `)` and `]` do.
    const beforeLast = tokens[tokens.length - 2];
    if (last.value === '!' && beforeLast && ((beforeLast.type === 'word' && !BEFORE_REGEX.has(beforeLast.value)) || /^[)\]]$/.test(beforeLast.value))) return false;
    return !/^[)\]}]$/.test(last.value);
  };
  while (i < source.length) {
    const c = source[i]!;
    const next = source[i + 1];
    if (/\s/.test(c)) {
      advance(i + 1);
    } else if (c === '/' && next === '/') {
      const end = source.indexOf('\n', i);
      advance(end === -1 ? source.length : end);
    } else if (c === '/' && next === '*') {
      const end = source.indexOf('*/', i + 2);
      if (end === -1) throw new LexError(`unterminated comment at line ${line}`);
      advance(end + 2);
    } else if (c === '"' || c === "'") {
      const start = line;
      let k = i + 1;
      let value = '';
      for (; k < source.length && source[k] !== c; k++) {
        if (source[k] === '\n') throw new LexError(`unterminated string at line ${start}`);
        if (source[k] === '\\') k++;
        value += source[k];
      }
      if (k >= source.length) throw new LexError(`unterminated string at line ${start}`);
      advance(k + 1);
      push('string', value, start);
    } else if (c === '`') {
      advance(i + 1);
      template();
    } else if (c === '}' && braces.length > 0 && braces[braces.length - 1]) {
      braces.pop();
      advance(i + 1);
      template();
    } else if (c === '/' && regexAllowed()) {
      const start = line;
      let k = i + 1;
      let inClass = false;
      for (; k < source.length; k++) {
        const r = source[k];
        if (r === '\n') throw new LexError(`unterminated regular expression at line ${start}`);
        if (r === '\\') k++;
        else if (r === '[') inClass = true;
        else if (r === ']') inClass = false;
        else if (r === '/' && !inClass) break;
      }
      k++;
      while (k < source.length && /[a-z]/i.test(source[k]!)) k++;
      advance(k);
      push('regex', '', start);
    } else if (/[A-Za-z0-9_$]/.test(c)) {
      let k = i;
      while (k < source.length && /[A-Za-z0-9_$]/.test(source[k]!)) k++;
      const start = line;
      const word = source.slice(i, k);
      advance(k);
      push('word', word, start);
    } else {
      if (c === '{') braces.push(false);
      else if (c === '}') braces.pop();
      const start = line;
      advance(i + 1);
      push('punct', c, start);
    }
  }
  if (braces.some((t) => t)) throw new LexError('unterminated template expression at the end of the file');
  return tokens;
}

const is = (token: Token | undefined, type: Token['type'], value?: string) => token !== undefined && token.type === type && (value === undefined || token.value === value);

/** The names of an import clause between `import` and `from`: `a`, `{ b, type C as D }`, `* as e`. */
function clauseNames(clause: Token[]): string[] {
  const names: string[] = [];
  for (let k = 0; k < clause.length; k++) {
    const t = clause[k]!;
    if (t.type !== 'word' || t.value === 'type' || t.value === 'as') continue;
    if (is(clause[k - 1], 'word', 'as')) continue;
    names.push(t.value);
  }
  return names;
}

export function moduleReferences(source: string): ModuleReference[] {
  const tokens = tokenize(source);
  const found: ModuleReference[] = [];
  for (let k = 0; k < tokens.length; k++) {
    const t = tokens[k]!;
    const before = tokens[k - 1];
    if (t.type !== 'word' || is(before, 'punct', '.')) continue;
    if (t.value === 'import' && is(tokens[k + 1], 'punct', '(') && is(tokens[k + 2], 'string')) {
      found.push({ kind: 'dynamic-import', specifier: tokens[k + 2]!.value, names: [], line: t.line });
    } else if (t.value === 'import' && is(tokens[k + 1], 'string')) {
      found.push({ kind: 'import', specifier: tokens[k + 1]!.value, names: [], line: t.line });
    } else if (t.value === 'import' && !is(tokens[k + 1], 'punct', '.') && !is(tokens[k + 1], 'punct', '(')) {
      let j = k + 1;
      while (j < tokens.length && !is(tokens[j], 'word', 'from') && !is(tokens[j], 'punct', ';')) j++;
      if (is(tokens[j], 'word', 'from') && is(tokens[j + 1], 'string')) found.push({ kind: 'import', specifier: tokens[j + 1]!.value, names: clauseNames(tokens.slice(k + 1, j)), line: t.line });
    } else if (t.value === 'export') {
      let j = k + 1;
      if (is(tokens[j], 'word', 'type')) j++;
      if (is(tokens[j], 'punct', '*')) {
        j++;
        if (is(tokens[j], 'word', 'as')) j += 2;
      } else if (is(tokens[j], 'punct', '{')) {
        while (j < tokens.length && !is(tokens[j], 'punct', '}')) j++;
        j++;
      } else continue;
      if (is(tokens[j], 'word', 'from') && is(tokens[j + 1], 'string')) found.push({ kind: 'export-from', specifier: tokens[j + 1]!.value, names: [], line: t.line });
    } else if (t.value === 'new' && is(tokens[k + 1], 'word', 'URL') && is(tokens[k + 2], 'punct', '(') && is(tokens[k + 3], 'string') && is(tokens[k + 4], 'punct', ',')) {
      const rest = tokens.slice(k + 5, k + 8).map((r) => r.value).join('');
      if (rest === 'import.meta') found.push({ kind: 'url', specifier: tokens[k + 3]!.value, names: [], line: t.line });
    }
  }
  return found;
}
