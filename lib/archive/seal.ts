/**
 * Sealing a revision: `sealRevision(options)` writes projects/<id>/sealed/<rev>/ (layout.ts)
 * from the working basis, or refuses and changes nothing.
 *
 * Refused (UserError; exit 1 for a basis with errors or a damaged archive, 2 for the request)
 * when the status is not one a revision is issued with (draft is the working state; superseded
 * follows from a later seal), the revision exists already or does not follow the last sealed
 * one (lib/basis/revisions.ts), the seal date lies before the last revision's, the basis has errors, or
 * Chromium is missing (a sealed revision must be complete, PDF included).
 *
 * Otherwise, holding the seal lock (sealed-folder.ts), it removes temporary folders that killed
 * seals left (and leaves in place, named, a folder so named that seal did not make), writes every file into `.tmp-<rev>-<pid>` beside the revisions (each flushed to
 * disk), and renames that folder to <rev> as the last step: whenever the process stops, the
 * revision is either complete or absent. The working basis is only read.
 *
 * The files: basis.yaml (sealed-basis.ts: the working text with revision and status set),
 * results.json (calculate() of that basis), document.html (the document as one self-contained
 * file, by `options.render`), document.pdf (printed by `options.pdf`, with the basis and results
 * attached) and manifest.json (manifest.ts), and with a key manifest.sig (signature.ts). Every
 * timestamp is the seal date (seal-date.ts).
 *
 * For tests of interruption, `pauseAt` names a step (SEAL_STEPS) at which the seal stops and
 * waits until it is killed; the CLI takes it from CELLBASIS_SEAL_PAUSE.
 */
import { existsSync, mkdirSync, rmSync, renameSync, rmdirSync } from 'node:fs';
import { join, resolve } from 'node:path';
import type { KeyObject } from 'node:crypto';
import { loadBasisText } from '../basis/load.ts';
import { BasisError } from '../basis/diagnostics.ts';
import { projectBasisPath } from '../basis/projects.ts';
import { DOCUMENT_STATUSES, type DesignBasis, type Diagnostic, type DocumentStatus } from '../basis/types.ts';
import { calculate } from '../plant/calculate.ts';
import type { Results } from '../plant/results-schema.ts';
import { speciesDataHash } from '../thermo/species-data.ts';
import { toolVersion } from '../core/version.ts';
import { documentPdfMeta } from '../report/pdf-meta.ts';
import type { PdfMeta } from '../core/pdf-properties.ts';
import { EXIT_USAGE, EXIT_VALIDATION, UserError } from '../core/errors.ts';
import { SEALED_FILES, sealedDir, sealedRoot, type SealManifest } from './layout.ts';
import { checkFollows, successors } from '../basis/revisions.ts';
import { acquireSealLock, isSealTemporary, lastRevision, readSealedFolder, tempDirName, type SealedFolder } from './sealed-folder.ts';
import { readSealedRevision, type SealedRevision } from './sealed-revision.ts';
import { sealedBasisText } from './sealed-basis.ts';
import { resolveSealDate, type SealDate } from './seal-date.ts';
import { manifestBytes, signOffOf } from './manifest.ts';
import { sha256Hex } from './hash.ts';
import { publicKeyPem, readPrivateKey, signBytes } from './signature.ts';
import { syncFolder, writeFileDurably } from './durable-write.ts';
import { readWorkingBasis } from './working-basis.ts';

/** The statuses a revision may be sealed with. */
export const SEALABLE_STATUSES: readonly DocumentStatus[] = DOCUMENT_STATUSES.filter((s) => s !== 'draft' && s !== 'superseded');

/** The steps of a seal, in order, where `pauseAt` may stop it. */
export const SEAL_STEPS = ['locked', 'temp-created', 'basis-written', 'results-written', 'html-written', 'pdf-written', 'manifest-written', 'renamed'] as const;
export type SealStep = (typeof SEAL_STEPS)[number];

/** What the document renderer is given for the revision being sealed. */
export interface SealDocumentInput {
  basis: DesignBasis;
  results: Results;
  /** The revision being sealed: number, status, date, note, sign-off, previous revision. */
  manifest: SealManifest;
  /** The revisions sealed before it, in issue order. */
  previous: SealedRevision[];
  /** The text of the sealed basis. */
  basisText: string;
}

/** Renders the sealed document as one self-contained HTML file. */
export type RenderSealedHtml = (input: SealDocumentInput) => Promise<string> | string;

/**
 * Prints the sealed document to PDF (lib/publish/pdf.ts gives one): given like the renderer, so
 * that the archive does not depend on the publishing code above it.
 */
export interface SealPdfPrinter {
  /** Throws (a UserError) when no PDF can be printed: asked before the seal takes its lock, so a refused seal writes nothing. */
  check(): void;
  /** The PDF of the page at `htmlPath` with the properties and attachments of `meta`, and the version of the Chromium that printed it. */
  print(htmlPath: string, meta: PdfMeta): Promise<{ pdf: Uint8Array; chromium: string }>;
}

export interface SealOptions {
  cwd: string;
  project: string;
  revision: string;
  status: string;
  note?: string;
  /** Private key file (PKCS#8 PEM), relative to cwd. */
  keyPath?: string;
  /** --date, YYYY-MM-DD. */
  date?: string;
  /** Environment (SOURCE_DATE_EPOCH). */
  env?: Record<string, string | undefined>;
  now?: () => Date;
  render: RenderSealedHtml;
  pdf: SealPdfPrinter;
  /** Told each warning of the basis. */
  warn?: (diagnostic: Diagnostic) => void;
  /** Stop at this step and wait to be killed (tests). */
  pauseAt?: string;
  onPause?: (step: SealStep) => void;
}

export interface SealOutcome {
  /** projects/<id>/sealed/<rev>. */
  display: string;
  manifest: SealManifest;
  manifestSha256: string;
  signed: boolean;
  sealDate: SealDate;
  /** Stale temporary folders of killed seals that were removed. */
  removedTemporary: string[];
  /** Folders named as temporary folders that seal did not make, left in place. */
  keptTemporary: string[];
}

function checkStatus(status: string): DocumentStatus {
  if (status === 'superseded') {
    throw new UserError('seal: a revision is not sealed as superseded; it becomes superseded when the next revision is sealed', EXIT_USAGE);
  }
  if (!(SEALABLE_STATUSES as readonly string[]).includes(status)) {
    throw new UserError(`seal: --status must be one of ${SEALABLE_STATUSES.map((s) => `"${s}"`).join(', ')}, got "${status}"${status === 'draft' ? ' (draft is the working basis, never sealed)' : ''}`, EXIT_USAGE);
  }
  return status as DocumentStatus;
}

/** Refuses a revision that exists or does not follow the last sealed one. */
function checkNext(folder: SealedFolder, revision: string, display: string): void {
  if (folder.other.includes(revision)) {
    throw new UserError(`seal: ${display}/sealed/${revision} exists and is not a sealed revision folder; move it away before sealing revision ${revision}`, EXIT_USAGE);
  }
  if (folder.revisions.includes(revision)) {
    const next = successors(lastRevision(folder)).join(' or ');
    throw new UserError(`seal: revision ${revision} of ${display} is sealed already (${display}/sealed/${revision}); a sealed revision is never rewritten: seal the next revision, ${next}`, EXIT_USAGE);
  }
  try {
    checkFollows(lastRevision(folder), revision);
  } catch (error) {
    throw new UserError(`seal: ${display}: ${(error as Error).message}`, EXIT_USAGE);
  }
}

async function pause(options: SealOptions, step: SealStep): Promise<void> {
  if (options.pauseAt !== step) return;
  options.onPause?.(step);
  await new Promise(() => setInterval(() => undefined, 1 << 30));
}

/** The sealed basis and its results; a calculation error is reported against the working file. */
function sealedContent(working: { text: string; basis: DesignBasis }, options: SealOptions, status: DocumentStatus): { text: string; basis: DesignBasis; results: Results } {
  const text = sealedBasisText(working.text, options.revision, status);
  const loaded = loadBasisText(text, `projects/${options.project}/sealed/${options.revision}/${SEALED_FILES.basis}`, options.project);
  if (!loaded.ok) throw new BasisError(loaded.errors, loaded.warnings);
  try {
    return { text, basis: loaded.basis, results: calculate(loaded.basis) };
  } catch (error) {
    if (error instanceof BasisError) calculate(working.basis);
    throw error;
  }
}

/** The revisions sealed so far, in issue order; refuses a seal date before the last one's. */
function previousRevisions(options: SealOptions, folder: SealedFolder, sealDate: SealDate): SealedRevision[] {
  const previous = folder.revisions.map((rev) => readSealedRevision(options.cwd, options.project, rev));
  const last = previous[previous.length - 1];
  if (last && last.manifest.sealedOn > sealDate.day) {
    throw new UserError(`seal: the seal date ${sealDate.day} is before ${last.manifest.sealedOn}, when revision ${last.revision} was sealed; revisions are sealed in date order`, EXIT_USAGE);
  }
  return previous;
}

/** The manifest of the revision before its files are hashed: what is sealed, when, by which tool, after which revision, signed by which key. */
function draftManifest(options: SealOptions, content: { basis: DesignBasis }, status: DocumentStatus, sealDate: SealDate, last: SealedRevision | undefined, key: KeyObject | undefined): SealManifest {
  return {
    format: 'cellbasis-seal/1',
    project: options.project,
    documentNumber: content.basis.document.number,
    title: content.basis.document.title,
    revision: options.revision,
    status,
    note: options.note ?? '',
    sealedOn: sealDate.day,
    sealedAt: sealDate.at.toISOString(),
    tool: { name: 'cellbasis', version: toolVersion() },
    speciesData_sha256: speciesDataHash(),
    files: {},
    previous: last ? { revision: last.revision, manifest_sha256: sha256Hex(last.manifestBytes) } : null,
    signOff: signOffOf(content.basis),
    ...(key ? { publicKey: publicKeyPem(key) } : {}),
  };
}

/**
 * Writes every file of the revision into `temp`, each flushed to disk, pausing after each step
 * when asked: basis.yaml, results.json, document.html (by options.render), document.pdf (by
 * options.pdf), manifest.json with the SHA-256 of each, and with a key manifest.sig. Returns the
 * final manifest and its bytes.
 */
async function writeRevision(
  options: SealOptions,
  temp: string,
  content: { text: string; basis: DesignBasis; results: Results },
  manifest: SealManifest,
  previous: SealedRevision[],
  sealDate: SealDate,
  key: KeyObject | undefined,
): Promise<{ final: SealManifest; bytes: Buffer }> {
  const basisBytes = Buffer.from(content.text, 'utf8');
  writeFileDurably(join(temp, SEALED_FILES.basis), basisBytes);
  await pause(options, 'basis-written');
  const resultsBytes = Buffer.from(`${JSON.stringify(content.results, null, 2)}\n`, 'utf8');
  writeFileDurably(join(temp, SEALED_FILES.results), resultsBytes);
  await pause(options, 'results-written');
  const html = await options.render({ basis: content.basis, results: content.results, manifest, previous, basisText: content.text });
  const htmlPath = join(temp, SEALED_FILES.html);
  writeFileDurably(htmlPath, html);
  await pause(options, 'html-written');
  const meta = documentPdfMeta({ basis: content.basis, results: content.results }, { date: sealDate.at, basisYaml: basisBytes, resultsJson: resultsBytes });
  const { pdf, chromium } = await options.pdf.print(htmlPath, meta);
  writeFileDurably(join(temp, SEALED_FILES.pdf), pdf);
  await pause(options, 'pdf-written');
  const files: Record<string, string> = {};
  for (const [name, bytes] of [
    [SEALED_FILES.basis, basisBytes],
    [SEALED_FILES.results, resultsBytes],
    [SEALED_FILES.html, Buffer.from(html, 'utf8')],
    [SEALED_FILES.pdf, pdf],
  ] as const) {
    files[name] = sha256Hex(bytes);
  }
  const final: SealManifest = { ...manifest, files, pdf: { chromium } };
  const bytes = manifestBytes(final);
  writeFileDurably(join(temp, SEALED_FILES.manifest), bytes);
  if (key) writeFileDurably(join(temp, SEALED_FILES.signature), signBytes(bytes, key));
  syncFolder(temp);
  await pause(options, 'manifest-written');
  return { final, bytes };
}

/** Renames the complete temporary folder to the revision: the one step that makes it appear. */
function moveIntoPlace(options: SealOptions, temp: string, display: string): void {
  try {
    renameSync(temp, sealedDir(options.cwd, options.project, options.revision));
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    if (code === 'ENOTEMPTY' || code === 'EEXIST') throw new UserError(`seal: revision ${options.revision} of ${display} appeared while sealing; nothing written`, EXIT_VALIDATION);
    throw error;
  }
}

export async function sealRevision(options: SealOptions): Promise<SealOutcome> {
  projectBasisPath(options.project, options.cwd);
  const display = `projects/${options.project}`;
  const status = checkStatus(options.status);
  const sealDate = resolveSealDate(options.date, options.env ?? {}, options.now);
  const key: KeyObject | undefined = options.keyPath ? readPrivateKey(resolve(options.cwd, options.keyPath), options.keyPath) : undefined;
  checkNext(readSealedFolder(options.cwd, options.project), options.revision, display);
  const working = readWorkingBasis(options.cwd, options.project, options.warn);
  options.pdf.check();

  const root = sealedRoot(options.cwd, options.project);
  const rootExisted = existsSync(root);
  mkdirSync(root, { recursive: true });
  let release: (() => void) | undefined;
  let temp: string | undefined;
  try {
    release = acquireSealLock(root, display);
    await pause(options, 'locked');
    const folder = readSealedFolder(options.cwd, options.project);
    checkNext(folder, options.revision, display);
    const removedTemporary = folder.temporary.filter((name) => isSealTemporary(root, name));
    const keptTemporary = folder.temporary.filter((name) => !removedTemporary.includes(name));
    for (const name of removedTemporary) rmSync(join(root, name), { recursive: true, force: true });
    const previous = previousRevisions(options, folder, sealDate);
    const content = sealedContent(working, options, status);

    temp = join(root, tempDirName(options.revision, process.pid));
    mkdirSync(temp);
    await pause(options, 'temp-created');
    const manifest = draftManifest(options, content, status, sealDate, previous[previous.length - 1], key);
    const { final, bytes } = await writeRevision(options, temp, content, manifest, previous, sealDate, key);
    moveIntoPlace(options, temp, display);
    temp = undefined;
    syncFolder(root);
    await pause(options, 'renamed');
    return { display: `${display}/sealed/${options.revision}`, manifest: final, manifestSha256: sha256Hex(bytes), signed: key !== undefined, sealDate, removedTemporary, keptTemporary };
  } finally {
    if (temp) rmSync(temp, { recursive: true, force: true });
    release?.();
    if (!rootExisted) {
      try {
        rmdirSync(root);
      } catch {
        // Not empty: a revision was sealed.
      }
    }
  }
}
