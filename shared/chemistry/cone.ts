import { add, div, mul, neg, ONE, rat, sign, sub, ZERO, type Rat } from './rational';

/**
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
    w[v] = lo !== null && hi !== null ? div(add(lo, hi), rat(2n)) : lo ?? hi ?? ZERO;
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
