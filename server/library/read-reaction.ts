import Fraction from 'fraction.js';
import {
  balanceEquation,
  ChemistryError,
  formatEquation,
  parseEquation,
  ratText,
  type Rat,
} from '@shared/chemistry/index';

/**
 * An equation read and balanced for evaluation against the library: each term with its species
 * as written and its exact coefficient in the balanced equation.
 */
export interface ReactionTerm {
  /** Term index, from 0 in input order. */
  index: number;
  formula: string;
  hill: string;
  charge: number;
  phase: string | null;
  descriptor: string | null;
  elements: string[];
  side: 'reactant' | 'product';
  /** Coefficient in the balanced equation (positive). */
  coefficient: Fraction;
}

export interface ReadReaction {
  /** The balanced equation as text (without any ΔH written with it). */
  equation: string;
  terms: ReactionTerm[];
  warnings: { code: string; message: string; term?: number }[];
}

/** The core's exact rational as a fraction.js Fraction (the combiner and thermo core's number type). */
export function fractionOf(r: Rat): Fraction {
  return new Fraction(ratText(r));
}

/**
 * Parses and balances an equation. Coefficients as typed are kept when they balance; an
 * unbalanced equation is balanced when that is unique (said in a warning); several balancings or
 * none give 422 in words.
 * @throws EquationParseError (400) for unreadable text; ChemistryError `unprocessable` (422).
 */
export function readBalancedReaction(text: string): ReadReaction {
  const parsed = parseEquation(text);
  const balancing = balanceEquation(parsed, {});
  if (balancing.status === 'impossible') {
    throw new ChemistryError(
      'unprocessable',
      `This equation cannot be balanced: ${balancing.impossible?.message ?? 'no balancing exists'}`,
      { status: balancing.status },
    );
  }
  const equation = formatEquation({ ...balancing.equation, enthalpy: null }, 'text');
  if (balancing.status === 'multiple') {
    throw new ChemistryError(
      'unprocessable',
      `These species balance in ${balancing.dimension} independent ways, so the reaction is not defined: write the coefficients (e.g. "${equation}").`,
      { status: balancing.status, dimension: balancing.dimension },
    );
  }
  const warnings: ReadReaction['warnings'] = [...parsed.warnings, ...balancing.warnings].map((w) => ({
    code: w.code,
    message: w.message,
    ...(w.term !== undefined ? { term: w.term } : {}),
  }));
  if (!balancing.asGiven) {
    warnings.push({
      code: 'balanced_first',
      message: `The equation as typed does not balance; it was balanced first: ${equation}.`,
    });
  }
  if (parsed.enthalpy) {
    warnings.push({
      code: 'stated_enthalpy_ignored',
      message: 'The ΔH written with the equation is not used here: the enthalpy comes from the library values.',
    });
  }
  return {
    equation,
    terms: balancing.equation.terms.map((t, index) => ({
      index,
      formula: t.species.formula,
      hill: t.species.hill,
      charge: t.species.charge,
      phase: t.species.phase,
      descriptor: t.species.descriptor,
      elements: Object.keys(t.species.composition),
      side: t.side,
      coefficient: fractionOf(t.coefficient),
    })),
    warnings,
  };
}
