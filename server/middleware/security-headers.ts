import type { RequestHandler } from 'express';
import helmet from 'helmet';

/**
 * Protective headers through helmet. Our Content-Security-Policy: everything from our own origin,
 * inline styles only because naive-ui injects <style> tags at run time, no inline scripts, no
 * framing. HSTS goes only on requests that arrived over HTTPS (through a trusted proxy): sent over
 * plain HTTP it would be ignored, and on a development machine it would pin localhost to HTTPS.
 */
export function securityHeaders(): RequestHandler[] {
  const hsts = helmet.strictTransportSecurity({ maxAge: 365 * 86_400, includeSubDomains: true });
  return [
    helmet({
      contentSecurityPolicy: {
        useDefaults: false,
        directives: {
          defaultSrc: ["'self'"],
          scriptSrc: ["'self'"],
          styleSrc: ["'self'", "'unsafe-inline'"],
          imgSrc: ["'self'", 'data:'],
          fontSrc: ["'self'", 'data:'],
          connectSrc: ["'self'"],
          objectSrc: ["'none'"],
          baseUri: ["'self'"],
          formAction: ["'self'"],
          frameAncestors: ["'none'"],
        },
      },
      frameguard: { action: 'deny' },
      referrerPolicy: { policy: 'same-origin' },
      crossOriginOpenerPolicy: { policy: 'same-origin' },
      strictTransportSecurity: false,
    }),
    (req, res, next) => {
      // No powerful browser features are used; say so, so an injected script cannot ask for them either.
      res.setHeader(
        'Permissions-Policy',
        'accelerometer=(), camera=(), display-capture=(), geolocation=(), gyroscope=(), magnetometer=(), microphone=(), midi=(), payment=(), usb=(), xr-spatial-tracking=()',
      );
      if (req.secure) return hsts(req, res, next);
      next();
    },
  ];
}
