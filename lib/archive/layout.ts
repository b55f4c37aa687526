/**
 * Where issued revisions live and what their manifest holds. An issued revision is a folder that
 * no command but `cellbasis issue` ever writes:
 *
 *   projects/<id>/issued/<rev>/
 *     basis.yaml              the working basis as it was issued, byte for byte
 *     results.json            the results object of that basis (lib/plant/results-schema.ts)
 *     document.html           the design-basis document as one self-contained file (CSS, fonts, scripts inlined)
 *     document.pdf            the same document printed to PDF
 *     manifest.json           this module's IssueManifest: SHA-256 of every file above, and the context
 *     manifest.<role>.sig     one per signature: Ed25519 over the exact bytes of manifest.json
 *                             (base64), by the key the manifest records for that role
 *
 * The revision and its status live here, and only here: the working basis states neither.
 * Revisions issued by earlier versions of cellbasis (format `cellbasis-seal/1`, in a folder then named
 * `sealed/`) carry the revision and status in their basis.yaml too, and at most one signature,
 * `manifest.sig`; they are read and audited as they are (former-layout.ts says how to move them).
 *
 * The site never renders an issued revision again: it shows its document.html and document.pdf
 * as issued. This module only names the paths and the manifest's shape; issuing, auditing and
 * comparing live beside it in lib/archive.
 */
import { existsSync, readdirSync, realpathSync } from 'node:fs';
import { basename, dirname, isAbsolute, join, relative, resolve, sep } from 'node:path';
import type { IssueStatus } from '../basis/revisions.ts';

export const ISSUED_DIR = 'issued';

/** The folder earlier versions issued revisions into (former-layout.ts). */
export const FORMER_DIR = 'sealed';

export const ISSUED_FILES = {
  basis: 'basis.yaml',
  results: 'results.json',
  html: 'document.html',
  pdf: 'document.pdf',
  manifest: 'manifest.json',
} as const;

/**
 * The largest size each file of an issued revision is read at (lib/core/read-file.ts, which also
 * refuses anything but a regular file): some hundred times what cellbasis writes for a large
 * basis (a manifest of 3 KB, results of 0.5 MB, a document of 3 MB, a PDF of 2 MB), so that no
 * file put there, a device or an enormous one, can hang a command or exhaust its memory.
 */
export const ISSUED_FILE_LIMITS: Record<string, number> = {
  'manifest.json': 1024 * 1024,
  'results.json': 64 * 1024 * 1024,
  'document.html': 256 * 1024 * 1024,
  'document.pdf': 256 * 1024 * 1024,
};

/** The files a manifest lists, in this order. */
export const HASHED_FILES = [ISSUED_FILES.basis, ISSUED_FILES.results, ISSUED_FILES.html, ISSUED_FILES.pdf] as const;

/** The manifest format this version writes, and the one of revisions issued before it. */
export const MANIFEST_FORMAT = 'cellbasis-issue/2';
export const FORMER_MANIFEST_FORMAT = 'cellbasis-seal/1';

export type SignOffRole = 'prepared' | 'checked' | 'approved';

export const SIGN_OFF_ROLES: readonly SignOffRole[] = ['prepared', 'checked', 'approved'];

/** The signature file of a role (format 2). */
export function signatureFile(role: SignOffRole): string {
  return `manifest.${role}.sig`;
}

/** The one signature file of a revision of format 1. */
export const FORMER_SIGNATURE_FILE = 'manifest.sig';

/** A signature a manifest records: the role signed for, the key's name, its fingerprint and the key itself. */
export interface ManifestSignature {
  role: SignOffRole;
  /** The key's name: its file name without .key (cellbasis keygen NAME). */
  key: string;
  /** SHA-256 of the public key's SPKI DER, lower-case hex (signature.ts keyFingerprint). */
  fingerprint: string;
  /** SPKI PEM of the public key. */
  publicKey: string;
}

export interface IssueManifest {
  format: typeof MANIFEST_FORMAT | typeof FORMER_MANIFEST_FORMAT;
  project: string;
  /** Document number and title as issued. */
  documentNumber: string;
  title: string;
  revision: string;
  status: IssueStatus;
  /** The note given to `issue --note`, or "". */
  note: string;
  /** The issue date (ISO date, YYYY-MM-DD) used for every timestamp in the issued files. */
  issuedOn: string;
  /**
   * The timestamp written into the files (PDF CreationDate and ModDate), ISO 8601 UTC: 00:00 of
   * issuedOn, or the SOURCE_DATE_EPOCH second when that set the date. Absent in some manifests of
   * format 1; read as 00:00 UTC of issuedOn then.
   */
  issuedAt?: string;
  tool: { name: 'cellbasis'; version: string };
  /** SHA-256 of the species data file (lib/thermo/data/nasa-glenn-excerpt.inp) used. */
  speciesData_sha256: string;
  /** SHA-256 (hex) of each issued file by name. */
  files: Record<string, string>;
  /** The revision this one follows and the SHA-256 of its manifest.json, or null for the first. */
  previous: { revision: string; manifest_sha256: string } | null;
  /** Signatories as issued (from the basis's sign-off). */
  signOff: { role: SignOffRole; name: string; date?: string }[];
  /** The signatures in manifest.<role>.sig, in sign-off order (format 2); [] for none. */
  signatures: ManifestSignature[];
  /** Format 1 only: SPKI PEM of the key whose signature is in manifest.sig, when signed. */
  formerPublicKey?: string;
  /** The Chromium that printed document.pdf (its version), for reproducing the PDF. */
  pdf?: { chromium: string };
}

/** The signature files of a revision with their role (null for format 1's one file) and public key. */
export function signatureFiles(m: IssueManifest): { file: string; role: SignOffRole | null; publicKey: string }[] {
  if (m.format === FORMER_MANIFEST_FORMAT) return m.formerPublicKey ? [{ file: FORMER_SIGNATURE_FILE, role: null, publicKey: m.formerPublicKey }] : [];
  return m.signatures.map((s) => ({ file: signatureFile(s.role), role: s.role, publicKey: s.publicKey }));
}

/** projects/<id>/issued under the working folder. */
export function issuedRoot(cwd: string, projectId: string): string {
  return join(cwd, 'projects', projectId, ISSUED_DIR);
}

/** projects/<id>/issued/<rev>. */
export function issuedDir(cwd: string, projectId: string, revision: string): string {
  return join(issuedRoot(cwd, projectId), revision);
}

/** Whether `inner` is `outer` or lies inside it (paths compared as written). */
export function within(outer: string, inner: string): boolean {
  const rel = relative(outer, inner);
  return rel === '' || (!rel.startsWith('..') && !isAbsolute(rel));
}

/**
 * Where `path` really is: the folders above it that exist, with every symbolic link resolved,
 * then the rest as written. `path` itself is not followed (a command that replaces it replaces
 * a link there, not what the link points to).
 */
export function realLocation(path: string): string {
  const below = [basename(path)];
  let dir = dirname(path);
  while (!existsSync(dir) && dirname(dir) !== dir) {
    below.unshift(basename(dir));
    dir = dirname(dir);
  }
  return join(realpathSync(dir), ...below);
}

/**
 * The folder of issued revisions that writing or replacing `target` would touch, or null:
 * `target` inside a projects/<id>/issued folder (or the former projects/<id>/sealed), or a
 * folder that holds one (replacing `projects/` or the working folder itself would take the issued
 * revisions with it), as written or where it really is, so that no symbolic link on the way
 * (`link-to-issued/A`) leads there either. For commands that replace what they are given
 * (`build --out`; keygen, which writes into a folder, uses issuedFolderHolding), so that no
 * command but issue ever writes there.
 */
export function issuedFolderAt(cwd: string, target: string): string | null {
  const projects = resolve(cwd, 'projects');
  const path = resolve(cwd, target);
  const real = realLocation(path);
  if (within(projects, path)) {
    const [id, dir] = relative(projects, path).split(sep);
    if (id && (dir === ISSUED_DIR || dir === FORMER_DIR)) return join(projects, id, dir);
  }
  if (!existsSync(projects)) return null;
  for (const id of readdirSync(projects)) {
    for (const dir of [ISSUED_DIR, FORMER_DIR]) {
      const issued = join(projects, id, dir);
      if (!existsSync(issued)) continue;
      const realIssued = realpathSync(issued);
      if (within(path, issued) || within(real, realIssued) || within(realIssued, real)) return issued;
    }
  }
  return null;
}

/**
 * The folder of issued revisions (or the former one) that `dir` lies in, as written or where it
 * really is with every link followed, `dir` itself included, or null: for commands that write
 * files into a folder they are given (`keygen --dir`), which may well be the working folder
 * itself but never a folder of issued revisions, however it is reached (`--dir link-to-issued`).
 */
export function issuedFolderHolding(cwd: string, dir: string): string | null {
  const path = resolve(cwd, dir);
  const real = existsSync(path) ? realpathSync(path) : realLocation(path);
  const projects = resolve(cwd, 'projects');
  if (!existsSync(projects)) return null;
  for (const id of readdirSync(projects)) {
    for (const name of [ISSUED_DIR, FORMER_DIR]) {
      const issued = join(projects, id, name);
      if (within(issued, path)) return issued;
      if (existsSync(issued) && within(realpathSync(issued), real)) return issued;
    }
  }
  return null;
}
