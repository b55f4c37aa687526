// The cache of checked bases (lib/batch/basis-cache.ts) must give exactly what loading the bytes
// gives: the site's pages are made from what it returns, and a build must write the same bytes
// whether a basis came from the cache or was parsed. No physics here: every expected value is the
// loader's own output for the same bytes.
import { readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { BasisCache, loadThroughCache } from '../../lib/batch/basis-cache.ts';
import { CACHE_DIR, resultsKey } from '../../lib/batch/results-cache.ts';
import { loadBasisText, type LoadResult } from '../../lib/basis/load.ts';
import { projectsRoot, scaffoldText } from '../helpers/scaffold-basis.ts';

const PROJECTS = fileURLToPath(new URL('../../projects', import.meta.url));

function entries(root: string): string[] {
  try {
    return readdirSync(join(root, CACHE_DIR, 'bases'));
  } catch {
    return [];
  }
}

describe('the cache of checked bases', () => {
  it('gives back, for each demo project and a basis with a warning, exactly what loading its bytes gives', () => {
    const root = projectsRoot('basis-cache', {});
    // Mole fractions summing to 0.995: a warning (normalised to 1), which must travel through the cache.
    const warning = scaffoldText('solid-oxide', 'power', 'w', { 'streams.fuel-electrode.composition': { CH4: 0.93, CO2: 0.035, N2: 0.03 }, 'streams.fuel-electrode.pre-reforming': 'none' });
    const bases: [string, Buffer][] = readdirSync(PROJECTS).map((id) => [id, readFileSync(join(PROJECTS, id, 'basis.yaml'))]);
    let warned = 0;
    for (const [id, bytes] of [...bases, ['w', Buffer.from(warning)] as [string, Buffer]]) {
      const file = `projects/${id}/basis.yaml`;
      const fresh = loadBasisText(bytes, file, id);
      expect(fresh.ok, id).toBe(true);
      warned += fresh.warnings.length;
      const cache = new BasisCache(root);
      expect(loadThroughCache(cache, bytes, file, id), `${id}: loaded and stored`).toStrictEqual(fresh);
      expect(cache.get(resultsKey(bytes, id, file)), `${id}: the entry`).toBeDefined();
      expect(loadThroughCache(new BasisCache(root), bytes, file, id), `${id}: read back`).toStrictEqual(fresh);
    }
    expect(warned).toBeGreaterThan(0);
    expect(entries(root)).toHaveLength(bases.length + 1);
  });

  it('keys an entry by the bytes, the id and the file: another of any of them is loaded afresh', () => {
    const text = scaffoldText('pem', 'power', 'a');
    const root = projectsRoot('basis-cache', {});
    const cache = new BasisCache(root);
    loadThroughCache(cache, Buffer.from(text), 'projects/a/basis.yaml', 'a');
    const changed = text.replace(/^(\s*title: ).*$/m, '$1Another title');
    expect(changed).not.toBe(text);
    const again = loadThroughCache(cache, Buffer.from(changed), 'projects/a/basis.yaml', 'a');
    expect(again).toStrictEqual(loadBasisText(changed, 'projects/a/basis.yaml', 'a'));
    expect(loadThroughCache(cache, Buffer.from(text), 'projects/b/basis.yaml', 'b')).toStrictEqual(loadBasisText(text, 'projects/b/basis.yaml', 'b'));
    expect(entries(root)).toHaveLength(3);
  });

  it('stores no basis with errors, and treats an edited entry as a miss', () => {
    const root = projectsRoot('basis-cache', {});
    const cache = new BasisCache(root);
    const bad = scaffoldText('pem', 'power', 'a', { 'operating-point.current-density': 'many A/cm2' });
    const failed = loadThroughCache(cache, Buffer.from(bad), 'projects/a/basis.yaml', 'a');
    expect(failed.ok).toBe(false);
    expect(entries(root)).toHaveLength(0);
    const text = Buffer.from(scaffoldText('pem', 'power', 'a'));
    const fresh = loadThroughCache(cache, text, 'projects/a/basis.yaml', 'a') as Extract<LoadResult, { ok: true }>;
    const [name] = entries(root);
    const file = join(root, CACHE_DIR, 'bases', name!);
    // Still valid JSON of a basis: only the entry's hash tells the edit.
    writeFileSync(file, readFileSync(file, 'latin1').replace(`"id":"a"`, `"id":"z"`), 'latin1');
    expect(readFileSync(file, 'latin1')).toContain(`"id":"z"`);
    expect(loadThroughCache(cache, text, 'projects/a/basis.yaml', 'a')).toStrictEqual(fresh);
  });

  it('stores no load that JSON would not give back exactly (an undefined member, −0)', () => {
    const root = projectsRoot('basis-cache', {});
    const cache = new BasisCache(root);
    const loaded = loadBasisText(scaffoldText('pem', 'power', 'a'), 'projects/a/basis.yaml', 'a') as Extract<LoadResult, { ok: true }>;
    cache.put('a'.repeat(64), { ...loaded, basis: { ...loaded.basis, id: undefined as unknown as string } });
    cache.put('b'.repeat(64), { ...loaded, basis: { ...loaded.basis, positions: { x: { line: -0, column: 1 } } } });
    expect(entries(root)).toHaveLength(0);
    cache.put('c'.repeat(64), loaded);
    expect(cache.get('c'.repeat(64))).toStrictEqual(loaded);
  });
});
