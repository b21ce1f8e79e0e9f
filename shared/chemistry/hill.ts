import { ratDecimalOrFraction, ratOfInteger, rat, type Rat } from './rational';
import type { Composition, FormulaItem, FormulaPart } from './types';

/**
 * Hill-order formula without charge: with carbon present, C first, then H, then the rest in
 * alphabetical order; without carbon, every symbol alphabetical (Hill, J. Am. Chem. Soc. 22 (1900)
 * 478; from memory). D and T: with carbon they follow H directly (C, H, D, T, …) because chemists
 * write them as hydrogen (CDCl3); without carbon they sort alphabetically like other symbols
 * (D2O → "D2O", T2O → "OT2"). This placement is common practice, no source. A count of 1 is
 * omitted. The electron (empty composition) gives "e".
 *
 * Fractional formula units keep their own counts: the Hill formula describes one formula unit as
 * written, so CaSO4·½H2O gives "CaHO4.5S" (counts as exact decimals; a count with no terminating
 * decimal is written as a fraction, CaSO4·⅓H2O → "CaH2/3O13/3S"). It is not rescaled to whole
 * numbers, so it always agrees with the composition and the molar mass of the same unit. (The
 * crystallographic "sum formula" writes fractional counts the same way.)
 */
export function hillFormula(composition: Composition): string {
  let out = '';
  for (const symbol of hillOrder(Object.keys(composition), composition.C !== undefined && composition.C.n !== 0n)) {
    const count = composition[symbol]!;
    if (count.n === 0n) continue;
    out += count.n === 1n && count.d === 1n ? symbol : symbol + ratDecimalOrFraction(count);
  }
  return out === '' ? 'e' : out;
}

/** The same Hill formula from whole-number counts (the usual case, without BigInt). */
function hillFormulaOfCounts(counts: ReadonlyMap<string, number>): string {
  let out = '';
  const carbon = counts.get('C');
  for (const symbol of hillOrder([...counts.keys()], carbon !== undefined && carbon !== 0)) {
    const count = counts.get(symbol)!;
    if (count === 0) continue;
    out += count === 1 ? symbol : symbol + String(count);
  }
  return out === '' ? 'e' : out;
}

const CARBON_FIRST = ['C', 'H', 'D', 'T'];

/**
 * The symbols in Hill order (see `hillFormula`): with carbon, C, H, D, T first, the rest
 * alphabetical; without, all alphabetical. Symbols are ASCII letters, so the default sort (by
 * code unit) puts "C" before "Ca" before "Cl", as Hill order requires.
 */
function hillOrder(symbols: string[], carbon: boolean): string[] {
  symbols.sort();
  if (!carbon) return symbols;
  const ordered: string[] = [];
  for (const s of CARBON_FIRST) if (symbols.includes(s)) ordered.push(s);
  for (const s of symbols) if (!CARBON_FIRST.includes(s)) ordered.push(s);
  return ordered;
}

/** Atoms per formula unit of a formula structure (groups and hydrate parts multiplied out), exact. */
export function compositionOf(parts: readonly FormulaPart[]): Composition {
  return compositionAndHill(parts).composition;
}

/**
 * The composition and the Hill formula of a formula structure in one pass. Whole-number parts are
 * summed as plain numbers (every count has at most 9 digits and nesting is bounded, but each sum
 * is checked, and the exact path runs instead if one ever leaves the safe range).
 */
export function compositionAndHill(parts: readonly FormulaPart[]): { composition: Composition; hill: string } {
  let whole = true;
  for (const p of parts) if (p.multiplier.d !== 1n || p.multiplier.n > 1_000_000_000n) whole = false;
  if (whole) {
    const counts = new Map<string, number>();
    let safe = true;
    for (const part of parts) safe = addWhole(counts, part.items, Number(part.multiplier.n)) && safe;
    if (safe) {
      const composition: Record<string, Rat> = {};
      for (const [symbol, count] of counts) composition[symbol] = ratOfInteger(count);
      return { composition, hill: hillFormulaOfCounts(counts) };
    }
  }
  const exact: Record<string, { n: bigint; d: bigint }> = {};
  for (const part of parts) addExact(exact, part.items, part.multiplier.n, part.multiplier.d);
  const composition: Record<string, Rat> = {};
  for (const symbol in exact) composition[symbol] = rat(exact[symbol]!.n, exact[symbol]!.d);
  return { composition, hill: hillFormula(composition) };
}

function addWhole(out: Map<string, number>, items: readonly FormulaItem[], factor: number): boolean {
  let safe = Number.isSafeInteger(factor);
  for (const item of items) {
    if (item.kind === 'element') {
      const total = (out.get(item.symbol) ?? 0) + item.count * factor;
      out.set(item.symbol, total);
      if (!Number.isSafeInteger(total)) safe = false;
    } else {
      safe = addWhole(out, item.items, factor * item.count) && safe;
    }
  }
  return safe;
}

// Sums n/d fractions sharing the denominator of their part (normalised once at the end).
function addExact(
  out: Record<string, { n: bigint; d: bigint }>,
  items: readonly FormulaItem[],
  n: bigint,
  d: bigint,
): void {
  for (const item of items) {
    if (item.kind === 'element') {
      const add = BigInt(item.count) * n;
      const prev = out[item.symbol];
      out[item.symbol] = prev ? { n: prev.n * d + add * prev.d, d: prev.d * d } : { n: add, d };
    } else {
      addExact(out, item.items, n * BigInt(item.count), d);
    }
  }
}
