import { ArithmeticOverflow, BIG_INTEGERS, SAFE_INTEGERS, type IntegerArithmetic } from './arithmetic';
import { lcmBigInt, type Rat } from './rational';
import type { SpeciesTerm } from './types';

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
  return { keys, rows, cols };
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
  const rows: bigint[][] = entries.map((row) => {
    let l = 1n;
    for (const x of row) l = lcmBigInt(l, x.d);
    return row.map((x) => (x.n * l) / x.d);
  });
  if (terms.some((t) => t.species.charge !== 0)) {
    keys.push('charge');
    rows.push(terms.map((t) => BigInt((t.side === 'reactant' ? 1 : -1) * t.species.charge)));
  }
  return { keys, rows, cols };
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

/** Whether the coefficients conserve every element and the charge: A x = 0, exactly. */
export function conserves(matrix: CompositionMatrix, coefficients: readonly Rat[]): boolean {
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
