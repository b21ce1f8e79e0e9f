import type { Composition, FormulaItem, FormulaPart } from './types';

/**
 * Hill-order formula without charge: with carbon present, C first, then H, then the rest in
 * alphabetical order; without carbon, every symbol alphabetical (Hill, J. Am. Chem. Soc. 22 (1900)
 * 478; from memory). D and T: with carbon they follow H directly (C, H, D, T, …) because chemists
 * write them as hydrogen (CDCl3); without carbon they sort alphabetically like other symbols
 * (D2O → "D2O", T2O → "OT2"). This placement is common practice, no source. A count of 1 is
 * omitted. The electron (empty composition) gives "e".
 */
export function hillFormula(composition: Composition): string {
  const symbols: string[] = [];
  for (const s in composition) if (composition[s] !== 0) symbols.push(s);
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

function term(symbol: string, count: number | undefined): string {
  return !count ? '' : count === 1 ? symbol : symbol + String(count);
}

// Plain code-unit comparison: symbols are ASCII letters, "C" < "Ca" < "Cl" as Hill order requires.
function compareSymbols(a: string, b: string): number {
  return a < b ? -1 : a > b ? 1 : 0;
}

/** Atom counts of a formula structure (groups and hydrate parts multiplied out). */
export function compositionOf(parts: readonly FormulaPart[]): Composition {
  const out: Composition = {};
  for (const part of parts) addItems(out, part.items, part.multiplier);
  return out;
}

function addItems(out: Composition, items: readonly FormulaItem[], factor: number): void {
  for (const item of items) {
    if (item.kind === 'element') out[item.symbol] = (out[item.symbol] ?? 0) + item.count * factor;
    else addItems(out, item.items, factor * item.count);
  }
}
