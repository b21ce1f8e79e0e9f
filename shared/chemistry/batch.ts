import type { BalanceResult, ParseErrorDetails } from '../schemas/balance';
import { balanceEquationText } from './balance';
import { ChemistryError, EquationParseError } from './errors';

/** A batch line that balanced (or was found impossible/multiple). */
export interface BatchLineResult {
  line: number;
  source: string;
  result: BalanceResult;
}
/** A batch line that could not be read; `details.line` is the line in the whole input. */
export interface BatchLineError {
  line: number;
  source: string;
  error: { message: string; details: ParseErrorDetails };
}
export type BatchLine = BatchLineResult | BatchLineError;

/**
 * Balances one equation per non-empty line. Blank lines and lines whose first non-space
 * character is `#` are skipped; `line` numbers (from 1) are those of the input, and parse errors
 * report the input's line too. Lines are independent: a bad line does not stop the others.
 */
export function parseEquationBatch(text: string): BatchLine[] {
  const out: BatchLine[] = [];
  const lines = text.split('\n');
  let offset = 0;
  lines.forEach((raw, i) => {
    const source = raw.replace(/\r$/, '');
    const lineOffset = offset;
    offset += raw.length + 1;
    const trimmed = source.trim();
    if (trimmed === '' || trimmed.startsWith('#')) return;
    const line = i + 1;
    try {
      out.push({ line, source, result: balanceEquationText({ equation: source }) });
    } catch (err) {
      if (err instanceof EquationParseError) {
        const message =
          err.position.line === 1 && line > 1
            ? err.message.replace(/ at column (\d+)/, ` at line ${line}, column $1`)
            : err.message;
        out.push({
          line,
          source,
          error: { message, details: { ...err.position, line, offset: lineOffset + err.position.offset } },
        });
      } else if (err instanceof ChemistryError) {
        out.push({
          line,
          source,
          error: {
            message: err.message,
            details: { line, column: 1, offset: lineOffset, excerpt: source.slice(0, 48), expected: [] },
          },
        });
      } else {
        throw err;
      }
    }
  });
  return out;
}
