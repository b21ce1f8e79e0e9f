import Fraction from 'fraction.js';
import { argumentMessages } from './messages';
import { mul, parseRational, rat, ratToNumber, type Rat } from './rational';
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
    (t) => ({ ...t, side: flip(t.side) }),
  );
  const enthalpy: EnthalpyValue | null = eq.enthalpy
    ? { ...eq.enthalpy, value: -eq.enthalpy.value, stated: { ...eq.enthalpy.stated, value: -eq.enthalpy.stated.value } }
    : null;
  return { ...eq, terms, enthalpy };
}

/** Reads a factor given as a Fraction, exact text ("1/2", "0.5") or a number (converted exactly as fraction.js reads it). */
export function readFactor(factor: Fraction | Rat | string | number): Rat {
  let r: Rat | null;
  if (factor instanceof Fraction) r = rat(BigInt(factor.s) * BigInt(factor.n), BigInt(factor.d));
  else if (typeof factor === 'object') r = factor;
  else if (typeof factor === 'number') r = parseRational(new Fraction(factor).toFraction());
  else r = parseRational(factor);
  if (r === null) throw new RangeError(argumentMessages.notExactFactor(String(factor)));
  return r;
}

/**
 * Multiplies every coefficient by an exact factor and ΔH (kJ/mol of reaction as written) by the
 * same factor, since ΔH is extensive in the extent of reaction. A negative factor reverses the
 * equation.
 * @throws RangeError for a zero or unreadable factor, or when ΔH would not be a finite number.
 */
export function scaleEquation<T extends EquationModel>(eq: T, factor: Fraction | Rat | string | number): T {
  const f = readFactor(factor);
  if (f.n === 0n) throw new RangeError(argumentMessages.zeroFactor());
  if (f.n < 0n) return scaleEquation(reverseEquation(eq), { n: -f.n, d: f.d });
  const x = ratToNumber(f);
  const terms = eq.terms.map((t) => ({ ...t, coefficient: mul(t.coefficient, f) }));
  let enthalpy: EnthalpyValue | null = null;
  if (eq.enthalpy) {
    enthalpy = {
      ...eq.enthalpy,
      value: eq.enthalpy.value * x,
      ...(eq.enthalpy.uncertainty === undefined ? {} : { uncertainty: eq.enthalpy.uncertainty * x }),
      stated: { ...eq.enthalpy.stated, value: eq.enthalpy.stated.value * x },
    };
    if (!Number.isFinite(enthalpy.value) || !Number.isFinite(enthalpy.uncertainty ?? 0)) {
      throw new RangeError(argumentMessages.scaledEnthalpyNotFinite());
    }
  }
  return { ...eq, terms, enthalpy };
}
