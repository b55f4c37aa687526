/**
 * Errors of the file system in the user's words. A folder that is read-only, a full disk, a file
 * the user may not read are the user's to put right, not faults of cellbasis: each becomes one
 * line naming the path, what could not be done and what to do, with exit code 1, never an
 * "internal error" and never a stack trace. Node reports them as errors with a `code` (ENOSPC,
 * EACCES, ...), the `syscall` that failed and usually the `path` (and `dest`); a write to an open
 * file reports no path, so the writers of lib/batch/write-file.ts add it.
 *
 *   fileProblem(error)             the error as such a UserError, or null for any other error
 *   fileErrorReason(code)          "no space is left on the device: free some space and run again"
 */
import { EXIT_VALIDATION, UserError } from './errors.ts';

/** What each error code means for the user, and what to do about it. */
const REASONS: Record<string, string> = {
  ENOENT: 'it does not exist',
  EACCES: 'permission denied: check the mode of the file and of the folders above it',
  EPERM: 'the operation is not permitted: check the mode and the owner of the file and of the folders above it',
  EROFS: 'the file system is read-only: work in a folder you can write, or mount it writable',
  ENOSPC: 'no space is left on the device: free some space and run again',
  EDQUOT: 'the disk quota is used up: free some space and run again',
  EFBIG: 'the file would be larger than the file system allows',
  EIO: 'the device reported an input/output error: check the disk',
  EISDIR: 'it is a folder',
  ENOTDIR: 'a part of the path is not a folder',
  ENOTEMPTY: 'the folder is not empty',
  EEXIST: 'something of that name exists already',
  ELOOP: 'it is a symbolic link where none is accepted, or the path goes round a loop of links',
  ENAMETOOLONG: 'the path is too long',
  EMFILE: 'too many files are open: close other programs and try again',
  ENFILE: 'too many files are open on this machine: close other programs and try again',
  EBUSY: 'it is in use: close the program using it and try again',
  ETXTBSY: 'it is in use: close the program using it and try again',
  EXDEV: 'it would have to move to another file system',
  EAGAIN: 'it is not ready to be read (a pipe or a device)',
};

/** What the failing call was doing, in words. */
const ACTIONS: Record<string, string> = {
  open: 'open',
  read: 'read',
  write: 'write',
  close: 'write',
  fsync: 'write',
  mkdir: 'create the folder',
  mkdtemp: 'create a folder in',
  rmdir: 'remove the folder',
  rm: 'remove',
  unlink: 'remove',
  rename: 'move',
  copyfile: 'copy',
  cp: 'copy',
  link: 'write',
  symlink: 'create the link',
  scandir: 'list the folder',
  opendir: 'list the folder',
  stat: 'reach',
  lstat: 'reach',
  chmod: 'change the mode of',
  utime: 'write',
  watch: 'watch',
};

/** A file-system error as Node throws it: its code, the call that failed, the path (and the destination of a move or copy). */
export type FileError = NodeJS.ErrnoException & { code: string; dest?: string };

/** Whether an error is one of the file system's (it has a code that REASONS knows). */
export function isFileError(error: unknown): error is FileError {
  return error instanceof Error && typeof (error as NodeJS.ErrnoException).code === 'string' && (error as NodeJS.ErrnoException).code! in REASONS;
}

/** The reason and remedy for an error code, or the code itself for one without words here. */
export function fileErrorReason(code: string): string {
  return REASONS[code] ?? code;
}

/** The first file-system error in an error's chain of causes (Eleventy and others wrap what they meet). */
export function fileErrorIn(error: unknown): FileError | null {
  let e: unknown = error;
  for (let depth = 0; e && depth < 10; depth++) {
    if (isFileError(e)) return e;
    e = (e as { originalError?: unknown }).originalError ?? (e as { cause?: unknown }).cause;
  }
  return null;
}

/**
 * The error, or the first file-system error among its causes, as one line for the user:
 * `site/index.html: cannot write: no space is left on the device: free some space and run again`,
 * with exit code 1. `shown` turns an absolute path into the one messages show (relative to the
 * working folder). Null when no file-system error is found.
 */
export function fileProblem(error: unknown, shown: (path: string) => string = (p) => p): UserError | null {
  const found = fileErrorIn(error);
  if (!found) return null;
  const action = ACTIONS[found.syscall ?? ''] ?? 'use';
  const path = found.path === undefined ? '' : `${shown(found.path)}${found.dest !== undefined ? ` to ${shown(found.dest)}` : ''}: `;
  return new UserError(`${path}cannot ${action}: ${fileErrorReason(found.code)}`, EXIT_VALIDATION);
}
