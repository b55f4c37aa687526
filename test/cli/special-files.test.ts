// The command-line part of the bad-input corpus, class "special files" (issue 15 item 4): a basis
// that is a named pipe, a device or a folder is refused before it is opened, naming it, never read
// (a FIFO's open waits for a writer, /dev/zero never ends); as projects/<id>/basis.yaml it is a
// problem of that project, named by check and build, and never makes them hang. The same inside an
// issued revision's folder: a named pipe in place of an issued file, or beside them, is named by
// build, compare and audit, never opened.
import { cpSync, existsSync, mkdirSync, rmSync, symlinkSync } from 'node:fs';
import { spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { run } from '../helpers/run-cli.ts';
import { projectsRoot, scaffoldText } from '../helpers/scaffold-basis.ts';
import { PACKAGE_ROOT } from '../../lib/publish/paths.ts';
import { acquireIssueLock, LOCK_FILE } from '../../lib/archive/issued-folder.ts';

const BACKUP = 'hob-tor-pem-backup';

/** A working folder holding a copy of the demo project with its approved revision 0, `name` in its issued folder (`0/document.html`) replaced by a named pipe. */
function issuedWithFifo(name: string): string {
  const root = projectsRoot('special-files', {});
  cpSync(join(PACKAGE_ROOT, 'projects', BACKUP), join(root, 'projects', BACKUP), { recursive: true });
  const path = join(root, 'projects', BACKUP, 'issued', name);
  rmSync(path, { force: true });
  expect(spawnSync('mkfifo', [path]).status).toBe(0);
  return root;
}

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

describe('special files inside an issued revision', () => {
  it('a FIFO as an issued document or beside the issued files: build names it, writes nothing and exits 1; the audit fails it; nothing waits on it', async () => {
    const root = issuedWithFifo('0/document.html');
    expect(spawnSync('mkfifo', [join(root, 'projects', BACKUP, 'issued', '0', 'stray')]).status).toBe(0);
    const built = await run(['build', '--html-only', '--quiet'], root);
    expect(built.code).toBe(1);
    expect(built.err).toContain(
      `projects/${BACKUP}/issued/0/document.html: the issued document must be a regular file; this is a named pipe (FIFO); run cellbasis audit ${BACKUP} for the full report\n`,
    );
    expect(existsSync(join(root, 'site'))).toBe(false);
    const audited = await run(['audit', BACKUP], root);
    expect(audited.code).toBe(1);
    expect(audited.out).toContain('document.html: the issued document must be a regular file; this is a named pipe (FIFO)');
    expect(audited.out).toContain('extra file stray (not part of an issued revision)');
  });

  it('a FIFO as the issued results: compare names it in one line, exit 1', async () => {
    const root = issuedWithFifo('0/results.json');
    const r = await run(['compare', BACKUP, '0', 'draft'], root);
    expect(r).toEqual({
      code: 1,
      out: '',
      err: `cellbasis: projects/${BACKUP}/issued/0: cannot read results.json: the issued results must be a regular file; this is a named pipe (FIFO); run cellbasis audit ${BACKUP} for the full report\n`,
    });
  });

  it('a FIFO as the issue lock: refused as no lock issue wrote, never waited on, left in place', () => {
    const root = issuedWithFifo(LOCK_FILE);
    const issued = join(root, 'projects', BACKUP, 'issued');
    expect(() => acquireIssueLock(issued, `projects/${BACKUP}`)).toThrow(
      `issue: projects/${BACKUP}/issued/${LOCK_FILE} is not a lock that cellbasis issue wrote; nothing was changed: remove it yourself if no issue runs`,
    );
    expect(spawnSync('test', ['-p', join(issued, LOCK_FILE)]).status).toBe(0);
  });
});
