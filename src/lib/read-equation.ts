/**
 * The browser-side reading of the equation field: the shared parser run on each keystroke, its
 * error turned into what the field needs to mark the spot. Pure (no Vue).
 */
import {
  ChemistryError,
  EquationParseError,
  parseEquation,
  type ParsedEquation,
  type ParsePosition,
} from '@shared/chemistry/index';

/** A parse problem as the field shows it: the sentence and the place (line and column from 1, length of the faulty text). */
export interface ParseProblem extends ParsePosition {
  message: string;
}

export type EquationReading =
  { kind: 'empty' } | { kind: 'ok'; parsed: ParsedEquation } | { kind: 'error'; problem: ParseProblem };

/** Reads the text with the shared parser; never throws for bad input. */
export function readEquation(text: string): EquationReading {
  if (text.trim() === '') return { kind: 'empty' };
  try {
    return { kind: 'ok', parsed: parseEquation(text) };
  } catch (error) {
    if (error instanceof EquationParseError)
      return { kind: 'error', problem: { message: error.message, ...error.position } };
    // A work limit (too many terms): the whole text is at fault.
    const message =
      error instanceof ChemistryError
        ? error.message
        : `The equation could not be read (${error instanceof Error ? error.message : String(error)}).`;
    return {
      kind: 'error',
      problem: { message, line: 1, column: 1, offset: 0, length: 0, excerpt: text.slice(0, 40), expected: [] },
    };
  }
}
