/**
 * The CSV files of a document's tables, written beside its page as real files
 * (`projects/<id>/tables/<name>.csv`, lib/report/table-links.ts), so that its download links
 * work from a site opened from disk as well as served. The bytes are those of `tableCsv`
 * (lib/report/table.ts): the same inputs give the same files.
 *
 * The files are written when a page's view model is made (`withTableFiles`), which the site
 * build, Eleventy run on its own and `cellbasis serve` all do through the model's pages. Into a
 * folder that is shown (serve's, Eleventy's run on its own) each file goes through a temporary
 * name, so that a server never serves half a file; into a build's fresh folder, which no one sees
 * until the build renames it complete and which a failed or killed build removes whole
 * (lib/publish/build.ts), each is written in place: the temporary file and the rename were a
 * fifth of what writing a page's files cost.
 */
import { isFileError, type FileError } from '../core/file-errors.ts';
import { mkdirSync, renameSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import type { DocumentView } from '../report/document.ts';
import { tableCsv } from '../report/table.ts';
import { linkedTables, tableFilePath } from '../report/table-links.ts';

/** The CSV files a page links: site path and text, for every table linked to a file. */
function tableFiles(view: DocumentView): { path: string; text: string }[] {
  return linkedTables(view)
    .filter((t) => t.csv !== undefined && !t.csv.href.startsWith('data:'))
    .map((t) => ({ path: tableFilePath(view.pagePath, t), text: tableCsv(t) }));
}

/**
 * Writes the page's CSV files under the site folder `out` and returns their paths: each through a
 * temporary name (a server never serves half a file), or, where `out` is `unseen` (a build's fresh
 * folder, shown to no one before it is complete), in place. Each folder is made once.
 */
export function writeTableFiles(out: string, view: DocumentView, unseen = false): string[] {
  const folders = new Set<string>();
  return tableFiles(view).map(({ path, text }) => {
    const file = join(out, ...path.split('/'));
    const folder = dirname(file);
    if (!folders.has(folder)) mkdirSync(folder, { recursive: true });
    folders.add(folder);
    if (unseen) {
      writeFileSync(file, text);
      return file;
    }
    const temp = `${file}.${process.pid}.tmp`;
    writeFileSync(temp, text);
    renameSync(temp, file);
    return file;
  });
}

/** The pages of a site model whose views, when made, write their CSV files under `out` (`unseen`: see writeTableFiles). */
export function withTableFiles<P extends { view(): DocumentView }>(pages: readonly P[], out: string, unseen: boolean): P[] {
  return pages.map((page) => ({
    ...page,
    view: () => {
      const view = page.view();
      try {
        writeTableFiles(out, view, unseen);
      } catch (error) {
        // Written while a template renders, whose error wrapping loses the error's code: kept
        // here so that the build reports a full disk or a read-only folder as such.
        if (isFileError(error)) tableFileErrors.push(error);
        throw error;
      }
      return view;
    },
  }));
}

const tableFileErrors: FileError[] = [];

/** The first file-system error met writing table files since the last call, or null. */
export function takeTableFileError(): FileError | null {
  const first = tableFileErrors[0] ?? null;
  tableFileErrors.length = 0;
  return first;
}
