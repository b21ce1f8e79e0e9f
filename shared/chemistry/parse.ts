import { parse as peggyParse } from './generated/equation.js';
import type { AstEnthalpy, AstTerm } from './grammar-ast';
import { isElementSymbol } from './elements';
import { isEnergyUnit, toKilojoules } from './energy-units';
import { isPeggyError, parseErrorAt, rewritePeggyError } from './parse-errors';
import { positionAt } from './positions';
import { parseRational, ratText } from './rational';
import { buildSpecies } from './species';
import type { EnthalpyValue, HeatTerm, ParsedEquation, ParsedSpecies, ParseWarning, Side, SpeciesTerm } from './types';

// Built once: object spreads per call are measurably slow on this hot path.
const EQUATION_OPTIONS = { isElement: isElementSymbol, startRule: 'Equation' as const };
const FORMULA_OPTIONS = { isElement: isElementSymbol, startRule: 'FormulaOnly' as const };
const EQUILIBRIUM_ARROWS = new Set(['<=>', '⇌']);

function runParser<T>(text: string, run: () => T): T {
  try {
    return run();
  } catch (err) {
    if (isPeggyError(err)) throw rewritePeggyError(text, err);
    throw err;
  }
}

function enthalpyFromAst(text: string, ast: AstEnthalpy): EnthalpyValue {
  if (!isEnergyUnit(ast.unit)) throw parseErrorAt(text, ast.start, `unknown energy unit '${ast.unit}'`);
  const stated = Number(ast.value);
  const unc = ast.uncertainty === null ? undefined : Number(ast.uncertainty);
  if (!Number.isFinite(stated) || (unc !== undefined && !Number.isFinite(unc))) {
    throw parseErrorAt(text, ast.start, 'the enthalpy is not a finite number');
  }
  return {
    value: toKilojoules(stated, ast.unit),
    ...(unc === undefined ? {} : { uncertainty: toKilojoules(unc, ast.unit) }),
    stated: { value: stated, unit: ast.unit, perMol: ast.perMol, ...(unc === undefined ? {} : { uncertainty: unc }) },
  };
}

/**
 * Reads one thermochemical equation.
 *
 * Accepts coefficients (whole, decimal, fraction; decimals converted exactly), phase labels
 * (s, l, g, aq, cr, am, with an optional descriptor: `C(cr, graphite)`), charges (`SO4^2-`,
 * `SO4{2-}`, `SO₄²⁻`, `NH4+`, `[Fe(CN)6]3-`, `e-`), hydrates (`CuSO4·5H2O`, `*`, `.`), the arrows
 * `->`, `→`, `=`, `<=>`, `⇌`, heat terms (`+ 120.5 kJ`) and a trailing ΔH (`, ΔH = -45.2 kJ/mol`)
 * in kJ, J, kcal or cal (thermochemical calorie). A heat term on the product side means heat is
 * released: it is folded into `enthalpy` as ΔH = −q; on the reactant side ΔH = +q.
 *
 * @throws EquationParseError with line/column (from 1), offset (from 0), excerpt and expected words.
 */
export function parseEquation(text: string): ParsedEquation {
  const ast = runParser(text, () => peggyParse(text, EQUATION_OPTIONS));
  const warnings: ParseWarning[] = [];
  const terms: SpeciesTerm[] = [];
  const heatTerms: HeatTerm[] = [];

  const readSide = (side: Side, list: AstTerm[], arrowOffset: number): void => {
    let species = 0;
    for (const t of list) {
      if (t.kind === 'heat') {
        if (!isEnergyUnit(t.unit)) throw parseErrorAt(text, t.start, `unknown energy unit '${t.unit}'`);
        const value = Number(t.value);
        if (!Number.isFinite(value)) throw parseErrorAt(text, t.start, 'the heat term is not a finite number');
        heatTerms.push({
          side,
          value: toKilojoules(value, t.unit),
          stated: { value, unit: t.unit },
          span: { start: t.start, end: t.end, column: positionAt(text, t.start).column },
        });
        continue;
      }
      species++;
      let coefficient = '1';
      if (t.coefficient !== null) {
        const r = parseRational(t.coefficient);
        if (r === null) throw parseErrorAt(text, t.start, `cannot read the coefficient '${t.coefficient}'`);
        if (r.n === 0n) throw parseErrorAt(text, t.start, 'a coefficient must be greater than zero');
        coefficient = ratText(r);
      }
      const index = terms.length;
      const sp = buildSpecies(t.species, text, warnings, index);
      if (sp.electron && sp.charge !== -1) {
        throw parseErrorAt(text, t.species.start, 'the electron has charge 1−: write e- or e^-');
      }
      terms.push({ species: sp, side, coefficient, coefficientWritten: t.coefficient !== null });
    }
    if (species === 0) {
      const where = side === 'reactant' ? 0 : arrowOffset;
      throw parseErrorAt(
        text,
        where,
        `the ${side === 'reactant' ? 'reactants' : 'products'} need at least one species`,
      );
    }
  };
  readSide('reactant', ast.left, ast.arrow.start);
  readSide('product', ast.right, ast.arrow.end);

  const statedEnthalpy = ast.enthalpy ? enthalpyFromAst(text, ast.enthalpy) : null;
  let enthalpy: EnthalpyValue | null = statedEnthalpy;
  if (heatTerms.length > 0) {
    // Heat released (a product) lowers the system's enthalpy: ΔH = Σ q(reactant side) − Σ q(product side).
    const fromHeat = heatTerms.reduce((sum, h) => sum + (h.side === 'reactant' ? h.value : -h.value), 0);
    const first = heatTerms[0]!;
    const fromHeatValue: EnthalpyValue = {
      value: fromHeat,
      stated: { value: fromHeat / toKilojoules(1, first.stated.unit), unit: first.stated.unit, perMol: false },
    };
    if (statedEnthalpy === null) enthalpy = fromHeatValue;
    else if (Math.abs(statedEnthalpy.value - fromHeat) > 1e-9 * Math.max(1, Math.abs(fromHeat))) {
      warnings.push({
        code: 'heat_term_disagrees',
        message: `The heat term gives ΔH = ${+fromHeat.toPrecision(12)} kJ/mol but the stated ΔH is ${+statedEnthalpy.value.toPrecision(12)} kJ/mol; the stated ΔH is used.`,
        column: first.span.column,
      });
    }
  }

  return {
    source: text,
    arrow: ast.arrow.text,
    equilibrium: EQUILIBRIUM_ARROWS.has(ast.arrow.text),
    terms,
    heatTerms,
    statedEnthalpy,
    enthalpy,
    warnings,
  };
}

/**
 * Reads one species: a formula with optional charge and phase (`SO4^2-(aq)`, `C(cr, graphite)`).
 * Warnings about the reading (e.g. `ambiguous_charge`) are returned alongside.
 *
 * @throws EquationParseError as `parseEquation`.
 */
export function parseFormula(text: string): ParsedSpecies & { warnings: ParseWarning[] } {
  const ast = runParser(text, () => peggyParse(text, FORMULA_OPTIONS));
  const warnings: ParseWarning[] = [];
  const species = buildSpecies(ast.species, text, warnings);
  if (species.electron && species.charge !== -1) {
    throw parseErrorAt(text, ast.species.start, 'the electron has charge 1−: write e- or e^-');
  }
  return { ...species, warnings };
}
