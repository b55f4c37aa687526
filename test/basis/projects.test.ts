// Project resolution: ids under projects/, files by path, and nothing that leads outside.
import { mkdirSync, mkdtempSync, realpathSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { listProjects, projectsProblemText, resolveProjectArg, scanProjects } from '../../lib/basis/projects.ts';
import { UserError } from '../../lib/core/errors.ts';

/**
 * A working folder of a fixed name inside a fresh temporary folder: the id of a basis file named
 * by its path comes from the name of its folder, which must not be mkdtemp's random letters
 * (they made a valid id about one run in 25: six of a-z and 0-9 out of a-z, A-Z and 0-9).
 */
function workspace(name = 'Work Folder'): string {
  const cwd = join(mkdtempSync(join(tmpdir(), 'cellbasis-projects-')), name);
  for (const id of ['beta', 'alpha', 'no-basis', 'Bad_Name']) mkdirSync(join(cwd, 'projects', id), { recursive: true });
  for (const id of ['beta', 'alpha', 'Bad_Name']) writeFileSync(join(cwd, 'projects', id, 'basis.yaml'), 'document: {}\n');
  return cwd;
}

function refusal(arg: string, cwd: string): UserError {
  try {
    resolveProjectArg(arg, cwd);
  } catch (error) {
    if (error instanceof UserError) return error;
    throw error;
  }
  throw new Error(`${arg} was not refused`);
}

describe('projects', () => {
  it('an id names projects/<id>/basis.yaml', () => {
    const cwd = workspace();
    expect(resolveProjectArg('alpha', cwd)).toEqual({ path: join(cwd, 'projects', 'alpha', 'basis.yaml'), displayPath: 'projects/alpha/basis.yaml', id: 'alpha' });
  });

  it('an argument ending in .yaml or .yml is a file; another with a path separator is refused (exit 2)', () => {
    const cwd = workspace();
    // The id is the name of the file's folder where that is a valid id, else "basis".
    expect(resolveProjectArg('site.yml', cwd)).toEqual({ path: join(cwd, 'site.yml'), displayPath: 'site.yml', id: 'basis' });
    const plant = workspace('plant-7');
    expect(resolveProjectArg('site.yml', plant)).toEqual({ path: join(plant, 'site.yml'), displayPath: 'site.yml', id: 'plant-7' });
    expect(resolveProjectArg('projects/beta/basis.yaml', cwd)).toMatchObject({ path: join(cwd, 'projects/beta/basis.yaml'), id: 'beta' });
    const error = refusal('somewhere/else', cwd);
    expect(error.exitCode).toBe(2);
    expect(error.message).toBe('"somewhere/else" names neither a project (an id such as chp-1, for projects/chp-1/basis.yaml) nor a design-basis file (a path ending in .yaml or .yml)');
  });

  it('refuses ids that are not plain names or contain "..", with exit code 2', () => {
    const cwd = workspace();
    for (const id of ['..', 'a..b', 'Alpha', '-x', '.hidden', 'x'.repeat(65), 'a b']) {
      const error = refusal(id, cwd);
      expect(error.exitCode, id).toBe(2);
    }
    expect(refusal('a..b', cwd).message).toBe('project id "a..b" may not contain ".."');
    expect(refusal('Alpha', cwd).message).toBe('project id "Alpha" must be 1 to 64 characters of a-z, 0-9, ".", "_" and "-", starting with a letter or digit');
  });

  it('refuses a project folder or basis file that links outside projects/', () => {
    const cwd = workspace();
    const outside = mkdtempSync(join(tmpdir(), 'cellbasis-outside-'));
    writeFileSync(join(outside, 'basis.yaml'), 'document: {}\n');
    symlinkSync(outside, join(cwd, 'projects', 'escape'));
    mkdirSync(join(cwd, 'projects', 'linked'));
    symlinkSync(join(outside, 'basis.yaml'), join(cwd, 'projects', 'linked', 'basis.yaml'));
    for (const id of ['escape', 'linked']) {
      const error = refusal(id, cwd);
      expect(error.exitCode).toBe(2);
      expect(error.message).toMatch(new RegExp(`^projects/${id} leads outside projects/ \\(to .*\\); a project must lie inside projects/$`));
    }
    // A link that stays inside projects/ is fine.
    symlinkSync(join(cwd, 'projects', 'alpha'), join(cwd, 'projects', 'alias'));
    expect(resolveProjectArg('alias', cwd).id).toBe('alias');
  });

  it('lists the ids of every projects/*/basis.yaml, sorted, skipping folders without one and invalid names', () => {
    expect(listProjects(workspace())).toEqual(['alpha', 'beta']);
    expect(listProjects(mkdtempSync(join(tmpdir(), 'cellbasis-empty-')))).toEqual([]);
  });
});

describe('what else is under projects/', () => {
  it('names every folder that is no project (an error) and every file (a warning), passing over names that start with "."', () => {
    const cwd = workspace();
    mkdirSync(join(cwd, 'projects', 'yml-only'));
    writeFileSync(join(cwd, 'projects', 'yml-only', 'basis.yml'), 'document: {}\n');
    mkdirSync(join(cwd, 'projects', 'other-name'));
    writeFileSync(join(cwd, 'projects', 'other-name', 'plant.yaml'), 'document: {}\n');
    writeFileSync(join(cwd, 'projects', 'notes.txt'), 'notes\n');
    mkdirSync(join(cwd, 'projects', '.git'));
    const outside = mkdtempSync(join(tmpdir(), 'cellbasis-outside-'));
    symlinkSync(outside, join(cwd, 'projects', 'escape'));
    const scanned = scanProjects(cwd);
    expect(scanned.ids).toEqual(['alpha', 'beta']);
    expect(scanned.problems.map(projectsProblemText)).toEqual([
      'projects/Bad_Name is no project: the folder\'s name is no project id (must be 1 to 64 characters of a-z, 0-9, ".", "_" and "-", starting with a letter or digit); rename the folder, to bad_name for instance',
      `projects/escape leads outside projects/ (to ${realpathSync(outside)}); a project must lie inside projects/`,
      'projects/no-basis is no project: it holds no basis.yaml; write one with cellbasis new no-basis --technology TECH, or move the folder out of projects/',
      'warning: projects/notes.txt is not a folder, and each entry of projects/ is a project folder; it is left out: move it elsewhere',
      "projects/other-name is no project: it holds no basis.yaml (it holds plant.yaml); a project's basis is projects/other-name/basis.yaml",
      "projects/yml-only is no project: it holds basis.yml, but a project's basis is basis.yaml: rename the file",
    ]);
  });
});
