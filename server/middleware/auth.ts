import type { CookieOptions, Request, RequestHandler, Response } from 'express';
import type { AppDeps } from '../context';
import { AppError } from '../errors';
import { resolveApiToken, resolveSession } from '../services/session.service';
import { serviceContext } from './service-context';

/** Name of the session cookie. */
export const SESSION_COOKIE = 'tl_session';

function cookieOptions(req: Request): CookieOptions {
  // Secure only over HTTPS (req.secure honours "trust proxy"), so plain-HTTP development still works.
  return { httpOnly: true, sameSite: 'lax', secure: req.secure, path: '/' };
}

/** Sets the session cookie after sign-in. */
export function setSessionCookie(req: Request, res: Response, secret: string, expiresAt: Date): void {
  res.cookie(SESSION_COOKIE, secret, { ...cookieOptions(req), expires: expiresAt });
}

/** Removes the session cookie from the browser. */
export function clearSessionCookie(req: Request, res: Response): void {
  res.clearCookie(SESSION_COOKIE, cookieOptions(req));
}

/**
 * Resolves who is calling: `Authorization: Bearer tl_…` first, else the `tl_session` cookie.
 * A bad token is a 401 at once (a script should hear about it); a stale cookie just makes the
 * request anonymous and is cleared.
 */
export function authenticate(deps: AppDeps): RequestHandler {
  return async (req, res, next) => {
    res.locals.principal = null;
    res.locals.cookieAuth = false;
    const header = req.get('authorization');
    if (header !== undefined) {
      const match = /^Bearer\s+(\S+)\s*$/i.exec(header);
      if (!match) throw new AppError('unauthenticated', 'Send the API token as "Authorization: Bearer tl_…".');
      const principal = await resolveApiToken(serviceContext(deps, req, res), { secret: match[1]! });
      if (!principal) throw new AppError('unauthenticated', 'This API token is not valid, has expired or was revoked.');
      res.locals.principal = principal;
      return next();
    }
    const secret: unknown = req.cookies?.[SESSION_COOKIE];
    if (typeof secret === 'string' && secret.length > 0) {
      res.locals.cookieAuth = true;
      const principal = await resolveSession(serviceContext(deps, req, res), { secret });
      if (principal) res.locals.principal = principal;
      else clearSessionCookie(req, res);
    }
    next();
  };
}
