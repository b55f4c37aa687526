/**
 * Reads the issued revisions of a project for the site (lib/archive/layout.ts): the revisions
 * that lib/archive/issued-folder.ts finds (an issue run in progress or killed is named in a
 * warning and skipped, as the audit and compare do), each with its manifest, the basis and
 * results as issued (for the revision history's change summaries; never recalculated) and the
 * paths of its document.html and document.pdf, which the site copies as they were issued: an
 * issued revision is never rendered again. Those two are copied, not read, so each is first
 * checked to be a regular file within its size limit (lib/archive/issued-files.ts): a named pipe
 * or a device there is an error naming it, never a copy that waits or never ends. A project whose revisions lie in the former folder is
 * an error naming the command that moves them. Problems are collected, not thrown, so a site
 * build reports all of them.
 */
import { join } from 'node:path';
import type { DesignBasis } from '../basis/types.ts';
import type { ComparableResults } from '../plant/comparable-results.ts';
import { ISSUED_FILES, issuedDir, type IssueManifest } from '../archive/layout.ts';
import { readIssuedFolder, temporaryNote } from '../archive/issued-folder.ts';
import { readIssuedRevision } from '../archive/issued-revision.ts';
import { issuedFileToCopy } from '../archive/issued-files.ts';
import { formerLayoutProblem } from '../archive/former-layout.ts';
import { sha256Hex } from '../archive/hash.ts';
import { UserError } from '../core/errors.ts';
import type { SiteProblems } from './site-problems.ts';

export interface IssuedRevision {
  revision: string;
  manifest: IssueManifest;
  /** SHA-256 of manifest.json, as the register page shows it. */
  manifestSha256: string;
  /** Null where today's loader does not read the issued basis (`basisProblem` says why; a warning of the site names it). */
  basis: DesignBasis | null;
  basisProblem: string | null;
  /** As far as the change summaries read them (lib/archive/issued-results.ts). */
  results: ComparableResults;
  /** Absolute paths of the issued document.html and document.pdf, or null where the revision has none. */
  html: string | null;
  pdf: string | null;
  /** The issued basis.yaml as text (for the change summary). */
  source: string;
}

/** The issued revisions of a project in issue order. */
export function readIssuedRevisions(root: string, projectId: string, problems: SiteProblems): IssuedRevision[] {
  const former = formerLayoutProblem(root, projectId);
  if (former) {
    problems.error(`projects/${projectId}/sealed`, former);
    return [];
  }
  let folder;
  try {
    folder = readIssuedFolder(root, projectId);
  } catch (error) {
    if (!(error instanceof UserError)) throw error;
    problems.error(`projects/${projectId}/issued`, error.message);
    return [];
  }
  for (const name of folder.temporary) problems.warning(temporaryNote(root, projectId, name));
  for (const name of folder.other) problems.error(`projects/${projectId}/issued/${name}`, 'is not an issued revision (A, B, ... or 0, 1, ...); only cellbasis issue writes here (cellbasis audit says more)');
  const out: IssuedRevision[] = [];
  for (const revision of folder.revisions) {
    let read;
    try {
      read = readIssuedRevision(root, projectId, revision);
    } catch (error) {
      if (!(error instanceof UserError)) throw error;
      problems.errors.push(error.message);
      continue;
    }
    if (read.manifest.revision !== revision) {
      problems.error(`${read.display}/${ISSUED_FILES.manifest}`, `names revision ${read.manifest.revision}, but lies in the folder of revision ${revision}`);
      continue;
    }
    if (read.basisProblem) {
      problems.warning(`${read.display}/${ISSUED_FILES.basis}: does not load with this version of cellbasis (${read.basisProblem}); its issued page and PDF are shown as issued, and its change summary compares the YAML field by field (cellbasis audit ${projectId} checks the revision)`);
    }
    const dir = issuedDir(root, projectId, revision);
    // Copied, not read: refused before the copy opens it when it is no regular file or too large.
    const checked = [ISSUED_FILES.html, ISSUED_FILES.pdf].map((name) => ({ name, ...issuedFileToCopy(dir, read.display, name) }));
    const refused = checked.filter((c) => c.present && c.problem !== null);
    for (const c of refused) if (c.present && c.problem) problems.errors.push(`${c.problem}; run cellbasis audit ${projectId} for the full report`);
    if (refused.length) continue;
    const file = (name: string) => (checked.find((c) => c.name === name)!.present ? join(dir, name) : null);
    out.push({
      revision,
      manifest: read.manifest,
      manifestSha256: sha256Hex(read.manifestBytes),
      basis: read.basis,
      basisProblem: read.basisProblem,
      results: read.results,
      html: file(ISSUED_FILES.html),
      pdf: file(ISSUED_FILES.pdf),
      source: read.basisText,
    });
  }
  return out;
}
