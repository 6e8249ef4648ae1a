import { createHmac, timingSafeEqual } from 'node:crypto';
import type { Request, RequestHandler } from 'express';
import type pg from 'pg';
import type { Config } from '../config.ts';
import { renewalInterval, sessionCookieName } from './session.ts';
import { extrasOf, nowInSeconds, SESSION_WITH_USER, type SessionExtras, type SessionRow } from './session-read.ts';

const READS = new Set(['GET', 'HEAD']);

/**
 * The session id in a signed session cookie as express-session writes it (`s:` + id + `.` + HMAC-SHA256 of the id
 * with the secret, base64 without padding), or undefined: no such cookie, or a signature that is not ours.
 */
export function signedSessionId(cookieHeader: string | undefined, cookie: RegExp, secret: string): string | undefined {
  const match = cookieHeader ? cookie.exec(cookieHeader) : null;
  if (!match) return undefined;
  let value: string;
  try {
    value = decodeURIComponent(match[1].trim().replace(/^"(.*)"$/, '$1'));
  } catch {
    return undefined;
  }
  if (!value.startsWith('s:')) return undefined;
  const dot = value.lastIndexOf('.');
  if (dot < 2) return undefined;
  const sid = value.slice(2, dot);
  const sent = Buffer.from(value.slice(dot + 1));
  const expected = Buffer.from(createHmac('sha256', secret).update(sid).digest('base64').replace(/=+$/, ''));
  return sent.length === expected.length && timingSafeEqual(sent, expected) ? sid : undefined;
}

/**
 * The session layer of the API: `full` (express-session, the lifetime checks, passport) for every write and for any
 * read it has work to do on, and a lean path for the common case, a signed-in read:
 * a GET or HEAD (outside /auth) with a validly signed session cookie whose session, read with its user and the data
 * change counters in one prepared query, is unexpired, belongs to an active user, is within its absolute lifetime
 * and needs no idle renewal yet. Then the request is signed in as that user and nothing is written or re-signed,
 * exactly as the full path would have done it (no store write, no cookie). Everything else (no cookie, a bad
 * signature, an ended session, a disabled user, a lifetime passed, a renewal due) goes the full way, which ends,
 * renews or anonymises the session as before.
 */
export function createSessionLayer(
  config: Config,
  pool: pg.Pool,
  full: RequestHandler,
  fullExtras: (req: Request) => SessionExtras | undefined,
) {
  const name = sessionCookieName(config);
  const cookie = new RegExp(`(?:^|;)\\s*${name.replace(/[.]/g, '\\.')}=([^;]*)`);
  const renewEvery = renewalInterval(config);
  const read = new WeakMap<Request, SessionExtras>();

  const current = (sess: SessionRow['sess'], now: number) =>
    typeof sess.signedInAt === 'number' &&
    now - sess.signedInAt <= config.sessionAbsoluteMs &&
    typeof sess.renewedAt === 'number' &&
    now - sess.renewedAt < renewEvery;

  const middleware: RequestHandler = (req, res, next) => {
    const sid =
      READS.has(req.method) && !req.path.startsWith('/auth/')
        ? signedSessionId(req.headers.cookie, cookie, config.sessionSecret)
        : undefined;
    if (sid === undefined) {
      full(req, res, next);
      return;
    }
    pool
      .query<SessionRow>({ name: 'session-with-user', text: SESSION_WITH_USER, values: [sid, nowInSeconds()] })
      .then(({ rows: [row] }) => {
        if (!row || row.id === null || !current(row.sess, Date.now())) {
          full(req, res, next);
          return;
        }
        const extras = extrasOf(row);
        req.user = extras.actor!;
        req.sessionID = sid;
        read.set(req, extras);
        next();
      }, next);
  };

  /** What was read with this request's session (either way), or undefined: an anonymous request. */
  const extras = (req: Request): SessionExtras | undefined => read.get(req) ?? fullExtras(req);
  return { middleware, extras };
}
