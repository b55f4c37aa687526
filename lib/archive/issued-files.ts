/**
 * Reading the files of an issued revision: each only when it is a regular file (never through a
 * symbolic link: an issued revision holds none), and at most the size ISSUED_FILE_LIMITS allows
 * (a design basis, the basis limit), through the one bounded reader, lib/core/read-file.ts.
 */
import { lstatSync } from 'node:fs';
import { join } from 'node:path';
import { kindOf, readRegularFile, sizeText } from '../core/read-file.ts';
import { UserError } from '../core/errors.ts';
import { MAX_BASIS_BYTES } from '../basis/source-text.ts';
import { ISSUED_FILES, ISSUED_FILE_LIMITS } from './layout.ts';
import { MAX_SIGNATURE_BYTES } from './signature.ts';

const WHAT: Record<string, string> = {
  'basis.yaml': 'issued basis',
  'results.json': 'issued results',
  'document.html': 'issued document',
  'document.pdf': 'issued PDF',
  'manifest.json': 'manifest',
};

function limitOf(name: string): number {
  return name === ISSUED_FILES.basis ? MAX_BASIS_BYTES : (ISSUED_FILE_LIMITS[name] ?? MAX_SIGNATURE_BYTES);
}

/**
 * For a file the site copies rather than reads (document.html, document.pdf): whether it is
 * there, and when it is, a problem if it is no regular file (a named pipe would make the copy
 * wait for ever, a device never end) or larger than its limit, named as the reader would;
 * checked before anything opens it, by lstat (a link is refused: an issued revision holds none).
 */
export function issuedFileToCopy(dir: string, display: string, name: string): { present: false } | { present: true; problem: string | null } {
  const stat = lstatSync(join(dir, name), { throwIfNoEntry: false });
  if (!stat) return { present: false };
  const what = WHAT[name] ?? 'signature';
  if (!stat.isFile()) return { present: true, problem: `${display}/${name}: the ${what} must be a regular file; this is ${kindOf(stat)}` };
  if (stat.size > limitOf(name)) return { present: true, problem: `${display}/${name}: the ${what} is ${sizeText(stat.size)}, more than the ${sizeText(limitOf(name))} accepted` };
  return { present: true, problem: null };
}

/** The bytes of `name` in the revision folder `dir` (shown as `display` in messages); throws a UserError naming the file. */
export function readIssuedFile(dir: string, display: string, name: string): Buffer {
  const maxBytes = limitOf(name);
  const path = join(dir, name);
  try {
    return readRegularFile(path, { maxBytes, what: WHAT[name] ?? 'signature', followLinks: false });
  } catch (error) {
    // The reader names the file by the path it opened; messages show it as the user knows it.
    if (error instanceof UserError && error.message.startsWith(`${path}:`)) throw new UserError(`${display}/${name}${error.message.slice(path.length)}`, error.exitCode);
    throw error;
  }
}
