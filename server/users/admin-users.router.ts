import { Router } from 'express';
import { createUser, listUsers, updateUser } from '@shared/api/users';
import { actorOf } from '../http/access.ts';
import { mount } from '../http/endpoint.ts';
import { toAdminUserView } from './user-view.ts';
import type { UsersService } from './users.service.ts';

/** Mounted at /api. */
export function adminUsersRouter(users: UsersService): Router {
  const router = Router();
  mount(router, listUsers, async ({ req }) => ({ users: (await users.list()).map((user) => toAdminUserView(user, actorOf(req))) }));
  mount(router, createUser, async ({ body, req }) => ({ user: toAdminUserView(await users.create(actorOf(req), body), actorOf(req)) }));
  mount(router, updateUser, async ({ params, body, req }) => ({
    user: toAdminUserView(await users.update(actorOf(req), params.id, body), actorOf(req)),
  }));
  return router;
}
