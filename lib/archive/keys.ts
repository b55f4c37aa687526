/**
 * Where signing keys are kept, and how a command finds one. A private key belongs to one person
 * and never to a repository: `cellbasis keygen` writes into a folder of the user's own, outside
 * any working tree, unless told otherwise.
 *
 *   keyFolder(env)           CELLBASIS_KEYS, else $XDG_CONFIG_HOME/cellbasis/keys, else
 *                            ~/.config/cellbasis/keys (the XDG base-directory convention)
 *   gitWorkTreeOf(path)      the git work tree a path lies in (a folder above it holding .git), or null
 *   resolveKeyArg(arg, ...)  a key option's value: a path (it has a "/" or ends in .key, .pub or
 *                            .pem), else the name of a key in the key folder
 *   KEY_NAME                 what a key's name may be: it is a file name and is recorded in manifests
 */
import { existsSync, lstatSync } from 'node:fs';
import { homedir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { quoted } from '../core/quote.ts';
import { EXIT_USAGE, UserError } from '../core/errors.ts';

/** A key name: lower-case letters, digits, ".", "_" and "-", starting with a letter or digit; at most 64. */
const KEY_NAME = /^[a-z0-9][a-z0-9._-]{0,63}$/;

/** Why a key name is refused, or undefined. */
export function keyNameProblem(name: string): string | undefined {
  if (name === '') return 'a key name must not be empty';
  if (name.includes('..') || !KEY_NAME.test(name)) return `key name ${quoted(name)} must be 1 to 64 characters of a-z, 0-9, ".", "_" and "-", starting with a letter or digit (it names the key's files and is recorded in each manifest it signs)`;
  return undefined;
}

/** The folder keygen writes to and bare key names are looked up in. */
export function keyFolder(env: Record<string, string | undefined> = process.env): string {
  if (env.CELLBASIS_KEYS) return resolve(env.CELLBASIS_KEYS);
  const config = env.XDG_CONFIG_HOME ? resolve(env.XDG_CONFIG_HOME) : join(env.HOME || homedir(), '.config');
  return join(config, 'cellbasis', 'keys');
}

/** The git work tree `path` lies in: the nearest folder at or above it that holds a .git entry (folder or file), or null. */
export function gitWorkTreeOf(path: string): string | null {
  for (let dir = resolve(path); ; dir = dirname(dir)) {
    if (lstatSync(join(dir, '.git'), { throwIfNoEntry: false })) return dir;
    if (dirname(dir) === dir) return null;
  }
}

/** Whether a key option's value names a file rather than a key in the key folder. */
function namesAFile(arg: string): boolean {
  return arg.includes('/') || /\.(key|pub|pem)$/i.test(arg);
}

/**
 * The file a key option names: a path as given (relative to cwd), or NAME.key / NAME.pub in the
 * key folder for a bare name. Refuses a bare name with no such key, naming where it looked.
 */
export function resolveKeyArg(arg: string, kind: 'private' | 'public', cwd: string, env: Record<string, string | undefined> = process.env): { path: string; display: string } {
  if (arg === '') throw new UserError('a key option needs a key: a key name (from cellbasis keygen NAME) or a key file', EXIT_USAGE);
  if (namesAFile(arg)) return { path: resolve(cwd, arg), display: arg };
  const problem = keyNameProblem(arg);
  if (problem) throw new UserError(problem, EXIT_USAGE);
  const path = join(keyFolder(env), `${arg}.${kind === 'private' ? 'key' : 'pub'}`);
  if (!existsSync(path)) {
    throw new UserError(`no key named ${arg}: ${path} does not exist (make one with cellbasis keygen ${arg}, or give the path of a key file)`, EXIT_USAGE);
  }
  return { path, display: path };
}
