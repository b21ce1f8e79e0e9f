import type { ErrorRequestHandler } from 'express';
import type { Logger } from 'pino';
import { ZodError } from 'zod';
import { ChemistryError } from '@shared/chemistry/errors';
import type { ErrorCode, ErrorEnvelope } from '@shared/schemas/errors';
import { errorStatusByCode } from '@shared/schemas/errors';
import { WorkLimitExceeded } from '../calc/work-limits';
import { AppError } from '../errors';
import { toValidationIssues, validationError } from './validate';

/** What body-parser (express.json) attaches to the errors it raises before any route runs. */
interface BodyParserError extends Error {
  type?: string;
  status?: number;
  limit?: number;
}

/** Errors raised while reading the request body. */
function fromBodyParser(err: BodyParserError): AppError | null {
  switch (err.type) {
    case 'entity.parse.failed':
      return new AppError('bad_request', 'The request body is not valid JSON. Check quotes, commas and brackets.');
    case 'entity.too.large':
      return new AppError(
        'payload_too_large',
        `The request body is too large (the limit is ${Math.round((err.limit ?? 0) / 1024)} kB).`,
        { limit: 'bodyBytes', max: err.limit },
      );
    case 'encoding.unsupported':
      return new AppError(
        'unsupported_media_type',
        'This Content-Encoding is not supported. Send the body uncompressed, or as gzip, deflate or br.',
      );
    case 'charset.unsupported':
      return new AppError('unsupported_media_type', 'Send the body as UTF-8 JSON.');
    case 'request.aborted':
    case 'request.size.invalid':
    case 'stream.encoding.set':
      return new AppError('bad_request', 'The request body could not be read.');
  }
  // A body that does not decompress (corrupt gzip, deflate or br) comes from zlib through
  // body-parser as a plain 400 without a type.
  if (err.status === 400 && typeof (err as NodeJS.ErrnoException).code === 'string') {
    return new AppError(
      'bad_request',
      'The request body could not be decompressed. Check that the Content-Encoding header matches the body.',
    );
  }
  return null;
}

function envelope(code: ErrorCode, message: string, details?: Record<string, unknown>): ErrorEnvelope {
  return { error: details === undefined ? { code, message } : { code, message, details } };
}

function known(err: unknown): AppError | null {
  if (err instanceof AppError) return err;
  if (err instanceof ChemistryError) return new AppError(err.code, err.message, err.details);
  if (err instanceof WorkLimitExceeded) return new AppError(err.problem.code, err.problem.message, err.problem.details);
  if (err instanceof ZodError) return validationError(toValidationIssues('body', err));
  if (err instanceof Error && ('type' in err || 'status' in err)) return fromBodyParser(err as BodyParserError);
  return null;
}

/**
 * The last middleware: every failure leaves as `{"error": {code, message, details?}}`.
 * Unknown errors are logged with the request id and the stack, and answered with a bare 500
 * that quotes the request id, never the stack.
 */
export function errorHandler(fallbackLog: Logger): ErrorRequestHandler {
  return (err: unknown, req, res, next) => {
    if (res.headersSent) return next(err);
    const answer = known(err);
    if (answer) {
      for (const [name, value] of Object.entries(answer.headers ?? {})) res.setHeader(name, value);
      res.status(answer.status).json(envelope(answer.code, answer.message, answer.details));
      return;
    }
    const requestId = res.locals.requestId ?? 'unknown';
    (req.log ?? fallbackLog).error({ err, requestId }, `unhandled error in ${req.method} ${req.path}`);
    res.status(errorStatusByCode.internal).json(
      envelope('internal', `Something went wrong on our side. Quote request id ${requestId} when reporting it.`, {
        requestId,
      }),
    );
  };
}
