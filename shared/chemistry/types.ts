/**
 * The chemistry core's own model: what the parser reads and what the balancer answers. Pure data,
 * no behaviour. The API's reply shapes (shared/schemas/balance*.ts) are built from these by one
 * adapter (`balance-reply.ts`); nothing in the core depends on them.
 *
 * Conventions used throughout `shared/chemistry`:
 * - Stoichiometric coefficients and atom counts are exact rationals (`Rat`, BigInt numerator and
 *   denominator); counts are per formula unit and may be fractional (CaSO4·½H2O has 4.5 O).
 * - Energies are in kJ/mol inside the core, per mole of reaction *as written*.
 * - Sign convention: ΔH < 0 is exothermic (heat released to the surroundings).
 * - Standard state as recorded by the caller; the parser only reads the phase label.
 * - Offsets count UTF-16 code units from 0 (end exclusive); lines and columns count from 1.
 */
import type { ChargeSigns } from './messages';
import type { Rat } from './rational';

export type { Rat } from './rational';

/** Phase labels the equation language accepts after a species. */
export type Phase = 's' | 'l' | 'g' | 'aq' | 'cr' | 'am';

/** Which side of the arrow a term stands on. */
export type Side = 'reactant' | 'product';

/**
 * Element symbol (or `D`/`T` for deuterium/tritium) → atoms per formula unit, exact. Keys appear in
 * order of first appearance in the formula; counts are positive (whole, or fractional for
 * fractional formula units).
 */
export type Composition = Readonly<Record<string, Rat>>;

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

/** Where a parse problem is: line and column from 1, offset from 0, `length` of the faulty text (0 = something is missing). */
export interface ParsePosition {
  line: number;
  column: number;
  offset: number;
  length: number;
  /** The line around the spot, with "…" where cut. */
  excerpt: string;
  /** What could have come at the spot, in words. */
  expected: string[];
}

/** One group or element inside a formula as typed, kept for faithful formatting. Counts are whole numbers ≥ 1. */
export type FormulaItem =
  | { kind: 'element'; symbol: string; count: number }
  | { kind: 'group'; bracket: '(' | '['; items: FormulaItem[]; count: number };

/**
 * One part of an adduct or hydrate: `CuSO4·5H2O` has two parts, CuSO4 (multiplier 1) and H2O
 * (multiplier 5); `CaSO4·½H2O` has H2O with multiplier 1/2.
 */
export interface FormulaPart {
  multiplier: Rat;
  items: FormulaItem[];
}

/** How a charge was written, so warnings can point at the reading. */
export type ChargeNotation = 'caret' | 'braces' | 'parentheses' | 'superscript' | 'trailing-sign' | 'after-bracket';

/** A species as read by the parser: formula, composition, charge and optional phase. */
export interface ParsedSpecies {
  /** Plain caret notation without phase, e.g. "SO4^2-", "[Fe(CN)6]^3-", "CuSO4·5H2O", "CaSO4·1/2H2O", "e^-". */
  formula: string;
  /** Atoms per formula unit over the whole species (hydrate water included). Empty for the electron. */
  composition: Composition;
  /** Net charge in elementary charges (a whole number). */
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
  /** Where the formula and charge were typed (without the phase label). */
  span: SourceSpan;
}

/** Stable warning codes. */
export type WarningCode =
  'ambiguous_charge' | 'heat_term_disagrees' | 'enthalpy_not_carried' | 'other_balancings' | 'basis_truncated';

/** A warning about how something was read or balanced; `code` is stable, `message` is for people. */
export interface ParseWarning {
  code: WarningCode;
  message: string;
  /** Term index (species terms only, from 0 in input order). */
  term?: number;
  /** Column (from 1) the warning points at. */
  column?: number;
}

/** A species term of an equation. */
export interface SpeciesTerm {
  species: ParsedSpecies;
  side: Side;
  /** Exact coefficient (1 when none was written). */
  coefficient: Rat;
  /** Whether the user wrote a coefficient. */
  coefficientWritten: boolean;
}

/** An energy value converted to kJ/mol, with what the user typed. Always finite. */
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

/** An equation: what reverse, scale and format operate on. */
export interface EquationModel {
  /** Species terms in order: reactants first as typed, then products. */
  terms: SpeciesTerm[];
  /** ΔH of the reaction as written in kJ/mol (heat terms already folded in), or null. */
  enthalpy: EnthalpyValue | null;
  /** Whether the arrow marks an equilibrium (`<=>`, `⇌`). */
  equilibrium: boolean;
}

/** The result of `parseEquation`: the equation as typed, with what the parser noticed. */
export interface ParsedEquation extends EquationModel {
  source: string;
  /** The arrow as typed. */
  arrow: string;
  /** Heat terms as typed; their effect is already included in `enthalpy`. */
  heatTerms: HeatTerm[];
  /** The trailing ΔH as typed, if any (before heat terms were folded in). */
  statedEnthalpy: EnthalpyValue | null;
  warnings: ParseWarning[];
}

/** The three outcomes of balancing. */
export type BalanceStatus = 'balanced' | 'multiple' | 'impossible';

/** Totals of one element (or of the charge, key "charge") on each side: Σ coefficient × count. */
export interface ElementTotals {
  /** Element symbol, or "charge" (in elementary charges). */
  element: string;
  reactants: Rat;
  products: Rat;
}

/**
 * Why no balancing with every coefficient positive exists. Term indexes from 0 in input order;
 * `message` says it in words.
 */
export type ImpossibleReason = { message: string } & (
  | {
      /** Elements found on one side only, and/or a charge that only one side can carry. */
      kind: 'one_side';
      elements: Array<{ element: string; side: Side }>;
      charge: { reactants: ChargeSigns; products: ChargeSigns } | null;
    }
  | { kind: 'only_zero'; /** Element keys (and "charge") that cannot all balance. */ conserved: string[] }
  | { kind: 'must_vanish'; /** Terms that are 0 in every balancing. */ terms: number[] }
  | { kind: 'must_change_side'; /** Terms the only balancing gives a negative coefficient. */ terms: number[] }
  | { kind: 'no_positive_balancing' }
);

/**
 * What `balanceEquation` answers.
 * - `balanced`: one answer in `equation` (smallest whole numbers, or as typed when they balance,
 *   or as chosen by fixed coefficients; normalised when asked).
 * - `multiple`: `dimension` independent balancings; `basis` lists up to the basis limit of them
 *   (integer vectors in term order, positive = on the side written), `equation` holds an example
 *   with every coefficient positive.
 * - `impossible`: `impossible` says why; `equation` keeps the coefficients as typed.
 */
export interface Balancing {
  status: BalanceStatus;
  /** The equation as read. */
  reading: ParsedEquation;
  /** The answer: the reading's species with the coefficients found, and ΔH when it carries over. */
  equation: EquationModel;
  /** Whether the coefficients as typed balance. */
  asGiven: boolean;
  /** Per-element totals of the coefficients as typed, when they do not balance. */
  givenTotals: ElementTotals[] | null;
  /** Number of independent balancings (after fixed coefficients, when given). */
  dimension: number;
  /** Independent balancings as primitive integer vectors in term order (at most `maxBasisVectors`). */
  basis: bigint[][];
  /** True when `basis` lists fewer vectors than `dimension`. */
  basisTruncated: boolean;
  impossible: ImpossibleReason | null;
  /** Warnings of the balancing step (the reading's own are in `reading.warnings`). */
  warnings: ParseWarning[];
}
