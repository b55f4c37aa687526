/**
 * Shared by the archive tests: a working folder with one project made from a scaffold, issuing
 * in it, and byte flips (the digest of a folder tree is in tree-digest.ts).
 */
import { readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Mode, TechnologyId } from '../../lib/electrochem/technologies.ts';
import { run } from './run-cli.ts';
import { projectsRoot, scaffoldText } from './scaffold-basis.ts';

export const PROJECT = 'demo';

/** Time allowed to set up tests that issue a few revisions (each prints a PDF of some 30 pages). */
export const ISSUE_TIMEOUT = 300_000;

/** A temporary working folder holding projects/demo/basis.yaml from a scaffold. */
export function workspace(technology: TechnologyId = 'solid-oxide', mode: Mode = 'power'): string {
  return projectsRoot('archive', { [PROJECT]: scaffoldText(technology, mode, PROJECT) });
}

export function removeWorkspace(cwd: string): void {
  rmSync(cwd, { recursive: true, force: true });
}

export function basisPath(cwd: string): string {
  return join(cwd, 'projects', PROJECT, 'basis.yaml');
}

export function issuedPath(cwd: string, revision: string, file = ''): string {
  return join(cwd, 'projects', PROJECT, 'issued', revision, file);
}

/** Flips the lowest bit of the byte at `at` (a fraction of the length, or an offset). */
export function flipByte(path: string, at: number): void {
  const bytes = readFileSync(path);
  const offset = at < 1 ? Math.floor(bytes.length * at) : at;
  bytes[offset] = bytes[offset]! ^ 1;
  writeFileSync(path, bytes);
}

/** `cellbasis issue demo --rev REV ...` in-process. */
export function issue(cwd: string, [revision, ...options]: string[]): Promise<{ code: number; out: string; err: string }> {
  return run(['issue', PROJECT, '--rev', revision!, ...options], cwd);
}

/**
 * The scaffold's basis signed off for approval: checked and approved by two other people on the
 * dates given, and its open assumption A2 accepted as open with a reason (an approved revision
 * needs all three, lib/archive/issue-rules.ts).
 */
export function approvable(text: string, checked = '2026-12-02', approved = '2026-12-03'): string {
  const out = text
    .replace('    # checked: { name: ..., date: ... }\n', `    checked: { name: C. Checker, date: ${checked} }\n`)
    .replace('    # approved: { name: ..., date: ... }\n', `    approved: { name: P. Approver, date: ${approved} }\n`)
    .replace(
      'open: true, reference: R1 }',
      `open: true, reference: R1, accepted: { reason: "The annual gas analysis is within the band the stack maker allows.", by: P. Approver, date: ${approved} } }`,
    );
  if (out === text || !out.includes('checked: { name: C. Checker') || !out.includes('accepted:')) throw new Error('the scaffold changed: approvable() no longer applies');
  return out;
}

/** `cellbasis keygen NAME --dir keys` in the working folder (outside any git work tree). */
export function keygen(cwd: string, name: string): Promise<{ code: number; out: string; err: string }> {
  return run(['keygen', name, '--dir', 'keys'], cwd);
}
