/**
 * Exact rationals on BigInt for the core's internal arithmetic (fraction.js is used only at the
 * edges, where values are returned). Always normalised: d > 0, gcd(|n|, d) = 1.
 */
export interface Rat {
  readonly n: bigint;
  readonly d: bigint;
}

/** Greatest common divisor of two BigInts (non-negative result; gcd(0, 0) = 0). */
export function gcd(a: bigint, b: bigint): bigint {
  if (a < 0n) a = -a;
  if (b < 0n) b = -b;
  while (b !== 0n) {
    const t = a % b;
    a = b;
    b = t;
  }
  return a;
}

/** Build a normalised rational n/d; throws on d = 0. */
export function rat(n: bigint, d: bigint = 1n): Rat {
  if (d === 0n) throw new RangeError('division by zero');
  if (d < 0n) {
    n = -n;
    d = -d;
  }
  const g = gcd(n, d);
  return g > 1n ? { n: n / g, d: d / g } : { n, d };
}

export const ZERO: Rat = { n: 0n, d: 1n };
export const ONE: Rat = { n: 1n, d: 1n };

export const add = (a: Rat, b: Rat): Rat => rat(a.n * b.d + b.n * a.d, a.d * b.d);
export const sub = (a: Rat, b: Rat): Rat => rat(a.n * b.d - b.n * a.d, a.d * b.d);
export const mul = (a: Rat, b: Rat): Rat => rat(a.n * b.n, a.d * b.d);
export const div = (a: Rat, b: Rat): Rat => rat(a.n * b.d, a.d * b.n);
export const neg = (a: Rat): Rat => ({ n: -a.n, d: a.d });
export const eq = (a: Rat, b: Rat): boolean => a.n === b.n && a.d === b.d;
export const sign = (a: Rat): number => (a.n > 0n ? 1 : a.n < 0n ? -1 : 0);

/** Exact text: "3", "-1/2". */
export function ratText(a: Rat): string {
  return a.d === 1n ? a.n.toString() : `${a.n}/${a.d}`;
}

/** Nearest double (for ΔH scaling and display only). */
export function ratToNumber(a: Rat): number {
  return Number(a.n) / Number(a.d);
}

const VULGAR: Record<string, Rat> = {
  '½': { n: 1n, d: 2n },
  '⅓': { n: 1n, d: 3n },
  '⅔': { n: 2n, d: 3n },
  '¼': { n: 1n, d: 4n },
  '¾': { n: 3n, d: 4n },
  '⅛': { n: 1n, d: 8n },
};

/**
 * Reads "3", "-2", "1/2", "0.25", ".5", "1.5e3" or a vulgar fraction ("½") exactly.
 * Returns null when the text is not such a number (or has a zero denominator).
 */
export function parseRational(text: string): Rat | null {
  // Fast path: plain whole numbers, the common case for coefficients.
  if (/^\d{1,15}$/.test(text)) return { n: BigInt(text), d: 1n };
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

/** Least common multiple of positive BigInts. */
export function lcm(a: bigint, b: bigint): bigint {
  if (a === 0n || b === 0n) return 0n;
  return (a / gcd(a, b)) * b;
}
