/**
 * `cellbasis serve`: Eleventy's dev server on the site, rebuilding on every change to
 * projects/**\/*.yaml, the sealed revisions and the templates, and reloading the browser. It
 * writes into the site folder directly (no atomic swap: it is for editing); a basis with errors
 * shows its located diagnostics on the index page and on stderr, and the server keeps running.
 *
 *   serveSite({ root, out, port }): Promise<{ stop(): Promise<void> }>
 */
import { join, resolve } from 'node:path';
import { setBuildContext } from './build-context.ts';
import { createEleventy } from './eleventy-api.ts';
import { ELEVENTY_CONFIG, TEMPLATES_DIR } from './paths.ts';

export interface ServeOptions {
  root: string;
  out?: string;
  port: number;
}

export async function serveSite(options: ServeOptions): Promise<{ stop(): Promise<void> }> {
  const root = resolve(options.root);
  const out = resolve(options.out ?? join(root, 'site'));
  setBuildContext({ root, output: out, mode: 'serve', model: null });
  const eleventy = createEleventy(TEMPLATES_DIR, out, { configPath: ELEVENTY_CONFIG, quietMode: true, runMode: 'serve' });
  await eleventy.init();
  await eleventy.watch();
  await eleventy.serve(options.port);
  return {
    async stop() {
      await eleventy.stopWatch();
      setBuildContext(null);
    },
  };
}
