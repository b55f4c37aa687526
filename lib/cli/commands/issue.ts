/**
 * `cellbasis issue ID --status STATUS [--rev REV] [--note TEXT] [--key ROLE=KEY ...] [--date YYYY-MM-DD]`:
 * issues a revision: writes projects/ID/issued/REV/ with the basis as issued, its results, the
 * document as one self-contained HTML file and as PDF, the manifest and a signature per key
 * (lib/archive/issue.ts), or refuses and changes nothing. A request that cannot be (a status
 * that is not issued, a revision that exists or does not follow, a bad date or key option)
 * exits 2; a basis with errors, an unmet rule of the status (each on a line of its own) or
 * missing Chromium exits 1.
 */
import type { Command } from '../command.ts';
import { optionalString, requireString } from '../command.ts';
import { formatDiagnostic } from '../../basis/diagnostics.ts';
import { ISSUE_STATUSES } from '../../basis/revisions.ts';

// The issuing, rendering and printing modules load only when an issue runs (they pull in Eleventy's
// Nunjucks and Playwright), so that every other command starts quickly.

export const issueCommand: Command = {
  name: 'issue',
  summary: 'issue a revision: the basis, results, HTML and PDF document and their manifest, signed, under projects/ID/issued/REV',
  usage: 'issue ID --status STATUS [--rev REV] [--note TEXT] [--key ROLE=KEY ...] [--date YYYY-MM-DD]',
  details:
    `STATUS: ${ISSUE_STATUSES.map((s) => `"${s}"`).join(', ')}. REV follows the last issued revision: A, B, C, ... (no I, O, Q, S, X, Z)\n` +
    'before approval, 0, 1, 2, ... after (ASME Y14.35 practice); the first is A or 0. Without --rev: the next letter, or 0\n' +
    'for the first approved revision. Issued for review needs the preparer with a date; issued for approval the checker too;\n' +
    'approved the approver too (neither the preparer), every open assumption accepted (accepted: { reason, by, date }) and\n' +
    'no error-level finding. Each unmet rule is named on a line of its own, and nothing is issued.\n' +
    'The issue date (--date, else SOURCE_DATE_EPOCH, else today, UTC; never in the future) is every timestamp of the files.\n' +
    'Each --key ROLE=KEY signs the manifest for that role of the sign-off with an Ed25519 private key: a key name made by\n' +
    'cellbasis keygen NAME (looked up in the key folder), or a key file.\n' +
    'Needs Chromium for the PDF. Never changes the working basis; a refused or interrupted issue leaves nothing.',
  positionals: [1, 1],
  options: [
    { name: 'status', type: 'string', value: 'STATUS', description: 'issued for review, issued for approval or approved' },
    { name: 'rev', type: 'string', value: 'REV', description: 'the revision to issue (default: the next one)' },
    { name: 'note', type: 'string', value: 'TEXT', description: 'what this revision is for (shown in the revision history)' },
    { name: 'key', type: 'string', value: 'ROLE=KEY', description: 'sign for ROLE (prepared, checked, approved) with this private key; repeat for each signer', multiple: true },
    { name: 'date', type: 'string', value: 'YYYY-MM-DD', description: 'the issue date (default: SOURCE_DATE_EPOCH, else today)' },
  ],
  async run(args, io) {
    const project = args.positionals[0]!;
    const status = requireString(args, 'status', 'issue');
    const revision = optionalString(args, 'rev');
    if (status === 'approved' && revision !== undefined && /^[A-Z]/.test(revision)) {
      io.err(`cellbasis: warning: revision ${revision} is a letter, the numbering before approval; an approved revision is usually numbered 0, 1, 2, ... (ASME Y14.35 practice)\n`);
    }
    const pauseAt = process.env.CELLBASIS_ISSUE_PAUSE;
    const { issueRevision, ISSUE_STEPS } = await import('../../archive/issue.ts');
    const { IssueRefused } = await import('../../archive/issue-rules.ts');
    const { issuedDocumentInput } = await import('../../archive/issued-document.ts');
    const { renderStandaloneHtml } = await import('../../publish/render.ts');
    const { issuePdfPrinter } = await import('../../publish/pdf.ts');
    let outcome;
    try {
      outcome = await issueRevision({
        cwd: io.cwd,
        project,
        ...(revision !== undefined ? { revision } : {}),
        status,
        note: optionalString(args, 'note'),
        keys: (args.values.key as string[] | undefined) ?? [],
        date: optionalString(args, 'date'),
        env: process.env,
        render: (input) => renderStandaloneHtml(issuedDocumentInput(input)),
        pdf: issuePdfPrinter,
        warn: (d) => io.err(`${formatDiagnostic(d)}\n`),
        tell: (line) => io.err(`cellbasis: ${line}\n`),
        ...(pauseAt && (ISSUE_STEPS as readonly string[]).includes(pauseAt) ? { pauseAt, onPause: (step: string) => io.err(`cellbasis: issue paused at ${step} (CELLBASIS_ISSUE_PAUSE)\n`) } : {}),
      });
    } catch (error) {
      // Each unmet rule on a line of its own, as check prints problems; then the one-line verdict.
      if (error instanceof IssueRefused) for (const line of error.lines) io.err(`cellbasis: issue: ${line}\n`);
      throw error;
    }
    const m = outcome.manifest;
    for (const name of outcome.removedTemporary) io.err(`cellbasis: removed projects/${project}/issued/${name}, left by an interrupted issue run\n`);
    for (const name of outcome.keptTemporary) io.err(`cellbasis: left projects/${project}/issued/${name} in place: named as a killed issue run's temporary folder, but not something cellbasis made; remove it yourself\n`);
    const signed = m.signatures.map((s) => `${s.role} by key ${s.key}`).join(', ');
    io.out(
      `issued ${outcome.display}/: revision ${m.revision}, ${m.status}, ${m.issuedOn}${m.previous ? ` (follows ${m.previous.revision})` : ''}${signed ? `, signed for ${signed}` : ', not signed'}\n` +
        `  ${Object.keys(m.files).join(', ')}, manifest.json${m.signatures.map((s) => `, manifest.${s.role}.sig`).join('')}\n` +
        `  manifest SHA-256 ${outcome.manifestSha256}\n`,
    );
    return 0;
  },
};
