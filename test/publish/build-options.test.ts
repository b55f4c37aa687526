// cellbasis build's options and refusals: an output folder that would replace projects/ or the
// working folder is refused before anything is written; without Chromium the build says so and
// writes HTML; --html-only prints nothing; a second build takes results from the cache.
import { existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { renderScaffold } from '../../lib/basis/scaffolds.ts';
import { CACHE_DIR } from '../../lib/batch/results-cache.ts';
import { run } from '../helpers/run-cli.ts';

function root(): string {
  const dir = mkdtempSync(join(tmpdir(), 'cellbasis-build-options-'));
  mkdirSync(join(dir, 'projects', 'p1'), { recursive: true });
  writeFileSync(join(dir, 'projects', 'p1', 'basis.yaml'), renderScaffold('pem', 'power', 'p1', '2026-11-30'));
  return dir;
}

describe('cellbasis build options', () => {
  it('refuses --out that is the working folder, projects/ or inside it, and writes nothing', async () => {
    const dir = root();
    for (const out of ['.', 'projects', 'projects/p1', 'projects/p1/issued/A', '..']) {
      const r = await run(['build', '--out', out, '--html-only'], dir);
      expect(r.code, out).toBe(2);
      expect(r.err, out).toMatch(/would replace the working folder or write inside projects\//);
    }
    expect(readdirSync(dir).sort()).toEqual(['projects']);
  });

  it('writes an absolute --out where it names, not under the working folder', async () => {
    const dir = root();
    const out = join(mkdtempSync(join(tmpdir(), 'cellbasis-build-out-')), 'public');
    const r = await run(['build', '--out', out, '--html-only', '--quiet'], dir);
    expect(r.code, r.err).toBe(0);
    expect(existsSync(join(out, 'projects', 'p1', 'index.html'))).toBe(true);
    expect(readdirSync(dir).filter((f) => !f.startsWith('.')).sort()).toEqual(['projects']);
  });

  it('without Chromium: builds the HTML and says clearly that no PDF was printed', async () => {
    const dir = root();
    const before = process.env.CELLBASIS_CHROMIUM;
    process.env.CELLBASIS_CHROMIUM = join(dir, 'no-such-browser');
    try {
      const r = await run(['build', '--quiet'], dir);
      expect(r.code).toBe(0);
      expect(r.err).toMatch(/no PDFs were printed: CELLBASIS_CHROMIUM names .* PDFs need Debian's Chromium \(apt-get install -y chromium\)/);
      expect(existsSync(join(dir, 'site', 'projects', 'p1', 'index.html'))).toBe(true);
      expect(existsSync(join(dir, 'site', 'projects', 'p1', 'document.pdf'))).toBe(false);
    } finally {
      if (before === undefined) delete process.env.CELLBASIS_CHROMIUM;
      else process.env.CELLBASIS_CHROMIUM = before;
    }
  });

  it('a Chromium that will not start fails the build with one clear message (exit 1) and leaves the previous site as it was', async () => {
    const dir = root();
    for (let i = 2; i <= 3; i++) {
      mkdirSync(join(dir, 'projects', `p${i}`));
      writeFileSync(join(dir, 'projects', `p${i}`, 'basis.yaml'), renderScaffold('pem', 'power', `p${i}`, '2026-11-30'));
    }
    expect((await run(['build', '--html-only', '--quiet'], dir)).code).toBe(0);
    const before = readdirSync(join(dir, 'site', 'projects')).sort();
    const page = readFileSync(join(dir, 'site', 'projects', 'p1', 'index.html'));
    const fake = join(dir, 'not-a-browser.sh');
    writeFileSync(fake, '#!/bin/sh\necho "this is not Chromium" >&2\nexit 3\n', { mode: 0o755 });
    const saved = process.env.CELLBASIS_CHROMIUM;
    process.env.CELLBASIS_CHROMIUM = fake;
    try {
      // Three drafts to print: both print lanes start a Chromium, and both fail.
      const r = await run(['build', '--quiet'], dir);
      expect(r.code).toBe(1);
      expect(r.err.trim().split('\n')).toEqual([expect.stringMatching(/^cellbasis: pdf: Chromium \(.*not-a-browser\.sh\) did not start: /)]);
    } finally {
      if (saved === undefined) delete process.env.CELLBASIS_CHROMIUM;
      else process.env.CELLBASIS_CHROMIUM = saved;
    }
    expect(readdirSync(join(dir, 'site', 'projects')).sort()).toEqual(before);
    expect(readFileSync(join(dir, 'site', 'projects', 'p1', 'index.html')).equals(page)).toBe(true);
    expect(readdirSync(dir).filter((n) => /^site\./.test(n)), 'beside site/ only the folder it links to').toHaveLength(1);
  }, 60_000);

  it('--html-only prints nothing and keeps results in the cache for the next build', async () => {
    const dir = root();
    const r = await run(['build', '--html-only'], dir);
    expect(r.code).toBe(0);
    expect(r.err).toMatch(/no PDFs were printed: HTML only was asked for/);
    expect(readdirSync(join(dir, CACHE_DIR, 'results'))).toHaveLength(1);
    const again = await run(['build', '--html-only'], dir);
    expect(again.out).toBe(r.out);
  });

  it('reports rendering page by page, not once at the end of a run of Eleventy', async () => {
    // Rendering is the longest step of an HTML build; it used to report only after each run of
    // 100 pages, so a build of 100 showed "render: 100/100 (0.0 s)" and nothing before.
    const dir = root();
    for (let i = 2; i <= 8; i++) {
      mkdirSync(join(dir, 'projects', `p${i}`));
      writeFileSync(join(dir, 'projects', `p${i}`, 'basis.yaml'), renderScaffold('pem', 'power', `p${i}`, '2026-11-30'));
    }
    const r = await run(['build', '--html-only'], dir);
    expect(r.code, r.err).toBe(0);
    const render = r.err.split('\n').filter((l) => l.startsWith('render: '));
    expect(render[0]).toMatch(/^render: 1\/8 \(/);
    expect(render.at(-1)).toMatch(/^render: 8\/8 \(\d+\.\d s\)$/);
    expect(render.length).toBeGreaterThanOrEqual(3);
  });
});
