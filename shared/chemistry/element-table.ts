import { parseRational, rat, ratText, add, mul, ZERO, type Rat } from './rational';
import type { Composition, Side } from './types';

/** A term with its coefficient, as `elementBalanceTable` needs it. */
export interface CountedTerm {
  composition: Composition;
  charge: number;
  side: Side;
  /** Exact fraction text ("2", "1/2"). */
  coefficient: string;
}

/** One row: an element symbol (or "charge") and its total on each side, as exact fraction text. */
export interface BalanceRow {
  element: string;
  reactants: string;
  products: string;
}

/**
 * Totals of every element (in order of first appearance) and, when any term is charged, of the
 * charge ("charge" row, in elementary charges), on each side: Σ coefficient × count.
 * Throws RangeError on an unreadable coefficient.
 */
export function elementBalanceTable(terms: readonly CountedTerm[]): BalanceRow[] {
  if (terms.every((t) => /^\d{1,9}$/.test(t.coefficient))) return wholeNumberTable(terms);
  const totals = new Map<string, { reactants: Rat; products: Rat }>();
  let charged = false;
  const bump = (key: string, side: Side, amount: Rat): void => {
    const row = totals.get(key) ?? { reactants: ZERO, products: ZERO };
    if (side === 'reactant') row.reactants = add(row.reactants, amount);
    else row.products = add(row.products, amount);
    totals.set(key, row);
  };
  for (const t of terms) {
    const c = parseRational(t.coefficient);
    if (c === null) throw new RangeError(`unreadable coefficient '${t.coefficient}'`);
    for (const [symbol, count] of Object.entries(t.composition)) bump(symbol, t.side, mul(c, rat(BigInt(count))));
    if (t.charge !== 0) charged = true;
  }
  if (charged) {
    totals.set('charge', { reactants: ZERO, products: ZERO });
    for (const t of terms)
      if (t.charge !== 0) bump('charge', t.side, mul(parseRational(t.coefficient)!, rat(BigInt(t.charge))));
  }
  return [...totals].map(([element, { reactants, products }]) => ({
    element,
    reactants: ratText(reactants),
    products: ratText(products),
  }));
}

/** True when every row of `elementBalanceTable(terms)` has equal sides. */
export function isBalanced(terms: readonly CountedTerm[]): boolean {
  return elementBalanceTable(terms).every((r) => r.reactants === r.products);
}

// Same table with plain numbers when every coefficient is a small whole number (exact: all
// products stay far below 2^53), avoiding BigInt work on the common path.
function wholeNumberTable(terms: readonly CountedTerm[]): BalanceRow[] {
  const totals = new Map<string, [number, number]>();
  let charged = false;
  for (const t of terms) {
    const c = Number(t.coefficient);
    const k = t.side === 'reactant' ? 0 : 1;
    for (const symbol in t.composition) {
      let row = totals.get(symbol);
      if (!row) totals.set(symbol, (row = [0, 0]));
      row[k] += c * t.composition[symbol]!;
    }
    if (t.charge !== 0) charged = true;
  }
  if (charged) {
    const row: [number, number] = [0, 0];
    for (const t of terms) row[t.side === 'reactant' ? 0 : 1] += Number(t.coefficient) * t.charge;
    totals.set('charge', row);
  }
  const out: BalanceRow[] = [];
  for (const [element, [r, p]] of totals) out.push({ element, reactants: String(r), products: String(p) });
  return out;
}
