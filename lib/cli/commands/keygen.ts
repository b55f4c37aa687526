/**
 * `cellbasis keygen NAME`: a new Ed25519 key pair for signing sealed revisions: NAME.key
 * (PKCS#8 PEM, readable by its owner only) and NAME.pub (SPKI PEM, to hand to auditors).
 * Refuses to overwrite either file, and to write in a sealed folder; writes both or neither.
 */
import { chmodSync, existsSync, unlinkSync, writeFileSync } from 'node:fs';
import { relative, resolve } from 'node:path';
import type { Command } from '../command.ts';
import { sealedFolderAt } from '../../archive/layout.ts';
import { newKeyPair } from '../../archive/signature.ts';
import { UserError } from '../../core/errors.ts';

export const keygenCommand: Command = {
  name: 'keygen',
  summary: 'make an Ed25519 key pair for signing sealed revisions (NAME.key, NAME.pub)',
  usage: 'keygen NAME',
  details:
    'Writes NAME.key (private, PKCS#8 PEM, mode 0600) and NAME.pub (public, SPKI PEM); never overwrites.\n' +
    'Sign with cellbasis seal ID --key NAME.key; audit with cellbasis audit --key NAME.pub.',
  positionals: [1, 1],
  options: [],
  run(args, io) {
    const name = args.positionals[0]!;
    const keyFile = `${name}.key`;
    const pubFile = `${name}.pub`;
    const keyPath = resolve(io.cwd, keyFile);
    const pubPath = resolve(io.cwd, pubFile);
    for (const display of [keyFile, pubFile]) {
      const sealed = sealedFolderAt(io.cwd, resolve(io.cwd, display));
      if (sealed) throw new UserError(`keygen: ${display} would be written in ${relative(io.cwd, sealed)}; only cellbasis seal writes there (choose another name)`);
      if (existsSync(resolve(io.cwd, display))) throw new UserError(`keygen: ${display} exists already; nothing written (choose another name)`);
    }
    const { privatePem, publicPem } = newKeyPair();
    try {
      writeFileSync(keyPath, privatePem, { flag: 'wx', mode: 0o600 });
    } catch (error) {
      const code = (error as NodeJS.ErrnoException).code;
      throw new UserError(code === 'EEXIST' ? `keygen: ${keyFile} exists already; nothing written` : `keygen: cannot write ${keyFile} (${code ?? (error as Error).message})`);
    }
    chmodSync(keyPath, 0o600);
    try {
      writeFileSync(pubPath, publicPem, { flag: 'wx', mode: 0o644 });
    } catch (error) {
      unlinkSync(keyPath);
      const code = (error as NodeJS.ErrnoException).code;
      throw new UserError(code === 'EEXIST' ? `keygen: ${pubFile} exists already; nothing written` : `keygen: cannot write ${pubFile} (${code ?? (error as Error).message})`);
    }
    io.out(`wrote ${keyFile} (private: keep it to yourself) and ${pubFile} (public: give it to whoever audits)\n`);
    return 0;
  },
};
