/**
 * Dense linear solves for the equilibrium iteration (at most a dozen unknowns: elements,
 * condensed phases and the total amount).
 *
 * - Gaussian elimination with partial pivoting (G. H. Golub and C. F. Van Loan, Matrix
 *   Computations, 4th ed., §3.4) after symmetric diagonal scaling D A D, D_ii = 1/√A_ii on the
 *   element rows: element amounts may differ by 30 orders of magnitude.
 * - Where elimination finds the matrix singular (a pivot of zero: an element carried only by
 *   species whose amounts underflow), the step is instead the truncated eigen-decomposition
 *   (pseudo-inverse) solution of the symmetric system, by cyclic Jacobi rotations (Golub and
 *   Van Loan, §8.5): the singular direction keeps its previous value.
 */

/**
 * Solves in place: `a` is row-major size×size and is destroyed; `r` receives the solution.
 * Returns the smallest |pivot| relative to the largest entry, or 0 when singular.
 */
function solveInPlace(a: Float64Array, r: Float64Array, size: number): number {
  let scale = 0;
  for (let i = 0; i < size * size; i++) scale = Math.max(scale, Math.abs(a[i]!));
  if (!(scale > 0)) return 0;
  let smallest = Infinity;
  for (let col = 0; col < size; col++) {
    let pivotRow = col;
    let best = Math.abs(a[col * size + col]!);
    for (let row = col + 1; row < size; row++) {
      const v = Math.abs(a[row * size + col]!);
      if (v > best) {
        best = v;
        pivotRow = row;
      }
    }
    smallest = Math.min(smallest, best / scale);
    if (!(best > scale * 1e-300)) return 0;
    if (pivotRow !== col) {
      for (let k = 0; k < size; k++) {
        const t = a[col * size + k]!;
        a[col * size + k] = a[pivotRow * size + k]!;
        a[pivotRow * size + k] = t;
      }
      const t = r[col]!;
      r[col] = r[pivotRow]!;
      r[pivotRow] = t;
    }
    const pivot = a[col * size + col]!;
    for (let row = col + 1; row < size; row++) {
      const f = a[row * size + col]! / pivot;
      if (f === 0) continue;
      for (let k = col; k < size; k++) a[row * size + k] = a[row * size + k]! - f * a[col * size + k]!;
      r[row] = r[row]! - f * r[col]!;
    }
  }
  for (let row = size - 1; row >= 0; row--) {
    let s = r[row]!;
    for (let k = row + 1; k < size; k++) s -= a[row * size + k]! * r[k]!;
    r[row] = s / a[row * size + row]!;
  }
  return smallest;
}

/** Eigen-decomposition of a symmetric matrix by cyclic Jacobi rotations: returns eigenvalues, fills `v` (columns = eigenvectors). */
function jacobiEigen(a: Float64Array, size: number, v: Float64Array): Float64Array {
  v.fill(0);
  for (let i = 0; i < size; i++) v[i * size + i] = 1;
  for (let sweep = 0; sweep < 60; sweep++) {
    let off = 0;
    for (let p = 0; p < size; p++) for (let q = p + 1; q < size; q++) off += a[p * size + q]! ** 2;
    if (off < 1e-300) break;
    for (let p = 0; p < size; p++) {
      for (let q = p + 1; q < size; q++) {
        const apq = a[p * size + q]!;
        if (apq === 0) continue;
        const theta = (a[q * size + q]! - a[p * size + p]!) / (2 * apq);
        const t = Math.sign(theta || 1) / (Math.abs(theta) + Math.sqrt(theta * theta + 1));
        const c = 1 / Math.sqrt(t * t + 1);
        const s = t * c;
        for (let k = 0; k < size; k++) {
          const akp = a[k * size + p]!;
          const akq = a[k * size + q]!;
          a[k * size + p] = c * akp - s * akq;
          a[k * size + q] = s * akp + c * akq;
        }
        for (let k = 0; k < size; k++) {
          const apk = a[p * size + k]!;
          const aqk = a[q * size + k]!;
          a[p * size + k] = c * apk - s * aqk;
          a[q * size + k] = s * apk + c * aqk;
        }
        for (let k = 0; k < size; k++) {
          const vkp = v[k * size + p]!;
          const vkq = v[k * size + q]!;
          v[k * size + p] = c * vkp - s * vkq;
          v[k * size + q] = s * vkp + c * vkq;
        }
      }
    }
  }
  const values = new Float64Array(size);
  for (let i = 0; i < size; i++) values[i] = a[i * size + i]!;
  return values;
}

const TRUNCATE = 1e-15;

/**
 * Solves the symmetric system A x = r (row-major, destroyed; r receives x). The first `scaled`
 * rows are diagonally scaled. `previous` holds the previous solution: along a direction that is
 * singular to working precision the solution keeps it.
 */
/** Scratch buffers by size (the solver is called thousands of times per fuel path). */
const scratch = new Map<number, { d: Float64Array; copy: Float64Array; rhs: Float64Array }>();

export function solveScaledInPlace(a: Float64Array, r: Float64Array, size: number, scaled: number, previous: Float64Array): boolean {
  let buffers = scratch.get(size);
  if (!buffers) {
    buffers = { d: new Float64Array(size), copy: new Float64Array(size * size), rhs: new Float64Array(size) };
    scratch.set(size, buffers);
  }
  const { d, copy, rhs } = buffers;
  d.fill(1);
  for (let i = 0; i < scaled; i++) {
    const diagonal = a[i * size + i]!;
    if (diagonal > 0 && Number.isFinite(diagonal)) d[i] = 1 / Math.sqrt(diagonal);
  }
  for (let i = 0; i < size; i++) {
    r[i] = r[i]! * d[i]!;
    for (let j = 0; j < size; j++) a[i * size + j] = a[i * size + j]! * d[i]! * d[j]!;
  }
  copy.set(a);
  rhs.set(r);
  const quality = solveInPlace(a, r, size);
  if (quality === 0) {
    // Truncated pseudo-inverse for the step from the previous solution: A Δy = rhs − A y_prev.
    const yPrev = new Float64Array(size);
    for (let i = 0; i < scaled && i < previous.length; i++) yPrev[i] = previous[i]! / d[i]!;
    const residual = new Float64Array(size);
    for (let i = 0; i < size; i++) {
      let s = rhs[i]!;
      for (let j = 0; j < size; j++) s -= copy[i * size + j]! * yPrev[j]!;
      residual[i] = s;
    }
    const v = new Float64Array(size * size);
    const values = jacobiEigen(copy, size, v);
    let largest = 0;
    for (const value of values) largest = Math.max(largest, Math.abs(value));
    if (!(largest > 0)) return false;
    for (let i = 0; i < size; i++) r[i] = yPrev[i]!;
    for (let k = 0; k < size; k++) {
      const lambda = values[k]!;
      if (Math.abs(lambda) < TRUNCATE * largest) continue;
      let proj = 0;
      for (let i = 0; i < size; i++) proj += v[i * size + k]! * residual[i]!;
      const coefficient = proj / lambda;
      for (let i = 0; i < size; i++) r[i] = r[i]! + coefficient * v[i * size + k]!;
    }
  }
  for (let i = 0; i < size; i++) r[i] = r[i]! * d[i]!;
  return true;
}
