import type { Request } from 'express';
import type { Store } from 'express-session';
import type pg from 'pg';
import { extrasOf, nowInSeconds, SESSION_WITH_USER, type SessionExtras, type SessionRow } from './session-read.ts';

export type { SessionExtras } from './session-read.ts';

/**
 * Replaces the store's `get` with one that also reads the session's user. The user found (or null: none, or
 * disabled) is kept beside the session's `passport` object, which express-session hands on to `req.session`
 * unchanged, and `joinedActor(req)` gives it back to passport's deserializer in the same request.
 */
export function readUsersWithSessions(store: Store, pool: pg.Pool) {
  const joined = new WeakMap<object, SessionExtras>();
  store.get = (sid, done) => {
    pool.query<SessionRow>(SESSION_WITH_USER, [sid, nowInSeconds()]).then(({ rows: [row] }) => {
      if (!row) return done(null, null);
      const { passport } = row.sess;
      if (passport && typeof passport === 'object') joined.set(passport, extrasOf(row));
      done(null, row.sess as never);
    }, done);
  };
  /** What was read with this request's session, or undefined (an anonymous request, or not read this way). */
  return (req: Request): SessionExtras | undefined => {
    const passport = (req.session as { passport?: unknown } | undefined)?.passport;
    return passport && typeof passport === 'object' ? joined.get(passport) : undefined;
  };
}
