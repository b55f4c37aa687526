/**
 * PDF benchmarks on synthetic projects: the working drafts printed as the build prints them
 * (lib/publish/draft-pdfs.ts: PRINT_LANES Chromiums, each every lanes-th draft, the PDF cache
 * empty), per document in wall and processor time (this process and every Chromium process it
 * started), target ≤ 1.0 s a document at N = 100 (issue 23); and a cold build with PDFs
 * (calculation, pages and PDFs, every cache empty) as one figure. On a shared machine the wall
 * time depends on what else runs: the processor time is the figure to compare.
 */
import { mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { writeSyntheticProjects } from './synthetic.ts';
import { buildSite } from '../lib/publish/build.ts';
import { findChromium } from '../lib/publish/chromium.ts';
import { loadSiteModel } from '../lib/publish/site-model.ts';
import { PRINT_LANES, printDrafts } from '../lib/publish/draft-pdfs.ts';
import type { Row } from './measure.ts';

/** Drafts printed per N: all of them up to 100, the first 100 beyond. */
const PDF_SAMPLE = 100;

/** Processor time (user + system, ms) of every process descended from this one, as /proc shows it now. */
function descendantsCpuMs(): Map<number, number> {
  const stats = new Map<number, { parent: number; ms: number }>();
  for (const entry of readdirSync('/proc')) {
    if (!/^\d+$/.test(entry)) continue;
    try {
      const stat = readFileSync(`/proc/${entry}/stat`, 'utf8');
      const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
      stats.set(Number(entry), { parent: Number(fields[1]), ms: (Number(fields[11]) + Number(fields[12])) * 10 });
    } catch {
      // the process ended while /proc was read
    }
  }
  const mine = new Set([process.pid]);
  for (let grew = true; grew; ) {
    grew = false;
    for (const [pid, { parent }] of stats) if (mine.has(parent) && !mine.has(pid)) (mine.add(pid), (grew = true));
  }
  mine.delete(process.pid);
  return new Map([...mine].map((pid) => [pid, stats.get(pid)!.ms]));
}

/**
 * Wall and processor time of `work`: this process's (process.cpuUsage) and that of the processes
 * it starts (Chromium and its renderers), read from /proc every 200 ms while it runs, so a
 * process's time counts up to its last reading before it ended.
 */
async function measured(work: () => Promise<unknown>): Promise<{ wallMs: number; cpuMs: number }> {
  const last = new Map<number, number>();
  const before = descendantsCpuMs();
  const sample = () => {
    for (const [pid, ms] of descendantsCpuMs()) last.set(pid, ms - (before.get(pid) ?? 0));
  };
  const timer = setInterval(sample, 200);
  const cpu0 = process.cpuUsage();
  const t0 = performance.now();
  try {
    await work();
  } finally {
    clearInterval(timer);
  }
  const wallMs = performance.now() - t0;
  const own = process.cpuUsage(cpu0);
  const children = [...last.values()].reduce((a, b) => a + b, 0);
  return { wallMs, cpuMs: (own.user + own.system) / 1000 + children };
}

const seconds = (ms: number) => `${(ms / 1000).toFixed(2)} s`;

/** The drafts of N synthetic projects printed as the build prints them, per document. */
async function pdfPerDocument(n: number): Promise<Row[]> {
  const root = mkdtempSync(join(tmpdir(), 'cellbasis-bench-pdf-'));
  try {
    writeSyntheticProjects(root, n);
    await buildSite({ root, pdf: false });
    const drafts = loadSiteModel(root).drafts.slice(0, PDF_SAMPLE);
    const { wallMs, cpuMs } = await measured(() => printDrafts(root, join(root, 'site'), drafts));
    const perDoc = wallMs / drafts.length;
    const sample = drafts.length < n ? `, the first ${drafts.length}` : '';
    return [
      {
        section: `pdf N=${n}`,
        measure: `PDF per document, ${PRINT_LANES} Chromiums side by side (as the build prints${sample}): wall (processor time)`,
        value: `${seconds(perDoc)} (${seconds(cpuMs / drafts.length)})`,
        target: n === 100 ? '≤ 1.0 s' : undefined,
        verdict: n === 100 ? (perDoc <= 1000 ? 'met' : 'MISSED') : undefined,
      },
    ];
  } finally {
    rmSync(root, { recursive: true, force: true });
  }
}

/** A cold build of N synthetic drafts with their PDFs (every cache empty), as one figure. */
async function coldBuildWithPdfs(n: number): Promise<Row> {
  const root = mkdtempSync(join(tmpdir(), 'cellbasis-bench-pdf-build-'));
  try {
    writeSyntheticProjects(root, n);
    const { wallMs, cpuMs } = await measured(() => buildSite({ root, pdf: true }));
    return { section: `pdf N=${n}`, measure: `cold build of ${n} drafts with PDFs: wall (processor time)`, value: `${seconds(wallMs)} (${seconds(cpuMs)})` };
  } finally {
    rmSync(root, { recursive: true, force: true });
  }
}

/**
 * The PDF rows at each N of `counts`, and the cold build with PDFs at BENCH_PDF_BUILD drafts
 * (default 500; 0 leaves it out: it takes some 25 minutes on two cores).
 */
export async function benchPdf(counts: number[]): Promise<Row[]> {
  if (!findChromium()) return [{ section: 'pdf', measure: 'PDF per document', value: 'not measured: no Chromium' }];
  const rows: Row[] = [];
  for (const n of counts) rows.push(...(await pdfPerDocument(n)));
  const build = Number(process.env.BENCH_PDF_BUILD ?? 500);
  if (build > 0) rows.push(await coldBuildWithPdfs(build));
  return rows;
}
