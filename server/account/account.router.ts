import { Router } from 'express';
import { changePasswordRequestSchema, preferencesRequestSchema } from '@shared/schemas/auth';
import { actorOf, requireSignIn } from '../http/access.ts';
import { parseBody } from '../http/validate.ts';
import type { UsersService } from '../users/users.service.ts';

export function accountRouter(users: UsersService): Router {
  const router = Router();
  router.use(requireSignIn);

  router.post('/password', async (req, res) => {
    const { currentPassword, newPassword } = parseBody(changePasswordRequestSchema, req);
    await users.changePassword(actorOf(req), currentPassword, newPassword);
    res.status(204).end();
  });

  router.patch('/preferences', async (req, res) => {
    const { theme } = parseBody(preferencesRequestSchema, req);
    res.json({ user: await users.setTheme(actorOf(req), theme) });
  });

  return router;
}
