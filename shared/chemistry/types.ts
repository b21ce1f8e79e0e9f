/**
 * Types shared by the chemistry core's modules. Pure data, no behaviour.
 *
 * Conventions used throughout `shared/chemistry`:
 * - Stoichiometric coefficients are exact rationals, carried as fraction text ("3", "1/2").
 * - Energies are in kJ/mol inside the core, per mole of reaction *as written*.
 * - Sign convention: ΔH < 0 is exothermic (heat released to the surroundings).
 * - Standard state as recorded by the caller; the parser only reads the phase label.
 */

/** Phase labels the equation language accepts after a species. */
export type Phase = 's' | 'l' | 'g' | 'aq' | 'cr' | 'am';

/** Which side of the arrow a term stands on. */
export type Side = 'reactant' | 'product';

/** Element symbol (or `D`/`T` for deuterium/tritium) → number of atoms. Whole numbers only. */
export type Composition = Record<string, number>;

/** Energy units accepted in heat terms and ΔH; kJ/mol is the internal unit. */
export type EnergyUnit = 'kJ' | 'J' | 'kcal' | 'cal';

/** Output notations for formulas and equations. */
export type FormulaFormat = 'text' | 'unicode' | 'html' | 'mhchem';

/** A span of the input, offsets from 0, end exclusive; `column` from 1 on the first line of the span. */
export interface SourceSpan {
  start: number;
  end: number;
  column: number;
}

/** One group or element inside a formula as typed, kept for faithful formatting. */
export type FormulaItem =
  | { kind: 'element'; symbol: string; count: number }
  | { kind: 'group'; bracket: '(' | '['; items: FormulaItem[]; count: number };

/** One part of an adduct/hydrate (`CuSO4·5H2O` has two parts: CuSO4 and 5 × H2O). */
export interface FormulaPart {
  multiplier: number;
  items: FormulaItem[];
}

/** How a charge was written, so warnings can point at the reading. */
export type ChargeNotation = 'caret' | 'braces' | 'parentheses' | 'superscript' | 'trailing-sign' | 'after-bracket';

/** A species as read by the parser: formula, charge and optional phase. */
export interface ParsedSpecies {
  /** The species in plain caret notation without phase, e.g. "SO4^2-", "[Fe(CN)6]^3-", "CuSO4·5H2O", "e^-". */
  formula: string;
  /** Atom counts over the whole species (hydrate water included). Empty for the electron. */
  composition: Composition;
  /** Net charge in units of the elementary charge. */
  charge: number;
  /** Hill-order formula without charge (see `hillFormula`); "e" for the electron. */
  hill: string;
  phase: Phase | null;
  /** Polymorph/allotrope/other descriptor written after the phase, e.g. "graphite" in `C(cr, graphite)`. */
  descriptor: string | null;
  /** True for the electron `e-`. */
  electron: boolean;
  /** Structure as typed (groups, multipliers, hydrate parts) for formatting. */
  parts: FormulaPart[];
  chargeNotation: ChargeNotation | null;
  span: SourceSpan;
}

/** A warning about how something was read; `code` is stable, `message` is for people. */
export interface ParseWarning {
  code: string;
  message: string;
  /** Term index (species terms only, from 0 in input order). */
  term?: number;
  column?: number;
}

/** A species term of an equation. */
export interface SpeciesTerm {
  species: ParsedSpecies;
  side: Side;
  /** Coefficient as exact fraction text; "1" when none was written. */
  coefficient: string;
  /** Whether the user wrote a coefficient. */
  coefficientWritten: boolean;
}

/** An energy value converted to kJ/mol, with what the user typed. */
export interface EnthalpyValue {
  /** kJ per mole of reaction as written; negative = exothermic. */
  value: number;
  /** Same unit as `value`, when an uncertainty (± u) was typed. */
  uncertainty?: number;
  stated: { value: number; unit: EnergyUnit; perMol: boolean; uncertainty?: number };
}

/** A heat term written on one side of an equation, e.g. `+ 120.5 kJ`. */
export interface HeatTerm {
  side: Side;
  /** kJ per mole of reaction as written (always the magnitude typed, converted). */
  value: number;
  stated: { value: number; unit: EnergyUnit };
  span: SourceSpan;
}

/** An equation model: what reverse/scale/format operate on. */
export interface EquationModel {
  /** Species terms in input order (reactants first as typed, then products). */
  terms: SpeciesTerm[];
  /** ΔH of the reaction as written in kJ/mol (heat terms already folded in), or null. */
  enthalpy: EnthalpyValue | null;
}

/** The result of `parseEquation`. */
export interface ParsedEquation extends EquationModel {
  source: string;
  /** The arrow as typed. */
  arrow: string;
  /** Whether the arrow marks an equilibrium (`<=>`, `⇌`). */
  equilibrium: boolean;
  /** Heat terms as typed; their effect is already included in `enthalpy`. */
  heatTerms: HeatTerm[];
  /** The trailing ΔH as typed, if any (before heat terms were folded in). */
  statedEnthalpy: EnthalpyValue | null;
  warnings: ParseWarning[];
}
