/**
 * Auditing sealed revisions: `auditProject(cwd, id, options)` checks each revision of a project
 * in issue order and returns one line per revision with every problem found:
 *   - the files against the SHA-256 the manifest records: missing, extra and changed files by
 *     name (audit-files.ts);
 *   - the manifest: its shape, its exact bytes, and its agreement with the basis, results, PDF
 *     and HTML it seals (audit-manifest.ts);
 *   - the signature, against the key the manifest records and optionally a required key
 *     (audit-signature.ts);
 *   - the results, against a recalculation of the sealed basis (audit-calculation.ts);
 *   - the chain of revisions (audit-chain.ts).
 * The audit only reads. Temporary folders of killed seals are noted, never audited as revisions;
 * anything else in the sealed folder fails.
 */
import { lstatSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { readPdfProperties, type PdfProperties } from '../core/pdf-properties.ts';
import { SEALED_FILES, sealedDir, sealedRoot, type SealManifest } from './layout.ts';
import { parseManifest } from './manifest.ts';
import { readSealedFolder } from './sealed-folder.ts';
import { finding, type AuditFinding } from './audit-finding.ts';
import { fileProblems } from './audit-files.ts';
import { signatureProblems } from './audit-signature.ts';
import { manifestProblems, type SealedContent } from './audit-manifest.ts';
import { calculationProblems } from './audit-calculation.ts';
import { chainProblems, type ChainLink } from './audit-chain.ts';

export type { AuditFinding } from './audit-finding.ts';

export interface AuditLine {
  /** "projects/x rev B", or "projects/x sealed/<entry>" for an entry that is not a revision. */
  subject: string;
  project: string;
  revision: string | null;
  problems: AuditFinding[];
  notes: string[];
}

export interface AuditOptions {
  /** SPKI PEM of the key every revision must be signed with. */
  requireKey?: string;
}

function readOptional(path: string): Buffer | undefined {
  try {
    return readFileSync(path);
  } catch {
    return undefined;
  }
}

async function auditRevision(cwd: string, project: string, revision: string, options: AuditOptions): Promise<{ line: AuditLine; link: ChainLink }> {
  const dir = sealedDir(cwd, project, revision);
  const display = `projects/${project}/sealed/${revision}`;
  const line: AuditLine = { subject: `projects/${project} rev ${revision}`, project, revision, problems: [], notes: [] };
  const file = (name: string) => readOptional(join(dir, name));
  const manifestBytes = file(SEALED_FILES.manifest) ?? null;
  let manifest: SealManifest | null = null;
  if (!manifestBytes) line.problems.push(finding('manifest.json is missing'));
  else {
    const parsed = parseManifest(manifestBytes);
    if (parsed.ok) manifest = parsed.manifest;
    else line.problems.push(finding('manifest.json is damaged', ...parsed.problems));
  }
  line.problems.push(...fileProblems(dir, manifest));

  const content: SealedContent = {};
  const basisBytes = file(SEALED_FILES.basis);
  const resultsBytes = file(SEALED_FILES.results);
  const pdfBytes = file(SEALED_FILES.pdf);
  const htmlBytes = file(SEALED_FILES.html);
  if (resultsBytes) {
    content.resultsBytes = resultsBytes;
    try {
      content.results = JSON.parse(resultsBytes.toString('utf8'));
    } catch (error) {
      line.problems.push(finding(`${SEALED_FILES.results} is not JSON (${(error as Error).message})`));
    }
  }
  if (basisBytes) {
    content.basisBytes = basisBytes;
    const calculation = calculationProblems(basisBytes, content.results, display, project);
    line.problems.push(...calculation.problems);
    line.notes.push(...calculation.notes);
    if (calculation.basis) content.basis = calculation.basis;
  }
  if (pdfBytes) {
    let pdf: PdfProperties | undefined;
    try {
      pdf = await readPdfProperties(pdfBytes);
    } catch (error) {
      line.problems.push(finding(`${SEALED_FILES.pdf} cannot be read as a PDF (${(error as Error).message.split('\n')[0]})`));
    }
    if (pdf) content.pdf = pdf;
  }
  if (htmlBytes) content.html = htmlBytes.toString('utf8');
  if (manifest && manifestBytes) {
    line.problems.push(...manifestProblems(manifest, manifestBytes, project, revision, content));
    line.problems.push(...signatureProblems(dir, manifest, manifestBytes, options.requireKey));
  }
  return { line, link: { revision, manifest, manifestBytes } };
}

/** Every sealed revision of a project, in issue order, a line for each foreign entry, and notes. */
export async function auditProject(cwd: string, project: string, options: AuditOptions = {}): Promise<{ lines: AuditLine[]; notes: string[] }> {
  const folder = readSealedFolder(cwd, project);
  const lines: AuditLine[] = [];
  let before: ChainLink | null = null;
  for (const revision of folder.revisions) {
    const { line, link } = await auditRevision(cwd, project, revision, options);
    line.problems.push(...chainProblems(link, before));
    lines.push(line);
    before = link;
  }
  for (const name of folder.other) {
    const kind = lstatSync(join(sealedRoot(cwd, project), name)).isDirectory() ? 'a folder not named as a revision' : 'not a revision folder';
    lines.push({ subject: `projects/${project} sealed/${name}`, project, revision: null, problems: [finding(`${kind}; only cellbasis seal writes here`)], notes: [] });
  }
  const notes = folder.temporary.map((name) => `projects/${project}/sealed/${name}: left by an interrupted seal, not a revision; the next seal removes it`);
  return { lines, notes };
}
