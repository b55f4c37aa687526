/**
 * The working drafts printed to PDF beside their pages (projects/<id>/document.pdf), through one
 * Chromium (lib/publish/pdf.ts). A PDF depends only on the page's bytes and its print metadata,
 * so it is cached under .cellbasis-cache/pdf/ by SHA-256 of both: an unchanged draft is copied,
 * not printed again.
 */
import { createHash } from 'node:crypto';
import { copyFileSync, existsSync, mkdirSync, readFileSync, renameSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import type { DesignBasis } from '../basis/types.ts';
import type { Results } from '../plant/results-schema.ts';
import { CACHE_DIR } from '../plant/results-cache.ts';
import { documentPdfMeta, withPdfPrinter, type PdfMeta } from './pdf.ts';

export interface DraftPage {
  pagePath: string;
  basis: DesignBasis;
  results: Results;
  /** The draft's date as its page shows it (lib/publish/source-date.ts), null when undated. */
  date: string | null;
}

function keyOf(html: Buffer, meta: PdfMeta): string {
  const { attachments: _attachments, ...rest } = meta as PdfMeta & { attachments?: unknown };
  return createHash('sha256').update(html).update('\0').update(JSON.stringify(rest, (_k, v) => (v instanceof Date ? v.toISOString() : v))).digest('hex');
}

export async function printDrafts(root: string, site: string, drafts: DraftPage[], onProgress?: (done: number, total: number) => void): Promise<void> {
  const cacheDir = join(root, CACHE_DIR, 'pdf');
  mkdirSync(cacheDir, { recursive: true });
  const work = drafts.map((d) => {
    const page = join(site, d.pagePath);
    // The date the page shows (never the clock); an undated draft prints as of 1970-01-01.
    const meta = documentPdfMeta({ basis: d.basis, results: d.results }, { date: new Date(`${d.date ?? '1970-01-01'}T00:00:00Z`), draft: true });
    return { page, target: join(dirname(page), 'document.pdf'), meta, cached: join(cacheDir, `${keyOf(readFileSync(page), meta)}.pdf`) };
  });
  let done = 0;
  const report = () => onProgress?.(++done, work.length);
  for (const w of work.filter((x) => existsSync(x.cached))) {
    copyFileSync(w.cached, w.target);
    report();
  }
  const missing = work.filter((x) => !existsSync(x.cached));
  if (missing.length === 0) return;
  await withPdfPrinter(async (printer) => {
    await Promise.all(
      missing.map(async (w) => {
        const bytes = await printer.print(w.page, w.meta);
        writeFileSync(w.target, bytes);
        const temp = `${w.cached}.${process.pid}.tmp`;
        writeFileSync(temp, bytes);
        renameSync(temp, w.cached);
        report();
      }),
    );
  }, { pages: 1 });
}
