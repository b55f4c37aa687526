// A basis saved while a build calculates (lib/publish/build.ts, precompute): each waiting project
// is held as its key and read again when its turn comes, so a basis saved after the listing and
// before its turn is calculated as saved, its results stored under the key of the saved bytes and
// none under the key of the bytes listed; the build goes on, and the page shows the saved text.
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, expect, it } from 'vitest';
import { writeSyntheticProjects } from '../../bench/synthetic.ts';
import { ResultsCache, resultsKey } from '../../lib/batch/results-cache.ts';
import { buildSite } from '../../lib/publish/build.ts';

const root = mkdtempSync(join(tmpdir(), 'cellbasis-test-saved-'));
afterAll(() => rmSync(root, { recursive: true, force: true }));

it('a basis saved before its turn in the calculation is calculated and shown as saved, with nothing cached under the bytes listed', async () => {
  const [, second] = writeSyntheticProjects(root, 2) as [string, string];
  const file = `projects/${second}/basis.yaml`;
  const listed = readFileSync(join(root, file));
  const saved = Buffer.from(listed.toString('utf8').replace(/^( {2}title: ).*$/m, '$1Saved during the build'));
  expect(saved.equals(listed)).toBe(false);
  let savedAt: number | undefined;
  // One thread below 150 projects a worker (lib/batch/batch.ts): the jobs run in order, the second taken after the first is reported.
  const report = await buildSite({
    root,
    pdf: false,
    onProgress: (step, done) => {
      if (step !== 'calculate' || done !== 1 || savedAt !== undefined) return;
      writeFileSync(join(root, file), saved);
      savedAt = done;
    },
  });
  expect(savedAt).toBe(1);
  expect(report.documents).toBe(2);
  expect(readFileSync(join(root, 'site', 'projects', second, 'index.html'), 'utf8')).toContain('Saved during the build');
  const cache = new ResultsCache(root);
  expect(cache.has(resultsKey(saved, second, file))).toBe(true);
  // Before, the bytes listed were held and calculated, and their results left in the cache beside those of the page.
  expect(cache.has(resultsKey(listed, second, file))).toBe(false);
}, 180_000);
