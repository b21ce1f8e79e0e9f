import type { ErrorCode } from '@shared/schemas/errors';

/**
 * Codes the client adds to the server's closed list: the server never sends these, they describe
 * failures that happen before or after the server could answer in its envelope.
 */
export type ClientErrorCode = 'network_error' | 'unexpected_reply';

/** Every failed API call surfaces as this one error type, whatever went wrong. */
export class ApiError extends Error {
  constructor(
    /** HTTP status; 0 when the server could not be reached at all. */
    readonly status: number,
    readonly code: ErrorCode | ClientErrorCode,
    message: string,
    readonly details: Record<string, unknown> = {},
  ) {
    super(message);
    this.name = 'ApiError';
  }
}

/** Narrowing helper for catch blocks (`catch (e) { if (isApiError(e)) … }`). */
export function isApiError(value: unknown): value is ApiError {
  return value instanceof ApiError;
}
