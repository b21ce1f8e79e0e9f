import Fraction from 'fraction.js';
import type { BalanceResult } from '../schemas/balance';
import { parseFormula } from './parse';
import { mul, parseRational, rat, ratText, ratToNumber, type Rat } from './rational';
import type { EnthalpyValue, EquationModel, Side } from './types';

const flip = (s: Side): Side => (s === 'reactant' ? 'product' : 'reactant');

/**
 * The reverse reaction: products become reactants (products listed first) and ΔH changes sign
 * (Hess's law: ΔH(reverse) = −ΔH(forward)). Pure: returns a new model. Only `terms` and
 * `enthalpy` change; fields describing the original text (a ParsedEquation's `source`,
 * `heatTerms`, `statedEnthalpy`) are carried over unchanged.
 */
export function reverseEquation<T extends EquationModel>(eq: T): T {
  const terms = [...eq.terms.filter((t) => t.side === 'product'), ...eq.terms.filter((t) => t.side === 'reactant')].map(
    (t) => ({
      ...t,
      side: flip(t.side),
    }),
  );
  const enthalpy: EnthalpyValue | null = eq.enthalpy
    ? { ...eq.enthalpy, value: -eq.enthalpy.value, stated: { ...eq.enthalpy.stated, value: -eq.enthalpy.stated.value } }
    : null;
  return { ...eq, terms, enthalpy };
}

function readFactor(factor: Fraction | string | number): Rat {
  let r: Rat | null;
  if (factor instanceof Fraction) r = rat(BigInt(factor.s) * BigInt(factor.n), BigInt(factor.d));
  else if (typeof factor === 'number') r = parseRational(new Fraction(factor).toFraction());
  else r = parseRational(factor);
  if (r === null) throw new RangeError(`'${String(factor)}' is not an exact number such as 2, 1/2 or 0.5`);
  return r;
}

/**
 * Multiplies every coefficient by an exact positive factor and ΔH by the same factor
 * (ΔH is extensive in the extent of reaction). A negative factor reverses the equation.
 * @throws RangeError for a zero or unreadable factor.
 */
export function scaleEquation<T extends EquationModel>(eq: T, factor: Fraction | string | number): T {
  const f = readFactor(factor);
  if (f.n === 0n) throw new RangeError('cannot scale an equation by zero');
  if (f.n < 0n) return scaleEquation(reverseEquation(eq), ratText({ n: -f.n, d: f.d }));
  const x = ratToNumber(f);
  const terms = eq.terms.map((t) => ({ ...t, coefficient: ratText(mul(parseRational(t.coefficient)!, f)) }));
  const enthalpy: EnthalpyValue | null = eq.enthalpy
    ? {
        ...eq.enthalpy,
        value: eq.enthalpy.value * x,
        ...(eq.enthalpy.uncertainty === undefined ? {} : { uncertainty: eq.enthalpy.uncertainty * x }),
        stated: { ...eq.enthalpy.stated, value: eq.enthalpy.stated.value * x },
      }
    : null;
  return { ...eq, terms, enthalpy };
}

/** Rebuilds an `EquationModel` from a balance reply (re-reading each term's formula). */
export function equationFromBalanceResult(result: BalanceResult): EquationModel {
  return {
    terms: result.terms.map((t) => {
      const { warnings: _w, ...species } = parseFormula(t.formula);
      return {
        species: {
          ...species,
          phase: t.phase as EquationModel['terms'][number]['species']['phase'],
          descriptor: t.descriptor,
        },
        side: t.side,
        coefficient: t.coefficient,
        coefficientWritten: true,
      };
    }),
    enthalpy: result.enthalpy
      ? {
          value: result.enthalpy.value,
          ...(result.enthalpy.uncertainty === undefined ? {} : { uncertainty: result.enthalpy.uncertainty }),
          stated: { value: result.enthalpy.value, unit: 'kJ', perMol: true },
        }
      : null,
  };
}
