import { balanceEquationText } from './balance';
import { ChemistryError, EquationParseError } from './errors';
import { checkWorkLimit, DEFAULT_WORK_LIMITS, resolveWorkLimits, type WorkLimits } from './limits';
import type { Balancing } from './types';

/** Options of `balanceEquationLines`. */
export interface BatchOptions {
  /** Work limits (defaults: `DEFAULT_WORK_LIMITS`): `maxCharacters` and `maxLines` for the whole batch, the others per line. */
  limits?: Partial<WorkLimits>;
}

interface LineBase {
  /** Line number in the whole input, from 1. */
  line: number;
  /** The line as typed (without its line break). */
  source: string;
  /** Offset of the line's first character in the whole input, from 0. */
  offset: number;
}

/** A line that was balanced (its status may still be `multiple` or `impossible`). */
export interface BalancedLine extends LineBase {
  balancing: Balancing;
}

/**
 * A line that could not be balanced: an `EquationParseError` placed in the whole input (line,
 * column and offset of the input), a `WorkLimitError` for a line over a per-equation limit, or
 * another `ChemistryError`.
 */
export interface RefusedLine extends LineBase {
  error: ChemistryError;
}

/** One equation line of a batch and its outcome, in input order. */
export type BatchLine = BalancedLine | RefusedLine;

/** Whether a line holds an equation: not blank, and not a comment (first non-space character `#`). */
export function isEquationLine(line: string): boolean {
  for (let i = 0; i < line.length; i++) {
    const c = line.charCodeAt(i);
    if (c === 32 || c === 9 || c === 13 || c === 0xa0 || c === 0x2009 || c === 0x202f || c === 0xfeff) continue;
    return c !== 35; // '#'
  }
  return false;
}

/**
 * Balances one equation per line. Blank lines and lines whose first non-space character is `#`
 * are skipped; `line` numbers (from 1) are those of the input, and parse errors are placed in the
 * input. Lines are independent: a bad line gets its own entry and does not stop the others.
 *
 * @throws WorkLimitError before any line is read when the text has more than `maxCharacters`
 *   characters or more than `maxLines` equation lines.
 */
export function balanceEquationLines(text: string, options: BatchOptions = {}): BatchLine[] {
  const limits = options.limits === undefined ? DEFAULT_WORK_LIMITS : resolveWorkLimits(options.limits);
  checkWorkLimit('characters', limits.maxCharacters, text.length);
  const lines = text.split('\n');
  let equations = 0;
  for (const raw of lines) if (isEquationLine(raw)) equations++;
  checkWorkLimit('lines', limits.maxLines, equations);

  const lineLimits = { limits };
  const out: BatchLine[] = [];
  let offset = 0;
  lines.forEach((raw, i) => {
    const lineOffset = offset;
    offset += raw.length + 1;
    if (!isEquationLine(raw)) return;
    const source = raw.endsWith('\r') ? raw.slice(0, -1) : raw;
    const line = i + 1;
    try {
      out.push({ line, source, offset: lineOffset, balancing: balanceEquationText(source, lineLimits) });
    } catch (err) {
      if (err instanceof EquationParseError) {
        const at = err.position;
        out.push({
          line,
          source,
          offset: lineOffset,
          error: err.relocated({ ...at, line, offset: lineOffset + at.offset }),
        });
      } else if (err instanceof ChemistryError) {
        out.push({ line, source, offset: lineOffset, error: err });
      } else {
        throw err;
      }
    }
  });
  return out;
}
