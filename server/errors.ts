import { errorStatusByCode, type ErrorCode } from '@shared/schemas/errors';

/** The one error class services and middleware throw; the error handler turns it into the envelope. */
export class AppError extends Error {
  readonly status: number;
  constructor(
    readonly code: ErrorCode,
    message: string,
    readonly details?: Record<string, unknown>,
    /** Extra reply headers, e.g. Retry-After. */
    readonly headers?: Record<string, string>,
  ) {
    super(message);
    this.name = 'AppError';
    this.status = errorStatusByCode[code];
  }
}

/** Shorthands for the errors thrown most often. */
export const errors = {
  unauthenticated: (message = 'Sign in first.') => new AppError('unauthenticated', message),
  forbidden: (message = 'Your role does not allow this.') => new AppError('forbidden', message),
  notFound: (what: string) => new AppError('not_found', `${what} was not found.`),
  conflict: (message: string, details?: Record<string, unknown>) => new AppError('conflict', message, details),
  validation: (field: string[], message: string) =>
    new AppError('validation_failed', `${field.join('.')}: ${message}`, { issues: [{ path: field, message }] }),
};
