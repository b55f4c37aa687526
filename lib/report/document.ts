/**
 * The view model of one design-basis document: everything its page shows, formatted, with the
 * mathematics pre-rendered, from a validated basis, its results (as calculated, or as issued), the
 * revision the page stands for and the project's revision history. The templates only display
 * what this returns; they do no arithmetic and make no choices of wording.
 */
import type { DesignBasis } from '../basis/types.ts';
import type { Results } from '../plant/results-schema.ts';
import { runAllChecks, type CheckResult } from '../verification/checks.ts';
import { toolVersion } from '../core/version.ts';
import { assetLinks, type AssetLinks } from './assets.ts';
import { EquationBook } from './equation-book.ts';
import { methodSection, type MethodStep } from './method.ts';
import { resultLines, type LineGroup } from './result-lines.ts';
import { appendices, outline, type AppendixEntry, type AppendixId, type OutlineEntry, type SectionId } from './outline.ts';
import { relativeHref } from './links.ts';
import type { RevisionContext } from './revision.ts';
import type { RevisionHistoryEntry } from './history.ts';
import { titleBlock, type TitleBlock } from './sections/title-block.ts';
import { summarySection, type SummarySection } from './sections/summary.ts';
import { inputsSection, type InputsSection } from './sections/inputs.ts';
import { assumptionsSection, type AssumptionsSection } from './sections/assumptions.ts';
import { blockFlowDiagram } from './flow-diagram.ts';
import type { TrustedHtml } from './trusted-html.ts';
import { figureTables, heatAndMaterialBalanceParts, plantTables, streamTable, type FigureTable } from './sections/results-tables.ts';
import { hazardsSection, type HazardsSection } from './sections/hazards.ts';
import { casesSection, type CasesSection } from './sections/cases.ts';
import { verificationSection, type VerificationSection } from './sections/verification.ts';
import { referencesSection, type ReferencesSection } from './sections/references.ts';
import { historySection, type HistorySection } from './sections/history-view.ts';
import { figures, type Figure } from './charts/figures.ts';
import type { Table } from './table.ts';
import { printMarks, type PrintMarks } from './print-css.ts';
import { linkTables, type TableLinks } from './table-links.ts';

export interface DocumentInput {
  basis: DesignBasis;
  results: Results;
  revision: RevisionContext;
  /** The project's revisions (lib/report/history.ts); [] for none. */
  history: readonly RevisionHistoryEntry[];
}

export interface DocumentOptions {
  /** URL of the assets folder relative to the page, e.g. "../../assets/". */
  assetBase: string;
  /** Site path of the page itself ("projects/x/index.html"), for links to other revisions; without it they are not linked. */
  pagePath?: string;
  /** Link to the portfolio index relative to the page, or null for a page that stands alone. */
  indexHref?: string | null;
  /** The reference checks (default: runAllChecks()), given once by a site build for all its pages. */
  checks?: readonly CheckResult[];
  /** How the page links the CSV of each table (lib/report/table-links.ts): files beside it (default), or inline for a page that stands alone. */
  tables?: TableLinks;
}

export interface DocumentView {
  lang: 'en';
  /** Site path of the page ("projects/x/index.html"), or "document.html" for a page that stands alone. */
  pagePath: string;
  /** The page title: document number and title. */
  pageTitle: string;
  paper: 'A4' | 'Letter';
  /** The CSS @page size keyword. */
  pageSize: 'A4' | 'letter';
  assets: AssetLinks;
  print: PrintMarks;
  indexHref: string | null;
  outline: OutlineEntry[];
  /** Each section's number, title and anchor by id, for the headings. */
  sections: Record<SectionId, OutlineEntry>;
  /** The appendices after the sections, lettered, and each by id. */
  appendices: AppendixEntry[];
  appendix: Record<AppendixId, AppendixEntry>;
  titleBlock: TitleBlock;
  purpose: string[];
  scope: string[];
  summary: SummarySection;
  inputs: InputsSection;
  assumptions: AssumptionsSection;
  method: MethodStep[];
  results: { groups: LineGroup[]; figures: FigureTable[]; streams: Table; plant: FigureTable[]; balance: Table[]; diagram: TrustedHtml | null };
  cases: CasesSection;
  figures: Figure[];
  hazards: HazardsSection;
  verification: VerificationSection;
  references: ReferencesSection;
  history: HistorySection;
}

/** Paragraphs of a block of user text: blank lines separate them, single line breaks are spaces. */
function paragraphs(text: string): string[] {
  return text
    .split(/\n\s*\n/)
    .map((p) => p.replace(/\s*\n\s*/g, ' ').trim())
    .filter((p) => p !== '');
}

export function documentView(input: DocumentInput, options: DocumentOptions): DocumentView {
  const { basis, results } = input;
  const book = new EquationBook();
  const checks = options.checks ?? runAllChecks();
  const hazards = results.hazards;
  const method = methodSection(results, book, outline().find((s) => s.id === 'method')!.number);
  const link = options.pagePath === undefined ? null : (path: string) => relativeHref(options.pagePath!, path);
  const title = titleBlock(basis, results, input.revision);
  const view: DocumentView = {
    lang: 'en',
    pagePath: options.pagePath ?? 'document.html',
    pageTitle: `${basis.document.number}: ${basis.document.title}`,
    paper: basis.document.paper,
    pageSize: basis.document.paper === 'A4' ? 'A4' : 'letter',
    assets: assetLinks(options.assetBase),
    print: printMarks(title.number, title.revision, title.statusMark),
    indexHref: options.indexHref ?? null,
    outline: outline(),
    sections: Object.fromEntries(outline().map((s) => [s.id, s])) as Record<SectionId, OutlineEntry>,
    appendices: appendices(),
    appendix: Object.fromEntries(appendices().map((a) => [a.id, a])) as Record<AppendixId, AppendixEntry>,
    titleBlock: title,
    purpose: paragraphs(basis.document.purpose),
    scope: paragraphs(basis.document.scope),
    summary: summarySection(results, basis, hazards, checks),
    inputs: inputsSection(basis, results),
    assumptions: assumptionsSection(basis),
    method,
    results: { groups: resultLines(results, basis, book), figures: figureTables(results), streams: streamTable(results), plant: plantTables(results), balance: heatAndMaterialBalanceParts(results), diagram: blockFlowDiagram(results) },
    cases: casesSection(results, basis, book),
    figures: figures(results),
    hazards: hazardsSection(results),
    verification: verificationSection(checks, toolVersion(), results.tool.version),
    references: referencesSection(basis, hazards),
    history: historySection(input.history, input.revision, link),
  };
  const revision = input.revision.kind === 'issued' ? `-rev-${input.revision.revision}` : '';
  linkTables(view, options.tables ?? 'files', `${results.project.id}${revision}`);
  return view;
}
