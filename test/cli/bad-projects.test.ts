// The command-line part of the bad-input corpus, class "projects": what stands under projects/ and
// is no project is named by `check` and `build`, never skipped in silence. A folder that is no
// project (a name that is no id, a basis.yml, no basis at all, a link out of projects/) is an
// error (exit 1; build writes nothing); a file is a warning; names starting with "." are passed over.
import { existsSync, mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { run } from '../helpers/run-cli.ts';
import { projectsRoot, scaffoldText } from '../helpers/scaffold-basis.ts';

/** A working folder with one valid project and, beside it, each kind of entry that is none. */
function workspace(): string {
  const root = projectsRoot('bad-projects', { good: scaffoldText('pem', 'power', 'good') });
  const put = (folder: string, file: string) => {
    mkdirSync(join(root, 'projects', folder), { recursive: true });
    writeFileSync(join(root, 'projects', folder, file), scaffoldText('pem', 'power', 'x'));
  };
  put('Chp_Unit', 'basis.yaml');
  put('yml-only', 'basis.yml');
  mkdirSync(join(root, 'projects', 'empty'));
  mkdirSync(join(root, 'projects', '.git'));
  writeFileSync(join(root, 'projects', 'README.md'), 'notes\n');
  return root;
}

const PROBLEMS = [
  'projects/Chp_Unit is no project: the folder\'s name is no project id (must be 1 to 64 characters of a-z, 0-9, ".", "_" and "-", starting with a letter or digit); rename the folder, to chp_unit for instance',
  'projects/empty is no project: it holds no basis.yaml; write one with cellbasis new empty --technology TECH, or move the folder out of projects/',
  "projects/yml-only is no project: it holds basis.yml, but a project's basis is basis.yaml: rename the file",
];
const WARNING = 'warning: projects/README.md is not a folder, and each entry of projects/ is a project folder; it is left out: move it elsewhere';

describe('what is under projects/ and is no project', () => {
  it('check names each, exits 1, and still checks the projects', async () => {
    const r = await run(['check'], workspace());
    expect(r.code).toBe(1);
    expect(r.err.split('\n').filter(Boolean).sort()).toEqual([...PROBLEMS, WARNING].sort());
    expect(r.out).toMatch(/^projects\/good\/basis\.yaml: valid/);
  });

  it('check with only a file beside the projects warns and passes', async () => {
    const root = projectsRoot('bad-projects', { good: scaffoldText('pem', 'power', 'good') });
    writeFileSync(join(root, 'projects', 'README.md'), 'notes\n');
    const r = await run(['check'], root);
    expect(r.code).toBe(0);
    expect(r.err).toBe(`${WARNING}\n`);
  });

  it('check with nothing but a folder that is no project names it rather than saying there is nothing', async () => {
    const root = projectsRoot('bad-projects', {});
    mkdirSync(join(root, 'projects', 'Plant'), { recursive: true });
    writeFileSync(join(root, 'projects', 'Plant', 'basis.yaml'), 'x: 1\n');
    const r = await run(['check'], root);
    expect(r).toEqual({ code: 1, out: '', err: 'projects/Plant is no project: the folder\'s name is no project id (must be 1 to 64 characters of a-z, 0-9, ".", "_" and "-", starting with a letter or digit); rename the folder, to plant for instance\n' });
  });

  it('build names each, writes nothing and exits 1', async () => {
    const root = workspace();
    const r = await run(['build', '--html-only', '--quiet'], root);
    expect(r.code).toBe(1);
    const lines = r.err.split('\n').filter(Boolean);
    expect(lines.slice(0, -1).sort()).toEqual([...PROBLEMS, WARNING].sort());
    expect(lines.at(-1)).toBe('cellbasis: build: 3 errors in the projects; the site was not built and the previous site is left as it was');
    expect(existsSync(join(root, 'site'))).toBe(false);
  }, 120_000);
});
