// The contributor guide keeps one list of the values quoted from memory (DEVELOPERS.md, "Values
// quoted from memory (open items)"). This test holds it to the files: every field of the hazard
// data, every standard, threshold and reference check flagged `memory: true` is listed, nothing
// listed is no longer flagged, and every other file of lib/ and test/ that quotes a value "from
// memory" is named by its path. A file that only describes the flag (a schema, a formatter) is
// not a quotation and is named below.
import { readFileSync, readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { parse } from 'yaml';
import { describe, expect, it } from 'vitest';

const ROOT = fileURLToPath(new URL('../..', import.meta.url));
const read = (path: string) => readFileSync(join(ROOT, path), 'utf8');

function section(): string {
  const guide = read('DEVELOPERS.md');
  const start = guide.indexOf('## Values quoted from memory (open items)');
  expect(start, 'DEVELOPERS.md has no section "Values quoted from memory (open items)"').toBeGreaterThan(0);
  const end = guide.indexOf('\n## ', start + 3);
  return guide.slice(start, end < 0 ? undefined : end);
}

/** The comma-separated ids after the colon of the list item that names `path`. */
function listed(path: string): string[] {
  const line = section().split('\n').find((l) => l.startsWith(`- \`${path}\``));
  expect(line, `no list item for ${path}`).toBeDefined();
  return line!.slice(line!.indexOf(': ') + 2).split(', ').map((x) => x.trim()).filter(Boolean);
}

type Flagged = { memory?: boolean } | undefined;
const flagged = (v: unknown): boolean => Array.isArray(v) ? v.some((x) => (x as Flagged)?.memory === true) : (v as Flagged)?.memory === true;

describe('the open items of the contributor guide', () => {
  it('lists, for every substance of the hazard data, exactly the fields quoted from memory', () => {
    const substances = parse(read('lib/hazards/data/substances.yaml')).substances as Record<string, Record<string, unknown>>;
    const lines = new Map(
      section()
        .split('\n')
        .map((l) => /^ {2}- `([^`]+)`: (.*)$/.exec(l))
        .filter((m) => m !== null)
        .map((m) => [m[1]!, m[2]!.split(', ')]),
    );
    for (const [label, s] of Object.entries(substances)) {
      const fields = Object.entries(s).flatMap(([key, value]) =>
        key === 'exposure_ppm' ? Object.entries(value as Record<string, Flagged>).filter(([, v]) => v?.memory).map(([limit]) => `exposure_ppm.${limit}`) : flagged(value) ? [key] : [],
      );
      expect(lines.get(label) ?? [], label).toEqual(fields);
    }
    for (const label of lines.keys()) expect(Object.keys(substances), `listed but not in substances.yaml: ${label}`).toContain(label);
  });

  it('lists exactly the standards, thresholds and reference checks flagged memory: true', () => {
    const ids = (entries: [string, unknown][]) => entries.filter(([, v]) => flagged(v)).map(([id]) => id);
    expect(listed('lib/hazards/data/standards.yaml')).toEqual(ids(Object.entries(parse(read('lib/hazards/data/standards.yaml')))));
    expect(listed('lib/hazards/data/thresholds.yaml')).toEqual(ids(Object.entries(parse(read('lib/hazards/data/thresholds.yaml')))));
    const checks = parse(read('lib/verification/reference-checks.yaml')) as { id: string; memory: boolean }[];
    expect(listed('lib/verification/reference-checks.yaml')).toEqual(checks.filter((c) => c.memory).map((c) => c.id));
  });

  it('names every file of lib/ and test/ that quotes a value from memory', () => {
    const describesTheFlag = new Set([
      'lib/hazards/format-text.ts',
      'lib/hazards/substances.ts',
      'lib/hazards/types.ts',
      'lib/report/sections/verification.ts',
      'test/verification/reference-checks.test.ts',
      'test/architecture/open-items.test.ts',
    ]);
    const files = (dir: string): string[] =>
      readdirSync(join(ROOT, dir)).flatMap((name) => {
        const path = `${dir}/${name}`;
        return statSync(join(ROOT, path)).isDirectory() ? files(path) : [path];
      });
    const quoting = [...files('lib'), ...files('test')]
      .filter((path) => /\.(ts|ya?ml|txt|inp)$/.test(path) && !describesTheFlag.has(path))
      .filter((path) => /from memory|memory: true/i.test(read(path)));
    const text = section();
    const missing = quoting.filter((path) => !text.includes(`\`${path}\``));
    expect(missing).toEqual([]);
    expect(quoting.length).toBeGreaterThan(10);
  });
});
