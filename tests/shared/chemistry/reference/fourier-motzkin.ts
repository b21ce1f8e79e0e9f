/**
 * Reference method for the tests: exact Fourier–Motzkin elimination on fraction.js, an
 * independent check of `findPositiveCombination` (cone.ts: simplex on a BigInt tableau). It is
 * exact but its work can grow exponentially with k, which is why the balancer does not use it.
 */
import Fraction from 'fraction.js';

interface Inequality {
  a: Fraction[];
  b: Fraction;
}

const sign = (f: Fraction): number => (f.equals(0) ? 0 : Number(f.s));

/**
 * Finds w with (Q w)_i ≥ 1 for every row i, exactly, with back substitution. Q is given as rows
 * of BigInt coefficients over k variables. The conditions are homogeneous up to scale, so such a
 * w exists exactly when some w makes every row strictly positive. Returns the w found, `null`
 * when none exists, or `undefined` when the elimination grew past `limit` constraints.
 */
export function findStrictlyPositive(q: bigint[][], k: number, limit = 20_000): Fraction[] | null | undefined {
  let current: Inequality[] = q.map((row) => ({ a: row.map((x) => new Fraction(Number(x))), b: new Fraction(1) }));
  const levels: Inequality[][] = [current];
  for (let v = 0; v < k; v++) {
    const positive: Inequality[] = [];
    const negative: Inequality[] = [];
    const next: Inequality[] = [];
    for (const c of current) {
      const s = sign(c.a[v]!);
      if (s > 0) positive.push(c);
      else if (s < 0) negative.push(c);
      else next.push(c);
    }
    for (const p of positive) {
      for (const n of negative) {
        // p: a_v x_v + … ≥ b ; n: −|c_v| x_v + … ≥ d. Scale to cancel x_v and add.
        const fp = new Fraction(1).div(p.a[v]!);
        const fn = new Fraction(1).div(n.a[v]!.neg());
        next.push({
          a: p.a.map((x, j) => (j === v ? new Fraction(0) : x.mul(fp).add(n.a[j]!.mul(fn)))),
          b: p.b.mul(fp).add(n.b.mul(fn)),
        });
      }
    }
    if (next.length > limit) return undefined;
    current = dedupe(next);
    levels.push(current);
  }
  // No variables left: every remaining inequality reads 0 ≥ b.
  if (current.some((c) => sign(c.b) > 0)) return null;

  const w: Fraction[] = Array.from({ length: k }, () => new Fraction(0));
  for (let v = k - 1; v >= 0; v--) {
    let lo: Fraction | null = null;
    let hi: Fraction | null = null;
    for (const c of levels[v]!) {
      const av = c.a[v]!;
      if (sign(av) === 0) continue;
      let rest = c.b;
      for (let j = v + 1; j < k; j++) rest = rest.sub(c.a[j]!.mul(w[j]!));
      const bound = rest.div(av);
      if (sign(av) > 0) lo = lo === null || bound.compare(lo) > 0 ? bound : lo;
      else hi = hi === null || bound.compare(hi) < 0 ? bound : hi;
    }
    w[v] = lo !== null && hi !== null ? lo.add(hi).div(2) : (lo ?? hi ?? new Fraction(0));
  }
  return w;
}

function dedupe(list: Inequality[]): Inequality[] {
  const seen = new Set<string>();
  const out: Inequality[] = [];
  for (const c of list) {
    if (c.a.every((x) => x.equals(0))) {
      if (sign(c.b) > 0) return [c]; // 0 ≥ positive: infeasible, keep just this one
      continue;
    }
    const key = c.a.map((x) => x.toFraction()).join(',') + '|' + c.b.toFraction();
    if (!seen.has(key)) {
      seen.add(key);
      out.push(c);
    }
  }
  return out;
}
