import { Router } from 'express';
import { changePassword, setPreferences } from '@shared/api/account';
import { actorOf } from '../http/access.ts';
import { mount } from '../http/endpoint.ts';
import type { UsersService } from '../users/users.service.ts';
import type { SessionsRepository } from '../auth/sessions.repository.ts';

/** Mounted at /api. */
export function accountRouter(users: UsersService, sessions: SessionsRepository): Router {
  const router = Router();

  mount(router, changePassword, async ({ body, req }) => {
    const actor = actorOf(req);
    await users.changePassword(actor, body.currentPassword, body.newPassword);
    // Whoever else holds a session of this account (a stolen cookie, another device) is signed out; this one stays.
    await sessions.endOthers(actor.id, req.sessionID);
  });

  mount(router, setPreferences, async ({ body, req }) => ({ user: await users.setTheme(actorOf(req), body.theme) }));

  return router;
}
