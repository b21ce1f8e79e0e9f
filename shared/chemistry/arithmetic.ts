/**
 * Integer arithmetic injected into the exact elimination (`nullspace.ts`), so that one algorithm
 * runs on plain safe integers (fast, the usual case) and on BigInt (any size). The safe-integer
 * version refuses any result it cannot represent exactly by throwing `ArithmeticOverflow`; the
 * caller then runs the same algorithm again on BigInt.
 */
import { gcdBigInt, gcdNumber } from './rational';

/** What the elimination needs of a ring of whole numbers. */
export interface IntegerArithmetic<T> {
  readonly name: string;
  readonly zero: T;
  readonly one: T;
  fromNumber(value: number): T;
  fromBigInt(value: bigint): T;
  toBigInt(value: T): bigint;
  add(a: T, b: T): T;
  sub(a: T, b: T): T;
  mul(a: T, b: T): T;
  /** a / b where b divides a exactly (Bareiss steps and gcd reductions). */
  divExact(a: T, b: T): T;
  neg(a: T): T;
  isZero(a: T): boolean;
  /** −1, 0 or 1. */
  sign(a: T): number;
  /** |a| < |b|. */
  lessInMagnitude(a: T, b: T): boolean;
  /** Non-negative gcd; gcd(0, 0) = 0. */
  gcd(a: T, b: T): T;
}

/** Thrown by `SAFE_INTEGERS` when a result would leave the exactly representable range. */
export class ArithmeticOverflow extends Error {
  constructor() {
    super('safe-integer overflow');
    this.name = 'ArithmeticOverflow';
  }
}

function checked(value: number): number {
  if (!Number.isSafeInteger(value)) throw new ArithmeticOverflow();
  return value;
}

/** Whole numbers as JavaScript numbers, every result checked to be a safe integer. */
export const SAFE_INTEGERS: IntegerArithmetic<number> = {
  name: 'safe integers',
  zero: 0,
  one: 1,
  fromNumber: checked,
  fromBigInt: (value) => {
    if (value > BigInt(Number.MAX_SAFE_INTEGER) || value < -BigInt(Number.MAX_SAFE_INTEGER))
      throw new ArithmeticOverflow();
    return Number(value);
  },
  toBigInt: (value) => BigInt(value),
  add: (a, b) => checked(a + b),
  sub: (a, b) => checked(a - b),
  // A product of two safe integers is exact whenever it is itself safe.
  mul: (a, b) => checked(a * b),
  divExact: (a, b) => {
    const q = a / b;
    if (!Number.isInteger(q)) throw new Error('internal: inexact division in the exact elimination');
    return q === 0 ? 0 : q; // no -0
  },
  neg: (a) => (a === 0 ? 0 : -a),
  isZero: (a) => a === 0,
  sign: (a) => (a > 0 ? 1 : a < 0 ? -1 : 0),
  lessInMagnitude: (a, b) => Math.abs(a) < Math.abs(b),
  gcd: gcdNumber,
};

/** Whole numbers as BigInt: no overflow. */
export const BIG_INTEGERS: IntegerArithmetic<bigint> = {
  name: 'BigInt',
  zero: 0n,
  one: 1n,
  fromNumber: (value) => BigInt(value),
  fromBigInt: (value) => value,
  toBigInt: (value) => value,
  add: (a, b) => a + b,
  sub: (a, b) => a - b,
  mul: (a, b) => a * b,
  divExact: (a, b) => {
    if (a % b !== 0n) throw new Error('internal: inexact division in the exact elimination');
    return a / b;
  },
  neg: (a) => -a,
  isZero: (a) => a === 0n,
  sign: (a) => (a > 0n ? 1 : a < 0n ? -1 : 0),
  lessInMagnitude: (a, b) => (a < 0n ? -a : a) < (b < 0n ? -b : b),
  gcd: gcdBigInt,
};
