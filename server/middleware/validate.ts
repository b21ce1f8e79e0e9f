import type { RequestHandler } from 'express';
import type { z } from 'zod';
import type { ValidationIssue } from '@shared/schemas/errors';
import type { ValidatedParts } from '../context';
import { AppError } from '../errors';

export interface RequestSchemas {
  params?: z.ZodType | undefined;
  query?: z.ZodType | undefined;
  body?: z.ZodType | undefined;
}

function friendlyMessage(issue: z.core.$ZodIssue): string {
  // zod says "Invalid input: expected string, received undefined" for a missing field.
  if (issue.code === 'invalid_type' && /received undefined$/.test(issue.message)) return 'is required.';
  return issue.message;
}

/** Turns zod issues into our ValidationIssue list, each path starting with its part. */
export function toValidationIssues(part: string, error: z.ZodError): ValidationIssue[] {
  return error.issues.map((i) => ({
    path: [part, ...i.path.map((p) => (typeof p === 'symbol' ? String(p) : p))],
    message: friendlyMessage(i),
    code: i.code,
  }));
}

/** 400 validation_failed whose message names the first bad field. */
export function validationError(issues: ValidationIssue[]): AppError {
  const first = issues[0];
  const where = first ? first.path.join('.') : 'request';
  const message = first ? `Check ${where}: ${first.message}` : 'The request is not valid.';
  return new AppError('validation_failed', message, { issues });
}

/**
 * Validates params, query and body with zod; all problems are reported together.
 * The parsed values land in res.locals.input.
 */
export function validate(schemas: RequestSchemas): RequestHandler {
  return (req, res, next) => {
    const issues: ValidationIssue[] = [];
    const out: ValidatedParts = { params: undefined, query: undefined, body: undefined };
    const parts: [keyof ValidatedParts, z.ZodType | undefined, unknown][] = [
      ['params', schemas.params, req.params],
      ['query', schemas.query, req.query],
      ['body', schemas.body, req.body ?? {}],
    ];
    for (const [part, schema, value] of parts) {
      if (!schema) continue;
      const parsed = schema.safeParse(value);
      if (parsed.success) out[part] = parsed.data;
      else issues.push(...toValidationIssues(part, parsed.error));
    }
    if (issues.length > 0) return next(validationError(issues));
    res.locals.input = out;
    next();
  };
}
