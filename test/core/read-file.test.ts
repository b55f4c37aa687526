/**
 * The bounded reader every command uses for files it is pointed at: a FIFO or a device is
 * refused before anything is read (reading either would block or never end), a file over the
 * limit is refused by its size, and the message names the file and what it is.
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { readRegularFile, sizeText, type ReadLimits } from '../../lib/core/read-file.ts';
import { UserError } from '../../lib/core/errors.ts';

const dir = mkdtempSync(join(tmpdir(), 'cellbasis-read-'));
const limits: ReadLimits = { maxBytes: 1024, what: 'public key' };

function refusal(path: string, options = limits): string {
  try {
    readRegularFile(path, options);
  } catch (error) {
    expect(error).toBeInstanceOf(UserError);
    return (error as Error).message;
  }
  throw new Error(`${path} was read`);
}

describe('readRegularFile', () => {
  it('reads a regular file within the limit, byte for byte', () => {
    const file = join(dir, 'small');
    const bytes = Buffer.from([0, 1, 2, 255, 10, 13]);
    writeFileSync(file, bytes);
    expect(readRegularFile(file, limits).equals(bytes)).toBe(true);
    const exact = join(dir, 'exact');
    writeFileSync(exact, Buffer.alloc(1024, 7));
    expect(readRegularFile(exact, limits).length).toBe(1024);
  });

  it('reads a file read in several parts, and one larger than its size when opened, byte for byte', () => {
    // Larger than the 64 KiB read at a time past the size the file had when opened.
    const file = join(dir, 'several');
    const bytes = Buffer.from(Array.from({ length: 200_000 }, (_, i) => (i * 7919) % 251));
    writeFileSync(file, bytes);
    expect(readRegularFile(file, { maxBytes: 256 * 1024, what: 'design basis' }).equals(bytes)).toBe(true);
    // A file of the proc file system is a regular file of size 0 with text in it, as a file that grew after it was opened.
    expect(readRegularFile('/proc/version', { maxBytes: 64 * 1024, what: 'version' }).equals(readFileSync('/proc/version'))).toBe(true);
    expect(refusal('/proc/version', { maxBytes: 10, what: 'version' })).toBe('/proc/version: the version grew past the 10 bytes accepted while it was read');
  });

  it('refuses a file over the limit by its size, without reading it', () => {
    const file = join(dir, 'large');
    writeFileSync(file, Buffer.alloc(1025));
    expect(refusal(file)).toBe(`${file}: the public key is 1025 bytes, more than the 1 KiB accepted`);
  });

  it('refuses a named pipe at once instead of waiting for a writer', () => {
    const fifo = join(dir, 'fifo');
    execFileSync('mkfifo', [fifo]);
    expect(refusal(fifo)).toBe(`${fifo}: the public key must be a regular file; this is a named pipe (FIFO)`);
  });

  it('refuses a device that never ends (/dev/zero) and a folder', () => {
    expect(refusal('/dev/zero')).toBe('/dev/zero: the public key must be a regular file; this is a character device');
    expect(refusal(dir)).toBe(`${dir}: the public key must be a regular file; this is a folder`);
  });

  it('names a missing file, and refuses a link where links are not accepted', () => {
    expect(refusal(join(dir, 'absent'))).toBe(`${join(dir, 'absent')}: cannot read the public key: it does not exist`);
    const target = join(dir, 'target');
    writeFileSync(target, 'key');
    const link = join(dir, 'link');
    symlinkSync(target, link);
    expect(readRegularFile(link, limits).toString()).toBe('key');
    expect(refusal(link, { ...limits, followLinks: false })).toBe(`${link}: cannot read the public key: it is a symbolic link, which is not accepted here`);
  });

  it('writes sizes as a reader expects', () => {
    expect(sizeText(300)).toBe('300 bytes');
    expect(sizeText(1024)).toBe('1 KiB');
    expect(sizeText(1536)).toBe('1536 bytes');
    expect(sizeText(15 * 1024 + 512)).toBe('15.5 KiB');
    expect(sizeText(16 * 1024 * 1024)).toBe('16 MiB');
  });
});
