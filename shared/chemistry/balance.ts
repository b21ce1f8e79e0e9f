import type { BalanceInput, BalanceResult } from '../schemas/balance';
import { findPositiveCombination } from './cone';
import { elementName } from './elements';
import { elementBalanceTable } from './element-table';
import { BalanceInputError } from './errors';
import { formatEquation } from './format';
import { integerNullspace, primitive, type Nullspace } from './nullspace';
import { parseEquation } from './parse';
import { div, lcm, mul, parseRational, rat, ratText, ratToNumber, type Rat } from './rational';
import type { EnthalpyValue, ParsedEquation, ParseWarning, SpeciesTerm } from './types';

/** Options of a balancing request (see `BalanceInput`). */
export interface BalanceOptions {
  /** Coefficients to hold, keyed by term index (from 0, input order), as exact fraction text. */
  fixed?: Record<string, string>;
  /** Term index whose coefficient becomes 1. */
  normaliseTo?: number;
}

/**
 * Parses and balances an equation (what `POST /api/v1/balance` returns).
 *
 * - Coefficients as typed balance → `balanced`, `asGiven: true` (coefficients kept as typed).
 * - Exactly one balancing up to scale → `balanced` with the smallest whole numbers.
 * - Several independent balancings → `multiple` with `dimension` and an integer `basis`
 *   (one vector per independent balancing, term order, positive = on the side written), and an
 *   example with all coefficients positive in `terms`; `fixed` picks one.
 * - None with all coefficients positive → `impossible` with `reason` in words.
 * - Coefficients as typed that do not balance → `givenImbalance` (every element row and the charge).
 * `normaliseTo` rescales the answer so that term's coefficient is 1 (fractions such as 1/2 O2).
 * ΔH (kJ/mol, per mole of reaction as written) is returned in `enthalpy` only when the answer is a
 * multiple of the equation as typed, scaled by the same factor; otherwise a warning says it was dropped.
 *
 * @throws EquationParseError for unreadable text.
 * @throws BalanceInputError (field "fixed.<index>" or "normaliseTo") for a bad index, a zero or
 *   negative fixed coefficient, or fixed coefficients no balancing can have.
 */
export function balanceEquationText(input: BalanceInput): BalanceResult {
  return balanceParsedEquation(parseEquation(input.equation), input);
}

interface FixedValue {
  index: number;
  key: string;
  value: Rat;
}

function readOptions(n: number, options: BalanceOptions): { fixed: FixedValue[]; normaliseTo: number | undefined } {
  const fixed: FixedValue[] = [];
  for (const [key, text] of Object.entries(options.fixed ?? {})) {
    const field = `fixed.${key}`;
    if (!/^\d+$/.test(key)) throw new BalanceInputError(`Term index '${key}' is not a whole number from 0.`, field);
    const index = Number(key);
    if (index >= n)
      throw new BalanceInputError(`There is no term ${index}: the equation has terms 0 to ${n - 1}.`, field);
    const value = parseRational(String(text));
    if (value === null) throw new BalanceInputError(`'${text}' is not an exact number such as 2, 1/2 or 0.5.`, field);
    if (value.n === 0n) throw new BalanceInputError(`A coefficient cannot be zero (term ${index}).`, field);
    if (value.n < 0n)
      throw new BalanceInputError(
        `A coefficient must be positive (term ${index}); move the species to the other side instead.`,
        field,
      );
    fixed.push({ index, key, value });
  }
  fixed.sort((a, b) => a.index - b.index);
  const normaliseTo = options.normaliseTo;
  if (normaliseTo !== undefined && (!Number.isInteger(normaliseTo) || normaliseTo < 0 || normaliseTo >= n)) {
    throw new BalanceInputError(
      `There is no term ${normaliseTo}: the equation has terms 0 to ${n - 1}.`,
      'normaliseTo',
    );
  }
  return { fixed, normaliseTo };
}

function label(symbol: string): string {
  const name = elementName(symbol);
  return name ? `${name} (${symbol})` : symbol;
}

function speciesLabel(t: SpeciesTerm, index: number): string {
  return `${t.species.formula}${t.species.phase ? `(${t.species.phase})` : ''} (term ${index})`;
}

function listWords(words: string[]): string {
  return words.length <= 1 ? (words[0] ?? '') : `${words.slice(0, -1).join(', ')} and ${words[words.length - 1]}`;
}

/** Whether Σ_j a_ij g_j = 0 for every row, exactly (numbers when safe, else BigInt). */
function balancesExactly(rows: number[][], given: Rat[]): boolean {
  if (given.every((g) => g.d === 1n && g.n < 1_000_000_000n)) {
    const g = given.map((x) => Number(x.n));
    // |a| and g below 1e9 each, at most a few hundred terms: sums stay exact in doubles.
    if (rows.every((row) => row.every((a) => Math.abs(a) < 1e6))) {
      return rows.every((row) => row.reduce((sum, a, j) => sum + a * g[j]!, 0) === 0);
    }
  }
  let den = 1n;
  for (const x of given) den = lcm(den, x.d);
  const ints = given.map((x) => (x.n * den) / x.d);
  return rows.every((row) => row.reduce((sum, a, j) => sum + BigInt(a) * ints[j]!, 0n) === 0n);
}

/**
 * The per-element table of the coefficients as typed, read off the composition matrix (same rows
 * as `elementBalanceTable`, which it falls back to for fractional coefficients).
 */
function givenTable(
  keys: string[],
  rows: number[][],
  terms: SpeciesTerm[],
  given: Rat[],
): BalanceResult['givenImbalance'] {
  if (!given.every((g) => g.d === 1n && g.n < 1_000_000n)) {
    return elementBalanceTable(
      terms.map((t) => ({
        composition: t.species.composition,
        charge: t.species.charge,
        side: t.side,
        coefficient: t.coefficient,
      })),
    );
  }
  const g = given.map((x) => Number(x.n));
  return keys.map((element, r) => {
    let reactants = 0;
    let products = 0;
    const row = rows[r]!;
    for (let j = 0; j < row.length; j++) {
      // Products were entered with the opposite sign.
      if (terms[j]!.side === 'reactant') reactants += row[j]! * g[j]!;
      else products -= row[j]! * g[j]!;
    }
    return { element, reactants: String(reactants), products: String(products) };
  });
}

/** Reasons that need no algebra: an element or the charge that sits on one side only. */
function oneSideReasons(keys: string[], rows: number[][], terms: SpeciesTerm[]): string[] {
  const reasons: string[] = [];
  keys.forEach((key, r) => {
    const row = rows[r]!;
    const hasPos = row.some((v) => v > 0);
    const hasNeg = row.some((v) => v < 0);
    if (hasPos === hasNeg) return;
    if (key === 'charge') {
      const side = (s: 'reactant' | 'product'): string => {
        const qs = terms.filter((t) => t.side === s && t.species.charge !== 0).map((t) => t.species.charge);
        if (qs.length === 0) return `the ${s}s carry no charge`;
        return `the ${s}s carry only ${qs[0]! > 0 ? 'positive' : 'negative'} charge`;
      };
      reasons.push(`The charge cannot balance: ${side('reactant')} and ${side('product')}.`);
    } else {
      reasons.push(`${label(key)} appears only among the ${hasPos ? 'reactants' : 'products'}, so it cannot balance.`);
    }
  });
  return reasons;
}

/**
 * Positive example in the span of a kernel basis (primitive integers), or null if none exists.
 * The basis is in free-column form (see `integerNullspace`), so with x = Σ c_f b_f the free
 * entries are positive multiples of c_f and the search is a small exact LP on the pivot rows.
 */
function positiveExample(ns: Nullspace, n: number): bigint[] | null {
  const { basis } = ns;
  if (basis.length === 0) return null;
  if (basis.length === 1) {
    const v = basis[0]!;
    if (v.every((x) => x > 0n)) return v;
    if (v.every((x) => x < 0n)) return v.map((x) => -x);
    return null;
  }
  // Fast path: the sum of the basis vectors (each positive at its own free column) is often positive.
  const sum = new Array<bigint>(n).fill(0n);
  for (const b of basis) for (let j = 0; j < n; j++) sum[j]! += b[j]!;
  if (sum.every((x) => x > 0n)) return primitive(sum);
  const pivotRows = ns.pivots.map((p) => basis.map((b) => b[p]!));
  const c = findPositiveCombination(pivotRows, basis.length);
  if (c === null) return null;
  const x = new Array<bigint>(n).fill(0n);
  basis.forEach((b, l) => {
    for (let j = 0; j < n; j++) x[j]! += b[j]! * c[l]!;
  });
  return primitive(x);
}

interface Solved {
  status: 'balanced' | 'multiple';
  coefficients: Rat[] | null;
  dimension: number;
  basis?: bigint[][];
  warnings: ParseWarning[];
}

/** Chooses among several balancings with the user's fixed coefficients (homogenised with t). */
function solveFixed(rows: number[][], terms: SpeciesTerm[], fixed: FixedValue[]): Solved {
  const n = terms.length;
  const aug = rows.map((r) => [...r, 0]);
  let kernel: bigint[][] = [];
  let kernelNs: Nullspace | null = null;
  for (let f = 0; f < fixed.length; f++) {
    const { index, key, value } = fixed[f]!;
    const row = new Array<number>(n + 1).fill(0);
    row[index] = Number(value.d);
    row[n] = -Number(value.n);
    if (!Number.isSafeInteger(row[index]) || !Number.isSafeInteger(row[n])) {
      throw new BalanceInputError(`The coefficient for term ${index} is too large.`, `fixed.${key}`);
    }
    aug.push(row);
    const kns = integerNullspace(aug, n + 1);
    kernelNs = kns;
    kernel = kns.basis;
    const field = `fixed.${key}`;
    const withT = kernel.filter((v) => v[n] !== 0n);
    const others = fixed.slice(0, f).map((o) => `term ${o.index} = ${ratText(o.value)}`);
    const context = others.length ? ` together with ${listWords(others)}` : '';
    if (withT.length === 0) {
      throw new BalanceInputError(
        `No balancing has coefficient ${ratText(value)} for ${speciesLabel(terms[index]!, index)}${context}.`,
        field,
      );
    }
    const positive = positiveExample(kns, n + 1);
    if (positive === null) {
      throw new BalanceInputError(
        `With coefficient ${ratText(value)} for ${speciesLabel(terms[index]!, index)}${context}, some other coefficient would have to be zero or negative.`,
        field,
      );
    }
  }
  // Directions that keep the fixed values: kernel vectors with t = 0 after eliminating t.
  const pivot = kernel.find((v) => v[n] !== 0n)!;
  const free = kernel
    .filter((v) => v !== pivot)
    .map((v) => primitive(v.map((x, j) => x * pivot[n]! - pivot[j]! * v[n]!)).slice(0, n));
  const example = positiveExample(kernelNs!, n + 1);
  const scaleToT = (v: bigint[]): Rat[] => v.slice(0, n).map((x) => rat(x, v[n]!));
  if (free.length === 0) {
    return {
      status: 'balanced',
      coefficients: scaleToT(pivot[n]! < 0n ? pivot.map((x) => -x) : pivot),
      dimension: 0,
      warnings: [],
    };
  }
  return {
    status: 'multiple',
    coefficients: example ? scaleToT(example) : null,
    dimension: free.length,
    basis: free,
    warnings: [],
  };
}

/**
 * Balances an already parsed equation; see `balanceEquationText` for the outcomes.
 * @throws BalanceInputError as `balanceEquationText`.
 */
export function balanceParsedEquation(parsed: ParsedEquation, options: BalanceOptions = {}): BalanceResult {
  const terms = parsed.terms;
  const n = terms.length;
  const { fixed, normaliseTo } = readOptions(n, options);
  const warnings: ParseWarning[] = [...parsed.warnings];

  // Composition matrix: one row per element (first appearance) and the charge; products negative.
  const index = new Map<string, number>();
  const rows: number[][] = [];
  const keys: string[] = [];
  const rowFor = (key: string): number[] => {
    let r = index.get(key);
    if (r === undefined) {
      r = rows.length;
      index.set(key, r);
      keys.push(key);
      rows.push(new Array<number>(n).fill(0));
    }
    return rows[r]!;
  };
  terms.forEach((t, j) => {
    const s = t.side === 'reactant' ? 1 : -1;
    for (const symbol in t.species.composition) rowFor(symbol)[j]! += s * t.species.composition[symbol]!;
  });
  if (terms.some((t) => t.species.charge !== 0)) {
    const row = rowFor('charge');
    terms.forEach((t, j) => (row[j] = (t.side === 'reactant' ? 1 : -1) * t.species.charge));
  }

  const given = terms.map((t) => parseRational(t.coefficient)!);
  const asGiven = balancesExactly(rows, given);

  const ns = integerNullspace(rows, n);
  const k = ns.basis.length;
  const result = (
    partial: Partial<BalanceResult> & Pick<BalanceResult, 'status'>,
    coefficients: Rat[] | null,
  ): BalanceResult => {
    let coeffs = coefficients ?? given;
    if (normaliseTo !== undefined && coefficients) {
      const pivot = coeffs[normaliseTo]!;
      coeffs = coeffs.map((c) => div(c, pivot));
    }
    const coeffText = coeffs.map(ratText);
    const model: SpeciesTerm[] = terms.map((t, j) => ({
      species: t.species,
      side: t.side,
      coefficient: coeffText[j]!,
      coefficientWritten: true,
    }));
    let enthalpy: EnthalpyValue | null = null;
    if (parsed.enthalpy && partial.status !== 'impossible' && coefficients) {
      const factor = div(coeffs[0]!, given[0]!);
      const proportional = coeffs.every((c, j) => ratText(mul(factor, given[j]!)) === coeffText[j]);
      if (proportional && asGiven) {
        const f = ratToNumber(factor);
        enthalpy = { value: parsed.enthalpy.value * f, stated: parsed.enthalpy.stated };
        if (parsed.enthalpy.uncertainty !== undefined) enthalpy.uncertainty = parsed.enthalpy.uncertainty * Math.abs(f);
      } else {
        warnings.push({
          code: 'enthalpy_not_carried',
          message:
            'ΔH was stated for the equation as typed, which is not a multiple of the balanced equation; it is not carried over.',
        });
      }
    }
    const out: BalanceResult = {
      status: partial.status,
      equation: formatEquation({ terms: model, enthalpy }, 'text'),
      terms: terms.map((t, j) => ({
        formula: t.species.formula,
        hill: t.species.hill,
        phase: t.species.phase,
        descriptor: t.species.descriptor,
        charge: t.species.charge,
        side: t.side,
        coefficient: coeffText[j]!,
      })),
      asGiven,
      dimension: partial.dimension ?? k,
      warnings: warnings.map((w) => {
        const plain: BalanceResult['warnings'][number] = { code: w.code, message: w.message };
        if (w.term !== undefined) plain.term = w.term;
        if (w.column !== undefined) plain.column = w.column;
        return plain;
      }),
    };
    if (!asGiven) {
      out.givenImbalance = givenTable(keys, rows, terms, given);
    }
    if (partial.basis) out.basis = partial.basis;
    if (partial.reason) out.reason = partial.reason;
    if (enthalpy) {
      out.enthalpy = { value: enthalpy.value, unit: 'kJ/mol' };
      if (enthalpy.uncertainty !== undefined) out.enthalpy.uncertainty = enthalpy.uncertainty;
    }
    return out;
  };
  const basisText = (b: bigint[][]): string[][] => b.map((v) => v.map((x) => x.toString()));

  // 1. An element or the charge on one side only.
  const oneSide = oneSideReasons(keys, rows, terms);
  if (oneSide.length > 0) {
    return result(
      { status: 'impossible', reason: oneSide.join(' '), ...(k > 0 ? { basis: basisText(ns.basis) } : {}) },
      null,
    );
  }
  // 2. Only the zero solution.
  if (k === 0) {
    const names = keys.map((key) => (key === 'charge' ? 'the charge' : key));
    return result(
      {
        status: 'impossible',
        reason: `No balancing exists: the only coefficients that balance ${listWords(names)} together are all zero.`,
      },
      null,
    );
  }
  // 3. A species that is zero in every balancing must vanish.
  const vanish = terms.map((t, j) => (ns.basis.every((b) => b[j] === 0n) ? j : -1)).filter((j) => j >= 0);
  if (vanish.length > 0) {
    const who = vanish.map((j) => speciesLabel(terms[j]!, j));
    return result(
      {
        status: 'impossible',
        reason: `${listWords(who)} would have to vanish: every balancing gives ${vanish.length > 1 ? 'them' : 'it'} coefficient 0.`,
        basis: basisText(ns.basis),
      },
      null,
    );
  }
  const example = positiveExample(ns, n);
  if (example === null) {
    let reason = 'No balancing has every coefficient positive: some species would have to change side.';
    if (k === 1) {
      const v = ns.basis[0]!;
      const pos = v.filter((x) => x > 0n).length;
      const oriented = pos * 2 >= v.length ? v : v.map((x) => -x);
      const flip = terms.map((_, j) => j).filter((j) => oriented[j]! < 0n);
      reason = `${listWords(flip.map((j) => speciesLabel(terms[j]!, j)))} would have to change side (the only balancing gives ${flip.length > 1 ? 'them' : 'it'} a negative coefficient).`;
    }
    return result({ status: 'impossible', reason, basis: basisText(ns.basis) }, null);
  }

  // 4. Balancing exists. Fixed coefficients choose among several (or set the scale).
  if (fixed.length > 0) {
    const solved = solveFixed(rows, terms, fixed);
    if (solved.status === 'balanced') return result({ status: 'balanced' }, solved.coefficients);
    return result(
      { status: 'multiple', dimension: solved.dimension, basis: basisText(solved.basis ?? []) },
      solved.coefficients,
    );
  }
  if (k === 1) {
    return result({ status: 'balanced' }, asGiven ? given : example!.map((x) => rat(x)));
  }
  if (asGiven) {
    warnings.push({
      code: 'other_balancings',
      message: `The coefficients as typed balance, but ${k} independent balancings exist for these species; see the basis.`,
    });
    return result({ status: 'balanced', basis: basisText(ns.basis) }, given);
  }
  return result({ status: 'multiple', basis: basisText(ns.basis) }, example ? example.map((x) => rat(x)) : null);
}
