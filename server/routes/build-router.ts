import { createReadStream } from 'node:fs';
import { pipeline } from 'node:stream/promises';
import { Router, type Request, type RequestHandler, type Response } from 'express';
import type { AppDeps } from '../context';
import { AppError } from '../errors';
import { RawJson } from '../lib/raw-json';
import { requireAccess } from '../middleware/access';
import { calcLineBudget, calcRequestLimit } from '../middleware/rate-limit';
import { serviceContext } from '../middleware/service-context';
import { validate } from '../middleware/validate';
import { acceptUpload } from '../middleware/upload';
import { FileDownload, FileReply } from '../lib/file-reply';
import { ReplyWithStatus, successStatus, type AnyRoute } from './registry';

function hasBody(req: Request): boolean {
  const length = req.get('content-length');
  return (length !== undefined && length !== '0') || req.get('transfer-encoding') !== undefined;
}

/** A JSON route refuses bodies of other types with 415 (express.json() skipped them). */
function requireJsonBody(): RequestHandler {
  return (req, _res, next) => {
    if (hasBody(req) && !req.is(['application/json', 'application/*+json'])) {
      throw new AppError(
        'unsupported_media_type',
        `Send the body as JSON with "Content-Type: application/json" (got ${req.get('content-type') ?? 'no content type'}).`,
      );
    }
    next();
  };
}

/** Runs the route's cheap work measurement on the raw body (413 over a limit) and keeps the line count. */
function measureWork(route: AnyRoute, deps: AppDeps): RequestHandler {
  return (req, res, next) => {
    res.locals.calcLines = route.measureWork ? route.measureWork(req.body, deps.config) : 1;
    next();
  };
}

/**
 * Streams a stored file as a download: never shown inline, never sniffed into another type, and
 * sandboxed should a browser open it anyway.
 */
async function sendAttachment(res: Response, file: FileReply): Promise<void> {
  res.status(200);
  res.attachment(file.name);
  res.type(file.mediaType);
  res.set({
    'Content-Length': String(file.size),
    'X-Content-Type-Options': 'nosniff',
    'Content-Security-Policy': "default-src 'none'; sandbox",
    'Cache-Control': 'private, no-store',
  });
  await pipeline(createReadStream(file.path), res);
}

function runHandler(route: AnyRoute, deps: AppDeps): RequestHandler {
  const status = successStatus(route);
  const where = `${route.method.toUpperCase()} ${route.path}`;
  return async (req, res) => {
    const input = res.locals.input ?? { params: undefined, query: undefined, body: undefined };
    let result = await route.handler({
      params: input.params,
      query: input.query,
      body: input.body,
      ctx: serviceContext(deps, req, res),
      teamRole: res.locals.teamRole,
      req,
      res,
    });
    if (res.headersSent) return;
    if (result instanceof FileReply) {
      await sendAttachment(res, result);
      return;
    }
    if (result instanceof FileDownload) {
      // Exports: a file with its own type, downloaded under its name. attachment() sets a type
      // from the file extension, so our own type goes after it.
      res.status(status).attachment(result.filename).type(result.contentType).send(result.body);
      return;
    }
    let replyStatus = status;
    if (result instanceof ReplyWithStatus) {
      replyStatus = result.status;
      result = result.body;
    }
    if (!(replyStatus in route.responses)) throw new Error(`${where} answered with undeclared status ${replyStatus}`);
    const replySchema = route.responses[replyStatus] ?? null;
    if (replySchema === null) {
      res.status(replyStatus).end();
      return;
    }
    if (result instanceof RawJson) {
      // Serialised in the calculation worker: checked against the contract outside production, sent as is.
      if (deps.config.checkResponses) {
        const checked = replySchema.safeParse(JSON.parse(result.text));
        if (!checked.success) throw new Error(`Reply of ${where} breaks its schema: ${checked.error.message}`);
      }
      res.status(replyStatus).type('application/json').send(result.text);
      return;
    }
    // Replies go through their schema: drift from the contract fails loudly, and no stray column leaks.
    const checked = replySchema.safeParse(result);
    if (!checked.success) throw new Error(`Reply of ${where} breaks its schema: ${checked.error.message}`);
    res.status(replyStatus).json(checked.data);
  };
}

/**
 * Builds the Express router for a list of routes. Each route runs, in order: its request-rate
 * limit, the access check (so anonymous callers get 401 before any 400), the body type check, the
 * cheap work measurement (413 before any parsing), validation, the line budget, the handler.
 * Authentication and the CSRF check ran earlier, for every request.
 */
export function buildRouter(routes: readonly AnyRoute[], deps: AppDeps): Router {
  const router = Router();
  for (const route of routes) {
    const chain: RequestHandler[] = [];
    if (route.rateLimit === 'calc') chain.push(calcRequestLimit(deps));
    chain.push(requireAccess(route.access, deps));
    if (route.upload) chain.push(...acceptUpload(route.upload, deps));
    else if (route.request?.body) chain.push(requireJsonBody());
    if (route.rateLimit === 'calc') chain.push(measureWork(route, deps));
    chain.push(validate(route.request ?? {}));
    if (route.rateLimit === 'calc') chain.push(calcLineBudget(deps));
    chain.push(runHandler(route, deps));
    router[route.method](route.path, ...chain);
  }
  return router;
}
