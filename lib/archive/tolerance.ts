/**
 * When two calculated numbers count as the same: the rule the audit applies between issued and
 * recomputed results, and the revision comparison between two revisions' results.
 *
 * Equal when |a − b| ≤ max(1e-12 · max(|a|, |b|), 1e-15). Why these numbers: a double carries
 * about 16 significant digits (machine epsilon 2.2e-16). The same cellbasis on the same Node.js
 * gives bit-identical numbers, since V8 computes Math.exp, Math.log and Math.pow with its own
 * portable routines; another Node.js version or CPU may round the last digit or two differently,
 * and the Newton iterations of the equilibrium carry such a difference through a few hundred
 * operations, which leaves it well below 1e-13 relative. Any real change of an input, a constant,
 * the species data or an equation moves the numbers by far more than 1e-12 relative (a 0.1 K
 * change of 1073 K is 1e-4). The absolute floor of 1e-15 is for values that are themselves
 * rounding residue (the element-balance error, about 1e-16) or trace amounts next to zero,
 * whose relative difference means nothing.
 */
const RELATIVE_TOLERANCE = 1e-12;
const ABSOLUTE_FLOOR = 1e-15;

export function sameWithinRounding(a: number, b: number): boolean {
  if (Object.is(a, b)) return true;
  if (!Number.isFinite(a) || !Number.isFinite(b)) return false;
  return Math.abs(a - b) <= Math.max(RELATIVE_TOLERANCE * Math.max(Math.abs(a), Math.abs(b)), ABSOLUTE_FLOOR);
}
