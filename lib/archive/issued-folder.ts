/**
 * What a project's issued folder holds: the revision folders (named by revision, in issue
 * order), the temporary folders of issue runs in progress or killed (`.tmp-<rev>-<pid>`, never a
 * revision), the issue lock, and anything else (reported by the audit). Only `cellbasis issue`
 * creates entries here; it holds the lock (`.issue-lock`, the issuing process id) while it
 * works, and a lock or temporary folder left by a killed issue run is recognised by its process
 * no longer running. Only what issue made is ever removed: a lock is a regular file holding a
 * process id, a temporary folder is named `.tmp-<rev>-<pid>` and holds only regular files of the
 * names issue writes; anything else is refused (the lock) or left in place and named.
 *
 * Every reader of the archive (issue, audit, compare, the site build and serve) takes the
 * revisions from readIssuedFolder and words a temporary folder with temporaryNote, so that a
 * killed or running issue is recognised the same way everywhere and never taken for a revision.
 */
import { lstatSync, readdirSync, unlinkSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { EXIT_USAGE, EXIT_VALIDATION, UserError } from '../core/errors.ts';
import { FORMER_SIGNATURE_FILE, ISSUED_FILES, SIGN_OFF_ROLES, issuedRoot, signatureFile } from './layout.ts';
import { compareRevisions, isRevision } from '../basis/revisions.ts';
import { fileSystemError } from './file-errors.ts';
import { readRegularFile } from '../core/read-file.ts';

const TEMP_PREFIX = '.tmp-';
export const LOCK_FILE = '.issue-lock';

const TEMP_NAME = /^\.tmp-(.+)-(\d+)$/;

export function tempDirName(revision: string, pid: number): string {
  return `${TEMP_PREFIX}${revision}-${pid}`;
}

export interface IssuedFolder {
  /** Revision folders, in issue order. */
  revisions: string[];
  /** Temporary folders of issue runs, running or killed. */
  temporary: string[];
  /** Entries that are neither: files, links, folders not named as revisions. */
  other: string[];
}

export function readIssuedFolder(cwd: string, projectId: string): IssuedFolder {
  const root = issuedRoot(cwd, projectId);
  let names: string[];
  try {
    names = readdirSync(root);
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return { revisions: [], temporary: [], other: [] };
    throw fileSystemError(error, `projects/${projectId}/issued`, 'read the issued revisions');
  }
  const folder: IssuedFolder = { revisions: [], temporary: [], other: [] };
  for (const name of names.sort()) {
    if (name === LOCK_FILE) continue;
    if (name.startsWith(TEMP_PREFIX)) folder.temporary.push(name);
    else if (isRevision(name) && lstatSync(join(root, name), { throwIfNoEntry: false })?.isDirectory()) folder.revisions.push(name);
    else folder.other.push(name);
  }
  folder.revisions.sort(compareRevisions);
  return folder;
}

/**
 * What a temporary folder is, in the words every reader uses: an issue running now (its process
 * alive), one that ended since the folder was listed (its folder gone: renamed into the revision,
 * which this reading does not show), or left by an issue run that was killed (the next issue
 * removes it).
 */
export function temporaryNote(cwd: string, projectId: string, name: string): string {
  const match = TEMP_NAME.exec(name);
  const shown = `projects/${projectId}/issued/${name}`;
  if (match && processAlive(Number(match[2])) && Number(match[2]) !== process.pid) {
    return `${shown}: revision ${match[1]} is being issued now (process ${match[2]}); not a revision until that run ends`;
  }
  if (match && !lstatSync(join(issuedRoot(cwd, projectId), name), { throwIfNoEntry: false })) {
    return `${shown}: revision ${match[1]} was being issued while the archive was read (process ${match[2]}, ended since); not shown here: read it again to see it`;
  }
  return `${shown}: left by an interrupted issue run, not a revision; the next cellbasis issue of this project removes it`;
}

/** The names an issue run writes into its temporary folder. */
const WRITTEN = new Set<string>([...Object.values(ISSUED_FILES), ...SIGN_OFF_ROLES.map(signatureFile), FORMER_SIGNATURE_FILE]);

/** Whether the temporary folder `name` under an issued folder is one issue made: its naming, and only regular files of the names issue writes. */
export function isIssueTemporary(root: string, name: string): boolean {
  const match = TEMP_NAME.exec(name);
  const path = join(root, name);
  if (!match || !isRevision(match[1]!) || !lstatSync(path, { throwIfNoEntry: false })?.isDirectory()) return false;
  return readdirSync(path).every((entry) => WRITTEN.has(entry) && lstatSync(join(path, entry)).isFile());
}

/** The process id in an issue lock, or null when it is gone; refuses (exit 1) a file there that issue did not write. */
function lockHolder(path: string, display: string): number | null {
  const stat = lstatSync(path, { throwIfNoEntry: false });
  if (!stat) return null;
  let text = '';
  try {
    // Through the bounded reader: a FIFO or a device put there is refused before it is opened, never waited on.
    text = readRegularFile(path, { maxBytes: 24, what: 'issue lock', followLinks: false }).toString('utf8');
  } catch (error) {
    if (!(error instanceof UserError)) throw error;
    // Gone since the lstat: released meanwhile.
    if (!lstatSync(path, { throwIfNoEntry: false })) return null;
  }
  if (!/^\d+\n$/.test(text)) {
    throw new UserError(`issue: ${display}/issued/${LOCK_FILE} is not a lock that cellbasis issue wrote; nothing was changed: remove it yourself if no issue runs`, EXIT_VALIDATION);
  }
  return Number(text);
}

/** The last issued revision, or null. */
export function lastRevision(folder: IssuedFolder): string | null {
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
 * Takes the issue lock of a project's issued folder (which must exist); returns its release.
 * A lock whose process has gone is taken over; a live one refuses.
 */
export function acquireIssueLock(root: string, display: string): () => void {
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
      if ((error as NodeJS.ErrnoException).code !== 'EEXIST') throw fileSystemError(error, `${display}/issued/${LOCK_FILE}`, 'take the issue lock');
    }
    // Null: removed between the two calls; try again.
    const holder = lockHolder(path, display);
    if (holder === null) continue;
    if (processAlive(holder) && holder !== process.pid) {
      throw new UserError(`another issue of ${display} is running (process ${holder}); wait for it, or remove ${display}/issued/${LOCK_FILE} if no issue runs`, EXIT_USAGE);
    }
    try {
      unlinkSync(path);
    } catch {
      // Someone else took it over first; the next attempt says so.
    }
  }
  throw new UserError(`could not take the issue lock ${display}/issued/${LOCK_FILE}`, EXIT_USAGE);
}
