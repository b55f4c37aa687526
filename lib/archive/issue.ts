/**
 * Issuing a revision: `issueRevision(options)` writes projects/<id>/issued/<rev>/ (layout.ts)
 * from the working basis, or refuses and changes nothing.
 *
 * Refused, before anything is written:
 *   - with exit 2, a request that cannot be: a status a revision is not issued with (the working
 *     basis is the draft; superseded follows from the next issue), a revision that exists or does
 *     not follow the last one (lib/basis/revisions.ts), a malformed date, a key option without
 *     its role or a key that is not a private Ed25519 key;
 *   - with exit 1, a project that is not a folder of its own (a symbolic link to another project,
 *     or to a basis elsewhere), revisions still in the former folder (former-layout.ts), a basis
 *     with errors, any rule of issue-rules.ts not met (every one named, a line each: the sign-off
 *     the status needs, the dates, open assumptions of an approved revision, error-level
 *     findings), and no Chromium (an issued revision is complete, PDF included).
 *
 * Otherwise, holding the issue lock (issued-folder.ts), it removes temporary folders that killed
 * issue runs left (and leaves in place, named, a folder so named that issue did not make), writes
 * every file into `.tmp-<rev>-<pid>` beside the revisions (each flushed to disk), and renames
 * that folder to <rev> as the last step: whenever the process stops, the revision is either
 * complete or absent. A disk or file-system error on the way (permission, a full disk) is one
 * line naming the path (file-errors.ts), and the temporary folder is removed. The working basis
 * is only read.
 *
 * The files: basis.yaml (the working basis byte for byte), results.json (calculate() of it),
 * document.html (the document as one self-contained file, by `options.render`), document.pdf
 * (printed by `options.pdf`, with the basis and results attached), manifest.json (manifest.ts)
 * and, for each key given, manifest.<role>.sig (signature.ts). Every timestamp is the issue date
 * (issue-date.ts).
 *
 * For tests of interruption, `pauseAt` names a step (ISSUE_STEPS) at which the run stops and
 * waits until it is killed; the CLI takes it from CELLBASIS_ISSUE_PAUSE.
 */
import { existsSync, lstatSync, mkdirSync, readlinkSync, renameSync, rmdirSync, rmSync, statSync } from 'node:fs';
import { join } from 'node:path';
import type { KeyObject } from 'node:crypto';
import { projectBasisPath } from '../basis/projects.ts';
import type { DesignBasis, Diagnostic } from '../basis/types.ts';
import { ISSUE_STATUSES, checkFollows, successors, type IssueStatus } from '../basis/revisions.ts';
import { calculate } from '../plant/calculate.ts';
import type { Results } from '../plant/results-schema.ts';
import { speciesDataHash } from '../thermo/species-data.ts';
import { runAllChecks } from '../verification/checks.ts';
import { toolVersion } from '../core/version.ts';
import { documentPdfMeta } from '../report/pdf-meta.ts';
import type { RevisionContext } from '../report/revision.ts';
import type { PdfMeta } from '../core/pdf-properties.ts';
import { EXIT_USAGE, EXIT_VALIDATION, UserError } from '../core/errors.ts';
import { ISSUED_FILES, MANIFEST_FORMAT, SIGN_OFF_ROLES, issuedDir, issuedRoot, signatureFile, type IssueManifest, type ManifestSignature, type SignOffRole } from './layout.ts';
import { acquireIssueLock, isIssueTemporary, lastRevision, readIssuedFolder, tempDirName, type IssuedFolder } from './issued-folder.ts';
import { readIssuedRevision, type IssuedRevision } from './issued-revision.ts';
import { resolveIssueDate, type IssueDate } from './issue-date.ts';
import { manifestBytes, signOffOf } from './manifest.ts';
import { sha256Hex } from './hash.ts';
import { keyFingerprint, keyName, publicKeyPem, readPrivateKey, signBytes } from './signature.ts';
import { resolveKeyArg } from './keys.ts';
import { syncFolder, writeFileDurably } from './durable-write.ts';
import { readWorkingBasis } from './working-basis.ts';
import { refuseFormerLayout } from './former-layout.ts';
import { compareRevisions } from './compare.ts';
import { fileSystemError } from './file-errors.ts';
import { IssueRefused, issueVerdict } from './issue-rules.ts';

export { ISSUE_STATUSES } from '../basis/revisions.ts';

/** The steps of an issue run, in order, where `pauseAt` may stop it. */
export const ISSUE_STEPS = ['locked', 'temp-created', 'basis-written', 'results-written', 'html-written', 'pdf-written', 'manifest-written', 'renamed'] as const;
export type IssueStep = (typeof ISSUE_STEPS)[number];

/** What the document renderer is given for the revision being issued. */
export interface IssueDocumentInput {
  basis: DesignBasis;
  results: Results;
  /** The revision being issued: number, status, date, note, sign-off, signatures, previous revision. */
  manifest: IssueManifest;
  /** The revisions issued before it, in issue order. */
  previous: IssuedRevision[];
  /** The text of the issued basis. */
  basisText: string;
}

/** Renders the issued document as one self-contained HTML file. */
export type RenderIssuedHtml = (input: IssueDocumentInput) => Promise<string> | string;

/**
 * Prints the issued document to PDF (lib/publish/pdf.ts gives one): given like the renderer, so
 * that the archive does not depend on the publishing code above it.
 */
export interface IssuePdfPrinter {
  /** Throws (a UserError) when no PDF can be printed: asked before the issue takes its lock, so a refused issue writes nothing. */
  check(): void;
  /** The PDF of the page at `htmlPath` with the properties and attachments of `meta`, and the version of the Chromium that printed it. */
  print(htmlPath: string, meta: PdfMeta): Promise<{ pdf: Uint8Array; chromium: string }>;
}

export interface IssueOptions {
  cwd: string;
  project: string;
  /** The revision to issue; default: the next one (the next letter, or 0 for the first approved). */
  revision?: string;
  status: string;
  note?: string;
  /** `--key ROLE=KEY` values: the role signed for, and a key file or a key name of the key folder (keys.ts). */
  keys?: readonly string[];
  /** --date, YYYY-MM-DD. */
  date?: string;
  /** Environment (SOURCE_DATE_EPOCH, CELLBASIS_KEYS). */
  env?: Record<string, string | undefined>;
  now?: () => Date;
  render: RenderIssuedHtml;
  pdf: IssuePdfPrinter;
  /** Told each warning of the basis. */
  warn?: (diagnostic: Diagnostic) => void;
  /** Told each finding that does not stop the issue, and warnings about keys. */
  tell?: (line: string) => void;
  /** Writes one file of the revision (tests give one that fails like a full disk). */
  writeFile?: (path: string, bytes: Uint8Array | string) => void;
  /** Stop at this step and wait to be killed (tests). */
  pauseAt?: string;
  onPause?: (step: IssueStep) => void;
}

export interface IssueOutcome {
  /** projects/<id>/issued/<rev>. */
  display: string;
  manifest: IssueManifest;
  manifestSha256: string;
  issueDate: IssueDate;
  /** Stale temporary folders of killed issue runs that were removed. */
  removedTemporary: string[];
  /** Folders named as temporary folders that issue did not make, left in place. */
  keptTemporary: string[];
}

function checkStatus(status: string): IssueStatus {
  if (status === 'superseded') {
    throw new UserError('issue: a revision is not issued as superseded; it becomes superseded when the next revision is issued', EXIT_USAGE);
  }
  if (!(ISSUE_STATUSES as readonly string[]).includes(status)) {
    throw new UserError(`issue: --status must be one of ${ISSUE_STATUSES.map((s) => `"${s}"`).join(', ')}, got "${status}"${status === 'draft' ? ' (the working basis is the draft, never issued as one)' : ''}`, EXIT_USAGE);
  }
  return status as IssueStatus;
}

/** The revision to issue: as asked, else the next letter, or 0 when the first approved revision follows letters (ASME Y14.35). */
function chooseRevision(folder: IssuedFolder, asked: string | undefined, status: IssueStatus): string {
  if (asked !== undefined) return asked;
  const [letter, number] = successors(lastRevision(folder));
  return status === 'approved' && number !== undefined ? number : letter!;
}

/** Refuses a revision that exists or does not follow the last issued one. */
function checkNext(folder: IssuedFolder, revision: string, display: string): void {
  if (folder.other.includes(revision)) {
    throw new UserError(`issue: ${display}/issued/${revision} exists and is not an issued revision folder; move it away before issuing revision ${revision}`, EXIT_USAGE);
  }
  if (folder.revisions.includes(revision)) {
    const next = successors(lastRevision(folder)).join(' or ');
    throw new UserError(`issue: revision ${revision} of ${display} is issued already (${display}/issued/${revision}); an issued revision is never rewritten: issue the next revision, ${next}`, EXIT_USAGE);
  }
  try {
    checkFollows(lastRevision(folder), revision);
  } catch (error) {
    throw new UserError(`issue: ${display}: ${(error as Error).message}`, EXIT_USAGE);
  }
}

/**
 * Refuses a project that is not a folder of its own: a project folder, basis or issued folder
 * that is a symbolic link would issue another project's basis, or write its revisions elsewhere.
 */
function checkOwnFolder(cwd: string, project: string): void {
  const folder = join(cwd, 'projects', project);
  for (const [path, shown] of [
    [folder, `projects/${project}`],
    [join(folder, 'basis.yaml'), `projects/${project}/basis.yaml`],
    [issuedRoot(cwd, project), `projects/${project}/issued`],
  ] as const) {
    if (lstatSync(path, { throwIfNoEntry: false })?.isSymbolicLink()) {
      throw new UserError(
        `issue: ${shown} is a symbolic link (to ${readlinkSync(path)}); a revision is issued only from a project's own folder, so that it is filed with the basis it was made from: issue the project it leads to, or copy the basis into a project of its own`,
        EXIT_VALIDATION,
      );
    }
  }
}

/** The keys of `--key ROLE=KEY`, read and checked: one per role, each role one the basis signs for. */
function readKeys(options: IssueOptions, basis: DesignBasis): { role: SignOffRole; key: KeyObject; signature: ManifestSignature }[] {
  const out: { role: SignOffRole; key: KeyObject; signature: ManifestSignature }[] = [];
  for (const value of options.keys ?? []) {
    const match = /^([a-z]+)=(.*)$/s.exec(value);
    const role = match?.[1] as SignOffRole | undefined;
    if (!match || !role || !(SIGN_OFF_ROLES as readonly string[]).includes(role)) {
      throw new UserError(`issue: --key ${JSON.stringify(value)}: say which role the key signs for, as --key ROLE=KEY with ROLE prepared, checked or approved (e.g. --key approved=j-smith)`, EXIT_USAGE);
    }
    if (out.some((k) => k.role === role)) throw new UserError(`issue: --key: two keys sign for ${role}; give one key per role`, EXIT_USAGE);
    if (!basis.document.signOff[role]) {
      throw new UserError(`issue: --key ${role}=...: nobody has ${role} the document (projects/${options.project}/basis.yaml: document.sign-off has no ${role}); a key signs for a role in the sign-off`, EXIT_USAGE);
    }
    const { path, display } = resolveKeyArg(match[2]!, 'private', options.cwd, options.env ?? {});
    const key = readPrivateKey(path, display);
    const mode = statSync(path).mode;
    if (mode & 0o077) {
      options.tell?.(`warning: ${display} can be read by others than its owner (mode ${(mode & 0o777).toString(8).padStart(4, '0')}): whoever reads it can sign as you; chmod 600 ${display}`);
    }
    out.push({ role, key, signature: { role, key: keyName(path), fingerprint: keyFingerprint(key), publicKey: publicKeyPem(key) } });
  }
  return out.sort((a, b) => SIGN_OFF_ROLES.indexOf(a.role) - SIGN_OFF_ROLES.indexOf(b.role));
}

async function pause(options: IssueOptions, step: IssueStep): Promise<void> {
  if (options.pauseAt !== step) return;
  options.onPause?.(step);
  await new Promise(() => setInterval(() => undefined, 1 << 30));
}

/** Whether the basis changed from the revision before, the sign-off aside (a change of the sign-off alone is not a change the sign-off must cover). */
function changedSince(previous: IssuedRevision, working: { text: string; basis: DesignBasis }, results: Results): boolean {
  const changes = compareRevisions(
    { revision: previous.revision, basis: previous.basis, ...(previous.basisProblem ? { basisProblem: previous.basisProblem } : {}), results: previous.results, source: previous.basisText },
    { revision: 'draft', basis: working.basis, results, source: working.text },
  );
  return changes.inputs.length + changes.assumptions.length + changes.references.length + changes.results.length > 0 || changes.fields.some((f) => !f.path.startsWith('document.sign-off'));
}

/** The revisions issued so far, in issue order; refuses an issue date before the last one's. */
function previousRevisions(options: IssueOptions, folder: IssuedFolder, issueDate: IssueDate): IssuedRevision[] {
  const previous = folder.revisions.map((rev) => readIssuedRevision(options.cwd, options.project, rev));
  const last = previous[previous.length - 1];
  if (last && last.manifest.issuedOn > issueDate.day) {
    throw new UserError(`issue: the issue date ${issueDate.day} is before ${last.manifest.issuedOn}, when revision ${last.revision} was issued; revisions are issued in date order`, EXIT_USAGE);
  }
  return previous;
}

/** The manifest of the revision before its files are hashed: what is issued, when, by which tool, after which revision, signed by which keys. */
function draftManifest(options: IssueOptions, basis: DesignBasis, revision: string, status: IssueStatus, issueDate: IssueDate, last: IssuedRevision | undefined, signatures: ManifestSignature[]): IssueManifest {
  return {
    format: MANIFEST_FORMAT,
    project: options.project,
    documentNumber: basis.document.number,
    title: basis.document.title,
    revision,
    status,
    note: options.note ?? '',
    issuedOn: issueDate.day,
    issuedAt: issueDate.at.toISOString(),
    tool: { name: 'cellbasis', version: toolVersion() },
    speciesData_sha256: speciesDataHash(),
    files: {},
    previous: last ? { revision: last.revision, manifest_sha256: sha256Hex(last.manifestBytes) } : null,
    signOff: signOffOf(basis),
    signatures,
  };
}

/** The revision as its own document shows it. */
function revisionContext(manifest: IssueManifest): RevisionContext {
  return { kind: 'issued', revision: manifest.revision, status: manifest.status, issuedOn: manifest.issuedOn, note: manifest.note, signatures: manifest.signatures, pdfHref: ISSUED_FILES.pdf };
}

/**
 * Writes every file of the revision into `temp`, each flushed to disk, pausing after each step
 * when asked: basis.yaml, results.json, document.html (by options.render), document.pdf (by
 * options.pdf), manifest.json with the SHA-256 of each, and a signature per key. Returns the
 * final manifest and its bytes.
 */
async function writeRevision(
  options: IssueOptions,
  temp: string,
  content: { text: string; basis: DesignBasis; results: Results },
  manifest: IssueManifest,
  previous: IssuedRevision[],
  issueDate: IssueDate,
  keys: { role: SignOffRole; key: KeyObject }[],
): Promise<{ final: IssueManifest; bytes: Buffer }> {
  const write = options.writeFile ?? writeFileDurably;
  const basisBytes = Buffer.from(content.text, 'utf8');
  write(join(temp, ISSUED_FILES.basis), basisBytes);
  await pause(options, 'basis-written');
  const resultsBytes = Buffer.from(`${JSON.stringify(content.results, null, 2)}\n`, 'utf8');
  write(join(temp, ISSUED_FILES.results), resultsBytes);
  await pause(options, 'results-written');
  const html = await options.render({ basis: content.basis, results: content.results, manifest, previous, basisText: content.text });
  const htmlPath = join(temp, ISSUED_FILES.html);
  write(htmlPath, html);
  await pause(options, 'html-written');
  const meta = documentPdfMeta({ basis: content.basis, results: content.results, revision: revisionContext(manifest) }, { date: issueDate.at, basisYaml: basisBytes, resultsJson: resultsBytes });
  const { pdf, chromium } = await options.pdf.print(htmlPath, meta);
  write(join(temp, ISSUED_FILES.pdf), pdf);
  await pause(options, 'pdf-written');
  const files: Record<string, string> = {};
  for (const [name, bytes] of [
    [ISSUED_FILES.basis, basisBytes],
    [ISSUED_FILES.results, resultsBytes],
    [ISSUED_FILES.html, Buffer.from(html, 'utf8')],
    [ISSUED_FILES.pdf, pdf],
  ] as const) {
    files[name] = sha256Hex(bytes);
  }
  const final: IssueManifest = { ...manifest, files, pdf: { chromium } };
  const bytes = manifestBytes(final);
  write(join(temp, ISSUED_FILES.manifest), bytes);
  for (const k of keys) write(join(temp, signatureFile(k.role)), signBytes(bytes, k.key));
  syncFolder(temp);
  await pause(options, 'manifest-written');
  return { final, bytes };
}

/** Renames the complete temporary folder to the revision: the one step that makes it appear. */
function moveIntoPlace(options: IssueOptions, temp: string, revision: string, display: string): void {
  try {
    renameSync(temp, issuedDir(options.cwd, options.project, revision));
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    if (code === 'ENOTEMPTY' || code === 'EEXIST') throw new UserError(`issue: revision ${revision} of ${display} appeared while issuing; nothing written`, EXIT_VALIDATION);
    throw error;
  }
}

/** Everything a refusal needs, read and checked before the lock is taken, so that a refused issue touches nothing. */
function prepare(options: IssueOptions) {
  projectBasisPath(options.project, options.cwd);
  checkOwnFolder(options.cwd, options.project);
  refuseFormerLayout(options.cwd, options.project);
  const display = `projects/${options.project}`;
  const status = checkStatus(options.status);
  const issueDate = resolveIssueDate(options.date, options.env ?? {}, options.now);
  const folder = readIssuedFolder(options.cwd, options.project);
  const revision = chooseRevision(folder, options.revision, status);
  checkNext(folder, revision, display);
  const working = readWorkingBasis(options.cwd, options.project, options.warn);
  const keys = readKeys(options, working.basis);
  const previous = previousRevisions(options, folder, issueDate);
  const results = calculate(working.basis);
  const last = previous[previous.length - 1];
  const verdict = issueVerdict({
    basis: working.basis,
    results,
    basisFile: working.display,
    status,
    revision,
    issueDate: issueDate.day,
    today: (options.now ?? (() => new Date()))().toISOString().slice(0, 10),
    previous: last ? { revision: last.revision, issuedOn: last.manifest.issuedOn, signOff: last.manifest.signOff, changed: changedSince(last, working, results) } : null,
    failedChecks: runAllChecks().filter((c) => !c.pass).length,
  });
  if (verdict.refusals.length) throw new IssueRefused(verdict.refusals, `issue: revision ${revision} of ${display}, ${status}`);
  for (const line of verdict.findings) options.tell?.(`finding: ${line}`);
  return { display, status, issueDate, revision, working, keys, previous, results, lastIssued: lastRevision(folder) };
}

export async function issueRevision(options: IssueOptions): Promise<IssueOutcome> {
  const { display, status, issueDate, revision, working, keys, previous, results, lastIssued } = prepare(options);
  options.pdf.check();

  const root = issuedRoot(options.cwd, options.project);
  const rootExisted = existsSync(root);
  let release: (() => void) | undefined;
  let temp: string | undefined;
  try {
    try {
      mkdirSync(root, { recursive: true });
    } catch (error) {
      throw fileSystemError(error, `${display}/issued`, 'make the folder of the issued revisions');
    }
    release = acquireIssueLock(root, display);
    await pause(options, 'locked');
    const folder = readIssuedFolder(options.cwd, options.project);
    checkNext(folder, revision, display);
    if (lastRevision(folder) !== lastIssued) throw new UserError(`issue: revision ${lastRevision(folder)} of ${display} was issued meanwhile; run the issue again`, EXIT_VALIDATION);
    const removedTemporary = folder.temporary.filter((name) => isIssueTemporary(root, name));
    const keptTemporary = folder.temporary.filter((name) => !removedTemporary.includes(name));
    for (const name of removedTemporary) rmSync(join(root, name), { recursive: true, force: true });

    temp = join(root, tempDirName(revision, process.pid));
    const shownTemp = `${display}/issued/${tempDirName(revision, process.pid)}`;
    try {
      mkdirSync(temp);
    } catch (error) {
      temp = undefined;
      throw fileSystemError(error, shownTemp, 'make the temporary folder of the revision');
    }
    await pause(options, 'temp-created');
    const manifest = draftManifest(options, working.basis, revision, status, issueDate, previous[previous.length - 1], keys.map((k) => k.signature));
    let written: { final: IssueManifest; bytes: Buffer };
    try {
      written = await writeRevision(options, temp, { text: working.text, basis: working.basis, results }, manifest, previous, issueDate, keys);
      moveIntoPlace(options, temp, revision, display);
    } catch (error) {
      throw fileSystemError(error, shownTemp, 'write the revision, and nothing was issued');
    }
    temp = undefined;
    syncFolder(root);
    await pause(options, 'renamed');
    return { display: `${display}/issued/${revision}`, manifest: written.final, manifestSha256: sha256Hex(written.bytes), issueDate, removedTemporary, keptTemporary };
  } finally {
    if (temp) rmSync(temp, { recursive: true, force: true });
    release?.();
    if (!rootExisted) {
      try {
        rmdirSync(root);
      } catch {
        // Not empty: a revision was issued.
      }
    }
  }
}
