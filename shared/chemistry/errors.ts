import type { ErrorCode } from '../schemas/errors';
import { placedProblem, unplacedProblem, workLimitMessage, type WorkLimitName } from './messages';
import type { ParsePosition } from './types';

/** The API error codes the chemistry core can raise (see shared/schemas/errors.ts for their statuses). */
export type ChemistryErrorCode = Extract<
  ErrorCode,
  'parse_error' | 'validation_failed' | 'unprocessable' | 'payload_too_large'
>;

/**
 * Base class for errors the chemistry core throws on bad input. It carries an API error code and
 * the details a user needs to fix the input; the server's error handler maps it to the envelope.
 * `details` is plain JSON data (safe to send, or to post from a worker thread).
 */
export class ChemistryError extends Error {
  constructor(
    readonly code: ChemistryErrorCode,
    message: string,
    readonly details?: Record<string, unknown>,
  ) {
    super(message);
    this.name = new.target.name;
  }
}

/**
 * Text that cannot be read as a formula or equation. `position` says where (line and column from
 * 1, offset from 0, `length` of the faulty text, 0 when something is missing); `problem` is the
 * sentence without its place, `message` the sentence with it.
 */
export class EquationParseError extends ChemistryError {
  /** The problem in words, without the place. */
  readonly problem: string;

  constructor(
    /** The problem as a template of `messages.ts` ("{at}" marks where the place goes). */
    readonly template: string,
    readonly position: ParsePosition,
  ) {
    super('parse_error', placedProblem(template, position.line, position.column), { ...position });
    this.problem = unplacedProblem(template);
  }

  /** The same problem at another place (e.g. a batch line's position within the whole input). */
  relocated(position: ParsePosition): EquationParseError {
    return new EquationParseError(this.template, position);
  }
}

/**
 * A request that is readable but asks for something impossible (term index out of range, zero
 * coefficient, ΔH that overflows when scaled…). `field` is the request field, e.g. "fixed.2",
 * "normaliseTo" or "equation"; details carry it as a validation issue path ["body", …].
 */
export class BalanceInputError extends ChemistryError {
  constructor(
    message: string,
    readonly field: string,
  ) {
    super('validation_failed', message, { issues: [{ path: ['body', ...field.split('.')], message }] });
  }
}

/**
 * The input asks for more work than the limits allow (see `WorkLimits`); thrown before the work
 * is done. Code `payload_too_large` (HTTP 413); details `{ limit, max, found }`.
 */
export class WorkLimitError extends ChemistryError {
  constructor(
    readonly limit: WorkLimitName,
    readonly max: number,
    readonly found: number,
  ) {
    super('payload_too_large', workLimitMessage(limit, max, found), { limit, max, found });
  }
}
