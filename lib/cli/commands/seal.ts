/**
 * `cellbasis seal ID --rev REV --status STATUS [--note TEXT] [--key PEM] [--date YYYY-MM-DD]`:
 * issues a revision: writes projects/ID/sealed/REV/ with the basis as sealed, its results, the
 * document as one self-contained HTML file and as PDF, and the manifest (lib/archive/seal.ts),
 * or refuses and changes nothing. Basis errors exit 1; a revision that exists or does not
 * follow, a status that is not issued, or a bad date exit 2; missing Chromium exits 1.
 */
import type { Command } from '../command.ts';
import { optionalString, requireString } from '../command.ts';
import { formatDiagnostic } from '../../basis/diagnostics.ts';
import { DOCUMENT_STATUSES } from '../../basis/types.ts';

// The sealing, rendering and printing modules load only when a seal runs (they pull in Eleventy's
// Nunjucks and Playwright), so that every other command starts quickly.
const SEALABLE_STATUSES = DOCUMENT_STATUSES.filter((s) => s !== 'draft' && s !== 'superseded');

export const sealCommand: Command = {
  name: 'seal',
  summary: 'issue a revision: seal the basis, results, HTML and PDF document and their manifest under projects/ID/sealed/REV',
  usage: 'seal ID --rev REV --status STATUS [--note TEXT] [--key PEM] [--date YYYY-MM-DD]',
  details:
    `STATUS: ${SEALABLE_STATUSES.map((s) => `"${s}"`).join(', ')}. REV follows the last sealed revision: A, B, C, ... (no I, O, Q, S, X, Z)\n` +
    'before approval, 0, 1, 2, ... after (ASME Y14.35 practice); the first is A or 0.\n' +
    'The seal date (--date, else SOURCE_DATE_EPOCH, else today, UTC) is every timestamp of the sealed files.\n' +
    'With --key (an Ed25519 private key from cellbasis keygen) the manifest is signed into manifest.sig.\n' +
    'Needs Chromium for the PDF. Never changes the working basis; a refused or interrupted seal leaves nothing.',
  positionals: [1, 1],
  options: [
    { name: 'rev', type: 'string', value: 'REV', description: 'the revision to seal' },
    { name: 'status', type: 'string', value: 'STATUS', description: 'its status: issued for review, issued for approval or approved' },
    { name: 'note', type: 'string', value: 'TEXT', description: 'what this revision is for (shown in the revision history)' },
    { name: 'key', type: 'string', value: 'PEM', description: 'sign the manifest with this Ed25519 private key file' },
    { name: 'date', type: 'string', value: 'YYYY-MM-DD', description: 'the seal date (default: SOURCE_DATE_EPOCH, else today)' },
  ],
  async run(args, io) {
    const project = args.positionals[0]!;
    const revision = requireString(args, 'rev', 'seal');
    const status = requireString(args, 'status', 'seal');
    if (status === 'approved' && /^[A-Z]/.test(revision)) {
      io.err(`cellbasis: warning: revision ${revision} is a letter, the numbering before approval; an approved revision is usually numbered 0, 1, 2, ... (ASME Y14.35 practice)\n`);
    }
    const pauseAt = process.env.CELLBASIS_SEAL_PAUSE;
    const { sealRevision, SEAL_STEPS } = await import('../../archive/seal.ts');
    const { sealedDocumentInput } = await import('../../archive/sealed-document.ts');
    const { renderStandaloneHtml } = await import('../../publish/render.ts');
    const { sealPdfPrinter } = await import('../../publish/pdf.ts');
    const outcome = await sealRevision({
      cwd: io.cwd,
      project,
      revision,
      status,
      note: optionalString(args, 'note'),
      keyPath: optionalString(args, 'key'),
      date: optionalString(args, 'date'),
      env: process.env,
      render: (input) => renderStandaloneHtml(sealedDocumentInput(input)),
      pdf: sealPdfPrinter,
      warn: (d) => io.err(`${formatDiagnostic(d)}\n`),
      ...(pauseAt && (SEAL_STEPS as readonly string[]).includes(pauseAt) ? { pauseAt, onPause: (step: string) => io.err(`cellbasis: seal paused at ${step} (CELLBASIS_SEAL_PAUSE)\n`) } : {}),
    });
    const m = outcome.manifest;
    for (const name of outcome.removedTemporary) io.err(`cellbasis: removed projects/${project}/sealed/${name}, left by an interrupted seal\n`);
    for (const name of outcome.keptTemporary) io.err(`cellbasis: left projects/${project}/sealed/${name} in place: named as a killed seal's temporary folder, but not something cellbasis made; remove it yourself\n`);
    io.out(
      `sealed ${outcome.display}/: revision ${m.revision}, ${m.status}, ${m.sealedOn}${m.previous ? ` (follows ${m.previous.revision})` : ''}${outcome.signed ? ', signed' : ''}\n` +
        `  ${Object.keys(m.files).join(', ')}, manifest.json${outcome.signed ? ', manifest.sig' : ''}\n` +
        `  manifest SHA-256 ${outcome.manifestSha256}\n`,
    );
    return 0;
  },
};
