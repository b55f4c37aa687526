/**
 * Reading a file the user or an archive names, without hanging or running out of memory.
 *
 * A path may name a FIFO (reading it blocks until a writer comes), a device (`/dev/zero` never
 * ends) or a file far larger than anything cellbasis writes. So the file is opened without
 * blocking and without following a final symbolic link unless asked, checked on the open
 * descriptor (the same object that is then read, so it cannot be swapped between the check and
 * the read) to be a regular file of at most `maxBytes`, and read to at most `maxBytes + 1`
 * bytes, which also catches a file that grows while it is read. Every refusal is a UserError
 * naming the file and what to do.
 */
import { closeSync, constants, fstatSync, openSync, readSync } from 'node:fs';
import { EXIT_VALIDATION, UserError } from './errors.ts';

export interface ReadLimits {
  /** Largest size accepted, bytes. */
  maxBytes: number;
  /** What the file is, for messages: "design basis", "public key", "manifest". */
  what: string;
  /** Follow a symbolic link as the last component (default true). */
  followLinks?: boolean;
}

/** The size written for messages: "12 MiB", "640 KiB", "1025 bytes" (exact below 10 KiB). */
export function sizeText(bytes: number): string {
  if (bytes < 10 * 1024 && bytes % 1024 !== 0) return `${bytes} bytes`;
  if (bytes >= 1024 * 1024) return `${(bytes / (1024 * 1024)).toFixed(bytes % (1024 * 1024) === 0 ? 0 : 1)} MiB`;
  if (bytes >= 1024) return `${(bytes / 1024).toFixed(bytes % 1024 === 0 ? 0 : 1)} KiB`;
  return `${bytes} bytes`;
}

function kindOf(stat: import('node:fs').Stats): string {
  if (stat.isDirectory()) return 'a folder';
  if (stat.isFIFO()) return 'a named pipe (FIFO)';
  if (stat.isCharacterDevice()) return 'a character device';
  if (stat.isBlockDevice()) return 'a block device';
  if (stat.isSocket()) return 'a socket';
  if (stat.isSymbolicLink()) return 'a symbolic link';
  return 'not a regular file';
}

function openError(path: string, what: string, error: NodeJS.ErrnoException): UserError {
  const reason: Record<string, string> = {
    ENOENT: 'it does not exist',
    EACCES: 'permission denied: check the file mode and the folders above it',
    EPERM: 'permission denied: check the file mode and the folders above it',
    ELOOP: 'it is a symbolic link, which is not accepted here',
    EISDIR: 'it is a folder',
    ENOTDIR: 'a part of the path is not a folder',
    EMFILE: 'too many files are open; close other programs and try again',
  };
  return new UserError(`${path}: cannot read the ${what}: ${reason[error.code ?? ''] ?? error.message}`, EXIT_VALIDATION);
}

/** The bytes of a regular file of at most `limits.maxBytes`, or a UserError saying why not. */
export function readRegularFile(path: string, limits: ReadLimits): Buffer {
  const flags = constants.O_RDONLY | constants.O_NONBLOCK | (limits.followLinks === false ? constants.O_NOFOLLOW : 0);
  let fd: number;
  try {
    fd = openSync(path, flags);
  } catch (error) {
    throw openError(path, limits.what, error as NodeJS.ErrnoException);
  }
  try {
    const stat = fstatSync(fd);
    if (!stat.isFile()) throw new UserError(`${path}: the ${limits.what} must be a regular file; this is ${kindOf(stat)}`, EXIT_VALIDATION);
    if (stat.size > limits.maxBytes) {
      throw new UserError(`${path}: the ${limits.what} is ${sizeText(stat.size)}, more than the ${sizeText(limits.maxBytes)} accepted`, EXIT_VALIDATION);
    }
    const chunks: Buffer[] = [];
    let length = 0;
    for (;;) {
      const chunk = Buffer.alloc(Math.min(64 * 1024, limits.maxBytes + 1 - length));
      const read = readSync(fd, chunk, 0, chunk.length, null);
      if (read === 0) break;
      chunks.push(chunk.subarray(0, read));
      length += read;
      if (length > limits.maxBytes) {
        throw new UserError(`${path}: the ${limits.what} grew past the ${sizeText(limits.maxBytes)} accepted while it was read`, EXIT_VALIDATION);
      }
    }
    return Buffer.concat(chunks, length);
  } catch (error) {
    if (error instanceof UserError) throw error;
    throw openError(path, limits.what, error as NodeJS.ErrnoException);
  } finally {
    closeSync(fd);
  }
}
