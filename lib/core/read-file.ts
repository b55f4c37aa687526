/**
 * Reading a file the user or an archive names, without hanging or running out of memory.
 *
 * A path may name a FIFO (reading it blocks until a writer comes), a device (`/dev/zero` never
 * ends; opening some devices has effects of its own) or a file far larger than anything
 * cellbasis writes. So a path that is no regular file is refused before it is opened; the file
 * is then opened without blocking and without following a final symbolic link unless asked,
 * checked again on the open descriptor (the same object that is then read, so it cannot be
 * swapped between the check and the read) to be a regular file of at most `maxBytes`, and read
 * to at most `maxBytes + 1` bytes, which also catches a file that grows while it is read. Every
 * refusal is a UserError naming the file and what to do.
 */
import { closeSync, constants, fstatSync, lstatSync, openSync, readSync, statSync, type Stats } from 'node:fs';
import { EXIT_VALIDATION, UserError } from './errors.ts';
import { fileErrorReason } from './file-errors.ts';

export interface ReadLimits {
  /** Largest size accepted, bytes. */
  maxBytes: number;
  /** What the file is, for messages: "design basis", "public key", "manifest". */
  what: string;
  /** Follow a symbolic link as the last component (default true). */
  followLinks?: boolean;
  /** The path as messages show it (default: as given). */
  shown?: string;
  /** The exit code of a refusal (default 1, EXIT_VALIDATION). */
  exitCode?: number;
  /** The error for a file over the limit (default: a UserError saying so); `atLeast` when it grew past the limit while read. */
  tooLarge?: (bytes: number, atLeast: boolean) => Error;
}

/** The size written for messages: "12 MiB", "640 KiB", "1025 bytes" (exact below 10 KiB). */
export function sizeText(bytes: number): string {
  if (bytes < 10 * 1024 && bytes % 1024 !== 0) return `${bytes} bytes`;
  if (bytes >= 1024 * 1024) return `${(bytes / (1024 * 1024)).toFixed(bytes % (1024 * 1024) === 0 ? 0 : 1)} MiB`;
  if (bytes >= 1024) return `${(bytes / 1024).toFixed(bytes % 1024 === 0 ? 0 : 1)} KiB`;
  return `${bytes} bytes`;
}

/** What a file that is no regular file is, for messages: "a named pipe (FIFO)", "a folder". */
export function kindOf(stat: Stats): string {
  if (stat.isDirectory()) return 'a folder';
  if (stat.isFIFO()) return 'a named pipe (FIFO)';
  if (stat.isCharacterDevice()) return 'a character device';
  if (stat.isBlockDevice()) return 'a block device';
  if (stat.isSocket()) return 'a socket';
  if (stat.isSymbolicLink()) return 'a symbolic link';
  return 'not a regular file';
}

function openError(path: string, what: string, error: NodeJS.ErrnoException, exitCode: number = EXIT_VALIDATION): UserError {
  return new UserError(`${path}: cannot read the ${what}: ${error.code ? fileErrorReason(error.code) : error.message}`, exitCode);
}

/**
 * How many bytes to read next, `length` read so far of a file of `size` bytes when opened: the
 * rest of it and one byte more (the read that finds its end), then 64 KiB at a time if it grew.
 * A fixed 64 KiB buffer a read, and another for the read that found the end, allocated 128 KiB
 * for each 6 kB design basis: listing 2 000 of them left the process 35 MiB larger (RSS) with
 * none of it alive, 9 MiB with these buffers (5 December 2026), and the peak of a cold build of
 * 2 000 projects stood on it (lib/batch/basis-file-job.ts gives the figures).
 */
function chunkBytes(size: number, length: number): number {
  return length <= size ? size + 1 - length : 64 * 1024;
}

/** The bytes of a regular file of at most `limits.maxBytes`, or a UserError saying why not. */
export function readRegularFile(path: string, limits: ReadLimits): Buffer {
  const shown = limits.shown ?? path;
  const exitCode = limits.exitCode ?? EXIT_VALIDATION;
  const notRegular = (stat: Stats) => new UserError(`${shown}: the ${limits.what} must be a regular file; this is ${kindOf(stat)}`, exitCode);
  const tooLarge = (bytes: number, atLeast: boolean) =>
    limits.tooLarge?.(bytes, atLeast) ??
    new UserError(
      atLeast ? `${shown}: the ${limits.what} grew past the ${sizeText(limits.maxBytes)} accepted while it was read` : `${shown}: the ${limits.what} is ${sizeText(bytes)}, more than the ${sizeText(limits.maxBytes)} accepted`,
      exitCode,
    );
  // Refused before it is opened: opening a device can act (a tape rewinds), a FIFO's open waits for a writer.
  const before = (limits.followLinks === false ? lstatSync : statSync)(path, { throwIfNoEntry: false });
  if (before?.isSymbolicLink()) throw new UserError(`${shown}: cannot read the ${limits.what}: it is a symbolic link, which is not accepted here`, exitCode);
  if (before && !before.isFile()) throw notRegular(before);
  const flags = constants.O_RDONLY | constants.O_NONBLOCK | (limits.followLinks === false ? constants.O_NOFOLLOW : 0);
  let fd: number;
  try {
    fd = openSync(path, flags);
  } catch (error) {
    throw openError(shown, limits.what, error as NodeJS.ErrnoException, exitCode);
  }
  try {
    const stat = fstatSync(fd);
    if (!stat.isFile()) throw notRegular(stat);
    if (stat.size > limits.maxBytes) throw tooLarge(stat.size, false);
    const chunks: Buffer[] = [];
    let length = 0;
    for (;;) {
      const chunk = Buffer.alloc(Math.min(chunkBytes(stat.size, length), limits.maxBytes + 1 - length));
      const read = readSync(fd, chunk, 0, chunk.length, null);
      if (read === 0) break;
      chunks.push(chunk.subarray(0, read));
      length += read;
      if (length > limits.maxBytes) throw tooLarge(length, true);
    }
    return chunks.length === 1 ? chunks[0]! : Buffer.concat(chunks, length);
  } catch (error) {
    if (error instanceof Error && !('code' in error)) throw error;
    throw openError(shown, limits.what, error as NodeJS.ErrnoException, exitCode);
  } finally {
    closeSync(fd);
  }
}
