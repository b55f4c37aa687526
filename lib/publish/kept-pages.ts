/**
 * Draft pages kept from the site a build replaces. A draft's page and its tables' CSV files are
 * a function of what goes into them and nothing else (pages are reproducible: no clock, no
 * random name): the basis bytes, project id and file (through the results key, which also
 * covers the calculation library), the draft's revision context and history, the page's path,
 * and the code that renders (lib/ through the library fingerprint, every file under templates/,
 * the installed version of each package package.json names and of Nunjucks, package-lock.json,
 * and the Node.js, V8, ICU and Unicode versions). `draftPageKey` hashes all of them.
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
 *   keptPages(root, out, fresh)            { link(key, pagePath): boolean, record(key, files), used, linked() }
 *     link     the files of `key` (the page at pagePath and its CSV files) linked from the site at `out` into `fresh`; false when not all could be
 *     record   the files just written into `fresh` (absolute paths) recorded under `key`
 */
import { createHash } from 'node:crypto';
import { existsSync, linkSync, lstatSync, mkdirSync, readdirSync, readFileSync, statSync, unlinkSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join, posix, relative, sep } from 'node:path';
import { fileURLToPath } from 'node:url';
import { CACHE_DIR, readJsonEntry, writeCacheEntry } from '../batch/results-cache.ts';
import { libraryFingerprint } from '../batch/fingerprint.ts';
import { isFileError } from '../core/file-errors.ts';
import { tableFolder } from '../report/table-links.ts';

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

/**
 * The installed version of a package, found from where `resolve` (Node's resolution from a
 * module) takes its entry: up to the package.json that names it; "unresolved" for a package with
 * no entry to resolve (types only).
 */
function installedVersion(name: string, resolve: (name: string) => string): string {
  try {
    let dir = dirname(resolve(name));
    while (dir !== dirname(dir)) {
      const manifest = join(dir, 'package.json');
      if (existsSync(manifest)) {
        const { name: named, version } = JSON.parse(readFileSync(manifest, 'utf8')) as { name?: string; version?: string };
        if (named === name) return `${name}@${version}`;
      }
      dir = dirname(dir);
    }
  } catch {
    // no entry point: said below
  }
  return `${name}@unresolved`;
}

/**
 * The packages a page may depend on: each package of package.json as this module resolves it,
 * Nunjucks as Eleventy resolves it (nunjucks-env.ts takes Eleventy's copy, which package.json
 * does not name), and package-lock.json whole (every other package's locked version).
 */
function packageVersions(): string {
  const manifest = JSON.parse(readFileSync(join(REPO, 'package.json'), 'utf8')) as { dependencies?: Record<string, string>; devDependencies?: Record<string, string> };
  const here = createRequire(import.meta.url);
  const fromEleventy = createRequire(here.resolve('@11ty/eleventy'));
  const names = Object.keys({ ...manifest.dependencies, ...manifest.devDependencies }).sort();
  const lock = existsSync(join(REPO, 'package-lock.json')) ? createHash('sha256').update(readFileSync(join(REPO, 'package-lock.json'))).digest('hex') : 'no lock';
  return [...names.map((name) => installedVersion(name, (n) => fileURLToPath(import.meta.resolve(n)))), installedVersion('nunjucks', (n) => fromEleventy.resolve(n)), `package-lock.json ${lock}`].join('\n');
}

/** The runtime whose number formatting, regular expressions (Unicode data) and collation a page goes through. */
function runtimeVersions(): string {
  const v = process.versions;
  return `node ${v.node} v8 ${v.v8} icu ${v.icu ?? '-'} unicode ${v.unicode ?? '-'}`;
}

/**
 * SHA-256 over the library fingerprint, the runtime, the packages (packageVersions) and every
 * file under templates/ (path and bytes); once a process (a build is one process: a process that
 * changed its templates between two builds would keep pages of the old ones).
 */
function renderingCodeFingerprint(): string {
  if (codeFingerprint) return codeFingerprint;
  const hash = createHash('sha256').update(`${libraryFingerprint()}\n${runtimeVersions()}\n${packageVersions()}\n`);
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

/**
 * The record of `key`, if it verifies and names only the page itself and CSV files of its own
 * tables folder (`projects/<id>/index.html`, `projects/<id>/tables/<name>.csv`): a record naming
 * anything else (the index, an asset, a register page, which the build writes itself) is not
 * used, so that nothing the build writes can be a link into the site it replaces.
 */
function readRecord(root: string, key: string, pagePath: string): PageRecord | undefined {
  const value = readJsonEntry(recordPath(root, key)) as PageRecord | undefined;
  if (!value || value.format !== RECORD_FORMAT || !Array.isArray(value.files) || value.files.length === 0) return undefined;
  const tables = tableFolder(pagePath);
  const own = (path: string) => path === pagePath || (path.startsWith(tables) && path.endsWith('.csv') && !path.slice(tables.length).includes('/') && posix.normalize(path) === path);
  const fine = value.files.every((f) => typeof f.path === 'string' && own(f.path) && [f.size, f.mtimeMs, f.ino].every(Number.isFinite));
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
  link(key: string, pagePath: string): boolean;
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
  const link = (key: string, pagePath: string): boolean => {
    const record = readRecord(root, key, pagePath);
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
        // The file linked is the one checked: another process (serve) may have replaced it between the check and the link.
        if (!asRecorded(to, file)) throw Object.assign(new Error('replaced while linked'), { code: 'ESTALE' });
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
