import { randomUUID } from 'node:crypto';
import type { RequestHandler } from 'express';

/** Gives each request an id, echoed in X-Request-Id and quoted in 500 replies and logs. */
export function requestId(): RequestHandler {
  return (_req, res, next) => {
    res.locals.requestId = randomUUID();
    res.setHeader('X-Request-Id', res.locals.requestId);
    next();
  };
}
