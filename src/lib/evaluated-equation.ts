/**
 * The equation the enthalpy panel sends: the balanced equation exactly as the workbench shows it
 * (after the user's reverse and scale), without any ΔH typed with it (the library gives ΔH), and
 * the identity of each term in the order the text lists them. Pure.
 */
import { formatEquation, type EquationModel } from '@shared/chemistry/index';
import { identityOf, type SpeciesIdentity } from './species-suggestions';

export function evaluatedEquation(model: EquationModel & { equilibrium?: boolean }): {
  text: string;
  terms: SpeciesIdentity[];
} {
  const text = formatEquation({ ...model, enthalpy: null }, 'text');
  // formatEquation writes reactants first, then products, each in model order.
  const ordered = [
    ...model.terms.filter((t) => t.side === 'reactant'),
    ...model.terms.filter((t) => t.side === 'product'),
  ];
  return { text, terms: ordered.map((t) => identityOf(t.species)) };
}
