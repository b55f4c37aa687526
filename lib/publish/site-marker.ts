/**
 * How cellbasis knows a site folder as its own, so that it never replaces or removes one it did
 * not make. Every site folder it writes (a build's, serve's, Eleventy's run with the site's
 * configuration) carries the file SITE_MARKER with exactly SITE_MARKER_TEXT, written first. A
 * folder counts as ours when it carries that marker, or when it is empty (replacing it loses
 * nothing). Anything else at such a path, a folder without the marker (or with a file of that
 * name and other content), a plain or special file, a symbolic link (serve and Eleventy follow
 * a link to the folder it shows, build accepts only its own link, lib/publish/build.ts), is
 * refused with a UserError naming it (exit 1), and nothing is changed.
 *
 *   siteFolderProblem(path): string | null   why `path` (not followed) is no site folder of ours; null when missing or ours
 *   claimSiteFolder(path, command, shown)    for writers: makes and marks a missing or empty folder, checks a marked one, refuses the rest
 *   writeSiteMarker(dir)                     marks a folder cellbasis has just made
 *   removeOwnFolder(path): boolean           removes a folder of ours (marked: all of it; empty: rmdir), leaves anything else
 */
import { lstatSync, mkdirSync, readdirSync, readFileSync, readlinkSync, rmdirSync, rmSync, statSync, unlinkSync, writeFileSync, type Stats } from 'node:fs';
import { join } from 'node:path';
import { EXIT_VALIDATION, UserError } from '../core/errors.ts';

export const SITE_MARKER = '.cellbasis-site';

/** The marker's exact bytes: the tool, the format of the site folder, and what the file is for. */
export const SITE_MARKER_TEXT = 'cellbasis site\nformat 1\nThis folder was written by cellbasis, which may replace or remove it whole.\n';

/** siteFolderProblem's words for a symbolic link, which it does not follow. */
export const SYMBOLIC_LINK = 'a symbolic link';

/** Whether the marker in `dir` is exactly ours: a regular file of the marker's size and bytes (nothing else is opened). */
function markerProblem(dir: string): string | null {
  const marker = join(dir, SITE_MARKER);
  const stat = lstatSync(marker, { throwIfNoEntry: false });
  if (!stat) return `it has no ${SITE_MARKER} marker`;
  const expected = Buffer.from(SITE_MARKER_TEXT, 'utf8');
  if (!stat.isFile() || stat.size !== expected.length || !readFileSync(marker).equals(expected)) return `its ${SITE_MARKER} is not the marker cellbasis writes`;
  return null;
}

/** Why a folder is none of ours, or null. */
function folderProblem(dir: string): string | null {
  if (readdirSync(dir).length === 0) return null;
  const marker = markerProblem(dir);
  return marker ? `a folder that cellbasis did not make (${marker})` : null;
}

/** What a non-folder is, as the refusal names it. */
function notAFolder(stat: Stats): string {
  return stat.isFile() ? 'a file, not a site folder cellbasis made' : 'a special file, not a site folder cellbasis made';
}

/**
 * Why `path` is not a site folder cellbasis made, as "is …" words for a message, or null when
 * nothing is there, or an empty folder, or a folder carrying the marker. A symbolic link is not
 * followed: it is named as one (the caller decides whether it made the link).
 */
export function siteFolderProblem(path: string): string | null {
  const stat = lstatSync(path, { throwIfNoEntry: false });
  if (!stat) return null;
  if (stat.isSymbolicLink()) return SYMBOLIC_LINK;
  if (!stat.isDirectory()) return notAFolder(stat);
  return folderProblem(path);
}

/** The refusal of a path that is none of ours: one line naming it, exit 1. */
export function notOursError(command: string, shown: string, problem: string, advice: string): UserError {
  return new UserError(`${command}: ${shown} is ${problem}; nothing was changed: ${advice}`, EXIT_VALIDATION);
}

export function writeSiteMarker(dir: string): void {
  writeFileSync(join(dir, SITE_MARKER), SITE_MARKER_TEXT, { flag: 'wx' });
}

/**
 * For a command that writes into a site folder in place (serve; Eleventy under `npx
 * @11ty/eleventy`): a missing folder is made, an empty one marked, a marked one used; anything
 * else is refused. A symbolic link is followed to the folder it shows, which must be ours.
 */
export function claimSiteFolder(path: string, command: string, shown: string): void {
  const stat = statSync(path, { throwIfNoEntry: false });
  if (!stat && lstatSync(path, { throwIfNoEntry: false })) {
    throw notOursError(command, shown, `a symbolic link to ${readlinkSync(path)}, which does not exist`, `move ${shown} away, or remove it yourself if it is yours to remove`);
  }
  if (!stat) {
    mkdirSync(path, { recursive: true });
    writeSiteMarker(path);
    return;
  }
  const problem = stat.isDirectory() ? folderProblem(path) : notAFolder(stat);
  if (problem) {
    const link = lstatSync(path).isSymbolicLink() ? ` (a symbolic link to ${readlinkSync(path)})` : '';
    throw notOursError(command, `${shown}${link}`, problem, `move ${shown} away, or remove it yourself if it is yours to remove`);
  }
  if (markerProblem(path)) writeSiteMarker(path);
}

/**
 * Removes the folder `dir` and everything in it, links unfollowed (a link is removed, never what
 * it points to), by the types its listing gives: Node's rmSync asks lstat of every entry and
 * tries rmdir on each file first, which made removing the previous build's site (some 30 files a
 * document) a tenth of a cached build. `last`, a name in `dir`, goes after everything else: the
 * site marker, so that a folder whose removal is cut short (the process killed) still carries it
 * and is removed by the next build instead of being kept as someone else's. Anything unexpected
 * on the way (an entry gone or added meanwhile) is left to rmSync, which finishes the removal.
 */
function removeTree(dir: string, last?: string): void {
  try {
    for (const entry of readdirSync(dir, { withFileTypes: true })) {
      if (entry.name === last) continue;
      const path = join(dir, entry.name);
      if (entry.isDirectory()) removeTree(path);
      else unlinkSync(path);
    }
    if (last !== undefined) unlinkSync(join(dir, last));
    rmdirSync(dir);
  } catch {
    rmSync(dir, { recursive: true, force: true });
  }
}

/**
 * Removes a folder cellbasis made: one carrying the marker whole, an empty one with rmdir (which
 * fails rather than lose a file added meanwhile). Returns false, removing nothing, for anything
 * else (a symbolic link included: the caller unlinks a link of its own).
 */
export function removeOwnFolder(path: string): boolean {
  const stat = lstatSync(path, { throwIfNoEntry: false });
  if (!stat?.isDirectory()) return false;
  if (readdirSync(path).length === 0) {
    rmdirSync(path);
    return true;
  }
  if (markerProblem(path)) return false;
  removeTree(path, SITE_MARKER);
  return true;
}
