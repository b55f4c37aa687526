/**
 * `cellbasis serve [--port N] [--listen-address ADDRESS]`: builds the site and serves it with live
 * reload, rebuilding when a basis, an issued revision or a template changes
 * (lib/publish/serve.ts). It listens on this machine only (127.0.0.1) unless given another
 * address, with a warning, and says the address and port it really uses. Stop it with Ctrl-C.
 */
import { isIP } from 'node:net';
import type { Command } from '../command.ts';
import { optionalString } from '../command.ts';
import { UserError } from '../../core/errors.ts';

/** Whether an address reaches only this machine (127.0.0.0/8, ::1). */
function loopback(host: string): boolean {
  return /^127\.\d+\.\d+\.\d+$/.test(host) || host === '::1' || host === 'localhost';
}

export const serveCommand: Command = {
  name: 'serve',
  summary: 'serve the design-basis site with live reload, rebuilding on every change',
  usage: 'serve [--port N] [--listen-address ADDRESS]',
  details:
    'Writes the site into site/ and watches the folders of projects/ (every basis, every issued revision, a new or renamed project) and the templates; a basis with errors shows them on the index page. ' +
    'Listens on 127.0.0.1, this machine only; --listen-address 0.0.0.0 (or one address of this machine) lets other machines read every project, with a warning. ' +
    'When the port is taken the next free one is used, and the address really used is printed.',
  positionals: [0, 0],
  options: [
    { name: 'port', type: 'string', value: 'N', description: 'port of the dev server (default 8080; when taken, the next free one of the 10 after it)' },
    { name: 'listen-address', type: 'string', value: 'ADDRESS', description: 'address to listen on (default 127.0.0.1: this machine only)' },
  ],
  async run(args, io) {
    const text = optionalString(args, 'port') ?? '8080';
    const port = Number(text);
    if (!/^\d+$/.test(text) || !Number.isInteger(port) || port < 1 || port > 65535) throw new UserError(`serve: --port must be a whole number from 1 to 65535, got "${text}"`);
    const host = optionalString(args, 'listen-address') ?? '127.0.0.1';
    if (host !== 'localhost' && !isIP(host)) throw new UserError(`serve: --listen-address must be an IP address of this machine (127.0.0.1, 0.0.0.0, ::), got "${host}"`);
    const server = await (await import('../../publish/serve.ts')).serveSite({ root: io.cwd, port, host });
    if (!loopback(host)) {
      io.err(`warning: serve listens on ${host}: every machine that can reach this one on port ${server.port} can read every project's design basis, and serve asks no one who they are\n`);
    }
    if (server.port !== port) io.err(`port ${port} is in use; port ${server.port} is used instead\n`);
    io.err(`serving the design-basis site on ${server.url} (Ctrl-C stops)\n`);
    await new Promise<void>((done) => process.once('SIGINT', () => done()));
    await server.stop();
    return 0;
  },
};
