/**
 * Piecewise cubic Hermite interpolation that keeps the data's monotonicity (PCHIP): interior
 * slopes by the weighted harmonic mean of Fritsch & Butland (SIAM J. Sci. Stat. Comput. 5 (1984)
 * 300), end slopes by the shape-preserving three-point formula (Moler, *Numerical Computing with
 * MATLAB*, 2004, §3.4), the refinement of Fritsch & Carlson (SIAM J. Numer. Anal. 17 (1980) 238).
 * Two points give a straight line. Integrals are exact for the cubic pieces.
 *
 * Written here because the npm packages for monotone splines draw curves and give no integrals.
 */
export interface MonotoneCubic {
  readonly x: readonly number[];
  readonly y: readonly number[];
  /** Slope dy/dx at each knot. */
  readonly slopes: readonly number[];
  /** ∫ from x[0] to x[k] of the interpolant, for each knot k. */
  readonly cumulative: readonly number[];
}

/**
 * Builds the interpolant through (x[k], y[k]); x strictly increasing, at least two points.
 * The caller validates the points.
 */
export function monotoneCubic(x: readonly number[], y: readonly number[]): MonotoneCubic {
  const n = x.length;
  const h: number[] = [];
  const m: number[] = [];
  for (let k = 0; k < n - 1; k++) {
    h.push(x[k + 1]! - x[k]!);
    m.push((y[k + 1]! - y[k]!) / h[k]!);
  }
  const slopes = new Array<number>(n).fill(0);
  if (n === 2) {
    slopes[0] = m[0]!;
    slopes[1] = m[0]!;
  } else {
    for (let k = 1; k < n - 1; k++) {
      const m0 = m[k - 1]!;
      const m1 = m[k]!;
      // A local extremum or flat stretch gets a zero slope, so no overshoot.
      if (m0 === 0 || m1 === 0 || Math.sign(m0) !== Math.sign(m1)) continue;
      const w1 = 2 * h[k]! + h[k - 1]!;
      const w2 = h[k]! + 2 * h[k - 1]!;
      slopes[k] = (w1 + w2) / (w1 / m0 + w2 / m1);
    }
    slopes[0] = endSlope(h[0]!, h[1]!, m[0]!, m[1]!);
    slopes[n - 1] = endSlope(h[n - 2]!, h[n - 3]!, m[n - 2]!, m[n - 3]!);
  }
  const cumulative = [0];
  for (let k = 0; k < n - 1; k++)
    cumulative.push(cumulative[k]! + pieceIntegral(y[k]!, y[k + 1]!, slopes[k]!, slopes[k + 1]!, h[k]!, h[k]!));
  return { x, y, slopes, cumulative };
}

function endSlope(h0: number, h1: number, m0: number, m1: number): number {
  const d = ((2 * h0 + h1) * m0 - h0 * m1) / (h0 + h1);
  if (Math.sign(d) !== Math.sign(m0)) return 0;
  if (Math.sign(m0) !== Math.sign(m1) && Math.abs(d) > 3 * Math.abs(m0)) return 3 * m0;
  return d;
}

/** Cubic coefficients of piece k in s = x − x[k]: y0 + d0 s + c2 s² + c3 s³. */
function coefficients(y0: number, y1: number, d0: number, d1: number, h: number): [number, number, number, number] {
  const slope = (y1 - y0) / h;
  return [y0, d0, (3 * slope - 2 * d0 - d1) / h, (d0 + d1 - 2 * slope) / (h * h)];
}

function pieceIntegral(y0: number, y1: number, d0: number, d1: number, h: number, s: number): number {
  const [c0, c1, c2, c3] = coefficients(y0, y1, d0, d1, h);
  return s * (c0 + s * (c1 / 2 + s * (c2 / 3 + s * (c3 / 4))));
}

/** Index k of the piece [x[k], x[k+1]] holding t (the last piece for t = x[n−1]). */
function pieceIndex(f: MonotoneCubic, t: number): number {
  let lo = 0;
  let hi = f.x.length - 2;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (f.x[mid]! <= t) lo = mid;
    else hi = mid - 1;
  }
  return lo;
}

/** Value of the interpolant at t (t inside [x[0], x[n−1]]; the caller checks). */
export function evaluateMonotoneCubic(f: MonotoneCubic, t: number): number {
  const k = pieceIndex(f, t);
  const [c0, c1, c2, c3] = coefficients(f.y[k]!, f.y[k + 1]!, f.slopes[k]!, f.slopes[k + 1]!, f.x[k + 1]! - f.x[k]!);
  const s = t - f.x[k]!;
  return c0 + s * (c1 + s * (c2 + s * c3));
}

/** Exact ∫ from x[0] to t of the interpolant. */
export function integrateMonotoneCubic(f: MonotoneCubic, t: number): number {
  const k = pieceIndex(f, t);
  return (
    f.cumulative[k]! +
    pieceIntegral(f.y[k]!, f.y[k + 1]!, f.slopes[k]!, f.slopes[k + 1]!, f.x[k + 1]! - f.x[k]!, t - f.x[k]!)
  );
}

/**
 * Exact ∫ from a to b of p(t)/t dt (the entropy integral ∫Cp/T dT), 0 < a, b inside the knots.
 * On each piece p(s)/(X + s), X = x[k], is divided exactly: q(s) + r/(X + s).
 */
export function integrateMonotoneCubicOverT(f: MonotoneCubic, a: number, b: number): number {
  if (a === b) return 0;
  if (a > b) return -integrateMonotoneCubicOverT(f, b, a);
  let total = 0;
  let k = pieceIndex(f, a);
  let from = a;
  for (;;) {
    const x0 = f.x[k]!;
    const x1 = f.x[k + 1]!;
    const to = Math.min(b, x1);
    const [c0, c1, c2, c3] = coefficients(f.y[k]!, f.y[k + 1]!, f.slopes[k]!, f.slopes[k + 1]!, x1 - x0);
    const q2 = c3;
    const q1 = c2 - x0 * q2;
    const q0 = c1 - x0 * q1;
    const r = c0 - x0 * q0;
    const antiderivative = (s: number) => s * (q0 + s * (q1 / 2 + s * (q2 / 3)));
    total += antiderivative(to - x0) - antiderivative(from - x0) + r * Math.log(to / from);
    if (to >= b || k >= f.x.length - 2) break;
    from = to;
    k += 1;
  }
  return total;
}
