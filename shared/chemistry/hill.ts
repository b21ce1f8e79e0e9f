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
  const symbols = Object.keys(composition).filter((s) => (composition[s] ?? 0) !== 0);
  if (symbols.length === 0) return 'e';
  let ordered: string[];
  if (symbols.includes('C')) {
    const head = ['C', 'H', 'D', 'T'].filter((s) => symbols.includes(s));
    const rest = symbols.filter((s) => !head.includes(s)).sort(compareSymbols);
    ordered = [...head, ...rest];
  } else {
    ordered = symbols.sort(compareSymbols);
  }
  return ordered.map((s) => (composition[s] === 1 ? s : `${s}${composition[s]}`)).join('');
}

// Plain code-unit comparison: symbols are ASCII letters, "C" < "Ca" < "Cl" as Hill order requires.
function compareSymbols(a: string, b: string): number {
  return a < b ? -1 : a > b ? 1 : 0;
}

/** Atom counts of a formula structure (groups and hydrate parts multiplied out). */
export function compositionOf(parts: readonly FormulaPart[]): Composition {
  const out: Composition = {};
  const walk = (items: readonly FormulaItem[], factor: number): void => {
    for (const item of items) {
      if (item.kind === 'element') out[item.symbol] = (out[item.symbol] ?? 0) + item.count * factor;
      else walk(item.items, factor * item.count);
    }
  };
  for (const part of parts) walk(part.items, part.multiplier);
  return out;
}
