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
  const symbols: string[] = [];
  for (const s in composition) if (composition[s]!.n !== 0n) symbols.push(s);
  if (symbols.length === 0) return 'e';
  symbols.sort(compareSymbols);
  let out = '';
  if (composition.C) {
    // Carbon first, then H, D, T; the rest stays alphabetical.
    out = term('C', composition.C) + term('H', composition.H) + term('D', composition.D) + term('T', composition.T);
    for (const s of symbols) if (s !== 'C' && s !== 'H' && s !== 'D' && s !== 'T') out += term(s, composition[s]);
    return out;
  }
  for (const s of symbols) out += term(s, composition[s]);
  return out;
}

function term(symbol: string, count: Rat | undefined): string {
  if (!count || count.n === 0n) return '';
  if (count.d === 1n && count.n === 1n) return symbol;
  return symbol + ratDecimalOrFraction(count);
}

// Plain code-unit comparison: symbols are ASCII letters, "C" < "Ca" < "Cl" as Hill order requires.
function compareSymbols(a: string, b: string): number {
  return a < b ? -1 : a > b ? 1 : 0;
}

/**
 * Atoms per formula unit of a formula structure (groups and hydrate parts multiplied out), exact.
 * Whole-number parts are summed as plain numbers (every count has at most 9 digits and nesting is
 * bounded, but the sum is checked and redone exactly if it ever leaves the safe range).
 */
export function compositionOf(parts: readonly FormulaPart[]): Composition {
  if (parts.every((p) => p.multiplier.d === 1n && p.multiplier.n <= 1_000_000_000n)) {
    const counts: Record<string, number> = {};
    let safe = true;
    for (const part of parts) safe = addWhole(counts, part.items, Number(part.multiplier.n)) && safe;
    if (safe) {
      const out: Record<string, Rat> = {};
      for (const symbol in counts) out[symbol] = ratOfInteger(counts[symbol]!);
      return out;
    }
  }
  const exact: Record<string, { n: bigint; d: bigint }> = {};
  for (const part of parts) addExact(exact, part.items, part.multiplier.n, part.multiplier.d);
  const out: Record<string, Rat> = {};
  for (const symbol in exact) out[symbol] = rat(exact[symbol]!.n, exact[symbol]!.d);
  return out;
}

function addWhole(out: Record<string, number>, items: readonly FormulaItem[], factor: number): boolean {
  let safe = Number.isSafeInteger(factor);
  for (const item of items) {
    if (item.kind === 'element') {
      const total = (out[item.symbol] ?? 0) + item.count * factor;
      out[item.symbol] = total;
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
