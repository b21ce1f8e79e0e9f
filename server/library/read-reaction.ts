import Fraction from 'fraction.js';
import { balanceParsedEquation, ChemistryError, parseEquation } from '@shared/chemistry/index';

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
  /** The balanced equation as text. */
  equation: string;
  terms: ReactionTerm[];
  warnings: { code: string; message: string; term?: number }[];
}

/**
 * Parses and balances an equation. Coefficients as typed are kept when they balance; an
 * unbalanced equation is balanced when that is unique (said in a warning); several balancings or
 * none give 422 in words.
 * @throws EquationParseError (400) for unreadable text; ChemistryError `unprocessable` (422).
 */
export function readBalancedReaction(text: string): ReadReaction {
  const parsed = parseEquation(text);
  const result = balanceParsedEquation(parsed);
  if (result.status === 'impossible') {
    throw new ChemistryError('unprocessable', `This equation cannot be balanced: ${result.reason ?? ''}`.trim(), {
      status: result.status,
    });
  }
  if (result.status === 'multiple') {
    throw new ChemistryError(
      'unprocessable',
      `These species balance in ${result.dimension ?? 'several'} independent ways, so the reaction is not defined: write the coefficients (e.g. "${result.equation}").`,
      { status: result.status, dimension: result.dimension },
    );
  }
  const warnings: ReadReaction['warnings'] = result.warnings.map((w) => ({
    code: w.code,
    message: w.message,
    ...(w.term !== undefined ? { term: w.term } : {}),
  }));
  if (!result.asGiven) {
    warnings.push({
      code: 'balanced_first',
      message: `The equation as typed does not balance; it was balanced first: ${result.equation}.`,
    });
  }
  if (parsed.enthalpy) {
    warnings.push({
      code: 'stated_enthalpy_ignored',
      message: 'The ΔH written with the equation is not used here: the enthalpy comes from the library values.',
    });
  }
  return {
    equation: result.equation,
    terms: parsed.terms.map((t, index) => ({
      index,
      formula: t.species.formula,
      hill: t.species.hill,
      charge: t.species.charge,
      phase: t.species.phase,
      descriptor: t.species.descriptor,
      elements: Object.keys(t.species.composition),
      side: t.side,
      coefficient: new Fraction(result.terms[index]!.coefficient),
    })),
    warnings,
  };
}
