/**
 * What a project's sealed folder holds: the revision folders (named by revision, in issue
 * order), the temporary folders of seals in progress or killed (`.tmp-<rev>-<pid>`, never a
 * revision), the seal lock, and anything else (reported by the audit). Only `cellbasis seal`
 * creates entries here; it holds the lock (`.seal-lock`, the sealing process id) while it
 * works, and a lock or temporary folder left by a killed seal is recognised by its process no
 * longer running. Only what seal made is ever removed: a lock is a regular file holding a
 * process id, a temporary folder is named `.tmp-<rev>-<pid>` and holds only regular files of
 * the names seal writes; anything else is refused (the lock) or left in place and named.
 */
import { lstatSync, readdirSync, readFileSync, unlinkSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { EXIT_USAGE, EXIT_VALIDATION, UserError } from '../core/errors.ts';
import { SEALED_FILES, sealedRoot } from './layout.ts';
import { compareRevisions, isRevision } from '../basis/revisions.ts';

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

/** Whether the temporary folder `name` under a sealed folder is one seal made: its naming, and only regular files of the names seal writes. */
export function isSealTemporary(root: string, name: string): boolean {
  const match = /^\.tmp-(.+)-(\d+)$/.exec(name);
  const path = join(root, name);
  if (!match || !isRevision(match[1]!) || !lstatSync(path).isDirectory()) return false;
  const names = new Set<string>(Object.values(SEALED_FILES));
  return readdirSync(path).every((entry) => names.has(entry) && lstatSync(join(path, entry)).isFile());
}

/** The process id in a seal lock, or null when it is gone; refuses (exit 1) a file there that seal did not write. */
function lockHolder(path: string, display: string): number | null {
  const stat = lstatSync(path, { throwIfNoEntry: false });
  if (!stat) return null;
  const text = stat.isFile() && stat.size <= 24 ? readFileSync(path, 'utf8') : '';
  if (!/^\d+\n$/.test(text)) {
    throw new UserError(`seal: ${display}/sealed/${LOCK_FILE} is not a lock that cellbasis seal wrote; nothing was changed: remove it yourself if no seal runs`, EXIT_VALIDATION);
  }
  return Number(text);
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
    // Null: removed between the two calls; try again.
    const holder = lockHolder(path, display);
    if (holder === null) continue;
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
