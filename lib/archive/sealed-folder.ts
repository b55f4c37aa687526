/**
 * What a project's sealed folder holds: the revision folders (named by revision, in issue
 * order), the temporary folders of seals in progress or killed (`.tmp-<rev>-<pid>`, never a
 * revision), the seal lock, and anything else (reported by the audit). Only `cellbasis seal`
 * creates entries here; it holds the lock (`.seal-lock`, the sealing process id) while it
 * works, and a lock or temporary folder left by a killed seal is recognised by its process no
 * longer running.
 */
import { lstatSync, readdirSync, readFileSync, unlinkSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { EXIT_USAGE, UserError } from '../errors.ts';
import { sealedRoot } from './layout.ts';
import { compareRevisions, isRevision } from './revisions.ts';

export const TEMP_PREFIX = '.tmp-';
export const LOCK_FILE = '.seal-lock';

export function tempDirName(revision: string, pid: number): string {
  return `${TEMP_PREFIX}${revision}-${pid}`;
}

export interface SealedFolder {
  /** Revision folders, in issue order. */
  revisions: string[];
  /** Temporary folders of unfinished seals. */
  temporary: string[];
  /** Entries that are neither: files, links, folders not named as revisions. */
  other: string[];
}

export function readSealedFolder(cwd: string, projectId: string): SealedFolder {
  const root = sealedRoot(cwd, projectId);
  let names: string[];
  try {
    names = readdirSync(root);
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return { revisions: [], temporary: [], other: [] };
    throw error;
  }
  const folder: SealedFolder = { revisions: [], temporary: [], other: [] };
  for (const name of names.sort()) {
    if (name === LOCK_FILE) continue;
    if (name.startsWith(TEMP_PREFIX)) folder.temporary.push(name);
    else if (isRevision(name) && lstatSync(join(root, name)).isDirectory()) folder.revisions.push(name);
    else folder.other.push(name);
  }
  folder.revisions.sort(compareRevisions);
  return folder;
}

/** The last sealed revision, or null. */
export function lastRevision(folder: SealedFolder): string | null {
  return folder.revisions[folder.revisions.length - 1] ?? null;
}

export function processAlive(pid: number): boolean {
  if (!Number.isInteger(pid) || pid <= 0) return false;
  try {
    process.kill(pid, 0);
    return true;
  } catch (error) {
    return (error as NodeJS.ErrnoException).code === 'EPERM';
  }
}

/**
 * Takes the seal lock of a project's sealed folder (which must exist); returns its release.
 * A lock whose process has gone is taken over; a live one refuses.
 */
export function acquireSealLock(root: string, display: string): () => void {
  const path = join(root, LOCK_FILE);
  for (let attempt = 0; attempt < 2; attempt++) {
    try {
      writeFileSync(path, `${process.pid}\n`, { flag: 'wx' });
      return () => {
        try {
          unlinkSync(path);
        } catch {
          // Already gone: nothing to release.
        }
      };
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code !== 'EEXIST') throw error;
    }
    let holder = NaN;
    try {
      holder = Number(readFileSync(path, 'utf8').trim());
    } catch {
      // Removed between the two calls: try again.
    }
    if (processAlive(holder) && holder !== process.pid) {
      throw new UserError(`another seal of ${display} is running (process ${holder}); wait for it, or remove ${display}/sealed/${LOCK_FILE} if no seal runs`, EXIT_USAGE);
    }
    try {
      unlinkSync(path);
    } catch {
      // Someone else took it over first; the next attempt says so.
    }
  }
  throw new UserError(`could not take the seal lock ${display}/sealed/${LOCK_FILE}`, EXIT_USAGE);
}
