/**
 * `cellbasis build`: the whole site, written atomically. The projects are loaded and checked
 * first (any error: nothing is written); Eleventy then renders into a fresh folder beside the
 * target, and only when every page and file is written is that folder swapped in for the old
 * site. A failed build leaves the previous site exactly as it was.
 *
 *   buildSite({ root, out }): Promise<BuildReport>
 *     root  the folder holding projects/ (the command's working folder)
 *     out   the site folder (default root/site)
 */
import { existsSync, mkdirSync, readFileSync, renameSync, rmSync } from 'node:fs';
import { randomBytes } from 'node:crypto';
import { basename, dirname, isAbsolute, join, relative, resolve } from 'node:path';
import { listProjects } from '../basis/projects.ts';
import { loadBasisText } from '../basis/load.ts';
import { sealedFolderAt } from '../archive/layout.ts';
import { calculateAll, type CalculationJob, type CalculationOutcome } from '../plant/batch.ts';
import { ResultsCache } from '../plant/results-cache.ts';
import { ChromiumMissingError, chromiumMissingMessage, findChromium } from './pdf.ts';
import { printDrafts } from './draft-pdfs.ts';
import { UserError, EXIT_INTERNAL } from '../errors.ts';
import { setBuildContext } from './build-context.ts';
import { createEleventy } from './eleventy-api.ts';
import { ELEVENTY_CONFIG, TEMPLATES_DIR } from './paths.ts';
import { loadSiteModel, type SiteOptions } from './site-model.ts';

/** Document pages rendered by one Eleventy run (the index is rendered by every run, identically). */
const PAGES_PER_RUN = 100;

export interface BuildReport {
  out: string;
  /** Document pages written (drafts and sealed revisions). */
  documents: number;
  /** Draft PDFs written (sealed revisions carry their own). */
  pdfs: number;
  warnings: string[];
}

/** A sibling folder of `target` named target.<random>.<suffix>.tmp (ignored by git). */
function sibling(target: string, suffix: string): string {
  return join(dirname(target), `${basename(target)}.${process.pid}-${randomBytes(4).toString('hex')}.${suffix}.tmp`);
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

async function runEleventy(output: string): Promise<void> {
  const eleventy = createEleventy(TEMPLATES_DIR, output, { configPath: ELEVENTY_CONFIG, quietMode: true });
  eleventy.disableLogger();
  try {
    await eleventy.write();
  } catch (error) {
    const user = userErrorIn(error);
    if (user) throw user;
    throw new UserError(`the site could not be rendered: ${(error as Error).message}`, EXIT_INTERNAL);
  }
}

export interface BuildOptions extends SiteOptions {
  root: string;
  out?: string;
  /** Print each working draft to PDF (default: when Chromium is found). */
  pdf?: boolean;
  /** Progress of the build's long steps: calculation and printing. */
  onProgress?: (step: 'calculate' | 'render' | 'print', done: number, total: number) => void;
}

/** Refuses an output folder whose replacement would take projects or sealed revisions with it. */
function checkOutput(root: string, out: string): void {
  const projects = join(root, 'projects');
  const within = (outer: string, inner: string) => {
    const rel = relative(outer, inner);
    return rel === '' || (!rel.startsWith('..') && !isAbsolute(rel));
  };
  if (within(out, root) || within(out, projects) || within(projects, out)) {
    throw new UserError(`build: --out ${relative(root, out) || '.'} would replace the working folder or write inside projects/; choose a folder of its own, such as site/`);
  }
  const sealed = sealedFolderAt(root, out);
  if (sealed) throw new UserError(`build: --out would replace the sealed revisions in ${relative(root, sealed)}; only cellbasis seal writes there`);
}

/** Every project's results, from the cache or calculated (in worker threads when there are many). */
async function precompute(root: string, options: BuildOptions): Promise<Map<string, CalculationOutcome>> {
  const jobs: { id: string; job: CalculationJob }[] = [];
  for (const id of listProjects(root)) {
    const file = join(root, 'projects', id, 'basis.yaml');
    const text = readFileSync(file);
    const loaded = loadBasisText(text, `projects/${id}/basis.yaml`, id);
    if (loaded.ok) jobs.push({ id, job: { basis: loaded.basis, text } });
  }
  const outcomes = await calculateAll(
    jobs.map((j) => j.job),
    { cache: new ResultsCache(root), onProgress: (done, total) => options.onProgress?.('calculate', done, total) },
  );
  return new Map(jobs.map((j, i) => [j.id, outcomes[i]!]));
}

export async function buildSite(options: BuildOptions): Promise<BuildReport> {
  const root = resolve(options.root);
  const out = resolve(options.out ?? join(root, 'site'));
  checkOutput(root, out);
  const chromium = findChromium();
  const printing = options.pdf ?? chromium !== null;
  if (printing && chromium === null) throw new ChromiumMissingError();
  const results = options.results ?? (await precompute(root, options));
  const model = loadSiteModel(root, { ...options, results, draftPdfs: printing });
  mkdirSync(dirname(out), { recursive: true });
  const fresh = sibling(out, 'build');
  mkdirSync(fresh);
  try {
    // Eleventy keeps every page it renders until its run ends; a run per PAGES_PER_RUN pages
    // bounds the memory of a large site (500 documents of about 0.7 MB each).
    for (let start = 0; start === 0 || start < model.pages.length; start += PAGES_PER_RUN) {
      setBuildContext({ root, output: fresh, mode: 'build', model: { ...model, pages: model.pages.slice(start, start + PAGES_PER_RUN) } });
      await runEleventy(fresh);
      options.onProgress?.('render', Math.min(start + PAGES_PER_RUN, model.pages.length), model.pages.length);
    }
    for (const page of [...model.pages.map((p) => p.pagePath), 'index.html']) {
      if (!existsSync(join(fresh, page))) throw new UserError(`the build did not write ${page}`, EXIT_INTERNAL);
    }
    if (printing) await printDrafts(root, fresh, model.drafts, (done, total) => options.onProgress?.('print', done, total));
  } catch (error) {
    rmSync(fresh, { recursive: true, force: true });
    throw error;
  } finally {
    setBuildContext(null);
  }
  const old = existsSync(out) ? sibling(out, 'old') : null;
  if (old) renameSync(out, old);
  try {
    renameSync(fresh, out);
  } catch (error) {
    if (old) renameSync(old, out);
    rmSync(fresh, { recursive: true, force: true });
    throw error;
  }
  if (old) rmSync(old, { recursive: true, force: true });
  const warnings = printing ? model.warnings : [...model.warnings, `no PDFs were printed: ${options.pdf === false ? 'HTML only was asked for' : chromiumMissingMessage()}`];
  return { out, documents: model.pages.length, pdfs: printing ? model.drafts.length : 0, warnings };
}
