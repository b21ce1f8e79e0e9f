import type { RequestHandler } from 'express';
import { AppError } from '../errors';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

function originOf(url: string): string | null {
  try {
    const origin = new URL(url).origin;
    return origin === 'null' ? null : origin.toLowerCase();
  } catch {
    return null;
  }
}

/**
 * Cross-site request forgery guard. A state-changing request that carries the session cookie
 * must come from our own origin — scheme, host and port: its Origin header equals the origin it
 * was sent to (the scheme as the request arrived, honouring a trusted proxy) or the public URL's,
 * or the browser marks it Sec-Fetch-Site: same-origin. Bearer and credential-less requests
 * cannot be forged by another site, so they pass.
 */
export function csrfGuard(publicUrl: string): RequestHandler {
  const publicOrigin = originOf(publicUrl);
  return (req, res, next) => {
    if (SAFE_METHODS.has(req.method) || !res.locals.cookieAuth || req.get('authorization')) return next();
    const origin = req.get('origin');
    if (origin !== undefined && origin !== 'null') {
      const claimed = originOf(origin);
      const host = req.get('host');
      const requestOrigin = host ? originOf(`${req.protocol}://${host}`) : null;
      if (claimed !== null && (claimed === requestOrigin || claimed === publicOrigin)) return next();
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
