/**
 * What the workbench shows for a balance reply: the equation after the user's reverse/scale,
 * its element table, a status summary and molar masses. Pure functions over the shared core:
 * the species come from the browser's own reading of the text, the numbers from the typed reply.
 */
import {
  elementTotals,
  gcdBigInt,
  molarMass,
  parseRational,
  ratText,
  reverseEquation,
  scaleEquation,
  type EquationModel,
  type ParsedEquation,
  type Rat,
  type SpeciesTerm,
} from '@shared/chemistry/index';
import type { BalanceResult } from '@shared/schemas/balance';

/** A balance reply together with the reading of the text it answers (same terms, same order). */
export interface BalanceOutcome {
  reading: ParsedEquation;
  reply: BalanceResult;
}

export interface Transforms {
  reversed: boolean;
  /** Exact positive factor as typed ("2", "1/2", "0.5"). */
  factor: string;
}

/** Reads a scale factor: a positive exact number. Returns the canonical text or a message. */
export function readFactor(text: string): { ok: true; value: string } | { ok: false; message: string } {
  const r = parseRational(text);
  if (r === null) return { ok: false, message: 'Write an exact number such as 2, 1/2 or 0.5.' };
  if (r.n <= 0n)
    return { ok: false, message: 'The factor must be greater than zero (use Reverse to turn the equation round).' };
  return { ok: true, value: ratText(r) };
}

/**
 * The reply's answer as an equation model: the reading's species with the reply's exact
 * coefficients and ΔH. Null when the reply does not belong to the reading (different terms).
 */
export function answerModel({ reading, reply }: BalanceOutcome): EquationModel | null {
  if (reply.terms.length !== reading.terms.length) return null;
  const coefficients: Rat[] = [];
  for (const [j, term] of reply.terms.entries()) {
    const c = parseRational(term.coefficient);
    if (c === null || term.side !== reading.terms[j]!.side) return null;
    coefficients.push(c);
  }
  const enthalpy = reply.enthalpy
    ? {
        value: reply.enthalpy.value,
        ...(reply.enthalpy.uncertainty === undefined ? {} : { uncertainty: reply.enthalpy.uncertainty }),
        stated: { value: reply.enthalpy.value, unit: 'kJ' as const, perMol: true },
      }
    : null;
  return {
    terms: reading.terms.map((t, j) => ({ ...t, coefficient: coefficients[j]!, coefficientWritten: true })),
    enthalpy,
    equilibrium: reading.equilibrium,
  };
}

/**
 * The balanced equation as shown after reverse and scale, or null when there is no single
 * balancing to show (or the factor would make ΔH too large to show).
 */
export function displayedEquation(outcome: BalanceOutcome, transforms: Transforms): EquationModel | null {
  if (outcome.reply.status !== 'balanced') return null;
  let model = answerModel(outcome);
  if (model === null) return null;
  if (transforms.reversed) model = reverseEquation(model);
  const factor = readFactor(transforms.factor);
  if (factor.ok && factor.value !== '1') {
    try {
      model = scaleEquation(model, factor.value);
    } catch {
      return null;
    }
  }
  return model;
}

/** One row of the element table: exact totals as text, and whether the sides differ. */
export interface BalanceRow {
  element: string;
  reactants: string;
  products: string;
  mismatch: boolean;
}

/** Element table rows of the terms with their coefficients, flagging the rows whose sides differ. */
export function balanceRows(terms: readonly SpeciesTerm[]): BalanceRow[] {
  return elementTotals(terms).map((row) => {
    const reactants = ratText(row.reactants);
    const products = ratText(row.products);
    return { element: row.element, reactants, products, mismatch: reactants !== products };
  });
}

/** The reply's per-element totals of the coefficients as typed, as table rows. */
export function givenRows(reply: BalanceResult): BalanceRow[] | null {
  return reply.givenImbalance?.map((r) => ({ ...r, mismatch: r.reactants !== r.products })) ?? null;
}

/** True when the coefficients are whole numbers with no common factor (what "balanced" usually means). */
export function smallestWholeNumbers(coefficients: readonly Rat[]): boolean {
  if (coefficients.some((c) => c.d !== 1n || c.n <= 0n)) return false;
  return coefficients.reduce((g, c) => gcdBigInt(g, c.n), 0n) === 1n;
}

export type StatusTone = 'success' | 'warning' | 'error';

/** A status chip's tone, label and a sentence of detail. */
export function statusSummary(reply: BalanceResult): { tone: StatusTone; label: string; detail: string } {
  switch (reply.status) {
    case 'balanced': {
      if (reply.asGiven)
        return {
          tone: 'success',
          label: 'Balanced as written',
          detail: 'Your coefficients conserve every element and the charge.',
        };
      const coefficients = reply.terms.map((t) => parseRational(t.coefficient));
      const whole = coefficients.every((c) => c !== null) && smallestWholeNumbers(coefficients as Rat[]);
      return {
        tone: 'success',
        label: 'Balanced',
        detail: whole
          ? 'Smallest whole-number coefficients that conserve every element and the charge.'
          : 'Exact coefficients that conserve every element and the charge.',
      };
    }
    case 'multiple': {
      const d = reply.dimension ?? reply.basis?.length ?? 0;
      return {
        tone: 'warning',
        label: `Several balancings (${d} independent)`,
        detail: `Any positive combination of the ${d} basis reactions below balances. Fix ${Math.max(d - 1, 1)} coefficient${d - 1 === 1 ? '' : 's'} to choose one.`,
      };
    }
    case 'impossible':
      return {
        tone: 'error',
        label: 'Cannot be balanced',
        detail: reply.reason ?? 'No positive coefficients conserve every element and the charge.',
      };
  }
}

/**
 * A value with its uncertainty rounded together: the uncertainty to two significant digits and
 * the value to the same decimal place (common practice, no source), e.g. 44.0095 ± 0.0010.
 */
export function formatWithUncertainty(value: number, uncertainty: number): string {
  if (!Number.isFinite(uncertainty) || uncertainty <= 0) return value.toFixed(4);
  const decimals = Math.max(0, 1 - Math.floor(Math.log10(uncertainty)));
  return `${value.toFixed(decimals)} ± ${uncertainty.toFixed(decimals)}`;
}

export interface MolarMassRow {
  index: number;
  /** Molar mass text in g/mol, or null for the electron (not counted). */
  text: string | null;
  /** Why the figure is approximate, when it is. */
  note: string | null;
}

/** Molar masses of the terms (per formula unit as written), in input order. */
export function molarMassRows(terms: readonly SpeciesTerm[]): MolarMassRow[] {
  return terms.map((t, index) => {
    if (t.species.electron || Object.keys(t.species.composition).length === 0)
      return { index, text: null, note: 'electron: mass neglected' };
    try {
      const m = molarMass(t.species.composition);
      const notes: string[] = [];
      if (m.approximateElements.length > 0)
        notes.push(
          `${m.approximateElements.join(', ')}: no standard atomic weight, mass number of the longest-lived isotope used`,
        );
      if (m.conventionalElements.length > 0)
        notes.push(`${m.conventionalElements.join(', ')}: conventional value of an interval weight`);
      return {
        index,
        text: formatWithUncertainty(m.value, m.uncertainty),
        note: notes.length > 0 ? notes.join('; ') : null,
      };
    } catch (error) {
      return { index, text: null, note: error instanceof Error ? error.message : 'not available' };
    }
  });
}
