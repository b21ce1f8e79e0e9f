import { randomUUID } from 'node:crypto';
import type { IncomingMessage } from 'node:http';
import type { RequestHandler } from 'express';
import type { Logger } from 'pino';
import { pinoHttp } from 'pino-http';

/** The URL as logged: no query string (reset links carry secrets there), invitation and share tokens masked. */
export function loggableUrl(url: string): string {
  return (
    url
      .split('?')[0]!
      .replace(/\/invitations\/[^/]+/, '/invitations/…')
      // The API's /api/v1/shared/… and the share page's /shared/… alike.
      .replace(/\/shared\/[^/]+/, '/shared/…')
  );
}

/**
 * Gives each request an id (echoed in X-Request-Id, quoted in 500 replies) and logs one line per
 * request with pino-http: method, URL without secrets, status, duration. `req.log` carries the
 * request id for anything logged while handling it.
 */
export function requestLog(logger: Logger): RequestHandler {
  const httpLogger = pinoHttp({
    logger,
    genReqId: (_req, res) => {
      const id = randomUUID();
      res.setHeader('X-Request-Id', id);
      return id;
    },
    customLogLevel: (_req, res, err) =>
      err || res.statusCode >= 500 ? 'error' : res.statusCode >= 400 ? 'warn' : 'info',
    serializers: {
      req: (req: IncomingMessage & { id?: unknown; raw?: IncomingMessage }) => ({
        id: req.id,
        method: req.method,
        url: loggableUrl(req.url ?? ''),
      }),
      res: (res: { statusCode: number }) => ({ statusCode: res.statusCode }),
    },
  });
  return (req, res, next) => {
    httpLogger(req, res);
    res.locals.requestId = String(req.id);
    next();
  };
}
