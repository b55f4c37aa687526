/**
 * `cellbasis audit [ID] [--key PUB ...] [--recalculate]`: checks every issued revision (of one
 * project, or of every project): file hashes, the manifest against the files, signatures and the
 * chain of revisions, and with --recalculate a recalculation of the issued basis against the
 * issued results (lib/archive/audit.ts). One line per revision,
 * PASS or FAIL and who signed it, the first reason after a FAIL and the details indented below;
 * exit 1 when any revision fails. Revisions still in the former folder (projects/ID/sealed/)
 * fail with the command that moves them.
 */
import { existsSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import type { Command } from '../command.ts';
import { projectBasisPath, projectIdProblem } from '../../basis/projects.ts';
import type { AuditLine } from '../../archive/audit.ts';
import { FORMER_DIR, ISSUED_DIR } from '../../archive/layout.ts';
import { formerLayoutProblem } from '../../archive/former-layout.ts';
import { resolveKeyArg } from '../../archive/keys.ts';
import { publicKeyPem, readPublicKey } from '../../archive/signature.ts';
import { EXIT_OK, EXIT_USAGE, EXIT_VALIDATION, UserError } from '../../core/errors.ts';

/** Projects with an issued folder (or the former one), sorted. */
function issuedProjects(cwd: string): string[] {
  const projects = join(cwd, 'projects');
  if (!existsSync(projects)) return [];
  return readdirSync(projects, { withFileTypes: true })
    .filter((e) => e.isDirectory() && !projectIdProblem(e.name) && (existsSync(join(projects, e.name, ISSUED_DIR)) || existsSync(join(projects, e.name, FORMER_DIR))))
    .map((e) => e.name)
    .sort();
}

function lineText(line: AuditLine): string {
  const signed = line.signed ? `, ${line.signed}` : '';
  const head = line.problems.length ? `FAIL ${line.subject}${signed}: ${line.problems[0]!.reason}` : `PASS ${line.subject}${signed}`;
  const details = [
    ...line.problems.flatMap((p, i) => [...(i > 0 ? [p.reason] : []), ...p.details.map((d) => `  ${d}`)]),
    ...line.notes.map((n) => `note: ${n}`),
  ];
  return [head, ...details.map((d) => `    ${d}`)].join('\n') + '\n';
}

export const auditCommand: Command = {
  name: 'audit',
  summary: 'verify issued revisions: file hashes, signatures and the revision chain (and, asked, a recalculation of the results)',
  usage: 'audit [ID] [--key PUB ...] [--recalculate]',
  details:
    'Without ID, audits every project with issued revisions. Prints PASS or FAIL per revision, and who signed it, with the\n' +
    'reasons below. The audit checks what was issued: a later cellbasis that calculates differently fails no intact revision.\n' +
    'With --recalculate it also calculates each issued basis again and compares the results: numbers count as equal within\n' +
    'a relative 1e-12 (rounding between platforms), any larger difference, or other species data, fails.\n' +
    'Each signature is checked against the key and fingerprint its manifest records; a later revision that loses its\n' +
    'signature, or is signed for a role with another key than before, fails. With --key (a public key file, or a key name\n' +
    'of the key folder; repeat for each signer) every revision must be signed, and only by those keys.\n' +
    'Exit code 0 when every revision passes, 1 when any fails, 2 when ID names no project here. The audit only reads.',
  positionals: [0, 1],
  options: [
    { name: 'key', type: 'string', value: 'PUB', description: 'a public key the revisions must be signed with (repeat for each signer)', multiple: true },
    { name: 'recalculate', type: 'boolean', description: 'also calculate each issued basis again and compare the results with the issued ones' },
  ],
  async run(args, io) {
    const id = args.positionals[0];
    const trustedKeys = ((args.values.key as string[] | undefined) ?? []).map((arg) => {
      const { path, display } = resolveKeyArg(arg, 'public', io.cwd);
      return publicKeyPem(readPublicKey(path, display));
    });
    if (id !== undefined) {
      projectBasisPath(id, io.cwd);
      // An audit of a mistyped id must not read as a clean audit: refuse it, as check and calc do.
      if (!existsSync(join(io.cwd, 'projects', id))) throw new UserError(`audit: projects/${id}: no such project (no folder projects/${id}/ here)`, EXIT_USAGE);
    }
    const projects = id !== undefined ? [id] : issuedProjects(io.cwd);
    let revisions = 0;
    let failed = 0;
    for (const project of projects) {
      const former = formerLayoutProblem(io.cwd, project);
      if (former) {
        io.out(`FAIL projects/${project} ${FORMER_DIR}/: not audited\n    ${former}\n`);
        failed += 1;
        continue;
      }
      const { lines, notes } = await (await import('../../archive/audit.ts')).auditProject(io.cwd, project, { trustedKeys, recalculate: args.values.recalculate === true });
      for (const line of lines) {
        io.out(lineText(line));
        if (line.revision !== null) revisions += 1;
        if (line.problems.length) failed += 1;
      }
      for (const note of notes) io.out(`note: ${note}\n`);
      if (id !== undefined && lines.length === 0) io.out(`projects/${project}: no issued revisions\n`);
    }
    if (projects.length === 0) io.out('no issued revisions under projects/ here\n');
    io.err(`audit: ${revisions} revision${revisions === 1 ? '' : 's'} checked, ${failed} failed\n`);
    return failed ? EXIT_VALIDATION : EXIT_OK;
  },
};
