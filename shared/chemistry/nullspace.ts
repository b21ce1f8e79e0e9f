/**
 * Exact integer nullspace by fraction-free Gauss–Jordan elimination (Bareiss): every division
 * by the previous pivot is exact, so entries stay integers (minors of the input). The algorithm
 * is written once over an injected `IntegerArithmetic`; `integerNullspace` runs it on safe
 * integers and again on BigInt if a result could leave the safe range.
 */
import { ArithmeticOverflow, BIG_INTEGERS, SAFE_INTEGERS, type IntegerArithmetic } from './arithmetic';
import { gcdBigInt } from './rational';

/** A basis of {x : A x = 0} as primitive integer vectors (gcd 1), with the rank of A. */
export interface Nullspace {
  rank: number;
  /** One vector per free column, in column order; `basis[l]` is positive at `free[l]` and 0 at the other free columns. */
  basis: bigint[][];
  /** Pivot columns, in row order. */
  pivots: number[];
  /** Free (non-pivot) columns, ascending. */
  free: number[];
  /** Which arithmetic finished the work ("safe integers" or "BigInt"), for tests and profiling. */
  arithmetic: string;
}

/** An integer matrix: rows of equal length, as numbers (safe integers) or BigInts. */
export type IntegerMatrix = ReadonlyArray<ReadonlyArray<number>> | ReadonlyArray<ReadonlyArray<bigint>>;

/**
 * Reduced row echelon form up to row scaling, fraction-free: returns the eliminated rows (only the
 * first `pivots.length` are non-zero) and the pivot columns. The smallest non-zero candidate is
 * chosen as pivot, which keeps the numbers small.
 */
export function eliminate<T>(
  arith: IntegerArithmetic<T>,
  matrix: IntegerMatrix,
  cols: number,
): { rows: T[][]; pivots: number[] } {
  const m: T[][] = matrix.map((row: ReadonlyArray<number | bigint>) =>
    row.map((v) => (typeof v === 'bigint' ? arith.fromBigInt(v) : arith.fromNumber(v))),
  );
  const pivots: number[] = [];
  let previous = arith.one;
  let r = 0;
  for (let c = 0; c < cols && r < m.length; c++) {
    let p = -1;
    for (let i = r; i < m.length; i++) {
      const v = m[i]![c]!;
      if (!arith.isZero(v) && (p === -1 || arith.lessInMagnitude(v, m[p]![c]!))) p = i;
    }
    if (p === -1) continue;
    if (p !== r) [m[p], m[r]] = [m[r]!, m[p]!];
    const pivotRow = m[r]!;
    const pivot = pivotRow[c]!;
    for (let i = 0; i < m.length; i++) {
      if (i === r) continue;
      const row = m[i]!;
      const factor = row[c]!;
      for (let j = 0; j < cols; j++) {
        // Bareiss: (pivot·a_ij − factor·a_rj) / previous pivot is exact.
        row[j] = arith.divExact(arith.sub(arith.mul(pivot, row[j]!), arith.mul(factor, pivotRow[j]!)), previous);
      }
    }
    previous = pivot;
    pivots.push(c);
    r++;
  }
  return { rows: m, pivots };
}

/**
 * Nullspace from the eliminated rows. Row r reads p_r x_{c_r} + Σ_free m[r][f] x_f = 0. For each
 * free column f: x_f = L (lcm of the |pivots|), x_{c_r} = −m[r][f]·L/p_r, then divide by the gcd.
 */
export function nullspaceIn<T>(arith: IntegerArithmetic<T>, matrix: IntegerMatrix, cols: number): Nullspace {
  const { rows, pivots } = eliminate(arith, matrix, cols);
  const isPivot = new Array<boolean>(cols).fill(false);
  for (const c of pivots) isPivot[c] = true;
  const free: number[] = [];
  for (let f = 0; f < cols; f++) if (!isPivot[f]) free.push(f);

  let l = arith.one;
  for (let r = 0; r < pivots.length; r++) {
    const p = rows[r]![pivots[r]!]!;
    const magnitude = arith.sign(p) < 0 ? arith.neg(p) : p;
    l = arith.mul(arith.divExact(l, arith.gcd(l, magnitude)), magnitude);
  }
  const basis: bigint[][] = [];
  for (const f of free) {
    const v = new Array<T>(cols).fill(arith.zero);
    v[f] = l;
    let g = l;
    for (let r = 0; r < pivots.length; r++) {
      const x = arith.divExact(arith.neg(arith.mul(rows[r]![f]!, l)), rows[r]![pivots[r]!]!);
      v[pivots[r]!] = x;
      g = arith.gcd(g, x);
    }
    basis.push(v.map((x) => arith.toBigInt(arith.divExact(x, g))));
  }
  return { rank: pivots.length, basis, pivots, free, arithmetic: arith.name };
}

/**
 * Basis of the integer nullspace of `matrix` (rows of equal length `cols`). Vectors are
 * primitive; the free columns are taken left to right, so each basis vector has a positive
 * entry at its own free column and zeros at the other free columns ("free-column form").
 * Runs on safe integers and, when a result could leave the safe range, again on BigInt.
 */
export function integerNullspace(matrix: IntegerMatrix, cols: number): Nullspace {
  try {
    return nullspaceIn(SAFE_INTEGERS, matrix, cols);
  } catch (err) {
    if (!(err instanceof ArithmeticOverflow)) throw err;
    return nullspaceIn(BIG_INTEGERS, matrix, cols);
  }
}

/** Divides a vector by the gcd of its entries and makes its first non-zero entry positive. */
export function primitive(v: readonly bigint[]): bigint[] {
  let g = 0n;
  for (const x of v) g = gcdBigInt(g, x);
  if (g === 0n) return v.slice();
  const first = v.find((x) => x !== 0n) ?? 1n;
  const s = first < 0n ? -g : g;
  return v.map((x) => x / s);
}
