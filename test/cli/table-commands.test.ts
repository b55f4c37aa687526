// The command line's tables (issue 21, items 4 and 5): calc prints the sections a reviewer reads
// and --section chooses them; reaction takes reactions that pass no electrons and gives K and
// log10 K; equilibrium takes inert species and a print threshold; hazards filters by severity;
// every command that prints a table prints it as CSV with --csv. The CSV is read back by an
// RFC 4180 parser of its own (csv-parse) and its numbers compared with the --json output, so the
// spreadsheet gets the results' own numbers, unrounded, with the unit in the header.
import { describe, expect, it } from 'vitest';
import { parse } from 'csv-parse/sync';
import { run } from '../helpers/run-cli.ts';
import { CALC_SECTIONS } from '../../lib/cli/calc-sections.ts';
import { documentView } from '../../lib/report/document.ts';
import { tablesOf } from '../../lib/report/table-links.ts';
import { tableCsv } from '../../lib/report/table.ts';
import { CASES, scaffoldCase } from '../helpers/scaffold-cases.ts';
import { existsSync, readdirSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { projectsRoot, scaffoldText } from '../helpers/scaffold-basis.ts';

/** The records of a CSV text, by csv-parse, which also checks the CRLF line ends of RFC 4180. */
function csv(text: string): string[][] {
  expect(text.endsWith('\r\n')).toBe(true);
  return parse(text, { record_delimiter: '\r\n' }) as string[][];
}

/** The CSV's single data row as header → field. */
function oneRow(text: string): Record<string, string> {
  const [head, ...rows] = csv(text);
  expect(rows).toHaveLength(1);
  return Object.fromEntries(head!.map((h, i) => [h, rows[0]![i]!]));
}

const DEMO = 'thistlemere-sofc-chp';

describe('cellbasis calc', () => {
  it('prints the reviewer\'s sections by default, in order: headline, streams, efficiency, heat, carbon, findings and the rest', async () => {
    const r = await run(['calc', DEMO]);
    expect(r.code).toBe(0);
    const standard = CALC_SECTIONS.filter((s) => s.standard);
    expect(standard.map((s) => s.name)).toEqual(expect.arrayContaining(['headline', 'streams', 'efficiency', 'heat', 'carbon', 'findings']));
    const at = standard.map((s) => r.out.indexOf(`\n${s.title}\n`));
    expect(at.every((i) => i > 0)).toBe(true);
    expect([...at].sort((a, b) => a - b)).toEqual(at);
    // A section not printed by default is not printed.
    expect(r.out).not.toMatch(/\nHazard data of the substances\n/);
    const results = JSON.parse((await run(['calc', DEMO, '--json'])).out);
    expect(r.out).toMatch(new RegExp(`Cells / cell current / sum of the cell currents\\s+${results.headline.cells} /`));
  });

  it('--section prints the sections named, in the order given, each once', async () => {
    const r = await run(['calc', DEMO, '--section', 'substances,headline', '--section', 'substances']);
    expect(r.code).toBe(0);
    const a = r.out.indexOf('\nHazard data of the substances\n');
    const b = r.out.indexOf('\nHeadline numbers\n');
    expect(a).toBeGreaterThan(0);
    expect(b).toBeGreaterThan(a);
    expect(r.out.split('\nHazard data of the substances\n')).toHaveLength(2);
    expect(r.out).not.toMatch(/\nStreams\n/);
  });

  it('--section streams --csv: one record per stream, units in the header, the numbers of --json exactly', async () => {
    const results = JSON.parse((await run(['calc', DEMO, '--json'])).out);
    const r = await run(['calc', DEMO, '--section', 'streams', '--csv']);
    expect(r.code).toBe(0);
    const [head, ...rows] = csv(r.out);
    expect(head!.slice(0, 4)).toEqual(['Stream', 'Temperature [K]', 'Pressure [bar]', 'Molar flow [mol/s]']);
    expect(rows).toHaveLength(results.streams.length);
    for (const [i, s] of results.streams.entries()) {
      expect(rows[i]![0]).toBe(s.name);
      // Shortest round-trip decimal: Number() gives back the very double of the JSON.
      expect(Number(rows[i]![1])).toBe(s.temperature_K);
      expect(Number(rows[i]![3])).toBe(s.flow_mol_per_s);
      const h2o = head!.indexOf('Mole fraction H2O [mol/mol]');
      expect(rows[i]![h2o] === '' ? undefined : Number(rows[i]![h2o])).toBe(s.moleFractions.H2O);
    }
  });

  it('usage mistakes: exit 2, one line naming what to do', async () => {
    const cases: [string[], RegExp][] = [
      [['calc', DEMO, '--section', 'stream'], /no section "stream"; did you mean .*streams/],
      [['calc', DEMO, '--csv'], /--csv prints one table: name it with --section NAME/],
      [['calc', DEMO, '--csv', '--section', 'heat,carbon'], /--csv prints one table/],
      [['calc', DEMO, '--json', '--section', 'heat'], /--json prints the whole results object/],
      [['calc', DEMO, '--json', '--csv'], /give --json or --csv, not both/],
    ];
    for (const [argv, pattern] of cases) {
      const r = await run(argv);
      expect(r.code, argv.join(' ')).toBe(2);
      expect(r.err, argv.join(' ')).toMatch(pattern);
      expect(r.err.trim().split('\n')).toHaveLength(1);
    }
  });
});

describe.each(CASES)('every document table of the %s %s scaffold is a calc section', (technology, mode) => {
  it('and calc --section NAME --csv gives the document\'s CSV file byte for byte', async () => {
    const c = scaffoldCase(technology, mode);
    const view = documentView({ basis: c.basis, results: c.results, revision: { kind: 'draft', revision: 'A', lastIssued: null, date: null }, history: [] }, { assetBase: '' });
    const tables = tablesOf(view);
    expect(tables.length).toBeGreaterThan(10);
    for (const t of tables) {
      const section = CALC_SECTIONS.find((s) => s.name === t.name);
      expect(section, t.name).toBeDefined();
      const mine = await section!.table({ basis: c.basis, results: c.results });
      expect(tableCsv(mine!), t.name).toBe(tableCsv(t));
      // Every data column has a name.
      const [head] = csv(tableCsv(t));
      expect(head!.every((h) => h.trim() !== ''), t.name).toBe(true);
    }
  });
});

describe('the tables of the operating cases', () => {
  // The scaffold's commented example cases (turndown, end of life) put in: the document then has
  // the cases, their comparison, the envelope and the cases' curves, each a calc section too.
  // Only the cases block: the scaffold's commented plant block is indented the same way.
  const c = scaffoldCase('solid-oxide', 'power', (y) => y.replace(/^# cases:.*(?:\n# {3}.*)*/m, (block) => block.replace(/^# /gm, '')));
  it('are calc sections whose CSV is the document\'s, a record per case or envelope quantity', async () => {
    expect(c.results.cases.length).toBe(3);
    const view = documentView({ basis: c.basis, results: c.results, revision: { kind: 'draft', revision: 'A', lastIssued: null, date: null }, history: [] }, { assetBase: '' });
    const tables = tablesOf(view);
    for (const name of ['cases', 'case-comparison', 'envelope', 'case-curves']) {
      const t = tables.find((x) => x.name === name);
      expect(t, name).toBeDefined();
      const mine = await CALC_SECTIONS.find((s) => s.name === name)!.table({ basis: c.basis, results: c.results });
      expect(tableCsv(mine!), name).toBe(tableCsv(t!));
    }
    const [head, ...rows] = csv(tableCsv(tables.find((x) => x.name === 'envelope')!));
    expect(rows).toHaveLength(c.results.envelope.length);
    // The governing values are the results' own numbers, in the unit given beside each.
    const value = head!.indexOf('Governing value');
    const unit = head!.indexOf('Unit');
    c.results.envelope.forEach((e, i) => {
      expect(Number(rows[i]![value]), e.id).toBe(e.value);
      expect(rows[i]![unit], e.id).toBe(e.unit === '1' ? '' : e.unit);
    });
    const comparison = csv(tableCsv(tables.find((x) => x.name === 'case-comparison')!));
    expect(comparison.slice(1).map((r) => r[0])).toEqual(['base (sizing)', 'turndown', 'end-of-life']);
    const cellVoltage = comparison[0]!.indexOf('Cell voltage [V]');
    expect(Number(comparison[3]![cellVoltage])).toBe(c.results.cases[2]!.headline!.cellVoltage_V);
  });

  it('are absent from a document without cases, and calc says so', async () => {
    const plain = scaffoldCase('solid-oxide', 'power');
    const view = documentView({ basis: plain.basis, results: plain.results, revision: { kind: 'draft', revision: 'A', lastIssued: null, date: null }, history: [] }, { assetBase: '' });
    expect(tablesOf(view).map((t) => t.name)).not.toContain('envelope');
    expect(await CALC_SECTIONS.find((s) => s.name === 'envelope')!.table({ basis: plain.basis, results: plain.results })).toBeNull();
  });
});

describe('cellbasis reaction', () => {
  it('steam reforming, which passes no electrons, gets ΔH°, ΔS°, ΔG°, K and log10 K and no voltage', async () => {
    const r = await run(['reaction', 'CH4 + H2O -> CO + 3 H2', '--temperature', '1000 K']);
    expect(r.code).toBe(0);
    // NIST-JANAF (Chase 1998): ΔG° = −27.18 kJ/mol, log10 K = 1.420, K = 26.3 bar² (test/electrochem/chemical-reaction.test.ts).
    expect(r.out).toMatch(/ΔG°\s+-27\.1\d* kJ\/mol/);
    expect(r.out).toMatch(/equilibrium constant K\s+26\.3\d* bar\^2/);
    expect(r.out).toMatch(/log10 K\s+1\.42\d*/);
    expect(r.out).toMatch(/electrons n\s+none/);
    expect(r.out).not.toMatch(/reversible voltage/);
  });

  it('--json and --csv carry the same numbers; K of the shift at 1000 K is 1.43 (JANAF 1.438)', async () => {
    const o = JSON.parse((await run(['reaction', 'CO + H2O -> CO2 + H2', '--temperature', '1000K', '--json'])).out);
    expect(o.electrons).toBeNull();
    expect(o.reversibleVoltage_V).toBeNull();
    expect(o.equilibriumConstant).toBeCloseTo(1.438, 1);
    const row = oneRow((await run(['reaction', 'CO + H2O -> CO2 + H2', '--temperature', '1000K', '--csv'])).out);
    expect(Number(row['ΔG° [J/mol]'])).toBe(o.deltaG_J_per_mol);
    expect(Number(row['ΔH° [J/mol]'])).toBe(o.deltaH_J_per_mol);
    // The shift keeps the gas moles (Σν = 0): K has no unit.
    expect(Number(row['equilibrium constant K'])).toBe(o.equilibriumConstant);
    expect(Number(row['log10 K'])).toBe(o.log10EquilibriumConstant);
    expect(row['temperature [K]']).toBe('1000');
  });

  it('a cell reaction still gets its voltages, and K beside them', async () => {
    const r = await run(['reaction', 'H2 + 0.5 O2 -> H2O', '--temperature', '1000K', '--csv']);
    const row = oneRow(r.out);
    expect(Number(row['electrons n'])).toBe(2);
    // Larminie & Dicks, Fuel Cell Systems Explained, 2nd ed., Table 2.2 (read in a reproduction of its p. 33 at
    // scribd.com/document/389709165): ΔGf −199.6 kJ/mol at 600 °C and −188.6 at 800 °C, linear in T to 1000 K
    // −192.6 kJ/mol, over 2F 0.998 V.
    expect(Number(row['reversible voltage |ΔG°|/nF [V]'])).toBeCloseTo(0.998, 3);
    expect(Number(row['equilibrium constant K [bar^-0.5]'])).toBeGreaterThan(1e9);
  });
});

describe('cellbasis equilibrium', () => {
  const base = ['equilibrium', '--temperature', '800C', '--pressure', '1bar', '--feed', 'CH4=1, H2O=2, N2=3'];

  it('--inert N2 keeps nitrogen out of every reaction and marks it in the table', async () => {
    const r = await run([...base, '--inert', 'N2']);
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/N2 \(inert\)\s+0\.375286/);
    expect(r.out).not.toMatch(/NH3/);
    const o = JSON.parse((await run([...base, '--inert', 'N2', '--json', '--min-fraction', '0'])).out);
    expect(o.inert).toEqual(['N2']);
    expect(Object.keys(o.moleFractions).filter((s) => /N/.test(s))).toEqual(['N2']);
  });

  it('lists species down to 1e-6 by default, says how many it leaves out, and --min-fraction 0 lists all', async () => {
    const all = Object.keys(JSON.parse((await run([...base, '--json'])).out).moleFractions).length;
    const r = await run(base);
    const listed = csv((await run([...base, '--csv'])).out).slice(1);
    expect(listed.every((row) => Number(row[1]) >= 1e-6)).toBe(true);
    expect(r.out).toMatch(new RegExp(`\\(${all - listed.length} species below a mole fraction of 1e-6 left out; --min-fraction 0 lists them\\)`));
    expect(csv((await run([...base, '--csv', '--min-fraction', '0'])).out).slice(1)).toHaveLength(all);
    const tight = csv((await run([...base, '--csv', '--min-fraction', '0.05'])).out);
    expect(tight[0]).toEqual(['Species', 'Mole fraction [mol/mol]', 'Amount per mole of feed [mol/mol]']);
    expect(tight.slice(1).map((row) => row[0])).toEqual(['H2', 'N2', 'H2O', 'CO']);
  });

  it('bad --inert and --min-fraction: exit 2, one line', async () => {
    const cases: [string[], RegExp][] = [
      [[...base, '--min-fraction', 'tiny'], /--min-fraction: expected a mole fraction from 0 to 1/],
      [[...base, '--min-fraction', '2'], /--min-fraction: expected a mole fraction from 0 to 1/],
      [[...base, '--inert', 'Ar'], /inert species Ar is not in the feed/],
      [[...base, '--inert', 'Nitrogen'], /unknown species "Nitrogen"/],
    ];
    for (const [argv, pattern] of cases) {
      const r = await run(argv);
      expect(r.code, argv.join(' ')).toBe(2);
      expect(r.err, argv.join(' ')).toMatch(pattern);
      expect(r.err.trim().split('\n')).toHaveLength(1);
    }
  });
});

describe('cellbasis hazards', () => {
  it('--severity keeps the cautions of that level and graver ones, in --json, the text and the CSV', async () => {
    const full = JSON.parse((await run(['hazards', DEMO, '--json'])).out);
    const severities = full.cautions.map((c: { severity: string }) => c.severity);
    expect(new Set(severities)).toEqual(new Set(['danger', 'warning', 'caution']));
    const count = (levels: string[]) => severities.filter((s: string) => levels.includes(s)).length;
    const warning = JSON.parse((await run(['hazards', DEMO, '--json', '--severity', 'warning'])).out);
    expect(warning.cautions.map((c: { severity: string }) => c.severity).sort()).toEqual(severities.filter((s: string) => s !== 'caution').sort());
    const rows = csv((await run(['hazards', DEMO, '--csv', '--severity', 'Danger'])).out);
    // A hazard register: the caution's whole text is in the CSV (not in the text table's columns).
    expect(rows[0]).toEqual(['Severity', 'Caution', 'Text', 'Id', 'Raised by', 'Standards']);
    expect(rows.slice(1).map((r) => r[0])).toEqual(Array(count(['danger'])).fill('danger'));
    const dangers = full.cautions.filter((c: { severity: string }) => c.severity === 'danger');
    expect(rows.slice(1).map((r) => r[2])).toEqual(dangers.map((c: { text: string }) => c.text));
    const text = await run(['hazards', DEMO, '--severity', 'danger']);
    expect(text.out).toMatch(/^HAZARDS\n\nInformational only/);
    for (const c of full.cautions) {
      if (c.severity === 'danger') expect(text.out).toContain(c.title);
      else expect(text.out).not.toContain(c.title);
    }
    const left = count(['warning', 'caution']);
    expect(text.out).toMatch(new RegExp(`\\(${left} cautions below danger left out\\)`));
  });

  it('--section substances --csv prints the substances table, and a bad level or table is a usage error', async () => {
    const rows = csv((await run(['hazards', DEMO, '--section', 'substances', '--csv'])).out);
    expect(rows.length).toBeGreaterThan(3);
    expect(rows[0]!.some((h) => / \[.+\]$/.test(h))).toBe(true);
    for (const [argv, pattern] of [
      [['hazards', DEMO, '--severity', 'high'], /--severity: no level "high".*the levels, gravest first: danger, warning, caution/],
      [['hazards', DEMO, '--section', 'cations'], /no section "cations"; did you mean .*cautions/],
    ] as [string[], RegExp][]) {
      const r = await run(argv);
      expect(r.code, argv.join(' ')).toBe(2);
      expect(r.err).toMatch(pattern);
    }
  });
});

describe('CSV from the other table commands', () => {
  it('species --list --csv: one record per species, molar mass in kg/mol', async () => {
    const list = JSON.parse((await run(['species', '--list', '--json'])).out);
    const rows = csv((await run(['species', '--list', '--csv'])).out);
    expect(rows[0]).toEqual(['species', 'NASA record', 'phase', 'formula', 'molar mass [kg/mol]', 'lowest temperature [K]', 'highest temperature [K]']);
    expect(rows).toHaveLength(list.length + 1);
    // H2O: 18.01528 g/mol (IUPAC standard atomic weights; fact of the trade).
    const h2o = rows.find((r) => r[0] === 'H2O')!;
    expect(Number(h2o[4])).toBeCloseTo(0.01801528, 7);
  });

  it('species NAME --csv and steam-limit --csv: the numbers of --json', async () => {
    const o = JSON.parse((await run(['species', 'H2O', '--temperature', '1000 K', '--json'])).out);
    const row = oneRow((await run(['species', 'H2O', '--temperature', '1000 K', '--csv'])).out);
    expect(Number(row['cp [J/(mol K)]'])).toBe(o.cp_J_per_mol_K);
    const args = ['steam-limit', '--fuel', 'CH4=1', '--temperature', '800C', '--pressure', '1bar'];
    const s = JSON.parse((await run([...args, '--json'])).out);
    const limit = oneRow((await run([...args, '--csv'])).out);
    expect(Number(limit['minimum steam-to-carbon ratio'])).toBe(s.minimumSteamToCarbon);
    expect(Number(limit['pressure [bar]'])).toBe(1);
  });
});

describe('help of the new options', () => {
  const cases: [string, RegExp[]][] = [
    ['calc', [/--section NAME/, /--csv/, /headline\s+Headline numbers \(printed by default\)/, /substances\s+Hazard data of the substances\n/]],
    ['reaction', [/--csv/, /equilibrium constant K = exp\(−ΔG°\/RT\) with log10 K/, /a reaction without O2 \(reforming, shift\) passes none/]],
    ['equilibrium', [/--inert SPECIES/, /--min-fraction X/, /default 1e-6/, /--csv/]],
    ['hazards', [/--severity LEVEL/, /danger, warning, caution/, /--section NAME/, /--csv/]],
    ['species', [/--csv/]],
    ['steam-limit', [/--csv/]],
    ['compare', [/--section NAME/, /--csv/, /inputs \(the inputs changed, as written and in SI\)/]],
  ];
  for (const [command, patterns] of cases) {
    it(`${command} --help names its options`, async () => {
      const r = await run([command, '--help']);
      expect(r.code).toBe(0);
      for (const p of patterns) expect(r.out).toMatch(p);
    });
  }
});

describe('compare tables', () => {
  it('the changed inputs and headline results as CSV: as written, and in SI with the unit of each row', async () => {
    const { compareRevisions } = await import('../../lib/archive/compare.ts');
    const { changeTable } = await import('../../lib/cli/commands/compare.ts');
    const before = scaffoldCase('solid-oxide', 'power');
    const after = scaffoldCase('solid-oxide', 'power', (y) => y.replace('value: "800 C", source: A1', 'value: "780 C", source: A1'));
    const changes = compareRevisions({ ...before, revision: 'A' }, { ...after, revision: 'B' });
    const inputs = csv(tableCsv(changeTable(changes, 'inputs')));
    expect(inputs[0]).toEqual(['Input', 'Old as written', 'Old source', 'Old in SI', 'New as written', 'New source', 'New in SI', 'Field', 'SI unit', 'Change']);
    expect(inputs.slice(1)).toEqual([['operating temperature', '800 C', 'A1', '1073.15', '780 C', 'A1', '1053.15', 'conditions.operating-temperature', 'K', 'changed']]);
    const [head, ...rows] = csv(tableCsv(changeTable(changes, 'results')));
    expect(head).toEqual(['Result', 'Key', 'SI unit', 'Old in SI', 'New in SI', 'Change in SI', 'Relative change']);
    const nernst = rows.find((r) => r[1] === 'meanNernst_V')!;
    expect(nernst[2]).toBe('V');
    expect(Number(nernst[3])).toBe(before.results.headline.meanNernst_V);
    expect(Number(nernst[4])).toBe(after.results.headline.meanNernst_V);
    expect(Number(nernst[5])).toBe(after.results.headline.meanNernst_V - before.results.headline.meanNernst_V);
  });
});

describe('cellbasis check --csv', () => {
  it('one record per valid basis of the portfolio: its summary and its headline numbers, unrounded, equal to calc --json', async () => {
    const r = await run(['check', '--csv']);
    expect(r.code).toBe(0);
    const [head, ...rows] = csv(r.out);
    const ids = readdirSync('projects').filter((id) => existsSync(join('projects', id, 'basis.yaml'))).sort();
    expect(rows.map((row) => row[0])).toEqual(ids);
    const col = (name: string) => head!.indexOf(name);
    expect(col('Cell voltage [V]')).toBeGreaterThan(0);
    for (const row of rows) {
      const results = JSON.parse((await run(['calc', row[0]!, '--json'])).out);
      expect(row[col('file')]).toBe(`projects/${row[0]}/basis.yaml`);
      expect(Number(row[col('Cell voltage [V]')])).toBe(results.headline.cellVoltage_V);
      expect(Number(row[col('Operating temperature [K]')])).toBe(results.conditions.temperature_K);
      // A quantity of power mode only is empty for an electrolyser, and the other way round.
      const production = row[col('Hydrogen production per day [kg/day]')];
      expect(col('Hydrogen production per day [kg/day]')).toBeGreaterThan(0);
      expect(production === '').toBe(results.technology.mode === 'power');
    }
    // The text of the plain check (the "valid" lines) is not mixed into the CSV.
    expect(r.out).not.toMatch(/: valid/);
  });

  it('a basis with errors is left out of the CSV, its errors on stderr, exit 1', async () => {
    const root = projectsRoot('check-csv', {
      good: scaffoldText('solid-oxide', 'power', 'good'),
      bad: scaffoldText('solid-oxide', 'power', 'bad', { 'operating-point.fuel-utilization': 1.7 }),
    });
    try {
      const r = await run(['check', '--csv'], root);
      expect(r.code).toBe(1);
      const [, ...rows] = csv(r.out);
      expect(rows.map((row) => row[0])).toEqual(['good']);
      expect(r.err).toMatch(/projects\/bad\/basis\.yaml:\d+:\d+: operating-point\.fuel-utilization/);
    } finally {
      rmSync(root, { recursive: true, force: true });
    }
  });
});
