import { add, div, mul, neg, ONE, rat, sign, sub, ZERO, type Rat } from './rational';

/**
 * Reference method, kept for cross-checking `findPositiveCombination` in the tests (it is exact
 * but its work can grow exponentially with k, so the balancer does not use it).
 * Finds w with (Q w)_i ≥ 1 for every row i, exactly, by Fourier–Motzkin elimination with back
 * substitution. Q is given as rows of BigInt coefficients over k variables. Because the
 * conditions are homogeneous up to scale, such a w exists exactly when some w makes every row
 * strictly positive. Returns the w found, `null` when none exists, or `undefined` when the
 * elimination grew past `limit` constraints (undecided; only for very large families).
 */
export function findStrictlyPositive(q: bigint[][], k: number, limit = 20_000): Rat[] | null | undefined {
  interface Ineq {
    a: Rat[];
    b: Rat;
  }
  let current: Ineq[] = q.map((row) => ({ a: row.map((x) => rat(x)), b: ONE }));
  const levels: Ineq[][] = [current];
  for (let v = 0; v < k; v++) {
    const pos: Ineq[] = [];
    const negs: Ineq[] = [];
    const next: Ineq[] = [];
    for (const c of current) {
      const s = sign(c.a[v]!);
      if (s > 0) pos.push(c);
      else if (s < 0) negs.push(c);
      else next.push(c);
    }
    for (const p of pos) {
      for (const n of negs) {
        // p: a_v x_v + … ≥ b ; n: −|c_v| x_v + … ≥ d. Scale to cancel x_v and add.
        const fp = div(ONE, p.a[v]!);
        const fn = div(ONE, neg(n.a[v]!));
        next.push({
          a: p.a.map((x, j) => (j === v ? ZERO : add(mul(x, fp), mul(n.a[j]!, fn)))),
          b: add(mul(p.b, fp), mul(n.b, fn)),
        });
      }
    }
    if (next.length > limit) return undefined;
    current = dedupe(next);
    levels.push(current);
  }
  // No variables left: every remaining inequality reads 0 ≥ b.
  if (current.some((c) => sign(c.b) > 0)) return null;

  const w: Rat[] = new Array<Rat>(k).fill(ZERO);
  for (let v = k - 1; v >= 0; v--) {
    let lo: Rat | null = null;
    let hi: Rat | null = null;
    for (const c of levels[v]!) {
      const av = c.a[v]!;
      if (sign(av) === 0) continue;
      let rest = c.b;
      for (let j = v + 1; j < k; j++) rest = sub(rest, mul(c.a[j]!, w[j]!));
      const bound = div(rest, av);
      if (sign(av) > 0) lo = lo === null || sign(sub(bound, lo)) > 0 ? bound : lo;
      else hi = hi === null || sign(sub(bound, hi)) < 0 ? bound : hi;
    }
    w[v] = lo !== null && hi !== null ? div(add(lo, hi), rat(2n)) : (lo ?? hi ?? ZERO);
  }
  return w;

  function dedupe(list: Ineq[]): Ineq[] {
    const seen = new Set<string>();
    const out: Ineq[] = [];
    for (const c of list) {
      if (c.a.every((x) => x.n === 0n)) {
        if (sign(c.b) > 0) return [c]; // 0 ≥ positive: infeasible, keep just this one
        continue;
      }
      const key = c.a.map((x) => `${x.n}/${x.d}`).join(',') + '|' + `${c.b.n}/${c.b.d}`;
      if (!seen.has(key)) {
        seen.add(key);
        out.push(c);
      }
    }
    return out;
  }
}

/**
 * Finds whole numbers c_j ≥ 1 with (M c)_i > 0 for every row, exactly, or returns null when none
 * exists. M is r × k. Method: phase one of the simplex method on c = 1 + y, y ≥ 0, M y ≥ 1 − M·1
 * (the homogeneous problem allows "≥ 1" in place of "> 0"), with Bland's rule (no cycling) on a
 * fraction-free integer tableau: each row carries its own positive scale, divided out by gcds.
 * Used for kernels in "free-column" form, whose free entries of Σ c_f b_f are positive multiples
 * of c_f and whose pivot entries are M c.
 */
export function findPositiveCombination(m: bigint[][], k: number): bigint[] | null {
  const r = m.length;
  const h = m.map((row) => 1n - row.reduce((s, x) => s + x, 0n));
  // Columns: y (k), surplus s (r), artificial a (r), right-hand side. Rows with h_i < 0 are
  // negated so that their surplus is basic; the others start with their artificial basic.
  const cols = k + 2 * r;
  const tab: bigint[][] = [];
  const basis: number[] = [];
  for (let i = 0; i < r; i++) {
    const flip = h[i]! < 0n;
    const row = new Array<bigint>(cols + 1).fill(0n);
    for (let j = 0; j < k; j++) row[j] = flip ? -m[i]![j]! : m[i]![j]!;
    row[k + i] = flip ? 1n : -1n;
    if (!flip) row[k + r + i] = 1n;
    row[cols] = flip ? -h[i]! : h[i]!;
    tab.push(row);
    basis.push(flip ? k + i : k + r + i);
  }
  // Reduced costs of "minimise Σ a": 1 on artificials minus the rows with an artificial basic.
  const cost = new Array<bigint>(cols + 1).fill(0n);
  for (let j = k + r; j < cols; j++) cost[j] = 1n;
  for (let i = 0; i < r; i++) {
    if (basis[i]! < k + r) continue;
    for (let j = 0; j <= cols; j++) cost[j] = cost[j]! - tab[i]![j]!;
  }
  const reduce = (row: bigint[]): void => {
    let g = 0n;
    for (const x of row) g = gcdAbs(g, x);
    if (g > 1n) for (let j = 0; j < row.length; j++) row[j] = row[j]! / g;
  };
  for (let guard = 0; guard < 100_000; guard++) {
    let enter = -1;
    for (let j = 0; j < cols; j++) {
      if (cost[j]! < 0n) {
        enter = j;
        break;
      }
    }
    if (enter === -1) break;
    let leave = -1;
    for (let i = 0; i < r; i++) {
      const a = tab[i]![enter]!;
      if (a <= 0n) continue;
      if (leave === -1) {
        leave = i;
        continue;
      }
      // Compare rhs_i / a_i with rhs_leave / a_leave (row scales cancel in each ratio).
      const lhs = tab[i]![cols]! * tab[leave]![enter]!;
      const rhs = tab[leave]![cols]! * a;
      if (lhs < rhs || (lhs === rhs && basis[i]! < basis[leave]!)) leave = i;
    }
    if (leave === -1) break; // phase one is bounded below by 0; kept for safety
    const pr = tab[leave]!;
    const p = pr[enter]!;
    for (let i = 0; i < r; i++) {
      if (i === leave) continue;
      const row = tab[i]!;
      const f = row[enter]!;
      if (f === 0n) continue;
      for (let j = 0; j <= cols; j++) row[j] = row[j]! * p - f * pr[j]!;
      reduce(row);
    }
    const f = cost[enter]!;
    for (let j = 0; j <= cols; j++) cost[j] = cost[j]! * p - f * pr[j]!;
    reduce(cost);
    basis[leave] = enter;
  }
  if (cost[cols]! !== 0n) return null; // phase-one optimum above zero: infeasible
  // y_j = rhs_i / scale_i for basic y_j (scale_i = the row's entry at its basic column).
  let l = 1n;
  for (let i = 0; i < r; i++) if (basis[i]! < k) l = lcmAbs(l, tab[i]![basis[i]!]!);
  const c = new Array<bigint>(k).fill(l);
  for (let i = 0; i < r; i++) {
    const b = basis[i]!;
    if (b < k) c[b] = l + (tab[i]![cols]! * l) / tab[i]![b]!;
  }
  return c;
}

function gcdAbs(a: bigint, b: bigint): bigint {
  if (a < 0n) a = -a;
  if (b < 0n) b = -b;
  while (b !== 0n) [a, b] = [b, a % b];
  return a;
}

function lcmAbs(a: bigint, b: bigint): bigint {
  if (b < 0n) b = -b;
  return (a / gcdAbs(a, b)) * b;
}
