/**
 * The view model of the portfolio index: every project of the site with its technology, the
 * revision last issued and its status, the working draft (the draft of the next revision), the
 * headline numbers of the draft and how many assumptions are still open. Problems of a build that failed while the dev
 * server runs are shown on the same page.
 */
import type { DesignBasis } from '../basis/types.ts';
import type { IssueStatus } from '../basis/revisions.ts';
import { DRAFT_STATUS } from './revision.ts';
import type { Results } from '../plant/results-schema.ts';
import { ASSETS, assetLinks, type AssetLinks } from './assets.ts';
import { formatInteger, formatPercent, formatPower, formatQuantity } from './format.ts';
import { relativeHref } from './links.ts';

export const INDEX_PATH = 'index.html';

/** The part of a project's results its index row reads (the whole results satisfy it). */
export interface PortfolioResults {
  technology: Pick<Results['technology'], 'name' | 'mode'>;
  headline: Results['headline'];
  hazards: Pick<Results['hazards'], 'cautions'>;
}

export interface PortfolioProject {
  id: string;
  basis: DesignBasis;
  results: PortfolioResults;
  draftPath: string;
  issued: { revision: string; status: IssueStatus; issuedOn: string; path: string } | null;
  /** The revision the working draft becomes when next issued. */
  draftRevision: string;
  revisionsIssued: number;
}

export interface PortfolioRow {
  id: string;
  title: string;
  number: string;
  href: string;
  client: string;
  technology: string;
  mode: string;
  issued: { label: string; status: string; href: string; kind: 'issued' | 'approved' } | null;
  draft: { label: string; status: string };
  output: string;
  efficiency: string;
  cellVoltage: string;
  heat: string;
  openAssumptions: string;
  openCount: number;
  cautions: string;
}

export interface PortfolioView {
  pageTitle: string;
  assets: AssetLinks;
  rows: PortfolioRow[];
  summary: string;
  /** Problems of the last build (dev server only); empty in a built site. */
  problems: string[];
}

/** Keeps a number with its unit on one line in the narrow columns of the index. */
function together(text: string): string {
  return text.replace(/ (?=[A-Za-z%°Ω×])/g, '\u00a0').replace(/× /g, '×\u00a0');
}

/**
 * What the index keeps of a project: its row, formatted, and how many revisions it has issued.
 * A site model keeps only this for each project until the index is made, not the basis and
 * results the row is made from (some 30 kB a project in memory), so that the model of a large
 * portfolio stays small; the dev server keeps each project's entry and makes again only the
 * entry of the project that changed.
 */
export interface PortfolioEntry {
  row: PortfolioRow;
  revisionsIssued: number;
}

export function portfolioEntry(p: PortfolioProject): PortfolioEntry {
  return { row: row(p), revisionsIssued: p.revisionsIssued };
}

function row(p: PortfolioProject): PortfolioRow {
  const r = p.results;
  const h = r.headline;
  const power = r.technology.mode === 'power';
  const open = p.basis.assumptions.filter((a) => a.open).length;
  const cautions = r.hazards.cautions;
  const danger = cautions.filter((c) => c.severity === 'danger').length;
  return {
    id: p.id,
    title: p.basis.document.title,
    number: p.basis.document.number,
    href: relativeHref(INDEX_PATH, p.draftPath),
    client: p.basis.document.client,
    technology: r.technology.name,
    mode: power ? 'power' : 'electrolysis',
    issued: p.issued
      ? { label: `Rev. ${p.issued.revision}, ${p.issued.issuedOn}`, status: p.issued.status, href: relativeHref(INDEX_PATH, p.issued.path), kind: p.issued.status === 'approved' ? 'approved' : 'issued' }
      : null,
    draft: { label: `Rev. ${p.draftRevision}`, status: DRAFT_STATUS },
    output: together(power ? `${formatPower(h.netPower_W)} net` : h.hydrogenProduction_kg_per_day === null ? formatPower(h.stackPower_W) : `${formatQuantity(h.hydrogenProduction_kg_per_day, 'kg/day')} H₂`),
    efficiency: together(
      power
        ? h.electricalEfficiencyLhv === null ? '' : `${formatPercent(h.electricalEfficiencyLhv, 3)} LHV`
        : h.specificEnergy_kWh_per_kg === null ? '' : formatQuantity(h.specificEnergy_kWh_per_kg, 'kWh/kg'),
    ),
    cellVoltage: `${together(formatQuantity(h.cellVoltage_V, 'V'))} × ${formatInteger(h.cells)}`,
    heat: together(`${h.stackHeat_W >= 0 ? '' : 'needs '}${formatPower(Math.abs(h.stackHeat_W))}`),
    openAssumptions: `${open} of ${p.basis.assumptions.length}`,
    openCount: open,
    cautions: `${cautions.length}${danger ? ` (${danger} danger)` : ''}`,
  };
}

export function portfolioView(projects: readonly PortfolioEntry[], problems: string[] = []): PortfolioView {
  const issued = projects.reduce((n, p) => n + p.revisionsIssued, 0);
  const open = projects.reduce((n, p) => n + p.row.openCount, 0);
  return {
    pageTitle: 'Design bases',
    // No charts on the index: only our script, which marks the page ready for printing.
    assets: { stylesheets: assetLinks('assets/').stylesheets, scripts: [`assets/${ASSETS.chartsScript}`] },
    rows: projects.map((p) => p.row),
    summary: `${projects.length} design bases, ${issued} issued revision${issued === 1 ? '' : 's'}, ${open} open assumption${open === 1 ? '' : 's'} in the working drafts.`,
    problems,
  };
}
