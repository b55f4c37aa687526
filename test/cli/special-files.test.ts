// The command-line part of the bad-input corpus, class "special files" (issue 15 item 4): a basis
// that is a named pipe, a device or a folder is refused before it is opened, naming it, never read
// (a FIFO's open waits for a writer, /dev/zero never ends); as projects/<id>/basis.yaml it is a
// problem of that project, named by check and build, and never makes them hang.
import { existsSync, mkdirSync, symlinkSync } from 'node:fs';
import { spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { run } from '../helpers/run-cli.ts';
import { projectsRoot, scaffoldText } from '../helpers/scaffold-basis.ts';

function withFifo(): string {
  const root = projectsRoot('special-files', { good: scaffoldText('pem', 'power', 'good') });
  mkdirSync(join(root, 'projects', 'piped'));
  expect(spawnSync('mkfifo', [join(root, 'projects', 'piped', 'basis.yaml')]).status).toBe(0);
  return root;
}

describe('special files named as a basis', () => {
  it.each([
    ['a named pipe', (root: string) => (spawnSync('mkfifo', [join(root, 'fifo.yaml')]), 'fifo.yaml'), 'a named pipe (FIFO)'],
    ['a link to a character device', (root: string) => (symlinkSync('/dev/zero', join(root, 'zero.yaml')), 'zero.yaml'), 'a character device'],
    ['a folder', (root: string) => (mkdirSync(join(root, 'folder.yaml')), 'folder.yaml'), 'a folder'],
  ])('check %s: exit 2, one line naming it, never read', async (_what, make, kind) => {
    const root = projectsRoot('special-files', {});
    const path = make(root);
    for (const command of ['check', 'calc']) {
      const r = await run([command, path], root);
      expect(r, command).toEqual({ code: 2, out: '', err: `cellbasis: ${command === 'check' ? 'check: ' : ''}${path}: the design basis must be a regular file; this is ${kind}\n` });
    }
  });

  it('a FIFO as a project\'s basis.yaml: check names the project and still checks the others', async () => {
    const root = withFifo();
    const r = await run(['check'], root);
    expect(r.code).toBe(1);
    expect(r.err).toBe('projects/piped is no project: it holds a basis.yaml that is a named pipe (FIFO), not a file\n');
    expect(r.out).toMatch(/^projects\/good\/basis\.yaml: valid/);
  });

  it('a FIFO as a project\'s basis.yaml: build names it, writes nothing and exits 1', async () => {
    const root = withFifo();
    const r = await run(['build', '--html-only', '--quiet'], root);
    expect(r.code).toBe(1);
    expect(r.err).toMatch(/projects\/piped is no project: it holds a basis\.yaml that is a named pipe \(FIFO\), not a file/);
    expect(existsSync(join(root, 'site'))).toBe(false);
  });
});
