/**
 * Dense symmetric positive-definite algebra on row-major Float64Arrays, for the consistency fit
 * (a generalised least-squares fit over up to a few thousand measurements). Written out here
 * because a general matrix package's element accessors made a 1,000 × 1,000 Cholesky several
 * times slower (measured: 0.54 s against 0.15 s at n = 800).
 */

/** Thrown when a matrix that should be positive definite is not (a fit that is not determined). */
export class NotPositiveDefiniteError extends Error {
  constructor(readonly column: number) {
    super(`matrix not positive definite at column ${column}`);
  }
}

/** In-place Cholesky factorisation A = L Lᵀ of an n × n SPD matrix; L is left in the lower triangle. */
export function cholesky(a: Float64Array, n: number): void {
  for (let j = 0; j < n; j++) {
    const rowJ = j * n;
    let d = a[rowJ + j]!;
    for (let k = 0; k < j; k++) d -= a[rowJ + k]! * a[rowJ + k]!;
    // Relative tolerance: a pivot that has cancelled to rounding noise means a singular matrix.
    if (!(d > 1e-13 * Math.abs(a[rowJ + j]!)) || !(d > 0)) throw new NotPositiveDefiniteError(j);
    d = Math.sqrt(d);
    a[rowJ + j] = d;
    // Four rows at a time against row j (read once for all four); each sum keeps the order of
    // the plain loop below, so the result is the same to the last bit.
    let i = j + 1;
    for (; i + 3 < n; i += 4) {
      const r0 = i * n;
      const r1 = r0 + n;
      const r2 = r1 + n;
      const r3 = r2 + n;
      let s0 = a[r0 + j]!;
      let s1 = a[r1 + j]!;
      let s2 = a[r2 + j]!;
      let s3 = a[r3 + j]!;
      for (let k = 0; k < j; k++) {
        const ajk = a[rowJ + k]!;
        s0 -= a[r0 + k]! * ajk;
        s1 -= a[r1 + k]! * ajk;
        s2 -= a[r2 + k]! * ajk;
        s3 -= a[r3 + k]! * ajk;
      }
      a[r0 + j] = s0 / d;
      a[r1 + j] = s1 / d;
      a[r2 + j] = s2 / d;
      a[r3 + j] = s3 / d;
    }
    for (; i < n; i++) {
      const rowI = i * n;
      let s = a[rowI + j]!;
      for (let k = 0; k < j; k++) s -= a[rowI + k]! * a[rowJ + k]!;
      a[rowI + j] = s / d;
    }
  }
}

/** Solves L y = b in place (b overwritten by y), L from `cholesky`. */
export function forwardSolve(l: Float64Array, n: number, b: Float64Array): void {
  for (let i = 0; i < n; i++) {
    const row = i * n;
    let s = b[i]!;
    for (let k = 0; k < i; k++) s -= l[row + k]! * b[k]!;
    b[i] = s / l[row + i]!;
  }
}

/**
 * Solves L Y = B in place for m right-hand sides at once (B row-major n × m, overwritten by Y),
 * L from `cholesky`. Each column gets the same operations in the same order as `forwardSolve`,
 * so the result is the same to the last bit; row i of L is read once for all m columns.
 */
export function forwardSolveMany(l: Float64Array, n: number, b: Float64Array, m: number): void {
  const sums = new Float64Array(m);
  for (let i = 0; i < n; i++) {
    const row = i * n;
    const out = i * m;
    for (let j = 0; j < m; j++) sums[j] = b[out + j]!;
    for (let k = 0; k < i; k++) {
      const lik = l[row + k]!;
      const yk = k * m;
      for (let j = 0; j < m; j++) sums[j]! -= lik * b[yk + j]!;
    }
    const lii = l[row + i]!;
    for (let j = 0; j < m; j++) b[out + j] = sums[j]! / lii;
  }
}

/** Solves Lᵀ x = y in place. */
export function backSolve(l: Float64Array, n: number, y: Float64Array): void {
  for (let i = n - 1; i >= 0; i--) {
    let s = y[i]!;
    for (let k = i + 1; k < n; k++) s -= l[k * n + i]! * y[k]!;
    y[i] = s / l[i * n + i]!;
  }
}

/** Inverse of an SPD matrix from its Cholesky factor (row-major n × n). */
export function inverseFromCholesky(l: Float64Array, n: number): Float64Array {
  const inverse = new Float64Array(n * n);
  const column = new Float64Array(n);
  for (let j = 0; j < n; j++) {
    column.fill(0);
    column[j] = 1;
    forwardSolve(l, n, column);
    backSolve(l, n, column);
    for (let i = 0; i < n; i++) inverse[i * n + j] = column[i]!;
  }
  return inverse;
}
