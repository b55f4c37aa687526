/**
 * Errors of the disk and the file system while the archive is written or read (a read-only
 * folder, a full disk, permission denied) as what they are: a user's problem with a path, told
 * on one line naming the path and what to do, exit 1; never "internal error, please report".
 * Anything that is not such an error (no errno code) is returned as it was, to surface as the bug
 * it is.
 */
import { EXIT_VALIDATION, UserError } from '../core/errors.ts';

const REASONS: Record<string, string> = {
  EACCES: 'permission denied: check the mode and owner of the folder and of the folders above it',
  EPERM: 'permission denied: check the mode and owner of the folder and of the folders above it',
  EROFS: 'the file system is read-only: issue from a copy on a writable disk',
  ENOSPC: 'no space left on the device: free some space and run the command again',
  EDQUOT: 'the disk quota is exceeded: free some space and run the command again',
  EIO: 'the disk reported an input/output error: check the disk',
  ENOTDIR: 'a part of the path is not a folder',
  EISDIR: 'it is a folder',
  EEXIST: 'something of that name is already there',
  ENOENT: 'it does not exist (was it moved or removed meanwhile?)',
  EMFILE: 'too many files are open: close other programs and run the command again',
  ENFILE: 'too many files are open on this system: run the command again later',
  ELOOP: 'too many symbolic links on the way',
  ENAMETOOLONG: 'the path is too long',
  EFBIG: 'the file is larger than the file system allows',
};

/** The error as a one-line UserError naming `shown` and what the command tried (`action`, e.g. "write document.pdf"); other errors unchanged. */
export function fileSystemError(error: unknown, shown: string, action: string): unknown {
  if (error instanceof UserError) return error;
  const code = (error as NodeJS.ErrnoException | null)?.code;
  if (typeof code !== 'string' || !/^E[A-Z]+$/.test(code)) return error;
  const reason = REASONS[code] ?? `the system said ${code}`;
  return new UserError(`${shown}: cannot ${action}: ${reason}`, EXIT_VALIDATION);
}
