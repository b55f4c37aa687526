/**
 * Where a finding stands in the file: follows its path through the YAML tree (through aliases
 * too) to the value, or to the key for unknown and duplicate keys; for a missing key, to the
 * key of the mapping that should hold it. Positions are 1-based line and column.
 */
import { isAlias, isMap, isScalar, isSeq, type Document, type LineCounter, type Node, type Pair } from 'yaml';
import { pathText, type Finding, type Path } from './diagnostics.ts';
import type { Diagnostic } from './types.ts';

interface Step {
  node: Node | null;
  /** The key of the pair holding `node`, when it is a mapping value. */
  key: Node | null;
}

function resolve(doc: Document.Parsed, node: unknown): unknown {
  return isAlias(node) ? node.resolve(doc) : node;
}

/** The pairs of each mapping by key (the first where a key repeats), built once per mapping: a file of many findings is located in linear time. */
const pairIndex = new WeakMap<object, Map<string, Pair>>();

function pairFor(map: { items: Pair[] }, segment: string | number): Pair | undefined {
  let index = pairIndex.get(map);
  if (!index) {
    index = new Map();
    for (const p of map.items) if (isScalar(p.key) && !index.has(String(p.key.value))) index.set(String(p.key.value), p);
    pairIndex.set(map, index);
  }
  return index.get(String(segment));
}

/** The steps from the root along `path`, as far as the tree goes. */
function walk(doc: Document.Parsed, path: Path): Step[] {
  const steps: Step[] = [{ node: doc.contents, key: null }];
  let current: unknown = doc.contents;
  for (const segment of path) {
    const here = resolve(doc, current);
    if (isMap(here)) {
      const pair = pairFor(here, segment);
      if (!pair) break;
      steps.push({ node: (pair.value as Node | null) ?? null, key: pair.key as Node });
      current = pair.value;
    } else if (isSeq(here) && typeof segment === 'number') {
      const item = here.items[segment];
      if (item === undefined) break;
      steps.push({ node: item as Node, key: null });
      current = item;
    } else {
      break;
    }
  }
  return steps;
}

function startOf(node: Node | null | undefined): number | undefined {
  return node?.range?.[0];
}

/** Offset of the finding's position in the text. */
function offsetOf(doc: Document.Parsed, finding: Finding): number {
  const steps = walk(doc, finding.at);
  const reached = steps.length - 1 === finding.at.length;
  const last = steps[steps.length - 1]!;
  if (reached && finding.target === 'key' && last.key) return startOf(last.key) ?? 0;
  if (reached && finding.target !== 'missing') {
    // An empty value ("key:" with nothing after it) has no range of its own: point at its key.
    return startOf(last.node) ?? startOf(last.key) ?? 0;
  }
  // A key that is not there: the key of the deepest mapping reached, else that mapping itself.
  return startOf(last.key) ?? startOf(last.node) ?? 0;
}

export function locate(doc: Document.Parsed, lines: LineCounter, file: string, finding: Finding): Diagnostic {
  const { line, col } = lines.linePos(offsetOf(doc, finding));
  return { severity: finding.severity, file, line, column: col, path: pathText(finding.at), message: finding.message };
}
