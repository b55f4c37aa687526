/**
 * `cellbasis serve [--port N]`: builds the site and serves it with live reload, rebuilding when a
 * basis, an issued revision or a template changes (lib/publish/serve.ts). Stop it with Ctrl-C.
 */
import type { Command } from '../command.ts';
import { optionalString } from '../command.ts';
import { UserError } from '../../core/errors.ts';

export const serveCommand: Command = {
  name: 'serve',
  summary: 'serve the design-basis site with live reload, rebuilding on every change',
  usage: 'serve [--port N]',
  details: 'Watches projects/**/*.yaml, the issued revisions and the templates; a basis with errors shows them on the index page.',
  positionals: [0, 0],
  options: [{ name: 'port', type: 'string', value: 'N', description: 'port of the dev server (default 8080)' }],
  async run(args, io) {
    const text = optionalString(args, 'port') ?? '8080';
    const port = Number(text);
    if (!Number.isInteger(port) || port < 1 || port > 65535) throw new UserError(`serve: --port must be a whole number from 1 to 65535, got "${text}"`);
    const server = await (await import('../../publish/serve.ts')).serveSite({ root: io.cwd, port });
    io.err(`serving the design-basis site on http://localhost:${port}/ (Ctrl-C stops)\n`);
    await new Promise<void>((done) => process.once('SIGINT', () => done()));
    await server.stop();
    return 0;
  },
};
