/**
 * `cellbasis serve`: the site for editing, rebuilt incrementally. Every page is rendered with the
 * site's own Nunjucks environment and templates (the same renderView the Eleventy build uses, so
 * a served page is byte for byte the built one), served by Eleventy's dev server with live
 * reload. When a project's files change (its basis.yaml or an issued revision), only that
 * project's pages and the index are rendered again; a change to the templates renders every
 * page. Results come from the results cache, so an edit costs one calculation.
 *
 * A basis with errors keeps its last good pages and shows its located diagnostics on the index
 * page (and on stderr); the server keeps running. serve writes into the site folder directly
 * (no atomic swap: it is for editing) and never prints PDFs. It writes only into a site folder
 * of cellbasis (lib/publish/site-marker.ts: missing, empty or marked; a link is followed) and
 * refuses any other before writing anything.
 *
 *   serveSite({ root, out, port }): Promise<{ stop(): Promise<void> }>
 */
import { copyFileSync, mkdirSync, renameSync, watch, writeFileSync, type FSWatcher } from 'node:fs';
import { dirname, join, relative, resolve, sep } from 'node:path';
import { createRequire } from 'node:module';
import { listProjects } from '../basis/projects.ts';
import { portfolioView, type PortfolioProject } from '../report/portfolio.ts';
import { loadProjectPages, projectLoader, type ProjectLoader } from './site-model.ts';
import { SiteProblems } from './site-problems.ts';
import { renderView } from './render.ts';
import { nunjucksEnvironment } from './nunjucks-env.ts';
import { writeSiteAssets } from './write-assets.ts';
import { ASSET_DIR } from './site-assets.ts';
import { TEMPLATES_DIR } from './paths.ts';
import { claimSiteFolder } from './site-marker.ts';
import { writeTableFiles } from './table-files.ts';

export interface ServeOptions {
  root: string;
  out?: string;
  port: number;
}

interface DevServer {
  serve(port: number): void;
  reloadFiles(files: string[], domDiff?: boolean): void;
  close(): Promise<void>;
}

interface ProjectState {
  portfolio: PortfolioProject | null;
  errors: string[];
  warnings: string[];
}

/** Writes a file through a temporary name, so the server never serves half a page. */
function writeAtomically(path: string, text: string): void {
  mkdirSync(dirname(path), { recursive: true });
  const temp = `${path}.${process.pid}.tmp`;
  writeFileSync(temp, text);
  renameSync(temp, path);
}

/** Copies a file through a temporary name, as writeAtomically writes one. */
function copyAtomically(from: string, path: string): void {
  mkdirSync(dirname(path), { recursive: true });
  const temp = `${path}.${process.pid}.tmp`;
  copyFileSync(from, temp);
  renameSync(temp, path);
}

class IncrementalSite {
  private readonly projects = new Map<string, ProjectState>();
  private loader: ProjectLoader;

  constructor(
    private readonly root: string,
    private readonly out: string,
  ) {
    this.loader = projectLoader(root);
  }

  /** Renders one project's pages; returns the files written. */
  project(id: string): string[] {
    const problems = new SiteProblems();
    const pages = loadProjectPages(this.loader, id, problems);
    const previous = this.projects.get(id);
    const failed = problems.errors.length > 0;
    this.projects.set(id, {
      portfolio: failed ? (previous?.portfolio ?? null) : pages.portfolio,
      errors: problems.errors,
      warnings: problems.warnings,
    });
    for (const line of [...problems.errors, ...problems.warnings]) process.stderr.write(`${line}\n`);
    if (failed) return [];
    const files = pages.pages.flatMap((entry) => {
      const file = join(this.out, entry.pagePath);
      const view = entry.view();
      writeAtomically(file, renderView(view));
      return [file, ...writeTableFiles(this.out, view)];
    });
    for (const entry of pages.revisionPages) {
      const file = join(this.out, entry.pagePath);
      writeAtomically(file, nunjucksEnvironment().render('revision-page.njk', { r: entry.view() }));
      files.push(file);
    }
    // An issued revision's document and PDF, as they were issued.
    for (const copy of pages.copies) {
      const file = join(this.out, copy.to);
      copyAtomically(copy.from, file);
      files.push(file);
    }
    return files;
  }

  /** Renders the portfolio index from the current state; returns its file. */
  index(): string {
    const ids = listProjects(this.root);
    for (const id of [...this.projects.keys()]) if (!ids.includes(id)) this.projects.delete(id);
    const states = ids.map((id) => this.projects.get(id)).filter((s): s is ProjectState => s !== undefined);
    const errors = states.flatMap((s) => s.errors);
    const portfolio = portfolioView(
      states.map((s) => s.portfolio).filter((p): p is PortfolioProject => p !== null),
      ...(errors.length ? [errors] : []),
    );
    const file = join(this.out, 'index.html');
    writeAtomically(file, nunjucksEnvironment().render('portfolio-page.njk', { cellbasis: { portfolio } }));
    return file;
  }

  /** Every page and the assets. */
  all(): string[] {
    this.loader = projectLoader(this.root);
    writeSiteAssets(join(this.out, ASSET_DIR));
    const files = listProjects(this.root).flatMap((id) => this.project(id));
    return [...files, this.index()];
  }
}

/** The project a changed path belongs to (projects/<id>/...), or null. */
function projectOf(root: string, path: string): string | null {
  const rel = relative(join(root, 'projects'), path);
  if (rel.startsWith('..') || rel === '') return null;
  return rel.split(sep)[0] ?? null;
}

export async function serveSite(options: ServeOptions): Promise<{ stop(): Promise<void> }> {
  const root = resolve(options.root);
  const out = resolve(options.out ?? join(root, 'site'));
  claimSiteFolder(out, 'serve', relative(root, out) || '.');
  const site = new IncrementalSite(root, out);
  site.all();
  // Eleventy's dev server (a CommonJS package without type declarations): static files and live reload.
  const devServer = createRequire(import.meta.url)('@11ty/eleventy-dev-server') as { getServer(name: string, dir: string, options: Record<string, unknown>): DevServer };
  const server = devServer.getServer('cellbasis', out, {
    liveReload: true,
    domDiff: false,
    showVersion: false,
    logger: { log: () => undefined, info: () => undefined, error: (m: string) => process.stderr.write(`${m}\n`) },
  });
  server.serve(options.port);

  // Changes are collected for a short moment (an editor saves in several writes), then rendered.
  const pending = new Set<string>();
  let templates = false;
  let timer: NodeJS.Timeout | null = null;
  const flush = () => {
    timer = null;
    const files = templates ? site.all() : [...[...pending].flatMap((id) => site.project(id)), site.index()];
    pending.clear();
    templates = false;
    server.reloadFiles(files, false);
  };
  const schedule = () => {
    if (!timer) timer = setTimeout(flush, 40);
  };
  const watchers: FSWatcher[] = [
    watch(join(root, 'projects'), { recursive: true }, (_event, name) => {
      if (!name || name.endsWith('.tmp')) return;
      const id = projectOf(root, join(root, 'projects', name.toString()));
      if (id) {
        pending.add(id);
        schedule();
      }
    }),
    watch(TEMPLATES_DIR, { recursive: true }, () => {
      templates = true;
      schedule();
    }),
  ];
  return {
    async stop() {
      for (const w of watchers) w.close();
      if (timer) clearTimeout(timer);
      await server.close();
    },
  };
}
