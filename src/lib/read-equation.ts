/**
 * The browser-side reading of the equation field: the shared parser run on each keystroke, its
 * error turned into what the field needs to mark the spot. Pure (no Vue).
 */
import { EquationParseError, parseEquation, type ParsedEquation } from '@shared/chemistry/index';

/** A parse problem as the field shows it: plain words and the place, line and column from 1. */
export interface ParseProblem {
  message: string;
  line: number;
  column: number;
  offset: number;
  excerpt: string;
  expected: string[];
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
    // Any other failure is a bug in the core; show it rather than crash the page.
    const message = error instanceof Error ? error.message : String(error);
    return {
      kind: 'error',
      problem: {
        message: `The equation could not be read (${message}).`,
        line: 1,
        column: 1,
        offset: 0,
        excerpt: text.slice(0, 40),
        expected: [],
      },
    };
  }
}
