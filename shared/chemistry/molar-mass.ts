import { standardAtomicWeights } from './atomic-weights';
import { argumentMessages } from './messages';
import { ratToNumber } from './rational';
import type { Composition } from './types';

/** Molar mass with its uncertainty, in g/mol. */
export interface MolarMass {
  value: number;
  uncertainty: number;
  unit: 'g/mol';
  /** Elements with no standard atomic weight, counted at the mass number of their longest-lived isotope. */
  approximateElements: string[];
  /** Elements whose CIAAW weight is an interval, counted at the conventional value. */
  conventionalElements: string[];
}

/**
 * Molar mass M = Σ nᵢ Aᵣ(i) · 1 g/mol from the CIAAW 2021 standard atomic weights (see
 * atomic-weights.ts for the policy on interval elements and elements without a standard weight).
 * Uncertainty: atoms of one element are fully correlated (nᵢ·uᵢ), different elements are
 * combined in quadrature, u(M) = √Σ (nᵢ uᵢ)² (GUM, JCGM 100:2008, §5.1; treating the CIAAW
 * uncertainties as standard uncertainties is common practice, no source). The electron's mass is
 * neglected (an ion's molar mass is that of its atoms, as in the tables). Fractional formula units
 * count their exact atoms per unit: M(CaSO4·½H2O) = M(CaSO4) + ½ M(H2O).
 * @throws RangeError for an unknown symbol.
 */
export function molarMass(composition: Composition): MolarMass {
  let value = 0;
  let variance = 0;
  const approximateElements: string[] = [];
  const conventionalElements: string[] = [];
  for (const [symbol, exact] of Object.entries(composition)) {
    if (exact.n === 0n) continue;
    const count = ratToNumber(exact);
    const w = standardAtomicWeights[symbol];
    if (!w) throw new RangeError(argumentMessages.unknownSymbol(symbol));
    value += count * w.value;
    variance += (count * w.uncertainty) ** 2;
    if (w.kind === 'mass-number') approximateElements.push(symbol);
    if (w.kind === 'conventional') conventionalElements.push(symbol);
  }
  return { value, uncertainty: Math.sqrt(variance), unit: 'g/mol', approximateElements, conventionalElements };
}
