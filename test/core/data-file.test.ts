// The library's data files are checked against their schemas at load: a file that does not match
// stops with an error naming the file and each wrong place, before any number is computed from it.
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { z } from 'zod';
import { readDataFile } from '../../lib/core/data-file.ts';

const dir = mkdtempSync(join(tmpdir(), 'cellbasis-data-file-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const Unit = z.record(z.string(), z.strictObject({ factor: z.number().positive(), offset: z.number().optional() }));

function file(name: string, text: string): URL {
  const path = join(dir, name);
  writeFileSync(path, text);
  return pathToFileURL(path);
}

describe('readDataFile', () => {
  it('returns the parsed and checked content', () => {
    expect(readDataFile(file('good.yaml', 'K: { factor: 1 }\nC: { factor: 1, offset: 273.15 }\n'), Unit)).toEqual({ K: { factor: 1 }, C: { factor: 1, offset: 273.15 } });
  });

  it('names the file and every place that does not match', () => {
    const url = file('bad.yaml', 'K: { factor: -1 }\nC: { factor: 1, ofset: 273.15 }\n');
    expect(() => readDataFile(url, Unit)).toThrow(/bad\.yaml does not match its schema: K\.factor: .*; C: .*ofset/);
  });
});
