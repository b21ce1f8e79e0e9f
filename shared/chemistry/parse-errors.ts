import { EquationParseError } from './errors';
import { foundWords, parseMessages } from './messages';
import { excerptAt, positionAt } from './positions';

/** The parts of a Peggy syntax error this module reads (kept structural so no parser import is needed). */
interface PeggyErrorLike {
  message: string;
  expected: ReadonlyArray<{ type: string; description?: string; text?: string; parts?: unknown[] }> | null;
  found: string | null;
  location: { start: { offset: number }; end: { offset: number } };
}

/** True for errors thrown by the generated parser. */
export function isPeggyError(err: unknown): err is PeggyErrorLike {
  return typeof err === 'object' && err !== null && 'location' in err && 'expected' in err && 'found' in err;
}

function describeExpectation(e: { type: string; description?: string; text?: string }): string | null {
  if (e.type === 'other' && e.description) return e.description;
  if (e.type === 'literal' && e.text !== undefined) return `'${e.text}'`;
  if (e.type === 'end') return 'the end of the equation';
  if (e.type === 'class') return 'a digit';
  return null;
}

/**
 * Builds an `EquationParseError` at `offset` of `source`. `template` states the problem (a text of
 * `parseMessages`); `length` is how much of the text is at fault (0 when something is missing).
 */
export function parseErrorAt(
  source: string,
  offset: number,
  template: string,
  length = 0,
  expected: string[] = [],
): EquationParseError {
  const { line, column } = positionAt(source, offset);
  return new EquationParseError(template, {
    line,
    column,
    offset,
    length,
    excerpt: excerptAt(source, offset),
    expected,
  });
}

/**
 * Rewrites a Peggy error into plain words for chemists: problems raised by the grammar's own
 * `error()` calls keep their text (and the span of the rule that raised them); generic
 * "Expected … but … found" failures become a sentence naming what was found and what could have
 * come there, marking the character found.
 */
export function rewritePeggyError(source: string, err: PeggyErrorLike): EquationParseError {
  const offset = err.location.start.offset;
  if (err.expected === null) return parseErrorAt(source, offset, err.message, err.location.end.offset - offset);

  const expected = [...new Set(err.expected.map(describeExpectation).filter((w): w is string => w !== null))];
  const found = err.found;
  const length = found === null ? 0 : found.length;
  if (found === '\n' || found === '\r')
    return parseErrorAt(source, offset, parseMessages.lineBreak(), length, expected);
  if (found === null && expected.some((w) => w.startsWith('an arrow'))) {
    return parseErrorAt(source, offset, parseMessages.missingArrow(), 0, expected);
  }
  if (found === null && expected.some((w) => w.startsWith('an energy unit'))) {
    return parseErrorAt(source, offset, parseMessages.missingUnit(), 0, expected);
  }
  return parseErrorAt(source, offset, parseMessages.expectedButFound(expected, foundWords(found)), length, expected);
}
