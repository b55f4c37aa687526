// cellbasis build: every page of the demo projects and their issued revisions, byte-identical on a
// second build, the draft date from SOURCE_DATE_EPOCH, and all or nothing: a basis with errors
// fails with its located diagnostics (exit 1) and leaves the previous site exactly as it was.
import { existsSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildSite } from '../../lib/publish/build.ts';
import { loadSiteModel } from '../../lib/publish/site-model.ts';
import { renderView } from '../../lib/publish/render.ts';
import { findChromium } from '../../lib/publish/chromium.ts';
import { readPdfProperties } from '../../lib/core/pdf-properties.ts';
import { DRAFT_PDF_STATUS } from '../../lib/report/pdf-meta.ts';
import { loadBasisText } from '../../lib/basis/load.ts';
import { appendices, outline } from '../../lib/report/outline.ts';
import { compact, imageSizes, pageTexts } from '../helpers/pdf-inspect.ts';
import type { ChartSpec } from '../../lib/report/charts/spec.ts';
import { run } from '../helpers/run-cli.ts';
import { basisFile, DEMO_PROJECTS, demoRoot, EPOCH, htmlPages, issuedDemoRoot, SOFC } from '../helpers/site.ts';
import { treeDigest } from '../helpers/tree-digest.ts';

let root: string;

beforeAll(async () => {
  root = await issuedDemoRoot();
}, 120_000);

afterAll(() => rmSync(root, { recursive: true, force: true }));

describe('a build of the demo projects', () => {
  let site: string;
  beforeAll(async () => {
    site = join(root, 'site');
    await buildSite({ root, env: EPOCH });
  }, 180_000);

  it('writes the index, one page per working draft and one per issued revision, with the issued documents and PDFs and the assets', () => {
    expect(htmlPages(site)).toEqual([
      'index.html',
      'projects/corrin-beck-mcfc-biogas/index.html',
      'projects/hob-tor-pem-backup/index.html',
      'projects/kestrelford-pem-electrolyser/index.html',
      'projects/thistlemere-sofc-chp/index.html',
      'projects/thistlemere-sofc-chp/rev-A/document.html',
      'projects/thistlemere-sofc-chp/rev-A/index.html',
      'projects/thistlemere-sofc-chp/rev-B/document.html',
      'projects/thistlemere-sofc-chp/rev-B/index.html',
    ]);
    // The issued files exactly as issued: never rendered or printed again.
    for (const rev of ['A', 'B']) {
      for (const name of ['document.html', 'document.pdf']) {
        expect(readFileSync(join(site, 'projects', SOFC, `rev-${rev}`, name)).equals(readFileSync(join(root, 'projects', SOFC, 'issued', rev, name))), `${rev}/${name}`).toBe(true);
      }
    }
    for (const asset of ['assets/katex/katex.min.css', 'assets/katex/fonts/KaTeX_Main-Regular.woff2', 'assets/chart.umd.min.js', 'assets/charts.js', 'assets/report.css']) {
      expect(existsSync(join(site, asset)), asset).toBe(true);
    }
    expect(readdirSync(root).filter((n) => n.endsWith('.tmp'))).toEqual([]);
  });

  it('prints every working draft to its document.pdf and links it from the page (Chromium present)', () => {
    if (findChromium() === null && !process.env.CI) {
      console.warn('SKIPPED draft PDF check: no Chromium at /usr/bin/chromium (apt-get install -y chromium); CI runs it');
      return;
    }
    for (const id of ['corrin-beck-mcfc-biogas', 'hob-tor-pem-backup', 'kestrelford-pem-electrolyser', SOFC]) {
      const pdf = readFileSync(join(site, 'projects', id, 'document.pdf'));
      expect(pdf.subarray(0, 5).toString('latin1'), id).toBe('%PDF-');
      expect(readFileSync(join(site, 'projects', id, 'index.html'), 'utf8'), id).toContain('href="document.pdf">This draft as PDF (not issued)</a>');
    }
  });

  it('dates each draft PDF as its page is dated, from the env the build was given, not the process environment', async () => {
    if (findChromium() === null && !process.env.CI) {
      console.warn('SKIPPED draft PDF date check: no Chromium at /usr/bin/chromium (apt-get install -y chromium); CI runs it');
      return;
    }
    // The build was given SOURCE_DATE_EPOCH = 2026-01-01 in options.env only; the demo bases'
    // sign-off dates differ from it, so a printer reading process.env would date them otherwise.
    expect(process.env.SOURCE_DATE_EPOCH).toBeUndefined();
    for (const id of DEMO_PROJECTS) {
      const properties = await readPdfProperties(readFileSync(join(site, 'projects', id, 'document.pdf')));
      expect(properties.creationDate?.toISOString(), id).toBe('2026-01-01T00:00:00.000Z');
      expect(readFileSync(join(site, 'projects', id, 'index.html'), 'utf8'), id).toContain('2026-01-01');
    }
  });

  it('prints the charts as vectors: no raster image bigger than a legend swatch, and every axis title, legend and bar label is text in the PDF', async () => {
    if (findChromium() === null && !process.env.CI) {
      console.warn('SKIPPED draft PDF chart check: no Chromium at /usr/bin/chromium (apt-get install -y chromium); CI runs it');
      return;
    }
    // templates/assets/charts.js draws each chart again in beforeprint, which Chromium records as
    // vector operations. Drawn before, a chart was a 1280 × 600 bitmap and none of its text was text.
    for (const id of DEMO_PROJECTS) {
      const pdf = readFileSync(join(site, 'projects', id, 'document.pdf'));
      for (const image of await imageSizes(pdf)) expect(Math.max(image.width, image.height), `${id}: an image of ${image.width} × ${image.height} px`).toBeLessThanOrEqual(64);
      const text = compact((await pageTexts(pdf)).join(''));
      const html = readFileSync(join(site, 'projects', id, 'index.html'), 'utf8');
      const specs = [...html.matchAll(/<script type="application\/json" class="chart-spec"[^>]*>([^<]*)<\/script>/g)].map((m) => JSON.parse(m[1]!) as ChartSpec);
      expect(specs.length, id).toBeGreaterThanOrEqual(6);
      for (const spec of specs) {
        const labels =
          spec.kind === 'line'
            ? [spec.x.title, spec.y.title, ...(spec.y2 ? [spec.y2.title] : []), ...spec.series.map((s) => s.label)]
            : spec.kind === 'tornado'
              ? [spec.x.title, spec.lowLabel, spec.highLabel, ...spec.categories]
              : [spec.x.title, ...spec.parts.map((p) => p.label), ...spec.categories];
        for (const label of labels) expect(text.includes(compact(label)), `${id}: "${label}" of a ${spec.kind} chart is text in the PDF`).toBe(true);
      }
    }
  }, 60_000);

  it('prints a draft as "draft, not issued" on every page, each major section on a new page, and no page all but empty inside a section', async () => {
    if (findChromium() === null && !process.env.CI) {
      console.warn('SKIPPED draft PDF pages check: no Chromium at /usr/bin/chromium (apt-get install -y chromium); CI runs it');
      return;
    }
    for (const id of DEMO_PROJECTS) {
      const loaded = loadBasisText(readFileSync(basisFile(root, id)), `projects/${id}/basis.yaml`, id);
      if (!loaded.ok) throw new Error(id);
      const d = loaded.basis.document;
      // The draft of the next revision: C after the two issued revisions of the solid oxide project, else A.
      const rev = id === SOFC ? 'C' : 'A';
      const pages = await pageTexts(readFileSync(join(site, 'projects', id, 'document.pdf')));
      // A major section opens a page, so the page before it may hold the last lines of the
      // section before; only a short page inside a section (a table's last rows pushed over) is
      // all but empty.
      const openers = [...outline().map((s) => compact(`${s.number} ${s.title}`)), ...appendices().map((a) => compact(`${a.letter} Appendix: ${a.title}`))];
      const endsSection = (i: number) => i === pages.length - 1 || openers.some((o) => compact(pages[i + 1]!).startsWith(o));
      pages.forEach((text, i) => {
        const words = compact(text);
        const where = `${id} page ${i + 1}`;
        // The running header and footer (lib/publish/pdf-page.ts) state the draft of the next revision.
        expect(words, where).toContain(compact(`Rev ${rev} · ${DRAFT_PDF_STATUS}`));
        expect(words, where).toContain(compact(`${d.number} rev ${rev}, ${DRAFT_PDF_STATUS}`));
        // Less than a line or two besides the header and footer: a table's last row or two alone on a page.
        const bands = compact(`${d.number} · ${d.title}Rev ${rev} · ${DRAFT_PDF_STATUS}${d.number} rev ${rev}, ${DRAFT_PDF_STATUS}, 2026-01-01page ${i + 1} of ${pages.length}`);
        if (!endsSection(i)) expect(words.length - bands.length, `${where}: ${text.slice(0, 120)}`).toBeGreaterThan(150);
      });
      // The print stylesheet breaks the page before each major section, its heading opening a
      // page, but for purpose and scope, which share the first page with the title block and
      // contents (issue 20.8: no nearly empty page after the title block); the appendix of the
      // checks opens a page of its own too.
      const [first, ...rest] = outline();
      expect(compact(pages[0]!), `${id}: page 1 holds ${first!.title}`).toContain(compact(`${first!.number} ${first!.title}`));
      for (const s of rest) expect(pages.some((t) => compact(t).startsWith(compact(`${s.number} ${s.title}`))), `${id}: section ${s.number} opens a page`).toBe(true);
      for (const a of appendices()) expect(pages.some((t) => compact(t).startsWith(compact(`${a.letter} Appendix: ${a.title}`))), `${id}: appendix ${a.letter} opens a page`).toBe(true);
    }
  }, 60_000);

  it('marks the draft as the draft of revision C, not issued, the old revision as superseded and links the issued files', () => {
    const draft = readFileSync(join(site, 'projects', SOFC, 'index.html'), 'utf8');
    const a = readFileSync(join(site, 'projects', SOFC, 'rev-A', 'index.html'), 'utf8');
    const b = readFileSync(join(site, 'projects', SOFC, 'rev-B', 'index.html'), 'utf8');
    expect(draft).toContain('Draft, not issued');
    expect(draft).toContain('<td>C, draft, not issued</td>');
    expect(draft).toContain('Draft of revision C; revision B issued for review on 2026-09-22');
    expect(draft).toContain('<td>2026-01-01</td>');
    expect(a).toContain('>Superseded<');
    expect(a).toContain('superseded by revision B');
    expect(a).toContain('href="../rev-B/index.html"');
    expect(b).toContain('>Issued for review<');
    expect(b).toContain('the current revision');
    expect(b).toContain('href="document.pdf"');
    expect(b).toContain('href="document.html"');
    expect(b).toContain('<td>2026-09-22</td>');
    // Nothing on one page contradicts another: the index names the same revisions.
    const index = readFileSync(join(site, 'index.html'), 'utf8');
    expect(index).toContain('Rev. B, 2026-09-22</a>');
    expect(index).toContain('Rev. C <span class="badge badge-draft">draft, not issued</span>');
  });

  it('shows an issued revision as the document issued, from the issued basis and results, not from the working draft', () => {
    const a = readFileSync(join(site, 'projects', SOFC, 'rev-A', 'document.html'), 'utf8');
    const draft = readFileSync(join(site, 'projects', SOFC, 'index.html'), 'utf8');
    expect(a).toContain('1033.15 K (760.0 °C)');
    expect(draft).toContain('1023.15 K (750.0 °C)');
  });

  it('lists every revision in the history with the change summary against the one before', () => {
    const draft = readFileSync(join(site, 'projects', SOFC, 'index.html'), 'utf8');
    expect(draft).toContain('href="rev-A/index.html"');
    expect(draft).toContain('href="rev-B/index.html"');
    expect(draft).toMatch(/operating temperature 760 C → 750 C/);
  });

  it('renders each page exactly as renderDocumentHtml renders the same view', () => {
    const model = loadSiteModel(root, { env: EPOCH, draftPdfs: findChromium() !== null });
    for (const entry of model.pages) expect(readFileSync(join(site, entry.pagePath), 'utf8'), entry.pagePath).toBe(renderView(entry.view()));
  }, 60_000);

  it('gives byte-identical files when built again from the same inputs', async () => {
    const again = join(root, 'site-again');
    await buildSite({ root, out: again, env: EPOCH });
    expect(treeDigest(again)).toEqual(treeDigest(site));
  }, 180_000);

  it('keeps the previous site when a basis has errors, and names each error at file:line:col', async () => {
    const before = treeDigest(site);
    const good = readFileSync(basisFile(root, 'hob-tor-pem-backup'), 'utf8');
    writeFileSync(basisFile(root, 'hob-tor-pem-backup'), good.replace('value: "62 C", source: R2', 'value: "hot", source: R2').replace('target-power: { value: "8 kW"', 'target-power: { value: "8 parsecs"'));
    try {
      const r = await run(['build'], root);
      expect(r.code).toBe(1);
      expect(r.err).toMatch(/^projects\/hob-tor-pem-backup\/basis\.yaml:\d+:\d+: conditions\.operating-temperature\.value: expected a temperature/m);
      expect(r.err).toMatch(/^projects\/hob-tor-pem-backup\/basis\.yaml:\d+:\d+: operating-point\.target-power\.value: /m);
      expect(r.err).toContain('the previous site is left as it was');
      expect(r.err).not.toMatch(/\n\s+at /);
      expect(treeDigest(site)).toEqual(before);
      expect(readdirSync(root).filter((n) => n.endsWith('.tmp'))).toEqual([]);
    } finally {
      writeFileSync(basisFile(root, 'hob-tor-pem-backup'), good);
    }
  }, 120_000);

  it('keeps the previous site when an issued results file lacks what the site needs of it', async () => {
    // (Another format, or fields it does not know, are read past: test/archive/issued-format.test.ts.)
    const before = treeDigest(site);
    const file = join(root, 'projects', SOFC, 'issued', 'A', 'results.json');
    const good = readFileSync(file, 'utf8');
    // The first "headline" is the top-level one (the cases' follow it).
    writeFileSync(file, good.replace('"headline": {', '"headlines": {'));
    try {
      const r = await run(['build'], root);
      expect(r.code).toBe(1);
      expect(r.err).toContain('projects/thistlemere-sofc-chp/issued/A/results.json: field headline: missing; expected an object of the headline numbers;');
      expect(treeDigest(site)).toEqual(before);
    } finally {
      writeFileSync(file, good);
    }
  }, 120_000);
});

it('says so when there is nothing to build', async () => {
  const empty = demoRoot([]);
  try {
    const r = await run(['build'], empty);
    expect(r.code).toBe(2);
    expect(r.err).toContain('no design bases under projects/');
    expect(existsSync(join(empty, 'site'))).toBe(false);
  } finally {
    rmSync(empty, { recursive: true, force: true });
  }
});
