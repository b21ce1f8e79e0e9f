/**
 * What the workbench shows for a balance reply: the equation after the user's reverse/scale,
 * its element table, a status summary and molar masses. Pure functions over the shared core.
 */
import {
  elementBalanceTable,
  equationFromBalanceResult,
  molarMass,
  reverseEquation,
  scaleEquation,
  type BalanceResult,
  type BalanceRow,
  type CountedTerm,
  type EquationModel,
  type SpeciesTerm,
} from '@shared/chemistry/index';
import { parseRational } from '@shared/chemistry/rational';

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
  return { ok: true, value: r.d === 1n ? String(r.n) : `${r.n}/${r.d}` };
}

/**
 * The balanced equation as shown, or null when there is no single balancing to show.
 * `equilibrium` keeps the typed ⇌ arrow (the balance reply does not carry it).
 */
export function displayedEquation(
  result: BalanceResult,
  transforms: Transforms,
  equilibrium = false,
): (EquationModel & { equilibrium: boolean }) | null {
  if (result.status !== 'balanced') return null;
  let model: EquationModel & { equilibrium: boolean } = { ...equationFromBalanceResult(result), equilibrium };
  if (transforms.reversed) model = reverseEquation(model);
  const factor = readFactor(transforms.factor);
  if (factor.ok && factor.value !== '1') model = scaleEquation(model, factor.value);
  return model;
}

/** Terms as the element table counts them. */
export function countedTerms(terms: readonly SpeciesTerm[]): CountedTerm[] {
  return terms.map((t) => ({
    composition: t.species.composition,
    charge: t.species.charge,
    side: t.side,
    coefficient: t.coefficient,
  }));
}

/** Element table rows with a flag for the rows whose sides differ. */
export function balanceRows(terms: readonly SpeciesTerm[]): Array<BalanceRow & { mismatch: boolean }> {
  return elementBalanceTable(countedTerms(terms)).map((row) => ({ ...row, mismatch: row.reactants !== row.products }));
}

function gcd(a: number, b: number): number {
  return b === 0 ? a : gcd(b, a % b);
}

/** True when the coefficients are whole numbers with no common factor (what "balanced" usually means). */
export function smallestWholeNumbers(coefficients: readonly string[]): boolean {
  if (coefficients.some((c) => !/^\d+$/.test(c))) return false;
  return coefficients.map(Number).reduce(gcd, 0) === 1;
}

export type StatusTone = 'success' | 'warning' | 'error';

/** A status chip's tone, label and a sentence of detail. */
export function statusSummary(result: BalanceResult): { tone: StatusTone; label: string; detail: string } {
  switch (result.status) {
    case 'balanced':
      return result.asGiven
        ? {
            tone: 'success',
            label: 'Balanced as written',
            detail: 'Your coefficients conserve every element and the charge.',
          }
        : {
            tone: 'success',
            label: 'Balanced',
            detail: smallestWholeNumbers(result.terms.map((t) => t.coefficient))
              ? 'Smallest whole-number coefficients that conserve every element and the charge.'
              : 'Exact coefficients that conserve every element and the charge.',
          };
    case 'multiple': {
      const d = result.dimension ?? result.basis?.length ?? 0;
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
        detail: result.reason ?? 'No positive coefficients conserve every element and the charge.',
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

/** Molar masses of the terms, in input order. */
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
