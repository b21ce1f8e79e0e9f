import { z } from 'zod';

/**
 * The closed list of error codes the API may return, with the HTTP status each maps to.
 * Clients switch on `code`, never on the message text.
 */
export const errorStatusByCode = {
  validation_failed: 400,
  parse_error: 400,
  bad_request: 400,
  unauthenticated: 401,
  invalid_credentials: 401,
  forbidden: 403,
  csrf_rejected: 403,
  not_found: 404,
  conflict: 409,
  token_expired: 410,
  payload_too_large: 413,
  unsupported_media_type: 415,
  unprocessable: 422,
  rate_limited: 429,
  internal: 500,
  unavailable: 503,
} as const;

export type ErrorCode = keyof typeof errorStatusByCode;

export const errorCodes = Object.keys(errorStatusByCode) as [ErrorCode, ...ErrorCode[]];

export const errorCodeSchema = z.enum(errorCodes);

/** One field problem in a `validation_failed` error: `path` names the field, e.g. ["body", "email"]. */
export const validationIssueSchema = z.object({
  path: z.array(z.union([z.string(), z.number()])),
  message: z.string(),
  code: z.string().optional(),
});
export type ValidationIssue = z.infer<typeof validationIssueSchema>;

/** The one error envelope every failing API call returns. */
export const errorEnvelopeSchema = z.object({
  error: z.object({
    code: errorCodeSchema,
    message: z.string(),
    details: z.record(z.string(), z.unknown()).optional(),
  }),
});
export type ErrorEnvelope = z.infer<typeof errorEnvelopeSchema>;
