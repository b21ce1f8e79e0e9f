import { describe, expect, it } from 'vitest';
import { grubbsCritical, replicateStatistics, studentCoverageFactor } from '@shared/chemistry/calorimetry';

describe('studentCoverageFactor', () => {
  // Two-sided critical values of Student's t: NIST/SEMATECH e-Handbook of Statistical Methods,
  // table 1.3.6.7.2 (from memory).
  it.each([
    [0.95, 1, 12.706],
    [0.95, 2, 4.303],
    [0.95, 4, 2.776],
    [0.95, 9, 2.262],
    [0.95, 29, 2.045],
    [0.99, 5, 4.032],
  ])('t at %s confidence with %i degrees of freedom is %s', (p, nu, t) => {
    expect(studentCoverageFactor(p, nu)).toBeCloseTo(t, 3);
  });
});

describe('grubbsCritical', () => {
  // Critical values of Grubbs' single-outlier test at 5 %: ISO 5725-2:1994, table 5 (from memory).
  it.each([
    [3, 1.155],
    [4, 1.481],
    [5, 1.715],
    [6, 1.887],
    [7, 2.02],
    [8, 2.126],
    [10, 2.29],
    [15, 2.549],
    [20, 2.709],
  ])('n = %i gives %s', (n, g) => {
    // The table prints three decimals (its last digit rounded either way): agree within 0.001.
    expect(Math.abs(grubbsCritical(n, 0.05) - g)).toBeLessThanOrEqual(0.001);
  });
});

describe('replicateStatistics', () => {
  it('gives mean, s, s/√n and t·s/√n (hand-computed for 1…5)', () => {
    // x̄ = 3, s = √2.5 = 1.58114, u = s/√5 = 0.70711, U = 2.7764·u = 1.96318.
    const r = replicateStatistics([1, 2, 3, 4, 5]);
    expect(r.mean).toBe(3);
    expect(r.standardDeviation).toBeCloseTo(1.58114, 5);
    expect(r.standardUncertainty).toBeCloseTo(0.70711, 5);
    expect(r.degreesOfFreedom).toBe(4);
    expect(r.coverageFactor).toBeCloseTo(2.776, 3);
    expect(r.expandedUncertainty).toBeCloseTo(1.9632, 3);
    expect(r.twiceStandardDeviationOfMean).toBeCloseTo(1.41421, 5);
    expect(r.outlier.applicable).toBe(true);
    expect(r.outlier.flagged).toBe(false);
  });

  it('flags a suspect run, keeps it in the mean and gives the statistics without it beside', () => {
    const runs = [-26.431, -26.436, -26.429, -26.434, -26.433, -26.47];
    const r = replicateStatistics(runs);
    expect(r.outlier.candidate).toBe(5);
    expect(r.outlier.flagged).toBe(true);
    expect(r.outlier.statistic!).toBeGreaterThan(grubbsCritical(6, 0.05));
    expect(r.mean).toBeCloseTo(runs.reduce((a, b) => a + b) / 6, 12);
    expect(r.withoutFlagged!.n).toBe(5);
    expect(r.withoutFlagged!.mean).toBeCloseTo(-26.4326, 4);
    expect(r.outlier.rule).toMatch(/never dropped/);
  });

  it('tests nothing below three values and says why', () => {
    const r = replicateStatistics([10, 11]);
    expect(r.outlier.applicable).toBe(false);
    expect(r.outlier.rule).toMatch(/at least 3 values/);
    const one = replicateStatistics([4.2]);
    expect(one.standardDeviation).toBeNull();
    expect(one.expandedUncertainty).toBeNull();
  });

  it('uses the stated confidence level', () => {
    const r = replicateStatistics([1, 2, 3, 4, 5], { confidence: 0.99 });
    // t(0.995, 4) = 4.604 (NIST/SEMATECH table; from memory).
    expect(r.coverageFactor).toBeCloseTo(4.604, 3);
  });

  it('refuses a non-finite value, naming it', () => {
    expect(() => replicateStatistics([1, Number.NaN, 3], {}, ['values'])).toThrow(
      expect.objectContaining({ path: ['values', 1] }),
    );
    expect(() => replicateStatistics([1, 2], { confidence: 1.5 })).toThrow(
      expect.objectContaining({ path: ['confidence'] }),
    );
  });
});
