// The bad-input corpus of test/basis/bad-input/, the one collection of inputs a basis must refuse
// (or accept) with exact messages: each case is a file <name>.yaml (or, for the few too large to
// commit, a recipe to make one) and <name>.expect.json with, for each command run on it, the exit
// code and every line it writes on stderr. Hostile files are named by kind (yaml-, encoding-,
// size-, nesting-, alias-, tag-, type-, unit-, range-, composition-, ...); the loader-* cases
// each make one mistake in the base basis (test/helpers/fixtures/sofc-power.yaml), so that every
// diagnostic of the loader is asserted with its message, field path and line:column.
import { closeSync, copyFileSync, mkdirSync, openSync, readdirSync, readFileSync, writeSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { expect } from 'vitest';

// fileURLToPath, not URL.pathname, which keeps a space in the path as %20.
export const CORPUS = fileURLToPath(new URL('./bad-input/', import.meta.url));

/** What one command must give on the case. */
export interface Outcome {
  exit: number;
  /** Every line on stderr, in order. */
  stderr?: string[];
  /** For cases whose stderr is too long to list: its first lines and its line count. */
  stderrHead?: string[];
  stderrLineCount?: number;
  /** The first line on stdout, for accepted files. */
  stdoutFirstLine?: string;
}

/** A file made by the test instead of committed: `sparse` of `bytes` zero bytes, or `numbered-lines` of "k<i>: 1" up to `bytes`. */
export interface Recipe {
  kind: 'sparse' | 'numbered-lines' | 'comment';
  bytes: number;
}

export interface CorpusCase {
  name: string;
  about: string;
  /** Commands by name (check, calc) with what each must give. */
  commands: Record<string, Outcome>;
  /** Commands also run as child processes (node bin/cellbasis.js). */
  process?: string[];
  generate?: Recipe;
}

export function corpusCases(): CorpusCase[] {
  return readdirSync(CORPUS)
    .filter((f) => f.endsWith('.expect.json'))
    .sort()
    .map((f) => {
      const name = f.slice(0, -'.expect.json'.length);
      const { about, process, generate, ...commands } = JSON.parse(readFileSync(join(CORPUS, f), 'utf8'));
      return { name, about, commands, ...(process ? { process } : {}), ...(generate ? { generate } : {}) };
    });
}

/** Writes a recipe's file: sparse (no disk or memory used for its size), or text in 64 KiB writes. */
function make(recipe: Recipe, path: string): void {
  const fd = openSync(path, 'w');
  try {
    if (recipe.kind === 'sparse') {
      if (recipe.bytes > 0) writeSync(fd, Buffer.alloc(1), 0, 1, recipe.bytes - 1);
      return;
    }
    let text = '';
    for (let i = 0; ; i += 1) {
      const line = recipe.kind === 'comment' ? `#${'-'.repeat(62)}\n` : `k${i}: 1\n`;
      if (text.length + line.length > recipe.bytes) break;
      text += line;
    }
    if (recipe.kind === 'comment') text += '#'.repeat(recipe.bytes - text.length);
    writeSync(fd, text);
  } finally {
    closeSync(fd);
  }
}

/** Puts the case at projects/<name>/basis.yaml under `root`, so messages name projects/<name>/basis.yaml. */
export function placeCase(c: CorpusCase, root: string): void {
  const folder = join(root, 'projects', c.name);
  mkdirSync(folder, { recursive: true });
  const target = join(folder, 'basis.yaml');
  if (c.generate) make(c.generate, target);
  else copyFileSync(join(CORPUS, `${c.name}.yaml`), target);
}

/** Stderr as lines (without the final newline's empty line). */
export function lines(text: string): string[] {
  return text === '' ? [] : text.replace(/\n$/, '').split('\n');
}

/** Checks one run against its outcome: no stack trace, no internal error, the exact stderr lines, the exit code. */
export function expectOutcome(name: string, got: { code: number; out: string; err: string }, want: Outcome): void {
  expect(got.err, `${name}: a stack trace`).not.toMatch(/\n\s+at /);
  expect(got.err, `${name}: an internal error`).not.toMatch(/internal error/);
  const err = lines(got.err);
  if (want.stderr) expect(err, name).toEqual(want.stderr);
  if (want.stderrHead) expect(err.slice(0, want.stderrHead.length), name).toEqual(want.stderrHead);
  if (want.stderrLineCount !== undefined) expect(err.length, name).toBe(want.stderrLineCount);
  if (want.stdoutFirstLine !== undefined) expect(lines(got.out)[0], name).toBe(want.stdoutFirstLine);
  expect(got.code, `${name}: exit code`).toBe(want.exit);
}
