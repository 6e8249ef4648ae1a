import { createHmac, randomBytes, timingSafeEqual } from 'node:crypto';
import type { Request, RequestHandler, Response } from 'express';
import { csrfSync } from 'csrf-sync';
import type { Config } from '../config.ts';

export const CSRF_COOKIE = 'XSRF-TOKEN';
export const CSRF_HEADER = 'x-xsrf-token';

/** How long a pre-sign-in token is accepted (the sign-in form reloads the session long before this). */
const ANONYMOUS_TOKEN_MS = 12 * 3_600_000;
const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

function headerToken(req: Request): string | undefined {
  const value = req.headers[CSRF_HEADER];
  return typeof value === 'string' ? value : undefined;
}

function cookieToken(req: Request): string | undefined {
  const match = new RegExp(`(?:^|;\\s*)${CSRF_COOKIE}=([^;]*)`).exec(req.headers.cookie ?? '');
  if (!match) return undefined;
  try {
    return decodeURIComponent(match[1]);
  } catch {
    return undefined;
  }
}

const sameText = (a: string, b: string) => {
  const x = Buffer.from(a);
  const y = Buffer.from(b);
  return x.length === y.length && timingSafeEqual(x, y);
};

/** Does this request carry a stored session (a sign-in or a synchroniser token)? Then its own token is required. */
const sessionHoldsToken = (req: Request) =>
  req.session?.csrfToken !== undefined || (req.session !== undefined && 'passport' in req.session);

/**
 * CSRF protection for every write, in two forms:
 * - a session that holds a token (every signed-in session: sign-in issues one) uses the synchroniser token stored
 *   in it, sent by Angular from the XSRF-TOKEN cookie as X-XSRF-TOKEN;
 * - an anonymous visitor (whose only useful write is signing in) gets no stored session at all: its token is a
 *   signed double-submit token (issue time, random part, HMAC with the session secret). A write must send it in the
 *   header and the same value in the cookie, the signature must be ours and not older than ANONYMOUS_TOKEN_MS.
 *   Another site can neither read the cookie nor set the header, so it cannot sign a visitor in either.
 * So an anonymous `GET /api/auth/session` writes no session row.
 */
export function createCsrf(config: Config) {
  const { csrfSynchronisedProtection, generateToken, invalidCsrfTokenError } = csrfSync({ size: 32, getTokenFromRequest: headerToken });
  const secure = config.cookieSecure;

  const mac = (payload: string) => createHmac('sha256', config.sessionSecret).update(`csrf-anonymous:${payload}`).digest('base64url');

  function anonymousToken(): string {
    const payload = `${Date.now().toString(36)}.${randomBytes(18).toString('base64url')}`;
    return `${payload}.${mac(payload)}`;
  }

  function validAnonymousToken(token: string | undefined): boolean {
    const parts = token?.split('.');
    if (!parts || parts.length !== 3) return false;
    const payload = `${parts[0]}.${parts[1]}`;
    if (!sameText(parts[2], mac(payload))) return false;
    const age = Date.now() - parseInt(parts[0], 36);
    return age >= 0 && age <= ANONYMOUS_TOKEN_MS;
  }

  const setCookie = (res: Response, token: string) =>
    res.cookie(CSRF_COOKIE, token, { httpOnly: false, sameSite: 'strict', secure, path: '/' });

  /** Gives the browser its token: the session's own once it holds one (`overwrite` at sign-in), else a signed one. */
  function issueToken(req: Request, res: Response, overwrite = false): void {
    if (overwrite || sessionHoldsToken(req)) {
      setCookie(res, generateToken(req, overwrite));
      return;
    }
    const current = cookieToken(req);
    if (!validAnonymousToken(current)) setCookie(res, anonymousToken());
  }

  const protection: RequestHandler = (req, res, next) => {
    if (SAFE_METHODS.has(req.method)) return next();
    if (sessionHoldsToken(req)) return csrfSynchronisedProtection(req, res, next);
    const sent = headerToken(req);
    if (sent && validAnonymousToken(sent) && sameText(sent, cookieToken(req) ?? '')) return next();
    next(invalidCsrfTokenError);
  };

  return { protection, issueToken };
}
