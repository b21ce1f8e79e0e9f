import fc from 'fast-check';
import Fraction from 'fraction.js';
import { describe, expect, it } from 'vitest';
import { findPositiveCombination, findStrictlyPositive } from '@shared/chemistry/cone';
import { integerNullspace } from '@shared/chemistry/nullspace';

/** Rank by plain Gaussian elimination on fraction.js — an independent reference implementation. */
function referenceRank(a: number[][], cols: number): number {
  const m = a.map((r) => r.map((v) => new Fraction(v)));
  let rank = 0;
  for (let c = 0; c < cols && rank < m.length; c++) {
    const p = m.findIndex((row, i) => i >= rank && !row[c]!.equals(0));
    if (p === -1) continue;
    [m[p], m[rank]] = [m[rank]!, m[p]!];
    for (let i = 0; i < m.length; i++) {
      if (i === rank || m[i]![c]!.equals(0)) continue;
      const f = m[i]![c]!.div(m[rank]![c]!);
      m[i] = m[i]!.map((v, j) => v.sub(f.mul(m[rank]![j]!)));
    }
    rank++;
  }
  return rank;
}

describe('integerNullspace', () => {
  it('returns vectors A·v = 0 spanning a space of dimension cols − rank (checked against fraction.js)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 7 }).chain((rows) =>
          fc.integer({ min: 1, max: 9 }).chain((cols) =>
            fc.tuple(
              fc.constant(cols),
              fc.array(fc.array(fc.integer({ min: -12, max: 12 }), { minLength: cols, maxLength: cols }), {
                minLength: rows,
                maxLength: rows,
              }),
            ),
          ),
        ),
        ([cols, a]) => {
          const ns = integerNullspace(a, cols);
          expect(ns.rank).toBe(referenceRank(a, cols));
          expect(ns.basis).toHaveLength(cols - ns.rank);
          for (const v of ns.basis) {
            for (const row of a) expect(row.reduce((s, x, j) => s + BigInt(x) * v[j]!, 0n)).toBe(0n);
          }
          // Independence: the basis vectors as rows have full rank.
          if (ns.basis.length)
            expect(
              referenceRank(
                ns.basis.map((v) => v.map(Number)),
                cols,
              ),
            ).toBe(ns.basis.length);
        },
      ),
      { numRuns: 400 },
    );
  });

  it('falls back to BigInt when products leave the safe-integer range', () => {
    const big = 2 ** 40;
    const ns = integerNullspace(
      [
        [big, big + 1, 3],
        [big - 7, 5, big],
      ],
      3,
    );
    expect(ns.basis).toHaveLength(1);
    const v = ns.basis[0]!;
    expect(BigInt(big) * v[0]! + BigInt(big + 1) * v[1]! + 3n * v[2]!).toBe(0n);
    expect(BigInt(big - 7) * v[0]! + 5n * v[1]! + BigInt(big) * v[2]!).toBe(0n);
  });
});

describe('findPositiveCombination', () => {
  it('agrees with Fourier–Motzkin elimination on feasibility, and its answers are positive', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 4 }).chain((k) =>
          fc.tuple(
            fc.constant(k),
            fc.array(fc.array(fc.integer({ min: -5, max: 5 }).map(BigInt), { minLength: k, maxLength: k }), {
              minLength: 1,
              maxLength: 5,
            }),
          ),
        ),
        ([k, m]) => {
          const c = findPositiveCombination(m, k);
          // FM reference over all constraints: c_j ≥ 1 and M c ≥ 1.
          const q = [
            ...Array.from({ length: k }, (_, j) => Array.from({ length: k }, (_, l) => (l === j ? 1n : 0n))),
            ...m,
          ];
          const w = findStrictlyPositive(q, k);
          expect(c === null).toBe(w === null);
          if (c) {
            for (const x of c) expect(x >= 1n).toBe(true);
            for (const row of m) {
              let num = 0n;
              for (let j = 0; j < k; j++) {
                num += row[j]! * c[j]!;
              }
              expect(num > 0n).toBe(true);
            }
          }
        },
      ),
      { numRuns: 500 },
    );
  });
});
