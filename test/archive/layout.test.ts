// Which folders a command writing elsewhere must leave alone: the sealed folders and what holds them.
import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, expect, it } from 'vitest';
import { sealedFolderAt } from '../../lib/archive/layout.ts';

const cwd = mkdtempSync(join(tmpdir(), 'cellbasis-layout-'));
mkdirSync(join(cwd, 'projects', 'a', 'sealed', 'A'), { recursive: true });
mkdirSync(join(cwd, 'projects', 'b'), { recursive: true });
afterAll(() => rmSync(cwd, { recursive: true, force: true }));

it('names the sealed folder a target lies in or would replace, and nothing for other places', () => {
  const sealed = join(cwd, 'projects', 'a', 'sealed');
  expect(sealedFolderAt(cwd, 'projects/a/sealed/A')).toBe(sealed);
  expect(sealedFolderAt(cwd, 'projects/a/sealed/new-site')).toBe(sealed);
  expect(sealedFolderAt(cwd, 'projects/b/sealed')).toBe(join(cwd, 'projects', 'b', 'sealed'));
  expect(sealedFolderAt(cwd, 'projects')).toBe(sealed);
  expect(sealedFolderAt(cwd, '.')).toBe(sealed);
  expect(sealedFolderAt(cwd, 'projects/a')).toBe(sealed);
  expect(sealedFolderAt(cwd, 'site')).toBeNull();
  expect(sealedFolderAt(cwd, 'projects/b')).toBeNull();
  expect(sealedFolderAt(cwd, 'projects/a/site')).toBeNull();
  expect(sealedFolderAt(cwd, join(tmpdir(), 'elsewhere'))).toBeNull();
});
