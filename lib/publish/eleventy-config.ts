/**
 * The Eleventy configuration of the design-basis site (loaded through .eleventy.js): templates
 * from templates/, our Nunjucks environment (lib/publish/nunjucks-env.ts) as Eleventy's njk
 * library, the site model as the global data `cellbasis` (the drafts paginated by
 * templates/document.njk, the issued revisions' register pages by templates/revision.njk, the
 * portfolio shown by templates/index.njk, in the runs whose model writes the index), the assets and each issued revision's document.html
 * and document.pdf copied as they were issued, and the projects' YAML watched by the dev server.
 *
 * The issued files are copied by this module, not by Eleventy's passthrough copy, before the run
 * writes anything: each is opened once, without following a link and without waiting on a FIFO,
 * checked to be a regular file within its size limit on the open file (readIssuedFile), and its
 * bytes written into the site. A passthrough copy opens the file by its name later, so a file
 * swapped for a FIFO after the site's check would hang the build, and one swapped for a link
 * would copy what it points to.
 *
 * Under `cellbasis build` the model arrives checked in the build context; under `cellbasis
 * serve` and `npx @11ty/eleventy` it is loaded on every build, and while serving a failed load
 * shows its problems on the index page instead of stopping the server.
 *
 * Eleventy's output folder must be a site folder of cellbasis (lib/publish/site-marker.ts: new,
 * empty or marked) and is marked before anything is written into it.
 */
import { lstatSync, mkdirSync, writeFileSync } from 'node:fs';
import { basename, dirname, join, relative, resolve } from 'node:path';
import { listProjects } from '../basis/projects.ts';
import { ISSUED_FILES, issuedDir } from '../archive/layout.ts';
import { readIssuedFolder } from '../archive/issued-folder.ts';
import { issuedFileToCopy, readIssuedFile } from '../archive/issued-files.ts';
import { UserError } from '../core/errors.ts';
import { INDEX_PATH, portfolioView } from '../report/portfolio.ts';
import { buildContext } from './build-context.ts';
import type { EleventyConfig } from './eleventy-api.ts';
import { nunjucksEnvironment } from './nunjucks-env.ts';
import { TEMPLATES_DIR } from './paths.ts';
import { revisionPagePath } from '../report/links.ts';
import { ASSET_DIR, siteAssets } from './site-assets.ts';
import { loadSiteModel, type SiteModel } from './site-model.ts';
import { SiteError } from './site-problems.ts';
import { claimSiteFolder } from './site-marker.ts';
import { withTableFiles } from './table-files.ts';

/**
 * The issued files the site copies: those of the model where the build loaded it first (only the
 * revisions it read, so that a revision an issue run completes meanwhile is not half shown);
 * else, where the model loads on every run (serve, npx), the revisions found in the folders
 * (readIssuedFolder: never an issue run's temporary folder).
 */
function issuedCopies(root: string, model: SiteModel | null): Record<string, string> {
  const copies: Record<string, string> = {};
  if (model) {
    for (const c of model.copies) copies[c.from] = c.to;
    return copies;
  }
  for (const id of listProjects(root)) {
    let revisions: string[];
    try {
      revisions = readIssuedFolder(root, id).revisions;
    } catch {
      continue; // The model's load reports the folder.
    }
    for (const rev of revisions) {
      for (const name of [ISSUED_FILES.html, ISSUED_FILES.pdf]) {
        const from = join(issuedDir(root, id, rev), name);
        // A file that is no regular file or too large is not copied; the model's load reports it.
        const state = issuedFileToCopy(issuedDir(root, id, rev), `projects/${id}/issued/${rev}`, name);
        if (state.present && state.problem === null) copies[from] = `${dirname(revisionPagePath(id, rev))}/${name}`;
      }
    }
  }
  return copies;
}

/**
 * Writes each issued file into the site as read through one checked open of it (the module
 * comment). Under serve the site stays between runs: a copy already there at the size of the
 * issued file is kept (an issued file never changes; the audit checks its digest).
 */
function copyIssuedFiles(root: string, output: string, copies: Record<string, string>): void {
  for (const [from, to] of Object.entries(copies)) {
    const target = join(output, to);
    const there = lstatSync(target, { throwIfNoEntry: false });
    if (there?.isFile() && there.size === lstatSync(from, { throwIfNoEntry: false })?.size) continue;
    const bytes = readIssuedFile(dirname(from), relative(root, dirname(from)), basename(from));
    mkdirSync(dirname(target), { recursive: true });
    writeFileSync(target, bytes);
  }
}

/** The model for one build: as handed over, or loaded now; while serving, problems become the index page. Each page writes its tables' CSV files as it is rendered. */
function siteData(): SiteModel & { indexPages: string[] } {
  const context = buildContext();
  const model = context.model ?? loadedModel();
  // templates/index.njk paginates over indexPages: one page, or none in a run that leaves the index to another.
  return { ...model, pages: withTableFiles(model.pages, context.output, context.unseen === true), indexPages: model.writesIndex === false ? [] : [INDEX_PATH] };
}

function loadedModel(): SiteModel {
  const context = buildContext();
  try {
    const model = loadSiteModel(context.root);
    for (const w of model.warnings) process.stderr.write(`${w}\n`);
    return model;
  } catch (error) {
    if (context.mode !== 'serve' || !(error instanceof UserError)) throw error;
    const lines = error instanceof SiteError ? [...error.errors, ...error.warnings] : [error.message];
    process.stderr.write(`${lines.join('\n')}\n`);
    return { pages: [], revisionPages: [], copies: [], portfolio: portfolioView([], lines), warnings: [], drafts: [] };
  }
}

export default function configureSite(eleventyConfig: EleventyConfig): void {
  const context = buildContext();
  eleventyConfig.setInputDirectory(TEMPLATES_DIR);
  eleventyConfig.setIncludesDirectory('_includes');
  eleventyConfig.setOutputDirectory(context.output);
  eleventyConfig.setTemplateFormats(['njk']);
  eleventyConfig.setLibrary('njk', nunjucksEnvironment());
  eleventyConfig.setQuietMode(true);
  // Eleventy writes into its output folder in place: only into one of ours (missing, empty or marked), which it marks first.
  eleventyConfig.on('eleventy.before', ({ directories, outputMode }) => {
    if (outputMode !== 'fs') return;
    const output = resolve(directories.output);
    claimSiteFolder(output, 'eleventy', relative(process.cwd(), output) || '.');
    copyIssuedFiles(context.root, output, issuedCopies(context.root, context.model));
  });
  eleventyConfig.addGlobalData('cellbasis', siteData);
  // A build of many pages runs Eleventy once per group of pages: the assets (some 60 files) are copied in its first run only.
  if (context.model?.writesIndex !== false) for (const asset of siteAssets()) eleventyConfig.addPassthroughCopy({ [asset.from]: `${ASSET_DIR}/${asset.to}` });
  eleventyConfig.addWatchTarget(join(context.root, 'projects', '**', '*.yaml'));
  eleventyConfig.addWatchTarget(join(context.root, 'projects', '**', '*.json'));
  eleventyConfig.addWatchTarget(join(TEMPLATES_DIR, 'assets', '*'));
}
