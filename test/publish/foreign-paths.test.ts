// Never delete what the tool did not make (issue 15, item 1). `cellbasis build --out DIR` used to
// rename whatever DIR was aside and delete it (`mkdir keep; echo precious > keep/notes.txt;
// cellbasis build --out keep` lost notes.txt; pointed at `.git` it wiped a clone's history) and
// exit 0. Every path a command would replace, rename or remove must be something cellbasis made
// (a site folder carrying its marker, lib/publish/site-marker.ts; a temporary file or folder of
// its own naming and content); anything else is refused with exit 1, named, and left exactly
// as it was (every entry's type, mode, inode, times and bytes: lib tree-record.ts), or, where
// the command only tidies up after killed runs, left in place with a warning naming it.
//
// The classes: the folder a command replaces (build --out, build's default site/, serve's site/,
// Eleventy's output under `npx @11ty/eleventy`), the leftovers of killed builds beside it, the
// temporary folders and lock of killed issue runs, the temporary files of the caches, and the files
// keygen and new create.
import { spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, readFileSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { renderScaffold } from '../../lib/basis/scaffolds.ts';
import { CACHE_DIR } from '../../lib/batch/results-cache.ts';
import { removeCacheLeftovers } from '../../lib/publish/cache-leftovers.ts';
import { serveSite } from '../../lib/publish/serve.ts';
import { SITE_MARKER, SITE_MARKER_TEXT } from '../../lib/publish/site-marker.ts';
import { describeWithChromium } from '../helpers/chromium.ts';
import { PROJECT, ISSUE_TIMEOUT, issue, workspace as archiveWorkspace } from '../helpers/archive-workspace.ts';
import { run } from '../helpers/run-cli.ts';
import { runNode } from '../helpers/child-process.ts';
import { treeRecord } from '../helpers/tree-record.ts';

const made: string[] = [];
afterAll(() => {
  for (const dir of made.splice(0)) rmSync(dir, { recursive: true, force: true });
});

function tempDir(prefix: string): string {
  const dir = mkdtempSync(join(tmpdir(), prefix));
  made.push(dir);
  return dir;
}

/** A working folder with one valid project, and a folder outside it. */
function workspace(): { root: string; outside: string } {
  const root = tempDir('cellbasis-foreign-');
  mkdirSync(join(root, 'projects', 'p1'), { recursive: true });
  writeFileSync(join(root, 'projects', 'p1', 'basis.yaml'), renderScaffold('pem', 'power', 'p1', '2026-11-30'));
  const outside = tempDir('cellbasis-foreign-outside-');
  writeFileSync(join(outside, 'precious.txt'), 'kept outside\n');
  return { root, outside };
}

/** Both folders, recorded entry by entry. */
function recordOf(root: string, outside: string): Record<string, string> {
  return { ...prefixed('root', treeRecord(root)), ...prefixed('outside', treeRecord(outside)) };
}

function prefixed(prefix: string, record: Record<string, string>): Record<string, string> {
  return Object.fromEntries(Object.entries(record).map(([k, v]) => [`${prefix}/${k}`, v]));
}

/** The pid of a process that has ended (a child run to completion). */
function deadPid(): number {
  const child = spawnSync(process.execPath, ['-e', '']);
  expect(child.status).toBe(0);
  return child.pid!;
}

/** A folder as `git clone` leaves it: a history that must survive any build. */
function fakeGitFolder(dir: string): void {
  mkdirSync(join(dir, 'objects', '3b'), { recursive: true });
  mkdirSync(join(dir, 'refs', 'heads'), { recursive: true });
  writeFileSync(join(dir, 'HEAD'), 'ref: refs/heads/main\n');
  writeFileSync(join(dir, 'config'), '[core]\n\trepositoryformatversion = 0\n');
  writeFileSync(join(dir, 'refs', 'heads', 'main'), '3b18e512dba79e4c8300dd08aeb37f8e728b8dad\n');
  writeFileSync(join(dir, 'objects', '3b', '18e512dba79e4c8300dd08aeb37f8e728b8dad'), Buffer.from([0x78, 0x01, 0x4b, 0xca]), { mode: 0o444 });
}

/**
 * What may stand at a path a command would replace, none of it made by cellbasis: how to make it
 * (returning the path as given on the command line) and the words the refusal must use.
 */
const FOREIGN: [what: string, make: (root: string, outside: string) => string, says: RegExp][] = [
  ['a folder holding a file', (root) => (mkdirSync(join(root, 'keep')), writeFileSync(join(root, 'keep', 'notes.txt'), 'precious\n'), 'keep'), /^keep is a folder that cellbasis did not make \(it has no \.cellbasis-site marker\)/],
  ['the .git folder of a clone', (root) => (fakeGitFolder(join(root, '.git')), '.git'), /^\.git is a folder that cellbasis did not make/],
  ['a folder whose only file is a spoofed marker', (root) => (mkdirSync(join(root, 'spoof')), writeFileSync(join(root, 'spoof', SITE_MARKER), 'not the marker cellbasis writes\n'), 'spoof'), /^spoof is a folder that cellbasis did not make \(its \.cellbasis-site is not the marker cellbasis writes\)/],
  ['a folder with a marker that is itself a folder', (root) => (mkdirSync(join(root, 'odd', SITE_MARKER), { recursive: true }), 'odd'), /^odd is a folder that cellbasis did not make/],
  ['a plain file', (root) => (writeFileSync(join(root, 'notes.txt'), 'precious\n'), 'notes.txt'), /^notes\.txt is a file, not a site folder cellbasis made/],
  ['a symbolic link to a foreign folder', (root, outside) => (symlinkSync(outside, join(root, 'link')), 'link'), /^link is a symbolic link to .*cellbasis-foreign-outside-.*, not to a site cellbasis built beside it/],
  ['a symbolic link named as a build to a foreign folder named as one', (root) => {
    mkdirSync(join(root, 'pub.1-0123abcd.build'));
    writeFileSync(join(root, 'pub.1-0123abcd.build', 'notes.txt'), 'precious\n');
    symlinkSync('pub.1-0123abcd.build', join(root, 'pub'));
    return 'pub';
  }, /^pub is a symbolic link to pub\.1-0123abcd\.build, which is a folder that cellbasis did not make/],
  ['a dangling symbolic link', (root, outside) => (symlinkSync(join(outside, 'not-yet'), join(root, 'dangling')), 'dangling'), /^dangling is a symbolic link to .*not-yet, not to a site cellbasis built beside it/],
  ['a FIFO', (root) => (spawnSync('mkfifo', [join(root, 'fifo')]), 'fifo'), /^fifo is a special file, not a site folder cellbasis made/],
];

describe('build refuses to replace what cellbasis did not make', () => {
  it.each(FOREIGN)('--out %s: exit 1, one line naming it, nothing touched', async (_what, make, says) => {
    const { root, outside } = workspace();
    const out = make(root, outside);
    const before = recordOf(root, outside);
    const r = await run(['build', '--out', out, '--html-only', '--quiet'], root);
    expect(r.err.split('\n').filter(Boolean), r.err).toEqual([expect.stringMatching(new RegExp(`^cellbasis: build: ${says.source.slice(1)}`))]);
    expect(r.err).toMatch(/nothing was changed/);
    expect(r.code).toBe(1);
    expect(r.out).toBe('');
    expect(recordOf(root, outside), 'every entry as it was, byte for byte').toEqual(before);
  });

  it('the default site/ too: a folder of that name that cellbasis did not make is refused and kept', async () => {
    const { root, outside } = workspace();
    mkdirSync(join(root, 'site'));
    writeFileSync(join(root, 'site', 'index.html'), '<p>my own site</p>\n');
    const before = recordOf(root, outside);
    const r = await run(['build', '--html-only', '--quiet'], root);
    expect(r.code).toBe(1);
    expect(r.err).toMatch(/^cellbasis: build: site is a folder that cellbasis did not make \(it has no \.cellbasis-site marker\); nothing was changed/);
    expect(recordOf(root, outside)).toEqual(before);
  });

  it('builds into a new or an empty folder and marks it; replaces a site it built and a real folder carrying its marker', async () => {
    const { root } = workspace();
    mkdirSync(join(root, 'empty'));
    for (const out of ['fresh', 'empty']) {
      const r = await run(['build', '--out', out, '--html-only', '--quiet'], root);
      expect(r.code, r.err).toBe(0);
      expect(readFileSync(join(root, out, SITE_MARKER), 'utf8')).toBe(SITE_MARKER_TEXT);
      expect(readFileSync(join(root, out, 'projects', 'p1', 'index.html'), 'utf8')).toMatch(/<html/);
    }
    const again = await run(['build', '--out', 'fresh', '--html-only', '--quiet'], root);
    expect(again.code, again.err).toBe(0);
    // A real folder with the marker, as serve or a copy of a site leaves it.
    mkdirSync(join(root, 'served'));
    writeFileSync(join(root, 'served', SITE_MARKER), SITE_MARKER_TEXT);
    writeFileSync(join(root, 'served', 'index.html'), 'an old page\n');
    const served = await run(['build', '--out', 'served', '--html-only', '--quiet'], root);
    expect(served.code, served.err).toBe(0);
    expect(readFileSync(join(root, 'served', 'index.html'), 'utf8')).toMatch(/<html/);
  });

  it('leaves in place, and names, what looks like a killed build\'s leftover but is not one', async () => {
    const { root, outside } = workspace();
    const dead = deadPid();
    const stem = `site.${dead}-0123abcd`;
    mkdirSync(join(root, `${stem}.build.tmp`));
    writeFileSync(join(root, `${stem}.build.tmp`, 'notes.txt'), 'precious\n');
    mkdirSync(join(root, `${stem}.build`));
    writeFileSync(join(root, `${stem}.build`, SITE_MARKER), 'a spoof\n');
    writeFileSync(join(root, `${stem}.link.tmp`), 'a file, not a link\n');
    symlinkSync(outside, join(root, `${stem}.old.tmp`));
    const names = [`${stem}.build`, `${stem}.build.tmp`, `${stem}.link.tmp`, `${stem}.old.tmp`];
    const record = () => ({ ...Object.fromEntries(names.flatMap((n) => Object.entries(prefixed(n, treeRecord(join(root, n)))))), ...prefixed('outside', treeRecord(outside)) });
    const before = record();
    const r = await run(['build', '--html-only', '--quiet'], root);
    expect(r.code, r.err).toBe(0);
    for (const name of names) expect(r.err, name).toContain(`cellbasis: left ${name} in place: named as a build's leftover, but not something cellbasis made; remove it yourself if it is yours to remove\n`);
    expect(r.err).not.toMatch(/removed|put back/);
    expect(record(), 'each left exactly as it was').toEqual(before);
  });
});

it('serve refuses a site/ that cellbasis did not make, before writing anything', async () => {
  const { root, outside } = workspace();
  mkdirSync(join(root, 'site'));
  writeFileSync(join(root, 'site', 'index.html'), '<p>my own site</p>\n');
  symlinkSync(outside, join(root, 'site', 'elsewhere'));
  const before = recordOf(root, outside);
  let refusal: unknown = null;
  try {
    const server = await serveSite({ root, port: 1 });
    await server.stop();
  } catch (error) {
    refusal = error;
  }
  expect(String(refusal)).toMatch(/serve: site is a folder that cellbasis did not make \(it has no \.cellbasis-site marker\); nothing was changed/);
  expect((refusal as { exitCode?: number }).exitCode).toBe(1);
  expect(recordOf(root, outside)).toEqual(before);
});

it('serve refuses a site/ that is a link to a foreign folder or to nothing, and writes nothing through it', async () => {
  const { root, outside } = workspace();
  for (const [target, says] of [
    [outside, /serve: site \(a symbolic link to .*cellbasis-foreign-outside-.*\) is a folder that cellbasis did not make/],
    [join(outside, 'not-yet'), /serve: site is a symbolic link to .*not-yet, which does not exist/],
  ] as const) {
    symlinkSync(target, join(root, 'site'));
    const before = recordOf(root, outside);
    await expect(serveSite({ root, port: 1 })).rejects.toThrow(says);
    expect(recordOf(root, outside)).toEqual(before);
    rmSync(join(root, 'site'));
  }
});

it('npx @11ty/eleventy with the site\'s configuration refuses a foreign output folder and marks the one it writes', async () => {
  const { root, outside } = workspace();
  const eleventy = join(import.meta.dirname, '..', '..', 'node_modules', '@11ty', 'eleventy', 'cmd.cjs');
  const config = join(import.meta.dirname, '..', '..', '.eleventy.js');
  mkdirSync(join(root, 'site'));
  writeFileSync(join(root, 'site', 'notes.txt'), 'precious\n');
  const before = recordOf(root, outside);
  const refused = await runNode([eleventy, `--config=${config}`, '--quiet'], root);
  expect(refused.code).not.toBe(0);
  expect(refused.err).toMatch(/site is a folder that cellbasis did not make/);
  expect(recordOf(root, outside)).toEqual(before);
  rmSync(join(root, 'site'), { recursive: true });
  const written = await runNode([eleventy, `--config=${config}`, '--quiet'], root);
  expect(written.code, written.err).toBe(0);
  expect(readFileSync(join(root, 'site', SITE_MARKER), 'utf8')).toBe(SITE_MARKER_TEXT);
}, 120_000);

it('the caches\' tidying removes only regular files of their own naming', () => {
  const { root, outside } = workspace();
  const dead = deadPid();
  const results = join(root, CACHE_DIR, 'results');
  mkdirSync(results, { recursive: true });
  const entry = 'a'.repeat(64);
  writeFileSync(join(results, `${entry}.json.${dead}.tmp`), '{"torn');
  writeFileSync(join(results, `notes.${dead}.tmp`), 'precious\n');
  mkdirSync(join(results, `${'b'.repeat(64)}.json.${dead}.tmp`));
  writeFileSync(join(results, `${'b'.repeat(64)}.json.${dead}.tmp`, 'inside'), 'precious\n');
  symlinkSync(join(outside, 'precious.txt'), join(results, `${'c'.repeat(64)}.json.${dead}.tmp`));
  const before = treeRecord(results);
  expect(removeCacheLeftovers(root)).toEqual([join(CACHE_DIR, 'results', `${entry}.json.${dead}.tmp`)]);
  const after = treeRecord(results);
  for (const key of Object.keys(before).filter((k) => k !== '.' && !k.startsWith(entry))) expect(after[key], key).toBe(before[key]);
  expect(readFileSync(join(outside, 'precious.txt'), 'utf8')).toBe('kept outside\n');
});

it('keygen and new never write through a symbolic link nor over a file', async () => {
  const { root, outside } = workspace();
  symlinkSync(join(outside, 'stolen.key'), join(root, 'alice.key'));
  writeFileSync(join(root, 'bob.pub'), 'precious\n');
  mkdirSync(join(root, 'projects', 'p2'));
  symlinkSync(join(outside, 'precious.txt'), join(root, 'projects', 'p2', 'basis.yaml'));
  const before = recordOf(root, outside);
  for (const argv of [['keygen', 'alice', '--dir', '.'], ['keygen', 'bob', '--dir', '.'], ['new', 'p1', '--technology', 'pem'], ['new', 'p2', '--technology', 'pem']]) {
    const r = await run(argv, root);
    expect(r.code, argv.join(' ')).toBe(2);
    expect(r.err, argv.join(' ')).toMatch(/exists already|already exists|leads outside projects\//);
  }
  expect(recordOf(root, outside)).toEqual(before);
});

describeWithChromium('issue keeps what it did not make in issued/', () => {
  it('a lock that is no lock of issue is refused; a foreign folder named as a killed issue run\'s is left in place', async () => {
    const cwd = archiveWorkspace();
    made.push(cwd);
    const issued = join(cwd, 'projects', PROJECT, 'issued');
    mkdirSync(join(issued, '.issue-lock'), { recursive: true });
    writeFileSync(join(issued, '.issue-lock', 'notes.txt'), 'precious\n');
    const before = treeRecord(issued);
    const locked = await issue(cwd, ['A', '--status', 'issued for review', '--date', '2026-11-30']);
    expect(locked.err).toBe(`cellbasis: issue: projects/${PROJECT}/issued/.issue-lock is not a lock that cellbasis issue wrote; nothing was changed: remove it yourself if no issue runs\n`);
    expect(locked.code).toBe(1);
    expect(treeRecord(issued)).toEqual(before);
    rmSync(join(issued, '.issue-lock'), { recursive: true });
    writeFileSync(join(issued, '.issue-lock'), 'mine\n');
    const spoofed = treeRecord(issued);
    expect((await issue(cwd, ['A', '--status', 'issued for review', '--date', '2026-11-30'])).code).toBe(1);
    expect(treeRecord(issued)).toEqual(spoofed);
    rmSync(join(issued, '.issue-lock'));

    const dead = deadPid();
    const foreign = `.tmp-A-${dead}`;
    mkdirSync(join(issued, foreign));
    writeFileSync(join(issued, foreign, 'notes.txt'), 'precious\n');
    const own = `.tmp-A-${deadPid()}`;
    mkdirSync(join(issued, own));
    writeFileSync(join(issued, own, 'basis.yaml'), 'a killed issue run wrote this\n');
    const kept = treeRecord(join(issued, foreign));
    const r = await issue(cwd, ['A', '--status', 'issued for review', '--date', '2026-11-30']);
    expect(r.code, r.err).toBe(0);
    expect(r.err).toContain(`cellbasis: left projects/${PROJECT}/issued/${foreign} in place: named as a killed issue run's temporary folder, but not something cellbasis made; remove it yourself\n`);
    expect(treeRecord(join(issued, foreign))).toEqual(kept);
    expect(() => readFileSync(join(issued, own, 'basis.yaml')), 'the killed issue run\'s own folder is removed').toThrow(/ENOENT/);
  }, ISSUE_TIMEOUT);
});
