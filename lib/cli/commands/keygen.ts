/**
 * `cellbasis keygen NAME [--dir DIR] [--inside-git]`: a new Ed25519 key pair for signing issued
 * revisions: NAME.key (PKCS#8 PEM, readable by its owner only) and NAME.pub (SPKI PEM, to hand to
 * auditors), in the user's key folder (lib/archive/keys.ts: CELLBASIS_KEYS, else
 * $XDG_CONFIG_HOME/cellbasis/keys, else ~/.config/cellbasis/keys; made with mode 0700) or DIR.
 * A private key belongs to its owner, never to a repository: a folder inside a git work tree is
 * refused unless --inside-git is given (and the repository's .gitignore then keeps *.key out of
 * it). Refuses to overwrite either file and to write in an issued folder; writes both or neither.
 */
import { chmodSync, existsSync, mkdirSync, unlinkSync, writeFileSync } from 'node:fs';
import { join, relative, resolve } from 'node:path';
import type { Command } from '../command.ts';
import { optionalString } from '../command.ts';
import { issuedFolderHolding } from '../../archive/layout.ts';
import { gitWorkTreeOf, keyFolder, keyNameProblem } from '../../archive/keys.ts';
import { keyFingerprint, newKeyPair } from '../../archive/signature.ts';
import { shortFingerprint } from '../../report/revision.ts';
import { UserError } from '../../core/errors.ts';

/** A path as messages show it: relative to the working folder when inside it. */
function shown(cwd: string, path: string): string {
  const rel = relative(cwd, path);
  return rel === '' || rel.startsWith('..') ? path : rel;
}

function writeError(error: unknown, file: string): UserError {
  const code = (error as NodeJS.ErrnoException).code;
  return new UserError(code === 'EEXIST' ? `keygen: ${file} exists already; nothing written` : `keygen: cannot write ${file} (${code ?? (error as Error).message})`);
}

export const keygenCommand: Command = {
  name: 'keygen',
  summary: 'make an Ed25519 key pair for signing issued revisions (NAME.key, NAME.pub) in your key folder',
  usage: 'keygen NAME [--dir DIR] [--inside-git]',
  details:
    'Writes NAME.key (private, PKCS#8 PEM, mode 0600) and NAME.pub (public, SPKI PEM) into your key folder:\n' +
    'CELLBASIS_KEYS, else $XDG_CONFIG_HOME/cellbasis/keys, else ~/.config/cellbasis/keys (made with mode 0700); or DIR.\n' +
    'Never overwrites, and refuses a folder inside a git work tree unless --inside-git is given: a private key\n' +
    'belongs to its owner, never to a repository. NAME (a-z, 0-9, ".", "_", "-") is recorded in every manifest it signs.\n' +
    'Sign with cellbasis issue ID --status STATUS --key ROLE=NAME; audit with cellbasis audit --key NAME.pub.',
  positionals: [1, 1],
  options: [
    { name: 'dir', type: 'string', value: 'DIR', description: 'write the pair into DIR instead of your key folder' },
    { name: 'inside-git', type: 'boolean', description: 'allow DIR inside a git work tree (its .gitignore must keep *.key out)' },
  ],
  run(args, io) {
    const name = args.positionals[0]!;
    const problem = keyNameProblem(name);
    if (problem) throw new UserError(`keygen: ${problem}`);
    const given = optionalString(args, 'dir');
    const dir = given !== undefined ? resolve(io.cwd, given) : keyFolder(process.env);
    const issued = issuedFolderHolding(io.cwd, dir);
    if (issued) throw new UserError(`keygen: ${shown(io.cwd, dir)} lies in ${relative(io.cwd, issued)}; only cellbasis issue writes there (choose another folder)`);
    const tree = gitWorkTreeOf(dir);
    if (tree && args.values['inside-git'] !== true) {
      throw new UserError(`keygen: ${shown(io.cwd, dir)} is inside the git work tree ${shown(io.cwd, tree)}, where a private key could be committed; nothing written: use your key folder (leave out --dir), or give --inside-git if the folder is kept out of git`);
    }
    const keyPath = join(dir, `${name}.key`);
    const pubPath = join(dir, `${name}.pub`);
    for (const path of [keyPath, pubPath]) {
      if (existsSync(path)) throw new UserError(`keygen: ${shown(io.cwd, path)} exists already; nothing written (choose another name)`);
    }
    try {
      mkdirSync(dir, { recursive: true, mode: 0o700 });
    } catch (error) {
      throw writeError(error, shown(io.cwd, dir));
    }
    const { privatePem, publicPem } = newKeyPair();
    try {
      writeFileSync(keyPath, privatePem, { flag: 'wx', mode: 0o600 });
    } catch (error) {
      throw writeError(error, shown(io.cwd, keyPath));
    }
    chmodSync(keyPath, 0o600);
    try {
      writeFileSync(pubPath, publicPem, { flag: 'wx', mode: 0o644 });
    } catch (error) {
      unlinkSync(keyPath);
      throw writeError(error, shown(io.cwd, pubPath));
    }
    io.out(
      `wrote ${shown(io.cwd, keyPath)} (private: keep it to yourself) and ${shown(io.cwd, pubPath)} (public: give it to whoever audits)\n` +
        `  key ${name}, fingerprint ${shortFingerprint(keyFingerprint(publicPem))} (SHA-256 ${keyFingerprint(publicPem)})\n`,
    );
    return 0;
  },
};
