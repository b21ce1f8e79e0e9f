/**
 * Shapes the Peggy grammar (grammar/equation.peggy) returns. Offsets are from 0, end exclusive.
 * Numbers stay as text here; `parse.ts` turns them into exact fractions.
 */

export interface AstSpan {
  start: number;
  end: number;
}

/** An element with its subscript, or a bracketed group of items with its multiplier. */
export type AstItem =
  | { kind: 'element'; symbol: string; count: number; countText: string | null; start: number; end: number }
  | {
      kind: 'group';
      bracket: '(' | '[';
      items: AstItem[];
      count: number;
      countText: string | null;
      start: number;
      end: number;
    };

/** A hydrate or adduct part; `multiplier` n/d as typed (whole numbers), null when none was written. */
export interface AstPart {
  multiplier: { n: number; d: number } | null;
  items: AstItem[];
  start: number;
}

/** A charge as typed, before the charge-reading rules of species.ts. */
export interface AstCharge {
  /** Magnitude as typed (null = no digits, i.e. 1). */
  digits: string | null;
  sign: 1 | -1;
  notation: 'caret' | 'braces' | 'parentheses' | 'superscript' | 'trailing-sign';
  start: number;
  end: number;
}

/** A phase label with its optional descriptor: `(cr, graphite)`. */
export interface AstPhase {
  phase: string;
  descriptor: string | null;
  start: number;
  end: number;
}

/** A species as typed: hydrate/adduct parts, charge and phase (the electron has no parts). */
export interface AstSpecies {
  electron: boolean;
  parts: AstPart[];
  charge: AstCharge | null;
  phase: AstPhase | null;
  /** Span of the formula + charge, without phase. */
  start: number;
  end: number;
}

/** A term of an equation: a species with its coefficient as typed, or a heat term. */
export type AstTerm =
  | { kind: 'species'; coefficient: string | null; species: AstSpecies; start: number; end: number }
  | { kind: 'heat'; value: string; unit: string; start: number; end: number };

/** The trailing ΔH as typed (numbers as text). */
export interface AstEnthalpy {
  value: string;
  uncertainty: string | null;
  unit: string;
  perMol: boolean;
  start: number;
  end: number;
}

/** What the Equation start rule returns. */
export interface AstEquation {
  /** Terms in order; null for terms past the parser's `maxTerms` option (counted, not kept). */
  left: Array<AstTerm | null>;
  arrow: { text: string; start: number; end: number };
  right: Array<AstTerm | null>;
  enthalpy: AstEnthalpy | null;
  /** Every term read, kept or not. */
  termCount: number;
}

/** What the FormulaOnly start rule returns. */
export interface AstFormulaOnly {
  species: AstSpecies;
}
