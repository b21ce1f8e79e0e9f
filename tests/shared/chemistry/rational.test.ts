import { describe, expect, it } from 'vitest';
import {
  gcdBigInt,
  gcdNumber,
  lcmBigInt,
  parseRational,
  rat,
  ratDecimalOrFraction,
  ratText,
  ratToNumber,
} from '@shared/chemistry/rational';

describe('parseRational', () => {
  it('reads whole numbers, fractions, decimals, exponents and vulgar fractions exactly', () => {
    const read = (t: string): string | null => {
      const r = parseRational(t);
      return r === null ? null : ratText(r);
    };
    expect(['3', '-2', '1/2', '6/4', '0.25', '.5', '1.5e3', '2e-3', '½', '¾'].map(read)).toEqual([
      '3',
      '-2',
      '1/2',
      '3/2',
      '1/4',
      '1/2',
      '1500',
      '1/500',
      '1/2',
      '3/4',
    ]);
    expect(['', '1/0', 'x', '1/2/3', '1e999'].map(read)).toEqual([null, null, null, null, null]);
  });
});

describe('ratDecimalOrFraction', () => {
  it('writes terminating decimals as decimals and the others as fractions', () => {
    expect(ratDecimalOrFraction(rat(9n, 2n))).toBe('4.5');
    expect(ratDecimalOrFraction(rat(5n, 4n))).toBe('1.25');
    expect(ratDecimalOrFraction(rat(1n, 8n))).toBe('0.125');
    expect(ratDecimalOrFraction(rat(-3n, 20n))).toBe('-0.15');
    expect(ratDecimalOrFraction(rat(13n, 3n))).toBe('13/3');
    expect(ratDecimalOrFraction(rat(7n))).toBe('7');
  });
});

describe('gcd and lcm', () => {
  it('agree on numbers and BigInts and ignore signs', () => {
    expect(gcdNumber(-12, 18)).toBe(6);
    expect(gcdBigInt(-12n, 18n)).toBe(6n);
    expect(gcdNumber(0, 0)).toBe(0);
    expect(lcmBigInt(4n, -6n)).toBe(12n);
    expect(lcmBigInt(0n, 5n)).toBe(0n);
  });
});

describe('ratToNumber', () => {
  it('gives the nearest double even when both parts are beyond the double range', () => {
    expect(ratToNumber(rat(1n, 3n))).toBeCloseTo(1 / 3, 15);
    expect(ratToNumber(rat(10n ** 400n + 1n, 2n * 10n ** 400n))).toBeCloseTo(0.5, 12);
  });
});
