// No command but issue ever writes in projects/<id>/issued/ (README, "Issuing revisions"). A
// revision is issued for real (Chromium prints its PDF; signed with a key from keygen), then
// every entry under issued/ is recorded: the directory listings, and for each file and folder
// its type, mode, size, inode, link count, modification and change times (nanoseconds) and the
// SHA-256 of its bytes. Every other command of the CLI (lib/cli/main.ts COMMANDS) then runs,
// with typical and with failing arguments: reaction, species, equilibrium, steam-limit,
// schema, check, calc and hazards (on the working basis and on the issued basis file itself),
// audit and compare, keygen, new, build (with and without PDFs, into another folder, as a
// failing build, and with --out aimed at the issued folder, a revision, inside one, at
// projects/, the working folder, and through symbolic links into the issued folder), serve
// (the site served and rebuilt on an edit of the working basis), and the refusals issue makes
// before it writes anything. After each, the record must be exactly the same: nothing added,
// removed, modified, or touched (a change time moves with any write, chmod or utimes, and no
// process can set it back).
//
// Then issued/ is made read-only (chmod -R a-w) and every command runs again as a child
// process, with the same exit codes and again nothing changed. Root ignores file modes, so
// when the test runs as root those commands run as the user nobody (the working folder handed
// to it, issued/ left root's), and a control shows that such a process indeed cannot write,
// add, remove, rename or touch anything under issued/. Where a read-only issued/ does not stop
// writes, the test says so and the record check is what stands. A checkout inside a private
// folder (mode 0700, as mktemp -d makes) is out of nobody's reach: the test then runs a copy of
// what the binary needs, made readable in a temporary folder. It skips, saying why, only where
// that user can reach neither the checkout nor the copy (or not Node.js, or the working folder).
//
// Running these commands, the test found `build --out LINK/A`, with LINK a symbolic link to a
// issued folder, replacing issued revision A by the site; build now refuses an --out that leads
// into projects/ or an issued folder through links (lib/publish/build.ts checkOutput).
import { spawn } from 'node:child_process';
import { chmodSync, cpSync, lchownSync, lstatSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, relative } from 'node:path';
import { within } from '../../lib/archive/layout.ts';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { renderScaffold } from '../../lib/basis/scaffolds.ts';
import { run } from '../helpers/run-cli.ts';
import { announceChromiumSkip, describeWithChromium } from '../helpers/chromium.ts';
import { basisPath, PROJECT, removeWorkspace, ISSUE_TIMEOUT, issue, workspace } from '../helpers/archive-workspace.ts';
import { BIN, cellbasis, runNode, until, type ChildOptions } from '../helpers/child-process.ts';
import { freePort } from '../helpers/site.ts';
import { treeRecord } from '../helpers/tree-record.ts';

announceChromiumSkip('the issued-folder tests');

const ISSUED = join('projects', PROJECT, 'issued');
const NOBODY = 65534;

/** What the binary needs of the checkout to run: its code, templates, configuration and installed packages. */
const RUNTIME = ['bin', 'lib', 'templates', 'node_modules', 'package.json', 'tsconfig.json', '.eleventy.js'];

/** Whether `user` can read the binary `bin`, running Node.js in `cwd`; the reason when not. */
async function readableBy(user: ChildOptions, bin: string, cwd: string): Promise<string | null> {
  try {
    const probe = await runNode(['-e', `require('fs').accessSync(${JSON.stringify(bin)}, require('fs').constants.R_OK)`], cwd, user);
    return probe.code === 0 ? null : `it cannot read ${bin}: ${probe.err.trim().split('\n').find((l) => /Error/.test(l)) ?? probe.err.trim()}`;
  } catch (error) {
    return `it cannot run ${process.execPath} in ${cwd}: ${(error as Error).message}`;
  }
}

/**
 * The binary `user` runs: this checkout's where it can read it; else a copy of RUNTIME in a new
 * folder under the temporary folder, readable by everyone (folders 0755, files a+r); or, when
 * the user reaches neither, why not (the test then skips with that reason).
 */
async function binaryFor(user: ChildOptions, cwd: string, made: string[]): Promise<{ bin: string } | { skip: string }> {
  const checkout = dirname(dirname(BIN));
  const here = await readableBy(user, BIN, cwd);
  if (here === null) return { bin: BIN };
  const copy = mkdtempSync(join(tmpdir(), 'cellbasis-readable-'));
  made.push(copy);
  for (const entry of RUNTIME) cpSync(join(checkout, entry), join(copy, entry), { recursive: true, verbatimSymlinks: true });
  for (const path of [copy, ...walkAll(copy)]) {
    const stat = lstatSync(path);
    if (!stat.isSymbolicLink()) chmodSync(path, stat.isDirectory() ? 0o755 : (stat.mode & 0o7777) | 0o444);
  }
  const bin = join(copy, relative(checkout, BIN));
  const there = await readableBy(user, bin, cwd);
  console.info(`uid ${user.uid}: ${here}; running a copy readable by everyone, ${copy}`);
  return there === null ? { bin } : { skip: `uid ${user.uid} cannot reach this checkout (${here}) nor a readable copy of it (${there})` };
}

/** Every path under `dir`, links not followed. */
function walkAll(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const path = join(dir, entry.name);
    return entry.isDirectory() ? [path, ...walkAll(path)] : [path];
  });
}

/** What went wrong with one command: its exit code, and each entry of the record it changed, added or removed. */
function differences(what: string, exit: number, r: { code: number; err: string }, before: Record<string, string>, after: Record<string, string>): string[] {
  const found: string[] = [];
  if (r.code !== exit) found.push(`${what}: exit ${r.code}, expected ${exit}: ${r.err.trim().split('\n').slice(-2).join(' | ')}`);
  for (const path of new Set([...Object.keys(before), ...Object.keys(after)])) {
    if (before[path] !== after[path]) found.push(`${what}: issued/${path} ${before[path] ?? '(none)'} -> ${after[path] ?? '(removed)'}`);
  }
  return found;
}

/** A command and the exit code it gives; `around` prepares the working folder for it and returns the undoing. */
interface Step {
  argv: string[];
  exit: number;
  around?: (cwd: string) => () => void;
}

/** A second project whose basis has an error, for a build that fails. */
const withBrokenProject = (cwd: string) => {
  mkdirSync(join(cwd, 'projects', 'broken'), { recursive: true });
  writeFileSync(join(cwd, 'projects', 'broken', 'basis.yaml'), renderScaffold('pem', 'power', 'broken', '2026-11-30').replace(/operating-temperature: .*/, 'operating-temperature: "hot"'));
  return () => rmSync(join(cwd, 'projects', 'broken'), { recursive: true, force: true });
};

/** Every command of the CLI but issue, typical and failing, and issue's refusals (names of files they make end in `tag`). */
function steps(tag: string): Step[] {
  const refused = (out: string): Step => ({ argv: ['build', '--html-only', '--out', out], exit: 2 });
  return [
    { argv: ['--help'], exit: 0 },
    { argv: ['--version'], exit: 0 },
    { argv: ['frobnicate'], exit: 2 },
    { argv: ['reaction', 'H2 + 0.5 O2 -> H2O', '--temperature', '1000K', '--json'], exit: 0 },
    { argv: ['reaction', 'H2 -> H2O'], exit: 2 },
    { argv: ['species', 'H2O', '--temperature', '800 C'], exit: 0 },
    { argv: ['species', '--list'], exit: 0 },
    { argv: ['species', 'Unobtainium'], exit: 2 },
    { argv: ['equilibrium', '--temperature', '800C', '--pressure', '1bar', '--feed', 'CH4=1, H2O=2', '--json'], exit: 0 },
    { argv: ['equilibrium', '--temperature', '800C', '--pressure', '1bar', '--feed', 'Xx=1'], exit: 2 },
    { argv: ['steam-limit', '--fuel', 'CH4=1', '--temperature', '800C', '--pressure', '1bar'], exit: 0 },
    { argv: ['steam-limit', '--fuel', 'CH4=1', '--temperature', 'hot', '--pressure', '1bar'], exit: 2 },
    { argv: ['schema'], exit: 0 },
    { argv: ['check'], exit: 0 },
    { argv: ['check', PROJECT], exit: 0 },
    { argv: ['check', `${ISSUED}/A/basis.yaml`], exit: 0 },
    { argv: ['check', 'no-such-project'], exit: 2 },
    { argv: ['check'], exit: 1, around: withBrokenProject },
    { argv: ['calc', PROJECT, '--json'], exit: 0 },
    { argv: ['calc', `${ISSUED}/A/basis.yaml`, '--json'], exit: 0 },
    { argv: ['calc', `${ISSUED}/A`], exit: 2 },
    { argv: ['hazards', PROJECT], exit: 0 },
    { argv: ['hazards', '../demo'], exit: 2 },
    { argv: ['audit'], exit: 0 },
    { argv: ['audit', PROJECT, '--key', 'alice.pub'], exit: 0 },
    { argv: ['audit', PROJECT, '--key', 'mallory.pub'], exit: 1 },
    { argv: ['audit', PROJECT, '--key', 'no-such-key.pub'], exit: 2 },
    { argv: ['compare', PROJECT, 'A', 'draft'], exit: 0 },
    { argv: ['compare', PROJECT, 'A', 'draft', '--json'], exit: 0 },
    { argv: ['compare', PROJECT, 'A', 'B'], exit: 2 },
    { argv: ['keygen', `key-${tag}`, '--dir', '.'], exit: 0 },
    { argv: ['keygen', 'alice', '--dir', '.'], exit: 2 },
    { argv: ['keygen', `${ISSUED}/A/key`], exit: 2 },
    { argv: ['keygen', 'key', '--dir', `${ISSUED}/A`], exit: 2 },
    { argv: ['keygen', 'key', '--dir', 'link-to-issued'], exit: 2 },
    { argv: ['issue', PROJECT, '--rev', 'A', '--status', 'issued for review'], exit: 2 },
    { argv: ['issue', PROJECT, '--rev', 'B', '--status', 'draft'], exit: 2 },
    { argv: ['issue', PROJECT, '--rev', 'C', '--status', 'issued for review'], exit: 2 },
    { argv: ['issue', PROJECT, '--rev', 'B', '--status', 'approved', '--date', '2026-12-01'], exit: 1 },
    { argv: ['build'], exit: 0 },
    { argv: ['build', '--html-only'], exit: 0 },
    { argv: ['build', '--html-only', '--out', `public-${tag}`], exit: 0 },
    { argv: ['build'], exit: 1, around: withBrokenProject },
    refused(ISSUED),
    refused(`${ISSUED}/A`),
    refused(`${ISSUED}/A/site`),
    refused(`${ISSUED}/.tmp-B-1`),
    refused(`projects/${PROJECT}`),
    refused('projects'),
    refused('.'),
    refused('..'),
    refused('link-to-issued/A'),
    refused('link-to-issued/new-site'),
    refused('link-to-project/issued'),
    refused('link-to-project/site'),
    // A link of one's own to the issued folder as the site folder: not a site cellbasis built, so refused (exit 1), the link and the folder as they were.
    { argv: ['build', '--html-only', '--out', `own-link-${tag}`], exit: 1, around: (cwd) => (symlinkSync(ISSUED, join(cwd, `own-link-${tag}`)), () => undefined) },
    { argv: ['serve', '--port', '0'], exit: 2 },
    { argv: ['new', `other-${tag}`, '--technology', 'pem'], exit: 0, around: (cwd) => () => rmSync(join(cwd, 'projects', `other-${tag}`), { recursive: true, force: true }) },
    { argv: ['new', PROJECT, '--technology', 'pem'], exit: 2 },
    { argv: ['new', 'no/such', '--technology', 'pem'], exit: 2 },
  ];
}

/** `cellbasis serve` as a child: served, rebuilt after an edit of the working basis, stopped with Ctrl-C (SIGINT). */
async function serveOnce(cwd: string, options: ChildOptions): Promise<number | null> {
  const port = await freePort();
  const child = spawn(process.execPath, [options.bin ?? BIN, 'serve', '--port', String(port)], { cwd, env: { ...process.env, ...options.env }, stdio: ['ignore', 'ignore', 'pipe'], ...(options.uid === undefined ? {} : { uid: options.uid, gid: options.gid }) });
  let stderr = '';
  child.stderr.on('data', (d: Buffer) => (stderr += d.toString()));
  const exited = new Promise<number | null>((resolve) => child.on('exit', (code) => resolve(code)));
  await until(() => stderr.includes('serving the design-basis site') || child.exitCode !== null, 'serve to start', 120_000);
  const page = async () => (await fetch(`http://127.0.0.1:${port}/projects/${PROJECT}/`)).text();
  expect(await page()).toContain('Draft, not issued');
  const basis = readFileSync(basisPath(cwd), 'utf8');
  writeFileSync(basisPath(cwd), basis.replace(/^( {2}title: )/m, '$1(edited) '));
  const deadline = Date.now() + 60_000;
  while (!(await page()).includes('(edited)') && Date.now() < deadline) await new Promise((r) => setTimeout(r, 200));
  expect(await page()).toContain('(edited)');
  writeFileSync(basisPath(cwd), basis);
  child.kill('SIGINT');
  return exited;
}

describeWithChromium('the issued folder, under every other command', () => {
  let cwd: string;
  let issued: string;
  /** Exit code of each step in the first round, by its position. */
  const codes: number[] = [];
  /** Folders made besides the working folder (a readable copy of the checkout). */
  const made: string[] = [];

  beforeAll(async () => {
    cwd = workspace('solid-oxide', 'power');
    issued = join(cwd, ISSUED);
    for (const name of ['alice', 'mallory']) expect((await run(['keygen', name, '--dir', '.'], cwd)).code).toBe(0);
    const done = await issue(cwd, ['A', '--status', 'issued for review', '--date', '2026-11-30', '--key', 'prepared=alice.key', '--note', 'for the issued-folder test']);
    expect(done.code, done.err).toBe(0);
    symlinkSync(ISSUED, join(cwd, 'link-to-issued'));
    symlinkSync(join('projects', PROJECT), join(cwd, 'link-to-project'));
  }, ISSUE_TIMEOUT);

  afterAll(() => {
    for (const path of [issued, ...Object.keys(treeRecord(issued)).map((p) => join(issued, p))]) chmodSync(path, 0o755);
    removeWorkspace(cwd);
    for (const dir of made) rmSync(dir, { recursive: true, force: true });
  });

  it('the record of the issued folder sees a touch, a chmod and a rewrite of the same bytes', () => {
    const file = join(issued, 'A', 'manifest.json');
    const before = treeRecord(issued);
    writeFileSync(file, readFileSync(file));
    const rewritten = treeRecord(issued);
    expect(rewritten['A/manifest.json']).not.toBe(before['A/manifest.json']);
    chmodSync(file, 0o644);
    expect(treeRecord(issued)['A/manifest.json']).not.toBe(rewritten['A/manifest.json']);
    expect(Object.keys(treeRecord(issued)).sort()).toEqual(['.', 'A', 'A/basis.yaml', 'A/document.html', 'A/document.pdf', 'A/manifest.json', 'A/manifest.prepared.sig', 'A/results.json']);
  });

  it('changes nothing under issued/, running every other command in process, typical and failing', { timeout: 900_000 }, async () => {
    const before = treeRecord(issued);
    const problems: string[] = [];
    let previous = before;
    for (const [index, step] of steps('1').entries()) {
      const undo = step.around?.(cwd);
      const r = await run(step.argv, cwd);
      undo?.();
      codes[index] = r.code;
      const now = treeRecord(issued);
      problems.push(...differences(`cellbasis ${step.argv.join(' ')}`, step.exit, r, previous, now));
      previous = now;
    }
    expect(problems).toEqual([]);
    expect(await serveOnce(cwd, {})).toBe(0);
    expect(treeRecord(issued), 'cellbasis serve').toEqual(before);
    expect((await run(['audit', PROJECT, '--key', 'alice.pub'], cwd)).out).toMatch(/^PASS projects\/demo rev A, signed for prepared by key alice \([0-9a-f ]{19}\)\n$/);
  });

  it('changes nothing under a read-only issued/ either, and every command still succeeds (child processes)', { timeout: 1_200_000 }, async (context) => {
    const asRoot = process.getuid?.() === 0;
    let user: ChildOptions = asRoot ? { uid: NOBODY, gid: NOBODY, env: { HOME: join(cwd, 'home') } } : {};
    if (asRoot) {
      // The working folder is handed to nobody, all but issued/, which stays root's.
      mkdirSync(join(cwd, 'home'), { recursive: true });
      for (const path of [cwd, ...walkAll(cwd)].filter((p) => !within(issued, p))) lchownSync(path, NOBODY, NOBODY);
      const binary = await binaryFor(user, cwd, made);
      if ('skip' in binary) context.skip(binary.skip);
      else user = { ...user, bin: binary.bin };
    }
    for (const path of [issued, ...Object.keys(treeRecord(issued)).filter((p) => p !== '.').map((p) => join(issued, p))]) {
      chmodSync(path, Number(lstatSync(path).mode) & 0o555);
    }
    // Control: the user the commands run as cannot write, add, remove or make anything there,
    // nor touch a file unless it owns it (an owner may set the times of a file it cannot write).
    const attempt = `const fs = require('fs'); const tries = { write: () => fs.appendFileSync('${ISSUED}/A/manifest.json', ' '), add: () => fs.writeFileSync('${ISSUED}/A/extra', ''), remove: () => fs.rmSync('${ISSUED}/A/manifest.prepared.sig'), mkdir: () => fs.mkdirSync('${ISSUED}/B'), rename: () => fs.renameSync('${ISSUED}/A', '${ISSUED}/Z'), touch: () => fs.utimesSync('${ISSUED}/A/basis.yaml', new Date(), new Date()) }; const out = {}; for (const [k, f] of Object.entries(tries)) { try { f(); out[k] = 'done'; } catch (e) { out[k] = e.code; } } process.stdout.write(JSON.stringify(out));`;
    const control = JSON.parse((await runNode(['-e', attempt], cwd, user)).out) as Record<string, string>;
    const { touch, ...writes } = control;
    if (Object.values(writes).some((v) => v === 'done')) {
      console.warn(`\n*** a read-only issued/ does not stop writes here (${JSON.stringify(control)}); only the record check stands ***\n`);
    } else {
      console.info(`issued/ read-only for uid ${user.uid ?? process.getuid?.()}: ${JSON.stringify(control)}`);
      for (const [what, code] of Object.entries(writes)) expect(code, what).toMatch(/^(EACCES|EPERM)$/);
      if (asRoot) expect(touch, 'touch').toMatch(/^(EACCES|EPERM)$/);
    }
    const before = treeRecord(issued);

    const problems: string[] = [];
    let previous = before;
    for (const [index, step] of steps('2').entries()) {
      const undo = step.around?.(cwd);
      const r = await cellbasis(step.argv, cwd, user);
      undo?.();
      const now = treeRecord(issued);
      problems.push(...differences(`cellbasis ${step.argv.join(' ')} (issued/ read-only)`, codes[index] ?? step.exit, r, previous, now));
      previous = now;
    }
    expect(problems).toEqual([]);
    expect(await serveOnce(cwd, user)).toBe(0);
    expect(treeRecord(issued), 'cellbasis serve (issued/ read-only)').toEqual(before);
    const audit = await cellbasis(['audit', PROJECT, '--key', 'alice.pub'], cwd, user);
    expect(audit.out).toMatch(/^PASS projects\/demo rev A, signed for prepared by key alice \([0-9a-f ]{19}\)\n$/);
  });
});
