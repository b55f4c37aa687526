/**
 * The whole site as data: for every project under projects/, the working draft (its basis
 * loaded and calculated now, shown as the draft of the next revision) as a document view, each
 * issued revision as its register page with the document and PDF exactly as issued copied beside
 * it (never rendered again), and the portfolio index. Every problem of every project is collected
 * first; with any error there is no model, only a SiteError listing them all.
 *
 * Pages: projects/<id>/index.html (the draft), projects/<id>/rev-<REV>/index.html (an issued
 * revision's register page; its document.html and document.pdf beside it), index.html (the
 * portfolio).
 */
import { join, posix } from 'node:path';
import { parse as parseYaml } from 'yaml';
import { compareRevisions } from '../archive/compare.ts';
import type { DesignBasis } from '../basis/types.ts';
import { projectsProblemText, scanProjects } from '../basis/projects.ts';
import { readBasisFile } from '../basis/load.ts';
import { BasisError } from '../basis/diagnostics.ts';
import { UserError } from '../core/errors.ts';
import { calculate } from '../plant/calculate.ts';
import type { CalculationOutcome } from '../batch/batch.ts';
import type { Results } from '../plant/results-schema.ts';
import { ResultsCache, resultsKey } from '../batch/results-cache.ts';
import { BasisCache, loadThroughCache } from '../batch/basis-cache.ts';
import { formatFinding } from '../plant/located-error.ts';
import { everyFinding } from '../plant/findings.ts';
import { runAllChecks } from '../verification/checks.ts';
import { documentView, type DocumentView } from '../report/document.ts';
import { revisionHistory, type ChangeSummary, type DraftRecord, type RevisionHistoryEntry } from '../report/history.ts';
import { draftPagePath, relativeHref, revisionPagePath, rootPrefix } from '../report/links.ts';
import { draftPageKey } from './kept-pages.ts';
import { INDEX_PATH, portfolioEntry, portfolioView, type PortfolioEntry, type PortfolioView } from '../report/portfolio.ts';
import type { RevisionContext } from '../report/revision.ts';
import { revisionPageView, type RevisionPageView } from '../report/revision-page.ts';
import { nextRevision } from '../basis/revisions.ts';
import { ISSUED_FILES } from '../archive/layout.ts';
import { readIssuedRevisions, type IssuedRevision } from './issued-revisions.ts';
import { SiteError, SiteProblems } from './site-problems.ts';
import { draftDate } from './source-date.ts';
import { ASSET_DIR } from './site-assets.ts';

/**
 * A document page: its path, and its view model made when the page is rendered (not kept: the
 * views of hundreds of projects would otherwise all sit in memory at once).
 */
export interface PageEntry {
  pagePath: string;
  view(): DocumentView;
  /** A draft's page: the key of its inputs (lib/publish/kept-pages.ts), under which a build keeps its files. */
  keepKey?: string;
}

/** The register page of an issued revision. */
export interface RevisionPageEntry {
  pagePath: string;
  view(): RevisionPageView;
}

/** A file copied into the site as it is: an issued revision's document.html or document.pdf (absolute source, site path). */
export interface SiteCopy {
  from: string;
  to: string;
}

export interface SiteModel {
  pages: PageEntry[];
  /** Whether this run of Eleventy writes the portfolio index (default: yes; a build writes it in its first run only). */
  writesIndex?: boolean;
  revisionPages: RevisionPageEntry[];
  copies: SiteCopy[];
  portfolio: PortfolioView;
  /** Warnings of the bases and the calculation, as file:line:col: warning: ... lines. */
  warnings: string[];
  /** Each working draft's page with its basis and results (to print it). */
  drafts: DraftEntry[];
}

/**
 * A working draft's page, to print it: its basis and results are made again when asked for
 * (`document()`), the basis read from its file again and the results from the results cache,
 * so that a model of many projects holds neither for any of them.
 */
export interface DraftEntry {
  id: string;
  pagePath: string;
  date: string | null;
  revision: RevisionContext;
  document(): { basis: DesignBasis; results: Results };
}

export interface SiteOptions {
  /** The change summary between revisions; default: lib/archive/compare.ts over the basis texts. */
  changeSummary?: ChangeSummary;
  env?: NodeJS.ProcessEnv;
  /** Results calculated beforehand (lib/batch/batch.ts), by project id; others are calculated here. */
  results?: ReadonlyMap<string, CalculationOutcome>;
  /** Whether the build prints each draft to projects/<id>/document.pdf (the page links it). */
  draftPdfs?: boolean;
  /**
   * Keep each draft's basis and results for its page and PDF, instead of reading them again when
   * they are made: for the dev server, which renders a project's pages at once and then lets
   * them go (a build keeps none: see documentAgain).
   */
  keepDrafts?: boolean;
  /**
   * Given each working draft's page as soon as its project is loaded, over the basis and results
   * the load holds (the build renders it then, and so reads, parses and validates each basis and
   * reads each result once); not given once any project has an error (there will be no site).
   * The model's own pages read both again when they are rendered.
   */
  onDraftPage?: (page: PageEntry) => void;
}

function pageOptions(path: string) {
  return { pagePath: path, assetBase: `${rootPrefix(path)}${ASSET_DIR}/`, indexHref: relativeHref(path, INDEX_PATH) };
}

/**
 * A copy of plain data (strings, numbers, arrays, objects) that holds only itself. V8 keeps a
 * string cut from another together with that other: a row's title, a signatory's name or a date
 * read from a basis kept the whole text of the basis alive (about 6 kB a project; a heap snapshot
 * of the model of 400 synthetic projects held all 400 texts), and the model keeps what it is
 * given until the build ends. A structured clone writes every string anew.
 */
function detached<T>(value: T): T {
  return structuredClone(value);
}

/** The change summary of lib/archive/compare.ts; each revision carries its basis's YAML text for the structural diff. */
const compareWith: ChangeSummary = (before, after) => compareRevisions(before, after).summary;

/**
 * A text field of an issued basis's `document` block: from the validated basis, or read from its
 * YAML where today's loader does not read it ("" when absent or not text).
 */
function issuedDocumentText(s: IssuedRevision, field: 'client' | 'site'): string {
  if (s.basis) return s.basis.document[field] ?? '';
  const tree: unknown = parseYaml(s.source);
  const document = typeof tree === 'object' && tree !== null ? (tree as Record<string, unknown>)['document'] : undefined;
  const value = typeof document === 'object' && document !== null ? (document as Record<string, unknown>)[field] : undefined;
  return typeof value === 'string' ? value : '';
}

/** What one project contributes to the site. */
export interface ProjectPages {
  pages: PageEntry[];
  revisionPages: RevisionPageEntry[];
  copies: SiteCopy[];
  draft: SiteModel['drafts'][number] | null;
  portfolio: PortfolioEntry | null;
  /** The draft's page over the basis and results the load holds, to render at once and let go (onDraftPage); null with no draft. */
  current: PageEntry | null;
}

/** The shared inputs of loading projects: the verification table, the results cache and the cache of checked bases. */
export interface ProjectLoader {
  root: string;
  options: SiteOptions;
  checks: ReturnType<typeof runAllChecks>;
  cache: ResultsCache;
  bases: BasisCache;
}

export function projectLoader(root: string, options: SiteOptions = {}): ProjectLoader {
  return { root, options, checks: runAllChecks(), cache: new ResultsCache(root), bases: new BasisCache(root) };
}

/**
 * The results of a project's working draft: those calculated beforehand for the build, else from
 * the results cache, else calculated (and cached); null, with the problems told, where its
 * calculation fails.
 */
function draftResults(loader: ProjectLoader, id: string, basis: DesignBasis, bytes: Uint8Array, problems: SiteProblems): Results | null {
  const shown = `projects/${id}/basis.yaml`;
  const given = loader.options.results?.get(id);
  if (given) {
    if (given.ok) return given.results;
    if (given.diagnostics.length) problems.diagnostics(given.diagnostics);
    else problems.error(shown, given.message);
    return null;
  }
  try {
    // The dev server rebuilds from here on every change: unchanged projects come from the cache.
    const key = resultsKey(bytes, id, shown);
    let results = loader.cache.get(key);
    if (!results) {
      results = calculate(basis);
      loader.cache.put(key, results);
    }
    return results;
  } catch (error) {
    if (!(error instanceof BasisError)) throw error;
    problems.diagnostics(error.errors);
    return null;
  }
}

/**
 * The draft's basis and results again, when its page is rendered or printed, so that the model
 * keeps neither (the memory of a build is then independent of the number of projects; the
 * validated basis alone is some 30 kB a project in memory). The basis is read from its file
 * again and must still be the one the model was made from (`key`, its results key): a basis
 * saved while the site is built stops the build, which is then run again, rather than give a page
 * that the checks, the index row and the warnings were not made from. The results are read from
 * the results cache, where they were put when they were calculated; where the cache holds no
 * entry (a folder it cannot write) they are kept (`kept`) instead, and an entry that no longer
 * reads back (removed meanwhile) is calculated again, as the same bytes give the same results.
 */
function documentAgain(loader: ProjectLoader, id: string, key: string, kept: Results | null): () => { basis: DesignBasis; results: Results } {
  return () => {
    const shown = `projects/${id}/basis.yaml`;
    const read = readBasisFile(join(loader.root, 'projects', id, 'basis.yaml'), { id, displayPath: shown });
    if (!read.bytes || !read.result.ok || resultsKey(read.bytes, id, shown) !== key) {
      throw new UserError(`${shown} changed while the site was made from it; nothing was made of the new text: run the build again`);
    }
    const basis = read.result.basis;
    return { basis, results: kept ?? loader.cache.get(key) ?? calculate(basis) };
  };
}

// Module functions, not arrows inside loadProjectPages: arrows made in one function share its
// variables, and a page's view would hold the basis and results it exists to let go.
function keptDocument(basis: DesignBasis, results: Results): () => { basis: DesignBasis; results: Results } {
  return () => ({ basis, results });
}

function draftPage(pagePath: string, document: () => { basis: DesignBasis; results: Results }, revision: RevisionContext, history: RevisionHistoryEntry[], checks: ProjectLoader['checks']): PageEntry {
  return { pagePath, view: () => documentView({ ...document(), revision, history }, { ...pageOptions(pagePath), checks }) };
}

function revisionPage(pagePath: string, input: Parameters<typeof revisionPageView>[0]): RevisionPageEntry {
  return { pagePath, view: () => revisionPageView(input) };
}

/**
 * The register page of each issued revision, and the copies of its document and PDF as issued;
 * the history's entries give each its change summary against the revision before.
 */
function issuedPages(id: string, issued: IssuedRevision[], history: RevisionHistoryEntry[], draftRevision: string): { pages: RevisionPageEntry[]; copies: SiteCopy[] } {
  const pages: RevisionPageEntry[] = [];
  const copies: SiteCopy[] = [];
  issued.forEach((s, i) => {
    const pagePath = revisionPagePath(id, s.revision);
    const folder = posix.dirname(pagePath);
    if (s.html) copies.push({ from: s.html, to: `${folder}/${ISSUED_FILES.html}` });
    if (s.pdf) copies.push({ from: s.pdf, to: `${folder}/${ISSUED_FILES.pdf}` });
    const next = issued[i + 1];
    const entry = history.find((h) => h.kind === 'issued' && h.revision === s.revision);
    const before = issued[i - 1];
    const m = s.manifest;
    // Made now, of a few strings: the page's view holds these, not the revision's basis and results.
    pages.push(
      revisionPage(pagePath, detached({
        projectId: id,
        number: m.documentNumber,
        title: m.title,
        client: issuedDocumentText(s, 'client'),
        site: issuedDocumentText(s, 'site'),
        revision: s.revision,
        manifest: { status: m.status, issuedOn: m.issuedOn, note: m.note, signOff: m.signOff, signatures: m.signatures, toolVersion: m.tool.version, chromium: m.pdf?.chromium ?? null },
        manifestSha256: s.manifestSha256,
        previous: before ? { revision: before.revision, changes: entry?.changes ?? [] } : null,
        supersededBy: next ? { revision: next.revision, issuedOn: next.manifest.issuedOn, path: revisionPagePath(id, next.revision) } : null,
        pagePath,
        draftPath: draftPagePath(id),
        hasDocument: s.html !== null,
        hasPdf: s.pdf !== null,
        indexPath: INDEX_PATH,
        draftRevision,
      })),
    );
  });
  return { pages, copies };
}

/** A project's revision history: each issued revision with its page, then the working draft, each compared with the one before by `changeSummary`. */
function projectHistory(id: string, issued: readonly IssuedRevision[], draft: DraftRecord, changeSummary: ChangeSummary): RevisionHistoryEntry[] {
  return revisionHistory({
    issued: issued.map((s) => ({
      revision: s.revision,
      basis: s.basis,
      ...(s.basisProblem ? { basisProblem: s.basisProblem } : {}),
      source: s.source,
      results: s.results,
      manifest: s.manifest,
      path: revisionPagePath(id, s.revision),
    })),
    draft,
    changeSummary,
  });
}

/**
 * One project: its working draft and issued revisions as document views, and its portfolio row.
 * Problems go to `problems`; a project with an error contributes no pages.
 */
export function loadProjectPages(loader: ProjectLoader, id: string, problems: SiteProblems): ProjectPages {
  const { root, options, checks } = loader;
  const none: ProjectPages = { pages: [], revisionPages: [], copies: [], draft: null, portfolio: null, current: null };
  const shown = `projects/${id}/basis.yaml`;
  let read;
  try {
    read = readBasisFile(join(root, 'projects', id, 'basis.yaml'), { id, displayPath: shown, check: (bytes, file) => loadThroughCache(loader.bases, bytes, file, id) });
  } catch (error) {
    // A basis that cannot be read (gone, a FIFO, unreadable): one problem of the site, not the end of it.
    if (!(error instanceof UserError)) throw error;
    problems.errors.push(error.message);
    return none;
  }
  const { result: loaded, bytes } = read;
  problems.diagnostics(loaded.ok ? loaded.warnings : [...loaded.errors, ...loaded.warnings]);
  const issued = readIssuedRevisions(root, id, problems);
  if (!loaded.ok || !bytes) return none;
  const results = draftResults(loader, id, loaded.basis, bytes, problems);
  if (!results) return none;
  problems.findings(everyFinding(results).map((f) => formatFinding(loaded.basis, f)));
  const draftPath = draftPagePath(id);
  const last = issued[issued.length - 1];
  const draftRevision = nextRevision(last?.revision ?? null);
  const history = detached(projectHistory(id, issued, { revision: draftRevision, basis: loaded.basis, source: Buffer.from(bytes).toString('utf8'), results, path: draftPath }, options.changeSummary ?? compareWith));
  const date = detached(draftDate(loaded.basis, options.env, last?.manifest.issuedOn ?? null));
  const draft: RevisionContext = detached({
    kind: 'draft',
    revision: draftRevision,
    lastIssued: last ? { revision: last.revision, status: last.manifest.status, issuedOn: last.manifest.issuedOn } : null,
    date,
    pdfHref: options.draftPdfs ? 'document.pdf' : null,
  });
  const register = issuedPages(id, issued, history, draftRevision);
  const key = resultsKey(bytes, id, shown);
  const document = options.keepDrafts ? keptDocument(loaded.basis, results) : documentAgain(loader, id, key, loader.cache.has(key) ? null : results);
  return {
    pages: [draftPage(draftPath, document, draft, history, checks)],
    current: { ...draftPage(draftPath, keptDocument(loaded.basis, results), draft, history, checks), keepKey: draftPageKey({ resultsKey: key, pagePath: draftPath, revision: draft, history }) },
    revisionPages: register.pages,
    copies: register.copies,
    draft: { id, pagePath: draftPath, date, revision: draft, document },
    // The index row, formatted now: the model keeps it, not the basis and results it is made from.
    portfolio: detached(
      portfolioEntry({
        id,
        basis: loaded.basis,
        results,
        draftPath,
        issued: last ? { revision: last.revision, status: last.manifest.status, issuedOn: last.manifest.issuedOn, path: revisionPagePath(id, last.revision) } : null,
        draftRevision,
        revisionsIssued: issued.length,
      }),
    ),
  };
}

/** Loads every project of `root`; throws SiteError with every problem found. */
export function loadSiteModel(root: string, options: SiteOptions = {}): SiteModel {
  const problems = new SiteProblems();
  const loader = projectLoader(root, options);
  const pages: PageEntry[] = [];
  const revisionPages: RevisionPageEntry[] = [];
  const copies: SiteCopy[] = [];
  const projects: PortfolioEntry[] = [];
  const drafts: SiteModel['drafts'] = [];
  const scanned = scanProjects(root);
  for (const problem of scanned.problems) (problem.severity === 'error' ? problems.errors : problems.warnings).push(projectsProblemText(problem));
  for (const id of scanned.ids) {
    const project = loadProjectPages(loader, id, problems);
    if (project.current && options.onDraftPage && problems.errors.length === 0) options.onDraftPage(project.current);
    pages.push(...project.pages);
    revisionPages.push(...project.revisionPages);
    copies.push(...project.copies);
    if (project.draft) drafts.push(project.draft);
    if (project.portfolio) projects.push(project.portfolio);
  }
  if (problems.errors.length) throw new SiteError(problems.errors, problems.warnings);
  return { pages, revisionPages, copies, portfolio: portfolioView(projects), warnings: problems.warnings, drafts };
}
