/** Small helpers shared by the benchmarks: repeat a function for a time budget, report rates. */

export interface Row {
  section: string;
  measure: string;
  value: string;
  target?: string;
  verdict?: string;
}

/** Calls fn repeatedly for about `budgetMs` and returns calls per second (after a warm-up). */
export function ratePerSecond(fn: () => void, budgetMs = 500): number {
  for (let i = 0; i < 200; i++) fn();
  let calls = 0;
  const start = performance.now();
  let now = start;
  while (now - start < budgetMs) {
    for (let i = 0; i < 100; i++) fn();
    calls += 100;
    now = performance.now();
  }
  return (calls / (now - start)) * 1000;
}

export function quantile(sorted: number[], q: number): number {
  if (sorted.length === 0) return NaN;
  const i = Math.min(sorted.length - 1, Math.max(0, Math.ceil(q * sorted.length) - 1));
  return sorted[i]!;
}

export function formatRate(perSecond: number): string {
  return `${Math.round(perSecond).toLocaleString('en-US')} /s`;
}

export function printTable(rows: Row[]): void {
  const header = ['section', 'measure', 'value', 'target', 'verdict'];
  const cells = rows.map((r) => [r.section, r.measure, r.value, r.target ?? '', r.verdict ?? '']);
  const widths = header.map((h, i) => Math.max(h.length, ...cells.map((c) => c[i]!.length)));
  const line = (c: string[]) => c.map((x, i) => x.padEnd(widths[i]!)).join('  ');
  process.stdout.write([line(header), widths.map((w) => '-'.repeat(w)).join('  '), ...cells.map(line)].join('\n') + '\n');
}
