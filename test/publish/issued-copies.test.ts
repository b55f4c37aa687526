// The issued files the site shows are copied through one checked open of each
// (lib/publish/eleventy-config.ts): an issued document.html swapped for a FIFO after the site
// model was loaded (and had found a regular file there) stops the run with a message naming the
// file, where a copy that opened it by its name again would wait for a writer for ever.
import { cpSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { spawnSync } from 'node:child_process';
import { tmpdir } from 'node:os';
import { basename, dirname, join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { loadSiteModel } from '../../lib/publish/site-model.ts';
import { setBuildContext } from '../../lib/publish/build-context.ts';
import { createEleventy } from '../../lib/publish/eleventy-api.ts';
import { ELEVENTY_CONFIG, PACKAGE_ROOT, TEMPLATES_DIR } from '../../lib/publish/paths.ts';

const DEMO = 'corrin-beck-mcfc-biogas';

/** A working folder holding the demo with its issued revisions. */
function workspace(): { root: string; out: string } {
  const root = mkdtempSync(join(tmpdir(), 'cellbasis-issued-copies-'));
  cpSync(join(PACKAGE_ROOT, 'projects', DEMO), join(root, 'projects', DEMO), { recursive: true });
  return { root, out: join(root, 'site') };
}

/** The messages of an error and the errors it wraps (Eleventy wraps what its event handlers throw). */
function messages(error: unknown): string {
  const out: string[] = [];
  for (let e = error as { message?: string; originalError?: unknown; cause?: unknown } | undefined, k = 0; e && k < 10; k++) {
    out.push(String(e.message));
    e = (e.originalError ?? e.cause) as typeof e;
  }
  return out.join(' | ');
}

afterEach(() => setBuildContext(null));

describe('issued files copied into the site', () => {
  it('copies each issued document byte for byte, and refuses one swapped for a FIFO after the model was loaded', async () => {
    const { root, out } = workspace();
    const model = loadSiteModel(root);
    const html = model.copies.find((c) => c.to.endsWith('document.html'))!;
    expect(html, 'the demo has an issued revision').toBeDefined();

    setBuildContext({ root, output: out, mode: 'build', model: { ...model, writesIndex: true } });
    await createEleventy(TEMPLATES_DIR, out, { configPath: ELEVENTY_CONFIG, quietMode: true }).write();
    for (const c of model.copies) expect(readFileSync(join(out, c.to)).equals(readFileSync(c.from)), c.to).toBe(true);

    rmSync(out, { recursive: true, force: true });
    rmSync(html.from);
    expect(spawnSync('mkfifo', [html.from]).status).toBe(0);
    setBuildContext({ root, output: out, mode: 'build', model: { ...model, writesIndex: true } });
    let caught: unknown = null;
    try {
      await createEleventy(TEMPLATES_DIR, out, { configPath: ELEVENTY_CONFIG, quietMode: true }).write();
    } catch (error) {
      caught = error;
    }
    expect(messages(caught)).toBe(`projects/${DEMO}/issued/${basename(dirname(html.from))}/document.html: the issued document must be a regular file; this is a named pipe (FIFO)`);
  }, 120_000);
});
