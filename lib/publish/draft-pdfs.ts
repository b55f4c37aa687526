/**
 * The working drafts printed to PDF beside their pages (projects/<id>/document.pdf), by two
 * Chromiums side by side (lib/publish/pdf.ts). A PDF depends on the page's bytes, its print metadata, the
 * site's assets the page loads (stylesheets, scripts, fonts), the library (the printer's
 * margins, bands and finishing are code) and the Chromium that prints it; it is cached under
 * .cellbasis-cache/pdf/ by SHA-256 of all of them, so an unchanged draft is copied, not printed
 * again, and a changed stylesheet or a new Chromium prints every draft anew.
 */
import { execFileSync } from 'node:child_process';
import { availableParallelism } from 'node:os';
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import type { DesignBasis } from '../basis/types.ts';
import type { Results } from '../plant/results-schema.ts';
import { CACHE_DIR, readCacheEntry, writeCacheEntry } from '../batch/results-cache.ts';
import { libraryFingerprint } from '../batch/fingerprint.ts';
import { withPdfPrinter } from './pdf.ts';
import { findChromium } from './chromium.ts';
import { documentPdfMeta } from '../report/pdf-meta.ts';
import type { RevisionContext } from '../report/revision.ts';
import type { PdfMeta } from '../core/pdf-properties.ts';
import { ASSET_DIR } from './site-assets.ts';

/**
 * Chromiums printing side by side. One Chromium with two pages gains little (measured: 2.9 s
 * against 3.1 s a document), because much of a print is serial work in the browser process;
 * two Chromiums on two cores print a document every 1.4 s, one alone every 1.9 s (npm run bench).
 */
export const PRINT_LANES = 2;

export interface DraftPage {
  pagePath: string;
  /** The draft's basis and results, made when asked for (the site model does not keep them). */
  document(): { basis: DesignBasis; results: Results };
  /** The draft's date as its page shows it (lib/publish/source-date.ts), null when undated. */
  date: string | null;
  /** Which revision the page is: the draft of the next one (lib/report/revision.ts). */
  revision: RevisionContext;
}

function keyOf(inputs: string, html: Buffer, meta: PdfMeta): string {
  const { attachments: _attachments, ...rest } = meta as PdfMeta & { attachments?: unknown };
  return createHash('sha256').update(inputs).update('\0').update(html).update('\0').update(JSON.stringify(rest, (_k, v) => (v instanceof Date ? v.toISOString() : v))).digest('hex');
}

/** Every file under `dir`, by path relative to it, sorted. */
function filesUnder(dir: string, prefix = ''): string[] {
  return readdirSync(join(dir, prefix), { withFileTypes: true })
    .flatMap((e) => (e.isDirectory() ? filesUnder(dir, join(prefix, e.name)) : [join(prefix, e.name)]))
    .sort();
}

/** The Chromium's own account of its version (`chromium --version`), or its path when it gives none. */
function chromiumIdentity(): string {
  const path = findChromium() ?? '';
  try {
    return execFileSync(path, ['--version'], { encoding: 'utf8', stdio: ['ignore', 'pipe', 'ignore'], timeout: 20_000 }).trim() || path;
  } catch {
    return path;
  }
}

/** A digest of what every draft's PDF depends on besides its page and metadata. */
export function printInputs(site: string): string {
  const hash = createHash('sha256').update(`library ${libraryFingerprint()}\nchromium ${chromiumIdentity()}\n`);
  const assets = join(site, ASSET_DIR);
  for (const file of existsSync(assets) ? filesUnder(assets) : []) hash.update(`${file}\n`).update(readFileSync(join(assets, file))).update('\n');
  return hash.digest('hex');
}

/** Prints (or copies from the cache) each draft's PDF beside its page; returns the keys of the cache entries it used. */
export async function printDrafts(root: string, site: string, drafts: DraftPage[], onProgress?: (done: number, total: number) => void): Promise<Set<string>> {
  const cacheDir = join(root, CACHE_DIR, 'pdf');
  mkdirSync(cacheDir, { recursive: true });
  const inputs = printInputs(site);
  const work = drafts.map((d) => {
    const page = join(site, d.pagePath);
    // The date the page shows (never the clock); an undated draft prints as of 1970-01-01.
    const meta = documentPdfMeta({ ...d.document(), revision: d.revision }, { date: new Date(`${d.date ?? '1970-01-01'}T00:00:00Z`) });
    const key = keyOf(inputs, readFileSync(page), meta);
    return { page, target: join(dirname(page), 'document.pdf'), meta, key, cached: join(cacheDir, `${key}.pdf`) };
  });
  const used = new Set(work.map((w) => w.key));
  let done = 0;
  const report = () => onProgress?.(++done, work.length);
  const missing: typeof work = [];
  for (const w of work) {
    // Only a cached PDF whose hash holds is copied; any other is printed again.
    const cached = readCacheEntry(w.cached);
    if (!cached) {
      missing.push(w);
      continue;
    }
    writeFileSync(w.target, cached);
    report();
  }
  if (missing.length === 0) return used;
  // Each lane a Chromium of its own, printing every lanes-th draft in turn; after a failure no
  // lane starts another print, and the first error is thrown once every Chromium has closed.
  const lanes = Math.max(1, Math.min(PRINT_LANES, availableParallelism(), missing.length));
  let failed = false;
  const outcomes = await Promise.allSettled(
    Array.from({ length: lanes }, (_, lane) =>
      withPdfPrinter(async (printer) => {
        for (let i = lane; i < missing.length && !failed; i += lanes) {
          const w = missing[i]!;
          try {
            const bytes = await printer.print(w.page, w.meta);
            writeFileSync(w.target, bytes);
            writeCacheEntry(w.cached, bytes);
          } catch (error) {
            failed = true;
            throw error;
          }
          report();
        }
      }, { pages: 1 }),
    ),
  );
  const rejected = outcomes.find((o): o is PromiseRejectedResult => o.status === 'rejected');
  if (rejected) throw rejected.reason;
  return used;
}
