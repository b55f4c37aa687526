/**
 * Reads the sealed revisions of a project (lib/archive/layout.ts): each folder
 * projects/<id>/sealed/<rev>/ with its manifest.json, the basis as sealed (loaded with the basis
 * loader, for the inputs table; manifest read by lib/archive/manifest.ts) and results.json as sealed (validated against the results
 * schema, never recomputed), and the sealed PDF where there is one. Problems are collected, not
 * thrown, so a site build reports all of them.
 */
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { z } from 'zod';
import { loadBasisFile } from '../basis/load.ts';
import type { DesignBasis } from '../basis/types.ts';
import { resultsSchema, type Results } from '../plant/results-schema.ts';
import { SEALED_FILES, sealedRoot, type SealManifest } from '../archive/layout.ts';
import { parseManifest } from '../archive/manifest.ts';
import { compareRevisions, isRevision } from '../basis/revisions.ts';
import type { SiteProblems } from './site-problems.ts';

export interface SealedRevision {
  revision: string;
  manifest: SealManifest;
  basis: DesignBasis;
  results: Results;
  /** Absolute path of document.pdf, or null when the revision has none. */
  pdf: string | null;
  /** The sealed basis.yaml as text (for the change summary). */
  source: string;
}


function readJson(file: string, shown: string, problems: SiteProblems): unknown {
  try {
    return JSON.parse(readFileSync(file, 'utf8'));
  } catch (error) {
    problems.error(shown, `cannot be read as JSON (${(error as Error).message})`);
    return undefined;
  }
}

function firstIssue(error: z.ZodError): string {
  const issue = error.issues[0]!;
  return `${issue.path.length ? `${issue.path.join('.')}: ` : ''}${issue.message}`;
}

function readOne(root: string, projectId: string, revision: string, problems: SiteProblems): SealedRevision | null {
  const dir = join(sealedRoot(root, projectId), revision);
  const shown = (name: string) => `projects/${projectId}/sealed/${revision}/${name}`;
  for (const name of [SEALED_FILES.manifest, SEALED_FILES.basis, SEALED_FILES.results]) {
    if (!existsSync(join(dir, name))) {
      problems.error(shown(name), 'missing: a sealed revision holds manifest.json, basis.yaml and results.json');
      return null;
    }
  }
  const manifest = parseManifest(readFileSync(join(dir, SEALED_FILES.manifest)));
  if (!manifest.ok) for (const p of manifest.problems) problems.error(shown(SEALED_FILES.manifest), p);
  const rawResults = readJson(join(dir, SEALED_FILES.results), shown(SEALED_FILES.results), problems);
  const loaded = loadBasisFile(join(dir, SEALED_FILES.basis), { id: projectId, displayPath: shown(SEALED_FILES.basis) });
  problems.diagnostics(loaded.ok ? loaded.warnings : [...loaded.errors, ...loaded.warnings]);
  if (!manifest.ok || rawResults === undefined || !loaded.ok) return null;
  if (manifest.manifest.revision !== revision) {
    problems.error(shown(SEALED_FILES.manifest), `names revision ${manifest.manifest.revision}, but lies in the folder of revision ${revision}`);
    return null;
  }
  const results = resultsSchema.safeParse(rawResults);
  if (!results.success) {
    problems.error(shown(SEALED_FILES.results), `is not a cellbasis results file: ${firstIssue(results.error)}`);
    return null;
  }
  const pdf = join(dir, SEALED_FILES.pdf);
  return { revision, manifest: manifest.manifest, basis: loaded.basis, results: results.data, pdf: existsSync(pdf) ? pdf : null, source: readFileSync(join(dir, SEALED_FILES.basis), 'utf8') };
}

/** The sealed revisions of a project in issue order. */
export function readSealedRevisions(root: string, projectId: string, problems: SiteProblems): SealedRevision[] {
  const dir = sealedRoot(root, projectId);
  if (!existsSync(dir)) return [];
  const names = readdirSync(dir, { withFileTypes: true })
    .filter((e) => e.isDirectory())
    .map((e) => e.name);
  const out: SealedRevision[] = [];
  for (const name of names) {
    if (!isRevision(name)) {
      problems.error(`projects/${projectId}/sealed/${name}`, 'is not named after a revision (A, B, ... or 0, 1, ...)');
      continue;
    }
    const one = readOne(root, projectId, name, problems);
    if (one) out.push(one);
  }
  return out.sort((a, b) => compareRevisions(a.revision, b.revision));
}
