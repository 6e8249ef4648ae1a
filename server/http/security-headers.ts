import helmet from 'helmet';
import type { RequestHandler } from 'express';
import type { Config } from '../config.ts';

/**
 * Strict CSP: scripts only from our own origin (the built app has no inline scripts).
 * Inline styles stay allowed because Angular and Material inject component styles at run time.
 * HSTS and upgrade-insecure-requests only make sense when the site is served over HTTPS.
 */
export function securityHeaders(config: Config) {
  return helmet({
    contentSecurityPolicy: {
      useDefaults: false,
      directives: {
        'default-src': ["'self'"],
        'script-src': ["'self'"],
        'script-src-attr': ["'none'"],
        'style-src': ["'self'", "'unsafe-inline'"],
        'img-src': ["'self'", 'data:', 'blob:'],
        'font-src': ["'self'", 'data:'],
        'connect-src': ["'self'"],
        'object-src': ["'none'"],
        'base-uri': ["'self'"],
        'form-action': ["'self'"],
        'frame-ancestors': ["'none'"],
        ...(config.cookieSecure ? { 'upgrade-insecure-requests': [] } : {}),
      },
    },
    strictTransportSecurity: config.cookieSecure ? { maxAge: 31_536_000, includeSubDomains: true } : false,
    referrerPolicy: { policy: 'no-referrer' },
    crossOriginEmbedderPolicy: false,
  });
}

/** API answers hold one person's data (JSON, PDF, CSV): no browser or proxy may keep a copy. */
export const noStore: RequestHandler = (_req, res, next) => {
  res.setHeader('Cache-Control', 'no-store');
  next();
};
