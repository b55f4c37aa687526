/**
 * Projects on disk: `projects/<id>/basis.yaml` under the working folder. A command argument
 * ending in .yaml or .yml names a basis file; any other argument with a path separator is
 * refused; anything else is a project id, which must be a plain lower-case name and may never
 * lead outside projects/ (no "..", no absolute path, no symbolic link whose target lies
 * elsewhere or nowhere).
 */
import { existsSync, lstatSync, readdirSync, readlinkSync, realpathSync } from 'node:fs';
import { isAbsolute, join, relative, resolve, sep } from 'node:path';
import { quoted } from '../core/quote.ts';
import { UserError, EXIT_USAGE } from '../core/errors.ts';

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
 * Why an entry under projects/ is refused: it resolves (through symbolic links) outside
 * projects/, or it is a symbolic link to nothing (which `new` would otherwise follow to create
 * a folder wherever it points). Undefined when nothing is there or it lies inside.
 */
function escape(projects: string, entry: string, label: string): string | undefined {
  try {
    lstatSync(entry);
  } catch {
    return undefined;
  }
  let real: string;
  try {
    real = realpathSync(entry);
  } catch {
    return `${label} is a symbolic link to ${readlinkSync(entry)}, which does not exist; a project must lie inside projects/`;
  }
  return inside(realpathSync(projects), real) ? undefined : `${label} leads outside projects/ (to ${real}); a project must lie inside projects/`;
}

/** Refuses (exit 2) a project folder or basis file under projects/ that escape() refuses. */
function refuseEscapes(projects: string, folder: string, label: string): void {
  if (!existsSync(projects)) return;
  for (const entry of [folder, join(folder, BASIS_FILE)]) {
    const problem = escape(projects, entry, label);
    if (problem) throw new UserError(problem, EXIT_USAGE);
  }
}

/**
 * The basis file of a project id, refused when the id is invalid or the project folder or its
 * basis file resolves (through symbolic links) outside projects/.
 */
export function projectBasisPath(id: string, cwd: string): string {
  const problem = projectIdProblem(id);
  if (problem) throw new UserError(problem, EXIT_USAGE);
  const projects = join(cwd, 'projects');
  refuseEscapes(projects, join(projects, id), `projects/${id}`);
  return join(projects, id, BASIS_FILE);
}

/**
 * A command argument: a path ending in .yaml or .yml names that file (a file named inside
 * projects/ must lie inside it, as a project's does); anything else with a path separator is
 * refused, since it names no basis; the rest is a project id.
 */
export function resolveProjectArg(arg: string, cwd: string): ProjectRef {
  if (/\.ya?ml$/i.test(arg)) {
    const path = resolve(cwd, arg);
    const projects = join(cwd, 'projects');
    const first = relative(projects, path).split(sep)[0]!;
    if (existsSync(projects) && inside(projects, path)) {
      for (const entry of [join(projects, first), path]) {
        const problem = escape(projects, entry, `projects/${first}`);
        if (problem) throw new UserError(problem, EXIT_USAGE);
      }
    }
    const folder = path.split(/[\\/]/).slice(-2, -1)[0] ?? '';
    return { path, displayPath: arg, id: projectIdProblem(folder) ? 'basis' : folder };
  }
  if (arg.includes('/') || arg.includes(sep)) {
    throw new UserError(`${quoted(arg)} names neither a project (an id such as chp-1, for projects/chp-1/basis.yaml) nor a design-basis file (a path ending in .yaml or .yml)`, EXIT_USAGE);
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
