/**
 * `cellbasis compare ID REV_A REV_B [--section NAME]... [--csv | --json]`: what changed from one
 * revision to another (either may be `draft`, the working basis): inputs as written, other
 * fields, assumptions, references, headline results, operating cases and the envelope
 * (lib/archive/compare.ts), and what it could not compare because the results of one revision,
 * issued by another version of cellbasis, do not carry it, or its basis no longer loads (its
 * YAML is then compared field by field). A readable table, with --csv the changed inputs or headline results
 * as CSV, or with --json the RevisionChanges object.
 */
import type { Command } from '../command.ts';
import { JSON_OPTION } from '../command.ts';
import { json } from '../../core/plain-text.ts';
import { UserError } from '../../core/errors.ts';
import { formatDiagnostic } from '../../basis/diagnostics.ts';
import type { InputChange, ResultChange, RevisionChanges } from '../../archive/compare.ts';
import { recordsTable, type RecordColumn, type Table } from '../../report/table.ts';
import { CSV_OPTION, checkOutputOptions, chosenSections, printTable, sectionOption, tableText } from '../table-output.ts';

/** The tables --section chooses from, and changeTable makes. */
const TABLES = ['inputs', 'results'] as const;
type TableName = (typeof TABLES)[number];

const text = <T>(head: string, get: (item: T) => string, name = head): RecordColumn<T> => ({ head, align: 'left', text: get, data: [{ name, unit: '', value: get }] });
const datum = <T>(name: string, unit: string, value: (item: T) => string | number | null): RecordColumn<T>['data'][number] => ({ name, unit, value });

/**
 * The changed inputs: as written on each side (the text columns), and in the data also their SI
 * values, whose unit is the row's own (one input is a temperature, the next a pressure), so the
 * unit is a column of its own.
 */
function inputsTable(changes: readonly InputChange[]): Table {
  return recordsTable<InputChange>({
    name: 'inputs-changed',
    title: 'Inputs changed',
    columns: [
      text('input', (c) => c.label, 'Input'),
      {
        head: 'old',
        align: 'right',
        text: oldInput,
        data: [datum('Old as written', '', (c) => c.old?.text ?? null), datum('Old source', '', (c) => c.old?.source ?? null), datum('Old in SI', '', (c) => c.old?.si ?? null)],
      },
      {
        head: 'new',
        align: 'right',
        text: newInput,
        data: [datum('New as written', '', (c) => c.new?.text ?? null), datum('New source', '', (c) => c.new?.source ?? null), datum('New in SI', '', (c) => c.new?.si ?? null)],
      },
      { head: 'field', align: 'right', text: (c) => c.path, data: [datum('Field', '', (c) => c.path), datum('SI unit', '', (c) => (c.new ?? c.old)?.siUnit ?? null), datum('Change', '', (c) => c.kind)] },
    ],
    groups: [{ items: changes }],
  });
}

/** The changed headline results: as the document writes them, and in the data old, new, delta and relative change in the row's SI unit. */
function resultsTable(changes: readonly ResultChange[]): Table {
  return recordsTable<ResultChange>({
    name: 'results-changed',
    title: 'Headline results changed',
    columns: [
      { head: 'result', align: 'left', text: (r) => r.label, data: [datum('Result', '', (r) => r.label), datum('Key', '', (r) => r.key), datum('SI unit', '', (r) => r.unit)] },
      { head: 'old', align: 'right', text: (r) => r.oldText, data: [datum('Old in SI', '', (r) => r.old)] },
      { head: 'new', align: 'right', text: (r) => r.newText, data: [datum('New in SI', '', (r) => r.new)] },
      { head: 'change', align: 'right', text: (r) => r.changeText, data: [datum('Change in SI', '', (r) => r.delta), datum('Relative change', '', (r) => r.relative)] },
    ],
    groups: [{ items: changes }],
  });
}

export function changeTable(changes: RevisionChanges, name: TableName): Table {
  return name === 'inputs' ? inputsTable(changes.inputs) : resultsTable(changes.results);
}

function sections(changes: RevisionChanges): string {
  const out: string[] = [];
  const lines = (title: string, list: { text: string }[]) => (list.length ? [`${title}\n${list.map((c) => `  ${c.text}\n`).join('')}`] : []);
  if (changes.inputs.length) out.push(`inputs changed\n${tableText(inputsTable(changes.inputs), null)}`);
  out.push(...lines('other fields changed', changes.fields), ...lines('assumptions', changes.assumptions), ...lines('references', changes.references));
  if (changes.results.length) out.push(`headline results changed\n${tableText(resultsTable(changes.results), null)}`);
  out.push(...lines('operating cases', changes.cases), ...lines('envelope', changes.envelope));
  return out.join('\n');
}

/** What the results of one side do not carry (issued by another version of cellbasis), so was not compared. */
function notCompared(changes: RevisionChanges): string {
  if (!changes.notCompared.length) return '';
  return `${changes.unchanged ? '' : '\n'}not compared (one revision does not carry it, or this version does not read it)\n${changes.notCompared.map((n) => `  ${n}\n`).join('')}`;
}

function withSource(text: string | undefined, source: string | undefined): string {
  if (text === undefined) return '(none)';
  return source ? `${text} [${source}]` : text;
}

const oldInput = (c: RevisionChanges['inputs'][number]) => withSource(c.old?.text, c.old?.source);
const newInput = (c: RevisionChanges['inputs'][number]) => withSource(c.new?.text, c.new?.source);

export const compareCommand: Command = {
  name: 'compare',
  summary: 'what changed between two revisions of a basis (inputs, assumptions, references, headline results)',
  usage: 'compare ID REV_A REV_B [--section NAME]... [--csv | --json]',
  details:
    'REV_A and REV_B are issued revisions (A, B, 0, ...) or "draft" for the working basis (the draft of the next revision);\n' +
    'issued revisions are read as issued, the draft is calculated now. With --json prints one object: inputs, fields, assumptions, references,\n' +
    'results (old, new, delta and relative change in SI), cases, envelope and summary lines.\n' +
    'Tables for --section: inputs (the inputs changed, as written and in SI) and results (the headline results changed,\n' +
    'old, new, delta and relative change in SI, the SI unit of each row in a column of its own); --csv prints one of\n' +
    'them, the results unless --section names the inputs.',
  positionals: [3, 3],
  options: [sectionOption('table (inputs, results)'), CSV_OPTION, JSON_OPTION],
  async run(args, io) {
    checkOutputOptions(args, 'compare');
    const chosen = chosenSections(args, TABLES, 'compare') as TableName[] | null;
    if (args.values.json && chosen) throw new UserError('compare: --json prints the whole comparison; --section chooses the tables of the text or CSV output (see cellbasis compare --help)');
    if (args.values.csv && chosen && chosen.length !== 1) throw new UserError('compare: --csv prints one table: name one with --section (see cellbasis compare --help)');
    const [project, revA, revB] = args.positionals as [string, string, string];
    const warn = (d: Parameters<typeof formatDiagnostic>[0]) => io.err(`${formatDiagnostic(d)}\n`);
    const { readRevisionSide } = await import('../../archive/revision-sides.ts');
    const { compareRevisions } = await import('../../archive/compare.ts');
    const note = (text: string) => io.err(`cellbasis: note: ${text}\n`);
    const a = readRevisionSide(io.cwd, project, revA, warn, note);
    const b = readRevisionSide(io.cwd, project, revB, warn);
    const changes = compareRevisions(a, b);
    if (args.values.json) {
      io.out(json({ project, ...changes, from: { ...changes.from, label: a.label }, to: { ...changes.to, label: b.label } }));
      return 0;
    }
    if (args.values.csv) {
      for (const n of changes.notCompared) note(`not compared: ${n}`);
      printTable(io, args, changeTable(changes, chosen?.[0] ?? 'results'));
      return 0;
    }
    io.out(`projects/${project}: ${a.label} → ${b.label}\n\n`);
    if (chosen) {
      io.out(chosen.map((name) => tableText(changeTable(changes, name))).join('\n'));
      return 0;
    }
    const nothing = changes.notCompared.length ? 'no changes in what both revisions carry\n' : 'no changes\n';
    io.out(`${changes.unchanged ? nothing : sections(changes)}${notCompared(changes)}`);
    return 0;
  },
};
