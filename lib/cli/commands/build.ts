/**
 * `cellbasis build [--out DIR]`: builds the design-basis site of every projects/<id>/basis.yaml
 * and its issued revisions into site/ (lib/publish/build.ts): all or nothing, the old site kept
 * on any error. Exit 1 with every located problem when a basis or issued revision is wrong.
 */
import { dirname, join, relative, resolve } from 'node:path';
import type { Command } from '../command.ts';
import { optionalString } from '../command.ts';
import { scanProjects } from '../../basis/projects.ts';
import { EXIT_VALIDATION, UserError } from '../../core/errors.ts';
import { SiteError } from '../../publish/site-problems.ts';
import { progressReporter } from '../progress.ts';

export const buildCommand: Command = {
  name: 'build',
  summary: 'build the design-basis documents of every project into site/ (atomically)',
  usage: 'build [--out DIR] [--html-only] [--render-all] [--quiet]',
  details:
    'Renders each projects/<id>/basis.yaml as its working draft, each issued revision as its own page, and the\n' +
    'portfolio index, into a fresh folder beside site/; site/ (a link) is switched to it only when everything was written.\n' +
    'Pages are reproducible: the draft date is SOURCE_DATE_EPOCH when set, else the latest sign-off date or the last\n' +
    'issue date, whichever is later.\n' +
    'Each draft is also printed beside its page, to site/projects/<id>/document.pdf (DIR/projects/<id>/document.pdf\n' +
    'with --out), when Chromium is found (the build says so when it is not). Results and PDFs of unchanged projects\n' +
    'come from .cellbasis-cache/, and a draft whose page the site being replaced holds, made from the same inputs by the\n' +
    'same code and unchanged since, keeps that page and its CSV files (linked, not rendered again); --render-all renders\n' +
    'every page.',
  positionals: [0, 0],
  options: [
    { name: 'out', type: 'string', value: 'DIR', description: 'write the site to DIR instead of site/' },
    { name: 'html-only', type: 'boolean', description: 'do not print the drafts to PDF' },
    { name: 'render-all', type: 'boolean', description: 'render every draft page, keeping none from the site being replaced' },
    { name: 'quiet', type: 'boolean', description: 'no progress output (for scripts)' },
  ],
  async run(args, io) {
    const scanned = scanProjects(io.cwd);
    if (scanned.ids.length === 0 && scanned.problems.length === 0) {
      throw new UserError('build: no design bases under projects/ here; create one with cellbasis new ID --technology TECH');
    }
    const out = optionalString(args, 'out');
    const pauseAt = process.env.CELLBASIS_BUILD_PAUSE;
    // Eleventy and the PDF printer load only when a build runs.
    const { buildSite, BUILD_STEPS } = await import('../../publish/build.ts');
    let report;
    try {
      report = await buildSite({
        root: io.cwd,
        out: out === undefined ? join(io.cwd, 'site') : resolve(io.cwd, out),
        ...(args.values['html-only'] ? { pdf: false } : {}),
        ...(args.values['render-all'] ? { renderAll: true } : {}),
        onProgress: progressReporter(io, args.values.quiet === true),
        ...(pauseAt && (BUILD_STEPS as readonly string[]).includes(pauseAt) ? { pauseAt, onPause: (step: string) => io.err(`cellbasis: build paused at ${step} (CELLBASIS_BUILD_PAUSE)\n`) } : {}),
      });
    } catch (error) {
      if (!(error instanceof SiteError)) throw error;
      // Each problem on a line of its own, as check prints them; then the one-line verdict.
      for (const line of [...error.errors, ...error.warnings]) io.err(`${line}\n`);
      throw new UserError(`build: ${error.errors.length} error${error.errors.length === 1 ? '' : 's'} in the projects; the site was not built and the previous site is left as it was`, EXIT_VALIDATION);
    }
    const shown = (path: string) => relative(io.cwd, path) || '.';
    const { removed, kept, restored } = report.leftovers;
    if (restored) io.err(`cellbasis: put back ${shown(report.out)} from ${shown(join(dirname(report.out), restored))}, where an interrupted build had moved it\n`);
    for (const name of removed) io.err(`cellbasis: removed ${shown(join(dirname(report.out), name))}, left by an interrupted build\n`);
    for (const name of kept) io.err(`cellbasis: left ${shown(join(dirname(report.out), name))} in place: named as a build's leftover, but not something cellbasis made; remove it yourself if it is yours to remove\n`);
    const temps = report.leftovers.cache.length;
    if (temps) io.err(`cellbasis: removed ${temps} temporary file${temps === 1 ? '' : 's'} under .cellbasis-cache/, left by an interrupted build\n`);
    const unused = report.unusedCache;
    if (unused.entries) io.err(`cellbasis: removed ${unused.entries} cache entr${unused.entries === 1 ? 'y' : 'ies'} no project uses any more (${(unused.bytes / 1048576).toFixed(1)} MiB) from .cellbasis-cache/\n`);
    if (report.keptPages) io.err(`cellbasis: kept ${report.keptPages} draft page${report.keptPages === 1 ? '' : 's'} of the site replaced, unchanged (the same inputs and code); --render-all renders them again\n`);
    for (const w of report.warnings) io.err(`${w}\n`);
    const pdfs = report.pdfs ? ` and ${report.pdfs} draft PDF${report.pdfs === 1 ? '' : 's'}` : '';
    io.out(`built ${report.documents} document page${report.documents === 1 ? '' : 's'}${pdfs} and the index into ${relative(io.cwd, report.out) || '.'}/\n`);
    return 0;
  },
};
