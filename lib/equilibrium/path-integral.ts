/**
 * Mean of a quantity along utilization, Ē = (1/U_f) ∫₀^U_f E(U) dU (the charge-averaged Nernst
 * voltage of the methods note of this project), with the sampling grid it needs:
 *
 * - a base grid of N intervals (at least 100 for a reported path) clustered towards the outlet,
 *   U_k = U_f (1 − (1 − k/N)^1.5);
 * - refinement: an interval whose end values differ by more than 1 mV is halved, up to 6 times
 *   (adaptive near the outlet, where E falls steeply as the fuel runs out);
 * - an inlet that is not linear over the first interval (tested at its midpoint, 0.1 mV) gets six
 *   geometric points U_1·10^−k below the first grid point: a dry inlet (no product species)
 *   gives E ≈ α − c ln U, unbounded at U = 0 but integrable. On [0, u_min],
 *   ∫ E dU = u_min (E(u_min) + c) with c from the first decade; on the geometric intervals E is
 *   integrated exactly for the form α + β ln U; elsewhere by the trapezoidal rule.
 * For a regular inlet the log terms vanish and the rule is the trapezoidal rule.
 *
 * The same model of E(u) (linear between samples, α + β ln u on the geometric inlet intervals
 * and below the smallest of them) is returned as a profile, so that other integrals along the
 * cell (lib/plant/cell-model.ts) use exactly the E(u) the mean was taken over.
 */

export interface Sample {
  utilization: number;
  value: number;
}

export interface PathIntegral<S extends Sample> {
  /** U = 0 and the (refined) grid, in increasing U: the points to report. */
  points: S[];
  /** Every sample evaluated, the geometric inlet points included. */
  all: S[];
  mean: number;
  /** The value at the smallest U evaluated after the inlet (for a dry inlet's display). */
  firstFinite: number;
  profile: Profile;
}

/**
 * E(u) as the integral models it: samples in increasing u; between samples k and k+1 linear in u,
 * except the first `logIntervals` intervals, where E = α + β ln u through both ends. With
 * `logTail`, samples start at the smallest geometric point u_min > 0 and E = α + β ln u on
 * (0, u_min] too (β from the first interval); without, the first sample is u = 0.
 */
export interface Profile {
  utilization: Float64Array;
  value: Float64Array;
  logIntervals: number;
  logTail: boolean;
}

const MAX_REFINE = 6;
const INLET_DECADES = 6;

/** ∫_a^b E dU with E = α + β ln U through both end points (0 < a < b). */
function logLinear(a: Sample, b: Sample): number {
  const la = Math.log(a.utilization);
  const lb = Math.log(b.utilization);
  const beta = (b.value - a.value) / (lb - la);
  const alpha = a.value - beta * la;
  const uLnU = (u: number, l: number) => u * l - u;
  return alpha * (b.utilization - a.utilization) + beta * (uLnU(b.utilization, lb) - uLnU(a.utilization, la));
}

export function integrateAlongUtilization<S extends Sample>(
  evaluate: (utilization: number) => S,
  utilizationF: number,
  intervals: number,
  refine = 1e-3,
): PathIntegral<S> {
  const grid = Array.from({ length: intervals + 1 }, (_, k) => utilizationF * (1 - Math.pow(1 - k / intervals, 1.5)));
  const inlet = evaluate(0);
  const u1 = grid[1]!;
  let body = grid.slice(1).map(evaluate);
  // A regular inlet is linear over the first interval (checked at its midpoint to 0.1 mV); anything
  // else is treated as the logarithmic inlet of a (nearly) dry feed.
  const mid = evaluate(u1 / 2);
  const regular = Number.isFinite(inlet.value) && Math.abs(mid.value - (inlet.value + body[0]!.value) / 2) < 1e-4;
  const decades = regular ? [] : Array.from({ length: INLET_DECADES }, (_, k) => evaluate(u1 * 10 ** (k - INLET_DECADES)));
  if (regular) body = [mid, ...body];
  for (let pass = 0; pass < MAX_REFINE; pass++) {
    const refined: S[] = [body[0]!];
    let added = 0;
    for (let k = 1; k < body.length; k++) {
      const a = body[k - 1]!;
      const b = body[k]!;
      if (Math.abs(b.value - a.value) > refine) {
        refined.push(evaluate((a.utilization + b.utilization) / 2));
        added++;
      }
      refined.push(b);
    }
    body = refined;
    if (added === 0) break;
  }

  let integral = 0;
  if (regular) {
    integral += ((inlet.value + body[0]!.value) / 2) * body[0]!.utilization;
  } else {
    const uMin = decades[0]!;
    const c = -(decades[1]!.value - uMin.value) / Math.log(10);
    integral += uMin.utilization * (uMin.value + c);
    const geometric = [...decades, body[0]!];
    for (let k = 1; k < geometric.length; k++) integral += logLinear(geometric[k - 1]!, geometric[k]!);
  }
  for (let k = 1; k < body.length; k++) {
    const a = body[k - 1]!;
    const b = body[k]!;
    integral += ((a.value + b.value) / 2) * (b.utilization - a.utilization);
  }
  const samples = regular ? [inlet, ...body] : [...decades, ...body];
  const profile: Profile = {
    utilization: Float64Array.from(samples, (p) => p.utilization),
    value: Float64Array.from(samples, (p) => p.value),
    logIntervals: regular ? 0 : decades.length,
    logTail: !regular,
  };
  return { points: [inlet, ...body], all: [inlet, ...decades, ...body], mean: integral / utilizationF, firstFinite: (decades[0] ?? body[0]!).value, profile };
}

/** Nodes and weights of 8-point Gauss-Legendre quadrature on [−1, 1] (Abramowitz & Stegun, Table 25.4). */
export const GL8: readonly (readonly [number, number])[] = [
  [0.1834346424956498, 0.3626837833783620],
  [0.5255324099163290, 0.3137066458778873],
  [0.7966664774136267, 0.2223810344533745],
  [0.9602898564975363, 0.1012285362903763],
];

/** ∫ of 1/y and 1/y² over an interval. */
interface Pair {
  first: number;
  second: number;
}

/** ∫_{u0}^{u1} du/y and du/y² for y = A + B ln u through (u0, y0) and (u1, y1): ∫ e^s ds/y(s), s = ln u, by 8-point Gauss-Legendre. */
function logPair(u0: number, u1: number, y0: number, y1: number): Pair {
  const s0 = Math.log(u0);
  const s1 = Math.log(u1);
  const half = (s1 - s0) / 2;
  const mid = (s0 + s1) / 2;
  let first = 0;
  let second = 0;
  for (const [x, w] of GL8) {
    for (const s of [mid - half * x, mid + half * x]) {
      const y = y0 + ((y1 - y0) * (s - s0)) / (s1 - s0);
      const e = Math.exp(s);
      first += (w * e) / y;
      second += (w * e) / (y * y);
    }
  }
  return { first: first * half, second: second * half };
}

/**
 * ∫_0^m du/y and du/y² with y = A + B ln u below the smallest sample (a log inlet): integrating by
 * parts, ∫_0^m du/y = m/y_m + B ∫_0^m du/y², and so on; y grows without bound as u → 0, so
 * m/y_m (1 + B/y_m + 2B²/y_m²) and m/y_m² (1 + 2B/y_m) (asymptotic series, next terms of order (B/y_m)³).
 */
function tailPair(m: number, ym: number, slope: number): Pair {
  const r = slope / ym;
  return { first: (m / ym) * (1 + r + 2 * r * r), second: (m / (ym * ym)) * (1 + 2 * r) };
}

/** ∫_0^U du/y and ∫_0^U du/y² with y = a E(u) + b. */
export interface ReciprocalSums {
  first: number;
  second: number;
}

export interface ReciprocalIntegral extends ReciprocalSums {
  /** ∫_0^{u_k} du/y at each sample of the profile. */
  cumulative: Float64Array;
}

/**
 * ∫_0^U du/(a E(u) + b) and ∫_0^U du/(a E(u) + b)² over the profile's model of E(u) (linear, or
 * α + β ln u, between samples; the log tail below the first sample), exact on linear intervals:
 * for y linear in u from y0 to y1 (both > 0) over Δu, ∫ du/y = Δu · ln(y1/y0)/(y1 − y0) (as
 * Δu · ln(1 + d)/d / y0, d = (y1 − y0)/y0, by its series 1 − d/2 + d²/3 where |d| < 1e-8) and
 * ∫ du/y² = Δu/(y0 y1). y = a E + b must be positive at every sample; null where it is not.
 * `cumulative`, where given, receives ∫_0^{u_k} du/y at each sample. One pass and no arrays of
 * its own: a cell-voltage root search calls it some ten times a solve.
 */
function accumulate(profile: Profile, a: number, b: number, cumulative: Float64Array | null): ReciprocalSums | null {
  const { utilization: u, value: e, logIntervals } = profile;
  const n = u.length;
  let y0 = a * e[0]! + b;
  if (!(y0 > 0)) return null;
  let first = 0;
  let second = 0;
  if (profile.logTail) {
    const y1 = a * e[1]! + b;
    if (!(y1 > 0)) return null;
    const slope = (y1 - y0) / Math.log(u[1]! / u[0]!);
    const tail = tailPair(u[0]!, y0, slope);
    first = tail.first;
    second = tail.second;
  }
  if (cumulative) cumulative[0] = first;
  for (let k = 1; k < n; k++) {
    const y1 = a * e[k]! + b;
    if (!(y1 > 0)) return null;
    if (k <= logIntervals) {
      const part = logPair(u[k - 1]!, u[k]!, y0, y1);
      first += part.first;
      second += part.second;
    } else {
      const du = u[k]! - u[k - 1]!;
      const d = (y1 - y0) / y0;
      const lnRatio = Math.abs(d) < 1e-8 ? 1 - d / 2 + (d * d) / 3 : Math.log1p(d) / d;
      first += (du * lnRatio) / y0;
      second += du / (y0 * y1);
    }
    if (cumulative) cumulative[k] = first;
    y0 = y1;
  }
  return { first, second };
}

/** ∫_0^U du/y and du/y² over the profile (accumulate); null where y = a E + b is not positive at every sample. */
export function reciprocalSums(profile: Profile, a: number, b: number): ReciprocalSums | null {
  return accumulate(profile, a, b, null);
}

/** The same with ∫_0^{u_k} du/y at each sample of the profile. */
export function reciprocalIntegral(profile: Profile, a: number, b: number): ReciprocalIntegral | null {
  const cumulative = new Float64Array(profile.utilization.length);
  const sums = accumulate(profile, a, b, cumulative);
  return sums && { first: sums.first, second: sums.second, cumulative };
}
