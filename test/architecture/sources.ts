/**
 * The modules the architecture tests read, parsed by a real parser (@babel/parser with its
 * TypeScript plugin: TypeScript 7 has no JavaScript compiler API), and a walk over their syntax
 * trees that hands each node its ancestors.
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { fileURLToPath } from 'node:url';
import { parse } from '@babel/parser';

export const ROOT = fileURLToPath(new URL('../../', import.meta.url));

export interface Comment {
  type: 'CommentBlock' | 'CommentLine';
  value: string;
}

export interface Node {
  type: string;
  loc?: { start: { line: number }; end: { line: number } } | null;
  leadingComments?: Comment[] | null;
  [key: string]: unknown;
}

const SKIPPED_KEYS = new Set(['loc', 'start', 'end', 'range', 'extra', 'leadingComments', 'trailingComments', 'innerComments', 'comments', 'tokens']);

export function isNode(value: unknown): value is Node {
  return typeof value === 'object' && value !== null && typeof (value as Node).type === 'string';
}

/** Every JavaScript or TypeScript module below `dir` (a path from the repository's root), as paths from the root with / between folders. */
export function sourceFiles(dir: string): string[] {
  const walk = (path: string): string[] =>
    readdirSync(path).flatMap((name) => {
      const inner = join(path, name);
      if (statSync(inner).isDirectory()) return name === 'node_modules' ? [] : walk(inner);
      return /\.(ts|mts|js|mjs)$/.test(name) && !name.endsWith('.d.ts') ? [relative(ROOT, inner).split('\\').join('/')] : [];
    });
  return walk(join(ROOT, dir));
}

/** The program of a module's source; `file` decides whether it is TypeScript. Throws where it does not parse. */
export function parseSource(source: string, file: string): Node {
  const typescript = /\.m?ts$/.test(file);
  return parse(source, { sourceType: 'module', plugins: typescript ? ['typescript'] : [], errorRecovery: false }).program as unknown as Node;
}

/** The program of a module of the repository, by its path from the root. */
export function parseFile(file: string): Node {
  return parseSource(readFileSync(join(ROOT, file), 'utf8'), file);
}

/** Calls `visit` on every node below `node` (itself included), with its ancestors from the outermost. */
export function walk(node: Node, visit: (node: Node, parents: readonly Node[]) => void, parents: Node[] = []): void {
  visit(node, parents);
  const inner = [...parents, node];
  for (const [key, value] of Object.entries(node)) {
    if (SKIPPED_KEYS.has(key)) continue;
    if (Array.isArray(value)) for (const item of value) if (isNode(item)) walk(item, visit, inner);
    if (isNode(value)) walk(value, visit, inner);
  }
}
