/**
 * `cellbasis build`: the whole site, written atomically. The projects are loaded and checked
 * first (any error: nothing is written); Eleventy then renders into a fresh folder beside the
 * target, and only when every page and file is written is that folder swapped in for the old
 * site. A failed build leaves the previous site exactly as it was.
 *
 *   buildSite({ root, out }): Promise<BuildReport>
 *     root  the folder holding projects/ (the command's working folder)
 *     out   the site folder (default root/site)
 */
import { existsSync, mkdirSync, renameSync, rmSync } from 'node:fs';
import { randomBytes } from 'node:crypto';
import { basename, dirname, join, resolve } from 'node:path';
import { UserError, EXIT_INTERNAL } from '../errors.ts';
import { setBuildContext } from './build-context.ts';
import { createEleventy } from './eleventy-api.ts';
import { ELEVENTY_CONFIG, TEMPLATES_DIR } from './paths.ts';
import { loadSiteModel, type SiteOptions } from './site-model.ts';

export interface BuildReport {
  out: string;
  /** Document pages written (drafts and sealed revisions). */
  documents: number;
  warnings: string[];
}

/** A sibling folder of `target` named target.<random>.<suffix>.tmp (ignored by git). */
function sibling(target: string, suffix: string): string {
  return join(dirname(target), `${basename(target)}.${process.pid}-${randomBytes(4).toString('hex')}.${suffix}.tmp`);
}

/** The first UserError in an error's cause chain (Eleventy wraps what the data and templates throw). */
function userErrorIn(error: unknown): UserError | null {
  let e: unknown = error;
  for (let depth = 0; e && depth < 10; depth++) {
    if (e instanceof UserError) return e;
    const next = (e as { originalError?: unknown; cause?: unknown }).originalError ?? (e as { cause?: unknown }).cause;
    e = next;
  }
  return null;
}

async function runEleventy(output: string): Promise<void> {
  const eleventy = createEleventy(TEMPLATES_DIR, output, { configPath: ELEVENTY_CONFIG, quietMode: true });
  eleventy.disableLogger();
  try {
    await eleventy.write();
  } catch (error) {
    const user = userErrorIn(error);
    if (user) throw user;
    throw new UserError(`the site could not be rendered: ${(error as Error).message}`, EXIT_INTERNAL);
  }
}

export async function buildSite(options: { root: string; out?: string } & SiteOptions): Promise<BuildReport> {
  const root = resolve(options.root);
  const out = resolve(options.out ?? join(root, 'site'));
  const model = loadSiteModel(root, options);
  mkdirSync(dirname(out), { recursive: true });
  const fresh = sibling(out, 'build');
  mkdirSync(fresh);
  try {
    setBuildContext({ root, output: fresh, mode: 'build', model });
    await runEleventy(fresh);
    for (const page of [...model.pages.map((p) => p.pagePath), 'index.html']) {
      if (!existsSync(join(fresh, page))) throw new UserError(`the build did not write ${page}`, EXIT_INTERNAL);
    }
  } catch (error) {
    rmSync(fresh, { recursive: true, force: true });
    throw error;
  } finally {
    setBuildContext(null);
  }
  const old = existsSync(out) ? sibling(out, 'old') : null;
  if (old) renameSync(out, old);
  try {
    renameSync(fresh, out);
  } catch (error) {
    if (old) renameSync(old, out);
    rmSync(fresh, { recursive: true, force: true });
    throw error;
  }
  if (old) rmSync(old, { recursive: true, force: true });
  return { out, documents: model.pages.length, warnings: model.warnings };
}
