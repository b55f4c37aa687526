/**
 * Auditing issued revisions: `auditProject(cwd, id, options)` checks each revision of a project
 * in issue order and returns one line per revision, saying who signed it, with every problem
 * found:
 *   - the files against the SHA-256 the manifest records: missing, extra and changed files by
 *     name (audit-files.ts);
 *   - the manifest: its shape, its exact bytes, and its agreement with the basis, results, PDF
 *     and HTML it lists (audit-manifest.ts);
 *   - the signatures, against the keys and fingerprints the manifest records and optionally the
 *     keys the auditor trusts (audit-signature.ts);
 *   - with `recalculate` only, the results against a recalculation of the issued basis by this
 *     cellbasis (audit-calculation.ts): the rest checks what was issued, so that a later change
 *     of the calculation or the species data cannot fail a revision that is intact;
 *   - the chain of revisions, signatures included (audit-chain.ts).
 * The audit only reads, each file only when it is a regular file and within the size limits of
 * layout.ts. Temporary folders of running or killed issue runs are noted, never audited as
 * revisions; anything else in the issued folder fails.
 */
import { lstatSync } from 'node:fs';
import { join } from 'node:path';
import { readPdfProperties, type PdfProperties } from '../core/pdf-properties.ts';
import { UserError } from '../core/errors.ts';
import { ISSUED_FILES, issuedDir, issuedRoot, type IssueManifest } from './layout.ts';
import { parseManifest } from './manifest.ts';
import { readIssuedFolder, temporaryNote } from './issued-folder.ts';
import { readIssuedFile } from './issued-files.ts';
import { finding, type AuditFinding } from './audit-finding.ts';
import { fileProblems } from './audit-files.ts';
import { signatureProblems, signedBy } from './audit-signature.ts';
import { manifestProblems, type IssuedContent } from './audit-manifest.ts';
import { calculationProblems } from './audit-calculation.ts';
import { chainProblems, type ChainLink } from './audit-chain.ts';

export type { AuditFinding } from './audit-finding.ts';

export interface AuditLine {
  /** "projects/x rev B", or "projects/x issued/<entry>" for an entry that is not a revision. */
  subject: string;
  project: string;
  revision: string | null;
  /** Who signed it: "signed for approved by key alice (1a2b 3c4d 5e6f 7a8b)", "not signed"; "" when the manifest cannot be read. */
  signed: string;
  problems: AuditFinding[];
  notes: string[];
}

export interface AuditOptions {
  /** SPKI PEMs of the keys the auditor trusts: every revision must be signed, and only by them. */
  trustedKeys?: readonly string[];
  /** Also calculate each issued basis again and compare with its issued results. */
  recalculate?: boolean;
}

/** A file of the revision; its absence, or why it cannot be read (not a regular file, too large). */
function readOptional(dir: string, display: string, name: string): { bytes?: Buffer; problem?: string } {
  try {
    return { bytes: readIssuedFile(dir, display, name) };
  } catch (error) {
    if (!(error instanceof UserError)) throw error;
    return { problem: /does not exist/.test(error.message) ? `${name} is missing` : error.message.replace(`${display}/`, '') };
  }
}

async function auditRevision(cwd: string, project: string, revision: string, options: AuditOptions): Promise<{ line: AuditLine; link: ChainLink }> {
  const dir = issuedDir(cwd, project, revision);
  const display = `projects/${project}/issued/${revision}`;
  const line: AuditLine = { subject: `projects/${project} rev ${revision}`, project, revision, signed: '', problems: [], notes: [] };
  // The other files' reading problems are the file check's to report (audit-files.ts).
  const file = (name: string) => readOptional(dir, display, name).bytes;
  const read = readOptional(dir, display, ISSUED_FILES.manifest);
  const manifestBytes = read.bytes ?? null;
  let manifest: IssueManifest | null = null;
  if (!manifestBytes) line.problems.push(finding(read.problem!));
  else {
    const parsed = parseManifest(manifestBytes);
    if (parsed.ok) manifest = parsed.manifest;
    else line.problems.push(finding('manifest.json is damaged', ...parsed.problems));
  }
  if (manifest) line.signed = signedBy(manifest);
  line.problems.push(...fileProblems(dir, display, manifest));

  const content: IssuedContent = {};
  const basisBytes = file(ISSUED_FILES.basis);
  const resultsBytes = file(ISSUED_FILES.results);
  const pdfBytes = file(ISSUED_FILES.pdf);
  const htmlBytes = file(ISSUED_FILES.html);
  if (resultsBytes) {
    content.resultsBytes = resultsBytes;
    try {
      content.results = JSON.parse(resultsBytes.toString('utf8'));
    } catch (error) {
      line.problems.push(finding(`${ISSUED_FILES.results} is not JSON (${(error as Error).message})`));
    }
  }
  if (basisBytes) {
    content.basisBytes = basisBytes;
    const calculation = calculationProblems(basisBytes, content.results, display, project, manifest, options.recalculate === true);
    line.problems.push(...calculation.problems);
    line.notes.push(...calculation.notes);
    if (calculation.basis) content.basis = calculation.basis;
  }
  if (pdfBytes) {
    let pdf: PdfProperties | undefined;
    try {
      pdf = await readPdfProperties(pdfBytes);
    } catch (error) {
      line.problems.push(finding(`${ISSUED_FILES.pdf} cannot be read as a PDF (${(error as Error).message.split('\n')[0]})`));
    }
    if (pdf) content.pdf = pdf;
  }
  if (htmlBytes) content.html = htmlBytes.toString('utf8');
  if (manifest && manifestBytes) {
    line.problems.push(...manifestProblems(manifest, manifestBytes, project, revision, content));
    line.problems.push(...signatureProblems(dir, display, manifest, manifestBytes, options.trustedKeys ?? []));
  }
  return { line, link: { revision, manifest, manifestBytes } };
}

/** Every issued revision of a project, in issue order, a line for each foreign entry, and notes. */
export async function auditProject(cwd: string, project: string, options: AuditOptions = {}): Promise<{ lines: AuditLine[]; notes: string[] }> {
  const folder = readIssuedFolder(cwd, project);
  const lines: AuditLine[] = [];
  let before: ChainLink | null = null;
  for (const revision of folder.revisions) {
    const { line, link } = await auditRevision(cwd, project, revision, options);
    line.problems.push(...chainProblems(link, before, options.trustedKeys ?? []));
    lines.push(line);
    before = link;
  }
  for (const name of folder.other) {
    const kind = lstatSync(join(issuedRoot(cwd, project), name)).isDirectory() ? 'a folder not named as a revision' : 'not a revision folder';
    lines.push({ subject: `projects/${project} issued/${name}`, project, revision: null, signed: '', problems: [finding(`${kind}; only cellbasis issue writes here`)], notes: [] });
  }
  const notes = folder.temporary.map((name) => temporaryNote(cwd, project, name));
  return { lines, notes };
}
