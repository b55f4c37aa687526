/**
 * `npm run bench`: the benchmarks, printed as one table. Not a test: nothing here fails a build.
 * Sections can be chosen: `npm run bench -- thermo equilibrium`.
 */
import { benchThermo } from './thermo.ts';
import { benchEquilibrium } from './equilibrium.ts';
import { benchCalc } from './calc.ts';
import { benchSite } from './site.ts';
import { printTable, type Row } from './measure.ts';

const sections: Record<string, () => Promise<Row[]> | Row[]> = {
  thermo: benchThermo,
  equilibrium: benchEquilibrium,
  calc: () => benchCalc([10, 100, 500]),
  site: () => benchSite(sizes()),
};

/** N of the site benchmarks: 10, 100, 500, or BENCH_SIZES=10,100 for a shorter run. */
function sizes(): number[] {
  return (process.env.BENCH_SIZES ?? '10,100,500').split(',').map(Number);
}

const wanted = process.argv.slice(2).filter((a) => !a.startsWith('-'));
const rows: Row[] = [];
for (const [name, run] of Object.entries(sections)) {
  if (wanted.length > 0 && !wanted.includes(name)) continue;
  process.stderr.write(`bench: ${name}...\n`);
  rows.push(...(await run()));
}
printTable(rows);
