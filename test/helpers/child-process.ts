/**
 * Shared by the tests that run the real binary, node bin/cellbasis.js, as a child
 * process: a run to its end (optionally behind a command such as `unshare -n`, or as another
 * user), a run started in its own process group to be killed with everything it started, and
 * the checks of a complete built site.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { expect } from 'vitest';

export const BIN = fileURLToPath(new URL('../../bin/cellbasis.js', import.meta.url));

export interface ChildRun {
  code: number;
  out: string;
  err: string;
  /** Wall time of the run, ms. */
  ms: number;
}

export interface ChildOptions {
  /** Added to this process's environment (CELLBASIS_DEBUG and the pause hooks removed first). */
  env?: Record<string, string>;
  /** A command and its arguments the node process runs behind, e.g. ['unshare', '-n']. */
  wrapper?: string[];
  uid?: number;
  gid?: number;
  /** The cellbasis binary to run (default BIN, this checkout's), e.g. a copy another user can read. */
  bin?: string;
}

function childEnv(extra: Record<string, string> = {}): NodeJS.ProcessEnv {
  const env: NodeJS.ProcessEnv = { ...process.env };
  for (const name of ['CELLBASIS_DEBUG', 'CELLBASIS_ISSUE_PAUSE', 'CELLBASIS_BUILD_PAUSE', 'NODE_OPTIONS']) delete env[name];
  return { ...env, ...extra };
}

/** Runs node with `args` (a script and its arguments, after any node options) in `cwd` to its end. */
export function runNode(args: string[], cwd: string, options: ChildOptions = {}): Promise<ChildRun> {
  const started = Date.now();
  return new Promise((resolve, reject) => {
    const [file, ...rest] = [...(options.wrapper ?? []), process.execPath, ...args];
    const child = spawn(file!, rest, { cwd, env: childEnv(options.env), stdio: ['ignore', 'pipe', 'pipe'], ...(options.uid === undefined ? {} : { uid: options.uid, gid: options.gid ?? options.uid }) });
    let out = '';
    let err = '';
    child.stdout.on('data', (d: Buffer) => (out += d.toString()));
    child.stderr.on('data', (d: Buffer) => (err += d.toString()));
    child.on('error', reject);
    child.on('close', (code) => resolve({ code: code ?? -1, out, err, ms: Date.now() - started }));
  });
}

/** Runs `cellbasis ARGV` in `cwd` to its end. */
export function cellbasis(argv: string[], cwd: string, options: ChildOptions = {}): Promise<ChildRun> {
  return runNode([options.bin ?? BIN, ...argv], cwd, options);
}

export interface Started {
  child: ChildProcess;
  stderr(): string;
  exited: Promise<number | null>;
}

/** Starts `cellbasis ARGV` as the leader of its own process group (so a kill takes what it started too). */
export function startCellbasis(argv: string[], cwd: string, env: Record<string, string> = {}): Started {
  const child = spawn(process.execPath, [BIN, ...argv], { cwd, env: childEnv(env), detached: true, stdio: ['ignore', 'ignore', 'pipe'] });
  let stderr = '';
  child.stderr!.on('data', (chunk: Buffer) => (stderr += chunk.toString()));
  const exited = new Promise<number | null>((resolve) => child.on('exit', (code) => resolve(code)));
  return { child, stderr: () => stderr, exited };
}

/** Process ids of every descendant of `pid` (from /proc), e.g. the Chromium a build started. */
export function descendants(pid: number): number[] {
  const parents = new Map<number, number[]>();
  for (const name of readdirSync('/proc')) {
    if (!/^\d+$/.test(name)) continue;
    try {
      const stat = readFileSync(`/proc/${name}/stat`, 'utf8');
      const ppid = Number(stat.slice(stat.lastIndexOf(')') + 2).split(' ')[1]);
      parents.set(ppid, [...(parents.get(ppid) ?? []), Number(name)]);
    } catch {
      // The process ended while we looked.
    }
  }
  const found: number[] = [];
  const walk = (p: number) => {
    for (const child of parents.get(p) ?? []) {
      found.push(child);
      walk(child);
    }
  };
  walk(pid);
  return found;
}

/** Whether a process (not a zombie) runs. */
export function running(pid: number): boolean {
  try {
    const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
    return stat.slice(stat.lastIndexOf(')') + 2)[0] !== 'Z';
  } catch {
    return false;
  }
}

export async function until(condition: () => boolean, what: string, timeoutMs = 180_000): Promise<void> {
  const start = Date.now();
  while (!condition()) {
    if (Date.now() - start > timeoutMs) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 20));
  }
}

/** Assets every built site carries (copied from node_modules and templates/assets). */
export const SITE_ASSETS = ['assets/katex/katex.min.css', 'assets/katex/fonts/KaTeX_Main-Regular.woff2', 'assets/chart.umd.min.js', 'assets/charts.js', 'assets/report.css'];

/**
 * The site under `site` is complete: the index, each project's page and draft PDF (a PDF file
 * that ends as a PDF does), the assets, and every file a page loads (src=, <link href=>) present
 * in the site or carried in a data: URI, none from a web address.
 */
export function expectCompleteSite(site: string, projects: readonly string[], extraPages: readonly string[] = []): void {
  const pages = ['index.html', ...projects.map((id) => `projects/${id}/index.html`), ...extraPages];
  for (const page of pages) expect(existsSync(join(site, page)), page).toBe(true);
  for (const id of projects) {
    const pdf = readFileSync(join(site, 'projects', id, 'document.pdf'));
    expect(pdf.subarray(0, 5).toString('latin1'), id).toBe('%PDF-');
    expect(pdf.subarray(-8).toString('latin1'), id).toMatch(/%%EOF\s*$/);
    expect(pdf.length, id).toBeGreaterThan(100_000);
  }
  for (const asset of SITE_ASSETS) expect(existsSync(join(site, asset)), asset).toBe(true);
  for (const page of pages) {
    const html = readFileSync(join(site, page), 'utf8');
    const loads = [...html.matchAll(/<(?:script|img)\b[^>]*\ssrc="([^"]+)"|<link\b[^>]*\shref="([^"]+)"/g)].map((m) => (m[1] ?? m[2])!);
    expect(loads.length, `${page} loads its styles and scripts`).toBeGreaterThan(0);
    for (const url of loads.filter((u) => !u.startsWith('data:'))) {
      expect(url, `${page} loads ${url}`).not.toMatch(/^[a-z][a-z0-9+.-]*:|^\/\//i);
      expect(existsSync(join(site, page, '..', url.split(/[?#]/)[0]!)), `${page} loads ${url}`).toBe(true);
    }
  }
}
