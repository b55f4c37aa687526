/**
 * Errors of the disk and the file system while the archive is written or read (a read-only
 * folder, a full disk, permission denied) as what they are: a user's problem with a path, told
 * on one line naming the path and what to do, exit 1; never "internal error, please report".
 * Anything that is not such an error (no errno code) is returned as it was, to surface as the bug
 * it is.
 */
import { EXIT_VALIDATION, UserError } from '../core/errors.ts';
import { fileErrorReason } from '../core/file-errors.ts';

/** The error as a one-line UserError naming `shown` and what the command tried (`action`, e.g. "write document.pdf"); other errors unchanged. */
export function fileSystemError(error: unknown, shown: string, action: string): unknown {
  if (error instanceof UserError) return error;
  const code = (error as NodeJS.ErrnoException | null)?.code;
  if (typeof code !== 'string' || !/^E[A-Z]+$/.test(code)) return error;
  // The reasons are worded once, for every command, in lib/core/file-errors.ts.
  const known = fileErrorReason(code);
  const reason = known === code ? `the system said ${code}` : known;
  return new UserError(`${shown}: cannot ${action}: ${reason}`, EXIT_VALIDATION);
}
