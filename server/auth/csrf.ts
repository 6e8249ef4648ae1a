import type { Request, Response } from 'express';
import { csrfSync } from 'csrf-sync';
import type { Config } from '../config.ts';

export const CSRF_COOKIE = 'XSRF-TOKEN';
export const CSRF_HEADER = 'x-xsrf-token';

/**
 * Synchroniser-token CSRF protection: the token lives in the session; Angular's HttpClient
 * reads it from the XSRF-TOKEN cookie and sends it back as X-XSRF-TOKEN on every write.
 */
export function createCsrf(config: Config) {
  const { csrfSynchronisedProtection, generateToken } = csrfSync({
    size: 32,
    getTokenFromRequest: (req) => {
      const value = req.headers[CSRF_HEADER];
      return typeof value === 'string' ? value : undefined;
    },
  });

  function issueToken(req: Request, res: Response, overwrite = false): void {
    const token = generateToken(req, overwrite);
    res.cookie(CSRF_COOKIE, token, { httpOnly: false, sameSite: 'strict', secure: config.cookieSecure, path: '/' });
  }

  return { protection: csrfSynchronisedProtection, issueToken };
}
