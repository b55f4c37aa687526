/**
 * The issued results against a recalculation of the issued basis, field by field: each
 * difference with its JSON path, the issued and the recomputed value (numbers in full, with
 * their relative difference). Numbers agreeing within rounding (tolerance.ts) are equal. The
 * tool version is not a difference (a later cellbasis may audit an earlier revision; the audit
 * notes it); the species-data hash is compared by the audit itself, once, not here.
 */
import type { Results } from '../plant/results-schema.ts';
import { diffTrees, treeText, type Tree } from './tree-diff.ts';
import { sameWithinRounding } from './tolerance.ts';

/** At most this many differences are listed; the count says how many more there are. */
const MAX_LISTED = 25;

const NOT_COMPARED = new Set(['tool.version', 'speciesData_sha256']);

/** What results of manifest format 1 carry that a recalculation no longer gives (the archive holds the revision and status now; audit-manifest.ts checks them). */
const FORMER_ONLY = new Set(['project.revision', 'project.status']);

function valueText(value: Tree | undefined): string {
  return typeof value === 'number' ? String(value) : treeText(value);
}

export interface ResultsComparison {
  /** Total number of differences. */
  count: number;
  /** The first MAX_LISTED, one line each: "headline.meanNernst_V: issued 0.93, recomputed 0.94 (relative 1.1e-2)". */
  lines: string[];
}

export function compareResults(issued: unknown, recomputed: Results, former = false): ResultsComparison {
  const all = diffTrees(issued as Tree, recomputed as unknown as Tree, { sameNumber: sameWithinRounding, skip: (p) => NOT_COMPARED.has(p) || (former && FORMER_ONLY.has(p)) });
  const lines = all.slice(0, MAX_LISTED).map((d) => {
    const where = d.path === '' ? '(the whole file)' : d.path;
    if (d.kind === 'added') return `${where}: not in the issued results, recomputed ${valueText(d.new)}`;
    if (d.kind === 'removed') return `${where}: issued ${valueText(d.old)}, not in the recomputed results`;
    const relative =
      typeof d.old === 'number' && typeof d.new === 'number' && d.old !== 0 ? ` (relative difference ${((d.new - d.old) / Math.abs(d.old)).toExponential(2)})` : '';
    return `${where}: issued ${valueText(d.old)}, recomputed ${valueText(d.new)}${relative}`;
  });
  if (all.length > MAX_LISTED) lines.push(`… and ${all.length - MAX_LISTED} more`);
  return { count: all.length, lines };
}
