import type { AstCharge, AstItem, AstPart, AstSpecies } from './grammar-ast';
import { elementName, isMetal } from './elements';
import { compositionAndHill } from './hill';
import { warningMessages } from './messages';
import { ONE, rat, ratText, type Rat } from './rational';
import type { ChargeNotation, FormulaItem, FormulaPart, ParsedSpecies, ParseWarning, Phase, SourceSpan } from './types';

// Homonuclear ions that are real and common, so reading `O2-` as O₂⁻ needs no warning.
const PLAUSIBLE_HOMONUCLEAR = new Set(['O2-', 'O3-', 'N3-', 'I3-', 'Br3-', 'Cl3-', 'H2+', 'H3+', 'C2-']);

function itemsText(items: readonly FormulaItem[]): string {
  let out = '';
  for (const it of items) {
    const count = it.count === 1 ? '' : String(it.count);
    if (it.kind === 'element') out += it.symbol + count;
    else out += it.bracket === '(' ? `(${itemsText(it.items)})${count}` : `[${itemsText(it.items)}]${count}`;
  }
  return out;
}

/** Plain caret text of a charge: "^2-", "^+", "" for 0. */
export function chargeText(charge: number): string {
  if (charge === 0) return '';
  const mag = Math.abs(charge);
  return `^${mag === 1 ? '' : mag}${charge > 0 ? '+' : '-'}`;
}

/** How a hydrate multiplier is written before its part: "" for 1, "5", "1/2". */
export function multiplierText(multiplier: Rat): string {
  return multiplier.n === 1n && multiplier.d === 1n ? '' : ratText(multiplier);
}

/** Plain text of a formula structure without charge ("CuSO4·5H2O", "CaSO4·1/2H2O"). */
export function partsText(parts: readonly FormulaPart[]): string {
  let out = '';
  parts.forEach((p, i) => {
    out += (i > 0 ? '·' + multiplierText(p.multiplier) : '') + itemsText(p.items);
  });
  return out;
}

function chargeValue(c: AstCharge): number {
  return c.sign * (c.digits === null ? 1 : Number(c.digits));
}

function partOf(ast: AstPart): FormulaPart {
  const m = ast.multiplier;
  // The grammar's items already have the FormulaItem shape (plus positions): share them.
  return { multiplier: m === null ? ONE : rat(BigInt(m.n), BigInt(m.d)), items: ast.items as FormulaItem[] };
}

/**
 * Turns a species from the grammar into a `ParsedSpecies`, applying the charge-reading rules:
 * after a closing square bracket, digits before a trailing sign are the charge (`[Fe(CN)6]3-`);
 * elsewhere they stay subscripts (`NH4+` = NH₄⁺), with an `ambiguous_charge` warning (pushed to
 * `warnings`) when that reading looks unlikely (`Fe3+`, `SO42-`).
 *
 * @param column column (from 1) of `ast.start` in `source`.
 * @param term index of the term, for the warning.
 */
export function buildSpecies(
  ast: AstSpecies,
  source: string,
  column: number,
  warnings: ParseWarning[],
  term?: number,
): ParsedSpecies {
  const span: SourceSpan = { start: ast.start, end: ast.end, column };
  const phase = (ast.phase?.phase as Phase | undefined) ?? null;
  const descriptor = ast.phase?.descriptor ?? null;
  if (ast.electron) {
    return {
      formula: 'e^-',
      composition: {},
      charge: ast.charge ? chargeValue(ast.charge) : -1,
      hill: 'e',
      phase,
      descriptor,
      electron: true,
      parts: [],
      chargeNotation: ast.charge?.notation ?? null,
      span,
    };
  }

  let parts = ast.parts.map(partOf);
  let charge = ast.charge ? chargeValue(ast.charge) : 0;
  let notation: ChargeNotation | null = ast.charge?.notation ?? null;
  const lastAstPart = ast.parts[ast.parts.length - 1]!;
  const last: AstItem | undefined = lastAstPart.items[lastAstPart.items.length - 1];

  if (ast.charge?.notation === 'trailing-sign' && last?.countText) {
    if (last.kind === 'group' && last.bracket === '[') {
      // `[Fe(CN)6]3-`: the digits after a complex's bracket are its charge.
      charge = ast.charge.sign * last.count;
      notation = 'after-bracket';
      const lastPart = parts[parts.length - 1]!;
      const items = lastPart.items.slice();
      items[items.length - 1] = { kind: 'group', bracket: '[', items: last.items as FormulaItem[], count: 1 };
      parts = [...parts.slice(0, -1), { multiplier: lastPart.multiplier, items }];
    } else {
      const typed = source.slice(ast.start, ast.charge.end);
      const single = ast.parts.length === 1 && lastAstPart.items.length === 1 && last.kind === 'element';
      const unlikely =
        last.countText.length >= 2 ||
        (single && last.kind === 'element' && (isMetal(last.symbol) || !PLAUSIBLE_HOMONUCLEAR.has(typed)));
      if (unlikely) {
        const digit = last.countText.slice(-1);
        const sign = ast.charge.sign > 0 ? '+' : '-';
        const prefix = source.slice(ast.start, last.end - 1);
        const atoms = single && last.kind === 'element' ? `${last.count} × ${elementName(last.symbol)}` : null;
        warnings.push({
          code: 'ambiguous_charge',
          message: warningMessages.ambiguousCharge(
            typed,
            partsText(parts) + chargeText(charge),
            atoms,
            sign,
            digit !== '0' ? `${digit}${sign}, write ${prefix}^${digit}${sign}` : null,
          ),
          ...(term === undefined ? {} : { term }),
          column,
        });
      }
    }
  }

  const { composition, hill } = compositionAndHill(parts);
  return {
    formula: partsText(parts) + chargeText(charge),
    composition,
    charge,
    hill,
    phase,
    descriptor,
    electron: false,
    parts,
    chargeNotation: notation,
    span,
  };
}
