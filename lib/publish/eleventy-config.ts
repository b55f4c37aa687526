/**
 * The Eleventy configuration of the design-basis site (loaded through .eleventy.js): templates
 * from templates/, our Nunjucks environment (lib/publish/nunjucks-env.ts) as Eleventy's njk
 * library, the site model as the global data `cellbasis` (the pages paginated by
 * templates/document.njk, the portfolio shown by templates/index.njk), the assets and sealed
 * PDFs copied as they are, and the projects' YAML watched by the dev server.
 *
 * Under `cellbasis build` the model arrives checked in the build context; under `cellbasis
 * serve` and `npx @11ty/eleventy` it is loaded on every build, and while serving a failed load
 * shows its problems on the index page instead of stopping the server.
 *
 * Eleventy's output folder must be a site folder of cellbasis (lib/publish/site-marker.ts: new,
 * empty or marked) and is marked before anything is written into it.
 */
import { existsSync, readdirSync } from 'node:fs';
import { join, relative, resolve } from 'node:path';
import { listProjects } from '../basis/projects.ts';
import { SEALED_FILES, sealedRoot } from '../archive/layout.ts';
import { UserError } from '../core/errors.ts';
import { portfolioView } from '../report/portfolio.ts';
import { revisionPagePath } from '../report/links.ts';
import { buildContext } from './build-context.ts';
import type { EleventyConfig } from './eleventy-api.ts';
import { nunjucksEnvironment } from './nunjucks-env.ts';
import { TEMPLATES_DIR } from './paths.ts';
import { ASSET_DIR, siteAssets } from './site-assets.ts';
import { loadSiteModel, type SiteModel } from './site-model.ts';
import { SiteError } from './site-problems.ts';
import { claimSiteFolder } from './site-marker.ts';

/** Sealed PDFs under the root, found from the folders alone (the configuration runs before the model loads). */
function sealedPdfs(root: string): Record<string, string> {
  const copies: Record<string, string> = {};
  for (const id of listProjects(root)) {
    const dir = sealedRoot(root, id);
    if (!existsSync(dir)) continue;
    for (const rev of readdirSync(dir)) {
      const pdf = join(dir, rev, SEALED_FILES.pdf);
      if (existsSync(pdf)) copies[pdf] = revisionPagePath(id, rev).replace(/index\.html$/, SEALED_FILES.pdf);
    }
  }
  return copies;
}

/** The model for one build: as handed over, or loaded now; while serving, problems become the index page. */
function siteData(): SiteModel {
  const context = buildContext();
  if (context.model) return context.model;
  try {
    const model = loadSiteModel(context.root);
    for (const w of model.warnings) process.stderr.write(`${w}\n`);
    return model;
  } catch (error) {
    if (context.mode !== 'serve' || !(error instanceof UserError)) throw error;
    const lines = error instanceof SiteError ? [...error.errors, ...error.warnings] : [error.message];
    process.stderr.write(`${lines.join('\n')}\n`);
    return { pages: [], portfolio: portfolioView([], lines), warnings: [], drafts: [] };
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
    if (outputMode === 'fs') claimSiteFolder(resolve(directories.output), 'eleventy', relative(process.cwd(), resolve(directories.output)) || '.');
  });
  eleventyConfig.addGlobalData('cellbasis', siteData);
  for (const asset of siteAssets()) eleventyConfig.addPassthroughCopy({ [asset.from]: `${ASSET_DIR}/${asset.to}` });
  for (const [from, to] of Object.entries(sealedPdfs(context.root))) eleventyConfig.addPassthroughCopy({ [from]: to });
  eleventyConfig.addWatchTarget(join(context.root, 'projects', '**', '*.yaml'));
  eleventyConfig.addWatchTarget(join(context.root, 'projects', '**', '*.json'));
  eleventyConfig.addWatchTarget(join(TEMPLATES_DIR, 'assets', '*'));
}
