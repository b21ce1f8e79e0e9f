import { EquationParseError } from './errors';
import { excerptAt, positionAt } from './positions';

/** The parts of a Peggy syntax error this module reads (kept structural so no parser import is needed). */
interface PeggyErrorLike {
  message: string;
  expected: ReadonlyArray<{ type: string; description?: string; text?: string; parts?: unknown[] }> | null;
  found: string | null;
  location: { start: { offset: number } };
}

/** True for errors thrown by the generated parser. */
export function isPeggyError(err: unknown): err is PeggyErrorLike {
  return typeof err === 'object' && err !== null && 'location' in err && 'expected' in err && 'found' in err;
}

function where(line: number, column: number): string {
  return line > 1 ? `line ${line}, column ${column}` : `column ${column}`;
}

function describeExpectation(e: { type: string; description?: string; text?: string }): string | null {
  if (e.type === 'other' && e.description) return e.description;
  if (e.type === 'literal' && e.text !== undefined) return `'${e.text}'`;
  if (e.type === 'end') return 'the end of the equation';
  if (e.type === 'class') return 'a digit';
  return null;
}

function joinWords(words: string[]): string {
  if (words.length <= 1) return words[0] ?? '';
  return `${words.slice(0, -1).join(', ')} or ${words[words.length - 1]}`;
}

function describeFound(found: string | null): string {
  if (found === null) return 'the end of the text';
  if (found === '\n' || found === '\r') return 'a line break';
  if (/\s/.test(found)) return 'a space';
  return `'${found}'`;
}

/**
 * Builds an `EquationParseError` at `offset` of `source` with a plain-words message. `what`
 * states the problem (e.g. "unknown element symbol 'Xx'"); " at column N" is appended, or put
 * where `what` says `{at}`.
 */
export function parseErrorAt(
  source: string,
  offset: number,
  what: string,
  expected: string[] = [],
): EquationParseError {
  const { line, column } = positionAt(source, offset);
  const placed = what.includes('{at}')
    ? what.replace('{at}', `at ${where(line, column)}`)
    : `${what} at ${where(line, column)}`;
  const sentence = placed.charAt(0).toUpperCase() + placed.slice(1);
  return new EquationParseError(sentence, {
    line,
    column,
    offset,
    excerpt: excerptAt(source, offset),
    expected,
  });
}

/**
 * Rewrites a Peggy error into plain words for chemists: custom messages from the grammar's
 * `error()` calls keep their text; generic "Expected … but … found" messages become a sentence
 * naming what was found and what could have come there.
 */
export function rewritePeggyError(source: string, err: PeggyErrorLike): EquationParseError {
  const offset = err.location.start.offset;
  if (err.expected === null) return parseErrorAt(source, offset, err.message);

  const expected = [...new Set(err.expected.map(describeExpectation).filter((w): w is string => w !== null))];
  const found = err.found;
  if (found === '\n' || found === '\r') {
    return parseErrorAt(
      source,
      offset,
      'found a line break {at}: only one equation per line here (use the batch input for several)',
      expected,
    );
  }
  if (found === null && expected.some((w) => w.startsWith('an arrow'))) {
    return parseErrorAt(
      source,
      offset,
      'the equation ends {at} without an arrow: write the reactants, an arrow (->, →, =, <=> or ⇌), then the products',
      expected,
    );
  }
  if (found === null && expected.some((w) => w.startsWith('an energy unit'))) {
    return parseErrorAt(source, offset, 'the energy value ending {at} needs a unit: kJ, J, kcal or cal', expected);
  }
  return parseErrorAt(source, offset, `expected ${joinWords(expected)}, but found ${describeFound(found)}`, expected);
}
