/**
 * What a build tells the site's Eleventy configuration: the folder whose projects/ it publishes,
 * where it writes, whether it serves, and the site model already loaded and checked. Eleventy
 * loads .eleventy.js itself, possibly as a second copy of lib/publish (when the caller ran
 * through another loader), so the context lives under a registered symbol on globalThis rather
 * than in a module variable. Without a context (npx @11ty/eleventy) the configuration publishes
 * the working folder into site/.
 */
import type { SiteModel } from './site-model.ts';

export interface BuildContext {
  /** The folder holding projects/. */
  root: string;
  /** The folder Eleventy writes. */
  output: string;
  mode: 'build' | 'serve';
  /**
   * Whether the output folder is a build's fresh folder, which no one sees before the build
   * renames it complete and which a failed or killed build removes whole: files may be written
   * into it in place, without a temporary name each. Absent: false, each file through a temporary name.
   */
  unseen?: boolean;
  /** The model, loaded before Eleventy runs (build); null to load it on every build (serve, npx). */
  model: SiteModel | null;
}

const KEY = Symbol.for('cellbasis.publish.build-context');

type Holder = { [KEY]?: BuildContext };

export function setBuildContext(context: BuildContext | null): void {
  const holder = globalThis as Holder;
  if (context) holder[KEY] = context;
  else delete holder[KEY];
}

export function buildContext(): BuildContext {
  return (globalThis as Holder)[KEY] ?? { root: process.cwd(), output: 'site', mode: 'build', model: null };
}
