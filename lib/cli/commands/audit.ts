/**
 * `cellbasis audit [ID] [--key PUB]`: checks every sealed revision (of one project, or of every
 * project): file hashes, signature, a recalculation of the sealed basis against the sealed
 * results, and the chain of revisions (lib/archive/audit.ts). One line per revision, PASS or
 * FAIL with the first reason, the details indented below; exit 1 when any revision fails.
 */
import { existsSync, readdirSync } from 'node:fs';
import { join, resolve } from 'node:path';
import type { Command } from '../command.ts';
import { optionalString } from '../command.ts';
import { projectBasisPath, projectIdProblem } from '../../basis/projects.ts';
import type { AuditLine } from '../../archive/audit.ts';
import { SEALED_DIR } from '../../archive/layout.ts';
import { publicKeyPem, readPublicKey } from '../../archive/signature.ts';
import { EXIT_OK, EXIT_USAGE, EXIT_VALIDATION, UserError } from '../../core/errors.ts';

/** Projects with a sealed folder, sorted. */
function sealedProjects(cwd: string): string[] {
  const projects = join(cwd, 'projects');
  if (!existsSync(projects)) return [];
  return readdirSync(projects, { withFileTypes: true })
    .filter((e) => e.isDirectory() && !projectIdProblem(e.name) && existsSync(join(projects, e.name, SEALED_DIR)))
    .map((e) => e.name)
    .sort();
}

function lineText(line: AuditLine): string {
  const head = line.problems.length ? `FAIL ${line.subject}: ${line.problems[0]!.reason}` : `PASS ${line.subject}`;
  const details = [
    ...line.problems.flatMap((p, i) => [...(i > 0 ? [p.reason] : []), ...p.details.map((d) => `  ${d}`)]),
    ...line.notes.map((n) => `note: ${n}`),
  ];
  return [head, ...details.map((d) => `    ${d}`)].join('\n') + '\n';
}

export const auditCommand: Command = {
  name: 'audit',
  summary: 'verify sealed revisions: file hashes, signatures, a recalculation of the results, and the revision chain',
  usage: 'audit [ID] [--key PUB]',
  details:
    'Without ID, audits every project with sealed revisions. Prints PASS or FAIL per revision with the reasons below;\n' +
    'numbers count as equal within a relative 1e-12 (rounding between platforms), any larger difference fails.\n' +
    'Exit code 0 when every revision passes, 1 when any fails, 2 when ID names no project here. The audit only reads.',
  positionals: [0, 1],
  options: [{ name: 'key', type: 'string', value: 'PUB', description: 'require every revision to be signed with this public key (PEM file)' }],
  async run(args, io) {
    const id = args.positionals[0];
    const keyPath = optionalString(args, 'key');
    const requireKey = keyPath ? publicKeyPem(readPublicKey(resolve(io.cwd, keyPath), keyPath)) : undefined;
    if (id !== undefined) {
      projectBasisPath(id, io.cwd);
      // An audit of a mistyped id must not read as a clean audit: refuse it, as check and calc do.
      if (!existsSync(join(io.cwd, 'projects', id))) throw new UserError(`audit: projects/${id}: no such project (no folder projects/${id}/ here)`, EXIT_USAGE);
    }
    const projects = id !== undefined ? [id] : sealedProjects(io.cwd);
    let revisions = 0;
    let failed = 0;
    for (const project of projects) {
      const { lines, notes } = await (await import('../../archive/audit.ts')).auditProject(io.cwd, project, { requireKey });
      for (const line of lines) {
        io.out(lineText(line));
        if (line.revision !== null) revisions += 1;
        if (line.problems.length) failed += 1;
      }
      for (const note of notes) io.out(`note: ${note}\n`);
      if (id !== undefined && lines.length === 0) io.out(`projects/${project}: no sealed revisions\n`);
    }
    if (projects.length === 0) io.out('no sealed revisions under projects/ here\n');
    io.err(`audit: ${revisions} revision${revisions === 1 ? '' : 's'} checked, ${failed} failed\n`);
    return failed ? EXIT_VALIDATION : EXIT_OK;
  },
};
