// Which folders a command writing elsewhere must leave alone: the folders of issued revisions (and
// the former sealed/ of revisions issued by earlier versions) and what holds them.
import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, expect, it } from 'vitest';
import { issuedFolderAt } from '../../lib/archive/layout.ts';

const cwd = mkdtempSync(join(tmpdir(), 'cellbasis-layout-'));
mkdirSync(join(cwd, 'projects', 'a', 'issued', 'A'), { recursive: true });
mkdirSync(join(cwd, 'projects', 'b'), { recursive: true });
mkdirSync(join(cwd, 'projects', 'c', 'sealed', 'A'), { recursive: true });
afterAll(() => rmSync(cwd, { recursive: true, force: true }));

it('names the issued folder a target lies in or would replace, and nothing for other places', () => {
  const issued = join(cwd, 'projects', 'a', 'issued');
  expect(issuedFolderAt(cwd, 'projects/a/issued/A')).toBe(issued);
  expect(issuedFolderAt(cwd, 'projects/a/issued/new-site')).toBe(issued);
  expect(issuedFolderAt(cwd, 'projects/b/issued')).toBe(join(cwd, 'projects', 'b', 'issued'));
  expect(issuedFolderAt(cwd, 'projects')).toBe(issued);
  expect(issuedFolderAt(cwd, '.')).toBe(issued);
  expect(issuedFolderAt(cwd, 'projects/a')).toBe(issued);
  expect(issuedFolderAt(cwd, 'site')).toBeNull();
  expect(issuedFolderAt(cwd, 'projects/b')).toBeNull();
  expect(issuedFolderAt(cwd, 'projects/a/site')).toBeNull();
  expect(issuedFolderAt(cwd, join(tmpdir(), 'elsewhere'))).toBeNull();
});

it('guards the former folder of revisions issued by earlier versions as well', () => {
  const former = join(cwd, 'projects', 'c', 'sealed');
  expect(issuedFolderAt(cwd, 'projects/c/sealed/A')).toBe(former);
  expect(issuedFolderAt(cwd, 'projects/c')).toBe(former);
});
