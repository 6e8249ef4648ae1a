import type { IncomingMessage } from 'node:http';
import type { Request } from 'express';
import passportModule from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import type { UsersService } from '../users/users.service.ts';
import type { UserRow } from '../users/users.repository.ts';
import type { Actor } from '../http/access.ts';

export const toActor = (row: UserRow): Actor => ({
  id: row.id,
  username: row.username,
  displayName: row.displayName,
  role: row.role,
});

/** A passport instance of our own (not the global one), so several apps can live in one test process. */
export type AppPassport = InstanceType<typeof passportModule.Authenticator>;

/** The user already read with the request's session (see session-store.ts), if it was. */
type JoinedActor = (req: Request) => { actor: Actor | null } | undefined;

export function createPassport(users: UsersService, joinedActor: JoinedActor = () => undefined): AppPassport {
  const passport = new passportModule.Authenticator();
  passport.use(
    new LocalStrategy({ session: true }, (username, password, done) => {
      users.verifyCredentials(username, password).then(
        (row) => done(null, row ? toActor(row) : false),
        (err: unknown) => done(err),
      );
    }),
  );
  passport.serializeUser((user, done) => done(null, user.id));
  // Loaded fresh each request: a disabled user or a changed role takes effect at once. Usually it was read in the
  // same query as the session; otherwise it is read here.
  passport.deserializeUser((req: IncomingMessage, id: number, done: (err: unknown, user?: Actor | false) => void) => {
    const joined = joinedActor(req as Request)?.actor;
    if (joined === null || (joined && joined.id === Number(id))) return done(null, joined ?? false);
    users.findActive(Number(id)).then(
      (row) => done(null, row ? toActor(row) : false),
      (err: unknown) => done(err),
    );
  });
  return passport;
}
