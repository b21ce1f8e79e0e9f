import { ArithmeticOverflow, BIG_INTEGERS, SAFE_INTEGERS, type IntegerArithmetic } from './arithmetic';
import { lcmBigInt, ratOfInteger, type Rat } from './rational';
import type { ElementTotals, SpeciesTerm } from './types';

/**
 * The conservation equations of an equation as an integer matrix: one row per element (in order
 * of first appearance) and, when any term is charged, one for the charge; one column per term.
 * Reactant entries are positive, product entries negative, so balancing coefficients x are the
 * positive solutions of A x = 0.
 *
 * Fractional formula units (CaSO4·½H2O) give fractional counts; each such row is multiplied by
 * the lcm of its denominators. Scaling a row leaves {x : A x = 0} unchanged, so coefficients need
 * no conversion afterwards.
 */
export interface CompositionMatrix {
  /** Row keys: element symbols, then "charge". */
  keys: string[];
  /** Whole-number rows as safe integers when every entry is one, else as BigInts. */
  rows: number[][] | bigint[][];
  /** True when no row was scaled (every count whole): the rows are the atom counts themselves. */
  unscaled: boolean;
  /** Number of columns (terms). */
  cols: number;
}

// Entries up to 2^31: with the work limits (≤ 80 terms) the first elimination steps stay exact on
// safe integers in most cases; larger entries simply take the BigInt path.
const SMALL = 2n ** 31n;

/** Builds the composition matrix of the terms (see `CompositionMatrix`). */
export function compositionMatrix(terms: readonly SpeciesTerm[]): CompositionMatrix {
  return wholeNumberMatrix(terms) ?? exactMatrix(terms);
}

function wholeNumberMatrix(terms: readonly SpeciesTerm[]): CompositionMatrix | null {
  const cols = terms.length;
  const index = new Map<string, number>();
  const keys: string[] = [];
  const rows: number[][] = [];
  let charged = false;
  for (let j = 0; j < cols; j++) {
    const t = terms[j]!;
    const s = t.side === 'reactant' ? 1 : -1;
    const composition = t.species.composition;
    for (const symbol in composition) {
      const count = composition[symbol]!;
      if (count.d !== 1n || count.n >= SMALL) return null;
      let r = index.get(symbol);
      if (r === undefined) {
        r = rows.length;
        index.set(symbol, r);
        keys.push(symbol);
        rows.push(new Array<number>(cols).fill(0));
      }
      rows[r]![j] = s * Number(count.n);
    }
    if (t.species.charge !== 0) charged = true;
  }
  if (charged) {
    keys.push('charge');
    rows.push(terms.map((t) => (t.side === 'reactant' ? 1 : -1) * t.species.charge));
  }
  return { keys, rows, cols, unscaled: true };
}

function exactMatrix(terms: readonly SpeciesTerm[]): CompositionMatrix {
  const cols = terms.length;
  const index = new Map<string, number>();
  const keys: string[] = [];
  const entries: Rat[][] = [];
  const zero: Rat = { n: 0n, d: 1n };
  terms.forEach((t, j) => {
    const composition = t.species.composition;
    for (const symbol in composition) {
      let r = index.get(symbol);
      if (r === undefined) {
        r = entries.length;
        index.set(symbol, r);
        keys.push(symbol);
        entries.push(new Array<Rat>(cols).fill(zero));
      }
      const c = composition[symbol]!;
      entries[r]![j] = t.side === 'reactant' ? c : { n: -c.n, d: c.d };
    }
  });
  let unscaled = true;
  const rows: bigint[][] = entries.map((row) => {
    let l = 1n;
    for (const x of row) l = lcmBigInt(l, x.d);
    if (l !== 1n) unscaled = false;
    return row.map((x) => (x.n * l) / x.d);
  });
  if (terms.some((t) => t.species.charge !== 0)) {
    keys.push('charge');
    rows.push(terms.map((t) => BigInt((t.side === 'reactant' ? 1 : -1) * t.species.charge)));
  }
  return { keys, rows, cols, unscaled };
}

function conservesIn<T>(arith: IntegerArithmetic<T>, matrix: CompositionMatrix, x: readonly bigint[]): boolean {
  const v = x.map((value) => arith.fromBigInt(value));
  for (const row of matrix.rows as ReadonlyArray<ReadonlyArray<number | bigint>>) {
    let sum = arith.zero;
    for (let j = 0; j < matrix.cols; j++) {
      const a = row[j]!;
      if (a === 0 || a === 0n) continue;
      sum = arith.add(sum, arith.mul(typeof a === 'bigint' ? arith.fromBigInt(a) : arith.fromNumber(a), v[j]!));
    }
    if (!arith.isZero(sum)) return false;
  }
  return true;
}

// Coefficients below 2^15 on entries below 2^31 over at most 128 terms: every sum stays below 2^53.
const SMALL_COEFFICIENT = 2n ** 15n;

/** The whole-number coefficients as numbers when they are small enough for exact sums, else null. */
function smallWholeNumbers(matrix: CompositionMatrix, coefficients: readonly Rat[]): number[] | null {
  if (matrix.cols > 128 || typeof matrix.rows[0]?.[0] === 'bigint') return null;
  const out: number[] = [];
  for (const c of coefficients) {
    if (c.d !== 1n || c.n >= SMALL_COEFFICIENT || c.n <= -SMALL_COEFFICIENT) return null;
    out.push(Number(c.n));
  }
  return out;
}

/**
 * Per-element totals of the coefficients on each side, read off the matrix (fast path of
 * `elementTotals` for whole counts and small whole coefficients); null when that does not apply.
 */
export function matrixTotals(
  matrix: CompositionMatrix,
  terms: readonly SpeciesTerm[],
  coefficients: readonly Rat[],
): ElementTotals[] | null {
  const g = matrix.unscaled ? smallWholeNumbers(matrix, coefficients) : null;
  if (g === null) return null;
  const rows = matrix.rows as number[][];
  return matrix.keys.map((element, r) => {
    let reactants = 0;
    let products = 0;
    const row = rows[r]!;
    for (let j = 0; j < matrix.cols; j++) {
      // Products were entered with the opposite sign.
      if (terms[j]!.side === 'reactant') reactants += row[j]! * g[j]!;
      else products -= row[j]! * g[j]!;
    }
    return { element, reactants: ratOfInteger(reactants), products: ratOfInteger(products) };
  });
}

/** Whether the coefficients conserve every element and the charge: A x = 0, exactly. */
export function conserves(matrix: CompositionMatrix, coefficients: readonly Rat[]): boolean {
  const g = smallWholeNumbers(matrix, coefficients);
  if (g !== null) {
    for (const row of matrix.rows as number[][]) {
      let sum = 0;
      for (let j = 0; j < matrix.cols; j++) sum += row[j]! * g[j]!;
      if (sum !== 0) return false;
    }
    return true;
  }
  // Bring the coefficients to whole numbers (scaling does not change A x = 0).
  let l = 1n;
  for (const c of coefficients) if (c.d !== 1n) l = lcmBigInt(l, c.d);
  const x = coefficients.map((c) => (c.d === l ? c.n : (c.n * l) / c.d));
  try {
    return conservesIn(SAFE_INTEGERS, matrix, x);
  } catch (err) {
    if (!(err instanceof ArithmeticOverflow)) throw err;
    return conservesIn(BIG_INTEGERS, matrix, x);
  }
}
