/**
 * Plain words for a failed API call. The server's own message is preferred (it names the field
 * or the reason); these fill in when a message is missing and add what the client knows, such as
 * the wait before another sign-in attempt. Pure: no Vue, no naive-ui.
 */
import { ApiError, type ClientErrorCode } from '@/api/api-error';
import type { ErrorCode } from '@shared/schemas/errors';

const wordsByCode: Record<ErrorCode | ClientErrorCode, string> = {
  validation_failed: 'Some of the input is not valid.',
  parse_error: 'The text could not be read.',
  bad_request: 'The request could not be understood.',
  unauthenticated: 'Please sign in first.',
  invalid_credentials: 'E-mail or password is wrong.',
  forbidden: 'Your role does not allow this.',
  csrf_rejected: 'The request was refused because it did not come from this page. Reload and try again.',
  not_found: 'That no longer exists, or the address is wrong.',
  conflict: 'That clashes with the current state. Reload and try again.',
  token_expired: 'This link has expired or was already used.',
  payload_too_large: 'That is too large to send.',
  unsupported_media_type: 'The server cannot read that kind of content.',
  unprocessable: 'The request is readable but cannot be carried out.',
  rate_limited: 'Too many requests. Wait a moment and try again.',
  internal: 'The server ran into a problem. Try again; if it persists, tell the site admin.',
  unavailable: 'The service is unavailable right now. Try again shortly.',
  network_error: 'Cannot reach the server. Check your connection and try again.',
  unexpected_reply: 'The server sent an unexpected reply.',
};

/** Seconds to wait, from the server's details or the Retry-After header (merged by http.ts). */
export function retryAfterSeconds(error: ApiError): number | undefined {
  for (const key of ['retryAfterSeconds', 'retryAfter']) {
    const value = error.details[key];
    if (typeof value === 'number' && Number.isFinite(value)) return Math.max(0, Math.ceil(value));
    if (typeof value === 'string' && /^\d+$/.test(value)) return Number(value);
  }
  return undefined;
}

/** One sentence for any thrown value, ready to show. */
export function apiErrorText(error: unknown): string {
  if (!(error instanceof ApiError)) {
    return error instanceof Error && error.message ? `Something went wrong: ${error.message}` : 'Something went wrong.';
  }
  if (error.code === 'rate_limited') {
    const wait = retryAfterSeconds(error);
    return wait === undefined
      ? 'Too many attempts — wait a moment and try again.'
      : `Too many attempts — try again in ${wait} s.`;
  }
  return error.message.trim() !== '' ? error.message : wordsByCode[error.code];
}

/**
 * Per-field messages from a validation_failed error, keyed by the field name without the
 * "body"/"query"/"params" prefix (["body","email"] → "email").
 */
export function fieldErrors(error: unknown): Record<string, string> {
  if (!(error instanceof ApiError) || error.code !== 'validation_failed') return {};
  const issues = error.details.issues;
  if (!Array.isArray(issues)) return {};
  const out: Record<string, string> = {};
  for (const issue of issues) {
    if (typeof issue !== 'object' || issue === null) continue;
    const { path, message } = issue as { path?: unknown; message?: unknown };
    if (!Array.isArray(path) || typeof message !== 'string') continue;
    const parts = path.map(String);
    if (['body', 'query', 'params'].includes(parts[0] ?? '')) parts.shift();
    const key = parts.join('.');
    if (key !== '' && out[key] === undefined) out[key] = message;
  }
  return out;
}
