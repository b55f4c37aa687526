/**
 * Where the publishing code finds its own files: the package root, the templates folder, and the
 * installed packages whose files the site copies (KaTeX, Chart.js), resolved through Node's
 * module resolution so that they come from the project's own node_modules.
 */
import { existsSync, readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

export const PACKAGE_ROOT = fileURLToPath(new URL('../../', import.meta.url));

export const TEMPLATES_DIR = join(PACKAGE_ROOT, 'templates');

/** The Eleventy configuration file of the package. */
export const ELEVENTY_CONFIG = join(PACKAGE_ROOT, '.eleventy.js');

const require = createRequire(import.meta.url);

/** The folder of an installed package: up from its entry point to the package.json that names it. */
export function packageDir(name: string): string {
  let dir = dirname(require.resolve(name));
  while (dir !== dirname(dir)) {
    const manifest = join(dir, 'package.json');
    if (existsSync(manifest) && (JSON.parse(readFileSync(manifest, 'utf8')) as { name?: string }).name === name) return dir;
    dir = dirname(dir);
  }
  throw new Error(`the package ${name} is not installed (run npm install)`);
}
