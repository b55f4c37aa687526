/**
 * Differences between two JSON-like trees (parsed YAML or JSON: objects, arrays, strings,
 * numbers, booleans, null), each at the path where the trees part: `headline.meanNernst_V`,
 * `streams[2].moleFractions.H2`, `document.sign-off.checked`. A subtree present on one side only
 * is one difference at its root, not one per leaf. Numbers are compared by a caller's rule (the
 * audit allows rounding, the revision comparison does not); paths may be skipped.
 */

export type Tree = null | boolean | number | string | Tree[] | { [key: string]: Tree };

export interface TreeDifference {
  /** Dotted path with [i] for list items; "" for the root. */
  path: string;
  /** 'added': only in the second tree; 'removed': only in the first; 'changed': in both, unequal. */
  kind: 'added' | 'removed' | 'changed';
  old?: Tree;
  new?: Tree;
}

export interface TreeDiffOptions {
  /** Whether two numbers count as equal; default: identical (Object.is, so 0 and −0 differ). */
  sameNumber?: (a: number, b: number) => boolean;
  /** Paths left out of the comparison, with everything below them. */
  skip?: (path: string) => boolean;
  /** Stop after this many differences (the audit reports the first few). */
  limit?: number;
}

function isObject(value: Tree | undefined): value is { [key: string]: Tree } {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

function kindOf(value: Tree): string {
  if (value === null) return 'null';
  if (Array.isArray(value)) return 'array';
  return typeof value;
}

export function childPath(path: string, key: string | number): string {
  if (typeof key === 'number') return `${path}[${key}]`;
  return path === '' ? key : `${path}.${key}`;
}

/** Every difference between `a` and `b`, in document order (keys of `a` first, then keys only in `b`). */
export function diffTrees(a: Tree, b: Tree, options: TreeDiffOptions = {}): TreeDifference[] {
  const sameNumber = options.sameNumber ?? Object.is;
  const limit = options.limit ?? Number.POSITIVE_INFINITY;
  const out: TreeDifference[] = [];
  const walk = (x: Tree | undefined, y: Tree | undefined, path: string): void => {
    if (out.length >= limit || options.skip?.(path)) return;
    if (x === undefined && y === undefined) return;
    if (x === undefined) {
      out.push({ path, kind: 'added', new: y! });
      return;
    }
    if (y === undefined) {
      out.push({ path, kind: 'removed', old: x });
      return;
    }
    if (kindOf(x) !== kindOf(y)) {
      out.push({ path, kind: 'changed', old: x, new: y });
      return;
    }
    if (Array.isArray(x) && Array.isArray(y)) {
      for (let i = 0; i < Math.max(x.length, y.length); i++) walk(x[i], y[i], childPath(path, i));
      return;
    }
    if (isObject(x) && isObject(y)) {
      for (const key of Object.keys(x)) walk(x[key], Object.hasOwn(y, key) ? y[key] : undefined, childPath(path, key));
      for (const key of Object.keys(y)) if (!Object.hasOwn(x, key)) walk(undefined, y[key], childPath(path, key));
      return;
    }
    const equal = typeof x === 'number' && typeof y === 'number' ? sameNumber(x, y) : x === y;
    if (!equal) out.push({ path, kind: 'changed', old: x, new: y });
  };
  walk(a, b, '');
  return out;
}

/** A value as one short line: scalars as they are, mappings and lists as compact JSON. */
export function treeText(value: Tree | undefined): string {
  if (value === undefined) return '(absent)';
  if (typeof value === 'string') return value;
  return JSON.stringify(value);
}
