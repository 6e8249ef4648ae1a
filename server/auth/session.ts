import connectPgSimple from 'connect-pg-simple';
import session from 'express-session';
import type { RequestHandler } from 'express';
import type pg from 'pg';
import type { Config } from '../config.ts';
import { readUsersWithSessions } from './session-store.ts';

declare module 'express-session' {
  interface SessionData {
    /** When the user signed in (ms since epoch): sessions end after an absolute lifetime too. */
    signedInAt?: number;
    /** When the session's idle clock was last reset (ms since epoch); see idleRenewal. */
    renewedAt?: number;
  }
}

export function sessionCookieName(config: Config): string {
  // The __Host- prefix requires Secure, so it is only used when served over HTTPS.
  return config.cookieSecure ? '__Host-gapwright.sid' : 'gapwright.sid';
}

export function createSessionMiddleware(config: Config, pool: pg.Pool) {
  const PgStore = connectPgSimple(session);
  const store = new PgStore({
    pool,
    tableName: 'session',
    createTableIfMissing: false,
    pruneSessionInterval: config.env === 'test' ? false : 900,
    // express-session touches the store on every request; idleRenewal below renews the expiry instead.
    disableTouch: true,
  });
  const readWithSession = readUsersWithSessions(store, pool);
  const middleware = session({
    name: sessionCookieName(config),
    secret: config.sessionSecret,
    store,
    resave: false,
    saveUninitialized: false,
    // Not rolling: renewing the idle clock on every request costs a database write per request. idleRenewal
    // renews it at most every tenth of the idle time instead.
    rolling: false,
    cookie: {
      httpOnly: true,
      sameSite: 'lax',
      secure: config.cookieSecure,
      path: '/',
      maxAge: config.sessionIdleMs,
    },
  });
  return { middleware, readWithSession, close: () => store.close() };
}

/** Ends a session that has outlived its absolute lifetime, however active it has been. */
export function absoluteLifetime(config: Config): RequestHandler {
  return (req, _res, next) => {
    const started = req.session?.signedInAt;
    if (started && Date.now() - started > config.sessionAbsoluteMs) {
      // Regenerate rather than destroy: later middleware still expects a session object.
      req.session.regenerate((err) => next(err));
      return;
    }
    next();
  };
}

/** How often an active session's idle clock is reset (ms): a tenth of the idle time, at least once a minute. */
export const renewalInterval = (config: Config) => Math.min(60_000, config.sessionIdleMs / 10);

/**
 * Keeps an active session alive: at most once per tenth of the idle time (and at least once a minute) the session
 * is marked, so it is saved with a fresh expiry and the cookie is sent again. The idle timeout is thereby enforced
 * to within a tenth of itself, without a store write on every request.
 */
export function idleRenewal(config: Config): RequestHandler {
  const every = renewalInterval(config);
  return (req, _res, next) => {
    const current = req.session;
    // Only sessions that hold something (a sign-in or a CSRF token); an anonymous request must not create one.
    if (current && Object.keys(current).some((key) => key !== 'cookie')) {
      const now = Date.now();
      if (!current.renewedAt || now - current.renewedAt >= every) current.renewedAt = now;
    }
    next();
  };
}
