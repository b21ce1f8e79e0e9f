import Fraction from 'fraction.js';
import { molarMass } from '../molar-mass';
import type { ParsedSpecies } from '../types';
import { ratText } from '../rational';
import { CalorimetryInputError, type FieldPath } from './errors';
import type { Measured } from './measured';
import { propagate, type Propagation } from './propagation';

/*
 * The combustion of a C, H, O, N, S compound in a bomb, written per mole of sample:
 *   CₐH_bO_cN_dS_s + x O₂ → a CO₂(g) + w H₂O(l) + d/2 N₂(g) + s SO₂(g) or s H₂SO₄(aq),
 * with exact coefficients from the element balance (w = b/2, or b/2 − s when sulfur ends as
 * H₂SO₄; a negative w means water is taken from the bomb's water). Δn(gas) counts the gases of
 * the equation, products positive; for CₐH_bO_cN_d it is c/2 + d/2 − b/4 (domain notes §4).
 */

/** Where the sample's sulfur ends: the sulfuric acid of a rotating-bomb experiment, or sulfur dioxide. */
export type SulfurProduct = 'H2SO4(aq)' | 'SO2(g)';

/** Phase of the sample: crystalline solid, liquid or gas. */
export type SamplePhase = 'cr' | 'l' | 'g';

/** One term of the combustion equation; coefficients are signed (products > 0, reactants < 0). */
export interface CombustionTerm {
  /** Species key as the library writes it, e.g. `CO2(g)`, `H2O(l)`; the sample's `formula(phase)`. */
  key: string;
  coefficient: Fraction;
  gas: boolean;
  role: 'sample' | 'oxygen' | 'product';
}

export interface CombustionReaction {
  sample: {
    formula: string;
    hill: string;
    phase: SamplePhase;
    key: string;
    /** g/mol, CIAAW 2021 standard atomic weights, with its uncertainty. */
    molarMass: Measured;
  };
  terms: CombustionTerm[];
  /** Δn(gas) per mole of sample, exact. */
  deltaNGas: Fraction;
  /** The equation as text, e.g. `C7H6O2(cr) + 15/2 O2(g) -> 7 CO2(g) + 3 H2O(l)`. */
  equation: string;
}

const HANDLED = new Set(['C', 'H', 'O', 'N', 'S']);

function coefficientText(c: Fraction): string {
  const magnitude = c.abs();
  return magnitude.equals(1) ? '' : `${magnitude.toFraction()} `;
}

/**
 * The combustion equation of a sample (already read by the equation core's `parseFormula`).
 * @throws CalorimetryInputError (field `formula` under `path`) for a charged species or elements
 * other than C, H, O, N and S (their products need corrections of their own).
 */
export function combustionReaction(
  species: ParsedSpecies,
  phase: SamplePhase,
  sulfurProduct: SulfurProduct,
  path: FieldPath = ['sample'],
): CombustionReaction {
  if (species.charge !== 0 || species.electron)
    throw new CalorimetryInputError('The sample must be a neutral compound.', [...path, 'formula']);
  const others = Object.keys(species.composition).filter((e) => !HANDLED.has(e));
  if (others.length > 0)
    throw new CalorimetryInputError(
      `Only compounds of C, H, O, N and S are reduced here; ${others.join(', ')} would need products and corrections of their own.`,
      [...path, 'formula'],
    );
  const count = (e: string) => {
    const r = species.composition[e];
    return r ? new Fraction(ratText(r)) : new Fraction(0);
  };
  const [a, b, c, d, s] = ['C', 'H', 'O', 'N', 'S'].map(count) as [Fraction, Fraction, Fraction, Fraction, Fraction];
  const acid = sulfurProduct === 'H2SO4(aq)';
  const water = acid ? b.div(2).sub(s) : b.div(2);
  const sulfurOxygen = s.mul(acid ? 4 : 2);
  const oxygen = a.mul(2).add(water).add(sulfurOxygen).sub(c).div(2);
  const key = `${species.formula}(${phase})`;
  const terms: CombustionTerm[] = [{ key, coefficient: new Fraction(-1), gas: phase === 'g', role: 'sample' }];
  if (!oxygen.equals(0)) terms.push({ key: 'O2(g)', coefficient: oxygen.neg(), gas: true, role: 'oxygen' });
  if (!a.equals(0)) terms.push({ key: 'CO2(g)', coefficient: a, gas: true, role: 'product' });
  if (!water.equals(0)) terms.push({ key: 'H2O(l)', coefficient: water, gas: false, role: 'product' });
  if (!d.equals(0)) terms.push({ key: 'N2(g)', coefficient: d.div(2), gas: true, role: 'product' });
  if (!s.equals(0)) terms.push({ key: sulfurProduct, coefficient: s, gas: !acid, role: 'product' });
  const deltaNGas = terms.filter((t) => t.gas).reduce((sum, t) => sum.add(t.coefficient), new Fraction(0));
  const side = (sign: 1 | -1) =>
    terms
      .filter((t) => t.coefficient.compare(0) === sign)
      .map((t) => `${coefficientText(t.coefficient)}${t.key}`)
      .join(' + ');
  const m = molarMass(species.composition);
  return {
    sample: {
      formula: species.formula,
      hill: species.hill,
      phase,
      key,
      molarMass: { value: m.value, u: m.uncertainty },
    },
    terms,
    deltaNGas,
    equation: `${side(-1)} -> ${side(1)}`,
  };
}

/** A formation enthalpy used in the cycle: kJ/mol at 298.15 K and p° = 1 bar, with u (k = 1) or null. */
export interface FormationValue {
  value: number;
  u: number | null;
}

/** O₂(g) is an element in its reference state: ΔfH° = 0 exactly, not looked up. */
export const REFERENCE_OXYGEN = 'O2(g)';

/**
 * ΔfH° of the sample by Hess's law from its ΔcH° and the formation enthalpies of the other
 * species of the combustion equation (per mole of sample, 298.15 K, p° = 1 bar):
 *   ΔcH° = Σ νᵢ ΔfH°ᵢ  ⇒  ΔfH°(sample) = Σ_{i ≠ sample} νᵢ ΔfH°ᵢ − ΔcH°,
 * u² = u²(ΔcH°) + Σ νᵢ² u²(ΔfH°ᵢ) (independent values; domain notes §6). `deltaCH` is itself a
 * measurement model: pass its inputs so that they appear in the budget.
 * @throws CalorimetryInputError when a value for a species of the equation is missing.
 */
export function formationFromCombustion(
  reaction: CombustionReaction,
  values: ReadonlyMap<string, FormationValue>,
): { needed: string[]; terms: { key: string; coefficient: Fraction }[] } {
  const terms = reaction.terms
    .filter((t) => t.role === 'product' || (t.role === 'oxygen' && t.key !== REFERENCE_OXYGEN))
    .map((t) => ({ key: t.key, coefficient: t.coefficient }));
  const missing = terms.filter((t) => !values.has(t.key)).map((t) => t.key);
  if (missing.length > 0)
    throw new CalorimetryInputError(
      `No formation enthalpy for ${missing.join(', ')}: the Hess cycle to ΔfH° of the sample cannot be closed.`,
      ['sample'],
      'unprocessable',
    );
  return { needed: terms.map((t) => t.key), terms };
}

/** ΔfH°(sample) = Σ νᵢ ΔfH°ᵢ − ΔcH° as a plain propagation (ΔcH° given with its u). */
export function formationEnthalpy(
  reaction: CombustionReaction,
  deltaCH: Measured,
  values: ReadonlyMap<string, FormationValue>,
): Propagation {
  const { terms } = formationFromCombustion(reaction, values);
  return propagate(
    [
      { id: 'deltaCH', label: 'ΔcH° of the sample', value: deltaCH.value, u: deltaCH.u, unit: 'kJ/mol' },
      ...terms.map((t) => ({
        id: `formation.${t.key}`,
        label: `ΔfH° of ${t.key}`,
        value: values.get(t.key)!.value,
        u: values.get(t.key)!.u,
        unit: 'kJ/mol',
      })),
    ],
    (x) => terms.reduce((sum, t) => sum + t.coefficient.valueOf() * x[`formation.${t.key}`]!, 0) - x['deltaCH']!,
  );
}
