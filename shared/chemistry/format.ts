import { ratText, type Rat } from './rational';
import type { EnthalpyValue, EquationModel, FormulaFormat, FormulaItem, FormulaPart, ParsedSpecies } from './types';

const SUB = '₀₁₂₃₄₅₆₇₈₉';
const SUP = '⁰¹²³⁴⁵⁶⁷⁸⁹';
const toScript = (digits: string, table: string): string => digits.replace(/\d/g, (d) => table[Number(d)]!);

function escapeHtml(text: string): string {
  return text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
}

function itemsIn(items: readonly FormulaItem[], sub: (digits: string) => string): string {
  return items
    .map((it) => {
      const count = it.count === 1 ? '' : sub(String(it.count));
      if (it.kind === 'element') return it.symbol + count;
      const inner = itemsIn(it.items, sub);
      return (it.bracket === '(' ? `(${inner})` : `[${inner}]`) + count;
    })
    .join('');
}

const VULGAR_TEXT: Readonly<Record<string, string>> = {
  '1/2': '½',
  '1/3': '⅓',
  '2/3': '⅔',
  '1/4': '¼',
  '3/4': '¾',
  '1/8': '⅛',
};

/** A hydrate multiplier: nothing for 1, "5", "1/2"; as a vulgar fraction character where one exists when `vulgar`. */
function multiplierIn(multiplier: Rat, vulgar: boolean): string {
  if (multiplier.n === 1n && multiplier.d === 1n) return '';
  const text = ratText(multiplier);
  return vulgar ? (VULGAR_TEXT[text] ?? text) : text;
}

function partsIn(parts: readonly FormulaPart[], sub: (digits: string) => string, dot: string, vulgar: boolean): string {
  return parts.map((p, i) => (i > 0 ? multiplierIn(p.multiplier, vulgar) : '') + itemsIn(p.items, sub)).join(dot);
}

function phaseText(species: ParsedSpecies, html: boolean): string {
  if (!species.phase) return '';
  const descriptor = species.descriptor ? `, ${html ? escapeHtml(species.descriptor) : species.descriptor}` : '';
  return `(${species.phase}${descriptor})`;
}

function speciesBody(species: ParsedSpecies, format: FormulaFormat): string {
  const q = species.charge;
  const mag = Math.abs(q) === 1 ? '' : String(Math.abs(q));
  switch (format) {
    case 'text':
      // `formula` is already the plain caret text of structure and charge.
      return species.formula + phaseText(species, false);
    case 'unicode': {
      const charge = q === 0 ? '' : toScript(mag, SUP) + (q > 0 ? '⁺' : '⁻');
      return (
        (species.electron ? 'e' : partsIn(species.parts, (d) => toScript(d, SUB), '·', true)) +
        charge +
        phaseText(species, false)
      );
    }
    case 'html': {
      const charge = q === 0 ? '' : `<sup>${mag}${q > 0 ? '+' : '−'}</sup>`;
      return (
        (species.electron ? 'e' : partsIn(species.parts, (d) => `<sub>${d}</sub>`, '·', true)) +
        charge +
        phaseText(species, true)
      );
    }
    case 'mhchem':
      // mhchem writes the adduct dot as "*", fractions as 1/2 and charges as ^2-.
      return (
        (species.electron ? 'e' : partsIn(species.parts, (d) => d, '*', false)) +
        (q === 0 ? '' : `^${mag}${q > 0 ? '+' : '-'}`) +
        phaseText(species, false)
      );
  }
}

/**
 * Formats a species with its charge and phase:
 * - 'text': plain caret notation that parses back ("SO4^2-(aq)", "CuSO4·5H2O(s)", "CaSO4·1/2H2O");
 * - 'unicode': sub/superscript characters and vulgar fractions ("SO₄²⁻(aq)", "CaSO₄·½H₂O");
 * - 'html': <sub>/<sup> markup, text escaped ("SO<sub>4</sub><sup>2−</sup>(aq)");
 * - 'mhchem': LaTeX for the mhchem package ("\ce{SO4^2-(aq)}", "\ce{CaSO4*1/2H2O}").
 */
export function formatFormula(species: ParsedSpecies, format: FormulaFormat): string {
  const body = speciesBody(species, format);
  return format === 'mhchem' ? `\\ce{${body}}` : body;
}

/** The typographic minus sign (U+2212) for a negative number's text. */
const minus = (text: string): string => (text.startsWith('-') ? `−${text.slice(1)}` : text);

/** A number without float noise (12 significant digits), "-0" as "0". */
function plainNumber(v: number): string {
  const r = Number(v.toPrecision(12));
  return Object.is(r, -0) ? '0' : String(r);
}

/**
 * Formats ΔH (kJ/mol per mole of reaction as written) as "ΔH = -285.8 kJ/mol" in the given
 * notation (mhchem gives "\Delta H = \pu{…}"). Negative = exothermic.
 */
export function formatEnthalpy(enthalpy: Pick<EnthalpyValue, 'value' | 'uncertainty'>, format: FormulaFormat): string {
  const value = plainNumber(enthalpy.value);
  const unc = enthalpy.uncertainty === undefined ? '' : plainNumber(enthalpy.uncertainty);
  switch (format) {
    case 'text':
      return `ΔH = ${value}${unc ? ` ± ${unc}` : ''} kJ/mol`;
    case 'unicode':
      return `ΔH = ${minus(value)}${unc ? ` ± ${unc}` : ''} kJ/mol`;
    case 'html':
      return `Δ<i>H</i> = ${minus(value)}${unc ? ` ± ${unc}` : ''} kJ mol<sup>−1</sup>`;
    case 'mhchem':
      return `\\Delta H = \\pu{${value}${unc ? ` +- ${unc}` : ''} kJ mol^-1}`;
  }
}

/**
 * Formats a whole equation (a parsed equation, a balancing's `equation`, any `EquationModel`):
 * coefficients as exact fractions (1 omitted), species as `formatFormula`, the arrow (→ or ⇌ in
 * unicode/html; -> or <=> in text and mhchem) and ΔH when known.
 */
export function formatEquation(model: EquationModel, format: FormulaFormat): string {
  const equilibrium = model.equilibrium;
  const arrow = format === 'text' || format === 'mhchem' ? (equilibrium ? '<=>' : '->') : equilibrium ? '⇌' : '→';
  const core = `${sideText(model, 'reactant', format)} ${arrow} ${sideText(model, 'product', format)}`;
  if (format === 'mhchem') {
    const tail = model.enthalpy ? ` \\quad ${formatEnthalpy(model.enthalpy, 'mhchem')}` : '';
    return `\\ce{${core}}${tail}`;
  }
  return core + (model.enthalpy ? `, ${formatEnthalpy(model.enthalpy, format)}` : '');
}

function sideText(model: EquationModel, side: 'reactant' | 'product', format: FormulaFormat): string {
  let out = '';
  for (const t of model.terms) {
    if (t.side !== side) continue;
    const c = t.coefficient;
    out +=
      (out === '' ? '' : ' + ') + (c.n === 1n && c.d === 1n ? '' : `${ratText(c)} `) + speciesBody(t.species, format);
  }
  return out;
}
