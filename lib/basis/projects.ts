/**
 * Projects on disk: `projects/<id>/basis.yaml` under the working folder. A command argument
 * ending in .yaml or .yml names a basis file; any other argument with a path separator is
 * refused; anything else is a project id, which must be a plain lower-case name and may never
 * lead outside projects/ (no "..", no absolute path, no symbolic link whose target lies
 * elsewhere or nowhere).
 */
import { existsSync, lstatSync, readdirSync, readlinkSync, realpathSync, statSync } from 'node:fs';
import { isAbsolute, join, relative, resolve, sep } from 'node:path';
import { quoted } from '../core/quote.ts';
import { UserError, EXIT_USAGE } from '../core/errors.ts';
import { kindOf } from '../core/read-file.ts';

const PROJECT_ID = /^[a-z0-9][a-z0-9._-]{0,63}$/;

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

/** Something under projects/ that is not a project, with why: an error for a folder, a warning for a file. */
export interface ProjectsProblem {
  severity: 'error' | 'warning';
  /** As messages show it: projects/<name>. */
  path: string;
  message: string;
}

/** A project id close to a folder name that is none (lower case, other characters as "-"), when that is one. */
function idLike(name: string): string | undefined {
  const id = name.toLowerCase().replace(/[^a-z0-9._-]+/g, '-').replace(/^[^a-z0-9]+/, '').slice(0, 64);
  return id && !projectIdProblem(id) ? id : undefined;
}

/** Why a folder under projects/ with a valid name is no project, or undefined: what it holds instead of basis.yaml. */
function missingBasis(folder: string, name: string): string | undefined {
  const basis = lstatSync(join(folder, BASIS_FILE), { throwIfNoEntry: false });
  if (basis) {
    // Followed, as the readers follow it (a link out of projects/ is refused apart).
    const target = statSync(join(folder, BASIS_FILE), { throwIfNoEntry: false });
    if (target && !target.isFile()) return `holds a ${BASIS_FILE} that is ${kindOf(target)}, not a file`;
    return undefined;
  }
  let entries: string[];
  try {
    entries = readdirSync(folder);
  } catch {
    return 'cannot be read (check its permissions)';
  }
  if (entries.includes('basis.yml')) return `holds basis.yml, but a project's basis is ${BASIS_FILE}: rename the file`;
  const yaml = entries.filter((e) => /\.ya?ml$/i.test(e));
  if (yaml.length) return `holds no ${BASIS_FILE} (it holds ${yaml.slice(0, 3).join(', ')}${yaml.length > 3 ? ', ...' : ''}); a project's basis is projects/${name}/${BASIS_FILE}`;
  return `holds no ${BASIS_FILE}; write one with cellbasis new ${name} --technology TECH, or move the folder out of projects/`;
}

/**
 * Every entry of projects/: the ids of the projects (a folder of a valid id holding basis.yaml,
 * inside projects/ wherever links lead), sorted, and everything else, so that no command skips it
 * in silence: a folder whose name is no id, that holds no basis.yaml (a basis.yml, say), or that
 * leads outside projects/ is an error; a file is a warning. Names starting with "." (.git,
 * .DS_Store: the files of other tools) are passed over.
 */
export function scanProjects(cwd: string): ProjectsScan {
  const projects = join(cwd, 'projects');
  if (!existsSync(projects)) return { ids: [], problems: [] };
  const names = readdirSync(projects).filter((name) => !name.startsWith('.'));
  return collect(names.map((name) => projectEntry(projects, name)));
}

/** What scanProjects finds in projects/. */
export interface ProjectsScan {
  ids: string[];
  problems: ProjectsProblem[];
}

/** One entry of projects/: a project's id, or the problem that makes it none. */
type ProjectEntry = { name: string; id: string } | { name: string; problem: ProjectsProblem };

/** The ids and problems of `entries`, in the order of their names. */
function collect(entries: ProjectEntry[]): ProjectsScan {
  const ids: string[] = [];
  const problems: ProjectsProblem[] = [];
  for (const entry of entries.sort((a, b) => (a.name < b.name ? -1 : a.name > b.name ? 1 : 0))) {
    if ('id' in entry) ids.push(entry.id);
    else problems.push(entry.problem);
  }
  return { ids, problems };
}

/** What the entry `name` of projects/ is (see scanProjects). */
function projectEntry(projects: string, name: string): ProjectEntry {
  const path = `projects/${name}`;
  const problem = (severity: 'error' | 'warning', message: string): ProjectEntry => ({ name, problem: { severity, path, message } });
  const folder = join(projects, name);
  const escaping = escape(projects, folder, path);
  if (escaping) return problem('error', escaping.replace(`${path} `, ''));
  if (!statSync(folder, { throwIfNoEntry: false })?.isDirectory()) {
    return problem('warning', 'is not a folder, and each entry of projects/ is a project folder; it is left out: move it elsewhere');
  }
  const badName = projectIdProblem(name);
  if (badName) {
    const like = idLike(name);
    return problem('error', `is no project: the folder's name is no project id (${badName.replace(/^project id "[^"]*" /, '')}); rename the folder${like ? `, to ${like} for instance` : ''}`);
  }
  const missing = missingBasis(folder, name);
  if (missing) return problem('error', `is no project: it ${missing}`);
  const basisEscape = escape(projects, join(folder, BASIS_FILE), path);
  if (basisEscape) return problem('error', basisEscape.replace(`${path} `, ''));
  return { name, id: name };
}

/**
 * `previous` (a scanProjects of `cwd`) with the entries `names` of projects/ looked at again, the
 * others as they were: what scanProjects would find when only those entries' contents changed
 * (a saved, deleted or broken basis.yaml), at the cost of those entries rather than of all.
 * A name no longer in projects/ is left out.
 */
export function rescanProjects(cwd: string, previous: ProjectsScan, names: ReadonlySet<string>): ProjectsScan {
  const projects = join(cwd, 'projects');
  const kept: ProjectEntry[] = [
    ...previous.ids.filter((id) => !names.has(id)).map((id) => ({ name: id, id })),
    ...previous.problems.map((problem) => ({ name: problem.path.slice('projects/'.length), problem })).filter((e) => !names.has(e.name)),
  ];
  const again = [...names].filter((name) => !name.startsWith('.') && lstatSync(join(projects, name), { throwIfNoEntry: false }));
  return collect([...kept, ...again.map((name) => projectEntry(projects, name))]);
}

/** A problem of projects/ as one line: `projects/Bad_Name is no project: ...`, `warning: projects/notes.txt is not a folder, ...`. */
export function projectsProblemText(problem: ProjectsProblem): string {
  return `${problem.severity === 'warning' ? 'warning: ' : ''}${problem.path} ${problem.message}`;
}

/** Ids of every projects/<id>/basis.yaml under the folder, sorted (scanProjects names what else is there). */
export function listProjects(cwd: string): string[] {
  return scanProjects(cwd).ids;
}
