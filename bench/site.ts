/**
 * Site benchmarks on synthetic projects: the full HTML build (cold: empty caches; warm: results
 * from the cache and every page rendered, also per document in wall and processor time, target
 * ≤ 8 ms; and the build after it, nothing changed, every page kept: lib/publish/kept-pages.ts), a bare Eleventy
 * site of the same number of trivial pages built in the same run (the yardstick of the 1.5×
 * target), Eleventy writing the very pages the build wrote (the floor, target ≤ 3×), the time from saving a changed basis to its rebuilt page under `cellbasis serve`,
 * and the peak memory (RSS) of a full build with results cached and of a cold one (every result
 * calculated in it), each measured in a child process. PDFs: bench/pdf.ts.
 */
import { spawn } from 'node:child_process';
import { mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, sep } from 'node:path';
import { fileURLToPath } from 'node:url';
import { writeSyntheticProjects } from './synthetic.ts';
import { createEleventy } from '../lib/publish/eleventy-api.ts';
import { buildSite, PAGES_PER_RUN } from '../lib/publish/build.ts';
import { serveSite } from '../lib/publish/serve.ts';
import { CACHE_DIR } from '../lib/batch/results-cache.ts';
import type { Row } from './measure.ts';

const REPO = fileURLToPath(new URL('..', import.meta.url));
const seconds = (ms: number) => `${(ms / 1000).toFixed(2)} s`;

async function timed(work: () => Promise<unknown>): Promise<number> {
  const t0 = performance.now();
  await work();
  return performance.now() - t0;
}

/** A bare Eleventy site: one Nunjucks template paginated over `count` items, a line of text each. */
async function bareEleventy(count: number): Promise<number> {
  const dir = mkdtempSync(join(tmpdir(), 'cellbasis-bench-bare-'));
  try {
    mkdirSync(join(dir, 'in'));
    writeFileSync(join(dir, 'in', 'items.11tydata.json'), JSON.stringify({ items: Array.from({ length: count }, (_, i) => ({ id: `p${i}`, title: `Project ${i}` })) }));
    writeFileSync(join(dir, 'in', 'items.njk'), '---\npagination:\n  data: items\n  size: 1\n  alias: item\npermalink: "projects/{{ item.id }}/index.html"\n---\n<!doctype html><title>{{ item.title }}</title><h1>{{ item.title }}</h1>\n');
    writeFileSync(join(dir, 'eleventy.config.mjs'), 'export default function () {}\n');
    const eleventy = createEleventy(join(dir, 'in'), join(dir, 'out'), { configPath: join(dir, 'eleventy.config.mjs'), quietMode: true });
    eleventy.disableLogger();
    return await timed(() => eleventy.write());
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/** Every HTML page under `site`, by path relative to it. */
function htmlPages(site: string, prefix = ''): string[] {
  return readdirSync(join(site, prefix), { withFileTypes: true }).flatMap((e) => {
    const path = join(prefix, e.name);
    if (e.isDirectory()) return htmlPages(site, path);
    return e.name.endsWith('.html') ? [path] : [];
  });
}

/**
 * The honest floor: Eleventy writing the very pages our build wrote (every HTML file of the
 * built site, read back and handed to one paginated template as data, output unchanged), so it
 * carries the same content, bytes and page count and costs no rendering of ours. The cached
 * build over this is what our calculation lookup, view model, templates, KaTeX and charts cost.
 */
async function finishedPagesEleventy(site: string): Promise<{ ms: number; pages: number }> {
  const dir = mkdtempSync(join(tmpdir(), 'cellbasis-bench-floor-'));
  try {
    mkdirSync(join(dir, 'in'));
    writeFileSync(join(dir, 'in', 'pages.njk'), '---\npagination:\n  data: pages\n  size: 1\n  alias: page_\npermalink: "{{ page_.permalink }}"\n---\n{{ page_.html | safe }}');
    writeFileSync(join(dir, 'eleventy.config.mjs'), 'export default function () {}\n');
    // Run by run, PAGES_PER_RUN pages each (as many as the build writes between two full
    // collections): all the pages of 2 000 documents (about 1.4 GB) in one data file would not
    // fit in a JavaScript string.
    const paths = htmlPages(site).map((path) => path.split(sep).join('/'));
    let ms = 0;
    for (let start = 0; start < paths.length; start += PAGES_PER_RUN) {
      const pages = paths.slice(start, start + PAGES_PER_RUN).map((permalink) => ({ permalink, html: readFileSync(join(site, permalink), 'utf8') }));
      writeFileSync(join(dir, 'in', 'pages.11tydata.json'), JSON.stringify({ pages }));
      const eleventy = createEleventy(join(dir, 'in'), join(dir, 'out'), { configPath: join(dir, 'eleventy.config.mjs'), quietMode: true });
      eleventy.disableLogger();
      ms += await timed(() => eleventy.write());
      const sample = pages[0];
      if (sample && readFileSync(join(dir, 'out', sample.permalink), 'utf8') !== sample.html) throw new Error(`the floor did not write ${sample.permalink} unchanged`);
    }
    return { ms, pages: paths.length };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/**
 * Peak RSS of a full HTML build in a fresh process (resourceUsage().maxRSS, in kB), every page
 * rendered (none kept from the site before): with the results cached, or cold (the results cache
 * emptied first: every result calculated in the build, which fills the cache again).
 */
function peakRss(root: string, cold = false): Promise<number> {
  if (cold) rmSync(join(root, CACHE_DIR, 'results'), { recursive: true, force: true });
  const script = `import { buildSite } from ${JSON.stringify(join(REPO, 'lib/publish/build.ts'))};\nawait buildSite({ root: ${JSON.stringify(root)}, pdf: false, renderAll: true });\nprocess.stdout.write(String(process.resourceUsage().maxRSS));\n`;
  const file = join(REPO, `.bench-rss-${process.pid}.mts`);
  writeFileSync(file, script);
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, ['--import', 'tsx', file], { cwd: REPO, stdio: ['ignore', 'pipe', 'inherit'] });
    let out = '';
    child.stdout.on('data', (d) => (out += d));
    child.on('exit', (code) => {
      rmSync(file, { force: true });
      if (code === 0) resolve(Number(out.trim()));
      else reject(new Error(`the RSS probe exited with ${code}`));
    });
  });
}

/** Saves a changed basis under `serve` and waits until its page is rewritten with the change. */
async function watchLatency(root: string, id: string): Promise<number> {
  const port = 18000 + (process.pid % 1000);
  const server = await serveSite({ root, port });
  try {
    const file = join(root, 'projects', id, 'basis.yaml');
    const page = join(root, 'site', 'projects', id, 'index.html');
    const waitFor = async (test: () => boolean, limitMs: number) => {
      const start = performance.now();
      while (!test()) {
        if (performance.now() - start > limitMs) throw new Error('the page was not rebuilt in time');
        await new Promise((r) => setTimeout(r, 20));
      }
    };
    await waitFor(() => {
      try {
        return statSync(page).size > 0;
      } catch {
        return false;
      }
    }, 300_000);
    await new Promise((r) => setTimeout(r, 1500));
    const text = readFileSync(file, 'utf8');
    const marker = `Bench change ${Date.now()}`;
    const t0 = performance.now();
    writeFileSync(file, text.replace(/^( {2}title: ).*$/m, `$1${marker}`));
    await waitFor(() => {
      try {
        return readFileSync(page, 'utf8').includes(marker);
      } catch {
        return false;
      }
    }, 120_000);
    return performance.now() - t0;
  } finally {
    await server.stop();
  }
}

/** The rows of a peak RSS (in MiB) at N = n: the figure (≤ 500 MiB) and, beyond 100, its growth over the figure at 100 (≤ +15 %). */
function memoryRows(section: string, n: number, what: string, rss: number, byCount: Map<number, number>): Row[] {
  byCount.set(n, rss);
  const rows: Row[] = [{ section, measure: `peak memory of ${what}`, value: `${rss.toFixed(0)} MiB`, target: '≤ 500 MiB', verdict: rss <= 500 ? 'met' : 'MISSED' }];
  const reference = byCount.get(100);
  if (reference !== undefined && n > 100) {
    const growth = rss / reference - 1;
    rows.push({ section, measure: `peak memory of ${what.split(' (')[0]} against N = 100`, value: `${growth >= 0 ? '+' : ''}${(growth * 100).toFixed(0)} %`, target: '≤ +15 %', verdict: growth <= 0.15 ? 'met' : 'MISSED' });
  }
  return rows;
}

export async function benchSite(counts: number[]): Promise<Row[]> {
  const rows: Row[] = [];
  const rssByCount = new Map<number, number>();
  const coldRssByCount = new Map<number, number>();
  for (const n of counts) {
    const root = mkdtempSync(join(tmpdir(), 'cellbasis-bench-site-'));
    const section = `site N=${n}`;
    try {
      const ids = writeSyntheticProjects(root, n);
      const cold = await timed(() => buildSite({ root, pdf: false }));
      // Processor time of this process (all its threads) beside the wall time: on a shared machine the wall time says little.
      // Every page rendered (--render-all): what rendering a document costs.
      const cpu0 = process.cpuUsage();
      const warm = await timed(() => buildSite({ root, pdf: false, renderAll: true }));
      const cpu = process.cpuUsage(cpu0);
      const warmCpu = (cpu.user + cpu.system) / 1000;
      // Nothing changed since: every draft's page kept from the site replaced (lib/publish/kept-pages.ts).
      const keptCpu0 = process.cpuUsage();
      let keptCount = 0;
      const kept = await timed(async () => (keptCount = (await buildSite({ root, pdf: false })).keptPages));
      const keptUsage = process.cpuUsage(keptCpu0);
      if (keptCount !== n) throw new Error(`the unchanged build kept ${keptCount} of ${n} pages`);
      const bare = await bareEleventy(n);
      rows.push({ section, measure: 'full HTML build, cold (calculation included)', value: seconds(cold) });
      rows.push({ section, measure: 'full HTML build, results cached, every page rendered', value: seconds(warm) });
      const perDocument = warm / n;
      rows.push({ section, measure: 'results cached, every page rendered: per document, wall (processor time)', value: `${perDocument.toFixed(1)} ms (${(warmCpu / n).toFixed(1)} ms)`, target: '≤ 8 ms', verdict: perDocument <= 8 ? 'met' : 'MISSED' });
      const perKept = kept / n;
      rows.push({ section, measure: 'nothing changed, every page kept: per document, wall (processor time)', value: `${perKept.toFixed(1)} ms (${((keptUsage.user + keptUsage.system) / 1000 / n).toFixed(1)} ms)`, target: '≤ 8 ms', verdict: perKept <= 8 ? 'met' : 'MISSED' });
      rows.push({ section, measure: `bare Eleventy, ${n} trivial pages`, value: seconds(bare) });
      // The target is stated for the full build; both ratios are shown, the cold one with the calculation in it.
      const coldRatio = cold / bare;
      rows.push({ section, measure: 'ratio: cold build / bare Eleventy', value: `${coldRatio.toFixed(1)} ×`, target: '≤ 1.5 ×', verdict: coldRatio <= 1.5 ? 'met' : 'MISSED' });
      const ratio = warm / bare;
      rows.push({ section, measure: 'ratio: cached build / bare Eleventy', value: `${ratio.toFixed(1)} ×`, target: '≤ 1.5 ×', verdict: ratio <= 1.5 ? 'met' : 'MISSED' });
      const floor = await finishedPagesEleventy(join(root, 'site'));
      rows.push({ section, measure: `Eleventy writing the same ${floor.pages} finished pages (the floor)`, value: seconds(floor.ms) });
      const floorRatio = warm / floor.ms;
      rows.push({ section, measure: 'ratio: cached build / finished-page floor (our rendering)', value: `${floorRatio.toFixed(1)} ×`, target: '≤ 3 ×', verdict: floorRatio <= 3 ? 'met' : 'MISSED' });
      // Memory must not grow with the portfolio: within 15 % of the figure at N = 100 (issue 23), cached and cold.
      rows.push(...memoryRows(section, n, 'a full build (RSS), results cached', (await peakRss(root)) / 1024, rssByCount));
      rows.push(...memoryRows(section, n, 'a cold build (RSS), every result calculated', (await peakRss(root, true)) / 1024, coldRssByCount));
      const latency = await watchLatency(root, ids[Math.floor(ids.length / 2)]!);
      rows.push({ section, measure: 'saved basis to rebuilt page (cellbasis serve)', value: seconds(latency), target: '≤ 0.3 s', verdict: latency <= 300 ? 'met' : 'MISSED' });
    } finally {
      rmSync(root, { recursive: true, force: true });
    }
  }
  return rows;
}
