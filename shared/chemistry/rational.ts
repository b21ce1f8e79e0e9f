/**
 * Whole numbers and exact rationals: the one module for gcd, lcm and fractions in the core.
 * Rationals are BigInt pairs, always normalised (d > 0, gcd(|n|, d) = 1); fraction.js appears
 * only at the edges (equation-ops accepts a Fraction as a factor).
 */

/** An exact rational n/d on BigInt, normalised: d > 0 and gcd(|n|, d) = 1. */
export interface Rat {
  readonly n: bigint;
  readonly d: bigint;
}

/** Greatest common divisor of two safe integers (non-negative; gcd(0, 0) = 0). */
export function gcdNumber(a: number, b: number): number {
  a = Math.abs(a);
  b = Math.abs(b);
  while (b !== 0) {
    const t = a % b;
    a = b;
    b = t;
  }
  return a;
}

/** Greatest common divisor of two BigInts (non-negative; gcd(0, 0) = 0). */
export function gcdBigInt(a: bigint, b: bigint): bigint {
  if (a < 0n) a = -a;
  if (b < 0n) b = -b;
  while (b !== 0n) {
    const t = a % b;
    a = b;
    b = t;
  }
  return a;
}

/** Least common multiple of two BigInts (non-negative; 0 when either is 0). */
export function lcmBigInt(a: bigint, b: bigint): bigint {
  if (a === 0n || b === 0n) return 0n;
  const l = (a / gcdBigInt(a, b)) * b;
  return l < 0n ? -l : l;
}

/** Absolute value of a BigInt. */
export const absBigInt = (a: bigint): bigint => (a < 0n ? -a : a);

// Shared objects for the small whole numbers that make up nearly every formula and coefficient.
const SMALL_WHOLE: Rat[] = Array.from({ length: 1025 }, (_, i) => Object.freeze({ n: BigInt(i), d: 1n }));

/** The rational of a safe integer (shared frozen objects for 0…1024). */
export function ratOfInteger(k: number): Rat {
  return k >= 0 && k <= 1024 && Number.isInteger(k) ? SMALL_WHOLE[k]! : { n: BigInt(k), d: 1n };
}

/** Build a normalised rational n/d; throws RangeError on d = 0. */
export function rat(n: bigint, d: bigint = 1n): Rat {
  if (d === 0n) throw new RangeError('division by zero');
  if (d < 0n) {
    n = -n;
    d = -d;
  }
  if (d === 1n) return n >= 0n && n <= 1024n ? SMALL_WHOLE[Number(n)]! : { n, d };
  const g = gcdBigInt(n, d);
  return g > 1n ? rat(n / g, d / g) : { n, d };
}

/** 0 and 1 as rationals. */
export const ZERO: Rat = SMALL_WHOLE[0]!;
/** See `ZERO`. */
export const ONE: Rat = SMALL_WHOLE[1]!;

/** a + b, exact and normalised (the same for `sub`, `mul` and `div`; `div` throws RangeError for b = 0). */
export const add = (a: Rat, b: Rat): Rat =>
  a.d === 1n && b.d === 1n ? rat(a.n + b.n) : rat(a.n * b.d + b.n * a.d, a.d * b.d);
/** a − b. */
export const sub = (a: Rat, b: Rat): Rat =>
  a.d === 1n && b.d === 1n ? rat(a.n - b.n) : rat(a.n * b.d - b.n * a.d, a.d * b.d);
/** a × b. */
export const mul = (a: Rat, b: Rat): Rat => (a.d === 1n && b.d === 1n ? rat(a.n * b.n) : rat(a.n * b.n, a.d * b.d));
/** a ÷ b. */
export const div = (a: Rat, b: Rat): Rat => rat(a.n * b.d, a.d * b.n);
/** −a. */
export const neg = (a: Rat): Rat => (a.n === 0n ? a : { n: -a.n, d: a.d });
/** Whether a = b (normalised rationals compare by parts). */
export const eq = (a: Rat, b: Rat): boolean => a.n === b.n && a.d === b.d;
/** −1, 0 or 1. */
export const sign = (a: Rat): number => (a.n > 0n ? 1 : a.n < 0n ? -1 : 0);
/** Whether a is a whole number. */
export const isWhole = (a: Rat): boolean => a.d === 1n;

/** Exact text: "3", "-1/2". This is also the wire format of coefficients. */
export function ratText(a: Rat): string {
  return a.d === 1n ? a.n.toString() : `${a.n}/${a.d}`;
}

/**
 * Decimal text when the rational has a terminating decimal expansion ("4.5", "0.125"), else the
 * fraction ("13/3"). Used for fractional counts in Hill formulas.
 */
export function ratDecimalOrFraction(a: Rat): string {
  if (a.d === 1n) return a.n.toString();
  let d = a.d;
  let twos = 0;
  let fives = 0;
  while (d % 2n === 0n) {
    d /= 2n;
    twos++;
  }
  while (d % 5n === 0n) {
    d /= 5n;
    fives++;
  }
  if (d !== 1n) return ratText(a);
  const digits = Math.max(twos, fives);
  const scaled = (absBigInt(a.n) * 10n ** BigInt(digits)) / a.d;
  const text = scaled.toString().padStart(digits + 1, '0');
  return `${a.n < 0n ? '-' : ''}${text.slice(0, -digits)}.${text.slice(-digits)}`;
}

/** Nearest double (for ΔH scaling, molar masses and display only). */
export function ratToNumber(a: Rat): number {
  if (a.d === 1n) return Number(a.n);
  const value = Number(a.n) / Number(a.d);
  if (Number.isFinite(value)) return value;
  // Both parts beyond the double range: divide with BigInt first.
  const shift = BigInt(Math.max(a.n.toString().length, a.d.toString().length) - 300);
  return Number(a.n / 10n ** shift) / Number(a.d / 10n ** shift);
}

const VULGAR: Readonly<Record<string, Rat>> = {
  '½': { n: 1n, d: 2n },
  '⅓': { n: 1n, d: 3n },
  '⅔': { n: 2n, d: 3n },
  '¼': { n: 1n, d: 4n },
  '¾': { n: 3n, d: 4n },
  '⅛': { n: 1n, d: 8n },
};

/** The vulgar fraction characters the equation language reads (½ ⅓ ⅔ ¼ ¾ ⅛). */
export const VULGAR_FRACTIONS: readonly string[] = Object.keys(VULGAR);

function isDigitCode(c: number): boolean {
  return c >= 48 && c <= 57;
}

/**
 * Reads "3", "-2", "1/2", "0.25", ".5", "1.5e3" or a vulgar fraction ("½") exactly.
 * Returns null when the text is not such a number (or has a zero denominator).
 */
export function parseRational(text: string): Rat | null {
  // Fast path: plain whole numbers, the common case for coefficients.
  if (text.length > 0 && text.length <= 15) {
    let whole = true;
    for (let i = 0; i < text.length; i++) if (!isDigitCode(text.charCodeAt(i))) whole = false;
    if (whole) return ratOfInteger(Number(text));
  }
  const t = text.trim();
  const v = VULGAR[t];
  if (v) return v;
  let m = /^([+-]?)(\d+)\/(\d+)$/.exec(t);
  if (m) {
    const d = BigInt(m[3]!);
    if (d === 0n) return null;
    return rat((m[1] === '-' ? -1n : 1n) * BigInt(m[2]!), d);
  }
  m = /^([+-]?)(\d*)(?:\.(\d*))?(?:[eE]([+-]?\d+))?$/.exec(t);
  if (!m || (m[2] === '' && (m[3] ?? '') === '')) return null;
  const whole = m[2] || '0';
  const frac = m[3] ?? '';
  let n = BigInt(whole + frac);
  let d = 10n ** BigInt(frac.length);
  const exp = m[4] ? Number(m[4]) : 0;
  if (Math.abs(exp) > 400) return null;
  if (exp > 0) n *= 10n ** BigInt(exp);
  else if (exp < 0) d *= 10n ** BigInt(-exp);
  return rat(m[1] === '-' ? -n : n, d);
}
