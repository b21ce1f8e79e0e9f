/**
 * Evaluation of NASA 7- and 9-coefficient polynomials (McBride, Gordon & Reno, NASA TM-4513, 1993;
 * the 9-term form of McBride, Zehe & Gordon, NASA/TP-2002-211556), as SOURCE.md in
 * seeds/source-data/nasa-tm4513/ states them. T in K; H in kJ/mol on the formation scale (elements in
 * their reference states have H°(298.15 K) = 0), S and Cp in J/(mol K), at p° = 1 bar.
 */

/** Molar gas constant, J/(mol K) (CODATA 2018, exact since the 2019 SI). */
export const R_J_PER_MOL_K = 8.314462618;

/** The reference temperature of every library value, K. */
export const T_REF = 298.15;

/**
 * A fit gives values at 298.15 K when it starts at or below this. 427 gas fits start at 300 K; using
 * them 1.85 K below their range is accepted practice (SOURCE.md). Anything starting later is never
 * extrapolated.
 */
export const LATEST_FIT_START_K = 300;

export type NasaKind = 'nasa7' | 'nasa9';

/** One fitted range: its coefficients a1…a7 or a1…a9. */
export type NasaCoefficients = readonly number[];

export interface NasaPoint {
  /** H°(T), kJ/mol. */
  h: number;
  /** S°(T), J/(mol K). */
  s: number;
  /** Cp°(T), J/(mol K). */
  cp: number;
}

function nasa7(a: NasaCoefficients, t: number): NasaPoint {
  const [a1, a2, a3, a4, a5, a6, a7] = a as [number, number, number, number, number, number, number];
  const cpR = a1 + a2 * t + a3 * t ** 2 + a4 * t ** 3 + a5 * t ** 4;
  const hRT = a1 + (a2 * t) / 2 + (a3 * t ** 2) / 3 + (a4 * t ** 3) / 4 + (a5 * t ** 4) / 5 + a6 / t;
  const sR = a1 * Math.log(t) + a2 * t + (a3 * t ** 2) / 2 + (a4 * t ** 3) / 3 + (a5 * t ** 4) / 4 + a7;
  return { h: (hRT * R_J_PER_MOL_K * t) / 1000, s: sR * R_J_PER_MOL_K, cp: cpR * R_J_PER_MOL_K };
}

function nasa9(a: NasaCoefficients, t: number): NasaPoint {
  const [a1, a2, a3, a4, a5, a6, a7, a8, a9] = a as [
    number,
    number,
    number,
    number,
    number,
    number,
    number,
    number,
    number,
  ];
  const cpR = a1 / t ** 2 + a2 / t + a3 + a4 * t + a5 * t ** 2 + a6 * t ** 3 + a7 * t ** 4;
  const hRT =
    -a1 / t ** 2 +
    (a2 * Math.log(t)) / t +
    a3 +
    (a4 * t) / 2 +
    (a5 * t ** 2) / 3 +
    (a6 * t ** 3) / 4 +
    (a7 * t ** 4) / 5 +
    a8 / t;
  const sR =
    -a1 / (2 * t ** 2) -
    a2 / t +
    a3 * Math.log(t) +
    a4 * t +
    (a5 * t ** 2) / 2 +
    (a6 * t ** 3) / 3 +
    (a7 * t ** 4) / 4 +
    a9;
  return { h: (hRT * R_J_PER_MOL_K * t) / 1000, s: sR * R_J_PER_MOL_K, cp: cpR * R_J_PER_MOL_K };
}

/** H°, S° and Cp° of one fitted range at T (no range check: the caller picks the range). */
export function evaluateNasa(kind: NasaKind, coefficients: NasaCoefficients, t: number): NasaPoint {
  const expected = kind === 'nasa7' ? 7 : 9;
  if (coefficients.length !== expected) {
    throw new Error(`a ${kind} range needs ${expected} coefficients, got ${coefficients.length}`);
  }
  return kind === 'nasa7' ? nasa7(coefficients, t) : nasa9(coefficients, t);
}

/**
 * Index of the range of `ranges` (breakpoints T0 < T1 < … < Tn) that holds T; a T at a breakpoint
 * belongs to the range below it, and a T below T0 to the first range (the caller decides how far
 * below T0 it may go).
 */
export function rangeIndexAt(ranges: readonly number[], t: number): number {
  for (let i = 1; i < ranges.length; i++) if (t <= ranges[i]!) return i - 1;
  return ranges.length - 2;
}

/**
 * Whether a fit over `ranges` gives values at 298.15 K: it starts at or below LATEST_FIT_START_K and
 * ends above 298.15 K.
 */
export function coversReferenceTemperature(ranges: readonly number[]): boolean {
  const first = ranges[0];
  const last = ranges[ranges.length - 1];
  return first !== undefined && last !== undefined && first <= LATEST_FIT_START_K && last > T_REF;
}

/** One fit as the source gives it. */
export interface NasaFit {
  label: string;
  kind: NasaKind;
  ranges: readonly number[];
  coefficients: readonly NasaCoefficients[];
}

/**
 * H°, S° and Cp° of a fit at 298.15 K.
 * @throws RangeError when the fit does not cover 298.15 K (see coversReferenceTemperature).
 */
export function evaluateAtReference(fit: NasaFit): NasaPoint {
  if (!coversReferenceTemperature(fit.ranges)) {
    throw new RangeError(`${fit.label} covers ${fit.ranges[0]}–${fit.ranges[fit.ranges.length - 1]} K, not ${T_REF} K`);
  }
  return evaluateNasa(fit.kind, fit.coefficients[rangeIndexAt(fit.ranges, T_REF)]!, T_REF);
}
