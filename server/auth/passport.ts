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

export function createPassport(users: UsersService): AppPassport {
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
  // Loaded fresh each request: a disabled user or a changed role takes effect at once.
  passport.deserializeUser((id: number, done) => {
    users.findActive(Number(id)).then(
      (row) => done(null, row ? toActor(row) : false),
      (err: unknown) => done(err),
    );
  });
  return passport;
}
