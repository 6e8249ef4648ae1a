import { Router } from 'express';
import { createUser, listUsers, updateUser } from '@shared/api/users';
import { actorOf } from '../http/access.ts';
import { mount } from '../http/endpoint.ts';
import type { UsersService } from './users.service.ts';

/** Mounted at /api. */
export function adminUsersRouter(users: UsersService): Router {
  const router = Router();
  mount(router, listUsers, async () => ({ users: await users.list() }));
  mount(router, createUser, async ({ body, req }) => ({ user: await users.create(actorOf(req), body) }));
  mount(router, updateUser, async ({ params, body, req }) => ({ user: await users.update(actorOf(req), params.id, body) }));
  return router;
}
