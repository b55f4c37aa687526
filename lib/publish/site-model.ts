/**
 * The whole site as data: for every project under projects/, the working draft (its basis
 * loaded and calculated now) and each sealed revision (basis and results as sealed), each as a
 * document view with its own page path, and the portfolio index. Every problem of every project
 * is collected first; with any error there is no model, only a SiteError listing them all.
 *
 * Pages: projects/<id>/index.html (the draft), projects/<id>/rev-<REV>/index.html (a sealed
 * revision; the configuration copies its document.pdf beside it), index.html (the portfolio).
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { compareRevisions } from '../archive/compare.ts';
import type { DesignBasis } from '../basis/types.ts';
import { listProjects } from '../basis/projects.ts';
import { loadBasisFile } from '../basis/load.ts';
import { BasisError } from '../basis/diagnostics.ts';
import { calculate } from '../plant/calculate.ts';
import type { CalculationOutcome } from '../plant/batch.ts';
import type { Results } from '../plant/results-schema.ts';
import { ResultsCache, resultsKey } from '../plant/results-cache.ts';
import { locatedDiagnostic } from '../plant/located-error.ts';
import { runAllChecks } from '../verification/checks.ts';
import { documentView, type DocumentView } from '../report/document.ts';
import { revisionHistory, type ChangeSummary } from '../report/history.ts';
import { draftPagePath, relativeHref, revisionPagePath, rootPrefix } from '../report/links.ts';
import { INDEX_PATH, portfolioView, type PortfolioProject, type PortfolioView } from '../report/portfolio.ts';
import type { RevisionContext } from '../report/revision.ts';
import { readSealedRevisions } from './sealed-revisions.ts';
import { SiteError, SiteProblems } from './site-problems.ts';
import { draftDate } from './source-date.ts';
import { ASSET_DIR } from './site-assets.ts';

export interface SiteModel {
  pages: DocumentView[];
  portfolio: PortfolioView;
  /** Warnings of the bases and the calculation, as file:line:col: warning: ... lines. */
  warnings: string[];
  /** Each working draft's page with its basis and results (to print it). */
  drafts: { id: string; pagePath: string; basis: DesignBasis; results: Results }[];
}

export interface SiteOptions {
  /** The change summary between revisions; default: lib/archive/compare.ts over the basis texts. */
  changeSummary?: ChangeSummary;
  env?: NodeJS.ProcessEnv;
  /** Results calculated beforehand (lib/plant/batch.ts), by project id; others are calculated here. */
  results?: ReadonlyMap<string, CalculationOutcome>;
  /** Whether the build prints each draft to projects/<id>/document.pdf (the page links it). */
  draftPdfs?: boolean;
}

function pageOptions(path: string) {
  return { pagePath: path, assetBase: `${rootPrefix(path)}${ASSET_DIR}/`, indexHref: relativeHref(path, INDEX_PATH) };
}

/** The change summary of lib/archive/compare.ts, with each basis's YAML text for the structural diff. */
function compareWith(sources: Map<DesignBasis, string>): ChangeSummary {
  return (before, after) => compareRevisions({ ...before, source: sources.get(before.basis) }, { ...after, source: sources.get(after.basis) }).summary;
}

/** Loads every project of `root`; throws SiteError with every problem found. */
export function loadSiteModel(root: string, options: SiteOptions = {}): SiteModel {
  const problems = new SiteProblems();
  const checks = runAllChecks();
  const pages: DocumentView[] = [];
  const projects: PortfolioProject[] = [];
  const drafts: SiteModel['drafts'] = [];
  const cache = new ResultsCache(root);
  for (const id of listProjects(root)) {
    const shown = `projects/${id}/basis.yaml`;
    const loaded = loadBasisFile(join(root, 'projects', id, 'basis.yaml'), { id, displayPath: shown });
    problems.diagnostics(loaded.ok ? loaded.warnings : [...loaded.errors, ...loaded.warnings]);
    const sealed = readSealedRevisions(root, id, problems);
    if (!loaded.ok) continue;
    let results;
    const given = options.results?.get(id);
    if (given) {
      if (!given.ok) {
        if (given.diagnostics.length) problems.diagnostics(given.diagnostics);
        else problems.error(shown, given.message);
        continue;
      }
      results = given.results;
    } else {
      try {
        // The dev server rebuilds from here on every change: unchanged projects come from the cache.
        const key = resultsKey(readFileSync(join(root, 'projects', id, 'basis.yaml')), id, shown);
        results = cache.get(key);
        if (!results) {
          results = calculate(loaded.basis);
          cache.put(key, results);
        }
      } catch (error) {
        if (!(error instanceof BasisError)) throw error;
        problems.diagnostics(error.errors);
        continue;
      }
    }
    problems.diagnostics(results.notes.map((n) => locatedDiagnostic(loaded.basis, n.path, n.message, 'warning')));
    const draftPath = draftPagePath(id);
    const sources = new Map<DesignBasis, string>(sealed.map((s) => [s.basis, s.source]));
    sources.set(loaded.basis, readFileSync(join(root, 'projects', id, 'basis.yaml'), 'utf8'));
    const history = revisionHistory({
      sealed: sealed.map((s) => ({ revision: s.revision, basis: s.basis, results: s.results, manifest: s.manifest, path: revisionPagePath(id, s.revision) })),
      draft: { revision: loaded.basis.document.revision, status: loaded.basis.document.status, basis: loaded.basis, results, path: draftPath },
      changeSummary: options.changeSummary ?? compareWith(sources),
    });
    const draft: RevisionContext = { kind: 'draft', date: draftDate(loaded.basis, options.env), pdfHref: options.draftPdfs ? 'document.pdf' : null };
    pages.push(documentView({ basis: loaded.basis, results, revision: draft, history }, { ...pageOptions(draftPath), checks }));
    drafts.push({ id, pagePath: draftPath, basis: loaded.basis, results });
    sealed.forEach((s, i) => {
      const path = revisionPagePath(id, s.revision);
      const next = sealed[i + 1];
      const revision: RevisionContext = {
        kind: 'sealed',
        revision: s.revision,
        status: s.manifest.status,
        sealedOn: s.manifest.sealedOn,
        note: s.manifest.note,
        supersededBy: next ? next.revision : null,
        pdfHref: s.pdf ? 'document.pdf' : null,
      };
      pages.push(documentView({ basis: s.basis, results: s.results, revision, history }, { ...pageOptions(path), checks }));
    });
    const last = sealed[sealed.length - 1];
    projects.push({
      id,
      basis: loaded.basis,
      results,
      draftPath,
      issued: last ? { revision: last.revision, status: last.manifest.status, sealedOn: last.manifest.sealedOn, path: revisionPagePath(id, last.revision) } : null,
      revisionsSealed: sealed.length,
    });
  }
  if (problems.errors.length) throw new SiteError(problems.errors, problems.warnings);
  return { pages, portfolio: portfolioView(projects), warnings: problems.warnings, drafts };
}
