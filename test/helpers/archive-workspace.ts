/**
 * Shared by the archive tests: a working folder with one project made from a scaffold, sealing
 * in it, a hash of every file under a folder (to show that a command changed nothing), and byte
 * flips.
 */
import { createHash } from 'node:crypto';
import { mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, relative } from 'node:path';
import { renderScaffold } from '../../lib/basis/scaffolds.ts';
import type { Mode, TechnologyId } from '../../lib/electrochem/technologies.ts';
import { run } from './run-cli.ts';

export const PROJECT = 'demo';

/** Time allowed to set up tests that seal a few revisions (each prints a PDF of some 30 pages). */
export const SEAL_TIMEOUT = 300_000;

/** A temporary working folder holding projects/demo/basis.yaml from a scaffold. */
export function workspace(technology: TechnologyId = 'solid-oxide', mode: Mode = 'power'): string {
  const cwd = mkdtempSync(join(tmpdir(), 'cellbasis-archive-'));
  mkdirSync(join(cwd, 'projects', PROJECT), { recursive: true });
  writeFileSync(basisPath(cwd), renderScaffold(technology, mode, PROJECT, '2026-11-30'));
  return cwd;
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

/** Every file and folder under `root` with the SHA-256 of each file ("dir" for folders). */
export function treeDigest(root: string): Record<string, string> {
  const out: Record<string, string> = {};
  const walk = (dir: string) => {
    for (const entry of readdirSync(dir, { withFileTypes: true })) {
      const path = join(dir, entry.name);
      const rel = relative(root, path);
      if (entry.isDirectory()) {
        out[`${rel}/`] = 'dir';
        walk(path);
      } else out[rel] = createHash('sha256').update(readFileSync(path)).digest('hex');
    }
  };
  walk(root);
  return out;
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
