/**
 * The fuel-gas equilibria a fuel path solved (fuel-path.ts), kept so that a later path of the same
 * calculation whose fuel side asks the same question takes the answer instead of solving it
 * again: a case that changes only the air side (its air utilization, so the air-electrode gas and
 * with it the Nernst voltage along the path) re-equilibrates the very fuel gas of the sizing case
 * at every point, and since the path's own solutions seed each next equilibrium, it asks the same
 * questions in the same order.
 *
 * The minimiser (gibbs-minimiser.ts minimiseGibbs) is pure in what it is given: the chemical
 * system, g°/RT of its species at T, ln P, the element amounts and the start. An answer is taken
 * only where all of them are the same, bit for bit (Object.is on every number), so the path gets
 * the numbers solving would give. The memo keeps the path's own arrays (a fuel path makes the
 * element amounts and the start afresh for each equilibrium and changes neither them nor the
 * answer afterwards), and a path that takes an answer gets copies, so that no path shares another's.
 */
import type { ChemicalSystem } from './species-set.ts';
import type { MinimiserResult } from './gibbs-minimiser.ts';

interface Kept {
  b: Float64Array;
  warm: Float64Array | undefined;
  result: MinimiserResult;
}

function same(a: Float64Array | undefined, b: Float64Array | undefined): boolean {
  if (a === undefined || b === undefined) return a === b;
  if (a.length !== b.length) return false;
  for (let k = 0; k < a.length; k++) if (!Object.is(a[k], b[k])) return false;
  return true;
}

/** The equilibria of one path, by utilization, under the system, g°/RT, ln P and graphite g°/RT they were solved with. */
export class EquilibriumMemo {
  private readonly kept = new Map<number, Kept[]>();
  private readonly key: string;
  /** The equilibria this path solved, and those it took from earlier paths. */
  solved = 0;
  taken = 0;

  constructor(
    private readonly system: ChemicalSystem,
    gRT: Float64Array,
    lnP: number,
    gGraphiteRT: number,
  ) {
    // JSON numbers round-trip exactly; every number the minimiser reads besides the amounts and the start.
    this.key = JSON.stringify([Array.from(gRT), lnP, gGraphiteRT]);
  }

  /** Whether the equilibria of `other` were solved on this system, g°/RT, ln P and graphite: the same questions have the same answers. */
  private matches(other: EquilibriumMemo): boolean {
    return other.system === this.system && other.key === this.key;
  }

  /** The earlier memos whose equilibria this one may take. */
  compatible(earlier: readonly EquilibriumMemo[]): EquilibriumMemo[] {
    return earlier.filter((m) => m !== this && this.matches(m));
  }

  /** The answer one of the `earlier` paths found at utilization u for these element amounts and start, copied; undefined where none asked it. */
  take(earlier: readonly EquilibriumMemo[], u: number, b: Float64Array, warm: Float64Array | undefined): MinimiserResult | undefined {
    for (const memo of earlier) {
      const hit = memo.kept.get(u)?.find((k) => same(k.b, b) && same(k.warm, warm));
      if (hit) {
        this.taken++;
        const r = hit.result;
        return { ...r, n: r.n.slice(), lnScaled: r.lnScaled.slice(), pi: r.pi.slice() };
      }
    }
    return undefined;
  }

  /** Keeps an equilibrium this path solved at utilization u from these element amounts and start. */
  keep(u: number, b: Float64Array, warm: Float64Array | undefined, result: MinimiserResult): void {
    this.solved++;
    const at = this.kept.get(u);
    const entry = { b, warm, result };
    if (at) at.push(entry);
    else this.kept.set(u, [entry]);
  }
}
