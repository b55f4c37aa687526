// Shared by the basis tests: the base fixture and text edits of it.
import { readFileSync } from 'node:fs';

export const BASE = readFileSync(new URL('./fixtures/sofc-power.yaml', import.meta.url), 'utf8');

/** The base with each `from` (which must occur exactly once) replaced by `to`. */
export function edit(base: string, ...edits: [from: string, to: string][]): string {
  let text = base;
  for (const [from, to] of edits) {
    const count = text.split(from).length - 1;
    if (count !== 1) throw new Error(`edit: "${from}" occurs ${count} times`);
    text = text.replace(from, () => to);
  }
  return text;
}
