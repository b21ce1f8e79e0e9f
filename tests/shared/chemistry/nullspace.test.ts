import fc from 'fast-check';
import Fraction from 'fraction.js';
import { describe, expect, it } from 'vitest';
import { ArithmeticOverflow, BIG_INTEGERS, SAFE_INTEGERS } from '@shared/chemistry/arithmetic';
import { findPositiveCombination } from '@shared/chemistry/cone';
import { eliminate, integerNullspace, nullspaceIn } from '@shared/chemistry/nullspace';
import { findStrictlyPositive } from './reference/fourier-motzkin';

/** Rank by plain Gaussian elimination on fraction.js — an independent reference implementation. */
function referenceRank(a: ReadonlyArray<ReadonlyArray<number | bigint>>, cols: number): number {
  const m = a.map((r) => r.map((v) => new Fraction(typeof v === 'bigint' ? v : BigInt(v))));
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

const matrices = fc.integer({ min: 1, max: 7 }).chain((rows) =>
  fc.integer({ min: 1, max: 9 }).chain((cols) =>
    fc.tuple(
      fc.constant(cols),
      fc.array(fc.array(fc.integer({ min: -12, max: 12 }), { minLength: cols, maxLength: cols }), {
        minLength: rows,
        maxLength: rows,
      }),
    ),
  ),
);

/** A·v computed with BigInt in the test itself. */
const times = (a: number[][], v: bigint[]): bigint[] =>
  a.map((row) => row.reduce((s, x, j) => s + BigInt(x) * v[j]!, 0n));

describe('nullspaceIn (one algorithm, two arithmetics)', () => {
  for (const arith of [SAFE_INTEGERS, BIG_INTEGERS] as const) {
    let overflows = 0;
    it(`on ${arith.name}: A·v = 0, dimension cols − rank, independent, free-column form (checked against fraction.js)`, () => {
      fc.assert(
        fc.property(matrices, ([cols, a]) => {
          let ns;
          try {
            ns = nullspaceIn<number | bigint>(arith as never, a, cols);
          } catch (err) {
            // Safe integers may refuse (an lcm of pivots past 2^53); that refusal is the contract.
            expect(arith === SAFE_INTEGERS && err instanceof ArithmeticOverflow).toBe(true);
            overflows++;
            return;
          }
          expect(ns.arithmetic).toBe(arith.name);
          expect(ns.rank).toBe(referenceRank(a, cols));
          expect(ns.basis).toHaveLength(cols - ns.rank);
          for (const v of ns.basis) expect(times(a, v).every((x) => x === 0n)).toBe(true);
          if (ns.basis.length) expect(referenceRank(ns.basis, cols)).toBe(ns.basis.length);
          ns.basis.forEach((v, l) => {
            // Positive at its own free column, zero at the others.
            ns.free.forEach((f, m) => expect(m === l ? v[f]! > 0n : v[f] === 0n).toBe(true));
          });
        }),
        { numRuns: 300 },
      );
      // Most small matrices finish on safe integers; the test must exercise that path.
      expect(overflows).toBeLessThan(60);
    });
  }

  it('gives the same basis on both arithmetics whenever safe integers finish', () => {
    fc.assert(
      fc.property(matrices, ([cols, a]) => {
        let safe;
        try {
          safe = nullspaceIn(SAFE_INTEGERS, a, cols);
        } catch (err) {
          expect(err).toBeInstanceOf(ArithmeticOverflow);
          return;
        }
        expect(safe.basis).toEqual(nullspaceIn(BIG_INTEGERS, a, cols).basis);
      }),
      { numRuns: 300 },
    );
  });
});

describe('SAFE_INTEGERS', () => {
  it('refuses a result outside the safe range instead of rounding it', () => {
    expect(() => SAFE_INTEGERS.mul(2 ** 30, 2 ** 30)).toThrow(ArithmeticOverflow);
    expect(() => SAFE_INTEGERS.add(Number.MAX_SAFE_INTEGER, 1)).toThrow(ArithmeticOverflow);
    expect(() => SAFE_INTEGERS.fromBigInt(2n ** 60n)).toThrow(ArithmeticOverflow);
    expect(SAFE_INTEGERS.mul(2 ** 26, 2 ** 26)).toBe(2 ** 52);
  });

  it('makes the elimination stop where BigInt carries on', () => {
    const big = 2 ** 40;
    const a = [
      [big, big + 1, 3],
      [big - 7, 5, big],
    ];
    expect(() => eliminate(SAFE_INTEGERS, a, 3)).toThrow(ArithmeticOverflow);
    expect(eliminate(BIG_INTEGERS, a, 3).pivots).toEqual([0, 1]);
  });
});

describe('integerNullspace', () => {
  it('falls back to BigInt when products leave the safe-integer range, and stays exact', () => {
    const big = 2 ** 40;
    const a = [
      [big, big + 1, 3],
      [big - 7, 5, big],
    ];
    const ns = integerNullspace(a, 3);
    expect(ns.arithmetic).toBe('BigInt');
    expect(ns.basis).toHaveLength(1);
    expect(times(a, ns.basis[0]!)).toEqual([0n, 0n]);
  });

  it('accepts BigInt matrices and uses safe integers when the entries allow', () => {
    expect(integerNullspace([[2n, -1n, 0n]], 3).arithmetic).toBe('safe integers');
    const ns = integerNullspace([[2n ** 70n, -(2n ** 71n)]], 2);
    expect(ns.arithmetic).toBe('BigInt');
    expect(ns.basis).toEqual([[2n, 1n]]);
  });

  it('gives the water balancing 2 H2 + O2 → 2 H2O', () => {
    // H: 2a − 2c = 0, O: 2b − c = 0 → (2, 1, 2) (common practice, no source).
    expect(
      integerNullspace(
        [
          [2, 0, -2],
          [0, 2, -1],
        ],
        3,
      ).basis,
    ).toEqual([[2n, 1n, 2n]]);
  });
});

describe('findPositiveCombination', () => {
  it('agrees with Fourier–Motzkin elimination (fraction.js) on feasibility, and its answers are positive', () => {
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
            for (const row of m) expect(row.reduce((s, x, j) => s + x * c[j]!, 0n) > 0n).toBe(true);
          }
        },
      ),
      { numRuns: 500 },
    );
  });
});
