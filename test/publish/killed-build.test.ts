// `cellbasis build` killed at any moment leaves the site folder showing either the complete
// previous site or the complete new one, byte for byte (every file of the tree hashed), never a
// partial one; the next build succeeds and removes what the killed ones left. Two demo projects
// are built in a temporary folder by the real binary (node bin/cellbasis.js, a child process
// in its own process group); then a basis changes and further builds are killed with SIGKILL
// of the whole group:
//   - at each step of the swap (CELLBASIS_BUILD_PAUSE, lib/publish/build.ts BUILD_STEPS): after
//     the temporary folder is made, after rendering, after printing, once the folder is
//     complete, once the link to it is made, and once the link is swapped in;
//   - at moments nobody chose, spread over a build's duration (measured first), with the draft
//     PDFs printed anew each time so the kill can land in Chromium's printing too.
// Each build goes to the other version of the basis than the one the site shows, so that a
// partial swap in either direction would be seen. Every file is compared byte for byte except
// the draft PDFs, which are printed anew and compared by treeLayoutDigest (glyph positions to
// a whole unit: Chromium under load has placed a glyph 1/8 unit apart; a torn PDF still differs). After each kill, no process the build
// started (Chromium) may outlive it. At the end a build completes, says what it removed, and
// leaves beside site/ only the folder site/ links to.
//
// Where site/ is a real folder (made by serve, npx @11ty/eleventy or by hand), the build must
// first move it aside, and between that rename and the next the site is missing: the test
// shows the README's guarantee for that one case exactly (the old site complete in
// site.<pid>-<random>.old.tmp, put back by the next build, even one that fails).
import { cpSync, existsSync, readdirSync, readFileSync, readlinkSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { BUILD_STEPS } from '../../lib/publish/build.ts';
import { CACHE_DIR } from '../../lib/batch/results-cache.ts';
import { announceChromiumSkip, describeWithChromium } from '../helpers/chromium.ts';
import { basisFile, demoRoot, EPOCH, treeLayoutDigest } from '../helpers/site.ts';
import { cellbasis, descendants, expectCompleteSite, running, startCellbasis, until, type Started } from '../helpers/child-process.ts';

announceChromiumSkip('the killed-build tests');

const PROJECTS = ['hob-tor-pem-backup', 'kestrelford-pem-electrolyser'] as const;
const CHANGED = 'hob-tor-pem-backup';
const TITLE = 'title: 8 kW PEM backup power unit';

type Version = 'old' | 'new';

describeWithChromium('cellbasis build killed at any moment', () => {
  let root: string;
  let original: string;
  const digests = {} as Record<Version, Record<string, string>>;
  /** Wall time of a build that prints both drafts, ms. */
  let duration = 0;
  let shown: Version = 'old';
  const site = () => join(root, 'site');
  const basisText = (v: Version) => (v === 'old' ? original : original.replace(TITLE, 'title: 8.5 kW PEM backup power unit'));
  /** What beside site/ a build made: site.<pid>-<random>.<kind>. */
  const siblings = () => readdirSync(root).filter((n) => /^site\.\d+-[0-9a-f]{8}\./.test(n)).sort();

  /** The site folder as the two complete builds left it: which one it is, or a failure naming the difference. */
  function expectSiteIs(version: Version, when: string): void {
    const now = treeLayoutDigest(site());
    const other: Version = version === 'old' ? 'new' : 'old';
    if (JSON.stringify(now) === JSON.stringify(digests[other])) throw new Error(`${when}: site/ shows the ${other} site, expected the ${version} one`);
    expect(now, `${when}: site/ is the complete ${version} site`).toEqual(digests[version]);
  }

  function expectOldOrNew(when: string): Version {
    const now = treeLayoutDigest(site());
    const version = (['old', 'new'] as const).find((v) => JSON.stringify(now) === JSON.stringify(digests[v]));
    if (!version) {
      const unlike = (v: Version) => [...new Set([...Object.keys(now), ...Object.keys(digests[v])])].filter((path) => now[path] !== digests[v][path]).join(', ');
      throw new Error(`${when}: site/ is neither the complete old site (it differs in ${unlike('old')}) nor the complete new one (it differs in ${unlike('new')})`);
    }
    return version;
  }

  /** Kills a build and everything it started; no process of it may live on. */
  async function kill(build: Started): Promise<void> {
    const started = descendants(build.child.pid!);
    try {
      process.kill(-build.child.pid!, 'SIGKILL');
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code !== 'ESRCH') throw error;
    }
    await build.exited;
    await until(() => started.every((pid) => !running(pid)), `the processes the build started (${started.join(', ')}) to end`, 30_000);
  }

  /** Sets the basis to the version the site does not show and starts a build of it. */
  function startTowardsOther(pauseAt?: string): { build: Started; target: Version } {
    const target: Version = shown === 'old' ? 'new' : 'old';
    writeFileSync(basisFile(root, CHANGED), basisText(target));
    return { build: startCellbasis(['build'], root, { ...EPOCH, ...(pauseAt ? { CELLBASIS_BUILD_PAUSE: pauseAt } : {}) }), target };
  }

  /** Forgets the printed drafts, so the next build prints them again. */
  const forgetPdfs = () => rmSync(join(root, CACHE_DIR, 'pdf'), { recursive: true, force: true });

  beforeAll(async () => {
    root = demoRoot(PROJECTS);
    original = readFileSync(basisFile(root, CHANGED), 'utf8');
    expect(original).toContain(TITLE);
    for (const version of ['new', 'old'] as const) {
      writeFileSync(basisFile(root, CHANGED), basisText(version));
      forgetPdfs();
      const r = await cellbasis(['build'], root, { env: EPOCH });
      expect(r.code, r.err).toBe(0);
      duration = Math.max(duration, r.ms);
      expectCompleteSite(site(), PROJECTS);
      digests[version] = treeLayoutDigest(site());
    }
    expect(digests.new).not.toEqual(digests.old);
    shown = 'old';
    console.info(`killed builds: a build printing both drafts takes ${(duration / 1000).toFixed(1)} s`);
  }, 600_000);

  afterAll(() => rmSync(root, { recursive: true, force: true }));

  it('builds are reproducible, so that "the complete old site" and "the complete new site" are exact', async () => {
    const r = await cellbasis(['build'], root, { env: EPOCH });
    expect(r.code).toBe(0);
    expectSiteIs('old', 'rebuilt unchanged');
  }, 300_000);

  it('killed at each step of the build and the swap: the old site until the link is swapped in, the new one from then on', async () => {
    const expected: Record<string, RegExp[]> = {
      'temp-created': [/\.build\.tmp$/],
      rendered: [/\.build\.tmp$/],
      printed: [/\.build\.tmp$/],
      completed: [/\.build$/],
      linked: [/\.build$/, /\.link\.tmp$/],
      swapped: [/\.build$/],
    };
    for (const step of BUILD_STEPS.filter((s) => s !== 'moved-aside')) {
      const before = new Set(siblings());
      const { build, target } = startTowardsOther(step);
      await until(() => build.stderr().includes(`build paused at ${step}`) || build.child.exitCode !== null, `the pause at ${step}`);
      expect(build.stderr(), step).toContain(`cellbasis: build paused at ${step} (CELLBASIS_BUILD_PAUSE)`);
      await kill(build);
      if (step === 'swapped') {
        expectSiteIs(target, `killed at ${step}`);
        shown = target;
      } else expectSiteIs(shown, `killed at ${step}`);
      const pid = build.child.pid!;
      const left = siblings().filter((n) => n.startsWith(`site.${pid}-`));
      expect(left.map((n) => expected[step]!.some((p) => p.test(n))), `${step}: left ${left.join(', ')}`).toEqual(expected[step]!.map(() => true));
      // What earlier killed builds left was removed by this one, except the folder site/ shows.
      const stale = [...before].filter((n) => siblings().includes(n));
      expect(stale.length, `${step}: still there from before: ${stale.join(', ')}`).toBeLessThanOrEqual(1);
    }
  }, 900_000);

  it('killed at moments spread over a build, printing included: always the complete old or new site', async () => {
    const outcomes: string[] = [];
    for (const fraction of [0.1, 0.3, 0.5, 0.7, 0.85, 0.95, 1.02, 1.1, 1.2]) {
      forgetPdfs();
      const { build, target } = startTowardsOther();
      const delay = Math.round(duration * fraction);
      await new Promise((r) => setTimeout(r, delay));
      const finished = build.child.exitCode !== null;
      await kill(build);
      const seen = expectOldOrNew(`killed after ${delay} ms`);
      if (finished) expect(seen, 'a build that ended shows its site').toBe(target);
      outcomes.push(`${delay} ms: ${finished ? 'had finished' : seen === target ? 'new site already in' : 'old site kept'}`);
      shown = seen;
    }
    console.info(`killed builds: ${outcomes.join('; ')}`);
  }, 900_000);

  it('the next build succeeds, removes what killed builds left and leaves only the site it links to', async () => {
    // Each build removes what the killed ones before it left; a kill once the link is made leaves two things.
    const { build } = startTowardsOther('linked');
    await until(() => build.stderr().includes('build paused at linked'), 'the pause at linked');
    await kill(build);
    const left = siblings().filter((n) => n !== readlinkName());
    expect(left.map((n) => n.replace(/^site\.\d+-[0-9a-f]{8}/, 'site.*')).sort()).toEqual(['site.*.build', 'site.*.link.tmp']);
    // A kill between a cache entry's write and its rename leaves <entry>.<pid>.tmp; the window is
    // too short to hit at will, so such a file of the killed build's process is put there.
    const stale = join(root, CACHE_DIR, 'results', `${'0'.repeat(64)}.json.${build.child.pid}.tmp`);
    writeFileSync(stale, '{"torn');
    const target: Version = shown === 'old' ? 'new' : 'old';
    writeFileSync(basisFile(root, CHANGED), basisText(target));
    const r = await cellbasis(['build'], root, { env: EPOCH });
    expect(r.code, r.err).toBe(0);
    for (const name of left) expect(r.err, name).toContain(`cellbasis: removed ${name}, left by an interrupted build\n`);
    expect(r.err).toContain('cellbasis: removed 1 temporary file under .cellbasis-cache/, left by an interrupted build\n');
    expect(existsSync(stale)).toBe(false);
    expectSiteIs(target, 'after the next build');
    shown = target;
    expect(siblings()).toEqual([readlinkName()]);
    expect(readdirSync(root).sort()).toEqual(['.cellbasis-cache', 'projects', 'site', readlinkName()].sort());
    expectCompleteSite(site(), PROJECTS);
  }, 600_000);

  it('where site/ is a real folder, it is missing only between the two renames, kept whole aside, and put back by the next build even when that build fails', async () => {
    // site/ as serve or a copy by hand would leave it: a real folder with the current site.
    const copy = join(root, 'site-copy');
    cpSync(site(), copy, { recursive: true, dereference: true });
    rmSync(site());
    renameSync(copy, site());
    expectSiteIs(shown, 'the real folder');
    const { build } = startTowardsOther('moved-aside');
    await until(() => build.stderr().includes('build paused at moved-aside') || build.child.exitCode !== null, 'the pause at moved-aside');
    await kill(build);
    expect(existsSync(site()), 'killed between the renames: site/ is missing').toBe(false);
    const aside = siblings().filter((n) => n.endsWith('.old.tmp'));
    expect(aside).toHaveLength(1);
    expect(treeLayoutDigest(join(root, aside[0]!)), 'and the complete old site is aside').toEqual(digests[shown]);

    // A build that fails (a basis with an error) still puts it back.
    writeFileSync(basisFile(root, CHANGED), basisText(shown).replace('value: "62 C", source: R2', 'value: "warm", source: R2'));
    const failed = await cellbasis(['build'], root, { env: EPOCH });
    expect(failed.code).toBe(1);
    expect(failed.err).toContain('the previous site is left as it was');
    expectSiteIs(shown, 'put back by a failed build');
    expect(siblings().filter((n) => n.endsWith('.old.tmp'))).toEqual([]);

    const target: Version = shown === 'old' ? 'new' : 'old';
    writeFileSync(basisFile(root, CHANGED), basisText(target));
    const r = await cellbasis(['build'], root, { env: EPOCH });
    expect(r.code, r.err).toBe(0);
    expectSiteIs(target, 'the next build');
    expect(siblings()).toEqual([readlinkName()]);
  }, 600_000);

  /** The folder site/ links to. */
  function readlinkName(): string {
    return readlinkSync(site());
  }
});
