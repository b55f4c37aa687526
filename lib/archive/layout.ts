/**
 * Where sealed revisions live and what their manifest holds. A sealed revision is a folder that
 * no command but `cellbasis seal` ever writes:
 *
 *   projects/<id>/sealed/<rev>/
 *     basis.yaml      the basis as sealed (document revision and status set to the sealed ones)
 *     results.json    the results object of that basis (lib/plant/results-schema.ts)
 *     document.html   the design-basis document as one self-contained file (CSS, fonts, scripts inlined)
 *     document.pdf    the same document printed to PDF
 *     manifest.json   this module's SealManifest: SHA-256 of every file above, and the context
 *     manifest.sig    optional: Ed25519 signature of the exact bytes of manifest.json (base64)
 *
 * The site builds each sealed revision's page from basis.yaml and results.json as sealed, never by
 * recomputing. This module only names the paths and the manifest's shape; sealing, auditing and
 * comparing live beside it in lib/archive.
 */
import { existsSync, readdirSync, realpathSync } from 'node:fs';
import { basename, dirname, isAbsolute, join, relative, resolve, sep } from 'node:path';
import type { DocumentStatus } from '../basis/types.ts';

export const SEALED_DIR = 'sealed';

export const SEALED_FILES = {
  basis: 'basis.yaml',
  results: 'results.json',
  html: 'document.html',
  pdf: 'document.pdf',
  manifest: 'manifest.json',
  signature: 'manifest.sig',
} as const;

/** The files a manifest lists, in this order. */
export const HASHED_FILES = [SEALED_FILES.basis, SEALED_FILES.results, SEALED_FILES.html, SEALED_FILES.pdf] as const;

export interface SealManifest {
  format: 'cellbasis-seal/1';
  project: string;
  /** Document number and title as sealed. */
  documentNumber: string;
  title: string;
  revision: string;
  status: DocumentStatus;
  /** The note given to `seal --note`, or "". */
  note: string;
  /** The seal date (ISO date, YYYY-MM-DD) used for every timestamp in the sealed files. */
  sealedOn: string;
  /**
   * The timestamp written into the files (PDF CreationDate and ModDate), ISO 8601 UTC: 00:00 of
   * sealedOn, or the SOURCE_DATE_EPOCH second when that set the date. Absent in manifests that
   * predate it; read as 00:00 UTC of sealedOn then.
   */
  sealedAt?: string;
  tool: { name: 'cellbasis'; version: string };
  /** SHA-256 of the species data file (lib/thermo/data/nasa-glenn-excerpt.inp) used. */
  speciesData_sha256: string;
  /** SHA-256 (hex) of each sealed file by name. */
  files: Record<string, string>;
  /** The revision this one follows and the SHA-256 of its manifest.json, or null for the first. */
  previous: { revision: string; manifest_sha256: string } | null;
  /** Signatories as sealed (from the basis's sign-off). */
  signOff: { role: 'prepared' | 'checked' | 'approved'; name: string; date?: string }[];
  /** SPKI PEM of the public key whose signature is in manifest.sig, when signed. */
  publicKey?: string;
  /** The Chromium that printed document.pdf (its version), for reproducing the PDF. */
  pdf?: { chromium: string };
}

/** projects/<id>/sealed under the working folder. */
export function sealedRoot(cwd: string, projectId: string): string {
  return join(cwd, 'projects', projectId, SEALED_DIR);
}

/** projects/<id>/sealed/<rev>. */
export function sealedDir(cwd: string, projectId: string, revision: string): string {
  return join(sealedRoot(cwd, projectId), revision);
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
 * The sealed folder that writing or replacing `target` would touch, or null: `target` inside a
 * projects/<id>/sealed folder, or a folder that holds one (replacing `projects/` or the working
 * folder itself would take the sealed revisions with it), as written or where it really is, so
 * that no symbolic link on the way (`link-to-sealed/A`) leads there either. For commands that
 * write or replace what they are given (`build --out`, `keygen NAME`), so that no command but
 * seal ever writes there.
 */
export function sealedFolderAt(cwd: string, target: string): string | null {
  const projects = resolve(cwd, 'projects');
  const path = resolve(cwd, target);
  const real = realLocation(path);
  if (within(projects, path)) {
    const [id, dir] = relative(projects, path).split(sep);
    if (id && dir === SEALED_DIR) return join(projects, id, SEALED_DIR);
  }
  if (!existsSync(projects)) return null;
  for (const id of readdirSync(projects)) {
    const sealed = join(projects, id, SEALED_DIR);
    if (!existsSync(sealed)) continue;
    const realSealed = realpathSync(sealed);
    if (within(path, sealed) || within(real, realSealed) || within(realSealed, real)) return sealed;
  }
  return null;
}
