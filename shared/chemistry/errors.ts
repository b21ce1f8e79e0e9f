import type { ErrorCode } from '../schemas/errors';
import type { ParseErrorDetails } from '../schemas/balance';

/**
 * Base class for errors the chemistry core throws on bad input. It carries an API error code and
 * the details a user needs to fix the input; the server's error handler maps it to the envelope.
 */
export class ChemistryError extends Error {
  constructor(
    readonly code: Extract<ErrorCode, 'parse_error' | 'validation_failed' | 'unprocessable'>,
    message: string,
    readonly details?: Record<string, unknown>,
  ) {
    super(message);
    this.name = new.target.name;
  }
}

/** Text that cannot be read as a formula or equation; position counted from 1. */
export class EquationParseError extends ChemistryError {
  constructor(
    message: string,
    readonly position: ParseErrorDetails,
  ) {
    super('parse_error', message, { ...position });
  }
}

/** A request that is readable but asks for something impossible (term index out of range, zero coefficient…). */
export class BalanceInputError extends ChemistryError {
  constructor(message: string, field: string) {
    super('validation_failed', message, { issues: [{ path: ['body', ...field.split('.')], message }] });
  }
}
