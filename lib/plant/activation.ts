/**
 * The activation (kinetic) loss of a cell's electrodes, and the integrals along the fuel path that
 * the uniform-voltage cell (voltage.ts) needs once the local current density depends on it.
 *
 * The loss is one symmetric Butler–Volmer term (transfer coefficients α_a = α_c = α):
 *
 *   i = i₀ [exp(α n F η / R T) − exp(−α n F η / R T)] = 2 i₀ sinh(α n F η / R T)
 *   ⇒ η_act(i) = (b / ln 10) · asinh(i / (2 i₀)),   b = ln 10 · R T / (α n F), the Tafel slope
 *
 * (R. O'Hayre, S.-W. Cha, W. Colella, F. B. Prinz, Fuel Cell Fundamentals, 3rd ed., Wiley 2016,
 * ch. 3, the Butler–Volmer equation and its Tafel and small-η limits; A. J. Bard and L. R.
 * Faulkner, Electrochemical Methods, 2nd ed., Wiley 2001, ch. 3; both from memory). For i ≫ i₀,
 * asinh x → ln 2x and η → b log₁₀(i / i₀), the Tafel equation; for i ≪ i₀, η → (b / ln 10) i / (2 i₀),
 * a resistance that vanishes as i₀ grows. The basis gives b (V per decade) and i₀ (A/m² of
 * geometric area) and both are held at every temperature (no temperature law); the loss lumps
 * both electrodes (in a PEM cell the oxygen electrode's). In power mode it is subtracted from the
 * Nernst voltage, in electrolysis added (η ≥ 0 for the magnitude |i| of the current either way).
 *
 * At a point u of the fuel path of a purely ionic cell (t_ion = 1), with y(u) the driving voltage
 * (E − ΔV_x − V in power mode, V − E in electrolysis), the local current density solves
 *
 *   y = g(i) = i ASR + η_act(i)                                                      (A)
 *
 * g rises monotonically from 0, so (A) has one root i(y) ≥ 0 for y ≥ 0, found through η: with
 * c = b/ln 10, h(η) = η + 2 ASR i₀ sinh(η/c) − y is convex and rising, and Newton's method from an
 * upper bound (η = y, or c·asinh(y/(2 ASR i₀)), the smaller) descends to the root without
 * overshooting; then i = 2 i₀ sinh(η/c).
 *
 * The area that carries the charge from u to u + du is Q du / i(u), so the mean current density is
 * U / ∫₀^U du / i(u). Where E(u), and so y, is linear in u between two samples,
 *
 *   ∫ du / i = (Δu / Δy) ∫ dy / i = (Δu / Δy) ∫ g'(i) di / i = (Δu / Δy) [F(i₁) − F(i₀)],
 *   F(i) = ASR ln i − (c / (2 i₀)) asinh(2 i₀ / i)
 *
 * exactly (d/di of asinh(2i₀/i) is −2i₀ / (i √(i² + 4 i₀²)), and η'(i) = c / √(i² + 4 i₀²)); where
 * y changes by less than 1e-5 of itself over the interval, the trapezoidal rule (error below
 * 1e-11 of the interval's part, smaller than the cancellation the exact form would suffer). On the
 * logarithmic inlet intervals (y = α + β ln u) the integral is taken in s = ln u by 8-point
 * Gauss–Legendre, as path-integral.ts takes its own; below the first sample of such an inlet
 * ∫₀^m du/i = (m / i_m) / (1 − β / (g'(i_m) i_m)), from ∫₀^m du/i = m/i_m + ∫₀^m β du/(g'(i) i²) by parts
 * (exact for a pure Tafel electrode, i ∝ u^(β/c); for an ohmic one it agrees with path-integral.ts's
 * tail to second order in β/y).
 */
import type { ActivationLoss } from '../basis/types.ts';
import { GL8, type Profile } from '../equilibrium/path-integral.ts';

/** The activation loss η_act(i) = (b/ln 10) asinh(i/(2 i₀)) at the current density i (A/m²), V. */
export function activationOverpotentialV(loss: ActivationLoss, currentDensityAPerM2: number): number {
  return (loss.tafelSlopeVPerDecade / Math.LN10) * Math.asinh(currentDensityAPerM2 / (2 * loss.exchangeCurrentDensityAPerM2));
}

/** The local electrode of (A): the Tafel slope over ln 10, i₀ and the area-specific resistance. */
export class KineticCell {
  readonly c: number;
  readonly i0: number;
  constructor(
    loss: ActivationLoss,
    readonly asr: number,
  ) {
    this.c = loss.tafelSlopeVPerDecade / Math.LN10;
    this.i0 = loss.exchangeCurrentDensityAPerM2;
  }

  /** η of the root the last call of current() found: a start for the next, nearby root. */
  eta = 0;

  /**
   * The root i ≥ 0 of (A) at the driving voltage y ≥ 0, by Newton's method on h(η) from the upper
   * bound, or from `near`, the η of a nearby root (the sample before along the path): h is convex
   * and rising, so from a start below the root one step lands above it (within the bound) and the
   * iterates then fall to it; near the root that takes two or three steps instead of some seven.
   */
  current(y: number, near = Number.NaN): number {
    this.eta = 0;
    if (!(y > 0)) return 0;
    if (y === Infinity) return y;
    const { c, i0, asr } = this;
    if (asr === 0) return 2 * i0 * Math.sinh((this.eta = y) / c);
    const upper = Math.min(y, c * Math.asinh(y / (2 * asr * i0)));
    let eta = upper;
    // cosh from sinh, √(1 + sinh²): one transcendental a step instead of two.
    if (near > 0 && near < upper) {
      const s = Math.sinh(near / c);
      const value = near + 2 * asr * i0 * s - y;
      eta = value >= 0 ? near : Math.min(upper, near - value / (1 + ((2 * asr * i0) / c) * Math.sqrt(1 + s * s)));
    }
    for (let k = 0; k < 200; k++) {
      const s = Math.sinh(eta / c);
      const value = eta + 2 * asr * i0 * s - y;
      const slope = 1 + ((2 * asr * i0) / c) * Math.sqrt(1 + s * s);
      const next = eta - value / slope;
      // Convex and rising from above the root: the iterates fall to it; a step that no longer falls is rounding.
      if (!(next < eta) || eta - next <= 1e-16 * eta) {
        eta = Math.min(eta, Math.max(next, 0));
        break;
      }
      eta = next;
    }
    this.eta = eta;
    return 2 * i0 * Math.sinh(eta / c);
  }

  /** g'(i) = ASR + c / √(i² + 4 i₀²) (by Math.sqrt: Math.hypot, which guards against overflow no current density needs, took several times as long). */
  slope(i: number): number {
    return this.asr + this.c / Math.sqrt(i * i + 4 * this.i0 * this.i0);
  }

  /** F(i) of the exact interval integral. */
  primitive(i: number): number {
    return this.asr * Math.log(i) - (this.c / (2 * this.i0)) * Math.asinh((2 * this.i0) / i);
  }

  /** η_act(i). */
  overpotential(i: number): number {
    return this.c * Math.asinh(i / (2 * this.i0));
  }
}

/**
 * ∫₀^U du/i, and for the root searches ∫ du/(i² g'(i)) (the derivative of the first in −y) and
 * ∫ du/(i g'(i)) (its derivative in ASR).
 */
export interface KineticSums {
  first: number;
  perVolt: number;
  perOhm: number;
}

export interface KineticIntegral extends KineticSums {
  /** ∫₀^{u_k} du/i at each sample of the profile. */
  cumulative: Float64Array;
  /** ∫₀^U η_act(i) du/i: the activation loss times the area, over Q. */
  overpotential: number;
}

/** The parts of one interval: du/i, du/(i² g'), du/(i g'), η du/i. */
type Parts = [number, number, number, number];

function atNode(cell: KineticCell, y: number, weight: number, near: number): Parts {
  const i = cell.current(y, near);
  const g = cell.slope(i);
  return [weight / i, weight / (i * i * g), weight / (i * g), (weight * cell.overpotential(i)) / i];
}

function add(total: Parts, part: Parts): void {
  for (let k = 0; k < 4; k++) total[k]! += part[k]!;
}

/** A logarithmic inlet interval, y linear in s = ln u: 8-point Gauss–Legendre in s. */
function logInterval(cell: KineticCell, u0: number, u1: number, y0: number, y1: number, near: number): Parts {
  const s0 = Math.log(u0);
  const s1 = Math.log(u1);
  const half = (s1 - s0) / 2;
  const mid = (s0 + s1) / 2;
  const total: Parts = [0, 0, 0, 0];
  for (const [x, w] of GL8) {
    for (const s of [mid - half * x, mid + half * x]) add(total, atNode(cell, y0 + ((y1 - y0) * (s - s0)) / (s1 - s0), w * half * Math.exp(s), near));
  }
  return total;
}

/** Nodes and weights of 3-point Gauss–Legendre on [0, 1] (Abramowitz & Stegun, Table 25.4): the area-mean loss on a linear interval. */
const GL3: readonly (readonly [number, number])[] = [
  [0.5 - Math.sqrt(0.15), 5 / 18],
  [0.5, 8 / 18],
  [0.5 + Math.sqrt(0.15), 5 / 18],
];

/** A linear interval: ∫du/i exactly by F (or by the trapezoid where y hardly changes), the rest by the trapezoid, the loss by Gauss–Legendre. */
function linearInterval(cell: KineticCell, du: number, y0: number, y1: number, i0: number, i1: number, withLoss: boolean, near: number): Parts {
  const dy = y1 - y0;
  const first = Math.abs(dy) < 1e-5 * y0 ? (du * (1 / i0 + 1 / i1)) / 2 : (du * (cell.primitive(i1) - cell.primitive(i0))) / dy;
  const perVolt = (du * (1 / (i0 * i0 * cell.slope(i0)) + 1 / (i1 * i1 * cell.slope(i1)))) / 2;
  const perOhm = (du * (1 / (i0 * cell.slope(i0)) + 1 / (i1 * cell.slope(i1)))) / 2;
  let loss = 0;
  if (withLoss) for (const [x, w] of GL3) loss += w * du * atNode(cell, y0 + dy * x, 1, near)[3];
  return [first, perVolt, perOhm, loss];
}

/**
 * The sums over the profile with y = a E(u) + b (a = ±1): null where y is not positive at every
 * sample. `cumulative`, where given, receives ∫₀^{u_k} du/i, and the area-mean loss is taken too
 * (on the logarithmic intervals and the tail it always is).
 */
function accumulate(profile: Profile, cell: KineticCell, a: number, b: number, cumulative: Float64Array | null): (KineticSums & { overpotential: number }) | null {
  const { utilization: u, value: e, logIntervals } = profile;
  const n = u.length;
  let y0 = a * e[0]! + b;
  if (!(y0 > 0)) return null;
  let i0 = cell.current(y0);
  // η at the sample before: where the next sample's root search starts (KineticCell.current).
  let eta0 = cell.eta;
  const total: Parts = [0, 0, 0, 0];
  if (profile.logTail) {
    const y1 = a * e[1]! + b;
    if (!(y1 > 0)) return null;
    const beta = (y1 - y0) / Math.log(u[1]! / u[0]!);
    const m = u[0]!;
    const g = cell.slope(i0);
    const factor = 1 / (1 - beta / (g * i0));
    total[0] = (m / i0) * factor;
    total[1] = (m / (i0 * i0 * g)) * factor;
    total[2] = (m / (i0 * g)) * factor;
    total[3] = ((m * cell.overpotential(i0)) / i0) * factor;
  }
  if (cumulative) cumulative[0] = total[0];
  for (let k = 1; k < n; k++) {
    const y1 = a * e[k]! + b;
    if (!(y1 > 0)) return null;
    const i1 = cell.current(y1, eta0);
    const eta1 = cell.eta;
    add(total, k <= logIntervals ? logInterval(cell, u[k - 1]!, u[k]!, y0, y1, eta0) : linearInterval(cell, u[k]! - u[k - 1]!, y0, y1, i0, i1, cumulative !== null, eta0));
    if (cumulative) cumulative[k] = total[0];
    y0 = y1;
    i0 = i1;
    eta0 = eta1;
  }
  return { first: total[0], perVolt: total[1], perOhm: total[2], overpotential: total[3] };
}

/** The sums alone, for the root searches. */
export function kineticSums(profile: Profile, cell: KineticCell, a: number, b: number): KineticSums | null {
  return accumulate(profile, cell, a, b, null);
}

/** The sums with ∫₀^{u_k} du/i at each sample and ∫ η du/i. */
export function kineticIntegral(profile: Profile, cell: KineticCell, a: number, b: number): KineticIntegral | null {
  const cumulative = new Float64Array(profile.utilization.length);
  const sums = accumulate(profile, cell, a, b, cumulative);
  return sums && { ...sums, cumulative };
}
