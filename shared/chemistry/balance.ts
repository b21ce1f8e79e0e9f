/**
 * The balancer: from a parsed equation to a `Balancing` (the core's own answer; the API reply is
 * built from it by `balance-reply.ts`). The work is split into named steps, run in this order by
 * `balanceEquation`:
 *
 * 1. `readBalanceRequest`: check the fixed coefficients and the term to normalise to.
 * 2. `compositionMatrix` and `conserves`: the conservation equations; do the typed coefficients balance?
 * 3. `integerNullspace`: every balancing (exact, in free-column form).
 * 4. `findPositiveBalancing`: is there a balancing with every coefficient positive, and if not, why?
 * 5. `chooseWithFixed` or `chooseAnswer`: the answer (as typed, smallest whole numbers, or fixed).
 * 6. `normalised` and `carriedEnthalpy`: rescale to 1 mol of a term; carry ΔH when proportional.
 * 7. `listedBasis`: the basis cut to the work limit.
 */
import { findPositiveCombination } from './cone';
import { compositionMatrix, conserves, matrixTotals, type CompositionMatrix } from './composition-matrix';
import { elementTotals } from './element-table';
import { BalanceInputError } from './errors';
import { DEFAULT_WORK_LIMITS, resolveWorkLimits } from './limits';
import { impossibleMessages, requestMessages, termLabel, warningMessages, type ChargeSigns } from './messages';
import { integerNullspace, primitive, type Nullspace } from './nullspace';
import { parseEquation, type ParseOptions } from './parse';
import { div, eq, mul, parseRational, rat, ratText, ratToNumber, type Rat } from './rational';
import type {
  BalanceStatus,
  Balancing,
  EnthalpyValue,
  ImpossibleReason,
  ParsedEquation,
  ParseWarning,
  SpeciesTerm,
} from './types';

/** Options of a balancing request (the API's `fixed` and `normaliseTo`), plus work limits. */
export interface BalanceOptions extends ParseOptions {
  /** Coefficients to hold, keyed by term index (from 0, input order), as exact text ("2", "1/2", "0.5"). */
  fixed?: Readonly<Record<string, string>>;
  /** Term index whose coefficient becomes 1 (the others follow as exact fractions). */
  normaliseTo?: number;
}

/**
 * Parses and balances an equation; see `balanceEquation` for the outcomes.
 * @throws EquationParseError for unreadable text; WorkLimitError over a work limit;
 *   BalanceInputError as `balanceEquation`.
 */
export function balanceEquationText(text: string, options: BalanceOptions = {}): Balancing {
  return balanceEquation(parseEquation(text, options), options);
}

/**
 * Balances a parsed equation.
 *
 * - Coefficients as typed balance → `balanced`, `asGiven: true` (coefficients kept as typed).
 * - Exactly one balancing up to scale → `balanced` with the smallest whole numbers.
 * - Several independent balancings → `multiple` with `dimension` and an integer `basis` (one
 *   vector per independent balancing, term order, positive = on the side written; at most
 *   `limits.maxBasisVectors` of them, `basisTruncated` and a warning saying when cut) and an
 *   example with all coefficients positive in `equation`; `fixed` picks one.
 * - None with all coefficients positive → `impossible` with the reason as data and in words.
 * `normaliseTo` rescales the answer so that term's coefficient is 1 (fractions such as 1/2 O2).
 * ΔH (kJ/mol, per mole of reaction as written) is carried into `equation.enthalpy` only when the
 * answer is a multiple of the equation as typed, scaled by the same factor; otherwise a warning
 * says it was dropped.
 *
 * @throws BalanceInputError (field "fixed.<index>", "normaliseTo" or "equation") for a bad index,
 *   a zero or negative fixed coefficient, fixed coefficients no balancing can have, or a ΔH that
 *   would leave the range of numbers when scaled.
 */
export function balanceEquation(reading: ParsedEquation, options: BalanceOptions = {}): Balancing {
  const limits = options.limits === undefined ? DEFAULT_WORK_LIMITS : resolveWorkLimits(options.limits);
  const terms = reading.terms;
  const request = readBalanceRequest(terms.length, options);
  const matrix = compositionMatrix(terms);
  const given = terms.map((t) => t.coefficient);
  const asGiven = conserves(matrix, given);
  const kernel = integerNullspace(matrix.rows, matrix.cols);

  const verdict = findPositiveBalancing(matrix, kernel, terms);
  const impossible = 'impossible' in verdict ? verdict.impossible : null;
  const answer: Answer =
    'impossible' in verdict
      ? { status: 'impossible', coefficients: null, dimension: kernel.basis.length, basis: verdict.basis }
      : request.fixed.length > 0
        ? chooseWithFixed(matrix, terms, request.fixed)
        : chooseAnswer(kernel, verdict.example, asGiven, given);

  const warnings: ParseWarning[] = [];
  const coefficients = answer.coefficients ? normalised(answer.coefficients, request.normaliseTo) : given;
  const enthalpy =
    answer.coefficients && reading.enthalpy
      ? carriedEnthalpy(reading.enthalpy, given, coefficients, asGiven, request, warnings)
      : null;
  if (answer.status === 'balanced' && asGiven && answer.basis.length > 0) {
    warnings.push({ code: 'other_balancings', message: warningMessages.otherBalancings(answer.basis.length) });
  }
  const { basis, truncated } = listedBasis(answer.basis, limits.maxBasisVectors, warnings);

  return {
    status: answer.status,
    reading,
    equation: {
      terms: terms.map((t, j) => ({
        species: t.species,
        side: t.side,
        coefficient: coefficients[j]!,
        coefficientWritten: true,
      })),
      enthalpy,
      equilibrium: reading.equilibrium,
    },
    asGiven,
    givenTotals: asGiven ? null : (matrixTotals(matrix, terms, given) ?? elementTotals(terms)),
    dimension: answer.dimension,
    basis,
    basisTruncated: truncated,
    impossible,
    warnings,
  };
}

// ----- 1. The request -------------------------------------------------------------------------

interface FixedValue {
  index: number;
  key: string;
  value: Rat;
}

interface BalanceRequest {
  fixed: FixedValue[];
  normaliseTo: number | undefined;
  /** The request field a ΔH overflow is blamed on. */
  scalingField: string;
}

/** Checks `fixed` and `normaliseTo` against the number of terms. */
export function readBalanceRequest(n: number, options: BalanceOptions): BalanceRequest {
  const fixed: FixedValue[] = [];
  for (const [key, text] of Object.entries(options.fixed ?? {})) {
    const field = `fixed.${key}`;
    if (!/^\d+$/.test(key)) throw new BalanceInputError(requestMessages.termIndexNotWhole(key), field);
    const index = Number(key);
    if (index >= n) throw new BalanceInputError(requestMessages.noSuchTerm(index, n), field);
    const value = parseRational(String(text));
    if (value === null) throw new BalanceInputError(requestMessages.notExact(String(text)), field);
    if (value.n === 0n) throw new BalanceInputError(requestMessages.fixedZero(index), field);
    if (value.n < 0n) throw new BalanceInputError(requestMessages.fixedNegative(index), field);
    fixed.push({ index, key, value });
  }
  fixed.sort((a, b) => a.index - b.index);
  const normaliseTo = options.normaliseTo;
  if (normaliseTo !== undefined && (!Number.isInteger(normaliseTo) || normaliseTo < 0 || normaliseTo >= n)) {
    throw new BalanceInputError(requestMessages.noSuchTerm(normaliseTo, n), 'normaliseTo');
  }
  const scalingField =
    normaliseTo !== undefined ? 'normaliseTo' : fixed.length > 0 ? `fixed.${fixed[0]!.key}` : 'equation';
  return { fixed, normaliseTo, scalingField };
}

// ----- 4. Is there a positive balancing? ------------------------------------------------------

function label(terms: readonly SpeciesTerm[], j: number): string {
  return termLabel(terms[j]!.species.formula, terms[j]!.species.phase, j);
}

function chargeSigns(terms: readonly SpeciesTerm[], side: 'reactant' | 'product'): ChargeSigns {
  const charged = terms.find((t) => t.side === side && t.species.charge !== 0);
  return charged === undefined ? 'none' : charged.species.charge > 0 ? 'positive' : 'negative';
}

/** Whether a row has positive and negative entries (numbers or BigInts). */
function signsOf(row: ReadonlyArray<number> | ReadonlyArray<bigint>): { positive: boolean; negative: boolean } {
  let positive = false;
  let negative = false;
  for (const v of row) {
    if (v > 0) positive = true;
    else if (v < 0) negative = true;
  }
  return { positive, negative };
}

type Verdict = { example: bigint[] } | { impossible: ImpossibleReason; basis: bigint[][] };

/**
 * A balancing with every coefficient positive, or why none exists. Checks, in order: an element
 * or the charge on one side only; only the zero solution; a term that is 0 in every balancing;
 * then looks for a positive combination of the basis (exact simplex, `cone.ts`).
 */
export function findPositiveBalancing(
  matrix: CompositionMatrix,
  kernel: Nullspace,
  terms: readonly SpeciesTerm[],
): Verdict {
  const k = kernel.basis.length;
  const elements: Array<{ element: string; side: 'reactant' | 'product' }> = [];
  let charge: { reactants: ChargeSigns; products: ChargeSigns } | null = null;
  for (let r = 0; r < matrix.keys.length; r++) {
    const { positive, negative } = signsOf(matrix.rows[r]!);
    if (positive === negative) continue;
    const key = matrix.keys[r]!;
    if (key === 'charge')
      charge = { reactants: chargeSigns(terms, 'reactant'), products: chargeSigns(terms, 'product') };
    else elements.push({ element: key, side: positive ? 'reactant' : 'product' });
  }
  if (elements.length > 0 || charge !== null) {
    const sentences = elements.map((e) => impossibleMessages.elementOnOneSide(e.element, e.side));
    const c = charge as { reactants: ChargeSigns; products: ChargeSigns } | null;
    if (c) sentences.push(impossibleMessages.chargeOnOneSide(c.reactants, c.products));
    return { impossible: { kind: 'one_side', elements, charge: c, message: sentences.join(' ') }, basis: kernel.basis };
  }
  if (k === 0) {
    return {
      impossible: { kind: 'only_zero', conserved: matrix.keys, message: impossibleMessages.onlyZero(matrix.keys) },
      basis: [],
    };
  }
  const vanish: number[] = [];
  for (let j = 0; j < terms.length; j++) if (kernel.basis.every((b) => b[j] === 0n)) vanish.push(j);
  if (vanish.length > 0) {
    const message = impossibleMessages.mustVanish(vanish.map((j) => label(terms, j)));
    return { impossible: { kind: 'must_vanish', terms: vanish, message }, basis: kernel.basis };
  }
  const example = positiveExample(kernel);
  if (example !== null) return { example };
  if (k === 1) {
    const v = kernel.basis[0]!;
    const positives = v.filter((x) => x > 0n).length;
    const oriented = positives * 2 >= v.length ? v : v.map((x) => -x);
    const flip = terms.map((_, j) => j).filter((j) => oriented[j]! < 0n);
    const message = impossibleMessages.mustChangeSide(flip.map((j) => label(terms, j)));
    return { impossible: { kind: 'must_change_side', terms: flip, message }, basis: kernel.basis };
  }
  return {
    impossible: { kind: 'no_positive_balancing', message: impossibleMessages.noPositiveBalancing() },
    basis: kernel.basis,
  };
}

/**
 * A balancing with every coefficient positive (primitive integers), or null if none exists. The
 * basis is in free-column form, so with x = Σ c_f b_f the free entries are positive multiples of
 * c_f and the search is a small exact LP on the pivot rows.
 */
export function positiveExample(kernel: Nullspace): bigint[] | null {
  const { basis } = kernel;
  if (basis.length === 0) return null;
  const n = basis[0]!.length;
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
  const pivotRows = kernel.pivots.map((p) => basis.map((b) => b[p]!));
  const c = findPositiveCombination(pivotRows, basis.length);
  if (c === null) return null;
  const x = new Array<bigint>(n).fill(0n);
  basis.forEach((b, l) => {
    for (let j = 0; j < n; j++) x[j]! += b[j]! * c[l]!;
  });
  return primitive(x);
}

// ----- 5. The answer --------------------------------------------------------------------------

interface Answer {
  status: BalanceStatus;
  /** The coefficients found (null: keep those as typed). */
  coefficients: Rat[] | null;
  dimension: number;
  /** Every independent balancing (cut to the limit later). */
  basis: bigint[][];
}

/** Without fixed coefficients: as typed when they balance, else the smallest whole numbers or an example. */
function chooseAnswer(kernel: Nullspace, example: bigint[], asGiven: boolean, given: Rat[]): Answer {
  const k = kernel.basis.length;
  if (k === 1)
    return { status: 'balanced', coefficients: asGiven ? given : wholeNumbers(example), dimension: 1, basis: [] };
  if (asGiven) return { status: 'balanced', coefficients: given, dimension: k, basis: kernel.basis };
  return { status: 'multiple', coefficients: wholeNumbers(example), dimension: k, basis: kernel.basis };
}

function wholeNumbers(v: readonly bigint[]): Rat[] {
  return v.map((x) => rat(x));
}

/** A homogenised vector (last entry t) as the coefficients x / t. */
function scaledToT(v: readonly bigint[], n: number): Rat[] {
  return v.slice(0, n).map((x) => rat(x, v[n]!));
}

/**
 * With fixed coefficients: each fixed value x_i = p/q adds the row q·x_i − p·t = 0 (homogenised
 * with t); balancings with t ≠ 0 keep the fixed values. Checked one value at a time, so the
 * refusal names the first value no balancing (or no positive one) can have.
 */
export function chooseWithFixed(
  matrix: CompositionMatrix,
  terms: readonly SpeciesTerm[],
  fixed: readonly FixedValue[],
): Answer {
  const n = terms.length;
  const augmented: bigint[][] = (matrix.rows as ReadonlyArray<ReadonlyArray<number | bigint>>).map((r) => [
    ...r.map((v) => BigInt(v)),
    0n,
  ]);
  let kernel: Nullspace | null = null;
  for (let f = 0; f < fixed.length; f++) {
    const { index, key, value } = fixed[f]!;
    const row = new Array<bigint>(n + 1).fill(0n);
    row[index] = value.d;
    row[n] = -value.n;
    augmented.push(row);
    kernel = integerNullspace(augmented, n + 1);
    const others = fixed.slice(0, f).map((o) => `term ${o.index} = ${ratText(o.value)}`);
    const field = `fixed.${key}`;
    if (!kernel.basis.some((v) => v[n] !== 0n)) {
      throw new BalanceInputError(
        requestMessages.noBalancingWithFixed(ratText(value), label(terms, index), others),
        field,
      );
    }
    if (positiveExample(kernel) === null) {
      throw new BalanceInputError(
        requestMessages.fixedForcesNonPositive(ratText(value), label(terms, index), others),
        field,
      );
    }
  }
  const k = kernel!;
  // Directions that keep the fixed values: kernel vectors with t = 0 after eliminating t.
  const pivot = k.basis.find((v) => v[n] !== 0n)!;
  const free = k.basis
    .filter((v) => v !== pivot)
    .map((v) => primitive(v.map((x, j) => x * pivot[n]! - pivot[j]! * v[n]!)).slice(0, n));
  if (free.length === 0) return { status: 'balanced', coefficients: scaledToT(pivot, n), dimension: 0, basis: [] };
  const example = positiveExample(k);
  return {
    status: 'multiple',
    coefficients: example ? scaledToT(example, n) : null,
    dimension: free.length,
    basis: free,
  };
}

// ----- 6. Normalising and ΔH ------------------------------------------------------------------

/** The coefficients divided by that of term `index` (so it becomes 1), or unchanged. */
function normalised(coefficients: Rat[], index: number | undefined): Rat[] {
  if (index === undefined) return coefficients;
  const pivot = coefficients[index]!;
  return coefficients.map((c) => div(c, pivot));
}

/**
 * ΔH of the answer: the typed ΔH times the factor between the answer and the typed coefficients,
 * when the answer is such a multiple and the typed coefficients balance; otherwise null with an
 * `enthalpy_not_carried` warning.
 * @throws BalanceInputError when the scaled ΔH or its uncertainty is not a finite number.
 */
function carriedEnthalpy(
  stated: EnthalpyValue,
  given: readonly Rat[],
  coefficients: readonly Rat[],
  asGiven: boolean,
  request: BalanceRequest,
  warnings: ParseWarning[],
): EnthalpyValue | null {
  const factor = div(coefficients[0]!, given[0]!);
  const proportional = asGiven && coefficients.every((c, j) => eq(c, mul(factor, given[j]!)));
  if (!proportional) {
    warnings.push({ code: 'enthalpy_not_carried', message: warningMessages.enthalpyNotCarried() });
    return null;
  }
  const f = ratToNumber(factor);
  const value = stated.value * f;
  const uncertainty = stated.uncertainty === undefined ? undefined : stated.uncertainty * Math.abs(f);
  if (!Number.isFinite(value) || (uncertainty !== undefined && !Number.isFinite(uncertainty))) {
    throw new BalanceInputError(
      requestMessages.enthalpyOverflow(`Scaling the equation by ${ratText(factor)}`),
      request.scalingField,
    );
  }
  return { value, ...(uncertainty === undefined ? {} : { uncertainty }), stated: stated.stated };
}

// ----- 7. The basis, cut to the limit ---------------------------------------------------------

function listedBasis(
  basis: bigint[][],
  max: number,
  warnings: ParseWarning[],
): { basis: bigint[][]; truncated: boolean } {
  if (basis.length <= max) return { basis, truncated: false };
  warnings.push({ code: 'basis_truncated', message: warningMessages.basisTruncated(basis.length, max) });
  return { basis: basis.slice(0, max), truncated: true };
}
