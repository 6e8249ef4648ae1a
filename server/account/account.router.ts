import { Router } from 'express';
import { changePasswordRequestSchema, preferencesRequestSchema } from '@shared/schemas/auth';
import { actorOf, requireSignIn } from '../http/access.ts';
import { parseBody } from '../http/validate.ts';
import type { UsersService } from '../users/users.service.ts';
import type { SessionsRepository } from '../auth/sessions.repository.ts';

export function accountRouter(users: UsersService, sessions: SessionsRepository): Router {
  const router = Router();
  router.use(requireSignIn);

  router.post('/password', async (req, res) => {
    const { currentPassword, newPassword } = parseBody(changePasswordRequestSchema, req);
    const actor = actorOf(req);
    await users.changePassword(actor, currentPassword, newPassword);
    // Whoever else holds a session of this account (a stolen cookie, another device) is signed out; this one stays.
    await sessions.endOthers(actor.id, req.sessionID);
    res.status(204).end();
  });

  router.patch('/preferences', async (req, res) => {
    const { theme } = parseBody(preferencesRequestSchema, req);
    res.json({ user: await users.setTheme(actorOf(req), theme) });
  });

  return router;
}
