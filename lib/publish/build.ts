/**
 * `cellbasis build`: the whole site, written atomically, into a fresh folder beside the target:
 * each draft's page as its project is loaded and checked, then, by Eleventy, the index and the
 * rest; a project with any error stops the pages and fails the build, the fresh folder removed.
 * Only when every page and file is written does the target switch to it, in one rename. A failed
 * build leaves the previous site exactly as it was.
 *
 *   buildSite({ root, out }): Promise<BuildReport>
 *     root  the folder holding projects/ (the command's working folder)
 *     out   the site folder (default root/site)
 *
 * The site folder `out` is a symbolic link to the folder of the last complete build, a sibling
 * named `<out>.<pid>-<random>.build`. A directory cannot be replaced by rename(2) while it holds
 * files, so replacing the folder itself would leave a moment without any site; a link can:
 *   temp-created  `<out>.<pid>-<random>.build.tmp` made, rendered into and printed into;
 *   completed     renamed to `<out>.<pid>-<random>.build` once every page and PDF is written;
 *   linked        a link `<out>.<pid>-<random>.link.tmp` to it made beside `out`;
 *   swapped       the link renamed onto `out`: one rename(2), which replaces the old link
 *                 atomically, so `out` always shows the complete old site or the complete new one.
 * The folder the old link showed is then removed. Only where `out` is a real folder (made by
 * `serve`, `npx @11ty/eleventy` or by hand) is it first renamed aside, to
 * `<out>.<pid>-<random>.old.tmp` (step moved-aside), so between those two renames `out` is
 * missing; a build that finds `out` missing and such a folder of a process that no longer runs
 * renames it back first. Every build removes the folders and links of this naming that builds
 * killed before their end left behind (those of processes no longer running), never the one
 * `out` shows; a complete build then removes the cache entries no project uses any more
 * (lib/publish/cache-unused.ts).
 *
 * Nothing cellbasis did not make is replaced, renamed or removed (lib/publish/site-marker.ts):
 * each build folder carries the site marker from the moment it is made, `out` must be missing,
 * an empty folder, a folder carrying the marker or a link to a build folder beside it (checked
 * before anything is written and again just before the swap), or the build is refused (exit 1)
 * with `out` as it was; a leftover of this naming that is not ours (a folder without the marker,
 * a `.link.tmp` that is no link to its build folder) is left in place and named.
 *
 * For tests of interruption, `pauseAt` names a step (BUILD_STEPS) at which the build stops and
 * waits until it is killed; the CLI takes it from CELLBASIS_BUILD_PAUSE.
 */
import { takeTableFileError } from './table-files.ts';
import { existsSync, lstatSync, mkdirSync, readdirSync, readlinkSync, realpathSync, renameSync, rmSync, symlinkSync, unlinkSync, writeFileSync } from 'node:fs';
import { randomBytes } from 'node:crypto';
import { basename, dirname, join, relative, resolve } from 'node:path';
import { listProjects } from '../basis/projects.ts';
import { fileErrorIn, fileErrorReason } from '../core/file-errors.ts';
import { realLocation, issuedFolderAt, within } from '../archive/layout.ts';
import { processAlive } from '../archive/issued-folder.ts';
import { collectGarbage } from '../batch/collect-garbage.ts';
import { getHeapStatistics } from 'node:v8';
import { calculateIntoCache, type CalculationOutcome, type DeferredJob } from '../batch/batch.ts';
import { ResultsCache } from '../batch/results-cache.ts';
import { basisFileJob } from '../batch/basis-file-job.ts';
import { ChromiumMissingError, chromiumMissingMessage, findChromium } from './chromium.ts';
import { printDrafts } from './draft-pdfs.ts';
import { removeCacheLeftovers } from './cache-leftovers.ts';
import { removeUnusedCacheEntries, type UsedKeys } from './cache-unused.ts';
import { keptPages, type KeptPages } from './kept-pages.ts';
import { UserError, EXIT_INTERNAL, EXIT_VALIDATION } from '../core/errors.ts';
import { setBuildContext } from './build-context.ts';
import { notOursError, removeOwnFolder, siteFolderProblem, SYMBOLIC_LINK, writeSiteMarker } from './site-marker.ts';
import { createEleventy } from './eleventy-api.ts';
import { ELEVENTY_CONFIG, TEMPLATES_DIR } from './paths.ts';
import { loadSiteModel, type PageEntry, type SiteModel, type SiteOptions } from './site-model.ts';
import { writeTableFiles } from './table-files.ts';
import { renderViewBytes } from './render.ts';

/**
 * Document pages the build writes between two full garbage collections (bench/site.ts hands
 * Eleventy as many finished pages a run). A full collection (collectGarbage,
 * lib/batch/collect-garbage.ts) follows every PAGES_PER_RUN pages and Eleventy's run. V8 sets the
 * heap it lets grow before its next full collection from the live size at its last one, and when
 * Eleventy rendered the pages, 25 a run, the live size in the middle of a run was large: left
 * alone, the heap of a build of 300 documents rose run by run to about 940 MiB though at most one
 * run's pages were alive at a time (capping the heap at 450 MiB changed nothing but the memory).
 * Collecting with none of them alive keeps the heap at that size whatever the number of
 * documents. (Pages are now written one at a time; a build of 100 without these collections
 * peaked at 408-452 MiB against 313-419 MiB with them, at the same processor time.)
 */
export const PAGES_PER_RUN = 25;

/**
 * Pages kept from the site replaced (lib/publish/kept-pages.ts) leave little garbage (their
 * project's results read, a few strings), and a full collection of the build's heap (some 86 MB
 * alive) took 125-175 ms (5 December 2026, `--trace-gc`, load average about 6): one every
 * PAGES_PER_RUN kept pages cost about 6 ms a page, as much as the rest of keeping it. Between
 * rendered pages the build collects when the heap in use has grown this much since its last
 * full collection, as V8 would have let it grow anyway.
 */
const KEPT_PAGES_HEAP_SLACK_BYTES = 64 * 1024 * 1024;

/** The steps of a build, in order, where `pauseAt` may stop it (moved-aside only where `out` is a real folder). */
export const BUILD_STEPS = ['temp-created', 'rendered', 'printed', 'completed', 'linked', 'moved-aside', 'swapped'] as const;
export type BuildStep = (typeof BUILD_STEPS)[number];

export interface BuildReport {
  out: string;
  /** Pages written: the drafts' documents and the issued revisions' register pages. */
  documents: number;
  /** Draft PDFs written (issued revisions carry their own). */
  pdfs: number;
  warnings: string[];
  /** Leftovers of builds killed before their end: the folders and links removed, and the site put back as `out`. */
  leftovers: Leftovers;
  /** Cache entries no project uses any more, removed after the build (lib/publish/cache-unused.ts): how many, and their size. */
  unusedCache: { entries: number; bytes: number };
  /** Draft pages whose files were kept from the site replaced, unchanged, instead of rendered (lib/publish/kept-pages.ts). */
  keptPages: number;
}

export interface Leftovers {
  /** Names of the siblings of `out` removed. */
  removed: string[];
  /** Name of the moved-aside site renamed back to `out`, or null. */
  restored: string | null;
  /** Names of siblings of `out` named as leftovers but not made by cellbasis, left in place. */
  kept: string[];
  /** Temporary cache files of killed builds removed, relative to the root (lib/publish/cache-leftovers.ts). */
  cache: string[];
}

/** The names beside `out` of one build: `<out>.<pid>-<random>.<kind>`. */
function buildNames(out: string): Record<'fresh' | 'complete' | 'link' | 'aside', string> {
  const stem = join(dirname(out), `${basename(out)}.${process.pid}-${randomBytes(4).toString('hex')}`);
  return { fresh: `${stem}.build.tmp`, complete: `${stem}.build`, link: `${stem}.link.tmp`, aside: `${stem}.old.tmp` };
}

/** `<out>.<pid>-<random>.<kind>`: the names of what builds make beside `out`. */
function siblingPattern(out: string): RegExp {
  return new RegExp(`^${basename(out).replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}\\.(\\d+)-[0-9a-f]{8}\\.(build|build\\.tmp|link\\.tmp|old\\.tmp)$`);
}

interface Sibling {
  name: string;
  pid: number;
  kind: string;
}

/** Siblings of `out` named as a build names what it makes: name, the process that made it, and its kind. */
function buildSiblings(out: string): Sibling[] {
  const pattern = siblingPattern(out);
  return readdirSync(dirname(out)).flatMap((name) => {
    const match = pattern.exec(name);
    return match ? [{ name, pid: Number(match[1]), kind: match[2]! }] : [];
  });
}

/** Removes a leftover that a build made (a marked or empty folder; a `.link.tmp` link to its `.build` folder); false, touching nothing, for anything else. */
function removeLeftover(out: string, sibling: Sibling): boolean {
  const path = join(dirname(out), sibling.name);
  if (sibling.kind !== 'link.tmp') return removeOwnFolder(path);
  if (!lstatSync(path, { throwIfNoEntry: false })?.isSymbolicLink() || readlinkSync(path) !== sibling.name.replace(/\.link\.tmp$/, '.build')) return false;
  unlinkSync(path);
  return true;
}

/** Where `path` is, as messages show it: relative to the working folder when inside it. */
function shownPath(root: string, path: string): string {
  const rel = relative(root, path);
  return rel === '' ? '.' : rel.startsWith('..') ? path : rel;
}

/** Why the build may not replace `out` (siteFolderProblem's words), or null. */
function replaceProblem(out: string): string | null {
  const problem = siteFolderProblem(out);
  if (problem !== SYMBOLIC_LINK) return problem;
  const target = readlinkSync(out);
  if (siblingPattern(out).exec(target)?.[2] !== 'build') return `a symbolic link to ${target}, not to a site cellbasis built beside it`;
  const linked = siteFolderProblem(join(dirname(out), target));
  return linked && `a symbolic link to ${target}, which is ${linked}`;
}

/**
 * Refuses (exit 1, nothing changed) an `out` the build would replace but did not make: anything
 * but nothing, an empty folder, a folder carrying the site marker, or a link to a build folder
 * beside it (the link a build makes), which must itself be missing, empty or marked.
 */
function checkReplaceable(root: string, out: string): void {
  const problem = replaceProblem(out);
  if (problem) {
    const shown = shownPath(root, out);
    throw notOursError('build', shown, problem, `choose another folder with --out, or move ${shown} away (remove it yourself if it is yours to remove)`);
  }
}

/** The sibling `out` links to, or null (no link, or a link of someone else's). */
function linkedName(out: string): string | null {
  try {
    const target = readlinkSync(out);
    return target === basename(target) ? target : null;
  } catch {
    return null;
  }
}

/**
 * Removes the siblings of `out` left by builds that no longer run (and by earlier builds of this
 * process), never the folder `out` links to; first, where `out` is missing, puts back the site a
 * killed build had moved aside.
 */
function removeLeftovers(out: string): Omit<Leftovers, 'cache'> {
  const stale = buildSiblings(out).filter((s) => s.pid === process.pid || !processAlive(s.pid));
  const aside = lstatSync(out, { throwIfNoEntry: false }) ? undefined : stale.find((s) => s.kind === 'old.tmp' && siteFolderProblem(join(dirname(out), s.name)) === null);
  if (aside) renameSync(join(dirname(out), aside.name), out);
  // The link is read after each process was found gone: one that no longer runs cannot point `out` at its folder any more.
  const linked = linkedName(out);
  const removed: string[] = [];
  const kept: string[] = [];
  for (const s of stale) if (s !== aside && s.name !== linked) (removeLeftover(out, s) ? removed : kept).push(s.name);
  return { removed, kept, restored: aside?.name ?? null };
}

async function pause(options: BuildOptions, step: BuildStep): Promise<void> {
  if (options.pauseAt !== step) return;
  options.onPause?.(step);
  await new Promise(() => setInterval(() => undefined, 1 << 30));
}

/** The first UserError in an error's cause chain (Eleventy wraps what the data and templates throw). */
function userErrorIn(error: unknown): UserError | null {
  let e: unknown = error;
  for (let depth = 0; e && depth < 10; depth++) {
    if (e instanceof UserError) return e;
    const next = (e as { originalError?: unknown; cause?: unknown }).originalError ?? (e as { cause?: unknown }).cause;
    e = next;
  }
  return null;
}

let lateCopiesWatched = false;

/**
 * Eleventy copies the assets (passthrough copy) beside rendering the pages, and when a page
 * cannot be written its run ends at once while a copy still fails a moment later, as a promise
 * no one awaits: Node would end the process with a stack trace after the build had already said
 * what went wrong and removed its folder. Such late file errors of a copy are let go; any other
 * unhandled rejection still ends the process as before.
 */
function ignoreLateCopyErrors(): void {
  if (lateCopiesWatched) return;
  lateCopiesWatched = true;
  process.on('unhandledRejection', (reason) => {
    if (fileErrorIn(reason) && /Passthrough/.test((reason as Error)?.name ?? (reason as Error)?.constructor?.name ?? '')) return;
    throw reason;
  });
}

/**
 * Waits until no file-system request of this process has been in flight for three looks in a
 * row, 10 ms apart (at most some 10 s). A run of Eleventy that fails on one file ends at once
 * while its other writes and copies go on: each creates its folders as it goes, so one finishing
 * after the failed build has removed its folder would make that folder again (a full disk left
 * `<out>.<pid>-<random>.build.tmp` behind on a loaded machine). The build removes its folder only
 * once they are done.
 */
async function fileWorkSettled(): Promise<void> {
  const busy = () => process.getActiveResourcesInfo().some((kind) => kind.startsWith('FSReq'));
  for (let quiet = 0, looks = 0; quiet < 3 && looks < 1000; looks++) {
    await new Promise((done) => setTimeout(done, 10));
    quiet = busy() ? 0 : quiet + 1;
  }
}

async function runEleventy(output: string): Promise<void> {
  const eleventy = createEleventy(TEMPLATES_DIR, output, { configPath: ELEVENTY_CONFIG, quietMode: true });
  eleventy.disableLogger();
  ignoreLateCopyErrors();
  try {
    await eleventy.write();
  } catch (error) {
    const user = userErrorIn(error);
    if (user) throw user;
    // A full disk, a read-only folder: said by buildSite, with the folder it concerns.
    if (fileErrorIn(error)) throw error;
    const tableError = takeTableFileError();
    if (tableError) throw tableError;
    throw new UserError(`the site could not be rendered: ${(error as Error).message}`, EXIT_INTERNAL);
  }
}

export interface BuildOptions extends SiteOptions {
  root: string;
  out?: string;
  /** Print each working draft to PDF (default: when Chromium is found). */
  pdf?: boolean;
  /** Render every draft's page, keeping none from the site replaced even where its inputs are unchanged (lib/publish/kept-pages.ts); the pages are still recorded for the next build. */
  renderAll?: boolean;
  /** Progress of the build's long steps: calculation and printing. */
  onProgress?: (step: 'calculate' | 'render' | 'print', done: number, total: number) => void;
  /** Stop at this step and wait to be killed (tests). */
  pauseAt?: string;
  onPause?: (step: BuildStep) => void;
}

/**
 * Refuses an output folder whose replacement would take projects or issued revisions with it:
 * as written, and where it really is (a link on the way, such as `--out link-to-issued/A`, must
 * not lead the build into projects/ or an issued folder, wherever that folder is).
 */
function checkOutput(root: string, out: string): void {
  const projects = join(root, 'projects');
  const real = realLocation(out);
  const sides: [string, string, string][] = [
    [root, projects, out],
    [realpathSync(root), existsSync(projects) ? realpathSync(projects) : projects, real],
  ];
  for (const [base, folder, target] of sides) {
    if (within(target, base) || within(target, folder) || within(folder, target)) {
      throw new UserError(`build: --out ${relative(root, out) || '.'} would replace the working folder or write inside projects/; choose a folder of its own, such as site/`);
    }
  }
  const issued = issuedFolderAt(root, out);
  if (issued) throw new UserError(`build: --out would replace the issued revisions in ${relative(root, issued)}; only cellbasis issue writes there`);
}

/**
 * Writes each working draft's page and its tables' CSV files into `fresh` as the site model loads
 * its project (SiteOptions.onDraftPage), with the basis and results the load holds: a page made
 * from the model afterwards read, parsed and validated its basis and read its results again. A
 * draft whose inputs are those of a page the site being replaced holds unchanged has its files
 * linked from there (`kept`, unless options.renderAll); every other page is written as bytes
 * (renderViewBytes), recorded for the next build, and its view let go. A full collection follows
 * every PAGES_PER_RUN pages rendered (see there). Returns the function the model calls and a count.
 */
function draftPageWriter(fresh: string, expected: number, options: BuildOptions, kept: KeptPages): { write: (page: PageEntry) => void; written: () => number } {
  let written = 0;
  const render = (page: PageEntry) => {
    const view = page.view();
    const files = writeTableFiles(fresh, view, true);
    const file = join(fresh, ...page.pagePath.split('/'));
    mkdirSync(dirname(file), { recursive: true });
    renderViewBytes(view, (bytes) => writeFileSync(file, bytes));
    if (page.keepKey) kept.record(page.keepKey, [file, ...files]);
  };
  let renderedSinceCollection = 0;
  let heapAfterCollection = getHeapStatistics().used_heap_size;
  const write = (page: PageEntry) => {
    written++;
    options.onProgress?.('render', Math.min(written, expected), expected);
    try {
      if (options.renderAll || !page.keepKey || !kept.link(page.keepKey, page.pagePath)) {
        render(page);
        renderedSinceCollection++;
      }
    } catch (error) {
      if (error instanceof UserError || fileErrorIn(error)) throw error;
      throw new UserError(`the site could not be rendered: ${(error as Error).message}`, EXIT_INTERNAL);
    }
    if (renderedSinceCollection < PAGES_PER_RUN && getHeapStatistics().used_heap_size - heapAfterCollection < KEPT_PAGES_HEAP_SLACK_BYTES) return;
    collectGarbage();
    renderedSinceCollection = 0;
    heapAfterCollection = getHeapStatistics().used_heap_size;
  };
  return { write, written: () => written };
}

/**
 * Renders with Eleventy what the drafts' pages leave (the portfolio index, the issued revisions'
 * register pages, the files copied as issued and the assets), in one run; every page must then be
 * on disk.
 */
async function renderRest(root: string, fresh: string, model: SiteModel): Promise<void> {
  setBuildContext({ root, output: fresh, mode: 'build', unseen: true, model: { ...model, pages: [], writesIndex: true } });
  await runEleventy(fresh);
  collectGarbage();
  for (const page of [...model.pages.map((p) => p.pagePath), ...model.revisionPages.map((p) => p.pagePath), ...model.copies.map((c) => c.to), 'index.html']) {
    if (!existsSync(join(fresh, page))) throw new UserError(`the build did not write ${page}`, EXIT_INTERNAL);
  }
}

/**
 * Moves the complete build into place at `out`: renamed complete, linked, and the link renamed
 * over `out` (a folder already there moved aside first), each step a pause point of the tests.
 */
async function swapIntoPlace(root: string, out: string, names: ReturnType<typeof buildNames>, options: BuildOptions): Promise<void> {
  renameSync(names.fresh, names.complete);
  await pause(options, 'completed');
  symlinkSync(basename(names.complete), names.link, 'dir');
  await pause(options, 'linked');
  // What stands at `out` may have changed while the build ran.
  checkReplaceable(root, out);
  const existing = lstatSync(out, { throwIfNoEntry: false });
  if (existing && !existing.isSymbolicLink()) {
    renameSync(out, names.aside);
    await pause(options, 'moved-aside');
  }
  renameSync(names.link, out);
}

/** The job, the key of the bytes it is calculated from added to the build's keys (another than the listed one where the file changed meanwhile). */
function usingKey(job: DeferredJob, keys: Set<string>): DeferredJob {
  const load = job.load;
  return {
    ...job,
    load: () => {
      const loaded = load();
      if (loaded) keys.add(loaded.key);
      return loaded;
    },
  };
}

/**
 * Every project's results calculated (in worker threads when there are many) into the results
 * cache, where the pages read them as they are rendered; the failures, by project id. A basis
 * whose results the cache holds (the key covers its bytes) is not loaded here: the site model
 * loads and checks every basis anyway, and loading each twice cost a build of 2 000 cached
 * projects some 2 000 needless parses. The others are loaded one at a time as the calculation
 * takes them (`DeferredJob`, lib/batch/basis-file-job.ts: read to be keyed, and read again at
 * their turn): holding all of them validated at once was 88 MiB of heap at 2 000 projects, and V8
 * let the heap grow to some 2.5 times that; holding their bytes kept 12 MiB more through the
 * calculation (lib/batch/basis-file-job.ts gives the figures). A worker that ran out of heap, its
 * work done in this thread instead, is told in `notices` (a warning of the build's report).
 */
async function precompute(root: string, options: BuildOptions, notices: string[], keys: Set<string>): Promise<Map<string, CalculationOutcome>> {
  const cache = new ResultsCache(root);
  const jobs: DeferredJob[] = [];
  let cached = 0;
  for (const id of listProjects(root)) {
    let job: DeferredJob;
    try {
      job = basisFileJob(root, id);
    } catch (error) {
      // Named again, with every other problem, when the site model is loaded.
      if (error instanceof UserError) continue;
      throw error;
    }
    keys.add(job.key);
    if (cache.has(job.key)) cached++;
    else jobs.push(usingKey(job, keys));
  }
  const total = cached + jobs.length;
  if (cached) options.onProgress?.('calculate', cached, total);
  const failures = await calculateIntoCache(jobs, cache, { onProgress: (done) => options.onProgress?.('calculate', cached + done, total), onNotice: (line) => notices.push(`warning: ${line}`) });
  return new Map(jobs.flatMap((j, i) => (failures[i] ? [[j.id, failures[i]!] as const] : [])));
}

export async function buildSite(options: BuildOptions): Promise<BuildReport> {
  const startedMs = Date.now();
  const root = resolve(options.root);
  const out = resolve(options.out ?? join(root, 'site'));
  checkOutput(root, out);
  checkReplaceable(root, out);
  const leftovers = { ...(existsSync(dirname(out)) ? removeLeftovers(out) : { removed: [], kept: [], restored: null }), cache: removeCacheLeftovers(root) };
  const chromium = findChromium();
  const printing = options.pdf ?? chromium !== null;
  if (printing && chromium === null) throw new ChromiumMissingError();
  const notices: string[] = [];
  // The keys of the results and checked bases of every project as read here, and of the PDFs printed or copied.
  const keys = new Set<string>();
  const results = options.results ?? (await precompute(root, options, notices, keys));
  let pdfKeys: Set<string> | undefined;
  // What the calculation left goes before the projects are read again for the model and the pages.
  collectGarbage();
  mkdirSync(dirname(out), { recursive: true });
  const names = buildNames(out);
  const fresh = names.fresh;
  mkdirSync(fresh);
  const kept = keptPages(root, out, fresh); // unchanged drafts' files, linked from the site at `out` as it stands (draftPageWriter)
  let model: SiteModel;
  try {
    writeSiteMarker(fresh);
    await pause(options, 'temp-created');
    // Each draft's page is written as its project loads; a project with an error stops the pages, and the load then throws with every problem.
    const pages = draftPageWriter(fresh, listProjects(root).length, options, kept);
    model = loadSiteModel(root, { ...options, results, draftPdfs: printing, onDraftPage: pages.write });
    if (pages.written() < model.pages.length || model.pages.length === 0) options.onProgress?.('render', model.pages.length, model.pages.length);
    // What calculating and reading the projects left behind goes before the rest is rendered.
    collectGarbage();
    await renderRest(root, fresh, model);
    await pause(options, 'rendered');
    if (printing) pdfKeys = await printDrafts(root, fresh, model.drafts, (done, total) => options.onProgress?.('print', done, total));
    await pause(options, 'printed');
    await swapIntoPlace(root, out, names, options);
  } catch (error) {
    await fileWorkSettled();
    // Its own folders go marker last (a kill meanwhile leaves a marked folder the next build removes); the rest, or what is not as expected, by rmSync.
    for (const path of [fresh, names.complete]) if (!removeOwnFolder(path)) rmSync(path, { recursive: true, force: true });
    rmSync(names.link, { recursive: true, force: true });
    if (existsSync(names.aside) && !lstatSync(out, { throwIfNoEntry: false })) renameSync(names.aside, out);
    const problem = error instanceof UserError ? null : fileErrorIn(error);
    if (problem) {
      const shown = shownPath(root, out);
      throw new UserError(`${shown}: the site could not be written: ${fileErrorReason(problem.code)}; ${shown} was left as it was`, EXIT_VALIDATION);
    }
    throw error;
  } finally {
    setBuildContext(null);
  }
  await pause(options, 'swapped');
  removeLeftovers(out);
  // Given its results (options.results), the build did not read every basis: it removes nothing then.
  const used: UsedKeys = options.results ? {} : { results: keys, bases: keys, ...(pdfKeys ? { pdf: pdfKeys } : {}), pages: kept.used };
  const unusedCache = removeUnusedCacheEntries(root, used, startedMs);
  const warnings = printing ? [...notices, ...model.warnings] : [...notices, ...model.warnings, `no PDFs were printed: ${options.pdf === false ? 'HTML only was asked for' : chromiumMissingMessage()}`];
  return { out, documents: model.pages.length + model.revisionPages.length, pdfs: printing ? model.drafts.length : 0, warnings, leftovers, unusedCache, keptPages: kept.linked() };
}
