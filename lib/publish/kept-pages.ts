/**
 * Draft pages kept from the site a build replaces. A draft's page and its tables' CSV files are
 * a function of what goes into them and nothing else (pages are reproducible: no clock, no
 * random name): the basis bytes, project id and file (through the results key, which also
 * covers the calculation library), the draft's revision context and history, the page's path,
 * and the code that renders (lib/ through the library fingerprint, every file under templates/,
 * and the installed version of each package the project depends on). `draftPageKey` hashes all
 * of them.
 *
 * When a build has written a draft's files it records them under that key in the cache
 * (`.cellbasis-cache/pages/<key>.json`): each file's path in the site, size, modification time
 * and inode, as written. A later build that finds the same key, and in the site it is about to
 * replace every file of the record still as recorded (a regular file, not a link, with that size,
 * time and inode), makes hard links to those files in its new folder instead of rendering the
 * page again: the same bytes, since the same inputs made them. Anything else (no record, a record
 * that does not verify, a file changed, moved or missing, a file system without hard links) and
 * the page is rendered as always; links half made are removed first, so that the render never
 * writes into a file the old site still holds. A linked file is never written: the build's other
 * writers (Eleventy's run for the index, the register pages and the assets) write other paths.
 *
 *   draftPageKey(inputs): string          the key of a draft page's inputs
 *   keptPages(root, out, fresh)            { link(key): boolean, record(key, files) }
 *     link     the files of `key` linked from the site at `out` into `fresh`; false when not all could be
 *     record   the files just written into `fresh` (absolute paths) recorded under `key`
 */
import { createHash } from 'node:crypto';
import { linkSync, lstatSync, mkdirSync, readdirSync, readFileSync, statSync, unlinkSync } from 'node:fs';
import { dirname, join, relative, sep } from 'node:path';
import { fileURLToPath } from 'node:url';
import { CACHE_DIR, readJsonEntry, writeCacheEntry } from '../batch/results-cache.ts';
import { libraryFingerprint } from '../batch/fingerprint.ts';
import { isFileError } from '../core/file-errors.ts';

const REPO = fileURLToPath(new URL('../..', import.meta.url));
const TEMPLATES = join(REPO, 'templates');

/** The format of a record; a record of another format is not used. */
const RECORD_FORMAT = 1;

interface KeptFile {
  /** Relative to the site folder, with forward slashes. */
  path: string;
  size: number;
  mtimeMs: number;
  ino: number;
}

interface PageRecord {
  format: number;
  files: KeptFile[];
}

let codeFingerprint: string | undefined;

function filesUnder(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const path = join(dir, entry.name);
    return entry.isDirectory() ? filesUnder(path) : [path];
  });
}

/** The installed version of each package package.json names (dependencies and devDependencies), or "missing". */
function packageVersions(): string {
  const manifest = JSON.parse(readFileSync(join(REPO, 'package.json'), 'utf8')) as { dependencies?: Record<string, string>; devDependencies?: Record<string, string> };
  const names = Object.keys({ ...manifest.dependencies, ...manifest.devDependencies }).sort();
  return names
    .map((name) => {
      try {
        return `${name}@${(JSON.parse(readFileSync(join(REPO, 'node_modules', name, 'package.json'), 'utf8')) as { version: string }).version}`;
      } catch {
        return `${name}@missing`;
      }
    })
    .join('\n');
}

/** SHA-256 over the library fingerprint, every file under templates/ (path and bytes) and the installed packages' versions; once a process. */
function renderingCodeFingerprint(): string {
  if (codeFingerprint) return codeFingerprint;
  const hash = createHash('sha256').update(`${libraryFingerprint()}\n${packageVersions()}\n`);
  for (const path of filesUnder(TEMPLATES).sort()) {
    hash.update(`${relative(TEMPLATES, path)}\n`);
    hash.update(readFileSync(path));
  }
  codeFingerprint = hash.digest('hex');
  return codeFingerprint;
}

/** What a draft's page is made from, beside its basis and results (which its results key stands for). */
export interface DraftPageInputs {
  resultsKey: string;
  pagePath: string;
  /** The draft's revision context and history, plain data (JSON.stringify gives them whole). */
  revision: unknown;
  history: unknown;
}

export function draftPageKey(inputs: DraftPageInputs): string {
  return createHash('sha256')
    .update(`cellbasis draft page ${RECORD_FORMAT}\n${renderingCodeFingerprint()}\n`)
    .update(JSON.stringify([inputs.resultsKey, inputs.pagePath, inputs.revision, inputs.history]))
    .digest('hex');
}

function recordPath(root: string, key: string): string {
  return join(root, CACHE_DIR, 'pages', `${key}.json`);
}

function readRecord(root: string, key: string): PageRecord | undefined {
  const value = readJsonEntry(recordPath(root, key)) as PageRecord | undefined;
  if (!value || value.format !== RECORD_FORMAT || !Array.isArray(value.files) || value.files.length === 0) return undefined;
  const fine = value.files.every((f) => typeof f.path === 'string' && !f.path.split('/').includes('..') && !f.path.startsWith('/') && [f.size, f.mtimeMs, f.ino].every(Number.isFinite));
  return fine ? value : undefined;
}

/** An error of the file system (ENOENT, ENOTDIR, EXDEV, EPERM...): a page not kept, not a failed build. */
function systemError(error: unknown): boolean {
  return error instanceof Error && typeof (error as NodeJS.ErrnoException).code === 'string';
}

/** Whether the file at `path` (not followed) is the one recorded. */
function asRecorded(path: string, file: KeptFile): boolean {
  try {
    const stat = lstatSync(path, { throwIfNoEntry: false });
    return stat !== undefined && stat.isFile() && stat.size === file.size && stat.mtimeMs === file.mtimeMs && stat.ino === file.ino;
  } catch (error) {
    if (systemError(error)) return false;
    throw error;
  }
}

export interface KeptPages {
  link(key: string): boolean;
  record(key: string, files: readonly string[]): void;
  /** The keys linked or recorded in this build (the cache entries it used). */
  readonly used: ReadonlySet<string>;
  /** How many pages were linked. */
  linked(): number;
}

export function keptPages(root: string, out: string, fresh: string): KeptPages {
  const used = new Set<string>();
  let linked = 0;
  const inSite = (site: string, file: KeptFile) => join(site, ...file.path.split('/'));
  const link = (key: string): boolean => {
    const record = readRecord(root, key);
    if (!record || !record.files.every((file) => asRecorded(inSite(out, file), file))) return false;
    const made: string[] = [];
    const folders = new Set<string>();
    try {
      for (const file of record.files) {
        const to = inSite(fresh, file);
        if (!folders.has(dirname(to))) mkdirSync(dirname(to), { recursive: true });
        folders.add(dirname(to));
        linkSync(inSite(out, file), to);
        made.push(to);
      }
    } catch (error) {
      if (!systemError(error)) throw error;
      for (const path of made) unlinkSync(path);
      return false;
    }
    used.add(key);
    linked++;
    return true;
  };
  const record = (key: string, files: readonly string[]): void => {
    const kept: KeptFile[] = files.map((path) => {
      const stat = statSync(path);
      return { path: relative(fresh, path).split(sep).join('/'), size: stat.size, mtimeMs: stat.mtimeMs, ino: stat.ino };
    });
    try {
      mkdirSync(dirname(recordPath(root, key)), { recursive: true });
      writeCacheEntry(recordPath(root, key), JSON.stringify({ format: RECORD_FORMAT, files: kept } satisfies PageRecord));
    } catch (error) {
      // A cache folder that cannot be written: the page is rendered again next time, nothing else.
      if (!isFileError(error)) throw error;
      return;
    }
    used.add(key);
  };
  return { link, record, used, linked: () => linked };
}
