import { adminUserResponseSchema, createUserRequestSchema, updateUserRequestSchema, userListResponseSchema } from '@shared/schemas/auth';
import { defineEndpoint } from './endpoint';
import { idParamsSchema } from './params';

export const listUsers = defineEndpoint({
  method: 'GET',
  path: '/admin/users',
  access: 'admin',
  answer: userListResponseSchema,
  summary: 'Every account',
});

export const createUser = defineEndpoint({
  method: 'POST',
  path: '/admin/users',
  access: 'admin',
  body: createUserRequestSchema,
  answer: adminUserResponseSchema,
  status: 201,
  summary: 'Create an account',
});

export const updateUser = defineEndpoint({
  method: 'PATCH',
  path: '/admin/users/:id',
  access: 'admin',
  params: idParamsSchema,
  body: updateUserRequestSchema,
  answer: adminUserResponseSchema,
  summary:
    'Change the display name or the role, or disable or enable the account (disabling or a new role ends the user’s sessions); at least one of displayName, role, disabled',
});
