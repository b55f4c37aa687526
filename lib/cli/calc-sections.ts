/**
 * The sections `cellbasis calc` prints: one entry per section, its name (what --section takes,
 * and the file name of the table's CSV in the document), its title, whether calc prints it when
 * no section is chosen, and how its table is made from the basis and its results. Each table is
 * built by lib/report, as the document shows it, so the text is the document's and the CSV the
 * document's file byte for byte. Every table of a document has an entry here (a test checks it,
 * test/cli/table-commands.test.ts, for every scaffold technology and mode); a new table or
 * results section is one more entry.
 */
import type { DesignBasis } from '../basis/types.ts';
import type { Results } from '../plant/results-schema.ts';
import type { Table } from '../report/table.ts';

// The modules that build the tables load when a section is printed, not when the command starts.
const summary = () => import('../report/sections/summary.ts');
const inputs = () => import('../report/sections/inputs.ts');
const resultsTables = () => import('../report/sections/results-tables.ts');
const hazards = () => import('../report/sections/hazards.ts');
const charts = () => import('../report/charts/figures.ts');
const cases = () => import('../report/sections/cases.ts');

export interface CalcInput {
  basis: DesignBasis;
  results: Results;
}

export interface CalcSection {
  name: string;
  title: string;
  /** Printed by calc when no --section is given: what a reviewer reads first. */
  standard: boolean;
  /** The section's table, or null where the results have none (the carbon figures of a fuel without carbon). */
  table(input: CalcInput): Promise<Table | null>;
}

/** The figure table of the results named `name`, or null. */
function resultsTable(name: string) {
  return async ({ results }: CalcInput): Promise<Table | null> => (await resultsTables()).figureTables(results).find((f) => f.table.name === name)?.table ?? null;
}

/** The table of the plant around the stack named `name`, or null where the plant has none (a power plant's duties, oxidiser and balance). */
function plantTable(name: string) {
  return async ({ results }: CalcInput): Promise<Table | null> => (await resultsTables()).plantTables(results).find((f) => f.table.name === name)?.table ?? null;
}

/** The data table of the chart named `name`, or null where the figure is a statement. */
function chartTable(name: string) {
  return async ({ results }: CalcInput): Promise<Table | null> => {
    for (const f of (await charts()).figures(results)) if (f.kind === 'chart' && f.data.table.name === name) return f.data.table;
    return null;
  };
}

/** The checks of the calculation library: every check (the document's appendix) or their summary by group (its body). */
function verificationTable(which: 'table' | 'summary') {
  return async ({ results }: CalcInput): Promise<Table> => {
    const [{ verificationSection }, { runAllChecks }, { toolVersion }] = await Promise.all([import('../report/sections/verification.ts'), import('../verification/checks.ts'), import('../core/version.ts')]);
    return verificationSection(runAllChecks(), toolVersion(), results.tool.version)[which];
  };
}

export const CALC_SECTIONS: readonly CalcSection[] = [
  { name: 'headline', title: 'Headline numbers', standard: true, table: async ({ results }) => (await summary()).headlineTable(results) },
  { name: 'electrochemistry', title: 'Electrochemistry', standard: true, table: resultsTable('electrochemistry') },
  { name: 'operating-point', title: 'Operating point', standard: true, table: resultsTable('operating-point') },
  { name: 'efficiency', title: 'Efficiency figures', standard: true, table: resultsTable('efficiency') },
  { name: 'heat', title: 'Heat balance', standard: true, table: resultsTable('heat') },
  { name: 'carbon', title: 'Carbon deposition', standard: true, table: resultsTable('carbon') },
  { name: 'streams', title: 'Streams', standard: true, table: async ({ results }) => (await resultsTables()).streamTable(results) },
  { name: 'electrical-layout', title: 'Electrical layout', standard: true, table: plantTable('electrical-layout') },
  { name: 'plant-duties', title: 'Fuel and air preparation', standard: true, table: plantTable('plant-duties') },
  { name: 'oxidiser-and-heat-recovery', title: 'Off-gas oxidiser, heat recovery and combined heat and power', standard: true, table: plantTable('oxidiser-and-heat-recovery') },
  { name: 'plant-energy-balance', title: 'Energy balance of the plant', standard: false, table: plantTable('plant-energy-balance') },
  { name: 'electrolysis-plant', title: 'Feed preparation, heat supply, hydrogen compression and specific energy', standard: true, table: plantTable('electrolysis-plant') },
  { name: 'electrolysis-plant-energy-balance', title: 'Energy balance of the electrolysis plant', standard: false, table: plantTable('electrolysis-plant-energy-balance') },
  { name: 'heat-and-material-balance', title: 'Heat-and-material balance', standard: false, table: async ({ results }) => (await resultsTables()).heatAndMaterialBalance(results) },
  // The document splits a balance of more than seven streams into parts (lib/report/sections/results-tables.ts), each with its own CSV.
  ...[1, 2].map((n) => ({ name: `heat-and-material-balance-${n}`, title: `Heat-and-material balance, part ${n}`, standard: false, table: async ({ results }: { results: Results }) => (await resultsTables()).heatAndMaterialBalanceParts(results).find((t) => t.name === `heat-and-material-balance-${n}`) ?? null })),
  { name: 'findings', title: 'Findings for the reviewer', standard: true, table: async ({ basis, results }) => (await summary()).findingsTable(results, basis) },
  { name: 'cell-and-feeds', title: 'The cell and its feeds', standard: false, table: async ({ basis, results }) => (await inputs()).inputsSection(basis, results).description },
  { name: 'inputs', title: 'Design inputs', standard: false, table: async ({ basis, results }) => (await inputs()).inputsSection(basis, results).values },
  { name: 'cases', title: 'The operating cases', standard: false, table: async ({ results }) => (await cases()).caseTables(results)?.definitions ?? null },
  { name: 'case-comparison', title: 'Headline numbers per case', standard: false, table: async ({ results }) => (await cases()).caseTables(results)?.comparison ?? null },
  { name: 'envelope', title: 'Envelope of the operating cases', standard: false, table: async ({ results }) => (await cases()).caseTables(results)?.envelope ?? null },
  { name: 'voltage-temperature', title: 'Reversible and thermoneutral voltage against temperature (chart data)', standard: false, table: chartTable('voltage-temperature') },
  { name: 'efficiency-temperature', title: 'Efficiency limits against temperature (chart data)', standard: false, table: chartTable('efficiency-temperature') },
  { name: 'nernst-path', title: 'Nernst voltage along the fuel path (chart data)', standard: false, table: chartTable('nernst-path') },
  { name: 'current-cell', title: 'Local current density and Nernst voltage along the cell (chart data)', standard: false, table: chartTable('current-cell') },
  { name: 'composition-path', title: 'Gas composition along the fuel path (chart data)', standard: false, table: chartTable('composition-path') },
  { name: 'carbon-steam', title: 'Carbon activity against steam-to-carbon ratio (chart data)', standard: false, table: chartTable('carbon-steam') },
  { name: 'polarisation', title: 'Cell voltage against current density (chart data)', standard: false, table: chartTable('polarisation') },
  { name: 'heat-power', title: 'Heat release and power against current density (chart data)', standard: false, table: chartTable('heat-power') },
  { name: 'stack-temperature', title: 'The stack at other temperatures (chart data)', standard: false, table: chartTable('stack-temperature') },
  { name: 'case-curves', title: 'Cell voltage and efficiency of the operating cases (chart data)', standard: false, table: chartTable('case-curves') },
  { name: 'sensitivity-voltage', title: 'Sensitivity of the cell voltage (chart data)', standard: false, table: chartTable('sensitivity-voltage') },
  { name: 'sensitivity-efficiency', title: 'Sensitivity of the efficiency (chart data)', standard: false, table: chartTable('sensitivity-efficiency') },
  { name: 'sensitivity-heat', title: 'Sensitivity of the stack heat (chart data)', standard: false, table: chartTable('sensitivity-heat') },
  { name: 'energy-flow', title: "Where the fuel's energy goes (chart data)", standard: false, table: chartTable('energy-flow') },
  { name: 'electrolysis-energy-flow', title: "Where the electrolysis plant's electricity and heat go (chart data)", standard: false, table: chartTable('electrolysis-energy-flow') },
  { name: 'cautions', title: 'Hazard cautions', standard: false, table: async ({ results }) => (await hazards()).cautionsTable(results.hazards) },
  { name: 'hazard-streams', title: 'Hazard indicators of the streams', standard: false, table: async ({ results }) => (await hazards()).hazardStreamTable(results.hazards.streams) },
  { name: 'substances', title: 'Hazard data of the substances', standard: false, table: async ({ results }) => (await hazards()).substancesTable(results.hazards.substances) },
  { name: 'verification-summary', title: 'Checks of the calculation library against published values, by group', standard: false, table: verificationTable('summary') },
  { name: 'verification', title: 'Checks of the calculation library against published values (appendix)', standard: false, table: verificationTable('table') },
];

/** The lines of `calc --help` that list the sections. */
export function sectionHelp(): string {
  const width = Math.max(...CALC_SECTIONS.map((s) => s.name.length)) + 2;
  return CALC_SECTIONS.map((s) => `  ${s.name.padEnd(width)}${s.title}${s.standard ? ' (printed by default)' : ''}`).join('\n');
}
