/**
 * Did-you-mean for names a user gets wrong (keys, enumerations, mixture names, species), by an
 * edit distance that the species suggestions of lib/thermo/species-data.ts use too.
 */

/**
 * Levenshtein distance, case-insensitive (for did-you-mean suggestions); swapping the digit 0
 * for the letter O (a common typing slip in formulas, "H20") costs half.
 */
function substitutionCost(x: string, y: string): number {
  if (x === y) return 0;
  return (x === '0' && y === 'o') || (x === 'o' && y === '0') ? 0.5 : 1;
}

export function editDistance(a: string, b: string): number {
  const s = a.toLowerCase();
  const t = b.toLowerCase();
  let prev = Array.from({ length: t.length + 1 }, (_, j) => j);
  for (let i = 1; i <= s.length; i++) {
    const cur = [i];
    for (let j = 1; j <= t.length; j++) {
      cur[j] = Math.min(prev[j]! + 1, cur[j - 1]! + 1, prev[j - 1]! + substitutionCost(s[i - 1]!, t[j - 1]!));
    }
    prev = cur;
  }
  return prev[t.length]!;
}

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
