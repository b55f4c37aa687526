/**
 * Did-you-mean for names a basis gets wrong (keys, enumerations, mixture names), by the same
 * edit distance the species suggestions use (lib/thermo/species-data.ts).
 */
import { editDistance } from '../thermo/species-data.ts';

/** Up to `most` candidates close to `name`, closest first. */
export function closest(name: string, candidates: readonly string[], most = 2): string[] {
  const limit = Math.max(2, Math.floor(name.length / 3));
  return candidates
    .filter((c) => Math.abs(c.length - name.length) <= limit)
    .map((c) => ({ c, d: editDistance(name, c) }))
    .filter((x) => x.d <= limit)
    .sort((a, b) => a.d - b.d || a.c.localeCompare(b.c))
    .slice(0, most)
    .map((x) => x.c);
}

/** `; did you mean "a" or "b"?`, or "" when nothing is close. */
export function didYouMean(name: string, candidates: readonly string[]): string {
  const near = closest(name, candidates);
  return near.length ? `; did you mean ${near.map((n) => `"${n}"`).join(' or ')}?` : '';
}

/** `"a", "b" or "c"` for messages. */
export function quotedList(names: readonly string[], conjunction = 'or'): string {
  const quoted = names.map((n) => `"${n}"`);
  return quoted.length <= 1 ? quoted.join('') : `${quoted.slice(0, -1).join(', ')} ${conjunction} ${quoted[quoted.length - 1]}`;
}
