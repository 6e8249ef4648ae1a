import connectPgSimple from 'connect-pg-simple';
import session from 'express-session';
import type { RequestHandler } from 'express';
import type pg from 'pg';
import type { Config } from '../config.ts';

declare module 'express-session' {
  interface SessionData {
    /** When the user signed in (ms since epoch): sessions end after an absolute lifetime too. */
    signedInAt?: number;
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
  });
  const middleware = session({
    name: sessionCookieName(config),
    secret: config.sessionSecret,
    store,
    resave: false,
    saveUninitialized: false,
    rolling: true,
    cookie: {
      httpOnly: true,
      sameSite: 'lax',
      secure: config.cookieSecure,
      path: '/',
      maxAge: config.sessionIdleMs,
    },
  });
  return { middleware, close: () => store.close() };
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
