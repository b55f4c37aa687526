/**
 * `cellbasis compare ID REV_A REV_B [--json]`: what changed from one revision to another
 * (either may be `draft`, the working basis): inputs as written, other fields, assumptions,
 * references, headline results, operating cases and the envelope (lib/archive/compare.ts). A readable table, or with --json
 * the RevisionChanges object.
 */
import type { Command } from '../command.ts';
import { JSON_OPTION } from '../command.ts';
import { grid, json } from '../../core/plain-text.ts';
import { formatDiagnostic } from '../../basis/diagnostics.ts';
import type { RevisionChanges } from '../../archive/compare.ts';

function sections(changes: RevisionChanges): string {
  const out: string[] = [];
  const lines = (title: string, list: { text: string }[]) => (list.length ? [`${title}\n${list.map((c) => `  ${c.text}\n`).join('')}`] : []);
  if (changes.inputs.length) {
    out.push(`inputs changed\n${grid(['input', 'old', 'new', 'field'], changes.inputs.map((c) => [c.label, oldInput(c), newInput(c), c.path]))}`);
  }
  out.push(...lines('other fields changed', changes.fields), ...lines('assumptions', changes.assumptions), ...lines('references', changes.references));
  if (changes.results.length) {
    out.push(`headline results changed\n${grid(['result', 'old', 'new', 'change'], changes.results.map((r) => [r.label, r.oldText, r.newText, r.changeText]))}`);
  }
  out.push(...lines('operating cases', changes.cases), ...lines('envelope', changes.envelope));
  return out.join('\n');
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
  usage: 'compare ID REV_A REV_B [--json]',
  details:
    'REV_A and REV_B are issued revisions (A, B, 0, ...) or "draft" for the working basis (the draft of the next revision);\n' +
    'issued revisions are read as issued, the draft is calculated now. With --json prints one object: inputs, fields, assumptions, references,\n' +
    'results (old, new, delta and relative change in SI), cases, envelope and summary lines.',
  positionals: [3, 3],
  options: [JSON_OPTION],
  async run(args, io) {
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
    io.out(`projects/${project}: ${a.label} → ${b.label}\n\n`);
    io.out(changes.unchanged ? 'no changes\n' : sections(changes));
    return 0;
  },
};
