/**
 * Shapes the Peggy grammar (grammar/equation.peggy) returns. Offsets are from 0, end exclusive.
 * Numbers stay as text here; `parse.ts` turns them into exact fractions.
 */

export interface AstSpan {
  start: number;
  end: number;
}

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

export interface AstCharge {
  /** Magnitude as typed (null = no digits, i.e. 1). */
  digits: string | null;
  sign: 1 | -1;
  notation: 'caret' | 'braces' | 'parentheses' | 'superscript' | 'trailing-sign';
  start: number;
  end: number;
}

export interface AstPhase {
  phase: string;
  descriptor: string | null;
  start: number;
  end: number;
}

export interface AstSpecies {
  electron: boolean;
  parts: AstPart[];
  charge: AstCharge | null;
  phase: AstPhase | null;
  /** Span of the formula + charge, without phase. */
  start: number;
  end: number;
}

export type AstTerm =
  | { kind: 'species'; coefficient: string | null; species: AstSpecies; start: number; end: number }
  | { kind: 'heat'; value: string; unit: string; start: number; end: number };

export interface AstEnthalpy {
  value: string;
  uncertainty: string | null;
  unit: string;
  perMol: boolean;
  start: number;
  end: number;
}

export interface AstEquation {
  /** Terms in order; null for terms past the parser's `maxTerms` option (counted, not kept). */
  left: Array<AstTerm | null>;
  arrow: { text: string; start: number; end: number };
  right: Array<AstTerm | null>;
  enthalpy: AstEnthalpy | null;
  /** Every term read, kept or not. */
  termCount: number;
}

export interface AstFormulaOnly {
  species: AstSpecies;
}
