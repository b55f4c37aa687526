/**
 * The current density at which the cells of the sizing case meet a case's target: the root of
 *
 *   N · p(j) = target,
 *
 * with p(j) what one cell delivers at current density j (design-point.ts deliveredPerCell): net
 * power N j A V(j) (1 − f_par) in power mode, input power N j A V(j) in electrolysis, or hydrogen
 * N A j_ion(j) M_H2 / (2F) (by the fuel path's hydrogen per charge). V(j) is the uniform-voltage
 * cell of voltage.ts on the case's fuel path (which does not depend on j at fixed utilization),
 * after its degradation.
 *
 * In electrolysis p(j) rises with j. In power mode N j A V(j) rises from zero, reaches a greatest
 * power (where d(jV)/dj = 0, V about half the open-circuit voltage for a resistive cell) and
 * falls: the plant runs on the rising branch, below that current, so the root sought is the first
 * crossing from below; a target above the greatest power cannot be met. The root is bracketed
 * from a guess in proportion to the target (fromGuess), else by stepping j up by a factor 1.25
 * from a sixty-fourth of the base current density (the greatest power, when passed, refined by
 * golden-section search for the message), and found by the Illinois
 * variant of regula falsi (G. Dahlquist and Å. Björck, Numerical Methods, §6.2) to 1e-12 of j.
 */
import type { FuelPath } from '../equilibrium/fuel-path.ts';
import { UserError } from '../core/errors.ts';
import type { DesignInputs } from './design-inputs.ts';
import { cellVoltageOf, deliveredPerCell, type CellVoltage } from './design-point.ts';

/** The most a current density of a basis may be (lib/basis/data/limits.yaml: 1000 A/cm²), A/m². */
const HIGHEST_CURRENT_DENSITY = 1e7;

const GROWTH = 1.25;

/**
 * The current density found, with the cell's voltage there on the inputs given (cellVoltageOf)
 * where the search computed it (it ends on its root, as a rule), or why none meets the target.
 */
export type TargetSolution = { ok: true; currentDensityAPerM2: number; cell?: CellVoltage } | { ok: false; message: string };

/** What `cells` cells deliver of the target's quantity at current density j, with the cell's voltage there; null where the cell has no voltage there. */
function deliveredAt(inputs: DesignInputs, path: FuelPath, cells: number, target: 'power' | 'hydrogen', j: number): { value: number; cell: CellVoltage } | null {
  const at = { ...inputs, currentDensityAPerM2: j };
  try {
    const cell = cellVoltageOf(at, path);
    return { value: cells * deliveredPerCell(at, path, cell.voltage, target), cell };
  } catch (error) {
    // Past the current density at which the voltage reaches zero (power mode) the cell delivers nothing.
    if (error instanceof UserError) return null;
    throw error;
  }
}

/** The root of f on [lo, hi] where f(lo) < 0 < f(hi), by the Illinois method, to 1e-12 relative. */
function illinois(f: (x: number) => number, lo: number, fLo: number, hi: number, fHi: number): number {
  let side = 0;
  for (let k = 0; k < 300; k++) {
    // A side where the cell delivers nothing (f = −∞) gives no secant: halve instead.
    const x = Number.isFinite(fLo) ? (lo * fHi - hi * fLo) / (fHi - fLo) : (lo + hi) / 2;
    const fx = f(x);
    if (fx === 0 || hi - lo <= 1e-12 * hi) return x;
    if (fx < 0) {
      lo = x;
      fLo = fx;
      if (side === -1) fHi /= 2;
      side = -1;
    } else {
      hi = x;
      fHi = fx;
      if (side === 1) fLo /= 2;
      side = 1;
    }
  }
  return (lo + hi) / 2;
}

/** The greatest of g on [a, b] (g unimodal there), by golden-section search: its argument and value. */
function greatest(g: (x: number) => number, a: number, b: number): { x: number; value: number } {
  const r = (Math.sqrt(5) - 1) / 2;
  let c = b - r * (b - a);
  let d = a + r * (b - a);
  let gc = g(c);
  let gd = g(d);
  while (b - a > 1e-9 * b) {
    if (gc > gd) {
      b = d;
      d = c;
      gd = gc;
      c = b - r * (b - a);
      gc = g(c);
    } else {
      a = c;
      c = d;
      gc = gd;
      d = a + r * (b - a);
      gd = g(d);
    }
  }
  return gc > gd ? { x: c, value: gc } : { x: d, value: gd };
}

/** How the messages write a target and a current density. */
function targetText(target: 'power' | 'hydrogen', value: number, mode: DesignInputs['mode']): string {
  return target === 'hydrogen' ? `${(value * 86400).toPrecision(4)} kg/day of hydrogen` : `${(value / 1000).toPrecision(4)} kW ${mode === 'power' ? 'net' : 'input'}`;
}

const cm2 = (j: number) => `${(j / 1e4).toPrecision(4)} A/cm2`;

/**
 * The root from a first guess, where the guess brackets it: the current density in proportion to
 * the target, j_g = j_b · target / p(j_b) from the base current density j_b (exact where p is
 * linear in j, as hydrogen is). Where p(j_g) reaches the target the root lies below j_g (on the
 * rising branch p(j)/j falls with j), bracketed by stepping down by the factor 1.25; where it
 * falls short on the rising branch the search steps up from j_g; past the greatest power, from
 * j_b/64 as without a guess.
 */
function fromGuess(base: number, value: number, delivered: (j: number) => number | null, f: (j: number) => number): number | { start: number } {
  const atBase = delivered(base);
  if (atBase === null || !(atBase > 0)) return { start: base / 64 };
  const guess = Math.min((base * value) / atBase, HIGHEST_CURRENT_DENSITY);
  const fGuess = f(guess);
  if (fGuess === 0) return guess;
  if (fGuess > 0) {
    let hi = guess;
    let fHi = fGuess;
    let lo = hi / GROWTH;
    let fLo = f(lo);
    while (fLo >= 0) {
      if (fLo === 0) return lo;
      hi = lo;
      fHi = fLo;
      lo /= GROWTH;
      fLo = f(lo);
    }
    return illinois(f, lo, fLo, hi, fHi);
  }
  return { start: f(guess * GROWTH) > fGuess ? guess : base / 64 };
}

/**
 * The current density at which `cells` cells on `path` deliver `value` of the target (W net or
 * input, or kg/s of hydrogen), or why none does.
 */
export function currentDensityForTarget(inputs: DesignInputs, path: FuelPath, cells: number, target: 'power' | 'hydrogen', value: number): TargetSolution {
  // The cell at the last current density tried: the root, where the search ends on it, needs it again (evaluateDesignPoint).
  let last: { j: number; cell: CellVoltage } | null = null;
  const delivered = (j: number) => {
    const at = deliveredAt(inputs, path, cells, target, j);
    last = at && { j, cell: at.cell };
    return at && at.value;
  };
  const f = (j: number) => (delivered(j) ?? -Infinity) - value;
  const found = (j: number): TargetSolution => (last?.j === j ? { ok: true, currentDensityAPerM2: j, cell: last.cell } : { ok: true, currentDensityAPerM2: j });
  const guessed = fromGuess(inputs.currentDensityAPerM2, value, delivered, f);
  if (typeof guessed === 'number') return found(guessed);
  let lo = guessed.start;
  let fLo = f(lo);
  // Below the first step: halve until the cells deliver less than the target (they deliver nothing at j → 0).
  while (fLo >= 0) {
    if (fLo === 0) return found(lo);
    lo /= 2;
    fLo = f(lo);
  }
  let before = lo / GROWTH;
  for (let hi = lo * GROWTH; hi <= HIGHEST_CURRENT_DENSITY * GROWTH; hi *= GROWTH) {
    const fHi = f(hi);
    if (fHi >= 0) return found(fHi === 0 ? hi : illinois(f, lo, fLo, hi, fHi));
    if (inputs.mode === 'power' && fHi <= fLo) {
      // Past the greatest power without reaching the target: it lies between `before` and `hi`.
      const most = greatest((j) => delivered(j) ?? 0, before, hi);
      return {
        ok: false,
        message: `the ${cells} cells of the sizing case cannot deliver ${targetText(target, value, inputs.mode)}: the most they deliver at this operating point is ${targetText(target, most.value, inputs.mode)}, at ${cm2(most.x)}`,
      };
    }
    before = lo;
    lo = hi;
    fLo = fHi;
  }
  return { ok: false, message: `the ${cells} cells of the sizing case would need more than ${cm2(HIGHEST_CURRENT_DENSITY)} to deliver ${targetText(target, value, inputs.mode)}` };
}
