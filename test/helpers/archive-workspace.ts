/**
 * Shared by the archive tests: a working folder with one project made from a scaffold, sealing
 * in it, and byte flips (the digest of a folder tree is in tree-digest.ts).
 */
import { readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Mode, TechnologyId } from '../../lib/electrochem/technologies.ts';
import { run } from './run-cli.ts';
import { projectsRoot, scaffoldText } from './scaffold-basis.ts';

export const PROJECT = 'demo';

/** Time allowed to set up tests that seal a few revisions (each prints a PDF of some 30 pages). */
export const SEAL_TIMEOUT = 300_000;

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

export function sealedPath(cwd: string, revision: string, file = ''): string {
  return join(cwd, 'projects', PROJECT, 'sealed', revision, file);
}

/** Flips the lowest bit of the byte at `at` (a fraction of the length, or an offset). */
export function flipByte(path: string, at: number): void {
  const bytes = readFileSync(path);
  const offset = at < 1 ? Math.floor(bytes.length * at) : at;
  bytes[offset] = bytes[offset]! ^ 1;
  writeFileSync(path, bytes);
}

/** `cellbasis seal demo --rev REV ...` in-process. */
export function seal(cwd: string, [revision, ...options]: string[]): Promise<{ code: number; out: string; err: string }> {
  return run(['seal', PROJECT, '--rev', revision!, ...options], cwd);
}
