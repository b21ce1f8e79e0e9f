import { add, mul, ratOfInteger, ZERO, eq, type Rat } from './rational';
import type { ElementTotals, Side, SpeciesTerm } from './types';

/**
 * Totals of every element (in order of first appearance) and, when any term is charged, of the
 * charge (key "charge", in elementary charges) on each side: Σ coefficient × atoms per formula
 * unit, exact. `coefficients` (term order) replace the terms' own when given.
 */
export function elementTotals(terms: readonly SpeciesTerm[], coefficients?: readonly Rat[]): ElementTotals[] {
  const c = coefficients ?? terms.map((t) => t.coefficient);
  return wholeNumberTotals(terms, c) ?? exactTotals(terms, c);
}

/** True when every row of `elementTotals(terms, coefficients)` has equal sides. */
export function isBalanced(terms: readonly SpeciesTerm[], coefficients?: readonly Rat[]): boolean {
  return elementTotals(terms, coefficients).every((row) => eq(row.reactants, row.products));
}

function exactTotals(terms: readonly SpeciesTerm[], coefficients: readonly Rat[]): ElementTotals[] {
  const totals = new Map<string, { reactants: Rat; products: Rat }>();
  const bump = (key: string, side: Side, amount: Rat): void => {
    let row = totals.get(key);
    if (!row) totals.set(key, (row = { reactants: ZERO, products: ZERO }));
    if (side === 'reactant') row.reactants = add(row.reactants, amount);
    else row.products = add(row.products, amount);
  };
  terms.forEach((t, j) => {
    const c = coefficients[j]!;
    const composition = t.species.composition;
    for (const symbol in composition) bump(symbol, t.side, mul(c, composition[symbol]!));
  });
  if (terms.some((t) => t.species.charge !== 0)) {
    totals.set('charge', { reactants: ZERO, products: ZERO });
    terms.forEach((t, j) => {
      if (t.species.charge !== 0) bump('charge', t.side, mul(coefficients[j]!, ratOfInteger(t.species.charge)));
    });
  }
  return [...totals].map(([element, { reactants, products }]) => ({ element, reactants, products }));
}

// The same totals with plain numbers when every coefficient, count and charge is a whole number
// below 2^20 in size: products stay below 2^40 and sums of up to 1,000 of them below 2^50, exact in
// doubles. Null otherwise (the exact path runs instead).
const SMALL = 2n ** 20n;
function wholeNumberTotals(terms: readonly SpeciesTerm[], coefficients: readonly Rat[]): ElementTotals[] | null {
  if (terms.length > 1000) return null;
  const totals = new Map<string, [number, number]>();
  let charged = false;
  for (let j = 0; j < terms.length; j++) {
    const t = terms[j]!;
    const c = coefficients[j]!;
    if (c.d !== 1n || c.n >= SMALL || c.n <= -SMALL) return null;
    const k = t.side === 'reactant' ? 0 : 1;
    const composition = t.species.composition;
    for (const symbol in composition) {
      const count = composition[symbol]!;
      if (count.d !== 1n || count.n >= SMALL) return null;
      let row = totals.get(symbol);
      if (!row) totals.set(symbol, (row = [0, 0]));
      row[k] += Number(c.n) * Number(count.n);
    }
    if (t.species.charge !== 0) {
      if (Math.abs(t.species.charge) >= 2 ** 20) return null;
      charged = true;
    }
  }
  if (charged) {
    const row: [number, number] = [0, 0];
    terms.forEach((t, j) => (row[t.side === 'reactant' ? 0 : 1] += Number(coefficients[j]!.n) * t.species.charge));
    totals.set('charge', row);
  }
  const out: ElementTotals[] = [];
  for (const [element, [r, p]] of totals) {
    if (!Number.isSafeInteger(r) || !Number.isSafeInteger(p)) return null;
    out.push({ element, reactants: ratOfInteger(r), products: ratOfInteger(p) });
  }
  return out;
}
