import type { Role } from '@shared/schemas/auth';
import type { Actor } from '../http/access.ts';

// The session and its signed-in user in one query: the user is still read fresh on every request (a disabled
// account or a changed role counts at once), but without a second round trip after the session's own. The same
// query reads the data change counters (drizzle/0004_change_counters.sql) that let listings be answered from cache.
// The expiry test is connect-pg-simple's own, on the app's clock.
export const SESSION_WITH_USER = `
  select s.sess, u.id, u.username, u.display_name, u.role,
    (select json_object_agg(c.name, c.n::text) from change_counters c) as generations
  from session s
  left join users u
    on u.id = case when (s.sess->'passport'->>'user') ~ '^[0-9]{1,9}$' then (s.sess->'passport'->>'user')::int end
   and not u.disabled
  where s.sid = $1 and s.expire >= to_timestamp($2)`;

export interface SessionRow {
  sess: Record<string, unknown> & { passport?: { user?: unknown }; signedInAt?: unknown; renewedAt?: unknown };
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

export const extrasOf = (row: SessionRow): SessionExtras => ({
  actor: row.id === null ? null : { id: row.id, username: row.username, displayName: row.display_name, role: row.role },
  generations: row.generations ?? {},
});

export const nowInSeconds = () => Math.ceil(Date.now() / 1000);
