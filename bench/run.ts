/**
 * `npm run bench`: the benchmarks, printed as one table. Not a test: nothing here fails a build.
 * Sections can be chosen: `npm run bench -- thermo equilibrium`.
 */
import { benchThermo } from './thermo.ts';
import { benchEquilibrium } from './equilibrium.ts';
import { benchCalc } from './calc.ts';
import { benchCases } from './cases.ts';
import { benchSite } from './site.ts';
import { benchPdf } from './pdf.ts';
import { printTable, type Row } from './measure.ts';

const sections: Record<string, () => Promise<Row[]> | Row[]> = {
  thermo: benchThermo,
  equilibrium: benchEquilibrium,
  calc: () => benchCalc(SIZES),
  cases: benchCases,
  site: () => benchSite(SIZES),
  pdf: () => benchPdf(SIZES.filter((n) => n <= 500)),
};

/** N of the calculation and site benchmarks: 10, 100, 500 and 2000, or BENCH_SIZES=10,100 for a shorter run. */
function sizes(): number[] {
  const raw = process.env.BENCH_SIZES ?? '10,100,500,2000';
  const sizes = raw.split(',').map((t) => t.trim());
  if (sizes.some((t) => !/^[1-9]\d{0,4}$/.test(t))) {
    process.stderr.write(`bench: BENCH_SIZES must be project counts from 1 to 99999 separated by commas (e.g. 10,100), got "${raw}"\n`);
    process.exit(2);
  }
  return sizes.map(Number);
}

const SIZES = sizes();
const wanted = process.argv.slice(2).filter((a) => !a.startsWith('-'));
const rows: Row[] = [];
for (const [name, run] of Object.entries(sections)) {
  if (wanted.length > 0 && !wanted.includes(name)) continue;
  process.stderr.write(`bench: ${name}...\n`);
  rows.push(...(await run()));
}
printTable(rows);
