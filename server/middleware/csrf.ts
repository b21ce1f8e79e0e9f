import type { RequestHandler } from 'express';
import { AppError } from '../errors';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

function hostOf(origin: string): string | null {
  try {
    return new URL(origin).host.toLowerCase();
  } catch {
    return null;
  }
}

/**
 * Cross-site request forgery guard. A state-changing request that carries the session cookie
 * must come from our own origin: its Origin header names the Host it was sent to (or the public
 * URL), or the browser marks it Sec-Fetch-Site: same-origin. Bearer and credential-less requests
 * cannot be forged by another site, so they pass.
 */
export function csrfGuard(publicUrl: string): RequestHandler {
  const publicHost = hostOf(publicUrl);
  return (req, res, next) => {
    if (SAFE_METHODS.has(req.method) || !res.locals.cookieAuth || req.get('authorization')) return next();
    const origin = req.get('origin');
    if (origin !== undefined && origin !== 'null') {
      const host = hostOf(origin);
      const requestHost = req.get('host')?.toLowerCase();
      if (host !== null && (host === requestHost || host === publicHost)) return next();
      throw new AppError(
        'csrf_rejected',
        `Requests from ${origin} may not change data here. Use Thermoledger from its own address.`,
      );
    }
    if (req.get('sec-fetch-site') === 'same-origin') return next();
    throw new AppError(
      'csrf_rejected',
      'This request carries the session cookie but no Origin header. Browsers send one; scripts should use an API token instead.',
    );
  };
}
