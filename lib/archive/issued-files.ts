/**
 * Reading the files of an issued revision: each only when it is a regular file (never through a
 * symbolic link: an issued revision holds none), and at most the size ISSUED_FILE_LIMITS allows
 * (a design basis, the basis limit), through the one bounded reader, lib/core/read-file.ts.
 */
import { join } from 'node:path';
import { readRegularFile } from '../core/read-file.ts';
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

/** The bytes of `name` in the revision folder `dir` (shown as `display` in messages); throws a UserError naming the file. */
export function readIssuedFile(dir: string, display: string, name: string): Buffer {
  const maxBytes = name === ISSUED_FILES.basis ? MAX_BASIS_BYTES : (ISSUED_FILE_LIMITS[name] ?? MAX_SIGNATURE_BYTES);
  const path = join(dir, name);
  try {
    return readRegularFile(path, { maxBytes, what: WHAT[name] ?? 'signature', followLinks: false });
  } catch (error) {
    // The reader names the file by the path it opened; messages show it as the user knows it.
    if (error instanceof UserError && error.message.startsWith(`${path}:`)) throw new UserError(`${display}/${name}${error.message.slice(path.length)}`, error.exitCode);
    throw error;
  }
}
