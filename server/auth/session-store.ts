import type { Request } from 'express';
import type { Store } from 'express-session';
import type pg from 'pg';
import type { Role } from '@shared/schemas/auth';
import type { Actor } from '../http/access.ts';

// The session and its signed-in user in one query: the user is still read fresh on every request (a disabled
// account or a changed role counts at once), but without a second round trip after the session's own. The same
// query reads the data change counters (drizzle/0004_change_counters.sql) that let listings be answered from cache.
const SESSION_WITH_USER = `
  select s.sess, u.id, u.username, u.display_name, u.role,
    (select json_object_agg(c.name, c.n::text) from change_counters c) as generations
  from session s
  left join users u
    on u.id = case when (s.sess->'passport'->>'user') ~ '^[0-9]{1,9}$' then (s.sess->'passport'->>'user')::int end
   and not u.disabled
  where s.sid = $1 and s.expire >= to_timestamp($2)`;

interface Row {
  sess: Record<string, unknown> & { passport?: { user?: unknown } };
  id: number | null;
  username: string;
  display_name: string;
  role: Role;
  generations: Record<string, string> | null;
}

/** What was read with a request's session: its user (null: none or disabled) and the data change counters. */
export interface SessionExtras {
  actor: Actor | null;
  generations: Record<string, string>;
}

/**
 * Replaces the store's `get` with one that also reads the session's user. The user found (or null: none, or
 * disabled) is kept beside the session's `passport` object, which express-session hands on to `req.session`
 * unchanged, and `joinedActor(req)` gives it back to passport's deserializer in the same request.
 */
export function readUsersWithSessions(store: Store, pool: pg.Pool) {
  const joined = new WeakMap<object, SessionExtras>();
  store.get = (sid, done) => {
    // The same expiry test as connect-pg-simple's own get, on the app's clock.
    pool.query<Row>(SESSION_WITH_USER, [sid, Math.ceil(Date.now() / 1000)]).then(({ rows: [row] }) => {
      if (!row) return done(null, null);
      const { passport } = row.sess;
      if (passport && typeof passport === 'object') {
        const actor = row.id === null ? null : { id: row.id, username: row.username, displayName: row.display_name, role: row.role };
        joined.set(passport, { actor, generations: row.generations ?? {} });
      }
      done(null, row.sess as never);
    }, done);
  };
  /** What was read with this request's session, or undefined (an anonymous request, or not read this way). */
  return (req: Request): SessionExtras | undefined => {
    const passport = (req.session as { passport?: unknown } | undefined)?.passport;
    return passport && typeof passport === 'object' ? joined.get(passport) : undefined;
  };
}
