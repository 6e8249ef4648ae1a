import { Router, type Request, type Response } from 'express';
import { session, signIn, signOut } from '@shared/api/auth';
import type { AuditService } from '../audit/audit.service.ts';
import type { Config } from '../config.ts';
import { AppError } from '../http/errors.ts';
import { mount } from '../http/endpoint.ts';
import { createSignInLimiters } from './sign-in-limits.ts';
import type { Actor } from '../http/access.ts';
import type { UsersService } from '../users/users.service.ts';
import { toUserView } from '../users/user-view.ts';
import type { AppPassport } from './passport.ts';
import { sessionCookieName } from './session.ts';

interface AuthDeps {
  config: Config;
  passport: AppPassport;
  users: UsersService;
  audit: AuditService;
  issueCsrfToken: (req: Request, res: Response, overwrite?: boolean) => void;
}

function authenticate(passport: AppPassport, req: Request, res: Response): Promise<Actor | null> {
  return new Promise((resolve, reject) => {
    passport.authenticate('local', (err: unknown, user: Actor | false) => (err ? reject(err) : resolve(user || null)))(req, res, reject);
  });
}

/** Mounted at /api. */
export function authRouter({ config, passport, users, audit, issueCsrfToken }: AuthDeps): Router {
  const router = Router();

  mount(router, session, async ({ req, res }) => {
    issueCsrfToken(req, res);
    const row = req.user ? await users.findActive(req.user.id) : null;
    return { user: row ? toUserView(row) : null };
  });

  mount(
    router,
    signIn,
    async ({ body, req, res }) => {
      const actor = await authenticate(passport, req, res);
      if (!actor) {
        await audit.record({ action: 'auth.sign_in_failed', target: `user:${body.username.toLowerCase()}`, ip: req.ip });
        throw new AppError(401, 'invalid_credentials', 'Wrong username or password, or the account is disabled.');
      }
      // passport ≥ 0.6 regenerates the session id here (session fixation defence).
      await new Promise<void>((resolve, reject) => req.logIn(actor, (err) => (err ? reject(err) : resolve())));
      req.session.signedInAt = Date.now();
      issueCsrfToken(req, res, true);
      const row = await users.touchSignIn(actor.id);
      await audit.record({ actorId: actor.id, action: 'auth.signed_in', target: `user:${actor.username}`, ip: req.ip });
      return { user: row ? toUserView(row) : null };
    },
    createSignInLimiters(config),
  );

  mount(router, signOut, async ({ req, res }) => {
    const actor = req.user;
    if (actor) {
      await audit.record({ actorId: actor.id, action: 'auth.signed_out', target: `user:${actor.username}`, ip: req.ip });
    }
    await new Promise<void>((resolve, reject) => req.logOut((err) => (err ? reject(err) : resolve())));
    await new Promise<void>((resolve, reject) => req.session.destroy((err) => (err ? reject(err) : resolve())));
    res.clearCookie(sessionCookieName(config), { path: '/' });
  });

  return router;
}
