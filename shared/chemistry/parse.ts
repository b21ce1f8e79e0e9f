import { parse as peggyParse } from './generated/equation.js';
import type { AstEnthalpy, AstEquation, AstTerm } from './grammar-ast';
import { isElementSymbol } from './elements';
import { isEnergyUnit, toKilojoules } from './energy-units';
import {
  checkWorkLimit,
  DEFAULT_WORK_LIMITS,
  MAX_COUNT_DIGITS,
  MAX_NESTING,
  resolveWorkLimits,
  type WorkLimits,
} from './limits';
import { parseMessages, warningMessages } from './messages';
import { isPeggyError, parseErrorAt, rewritePeggyError } from './parse-errors';
import { ONE, parseRational, type Rat } from './rational';
import { buildSpecies } from './species';
import type { EnthalpyValue, HeatTerm, ParsedEquation, ParsedSpecies, ParseWarning, Side, SpeciesTerm } from './types';

/** Options of `parseEquation` and the functions built on it. */
export interface ParseOptions {
  /** Work limits (defaults: `DEFAULT_WORK_LIMITS`); `maxTerms` and `maxSpecies` apply here. */
  limits?: Partial<WorkLimits>;
}

// Grammar options are built once per limit: object spreads per call are measurably slow on this hot path.
const GRAMMAR_BASE = { isElement: isElementSymbol, messages: parseMessages, maxCountDigits: MAX_COUNT_DIGITS };
const FORMULA_OPTIONS = { ...GRAMMAR_BASE, startRule: 'FormulaOnly' as const };
const equationOptions = new Map<number, typeof GRAMMAR_BASE & { startRule: 'Equation'; maxTerms: number }>();
function equationOptionsFor(maxTerms: number) {
  let options = equationOptions.get(maxTerms);
  if (!options) {
    options = { ...GRAMMAR_BASE, startRule: 'Equation', maxTerms };
    if (equationOptions.size < 16) equationOptions.set(maxTerms, options);
  }
  return options;
}
const EQUILIBRIUM_ARROWS = new Set(['<=>', '⇌']);

/**
 * Offset of the first bracket that opens deeper than `max` levels, or −1. Counts every ( [ {
 * against every ) ] }, so it bounds the parser's recursion (one level per open group) whatever
 * the input; real formulas stay below five levels.
 */
function tooDeepAt(text: string, max: number): number {
  let depth = 0;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c === 40 || c === 91 || c === 123) {
      if (++depth > max) return i;
    } else if ((c === 41 || c === 93 || c === 125) && depth > 0) depth--;
  }
  return -1;
}

function runParser<T>(text: string, run: () => T): T {
  const deep = tooDeepAt(text, MAX_NESTING);
  if (deep >= 0) throw parseErrorAt(text, deep, parseMessages.tooDeeplyNested(MAX_NESTING), 1);
  try {
    return run();
  } catch (err) {
    if (isPeggyError(err)) throw rewritePeggyError(text, err);
    throw err;
  }
}

function enthalpyFromAst(text: string, ast: AstEnthalpy): EnthalpyValue {
  if (!isEnergyUnit(ast.unit)) throw parseErrorAt(text, ast.start, parseMessages.unknownEnergyUnit(ast.unit));
  const stated = Number(ast.value);
  const unc = ast.uncertainty === null ? undefined : Number(ast.uncertainty);
  const value = toKilojoules(stated, ast.unit);
  const uncertainty = unc === undefined ? undefined : toKilojoules(unc, ast.unit);
  if (!Number.isFinite(value) || (uncertainty !== undefined && !Number.isFinite(uncertainty))) {
    throw parseErrorAt(text, ast.start, parseMessages.enthalpyNotFinite(), ast.end - ast.start);
  }
  return {
    value,
    ...(uncertainty === undefined ? {} : { uncertainty }),
    stated: { value: stated, unit: ast.unit, perMol: ast.perMol, ...(unc === undefined ? {} : { uncertainty: unc }) },
  };
}

/** A distinct species for the `maxSpecies` limit: same formula, charge and phase. */
function speciesKey(species: ParsedSpecies): string {
  return `${species.formula}|${species.phase ?? ''}|${species.descriptor ?? ''}`;
}

/** Reads one side's terms into `terms` and `heat`. */
function readSide(
  text: string,
  side: Side,
  list: ReadonlyArray<AstTerm | null>,
  missingAt: number,
  out: { terms: SpeciesTerm[]; heat: HeatTerm[]; warnings: ParseWarning[] },
): void {
  let species = 0;
  for (const t of list) {
    if (t === null) continue; // not kept: only possible past maxTerms, refused before this runs
    // The grammar refuses line breaks, so a parsed equation is one line: column = offset + 1.
    if (t.kind === 'heat') {
      if (!isEnergyUnit(t.unit)) throw parseErrorAt(text, t.start, parseMessages.unknownEnergyUnit(t.unit));
      const value = Number(t.value);
      const kj = toKilojoules(value, t.unit);
      if (!Number.isFinite(kj)) throw parseErrorAt(text, t.start, parseMessages.heatTermNotFinite(), t.end - t.start);
      out.heat.push({
        side,
        value: kj,
        stated: { value, unit: t.unit },
        span: { start: t.start, end: t.end, column: t.start + 1 },
      });
      continue;
    }
    species++;
    let coefficient: Rat | null = null;
    if (t.coefficient !== null) {
      coefficient = parseRational(t.coefficient);
      const length = t.coefficient.length;
      if (coefficient === null)
        throw parseErrorAt(text, t.start, parseMessages.coefficientUnreadable(t.coefficient), length);
      if (coefficient.n === 0n) throw parseErrorAt(text, t.start, parseMessages.coefficientZero(), length);
    }
    const sp = buildSpecies(t.species, text, t.species.start + 1, out.warnings, out.terms.length);
    if (sp.electron && sp.charge !== -1) {
      throw parseErrorAt(text, t.species.start, parseMessages.electronCharge(), t.species.end - t.species.start);
    }
    out.terms.push({ species: sp, side, coefficient: coefficient ?? ONE, coefficientWritten: coefficient !== null });
  }
  if (species === 0) throw parseErrorAt(text, missingAt, parseMessages.sideNeedsSpecies(side));
}

function readTerms(
  text: string,
  ast: AstEquation,
  warnings: ParseWarning[],
): { terms: SpeciesTerm[]; heat: HeatTerm[] } {
  const out = { terms: [] as SpeciesTerm[], heat: [] as HeatTerm[], warnings };
  readSide(text, 'reactant', ast.left, 0, out);
  readSide(text, 'product', ast.right, ast.arrow.end, out);
  return { terms: out.terms, heat: out.heat };
}

/**
 * ΔH of the equation: the stated ΔH, else the heat terms' sum. Heat released (a product) lowers
 * the system's enthalpy: ΔH = Σ q(reactant side) − Σ q(product side), in kJ/mol.
 */
function enthalpyOf(
  text: string,
  stated: EnthalpyValue | null,
  heat: readonly HeatTerm[],
  warnings: ParseWarning[],
): EnthalpyValue | null {
  if (heat.length === 0) return stated;
  const fromHeat = heat.reduce((sum, h) => sum + (h.side === 'reactant' ? h.value : -h.value), 0);
  const first = heat[0]!;
  if (!Number.isFinite(fromHeat)) throw parseErrorAt(text, first.span.start, parseMessages.heatTermNotFinite());
  if (stated === null) {
    return {
      value: fromHeat,
      stated: { value: fromHeat / toKilojoules(1, first.stated.unit), unit: first.stated.unit, perMol: false },
    };
  }
  if (Math.abs(stated.value - fromHeat) > 1e-9 * Math.max(1, Math.abs(fromHeat))) {
    warnings.push({
      code: 'heat_term_disagrees',
      message: warningMessages.heatTermDisagrees(fromHeat, stated.value),
      column: first.span.column,
    });
  }
  return stated;
}

/**
 * Reads one thermochemical equation.
 *
 * Accepts coefficients (whole, decimal, fraction; decimals converted exactly), phase labels
 * (s, l, g, aq, cr, am, with an optional descriptor: `C(cr, graphite)`), charges (`SO4^2-`,
 * `SO4{2-}`, `SO₄²⁻`, `NH4+`, `[Fe(CN)6]3-`, `e-`), hydrates and adducts (`CuSO4·5H2O`, `*`, `.`,
 * with fractional multipliers `CaSO4·½H2O`, `CaSO4·1/2H2O`, `CaSO4·0.5H2O`), the arrows
 * `->`, `→`, `=`, `<=>`, `⇌`, heat terms (`+ 120.5 kJ`) and a trailing ΔH (`, ΔH = -45.2 kJ/mol`)
 * in kJ, J, kcal or cal (thermochemical calorie). A heat term on the product side means heat is
 * released: it is folded into `enthalpy` as ΔH = −q; on the reactant side ΔH = +q.
 *
 * Work limits are checked as soon as the parser has counted: more than `maxTerms` terms, or more
 * than `maxSpecies` distinct species, throw `WorkLimitError` before anything is balanced.
 *
 * @throws EquationParseError with line/column (from 1), offset (from 0), length, excerpt and expected words;
 *   also for brackets nested more than `MAX_NESTING` levels.
 * @throws WorkLimitError (code `payload_too_large`) when a work limit is exceeded.
 */
export function parseEquation(text: string, options: ParseOptions = {}): ParsedEquation {
  const limits = options.limits === undefined ? DEFAULT_WORK_LIMITS : resolveWorkLimits(options.limits);
  const ast = runParser(text, () => peggyParse(text, equationOptionsFor(limits.maxTerms)));
  checkWorkLimit('terms', limits.maxTerms, ast.termCount);

  const warnings: ParseWarning[] = [];
  const { terms, heat } = readTerms(text, ast, warnings);
  if (terms.length > limits.maxSpecies) {
    checkWorkLimit('species', limits.maxSpecies, new Set(terms.map((t) => speciesKey(t.species))).size);
  }
  const statedEnthalpy = ast.enthalpy ? enthalpyFromAst(text, ast.enthalpy) : null;
  const enthalpy = enthalpyOf(text, statedEnthalpy, heat, warnings);

  return {
    source: text,
    arrow: ast.arrow.text,
    equilibrium: EQUILIBRIUM_ARROWS.has(ast.arrow.text),
    terms,
    heatTerms: heat,
    statedEnthalpy,
    enthalpy,
    warnings,
  };
}

/**
 * Reads one species: a formula with optional charge and phase (`SO4^2-(aq)`, `C(cr, graphite)`,
 * `CaSO4·½H2O(s)`). Warnings about the reading (e.g. `ambiguous_charge`) are returned alongside.
 *
 * @throws EquationParseError as `parseEquation`.
 */
export function parseFormula(text: string): ParsedSpecies & { warnings: ParseWarning[] } {
  const ast = runParser(text, () => peggyParse(text, FORMULA_OPTIONS));
  const warnings: ParseWarning[] = [];
  const species = buildSpecies(ast.species, text, ast.species.start + 1, warnings);
  if (species.electron && species.charge !== -1) {
    throw parseErrorAt(text, ast.species.start, parseMessages.electronCharge(), ast.species.end - ast.species.start);
  }
  return { ...species, warnings };
}
