import type { RequestHandler } from 'express';
import { AppError } from '../errors';

/** JSON 404 for any /api path no route matched. */
export function apiNotFound(): RequestHandler {
  return (req) => {
    throw new AppError('not_found', `There is no API route ${req.method} ${req.originalUrl.split('?')[0]}.`);
  };
}
