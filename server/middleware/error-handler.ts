import type { ErrorRequestHandler } from 'express';
import { ZodError } from 'zod';
import { ChemistryError } from '@shared/chemistry/errors';
import type { ErrorCode, ErrorEnvelope } from '@shared/schemas/errors';
import { errorStatusByCode } from '@shared/schemas/errors';
import { AppError } from '../errors';
import { toValidationIssues, validationError } from './validate';

interface BodyParserError extends Error {
  type?: string;
  status?: number;
  limit?: number;
}

/** Errors raised by express.json() before any route runs. */
function fromBodyParser(err: BodyParserError): AppError | null {
  switch (err.type) {
    case 'entity.parse.failed':
      return new AppError('bad_request', 'The request body is not valid JSON. Check quotes, commas and brackets.');
    case 'entity.too.large':
      return new AppError(
        'payload_too_large',
        `The request body is too large (the limit is ${Math.round((err.limit ?? 0) / 1024)} kB).`,
      );
    case 'encoding.unsupported':
    case 'charset.unsupported':
      return new AppError('unsupported_media_type', 'Send the body as UTF-8 JSON.');
    case 'request.aborted':
    case 'request.size.invalid':
    case 'stream.encoding.set':
      return new AppError('bad_request', 'The request body could not be read.');
    default:
      return null;
  }
}

function envelope(code: ErrorCode, message: string, details?: Record<string, unknown>): ErrorEnvelope {
  return { error: details === undefined ? { code, message } : { code, message, details } };
}

/**
 * The last middleware: every failure leaves as `{"error": {code, message, details?}}`.
 * Unknown errors are logged with the request id and answered with a bare 500, never a stack.
 */
export function errorHandler(): ErrorRequestHandler {
  return (err: unknown, req, res, next) => {
    if (res.headersSent) return next(err);
    let known: AppError | null = null;
    if (err instanceof AppError) known = err;
    else if (err instanceof ChemistryError) known = new AppError(err.code, err.message, err.details);
    else if (err instanceof ZodError) known = validationError(toValidationIssues('body', err));
    else if (err instanceof Error && 'type' in err) known = fromBodyParser(err as BodyParserError);

    if (known) {
      for (const [name, value] of Object.entries(known.headers ?? {})) res.setHeader(name, value);
      res.status(known.status).json(envelope(known.code, known.message, known.details));
      return;
    }
    const requestId = res.locals.requestId ?? 'unknown';
    console.error(`[error] request ${requestId} ${req.method} ${req.originalUrl}:`, err);
    res.status(errorStatusByCode.internal).json(
      envelope('internal', `Something went wrong on our side. Quote request id ${requestId} when reporting it.`, {
        requestId,
      }),
    );
  };
}
