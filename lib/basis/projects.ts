/**
 * Projects on disk: `projects/<id>/basis.yaml` under the working folder. A command argument
 * ending in .yaml or .yml, or containing a path separator, names a basis file; anything else is
 * a project id, which must be a plain lower-case name and may never lead outside projects/
 * (no "..", no absolute path, no symbolic link whose target lies elsewhere).
 */
import { existsSync, readdirSync, realpathSync } from 'node:fs';
import { isAbsolute, join, relative, sep } from 'node:path';
import { UserError, EXIT_USAGE } from '../errors.ts';

export const PROJECT_ID = /^[a-z0-9][a-z0-9._-]{0,63}$/;

export const BASIS_FILE = 'basis.yaml';

export interface ProjectRef {
  /** Path of the basis file (absolute). */
  path: string;
  /** The path as messages show it: as given, or projects/<id>/basis.yaml. */
  displayPath: string;
  id: string;
}

/** Why an id is refused, or undefined when it is a valid id. */
export function projectIdProblem(id: string): string | undefined {
  if (id.includes('..')) return `project id "${id}" may not contain ".."`;
  if (!PROJECT_ID.test(id)) return `project id "${id}" must be 1 to 64 characters of a-z, 0-9, ".", "_" and "-", starting with a letter or digit`;
  return undefined;
}

/** Whether `path` lies inside `root` (both real paths). */
function inside(root: string, path: string): boolean {
  const rel = relative(root, path);
  return rel !== '' && !rel.startsWith('..') && !isAbsolute(rel);
}

/**
 * The basis file of a project id, refused when the id is invalid or the project folder or its
 * basis file resolves (through symbolic links) outside projects/.
 */
export function projectBasisPath(id: string, cwd: string): string {
  const problem = projectIdProblem(id);
  if (problem) throw new UserError(problem, EXIT_USAGE);
  const projects = join(cwd, 'projects');
  const path = join(projects, id, BASIS_FILE);
  const existing = [path, join(projects, id)].find((p) => existsSync(p));
  if (existing && existsSync(projects)) {
    const real = realpathSync(existing);
    if (!inside(realpathSync(projects), real)) {
      throw new UserError(`projects/${id} leads outside projects/ (to ${real}); a project must lie inside projects/`, EXIT_USAGE);
    }
  }
  return path;
}

export function resolveProjectArg(arg: string, cwd: string): ProjectRef {
  if (/\.ya?ml$/i.test(arg) || arg.includes('/') || arg.includes(sep)) {
    const path = isAbsolute(arg) ? arg : join(cwd, arg);
    const parts = path.split(/[\\/]/);
    const folder = parts[parts.length - 2] ?? '';
    return { path, displayPath: arg, id: projectIdProblem(folder) ? 'basis' : folder };
  }
  return { path: projectBasisPath(arg, cwd), displayPath: `projects/${arg}/${BASIS_FILE}`, id: arg };
}

/** Ids of every projects/<id>/basis.yaml under the folder, sorted. */
export function listProjects(cwd: string): string[] {
  const projects = join(cwd, 'projects');
  if (!existsSync(projects)) return [];
  return readdirSync(projects, { withFileTypes: true })
    .filter((entry) => !projectIdProblem(entry.name) && existsSync(join(projects, entry.name, BASIS_FILE)))
    .map((entry) => entry.name)
    .sort();
}
