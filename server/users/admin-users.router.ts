import { Router } from 'express';
import { createUserRequestSchema, updateUserRequestSchema } from '@shared/schemas/auth';
import { actorOf, requireRole } from '../http/access.ts';
import { parseBody, parseIdParam } from '../http/validate.ts';
import type { UsersService } from './users.service.ts';

export function adminUsersRouter(users: UsersService): Router {
  const router = Router();
  router.use(requireRole('admin'));

  router.get('/', async (_req, res) => {
    res.json({ users: await users.list() });
  });

  router.post('/', async (req, res) => {
    const input = parseBody(createUserRequestSchema, req);
    res.status(201).json({ user: await users.create(actorOf(req), input) });
  });

  router.patch('/:id', async (req, res) => {
    const id = parseIdParam(req);
    const changes = parseBody(updateUserRequestSchema, req);
    res.json({ user: await users.update(actorOf(req), id, changes) });
  });

  return router;
}
