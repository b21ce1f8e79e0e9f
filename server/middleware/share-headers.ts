import type { RequestHandler } from 'express';

/**
 * Share links carry their token in the path, so their pages and replies must not leak it: no
 * Referer to any other site or resource (Referrer-Policy: no-referrer), and no place in search
 * engines (X-Robots-Tag: noindex). Set for /shared/… (the page) and /api/v1/shared/… (its data).
 */
export function shareHeaders(): RequestHandler {
  return (_req, res, next) => {
    res.setHeader('Referrer-Policy', 'no-referrer');
    res.setHeader('X-Robots-Tag', 'noindex, nofollow, noarchive');
    next();
  };
}
