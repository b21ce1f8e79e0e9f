/**
 * Exact integer nullspace by fraction-free Gauss–Jordan elimination (Bareiss): every division
 * by the previous pivot is exact, so entries stay integers (minors of the input). Runs on safe
 * JS integers and restarts on BigInt as soon as a product could leave the safe range.
 */

/** Result: a basis of {x : A x = 0} as primitive integer vectors (gcd 1), and the rank of A. */
export interface Nullspace {
  rank: number;
  basis: bigint[][];
  /** Pivot columns, in row order; `basis[l]` belongs to the l-th non-pivot ("free") column. */
  pivots: number[];
  /** Free columns: basis[l] is positive at free[l] and zero at the other free columns. */
  free: number[];
}

class Overflow extends Error {}

function eliminateNumbers(a: number[][], cols: number): { m: number[][]; pivots: number[] } {
  const m = a.map((row) => row.slice());
  const pivots: number[] = [];
  let prev = 1;
  let r = 0;
  for (let c = 0; c < cols && r < m.length; c++) {
    // Smallest non-zero pivot keeps the numbers small.
    let p = -1;
    for (let i = r; i < m.length; i++) {
      const v = m[i]![c]!;
      if (v !== 0 && (p === -1 || Math.abs(v) < Math.abs(m[p]![c]!))) p = i;
    }
    if (p === -1) continue;
    if (p !== r) [m[p], m[r]] = [m[r]!, m[p]!];
    const pr = m[r]!;
    const piv = pr[c]!;
    for (let i = 0; i < m.length; i++) {
      if (i === r) continue;
      const row = m[i]!;
      const f = row[c]!;
      for (let j = 0; j < cols; j++) {
        const t1 = piv * row[j]!;
        const t2 = f * pr[j]!;
        const num = t1 - t2;
        if (!Number.isSafeInteger(t1) || !Number.isSafeInteger(t2) || !Number.isSafeInteger(num)) throw new Overflow();
        const q = num / prev;
        if (!Number.isInteger(q)) throw new Overflow(); // never expected; BigInt path double-checks
        row[j] = q;
      }
    }
    prev = piv;
    pivots.push(c);
    r++;
  }
  return { m, pivots };
}

function eliminateBigInts(a: number[][], cols: number): { m: bigint[][]; pivots: number[] } {
  const m = a.map((row) => row.map((v) => BigInt(v)));
  const pivots: number[] = [];
  let prev = 1n;
  let r = 0;
  const abs = (v: bigint): bigint => (v < 0n ? -v : v);
  for (let c = 0; c < cols && r < m.length; c++) {
    let p = -1;
    for (let i = r; i < m.length; i++) {
      const v = m[i]![c]!;
      if (v !== 0n && (p === -1 || abs(v) < abs(m[p]![c]!))) p = i;
    }
    if (p === -1) continue;
    if (p !== r) [m[p], m[r]] = [m[r]!, m[p]!];
    const pr = m[r]!;
    const piv = pr[c]!;
    for (let i = 0; i < m.length; i++) {
      if (i === r) continue;
      const row = m[i]!;
      const f = row[c]!;
      for (let j = 0; j < cols; j++) {
        const num = piv * row[j]! - f * pr[j]!;
        if (num % prev !== 0n) throw new Error('internal: Bareiss division not exact');
        row[j] = num / prev;
      }
    }
    prev = piv;
    pivots.push(c);
    r++;
  }
  return { m, pivots };
}

function gcdBig(a: bigint, b: bigint): bigint {
  if (a < 0n) a = -a;
  if (b < 0n) b = -b;
  while (b !== 0n) [a, b] = [b, a % b];
  return a;
}

/** Divides a vector by the gcd of its entries and makes its first non-zero entry positive. */
export function primitive(v: bigint[]): bigint[] {
  let g = 0n;
  for (const x of v) g = gcdBig(g, x);
  if (g === 0n) return v.slice();
  const first = v.find((x) => x !== 0n) ?? 1n;
  const s = first < 0n ? -g : g;
  return v.map((x) => x / s);
}

/**
 * Basis of the integer nullspace of `a` (rows of equal length `cols`, small integers).
 * Vectors are primitive; the free columns are taken left to right, so each basis vector has a
 * positive entry at its own free column and zeros at the other free columns.
 */
export function integerNullspace(a: number[][], cols: number): Nullspace {
  let m: (number | bigint)[][];
  let pivots: number[];
  try {
    ({ m, pivots } = eliminateNumbers(a, cols));
  } catch (err) {
    if (!(err instanceof Overflow)) throw err;
    ({ m, pivots } = eliminateBigInts(a, cols));
  }
  const isPivot = new Array<boolean>(cols).fill(false);
  for (const c of pivots) isPivot[c] = true;
  const basis = buildBasis(m, pivots, isPivot, cols);
  const free: number[] = [];
  for (let f = 0; f < cols; f++) if (!isPivot[f]) free.push(f);
  return { rank: pivots.length, basis, pivots, free };
}

function gcdNum(a: number, b: number): number {
  a = Math.abs(a);
  b = Math.abs(b);
  while (b !== 0) [a, b] = [b, a % b];
  return a;
}

/**
 * Row r of the eliminated matrix reads p_r x_{c_r} + Σ_free m[r][f] x_f = 0. For each free column
 * f: x_f = L (lcm of the pivots), x_{c_r} = −m[r][f]·L/p_r, then divide by the gcd. Plain numbers
 * while every product is a safe integer, BigInt otherwise. The free entry ends up positive.
 */
function buildBasis(m: (number | bigint)[][], pivots: number[], isPivot: boolean[], cols: number): bigint[][] {
  const basis: bigint[][] = [];
  if (typeof m[0]?.[0] === 'number' || m.length === 0) {
    const mm = m as number[][];
    let l = 1;
    for (let r = 0; r < pivots.length; r++) l = (l / gcdNum(l, mm[r]![pivots[r]!]!)) * Math.abs(mm[r]![pivots[r]!]!);
    let safe = Number.isSafeInteger(l);
    for (let f = 0; f < cols && safe; f++) {
      if (isPivot[f]) continue;
      const v = new Array<number>(cols).fill(0);
      v[f] = l;
      let g = l;
      for (let r = 0; r < pivots.length; r++) {
        const product = -mm[r]![f]! * l;
        const x = product / mm[r]![pivots[r]!]!;
        if (!Number.isSafeInteger(product) || !Number.isInteger(x)) {
          safe = false;
          break;
        }
        v[pivots[r]!] = x;
        g = gcdNum(g, x);
      }
      if (safe) basis.push(v.map((x) => BigInt(x / g)));
    }
    if (safe) return basis;
    basis.length = 0;
  }
  let l = 1n;
  for (let r = 0; r < pivots.length; r++) {
    const p = BigInt(m[r]![pivots[r]!]!);
    l = (l / gcdBig(l, p)) * (p < 0n ? -p : p);
  }
  for (let f = 0; f < cols; f++) {
    if (isPivot[f]) continue;
    const v = new Array<bigint>(cols).fill(0n);
    v[f] = l;
    for (let r = 0; r < pivots.length; r++) {
      const p = BigInt(m[r]![pivots[r]!]!);
      v[pivots[r]!] = (-BigInt(m[r]![f]!) * l) / p;
    }
    let g = 0n;
    for (const x of v) g = gcdBig(g, x);
    basis.push(v.map((x) => x / g));
  }
  return basis;
}
