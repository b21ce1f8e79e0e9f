import type { AstCharge, AstItem, AstSpecies } from './grammar-ast';
import { elementName, isMetal } from './elements';
import { compositionOf, hillFormula } from './hill';
import { positionAt } from './positions';
import type { ChargeNotation, FormulaItem, FormulaPart, ParsedSpecies, ParseWarning, Phase } from './types';

// Homonuclear ions that are real and common, so reading `O2-` as O₂⁻ needs no warning.
const PLAUSIBLE_HOMONUCLEAR = new Set(['O2-', 'O3-', 'N3-', 'I3-', 'Br3-', 'Cl3-', 'H2+', 'H3+', 'C2-']);

function itemsText(items: readonly FormulaItem[]): string {
  return items
    .map((it) => {
      const count = it.count === 1 ? '' : String(it.count);
      if (it.kind === 'element') return it.symbol + count;
      return it.bracket === '(' ? `(${itemsText(it.items)})${count}` : `[${itemsText(it.items)}]${count}`;
    })
    .join('');
}

/** Plain caret text of a charge: "^2-", "^+", "" for 0. */
export function chargeText(charge: number): string {
  if (charge === 0) return '';
  const mag = Math.abs(charge);
  return `^${mag === 1 ? '' : mag}${charge > 0 ? '+' : '-'}`;
}

/** Plain text of a formula structure without charge ("CuSO4·5H2O"). */
export function partsText(parts: readonly FormulaPart[]): string {
  return parts.map((p, i) => (i > 0 && p.multiplier !== 1 ? String(p.multiplier) : '') + itemsText(p.items)).join('·');
}

function lastItem(species: AstSpecies): AstItem | undefined {
  const part = species.parts[species.parts.length - 1];
  return part?.items[part.items.length - 1];
}

function chargeValue(c: AstCharge): number {
  return c.sign * (c.digits === null ? 1 : Number(c.digits));
}

/**
 * Turns a species from the grammar into a `ParsedSpecies`, applying the charge-reading rules:
 * after a closing square bracket, digits before a trailing sign are the charge (`[Fe(CN)6]3-`);
 * elsewhere they stay subscripts (`NH4+` = NH₄⁺), with an `ambiguous_charge` warning when that
 * reading looks unlikely (`Fe3+`, `SO42-`).
 */
export function buildSpecies(ast: AstSpecies, source: string, warnings: ParseWarning[], term?: number): ParsedSpecies {
  const { column } = positionAt(source, ast.start);
  const span = { start: ast.start, end: ast.end, column };
  if (ast.electron) {
    const charge = ast.charge ? chargeValue(ast.charge) : -1;
    return {
      formula: 'e^-',
      composition: {},
      charge,
      hill: 'e',
      phase: (ast.phase?.phase as Phase | undefined) ?? null,
      descriptor: ast.phase?.descriptor ?? null,
      electron: true,
      parts: [],
      chargeNotation: ast.charge?.notation ?? null,
      span,
    };
  }

  // The grammar's items already have the FormulaItem shape (plus positions): share them.
  let parts: FormulaPart[] = ast.parts as FormulaPart[];
  let charge = ast.charge ? chargeValue(ast.charge) : 0;
  let notation: ChargeNotation | null = ast.charge?.notation ?? null;
  const last = lastItem(ast);

  if (ast.charge?.notation === 'trailing-sign' && last?.countText) {
    if (last.kind === 'group' && last.bracket === '[') {
      // `[Fe(CN)6]3-`: the digits after a complex's bracket are its charge.
      charge = ast.charge.sign * last.count;
      notation = 'after-bracket';
      const lastPart = parts[parts.length - 1]!;
      const items = lastPart.items.slice();
      const g = items[items.length - 1] as Extract<FormulaItem, { kind: 'group' }>;
      items[items.length - 1] = { kind: 'group', bracket: g.bracket, items: g.items, count: 1 };
      parts = [...parts.slice(0, -1), { multiplier: lastPart.multiplier, items }];
    } else {
      const typed = source.slice(ast.start, ast.charge.end);
      const single = ast.parts.length === 1 && ast.parts[0]!.items.length === 1 && last.kind === 'element';
      const unlikely =
        last.countText.length >= 2 ||
        (single && last.kind === 'element' && (isMetal(last.symbol) || !PLAUSIBLE_HOMONUCLEAR.has(typed)));
      if (unlikely) {
        const digit = last.countText.slice(-1);
        const sign = ast.charge.sign > 0 ? '+' : '-';
        const prefix = source.slice(ast.start, last.end - 1);
        const reading = `${partsText(parts)}${chargeText(charge)}`;
        const suggestion =
          digit !== '0' ? `; if you meant charge ${digit}${sign}, write ${prefix}^${digit}${sign}` : '';
        const name = single && last.kind === 'element' ? ` (${last.count} × ${elementName(last.symbol)})` : '';
        warnings.push({
          code: 'ambiguous_charge',
          message: `Read '${typed}' as ${reading}${name}, with charge ${charge > 0 ? '+' : '-'}1${suggestion}.`,
          ...(term === undefined ? {} : { term }),
          column,
        });
      }
    }
  }

  const composition = compositionOf(parts);
  return {
    formula: partsText(parts) + chargeText(charge),
    composition,
    charge,
    hill: hillFormula(composition),
    phase: (ast.phase?.phase as Phase | undefined) ?? null,
    descriptor: ast.phase?.descriptor ?? null,
    electron: false,
    parts,
    chargeNotation: notation,
    span,
  };
}
