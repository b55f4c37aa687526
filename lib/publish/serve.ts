/**
 * `cellbasis serve`: the site for editing, rebuilt incrementally. Every page is rendered with the
 * site's own Nunjucks environment and templates (the same renderView the Eleventy build uses, so
 * a served page is byte for byte the built one), served by Eleventy's dev server with live
 * reload. When a project's files change (its basis.yaml or an issued revision), only that
 * project's pages and the index are rendered again; a change to the templates renders every
 * page. Results come from the results cache, so an edit costs one calculation.
 *
 * Changes are seen by watching folders, never files (lib/publish/folder-watch.ts), so a save by
 * renaming over the basis, by truncating and writing, by deleting and writing again, and a new
 * project folder are all rebuilt. A basis with errors, or whose calculation fails, keeps its last
 * good pages and shows its located diagnostics on the index page (and on stderr); a project
 * renamed or deleted loses its pages, and a folder under projects/ that is no project is named on
 * the index page; nothing that happens to the files stops the server.
 *
 * It listens on 127.0.0.1 unless given another address (`host`), since the pages show every
 * project's design basis to whoever can reach the port and serve asks no one who they are. A
 * request is answered by the file it names under the site folder or not at all: a path with bad
 * percent-encoding, an encoded "/" or "\\" or NUL gets 400, a "." or ".." segment 404, and a
 * request that fails in the dev server gets 500; none ends the server. When the port asked for
 * is taken, the next ones are tried (at most 10) and the port really used is returned. serve writes into the site folder directly
 * (no atomic swap: it is for editing) and never prints PDFs. It writes only into a site folder
 * of cellbasis (lib/publish/site-marker.ts: missing, empty or marked; a link is followed) and
 * refuses any other before writing anything.
 *
 *   serveSite({ root, out, port, host }): Promise<{ port, host, url, stop(): Promise<void> }>
 */
import { copyFileSync, mkdirSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import type { IncomingMessage, Server, ServerResponse } from 'node:http';
import { dirname, join, relative, resolve, sep } from 'node:path';
import { createRequire } from 'node:module';
import { projectsProblemText, rescanProjects, scanProjects, type ProjectsScan } from '../basis/projects.ts';
import { UserError, EXIT_VALIDATION } from '../core/errors.ts';
import { fileProblem } from '../core/file-errors.ts';
import { portfolioView, type PortfolioEntry } from '../report/portfolio.ts';
import { loadProjectPages, projectLoader, type ProjectLoader } from './site-model.ts';
import { SiteProblems } from './site-problems.ts';
import { renderViewBytes } from './render.ts';
import { nunjucksEnvironment } from './nunjucks-env.ts';
import { writeSiteAssets } from './write-assets.ts';
import { ASSET_DIR } from './site-assets.ts';
import { TEMPLATES_DIR } from './paths.ts';
import { claimSiteFolder } from './site-marker.ts';
import { writeTableFiles } from './table-files.ts';
import { watchTree, type TreeWatch } from './folder-watch.ts';

const DEFAULT_HOST = '127.0.0.1';
/** How many ports after the one asked for are tried when it is taken. */
const PORT_TRIES = 10;

export interface ServeOptions {
  root: string;
  out?: string;
  port: number;
  /** The address to listen on (default 127.0.0.1, this machine only). */
  host?: string;
}

export interface RunningServer {
  /** The port really listened on (the one asked for, or the next free one). */
  port: number;
  host: string;
  url: string;
  stop(): Promise<void>;
}

interface DevServer {
  readonly server: Server;
  serve(port: number): void;
  reloadFiles(files: string[], domDiff?: boolean): void;
  close(): Promise<void>;
  onRequestHandler(req: IncomingMessage, res: ServerResponse): Promise<void>;
  _serverListen(port: number): void;
}

interface ProjectState {
  portfolio: PortfolioEntry | null;
  errors: string[];
  warnings: string[];
}

/** Writes a file through a temporary name, so the server never serves half a page. */
function writeAtomically(path: string, bytes: string | Uint8Array): void {
  mkdirSync(dirname(path), { recursive: true });
  const temp = `${path}.${process.pid}.tmp`;
  writeFileSync(temp, bytes);
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
  /** projects/ as last listed: a change inside some projects' folders looks at those entries only. */
  private scan: ProjectsScan = { ids: [], problems: [] };

  constructor(
    private readonly root: string,
    private readonly out: string,
  ) {
    this.loader = projectLoader(root, { keepDrafts: true });
  }

  /** Renders one project's pages and copies its issued PDFs; returns the files written. */
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
      renderViewBytes(view, (bytes) => writeAtomically(file, bytes));
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

  /** Forgets a project that is gone (deleted, renamed) and removes its pages, which would mislead. */
  private forget(id: string): void {
    this.projects.delete(id);
    rmSync(join(this.out, 'projects', id), { recursive: true, force: true });
  }

  /** Renders the portfolio index from the current state and `scan`, projects/ as it is now; returns its file. */
  index(scan: ProjectsScan): string {
    const { ids, problems } = scan;
    const present = new Set(ids);
    for (const id of [...this.projects.keys()]) if (!present.has(id)) this.forget(id);
    const states = ids.map((id) => this.projects.get(id)).filter((s): s is ProjectState => s !== undefined);
    const errors = [...problems.filter((p) => p.severity === 'error').map(projectsProblemText), ...states.flatMap((s) => s.errors)];
    const portfolio = portfolioView(
      states.map((s) => s.portfolio).filter((p): p is PortfolioEntry => p !== null),
      ...(errors.length ? [errors] : []),
    );
    const file = join(this.out, 'index.html');
    writeAtomically(file, nunjucksEnvironment().render('portfolio-page.njk', { cellbasis: { portfolio } }));
    return file;
  }

  /** Every page and the assets. */
  all(): string[] {
    this.loader = projectLoader(this.root, { keepDrafts: true });
    writeSiteAssets(join(this.out, ASSET_DIR));
    const scan = this.listProjects(null);
    const files = scan.ids.flatMap((id) => this.project(id));
    return [...files, this.index(scan)];
  }

  /**
   * projects/ as it is now: listed again in full (`changed` null, when an entry of projects/
   * itself came, went or was renamed), or with only the entries `changed` looked at again, when
   * only what is inside those project folders changed.
   */
  listProjects(changed: ReadonlySet<string> | null): ProjectsScan {
    this.scan = changed ? rescanProjects(this.root, this.scan, changed) : scanProjects(this.root);
    return this.scan;
  }
}

/** The project a changed path belongs to (projects/<id>/...), or null. */
function projectOf(root: string, path: string): string | null {
  const rel = relative(join(root, 'projects'), path);
  if (rel.startsWith('..') || rel === '') return null;
  return rel.split(sep)[0] ?? null;
}

/**
 * Why a request's path names no file of the site: 400 for a path that cannot be decoded
 * (bad percent-encoding) or that hides a separator or NUL in an encoded segment (%2F, %5C, %00),
 * 404 for a "." or ".." segment (the site has no use for them; they only climb); null when fine.
 */
export function requestPathProblem(url: string | undefined): 400 | 404 | null {
  if (!url || !url.startsWith('/') || url.startsWith('//')) return 400;
  const path = url.split(/[?#]/)[0]!;
  if (path.includes('\\')) return 400;
  for (const segment of path.split('/')) {
    let decoded: string;
    try {
      decoded = decodeURIComponent(segment);
    } catch {
      return 400;
    }
    if (/[/\\\0]/.test(decoded)) return 400;
    if (decoded === '.' || decoded === '..') return 404;
  }
  return null;
}

function answer(res: ServerResponse, status: number, text: string): void {
  if (res.headersSent) return void res.end();
  res.writeHead(status, { 'content-type': 'text/plain; charset=utf-8' });
  res.end(`${text}\n`);
}

/** Starts listening on host:port, or on one of the next PORT_TRIES ports when it is taken; the port used. */
function listen(dev: DevServer, host: string, port: number): Promise<number> {
  const server = dev.server;
  // The dev server's own handler throws from an event handler when its ports run out (which
  // ends the process) and listens on every interface: both are replaced.
  server.removeAllListeners('error');
  dev._serverListen = (p: number) => server.listen({ port: p, host });
  return new Promise((done, fail) => {
    let tries = 0;
    server.on('error', (error: NodeJS.ErrnoException) => {
      if (server.listening) {
        process.stderr.write(`serve: ${error.message}\n`);
        return;
      }
      if (error.code === 'EADDRINUSE' && tries < PORT_TRIES && port + tries < 65535) {
        tries++;
        dev._serverListen(port + tries);
        return;
      }
      const reason =
        error.code === 'EADDRINUSE'
          ? `port ${port} and the ${PORT_TRIES} after it are all in use: give another with --port`
          : error.code === 'EADDRNOTAVAIL' || error.code === 'ENOTFOUND'
            ? `${host} is no address of this machine: give one of its addresses with --listen-address`
            : error.code === 'EACCES'
              ? `port ${port + tries} may not be used by this user (ports below 1024 are reserved): give another with --port`
              : error.message;
      fail(new UserError(`serve: cannot listen on ${host}:${port + tries}: ${reason}`, EXIT_VALIDATION));
    });
    server.once('listening', () => done((server.address() as { port: number }).port));
    dev.serve(port);
  });
}

export async function serveSite(options: ServeOptions): Promise<RunningServer> {
  const root = resolve(options.root);
  const out = resolve(options.out ?? join(root, 'site'));
  const host = options.host ?? DEFAULT_HOST;
  claimSiteFolder(out, 'serve', relative(root, out) || '.');
  const site = new IncrementalSite(root, out);
  site.all();
  const { dev, port } = await startDevServer(out, host, options.port);
  const stopWatching = rebuildOnChange(root, site, dev);
  return {
    port,
    host,
    url: `http://${host.includes(':') ? `[${host}]` : host}:${port}/`,
    async stop() {
      stopWatching();
      await dev.close();
    },
  };
}

/** Eleventy's dev server over `out` (static files and live reload), every request checked before it sees it; listening on `host`. */
async function startDevServer(out: string, host: string, wanted: number): Promise<{ dev: DevServer; port: number }> {
  // Eleventy's dev server (a CommonJS package without type declarations): static files and live reload.
  const devServer = createRequire(import.meta.url)('@11ty/eleventy-dev-server') as { getServer(name: string, dir: string, options: Record<string, unknown>): DevServer };
  const dev = devServer.getServer('cellbasis', out, {
    liveReload: true,
    domDiff: false,
    showVersion: false,
    logger: { log: () => undefined, info: () => undefined, error: (m: string) => process.stderr.write(`${m}\n`) },
  });
  // Every request is checked before the dev server sees it, and no failure in it ends the server.
  const handle = dev.onRequestHandler.bind(dev);
  dev.onRequestHandler = async (req, res) => {
    const problem = requestPathProblem(req.url);
    if (problem) return answer(res, problem, problem === 400 ? 'Bad request: the path cannot be read as a path of this site' : 'Not found');
    try {
      await handle(req, res);
    } catch (error) {
      process.stderr.write(`serve: ${req.url}: ${(error as Error).message}\n`);
      answer(res, 500, 'The server could not answer this request');
    }
  };
  return { dev, port: await listen(dev, host, wanted) };
}

/**
 * Watches the projects and the templates and renders what changed: a changed project's pages and
 * the index, or the whole site when a template changed; returns the function that stops watching.
 */
function rebuildOnChange(root: string, site: IncrementalSite, dev: DevServer): () => void {
  // Changes are collected for a short moment (an editor saves in several writes), then rendered.
  const pending = new Set<string>();
  // Whether an entry of projects/ itself (or projects/) came, went or was renamed: then it is listed again in full.
  let listing = false;
  let templates = false;
  let timer: NodeJS.Timeout | null = null;
  const flush = () => {
    timer = null;
    const ids = [...pending];
    const all = templates;
    const full = listing;
    pending.clear();
    templates = false;
    listing = false;
    try {
      // Only the projects there are now: a folder renamed away, or to a name that is no id, has none.
      // projects/ is listed once a rebuild, for the changed projects and the index alike.
      const scan = all ? null : site.listProjects(full ? null : new Set(ids));
      const files = !scan ? site.all() : [...ids.filter((id) => scan.ids.includes(id)).flatMap((id) => site.project(id)), site.index(scan)];
      dev.reloadFiles(files, false);
    } catch (error) {
      // A file that vanished mid-render, a full disk: said, and the next change tries again, listing projects/ in full.
      listing = true;
      const problem = error instanceof UserError ? error : fileProblem(error, (p) => relative(root, p) || '.');
      process.stderr.write(`serve: the site could not be rebuilt: ${problem ? problem.message : (error as Error).message}\n`);
    }
  };
  const schedule = () => {
    if (!timer) timer = setTimeout(flush, 40);
  };
  const watchers: TreeWatch[] = [
    watchTree(join(root, 'projects'), (path) => {
      const id = projectOf(root, path);
      if (id === null || path === join(root, 'projects', id)) listing = true;
      if (path.endsWith('.tmp')) return;
      if (id) pending.add(id);
      schedule();
    }),
    watchTree(TEMPLATES_DIR, () => {
      templates = true;
      schedule();
    }),
  ];
  return () => {
    for (const w of watchers) w.close();
    if (timer) clearTimeout(timer);
  };
}
