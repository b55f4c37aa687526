// An issued revision's pages never recalculate (issue 20.6): the site shows the document as
// issued and a register page made from the manifest and the issued basis and results. Here the
// species data change between two builds (the enthalpy constant b1 of H2O shifted in every
// interval, in this process, as a corrected or replaced data file would): the working draft's
// page changes with them, and every file of the issued revisions' pages stays byte-identical.
import { readFileSync, readdirSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { buildSite } from '../../lib/publish/build.ts';
import { getSpecies } from '../../lib/thermo/species-data.ts';
import type { NasaInterval } from '../../lib/thermo/nasa-glenn.ts';
import { treeDigest } from '../helpers/tree-digest.ts';
import { EPOCH, issuedDemoRoot, SOFC } from '../helpers/site.ts';

let root: string;
const before: Record<string, Record<string, string>> = {};
let draftBefore = '';
const after: Record<string, Record<string, string>> = {};
let draftAfter = '';

/** Shifts b1 of every interval of H2O by `deltaB1` (b1 is h/R's integration constant, in K: 1000 K is 8.3 kJ/mol). */
function shiftWater(deltaB1: number): void {
  for (const interval of getSpecies('H2O').record.intervals as NasaInterval[]) interval.b1 += deltaB1;
}

function issuedPages(site: string): Record<string, Record<string, string>> {
  const dir = join(site, 'projects', SOFC);
  return Object.fromEntries(readdirSync(dir).filter((n) => n.startsWith('rev-')).map((n) => [n, treeDigest(join(dir, n))]));
}

beforeAll(async () => {
  root = await issuedDemoRoot();
  await buildSite({ root, out: join(root, 'site-1'), env: EPOCH, pdf: false });
  Object.assign(before, issuedPages(join(root, 'site-1')));
  draftBefore = readFileSync(join(root, 'site-1', 'projects', SOFC, 'index.html'), 'utf8');
  // The results cache is keyed by the species data file's hash, which this change leaves as it was.
  rmSync(join(root, '.cellbasis-cache'), { recursive: true, force: true });
  shiftWater(1000);
  try {
    await buildSite({ root, out: join(root, 'site-2'), env: EPOCH, pdf: false });
  } finally {
    shiftWater(-1000);
  }
  Object.assign(after, issuedPages(join(root, 'site-2')));
  draftAfter = readFileSync(join(root, 'site-2', 'projects', SOFC, 'index.html'), 'utf8');
}, 300_000);

afterAll(() => rmSync(root, { recursive: true, force: true }));

it('changes the working draft with the species data (so the change took effect)', () => {
  expect(draftAfter).not.toBe(draftBefore);
});

it('keeps every file of each issued revision page byte-identical when the species data change', () => {
  expect(Object.keys(before).sort()).toEqual(['rev-A', 'rev-B']);
  expect(after).toEqual(before);
});
