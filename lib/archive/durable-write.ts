/**
 * Writing files so that they survive a crash once written: each file is created new (never
 * over an existing one), written, flushed to disk (fsync) and closed; folders are flushed after
 * entries are added or renamed in them, so a rename that makes an issued revision appear is on
 * disk together with everything inside it.
 */
import { closeSync, fsyncSync, openSync, writeSync } from 'node:fs';

export function writeFileDurably(path: string, bytes: Uint8Array | string, mode = 0o644): void {
  const fd = openSync(path, 'wx', mode);
  try {
    const data = typeof bytes === 'string' ? Buffer.from(bytes, 'utf8') : bytes;
    let offset = 0;
    while (offset < data.length) offset += writeSync(fd, data, offset, data.length - offset);
    fsyncSync(fd);
  } finally {
    closeSync(fd);
  }
}

export function syncFolder(path: string): void {
  const fd = openSync(path, 'r');
  try {
    fsyncSync(fd);
  } finally {
    closeSync(fd);
  }
}
